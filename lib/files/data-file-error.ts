/** Errors from reading measurement files: they name the file (when known), the line, and where it applies the sample and wavelength. */
import { readFileSync, writeFileSync } from "node:fs";
import { checkFunction } from "../arguments/check-text.ts";
import { checkPath } from "./file-arguments.ts";

/** Where in a table a fault lies, beyond its line. */
export interface DataFilePlace {
  readonly sample?: string;
  /** Wavelength in nm. */
  readonly wavelength?: number;
}

export class DataFileError extends Error {
  /** 1-based line number in the file, when the fault is on one line. */
  readonly line: number | undefined;
  /** The file path, or undefined when text was parsed directly. */
  readonly file: string | undefined;
  /** The sample the fault concerns, when it concerns one. */
  readonly sample: string | undefined;
  /** The wavelength (nm) the fault concerns, when it concerns one. */
  readonly wavelength: number | undefined;
  /** The message without the file and line prefix. */
  readonly reason: string;

  constructor(message: string, line?: number, file?: string, place: DataFilePlace = {}) {
    const where = [file, line !== undefined ? `line ${line}` : undefined].filter(Boolean).join(", ");
    super(where ? `${where}: ${message}` : message);
    this.name = "DataFileError";
    this.reason = message;
    this.line = line;
    this.file = file;
    this.sample = place.sample;
    this.wavelength = place.wavelength;
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
  checkPath("withFileName", "file", file);
  if (error instanceof DataFileError && error.file === undefined) {
    return new DataFileError(error.reason, error.line, file, {
      sample: error.sample,
      wavelength: error.wavelength,
    });
  }
  return error instanceof Error ? error : new Error(String(error));
}

/** Reads a file's bytes; a missing file is an error naming the file. The path was checked by the public reader. */
export function readDataFileBytes(path: string): Buffer {
  if (typeof path !== "string" || path === "")
    throw new DataFileError(`expected a file path as a non-empty string, got ${JSON.stringify(path)}`);
  try {
    return readFileSync(path);
  } catch (e) {
    throw new DataFileError(`cannot read the file: ${(e as Error).message}`, undefined, path);
  }
}

/**
 * Reads a UTF-8 text file and parses it; a missing file or a fault in it is an error naming the file (and line).
 *
 * @param path The file's path (relative to the notebook's folder).
 * @param parse A function from the file's text to the result.
 * @returns What `parse` returns.
 * @source none: a tristim helper.
 * @example parseDataFile("data/filter-lot-114.csv", (text) => text.split("\n").length)
 */
export function parseDataFile<T>(path: string, parse: (text: string) => T): T {
  checkPath("parseDataFile", "path", path);
  checkFunction("parseDataFile", "parse", parse, {
    what: 'a function from the file\'s text to the result, e.g. (text) => text.split("\\n")',
  });
  return parseDataFileText(path, parse);
}

/** parseDataFile for the readers, whose arguments are already checked. */
export function parseDataFileText<T>(path: string, parse: (text: string) => T): T {
  const bytes = readDataFileBytes(path);
  try {
    return parse(bytes.toString("utf8"));
  } catch (e) {
    throw withFileName(e, path);
  }
}

/** Reads a file's bytes and parses them; a fault is an error naming the file (and line). */
export function parseDataFileBytes<T>(path: string, parse: (bytes: Uint8Array) => T): T {
  const bytes = readDataFileBytes(path);
  try {
    return parse(bytes);
  } catch (e) {
    throw withFileName(e, path);
  }
}

/** Writes a writer's text to a file; a file that cannot be written is an error naming the file. */
export function writeDataFileText(path: string, text: string): void {
  try {
    writeFileSync(path, text, "utf8");
  } catch (e) {
    throw new DataFileError(`cannot write the file: ${(e as Error).message}`, undefined, path);
  }
}
