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
  /** Reserved: every cell ran but an acceptance check failed (acceptance checks are a later addition). */
  checkFailed: 3,
  /** The runner itself failed: a report could not be written, or an internal error (set TRISTIM_DEBUG=1 for details). */
  internal: 4,
} as const;

export type ExitCode = (typeof EXIT)[keyof typeof EXIT];
