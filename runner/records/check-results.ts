/**
 * The acceptance checks of a run, read from its records: each with its cell and its anchor in the report, and the
 * counts the summary, the command's exit code and the index page of a batch use.
 */
import type { CheckRecord } from "../../cells/records.ts";
import type { RunRecord } from "./run-record.ts";

/** One check as it appears in the report. */
export interface CheckResult {
  readonly record: CheckRecord;
  /** 0-based index of the cell that stated it. */
  readonly cell: number;
  /** The element id of its row in the report. */
  readonly anchor: string;
}

/** Counts of a run's checks. */
export interface CheckCounts {
  readonly passed: number;
  readonly failed: number;
}

/** The element id of the `n`-th check (0-based) of cell `cell` (0-based): "check-4-2" for cell 4's second. */
export function checkAnchor(cell: number, n: number): string {
  return `check-${cell + 1}-${n + 1}`;
}

/** Every check of the run, in notebook order. */
export function checkResults(run: RunRecord): CheckResult[] {
  const results: CheckResult[] = [];
  for (const cell of run.cells) {
    let n = 0;
    for (const o of cell.outputs)
      if (o.kind === "check")
        results.push({ record: o, cell: cell.index, anchor: checkAnchor(cell.index, n++) });
  }
  return results;
}

/** How many checks passed and failed. */
export function countChecks(run: RunRecord): CheckCounts {
  const all = checkResults(run);
  const failed = all.filter((c) => !c.record.passed).length;
  return { passed: all.length - failed, failed };
}
