/**
 * The record of a batch (`tristim run nb.md --each name=pattern`): one entry per data file, reduced from each run's
 * embedded run record (plain data), so the index page is written from records like every report, and a merge of
 * shard folders (batch/collate.ts) rebuilds the same entries from the results embedded in the shards' index pages.
 */
import path from "node:path";
import { EXIT, type ExitCode } from "../shared/exit-codes.ts";
import type { CheckCounts } from "../records/check-results.ts";
import {
  resultsFile,
  type BatchResultsPlace,
  type ResultsFile,
  type RunResult,
} from "../report/results-file.ts";

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
    /** 0-based indexes of the failed cells (failures allowed by may-fail left out). */
    readonly failed: readonly number[];
    readonly notRun: number;
  };
  readonly checks: CheckCounts;
  /** Labels of the failed checks. */
  readonly failedChecks: readonly string[];
  readonly cautions: number;
  readonly exit: ExitCode;
  /** The run's results, embedded in the index page and written by --results. */
  readonly result: RunResult;
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
  /** The number of data files of the whole batch (more than `entries.length` for one shard). */
  readonly count: number;
  /** Set for one shard of a batch (`--shard K/N`). */
  readonly shard?: BatchResultsPlace["shard"];
  readonly entries: readonly BatchEntry[];
}

/** The index entry of one run, from its results. */
export function batchEntry(result: RunResult): BatchEntry {
  const record = result.record;
  const failedChecks = record.checks.filter((c) => !c.passed).map((c) => c.label);
  return {
    dataFile: result.dataFile ?? "",
    sha256: result.dataFileSha256 ?? "",
    ...(result.report ? { report: result.report } : {}),
    cells: {
      total: record.cells.filter((c) => c.status !== "listing").length,
      ran: record.cells.filter((c) => c.status === "ok" || c.status === "failed").length,
      failed: record.cells.filter((c) => c.status === "failed" && !c.failureAllowed).map((c) => c.cell - 1),
      notRun: record.cells.filter((c) => c.status === "not-run").length,
    },
    checks: { passed: record.checks.length - failedChecks.length, failed: failedChecks.length },
    failedChecks,
    cautions: record.cautions.length,
    exit: result.report ? result.exitCode : EXIT.internal,
    result,
  };
}

/** The batch's results (what the index page embeds and --results writes), from its record. */
export function batchResults(batch: BatchRecord): ResultsFile {
  return resultsFile(
    batch.entries.map((e) => e.result),
    {
      tool: batch.tool,
      reproducible: batch.reproducible,
      startedAt: batch.startedAt,
      batch: {
        notebook: {
          file: path.basename(batch.notebook.path),
          sha256: batch.notebook.sha256,
          title: batch.notebook.title,
        },
        input: batch.input,
        pattern: batch.pattern,
        count: batch.count,
        ...(batch.shard ? { shard: batch.shard } : {}),
      },
    },
  );
}
