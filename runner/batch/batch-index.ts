/**
 * The record of a batch (`tristim run nb.md --each name=pattern`): one entry per data file, reduced from each run's
 * RunRecord to plain data, so the index page is written from records like every report.
 */
import { cautionResults } from "../records/caution-results.ts";
import { checkResults, type CheckCounts } from "../records/check-results.ts";
import { EXIT, type ExitCode } from "../shared/exit-codes.ts";
import type { RunRecord } from "../records/run-record.ts";

/** One run of the batch, as the index lists it. */
export interface BatchEntry {
  /** The data file as bound to the input (relative to the notebook's folder). */
  readonly dataFile: string;
  /** SHA-256 of the data file before the run. */
  readonly sha256: string;
  /** The report's file name, relative to the index page; absent when it could not be written. */
  readonly report?: string;
  readonly cells: {
    readonly total: number;
    readonly ran: number;
    readonly failed: readonly number[];
    readonly notRun: number;
  };
  readonly checks: CheckCounts;
  /** Labels of the failed checks. */
  readonly failedChecks: readonly string[];
  readonly cautions: number;
  readonly exit: ExitCode;
}

/** The whole batch. */
export interface BatchRecord {
  readonly notebook: { readonly path: string; readonly sha256: string; readonly title: string };
  readonly input: string;
  readonly pattern: string;
  readonly tool: { readonly name: string; readonly version: string };
  readonly node: string;
  readonly platform: string;
  /** ISO date and time the batch started (left out of a reproducible index). */
  readonly startedAt: string;
  readonly reproducible: boolean;
  readonly entries: readonly BatchEntry[];
}

/** The index entry of one run. */
export function batchEntry(
  run: RunRecord,
  dataFile: string,
  sha256: string,
  report: string | undefined,
  exit: ExitCode,
): BatchEntry {
  const checks = checkResults(run);
  const failedChecks = checks.filter((c) => !c.record.passed).map((c) => c.record.label);
  return {
    dataFile,
    sha256,
    ...(report ? { report } : {}),
    cells: {
      total: run.cells.filter((c) => c.status !== "listing").length,
      ran: run.cells.filter((c) => c.status === "ok" || c.status === "failed").length,
      failed: run.cells.filter((c) => c.status === "failed" && !c.failureAllowed).map((c) => c.index),
      notRun: run.cells.filter((c) => c.status === "not-run").length,
    },
    checks: { passed: checks.length - failedChecks.length, failed: failedChecks.length },
    failedChecks,
    cautions: cautionResults(run).length,
    exit: report ? exit : EXIT.internal,
  };
}
