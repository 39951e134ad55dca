/**
 * The run record embedded in every report (<script type="application/json" id="tristim-run-record">): tools read a
 * run's cells, checks, cautions, Methods and inputs from it instead of scraping HTML. It carries full values, cannot
 * be broken out of by text from cells, and leaves out wall-clock values in a reproducible run.
 * SHA-256 reference: FIPS 180-2, Appendix B.1 — SHA-256("abc") = ba7816bf…f20015ad.
 */
import { describe, expect, it } from "vitest";
import { parseNotebook } from "../../runner/parse/parse-notebook.ts";
import { readEmbeddedRunRecord, RUN_RECORD_VERSION } from "../../runner/report/embedded-run-record.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import type { RunRecord } from "../../runner/records/run-record.ts";
import { runText, ts } from "./helpers.ts";
import { okCell, runRecord } from "./run-records.ts";

const ABC_SHA256 = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"; // FIPS 180-2, B.1

const NOTEBOOK =
  "---\ntitle: Embedded record (invented data)\ninputs:\n  limit: 0.2\n  lamp: A\n---\n# Embedded record\n\n" +
  ts(
    "import fs from 'node:fs';\nconst text = fs.readFileSync('data/abc.txt', 'utf8');\nconst w = whitePoint();\n" +
      "check('sum', 0.1 + 0.2, { max: inputs.limit, digits: 2, unit: 'cd/m²' });\n" +
      "check('Y of the white', w.Y, { target: 100, tolerance: 0.01 });\n" +
      "checkCondition('file says abc', text === 'abc', 'read from data/abc.txt');\n" +
      "show({ category: 3, caution: 'Informative only: the applicable standard decides.' });",
  ) +
  ts("throw new RangeError('lamp out of range');", "may-fail") +
  ts("1 + 1", "no-run");

describe("the run record embedded in the report", () => {
  it("holds the cells, checks with their full values and limits, cautions, Methods, inputs and files of a real run", async () => {
    const { document, run } = await runText(NOTEBOOK, { inputs: { lamp: "D65" } }, { "data/abc.txt": "abc" });
    const record = readEmbeddedRunRecord(renderReport(document, run));
    expect(record).toMatchObject({
      format: "tristim-run-record",
      version: RUN_RECORD_VERSION,
      title: "Embedded record (invented data)",
    });
    expect(record.notebook.file).toBe("nb.md");
    expect(record.reproducible).toBe(false);
    expect(typeof record.startedAt).toBe("string");
    expect(record.cells.map((c) => [c.cell, c.status])).toEqual([
      [1, "ok"],
      [2, "failed"],
      [3, "listing"],
    ]);
    expect(record.cells[0]).toMatchObject({ checks: 3, checksFailed: 1 });
    // Cell 2 is the fence on line 18; its code is line 19, and V8 places the error at `new` (column 7).
    expect(record.cells[1]).toMatchObject({
      firstLine: 19,
      failureAllowed: true,
      error: {
        failure: "thrown",
        name: "RangeError",
        message: "lamp out of range",
        location: { file: "nb.md", line: 19, column: 7 },
      },
    });
    // The full value, not the report's rounded "0.30": 0.1 + 0.2 is 0.30000000000000004 in IEEE 754 doubles.
    expect(record.checks[0]).toEqual({
      id: "check-1-1",
      cell: 1,
      label: "sum",
      passed: false,
      value: 0.30000000000000004,
      valueText: "0.30",
      unit: "cd/m²",
      limits: { max: 0.2 },
      digits: 2,
    });
    // The white's Y is 100 by the normalisation of CIE 015:2018 §7.1 (k = 100 / Σ S ȳ).
    expect(record.checks[1]).toMatchObject({
      label: "Y of the white",
      passed: true,
      limits: { target: 100, tolerance: 0.01 },
    });
    expect(Math.abs(record.checks[1]!.value! - 100)).toBeLessThan(1e-9);
    expect(record.checks[2]).toEqual({
      id: "check-1-3",
      cell: 1,
      label: "file says abc",
      passed: true,
      detail: "read from data/abc.txt",
    });
    expect(record.counts).toEqual({
      cells: { ok: 1, failed: 1, "not-run": 0, listing: 1 },
      checks: { passed: 2, failed: 1 },
      cautions: 1,
    });
    // A failed check and only an allowed cell failure: tristim run exits with 3.
    expect(record.exitCode).toBe(3);
    expect(record.cautions).toEqual([
      {
        id: "caution-1",
        cell: 1,
        title: "Caution",
        text: "Informative only: the applicable standard decides.",
        about: "value",
      },
    ]);
    expect(record.methods).toEqual(run.methods.map((m) => ({ topic: m.topic, statement: m.statement })));
    expect(record.methods.some((m) => m.topic === "observer")).toBe(true);
    expect(record.inputs).toEqual([
      { name: "limit", value: 0.2, setBy: "default" },
      { name: "lamp", value: "D65", setBy: "--input" },
    ]);
    expect(record.filesRead).toEqual([{ path: "data/abc.txt", sha256: ABC_SHA256, cells: [1] }]);
    expect(JSON.stringify(record)).not.toContain("/tmp");
  });

  it("cannot be broken out of: text with </script>, <!-- and line separators comes back as it was", () => {
    const evil = "</script><script>alert(1)</script><!-- \u2028 & </SCRIPT >";
    const doc = parseNotebook(`---\ntitle: "x"\n---\n` + ts("1"), "/lab/nb.md");
    const html = renderReport(doc, runRecordWith({ label: evil }, evil));
    expect(html).not.toContain("<script>alert(1)");
    expect(html).not.toContain("</SCRIPT >");
    const record = readEmbeddedRunRecord(html);
    expect(record.checks[0]!.label).toBe(evil);
    expect(record.cautions[0]!.text).toBe(evil);
    expect(record.inputs[0]!.value).toBe(evil);
  });

  it("leaves out the start time and every duration in a reproducible run", async () => {
    const { document, run } = await runText(ts("check('one', 1, { min: 0 });"), { reproducible: true });
    const record = readEmbeddedRunRecord(renderReport(document, run));
    expect(record.reproducible).toBe(true);
    expect(record).not.toHaveProperty("startedAt");
    expect(record).not.toHaveProperty("durationMs");
    expect(record.cells[0]).not.toHaveProperty("durationMs");
    expect(JSON.stringify(record)).not.toContain(run.startedAt.slice(0, 10));
    expect(record.exitCode).toBe(0);
  });

  it("is absent from a page that is not a report, with a clear error", () => {
    expect(() => readEmbeddedRunRecord("<html><body>hello</body></html>")).toThrow(
      'no <script id="tristim-run-record"> element',
    );
  });
});

/** A hand-made run whose check label, caution text and input value are `text`. */
function runRecordWith(check: { label: string }, text: string): RunRecord {
  return runRecord(
    [
      okCell(
        0,
        [
          { kind: "check", label: check.label, passed: true, value: 1, valueText: "1", limits: { min: 0 } },
          { kind: "caution", title: "Caution", text },
        ],
        1,
      ),
    ],
    { durationMs: 5, inputs: { sample: text } },
  );
}
