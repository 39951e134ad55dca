/** Display functions turn values into plain records; checked with a sink that collects them. */
import Color from "colorjs.io";
import { differenceCiede2000 } from "culori";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { swatch, swatchPairs } from "../../lib/plot/index.ts";
import { show, showFigure, showHtml, showSwatches, showTable } from "../../cells/display.ts";
import { formatNumber } from "../../cells/format-number.ts";
import { installOutputSink } from "../../cells/output-sink.ts";
import type { OutputRecord, SwatchesRecord } from "../../cells/records.ts";

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
    showTable(
      [
        { name: "A", Y: 12.3456, x: 0.31271 },
        { name: "B", Y: 7, extra: true },
      ],
      {
        columns: ["name", { key: "x", label: "x", digits: 4 }, { key: "Y", unit: "cd/m²" }],
        digits: 1,
      },
    );
    expect(records).toEqual([
      {
        kind: "table",
        caption: undefined,
        columns: [
          { label: "name", numeric: false },
          { label: "x", numeric: true },
          { label: "Y", unit: "cd/m²", numeric: true },
        ],
        rows: [
          ["A", "0.3127", "12.3"],
          ["B", "", "7.0"],
        ],
        totalRows: 2,
      },
    ]);
  });

  it("showTable names a column that is in none of the rows, and rejects rows that are not objects", () => {
    expect(() => showTable([{ L: 1 }], { columns: ["Lstar"] })).toThrow(
      'column "Lstar" is in none of the rows (their keys: L)',
    );
    expect(() => showTable([{ L: 1 }, 5 as never])).toThrow("row 2 is number 5, not an object");
    expect(() => showTable([{ L: 1 }], { digits: 2.5 })).toThrow("digits must be a whole number");
  });

  it("show picks a figure for a Plotly spec or a spectrum, a table for rows, text otherwise", () => {
    show({ data: [{ x: [1], y: [2] }], layout: { title: { text: "t" } } });
    show({ name: "lamp", quantity: "relative power", wavelengths: [400, 410, 420], values: [1, 2, 3] });
    show([{ a: 1 }]);
    show(new Map([["k", 1]]));
    expect(records.map((r) => r.kind)).toEqual(["figure", "figure", "table", "value"]);
    expect(records[1]).toMatchObject({
      kind: "figure",
      caption: "lamp: relative power, 3 samples from 400 to 420 nm.",
    });
    expect(records[3]).toEqual({ kind: "value", text: "Map(1) { 'k' => 1 }" });
  });

  it("showFigure takes the caption a plot function attached, converts typed arrays, refuses functions", () => {
    showFigure({ data: [{ y: new Float64Array([1, 2]) }], layout: {}, caption: "From the plot function" });
    expect(records[0]).toEqual({
      kind: "figure",
      caption: "From the plot function",
      spec: { data: [{ y: [1, 2] }], layout: {}, config: {} },
    });
    expect(() => showFigure({ data: [{ hover: () => 1 }] })).toThrow(
      "the figure.data[0].hover is a function",
    );
  });

  it("showSwatches checks hex and CSS colours so nothing can break out of a style attribute", () => {
    showSwatches([{ label: "P3 red", hex: "#FF0000", css: "color(display-p3 1 0 0)", outOfGamut: true }]);
    expect(records[0]).toEqual({
      kind: "swatches",
      caption: undefined,
      swatches: [{ label: "P3 red", hex: "#ff0000", css: "color(display-p3 1 0 0)", outOfGamut: true }],
    });
    expect(() => showSwatches([{ label: "x", hex: "red" }])).toThrow(
      "hex must be an sRGB colour like #1a2b3c",
    );
    expect(() => showSwatches([{ label: "x", hex: "#000000", css: "red;background:url(x)" }])).toThrow(
      "css must be a CSS colour value",
    );
  });

  it("showSwatches makes lib/plot's current swatchPairs output explicit pairs, ΔE00 moved from the note into the pair", () => {
    // Invented reference/sample Lab pairs (D65). Reference for ΔE00: culori's CIEDE2000 (npm registry).
    const pairs = [
      { label: "C1", reference: { L: 52, a: 41.5, b: 27 }, sample: { L: 51.2, a: 43, b: 25.9 } },
      { label: "grey 50", reference: { L: 50, a: 0, b: 0 }, sample: { L: 50.4, a: 0.6, b: -1.1 } },
    ];
    showSwatches(
      swatchPairs(
        pairs.map((p) => ({ label: p.label, reference: { lab: p.reference }, sample: { lab: p.sample } })),
      ),
    );
    const shown = (records[0] as SwatchesRecord).swatches;
    expect(shown.map((s) => s.pair?.role)).toEqual(["reference", "sample", "reference", "sample"]);
    expect(shown.map((s) => s.pair?.label)).toEqual(["C1", "C1", "grey 50", "grey 50"]);
    const de = differenceCiede2000();
    pairs.forEach((p, i) => {
      const expected = de(
        { mode: "lab65", l: p.reference.L, a: p.reference.a, b: p.reference.b },
        { mode: "lab65", l: p.sample.L, a: p.sample.a, b: p.sample.b },
      );
      // lib/plot writes ΔE00 with two decimals, so the pair carries it to ±0.005.
      expect(Math.abs(shown[2 * i + 1]!.pair!.deltaE00! - expected)).toBeLessThanOrEqual(0.005);
      expect(shown[2 * i]!.pair!.deltaE00).toBeUndefined();
      expect(shown[2 * i + 1]!.note ?? "").not.toContain("ΔE00");
    });
  });

  it("showSwatches keeps explicit pair fields, and names a pair whose members are not reference-then-sample", () => {
    const ref = { label: "target", hex: "#8a4b2f", pair: { label: "T-1", role: "reference" } } as const;
    const sam = {
      label: "batch",
      hex: "#8c4a2e",
      pair: { label: "T-1", role: "sample", deltaE00: 0.8 },
    } as const;
    showSwatches([ref, sam, { label: "loose", hex: "#000000" }]);
    expect((records[0] as SwatchesRecord).swatches).toEqual([
      { label: "target", hex: "#8a4b2f", pair: { label: "T-1", role: "reference" } },
      { label: "batch", hex: "#8c4a2e", pair: { label: "T-1", role: "sample", deltaE00: 0.8 } },
      { label: "loose", hex: "#000000" },
    ]);
    expect(() => showSwatches([sam, ref])).toThrow(
      'swatch 1 ("batch") is the sample of pair "T-1", but no swatch comes before it',
    );
    expect(() => showSwatches([{ label: "loose", hex: "#000000" }, sam])).toThrow(
      'swatch 2 ("batch") is the sample of pair "T-1", but swatch 1 is not its reference',
    );
    expect(() => showSwatches([ref, { ...sam, pair: { ...sam.pair, label: "T-2" } }])).toThrow(
      'is the reference of pair "T-1", but swatch 2 is not its sample',
    );
    expect(() => showSwatches([ref, { ...sam, pair: { ...sam.pair, deltaE00: Number.NaN } }])).toThrow(
      "pair.deltaE00 must be a finite number ≥ 0, got number NaN",
    );
    expect(() => showSwatches([{ ...ref, pair: { label: "T-1", role: "target" } } as never])).toThrow(
      'pair.role must be "reference" or "sample", got "target"',
    );
    expect(() => showSwatches([{ ...ref, pair: { ...ref.pair, deltaE00: 1 } } as never, sam])).toThrow(
      "pair.deltaE00 belongs on the pair's sample",
    );
  });

  it("showSwatches carries lib/plot's display-gamut fields into the record", () => {
    // Display P3 pure green is outside sRGB and inside Display P3 and BT.2020 (colorjs.io's inGamut, npm registry).
    const p3green = new Color("p3", [0, 1, 0]);
    const [X, Y, Z] = p3green.to("xyz-d65").coords as [number, number, number];
    expect([p3green.inGamut("srgb"), p3green.inGamut("p3"), p3green.inGamut("rec2020")]).toEqual([
      false,
      true,
      true,
    ]);
    showSwatches([
      swatch("P3 green for sRGB", { XYZ: { X: 100 * X, Y: 100 * Y, Z: 100 * Z } }),
      swatch("P3 green for P3", { XYZ: { X: 100 * X, Y: 100 * Y, Z: 100 * Z } }, { display: "Display P3" }),
    ]);
    const [forSrgb, forP3] = (records[0] as SwatchesRecord).swatches;
    expect(forSrgb).toMatchObject({
      display: "sRGB",
      outOfDisplayGamut: true,
      outOfGamut: true,
      inGamut: { sRGB: false, displayP3: true, bt2020: true },
    });
    expect(forP3).toMatchObject({ display: "Display P3", outOfDisplayGamut: false, outOfGamut: true });
    expect(() => showSwatches([{ label: "x", hex: "#000000", outOfDisplayGamut: "yes" } as never])).toThrow(
      "outOfDisplayGamut must be true or false",
    );
    expect(() => showSwatches([{ label: "x", hex: "#000000", inGamut: { sRGB: true } } as never])).toThrow(
      "inGamut must be { sRGB, displayP3, bt2020 }",
    );
  });

  it("showHtml is escaped unless marked trusted", () => {
    showHtml("<b>x</b>");
    showHtml("<b>y</b>", { trusted: true });
    expect(records).toEqual([
      { kind: "html", html: "<b>x</b>", trusted: false },
      { kind: "html", html: "<b>y</b>", trusted: true },
    ]);
  });
});
