/** Errors from reading measurement files: they name the file (when known) and the line, so the user can find the fault. */
import { readFileSync } from "node:fs";

export class DataFileError extends Error {
  /** 1-based line number in the file, when the fault is on one line. */
  readonly line: number | undefined;
  /** The file path, or undefined when text was parsed directly. */
  readonly file: string | undefined;

  constructor(message: string, line?: number, file?: string) {
    const where = [file, line !== undefined ? `line ${line}` : undefined].filter(Boolean).join(", ");
    super(where ? `${where}: ${message}` : message);
    this.name = "DataFileError";
    this.line = line;
    this.file = file;
  }
}

/**
 * A DataFileError that names no file, copied with the file name added; any other error is returned as it is (a
 * non-Error wrapped in one).
 *
 * @param error The error caught.
 * @param file The file's path.
 * @returns An Error; for a DataFileError its message starts "<file>, line <n>: ".
 * @source none: a tristim helper.
 * @example withFileName(new DataFileError("bad value", 3), "invented.csv").message
 */
export function withFileName(error: unknown, file: string): Error {
  if (error instanceof DataFileError && error.file === undefined) {
    const bare = error.line !== undefined ? error.message.replace(/^line \d+: /, "") : error.message;
    return new DataFileError(bare, error.line, file);
  }
  return error instanceof Error ? error : new Error(String(error));
}

/**
 * Reads a text file and parses it; a missing file or a fault in it is an error naming the file (and line).
 *
 * @param path The file's path (relative to the notebook's folder).
 * @param parse A function from the file's text to the result.
 * @returns What `parse` returns.
 * @source none: a tristim helper.
 * @example parseDataFile("data/filter-lot-114.csv", (text) => text.split("\n").length)
 */
export function parseDataFile<T>(path: string, parse: (text: string) => T): T {
  let text: string;
  try {
    text = readFileSync(path, "utf8");
  } catch (e) {
    throw new DataFileError(`cannot read the file: ${(e as Error).message}`, undefined, path);
  }
  try {
    return parse(text);
  } catch (e) {
    throw withFileName(e, path);
  }
}
