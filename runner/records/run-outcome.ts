/** The outcome of one run as an exit code: a failed cell (1) wins over a failed acceptance check (3). */
import { checkResults } from "./check-results.ts";
import { EXIT, type ExitCode } from "../shared/exit-codes.ts";
import type { RunRecord } from "./run-record.ts";

/** 1 when a cell failed (not allowed by may-fail), else 3 when a check failed, else 0. */
export function runExitCode(run: RunRecord): ExitCode {
  if (run.cells.some((c) => c.status === "failed" && !c.failureAllowed)) return EXIT.notebookFailed;
  if (checkResults(run).some((c) => !c.record.passed)) return EXIT.checkFailed;
  return EXIT.ok;
}
