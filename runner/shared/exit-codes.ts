/**
 * The exit codes of the `tristim` command. Scripts and CI can rely on these numbers; they are listed in
 * `tristim --help`, README.md and DEVELOPERS.md.
 */
export const EXIT = {
  /** Every notebook ran and its report was written. */
  ok: 0,
  /** A cell failed, or a notebook could not be read or parsed (missing file, bad front matter, unknown option, ...). */
  notebookFailed: 1,
  /** The command line was wrong (unknown command or option, bad value, unknown input name). */
  usage: 2,
  /**
   * Every cell ran, but an acceptance check (check / checkCondition) failed. A failed cell (1) wins over this. A check
   * with an uncertainty fails by its decision rule: "fail" and "marginal fail" exit 3, "pass" and "marginal pass" 0
   * (simple acceptance decides on the value, guarded acceptance on the limits narrowed by the guard band).
   */
  checkFailed: 3,
  /** The runner itself failed: a report, results file or PDF (--pdf) could not be written, or an internal error (TRISTIM_DEBUG=1). */
  internal: 4,
} as const;

export type ExitCode = (typeof EXIT)[keyof typeof EXIT];

/** Exit codes from least to most severe: a failed cell outranks a failed check, and the runner's own failure both. */
const SEVERITY: readonly ExitCode[] = [
  EXIT.ok,
  EXIT.checkFailed,
  EXIT.notebookFailed,
  EXIT.usage,
  EXIT.internal,
];

/** The more severe of two exit codes (for several notebooks or a batch: the worst over the runs). */
export function worseExit(a: ExitCode, b: ExitCode): ExitCode {
  return SEVERITY.indexOf(b) > SEVERITY.indexOf(a) ? b : a;
}
