/**
 * The runner's own error types. Each is shown to the user as a clear message without the runner's stack trace.
 */

/** A problem with a notebook (file, front matter, fences, options), placed at a file and line when known. */
export class NotebookError extends Error {
  override readonly name = "NotebookError";
  constructor(
    message: string,
    readonly file: string,
    readonly line?: number,
    readonly column?: number,
    /** Notebook lines around `line` with a marker, for the terminal. */
    readonly codeFrame?: string,
  ) {
    super(message);
  }

  /** "notebooks/x.md:12:3: message" as printed on the terminal. */
  where(displayPath: string): string {
    const place =
      this.line === undefined
        ? displayPath
        : `${displayPath}:${this.line}${this.column === undefined ? "" : `:${this.column}`}`;
    return `${place}: ${this.message}`;
  }
}

/** A wrong command line: unknown command, option or input, or a bad option value. */
export class UsageError extends Error {
  override readonly name = "UsageError";
}
