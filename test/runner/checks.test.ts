/**
 * Acceptance checks: the pass/fail rule, the records, the report (in place and in the summary) and the exit code 3
 * of `tristim run` (a failed cell's 1 wins). The limits are plain interval arithmetic; the references are the
 * definitions of the limits themselves (min ≤ value ≤ max; |value − target| ≤ tolerance) — common practice, no source.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { check, checkRecord, checkCondition, conditionRecord } from "../../cells/checks.ts";
import { installOutputSink } from "../../cells/output-sink.ts";
import type { CheckRecord, OutputRecord } from "../../cells/records.ts";
import { checkResults, countChecks } from "../../runner/records/check-results.ts";
import { runExitCode } from "../../runner/records/run-outcome.ts";
import { EXIT, worseExit } from "../../runner/shared/exit-codes.ts";
import { parseNotebook } from "../../runner/parse/parse-notebook.ts";
import { limitsText, marginText, printedNumber } from "../../runner/text/check-text.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import type { RunRecord } from "../../runner/records/run-record.ts";
import { notebookFile, outputsOf, runText, ts } from "./helpers.ts";
import { okCell, runRecord } from "./run-records.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

function tristim(args: string[], cwd?: string): { code: number | null; out: string; err: string } {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 60_000 });
  return { code: result.status, out: result.stdout, err: result.stderr };
}

describe("check(): the pass rule", () => {
  it("passes inside min..max and fails outside, the limits themselves included", () => {
    expect(checkRecord("τv", 0.12, { min: 0.08, max: 0.18 }).passed).toBe(true);
    expect(checkRecord("τv", 0.08, { min: 0.08, max: 0.18 }).passed).toBe(true);
    expect(checkRecord("τv", 0.18, { min: 0.08, max: 0.18 }).passed).toBe(true);
    expect(checkRecord("τv", 0.07999, { min: 0.08, max: 0.18 }).passed).toBe(false);
    expect(checkRecord("τv", 0.1801, { min: 0.08, max: 0.18 }).passed).toBe(false);
    expect(checkRecord("contrast", 1500, { min: 1000 }).passed).toBe(true);
    expect(checkRecord("contrast", 999, { min: 1000 }).passed).toBe(false);
    expect(checkRecord("ΔE00", 2.1, { max: 2 }).passed).toBe(false);
  });

  it("passes within target ± tolerance, a value on a decimal limit included (1.1 against 1.0 ± 0.1)", () => {
    expect(checkRecord("gamma", 2.2, { target: 2.2, tolerance: 0 }).passed).toBe(true);
    expect(checkRecord("gamma", 2.35, { target: 2.2, tolerance: 0.1 }).passed).toBe(false);
    expect(checkRecord("gamma", 2.05, { target: 2.2, tolerance: 0.1 }).passed).toBe(false);
    // |1.1 − 1.0| is 0.10000000000000009 in doubles; the interval form keeps the limit a reader sees.
    expect(checkRecord("x", 1.1, { target: 1, tolerance: 0.1 }).passed).toBe(true);
    expect(checkRecord("x", 0.9, { target: 1, tolerance: 0.1 }).passed).toBe(true);
    expect(checkRecord("CCT", 6535, { target: 6500, tolerance: 200, unit: "K" })).toMatchObject({
      passed: true,
      value: 6535,
      unit: "K",
    });
  });

  it("needs every limit given to hold when both forms are given", () => {
    expect(checkRecord("x", 5, { target: 5, tolerance: 1, max: 4.5 }).passed).toBe(false);
    expect(checkRecord("x", 4.2, { target: 5, tolerance: 1, max: 4.5 }).passed).toBe(true);
  });

  it("fails a value that is NaN, Infinity or not a number, with a note saying why (never a silent pass)", () => {
    const nan = checkRecord("Y", Number.NaN, { min: 0 });
    expect(nan).toMatchObject({ passed: false, value: null, valueText: "NaN" });
    expect(nan.detail).toContain("not a finite number");
    expect(checkRecord("Y", Infinity, { min: 0 })).toMatchObject({ passed: false, valueText: "Infinity" });
    expect(checkRecord("Y", -Infinity, { max: 0 })).toMatchObject({ passed: false, valueText: "-Infinity" });
    const missing = checkRecord("Y", undefined as unknown as number, { min: 0 });
    expect(missing).toMatchObject({ passed: false, valueText: "undefined" });
    expect(missing.detail).toContain("not a number");
    expect(checkRecord("Y", "12.3" as unknown as number, { min: 0 })).toMatchObject({
      passed: false,
      valueText: '"12.3"',
    });
  });

  it("refuses limits that cannot be meant, naming the offending one", () => {
    expect(() => checkRecord("x", 1, {})).toThrow("give at least one limit");
    expect(() => checkRecord("x", 1, { unit: "K" })).toThrow("give at least one limit");
    expect(() => checkRecord("x", 1, { maximum: 2 } as never)).toThrow('unknown limit "maximum"');
    expect(() => checkRecord("x", 1, { target: 1 })).toThrow("a target without a tolerance");
    expect(() => checkRecord("x", 1, { tolerance: 1 })).toThrow("a tolerance without a target");
    expect(() => checkRecord("x", 1, { target: 1, tolerance: -0.1 })).toThrow(
      "tolerance must not be negative, got -0.1",
    );
    expect(() => checkRecord("x", 1, { min: 2, max: 1 })).toThrow("min 2 is greater than max 1");
    expect(() => checkRecord("x", 1, { max: Number.NaN })).toThrow("max must be a finite number, got NaN");
    expect(() => checkRecord("x", 1, undefined as never)).toThrow("the third argument must be limits");
    expect(() => checkRecord("", 1, { max: 1 })).toThrow("must be a label");
    expect(() => checkRecord("x", 1, { max: 1, digits: 1.5 })).toThrow("digits must be a whole number");
  });

  it("shows the full value when the rounded one would seem to contradict the outcome", () => {
    // 2.004 rounds to "2.00", which would look like it meets ≤ 2; the record shows 2.004 instead.
    expect(checkRecord("ΔE00", 2.004, { max: 2, digits: 2 })).toMatchObject({
      passed: false,
      valueText: "2.004",
    });
    expect(checkRecord("ΔE00", 1.234, { max: 2, digits: 2 })).toMatchObject({
      passed: true,
      valueText: "1.23",
    });
  });

  it("checkCondition takes a true/false condition and an optional detail", () => {
    expect(conditionRecord("all patches read", true)).toEqual({
      kind: "check",
      label: "all patches read",
      passed: true,
    });
    expect(conditionRecord("monotonic ramp", false, "step 7 is darker than step 6")).toEqual({
      kind: "check",
      label: "monotonic ramp",
      passed: false,
      detail: "step 7 is darker than step 6",
    });
    expect(() => conditionRecord("x", 1 as unknown as boolean)).toThrow(
      "the condition must be true or false, got 1",
    );
  });
});

describe("check() and checkCondition() as display functions", () => {
  let records: OutputRecord[] = [];
  beforeEach(() => {
    records = [];
    installOutputSink((r) => records.push(r));
  });
  afterEach(() => installOutputSink(undefined as never));

  it("emit one check record each and return whether it passed", () => {
    expect(check("white Y", 180, { min: 150, unit: "cd/m²" })).toBe(true);
    expect(checkCondition("ramp monotonic", false)).toBe(false);
    expect(records.map((r) => r.kind)).toEqual(["check", "check"]);
  });
});

describe("words for checks in the report", () => {
  const r = (partial: Partial<CheckRecord>): CheckRecord => ({
    kind: "check",
    label: "x",
    passed: true,
    value: 1,
    valueText: "1",
    ...partial,
  });
  it("states limits as a spec sheet does", () => {
    expect(limitsText(r({ limits: { min: 8, max: 18 }, unit: "%" }))).toBe("8 to 18 %");
    expect(limitsText(r({ limits: { max: 0.004 } }))).toBe("≤ 0.004");
    expect(limitsText(r({ limits: { min: -5 } }))).toBe("≥ −5");
    expect(limitsText(r({ limits: { target: 6500, tolerance: 200 }, unit: "K" }))).toBe("6500 ± 200 K");
  });
  it("says how far a value lies from its target and outside a failed limit", () => {
    expect(marginText(r({ value: 6535, limits: { target: 6500, tolerance: 200 }, unit: "K" }))).toBe(
      "+35 K from target",
    );
    expect(marginText(r({ passed: false, value: 0.0052, limits: { max: 0.004 } }))).toBe(
      "0.0012 above the limit",
    );
    expect(
      marginText(r({ passed: false, value: 2.35, limits: { target: 2.2, tolerance: 0.1 }, digits: 2 })),
    ).toBe("+0.15 from target; 0.05 above the limit");
    expect(marginText(r({ value: 1, limits: { min: 0 } }))).toBeUndefined();
    expect(marginText(r({ value: 8, limits: { target: 8, tolerance: 0 } }))).toBe("on target");
    // Margins at the check's digits (issue 17: "0.534536 % above the limit" with digits 2, "−0.000000 % from target").
    expect(
      marginText(r({ passed: false, value: 10.534536, limits: { max: 10 }, unit: "%", digits: 2 })),
    ).toBe("0.53 % above the limit");
    expect(
      marginText(r({ value: 25 - 1e-12, limits: { target: 25, tolerance: 1 }, unit: "%", digits: 6 })),
    ).toBe("on target to 6 decimals");
    expect(marginText(r({ passed: false, value: 2.001, limits: { max: 2 }, digits: 2 }))).toBe(
      "less than 0.01 above the limit",
    );
  });
  it("prints powers of ten and minus signs as a report does", () => {
    expect(printedNumber("7.10543e-15")).toBe("7.10543 × 10⁻¹⁵");
    expect(printedNumber("1e-9")).toBe("10⁻⁹");
    expect(printedNumber("-2.5e+21")).toBe("−2.5 × 10²¹");
    expect(printedNumber("-0.25")).toBe("−0.25");
    expect(limitsText(r({ limits: { max: 1e-9 }, unit: "%" }))).toBe("≤ 10⁻⁹ %");
  });
});

describe("exit codes", () => {
  it("ranks a failed cell above a failed check, and the runner's failure above both", () => {
    expect(worseExit(EXIT.ok, EXIT.checkFailed)).toBe(EXIT.checkFailed);
    expect(worseExit(EXIT.checkFailed, EXIT.notebookFailed)).toBe(EXIT.notebookFailed);
    expect(worseExit(EXIT.notebookFailed, EXIT.checkFailed)).toBe(EXIT.notebookFailed);
    expect(worseExit(EXIT.internal, EXIT.notebookFailed)).toBe(EXIT.internal);
  });
});

describe("checks in a run", () => {
  it("are kept in order, the last-line check is not shown again as true/false, and the summary lists the failed", async () => {
    const { document, run } = await runText(
      "# Lot 7\n\n" +
        ts(
          'check("τv", 0.125, { min: 0.08, max: 0.18, unit: "", digits: 3 });\ncheck("ΔE00 patch 3", 2.6, { max: 2, digits: 2 })',
        ) +
        ts('const n = 12;\ncheckCondition("all 12 filters measured", n === 12)') +
        ts('check("<b>evil</b>", Number.NaN, { max: 1 })'),
    );
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "ok", "ok"]);
    expect(outputsOf(run, 0, "check").map((c) => c.passed)).toEqual([true, false]);
    expect(outputsOf(run, 0, "value")).toEqual([]);
    expect(outputsOf(run, 1, "value")).toEqual([]);
    expect(countChecks(run)).toEqual({ passed: 2, failed: 2 });
    expect(checkResults(run).map((c) => c.anchor)).toEqual([
      "check-1-1",
      "check-1-2",
      "check-2-1",
      "check-3-1",
    ]);
    expect(runExitCode(run)).toBe(EXIT.checkFailed);

    const html = renderReport(document, run);
    expect(html).toContain("2 of 4 acceptance checks failed");
    expect(html).toContain('href="#check-1-2"');
    expect(html).toContain('id="check-1-2"');
    expect(html).toMatch(
      /<tr class="check check-fail" id="check-1-2">.*FAIL.*ΔE00 patch 3.*2\.60.*0\.60 above the limit.*≤ 2/,
    );
    expect(html).toMatch(/<tr class="check check-pass" id="check-1-1">.*pass.*τv.*0\.125.*0\.08 to 0\.18/);
    expect(html).toContain("&lt;b&gt;evil&lt;/b&gt;");
    expect(html).not.toContain("<b>evil</b>");
    expect(html).toContain("NaN, not a finite number");
  });

  it("a failed cell's exit code wins over a failed check", async () => {
    const { run } = await runText(
      ts('check("a", 5, { max: 1 });') + ts("throw new Error('instrument file missing')"),
    );
    expect(countChecks(run).failed).toBe(1);
    expect(runExitCode(run)).toBe(EXIT.notebookFailed);
  });

  it("keeps every check even past the cap on a cell's outputs", async () => {
    const { run } = await runText(
      ts("for (let i = 0; i < 1500; i++) console.log(i), show(i);\ncheck('late', 3, { max: 1 });"),
    );
    expect(countChecks(run)).toEqual({ passed: 0, failed: 1 });
  });
});

describe("tristim run with checks", () => {
  it("exits 3 when a check fails and names it; 0 when all pass; 1 when a cell fails too", () => {
    const passing = notebookFile(ts('check("contrast", 1200, { min: 1000 })'));
    const ok = tristim(["run", passing]);
    expect(ok.code).toBe(EXIT.ok);
    expect(ok.out).toContain("1 check passed");

    const failing = notebookFile(
      ts('check("white Δu′v′", 0.0052, { max: 0.004 });\ncheckCondition("ramp monotonic", true)'),
    );
    const bad = tristim(["run", failing]);
    expect(bad.code).toBe(EXIT.checkFailed);
    expect(bad.err).toContain("1 of 2 checks FAILED");
    expect(bad.err).toContain("check failed (cell 1): white Δu′v′: 0.0052 (limits ≤ 0.004)");
    expect(fs.readFileSync(failing.replace(/\.md$/, ".html"), "utf8")).toContain(
      "1 of 2 acceptance checks failed",
    );

    const both = notebookFile(
      ts('check("white Δu′v′", 0.0052, { max: 0.004 })') + ts("throw new Error('boom')"),
    );
    expect(tristim(["run", both]).code).toBe(EXIT.notebookFailed);
    // Several notebooks: the worst code over them.
    expect(tristim(["run", passing, failing, "-o", path.join(path.dirname(passing), "out")]).code).toBe(
      EXIT.checkFailed,
    );
  }, 120_000);
});

/** A run record for renderer-only tests: one cell that showed `outputs`. */
function fakeRun(outputs: OutputRecord[]): RunRecord {
  return runRecord([okCell(0, outputs, 1)], { durationMs: 1 });
}

describe("the summary", () => {
  it("says all passed in words, not colour alone", () => {
    const doc = parseNotebook(ts("1"), "/lab/nb.md");
    const html = renderReport(
      doc,
      fakeRun([checkRecord("a", 1, { max: 2 }), checkRecord("b", 1, { max: 2 })]),
    );
    expect(html).toContain("All 2 acceptance checks passed");
    expect(html).not.toContain("FAIL");
  });
});
