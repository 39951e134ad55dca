/**
 * Decision rules for checks whose value has an uncertainty (issue 13): simple and guarded acceptance as defined in
 * ILAC-G8:2019 §4.2.1–4.2.2 (acceptance zone = tolerance limits narrowed by the guard band w; simple acceptance is
 * w = 0) and ISO 14253-1:2017 (conformance zone); the outcomes when value ± U reaches across a limit. The expected
 * outcomes follow from those definitions, worked by hand in each test.
 */
import { describe, expect, it } from "vitest";
import { checkRecord } from "../../cells/checks.ts";
import type { OutputRecord } from "../../cells/records.ts";
import { runExitCode } from "../../runner/records/run-outcome.ts";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { parseNotebook } from "../../runner/parse/parse-notebook.ts";
import { checkLine, valueText } from "../../runner/text/check-text.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import { readEmbeddedRunRecord } from "../../runner/report/embedded-run-record.ts";
import { okCell, runRecord } from "./run-records.ts";
import { outputsOf, runText, ts } from "./helpers.ts";

describe("decision rules", () => {
  // The issue's case: τv = 0.64 against a limit of 0.65 … here as a minimum: τv ≥ 0.65.
  it("simple acceptance (w = 0): decided on the value; value ± U across the limit is marginal", () => {
    const clearPass = checkRecord("τv", 0.7, { min: 0.65, uncertainty: 0.02 });
    const marginalPass = checkRecord("τv", 0.66, { min: 0.65, uncertainty: 0.02 });
    const marginalFail = checkRecord("τv", 0.64, { min: 0.65, uncertainty: 0.02 });
    const clearFail = checkRecord("τv", 0.6, { min: 0.65, uncertainty: 0.02 });
    expect([clearPass, marginalPass, marginalFail, clearFail].map((r) => r.passed)).toEqual([
      true,
      true,
      false,
      false,
    ]);
    expect([clearPass, marginalPass, marginalFail, clearFail].map((r) => r.decision!.outcome)).toEqual([
      "pass",
      "marginal pass",
      "marginal fail",
      "fail",
    ]);
    expect(marginalPass.decision!.guardBand).toBe(0);
  });

  it("guarded acceptance with w = U (ILAC-G8 §4.2.2): passes only when value ± U lies inside the limits", () => {
    // Acceptance zone: 0.65 + 0.02 ≤ τv; 0.66 lies between the limit and the zone, so it fails, marginally.
    const r = checkRecord("τv", 0.66, { min: 0.65, uncertainty: 0.02, rule: "guarded" });
    expect(r.passed).toBe(false);
    expect(r.decision).toMatchObject({ rule: "guarded", guardBand: 0.02, outcome: "marginal fail" });
    expect(r.decision!.acceptance.min).toBeCloseTo(0.67, 12);
    expect(
      checkRecord("τv", 0.671, { min: 0.65, uncertainty: 0.02, rule: "guarded" }).decision!.outcome,
    ).toBe("pass");
    // Two-sided: target ± tolerance narrowed on both sides; a guard band of its own.
    const t = { target: 6500, tolerance: 200, uncertainty: 60, rule: "guarded" as const, guardBand: 100 };
    expect(checkRecord("CCT", 6590, t).passed).toBe(true); // |90| ≤ 200 − 100
    expect(checkRecord("CCT", 6590, t).decision!.outcome).toBe("pass"); // 6530..6650 inside 6300..6700
    expect(checkRecord("CCT", 6410, t).passed).toBe(true);
    expect(checkRecord("CCT", 6650, t).decision!.outcome).toBe("marginal fail"); // outside 6400..6600, interval crosses 6700
    expect(checkRecord("CCT", 6800, t).decision!.outcome).toBe("fail"); // 6740..6860 wholly above 6700
  });

  it("w = U with k = 2 keeps the risk of false acceptance at the acceptance limit near 2.3 % (ILAC-G8 §4.2.2, normal case)", () => {
    // At the edge of the acceptance zone the true value exceeds the limit with P(Z > U/u) = P(Z > 2): 2.28 %.
    const U = 0.02,
      u = U / 2;
    const edge = checkRecord("τv", 0.65 + U, { min: 0.65, uncertainty: U, rule: "guarded" });
    expect(edge.passed).toBe(true);
    const pfa = 0.5 * erfc((0.65 + U - 0.65) / u / Math.SQRT2);
    expect(pfa).toBeCloseTo(0.02275, 4);
  });

  it("takes the value and U from an uncertainty result's output, and refuses mixed or incomplete forms", () => {
    const out = { estimate: 0.655, expandedUncertainty: 0.012 };
    const r = checkRecord("τv", out, { min: 0.65 });
    expect(r.value).toBe(0.655);
    expect(r.decision!.expandedUncertainty).toBe(0.012);
    expect(() => checkRecord("τv", out, { min: 0.65, uncertainty: 0.01 })).toThrow(/already carries/);
    expect(() => checkRecord("τv", 0.7, { min: 0.65, rule: "guarded" })).toThrow(
      /needs the value's expanded/,
    );
    expect(() => checkRecord("τv", 0.7, { min: 0.65, uncertainty: 0.01, guardBand: 0.01 })).toThrow(
      /guarded/,
    );
    expect(() => checkRecord("τv", 0.7, { min: 0.65, uncertainty: -1 })).toThrow(/≥ 0/);
  });

  it("a check without an uncertainty is decided as before and carries no decision", () => {
    const r = checkRecord("τv", 0.64, { min: 0.65 });
    expect(r.passed).toBe(false);
    expect(r.decision).toBeUndefined();
  });
});

describe("words, report, run record and exit code", () => {
  const records: OutputRecord[] = [
    checkRecord("τv blank 1", 0.6612, { min: 0.65, uncertainty: 0.0234, digits: 3 }),
    checkRecord("τv blank 2", 0.6612, { min: 0.65, uncertainty: 0.0234, rule: "guarded", digits: 3 }),
  ];
  const run = runRecord([okCell(0, records)]);

  it('shows "value ± U (k = 2)" and the rule with its outcome', () => {
    expect(valueText(records[0] as never)).toBe("0.661 ± 0.023 (k = 2)");
    expect(checkLine(records[0] as never)).toBe(
      "τv blank 1: 0.661 ± 0.023 (k = 2) (limits ≥ 0.65; simple acceptance (no guard band): marginal pass, value ± U reaches across a limit)",
    );
    expect(checkLine(records[1] as never)).toContain(
      "guarded acceptance, guard band 0.023 (accepted: ≥ 0.6734): marginal FAIL",
    );
  });

  it("the report marks both rows, the summary names the marginal pass and the failure, and exit code 3", () => {
    const html = renderReport(parseNotebook("```ts\n1\n```\n", "/lab/lot.md"), run);
    expect(html).toMatch(
      /<tr class="check check-pass" id="check-1-1">.*marginal pass.*0\.661 ± 0\.023 \(k = 2\)/,
    );
    expect(html).toMatch(/<tr class="check check-fail" id="check-1-2">.*marginal FAIL/);
    expect(html).toContain("One pass is marginal");
    expect(html).toContain("1 of 2 acceptance checks failed");
    expect(runExitCode(run)).toBe(EXIT.checkFailed);
    const embedded = readEmbeddedRunRecord(html);
    expect(embedded.checks[1]!.decision).toMatchObject({ rule: "guarded", outcome: "marginal fail" });
    expect(embedded.exitCode).toBe(3);
  });

  it("a marginal pass alone exits 0", () => {
    expect(runExitCode(runRecord([okCell(0, [records[0]!])]))).toBe(EXIT.ok);
  });
});

describe("tables", () => {
  it('show a column of uncertainty results as "value ± U" under a header stating (k = 2) once (JCGM 100 §7.2.6: U to two significant digits)', async () => {
    const { run } = await runText(
      ts(
        'showTable([{ blank: "A", tauV: { estimate: 26.5432, expandedUncertainty: 0.2071, standardUncertainty: 0.1 } }])',
      ),
    );
    const table = outputsOf(run, 0, "table")[0]!;
    expect(table.rows).toEqual([["A", "26.54 ± 0.21"]]);
    expect(table.columns.map((c) => c.label)).toEqual(["blank", "tauV (k = 2)"]);
  });

  it("keep (k = 2) in a cell when its column mixes uncertainty results with other values", async () => {
    const { run } = await runText(
      ts('showTable([{ v: { estimate: 1.234, expandedUncertainty: 0.05 } }, { v: "not measured" }])'),
    );
    expect(outputsOf(run, 0, "table")[0]!.rows).toEqual([["1.234 ± 0.050 (k = 2)"], ["not measured"]]);
  });
});

function erfc(x: number): number {
  // Continued fraction (Lentz) for x > 0 is overkill here; the series of erf converges well for x ≤ 3.
  let term = x,
    s = x;
  for (let n = 1; n < 80; n++) {
    term *= (-x * x) / n;
    s += term / (2 * n + 1);
  }
  return 1 - (2 / Math.sqrt(Math.PI)) * s;
}
