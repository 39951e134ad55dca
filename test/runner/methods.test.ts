/**
 * The Methods section reads like a lab report's: grouped headings, a paragraph per topic with a run-in heading, a
 * remark when two observers were mixed, and "no colorimetric computations were recorded" only when that is true —
 * a cell process stopped by its time limit must not make the notes of earlier cells vanish.
 */
import { describe, expect, it } from "vitest";
import type { CellRun, RunRecord } from "../../runner/records/run-record.ts";
import { escapeHtml } from "../../runner/report/escape.ts";
import { renderMethods } from "../../runner/report/methods-section.ts";
import { runText, ts } from "./helpers.ts";

const ran: CellRun = { index: 0, status: "ok", outputs: [], reads: [], durationMs: 1 };

function methods(run: Partial<Pick<RunRecord, "methods" | "methodsMissingFrom" | "cells">>): string {
  return renderMethods({ methods: [], cells: [ran], ...run }, "methods");
}

describe("the Methods section", () => {
  it("groups topics under headings in reading order, as sentences with run-in headings", () => {
    const html = methods({
      methods: [
        { topic: "data files", statement: "Spectral table read: 8 samples" },
        { topic: "colour difference", statement: "Colour differences ΔE00 by the CIEDE2000 formula." },
        { topic: "observer", statement: "CIE 1931 2° standard colorimetric observer." },
        { topic: "rgb encoding", statement: "sRGB per IEC 61966-2-1." },
      ],
    });
    const order = [
      "Colorimetric conditions",
      "Observer.",
      "Derived quantities",
      "Colour difference.",
      "RGB encoding.",
      "Data handling",
      "Spectral table read: 8 samples.",
    ];
    const at = order.map((t) => html.indexOf(t));
    expect(at.every((i) => i >= 0)).toBe(true);
    expect([...at].sort((a, b) => a - b)).toEqual(at);
    expect(html).not.toContain("No colorimetric computations");
  });

  it("never changes the case of a statement: sRGB stays sRGB, a lower-case start stays lower-case", () => {
    const html = methods({
      methods: [
        { topic: "rgb encoding", statement: "sRGB RGB (IEC 61966-2-1:1999): linear values" },
        { topic: "colour space", statement: "u′v′ per CIE 015:2018 §8.1 (CIE 1976 UCS)" },
        { topic: "optics", statement: "pH of the dye bath was not modelled." },
      ],
    });
    // A full stop is added where none closes the statement; nothing else about its text changes.
    expect(html).toContain("sRGB RGB (IEC 61966-2-1:1999): linear values.");
    expect(html).toContain("u′v′ per CIE 015:2018 §8.1 (CIE 1976 UCS).");
    expect(html).toContain("pH of the dye bath was not modelled.");
    expect(html).not.toMatch(/SRGB|U′v′|PH of/);
  });

  it('shows every statement of a real run verbatim, one starting with "sRGB" included', async () => {
    const { run } = await runText(
      ts(
        'const rgb = rgbFromXYZ({ X: 41.24, Y: 21.26, Z: 1.93 }, rgbSpace("sRGB"));\n' +
          'noteMethod("rgb encoding", "sRGB values were rounded to 8 bits for the swatch table.");',
      ),
    );
    expect(run.cells[0]!.status).toBe("ok");
    expect(run.methods.length).toBeGreaterThan(1);
    const html = renderMethods(run, "methods");
    for (const m of run.methods) expect(html).toContain(escapeHtml(m.statement.trim()));
    expect(html).toContain("sRGB values were rounded to 8 bits for the swatch table.");
    expect(html).not.toContain("SRGB");
  });

  it("remarks when more than one observer was used", () => {
    const html = methods({
      methods: [
        { topic: "observer", statement: "CIE 1931 2° observer." },
        { topic: "observer", statement: "CIE 1964 10° observer." },
      ],
    });
    expect(html).toContain("More than one observer was used in this run");
  });

  it("says no colorimetric computations were recorded only when the log was complete and empty", () => {
    expect(methods({})).toContain("No colorimetric computations were recorded");
    expect(methods({ methodsMissingFrom: [1] })).not.toContain("No colorimetric computations were recorded");
    expect(methods({ methodsMissingFrom: [1] })).toContain("cell 2 could not be collected");
    expect(methods({ cells: [{ index: 0, status: "listing", outputs: [], reads: [] }] })).toContain(
      "No cells ran",
    );
  });

  it("keeps the notes of earlier cells when a later cell's process is stopped, and says the list may be incomplete", async () => {
    const { run } = await runText(ts("const w = whitePoint();") + ts("while (true) {}", "time-limit=300ms"));
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "failed"]);
    expect(run.methods.some((m) => m.topic === "observer")).toBe(true);
    expect(run.methodsMissingFrom).toEqual([1]);
    const html = renderMethods(run, "methods");
    expect(html).toContain("Observer.");
    expect(html).toContain("may be incomplete");
  });
});
