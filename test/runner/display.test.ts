/** Display functions turn values into plain records; checked with a sink that collects them. */
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { show, showFigure, showHtml, showSwatches, showTable } from "../../cells/display.ts";
import { formatNumber } from "../../cells/format-number.ts";
import { installOutputSink } from "../../cells/output-sink.ts";
import type { OutputRecord } from "../../cells/records.ts";

let records: OutputRecord[] = [];
beforeEach(() => {
  records = [];
  installOutputSink((r) => records.push(r));
});
afterEach(() => installOutputSink(undefined as never));

describe("display functions", () => {
  it("formats table numbers: fixed decimals when asked, else up to 6 significant digits", () => {
    // 0.1 + 0.2 is 0.30000000000000004 in IEEE 754 doubles; six significant digits print 0.3.
    expect(formatNumber(0.1 + 0.2)).toBe("0.3");
    expect(formatNumber(2)).toBe("2");
    expect(formatNumber(1.23456789, 3)).toBe("1.235");
    expect(formatNumber(-0.000012345)).toBe("-1.2345e-5");
    expect(formatNumber(Number.NaN)).toBe("NaN");
  });

  it("showTable keeps column order, labels, units and digits", () => {
    showTable([{ name: "A", Y: 12.3456, x: 0.31271 }, { name: "B", Y: 7, extra: true }], {
      columns: ["name", { key: "x", label: "x", digits: 4 }, { key: "Y", unit: "cd/m²" }],
      digits: 1,
    });
    expect(records).toEqual([{
      kind: "table",
      caption: undefined,
      columns: [{ label: "name", numeric: false }, { label: "x", numeric: true }, { label: "Y", unit: "cd/m²", numeric: true }],
      rows: [["A", "0.3127", "12.3"], ["B", "", "7.0"]],
      totalRows: 2,
    }]);
  });

  it("showTable names a column that is in none of the rows, and rejects rows that are not objects", () => {
    expect(() => showTable([{ L: 1 }], { columns: ["Lstar"] })).toThrow('column "Lstar" is in none of the rows (their keys: L)');
    expect(() => showTable([{ L: 1 }, 5 as never])).toThrow("row 2 is number 5, not an object");
    expect(() => showTable([{ L: 1 }], { digits: 2.5 })).toThrow("digits must be a whole number");
  });

  it("show picks a figure for a Plotly spec or a spectrum, a table for rows, text otherwise", () => {
    show({ data: [{ x: [1], y: [2] }], layout: { title: { text: "t" } } });
    show({ name: "lamp", quantity: "relative power", wavelengths: [400, 410, 420], values: [1, 2, 3] });
    show([{ a: 1 }]);
    show(new Map([["k", 1]]));
    expect(records.map((r) => r.kind)).toEqual(["figure", "figure", "table", "value"]);
    expect(records[1]).toMatchObject({ kind: "figure", caption: "lamp: relative power, 3 samples from 400 to 420 nm." });
    expect(records[3]).toEqual({ kind: "value", text: "Map(1) { 'k' => 1 }" });
  });

  it("showFigure takes the caption a plot function attached, converts typed arrays, refuses functions", () => {
    showFigure({ data: [{ y: new Float64Array([1, 2]) }], layout: {}, caption: "From the plot function" });
    expect(records[0]).toEqual({ kind: "figure", caption: "From the plot function", spec: { data: [{ y: [1, 2] }], layout: {}, config: {} } });
    expect(() => showFigure({ data: [{ hover: () => 1 }] })).toThrow("the figure.data[0].hover is a function");
  });

  it("showSwatches checks hex and CSS colours so nothing can break out of a style attribute", () => {
    showSwatches([{ label: "P3 red", hex: "#FF0000", css: "color(display-p3 1 0 0)", outOfGamut: true }]);
    expect(records[0]).toEqual({ kind: "swatches", caption: undefined, swatches: [{ label: "P3 red", hex: "#ff0000", css: "color(display-p3 1 0 0)", outOfGamut: true }] });
    expect(() => showSwatches([{ label: "x", hex: "red" }])).toThrow("hex must be an sRGB colour like #1a2b3c");
    expect(() => showSwatches([{ label: "x", hex: "#000000", css: "red;background:url(x)" }])).toThrow("css must be a CSS colour function");
  });

  it("showHtml is escaped unless marked trusted", () => {
    showHtml("<b>x</b>");
    showHtml("<b>y</b>", { trusted: true });
    expect(records).toEqual([{ kind: "html", html: "<b>x</b>", trusted: false }, { kind: "html", html: "<b>y</b>", trusted: true }]);
  });
});
