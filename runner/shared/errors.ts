/**
 * The runner's own error types. Each is shown to the user as a clear message without the runner's stack trace.
 */

import type { Location } from "../../cells/records.ts";

/** A place in a file as NotebookError knows it: the file always, line and column when known (see `Location`). */
export type PlaceInFile = Pick<Location, "file"> & Partial<Pick<Location, "line" | "column">>;

/** A problem with a notebook (file, front matter, fences, options), placed at a file and line when known. */
export class NotebookError extends Error {
  override readonly name = "NotebookError";
  constructor(
    message: string,
    readonly location: PlaceInFile,
    /** Notebook lines around the line with a marker, for the terminal. */
    readonly codeFrame?: string,
  ) {
    super(message);
  }

  get file(): string {
    return this.location.file;
  }

  get line(): number | undefined {
    return this.location.line;
  }

  get column(): number | undefined {
    return this.location.column;
  }

  /** "notebooks/x.md:12:3: message" as printed on the terminal. */
  where(displayPath: string): string {
    const { line, column } = this.location;
    const place =
      line === undefined ? displayPath : `${displayPath}:${line}${column === undefined ? "" : `:${column}`}`;
    return `${place}: ${this.message}`;
  }
}

/** A wrong command line: unknown command, option or input, or a bad option value. */
export class UsageError extends Error {
  override readonly name = "UsageError";
}
