/**
 * Checking the arguments of the file readers and writers, once at their entry: a path, a file's text or bytes, the
 * readers' options (a quantity that must be stated), parsed CGATS tables and files. A wrong argument is an
 * ArgumentError naming the function; what is wrong inside a well-formed file stays a DataFileError with its line.
 */
import { ArgumentError } from "../arguments/argument-error.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkChoice, checkString } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { QUANTITIES } from "../arguments/common-arguments.ts";
import { describeKind } from "../arguments/describe-kind.ts";
import { refuse } from "../arguments/refuse.ts";

/** True for a plain record: an object that is not null, an array, a typed array or a spectrum. */
export function isRecord(value: unknown): value is Record<string, unknown> {
  return (
    typeof value === "object" &&
    value !== null &&
    !Array.isArray(value) &&
    !ArrayBuffer.isView(value) &&
    !isWellFormedSpectrum(value)
  );
}

/** Throws an ArgumentError unless `value` is a file path: a non-empty string. */
export function checkPath(fn: string, arg: string, value: unknown): void {
  checkString(fn, arg, value, {
    nonEmpty: true,
    what: "a file path (a non-empty string, relative to the notebook's folder)",
  });
}

/** Throws an ArgumentError unless `value` is a file's text (a string) or its bytes (a Uint8Array, e.g. a Buffer). */
export function checkTextOrBytes(fn: string, arg: string, value: unknown): void {
  checkWith(
    fn,
    arg,
    value,
    "the file's text (a string) or its bytes (a Uint8Array)",
    (v) => typeof v === "string" || v instanceof Uint8Array,
  );
}

/** Throws an ArgumentError when an encoding other than "auto" is stated for text: it applies to a file's bytes. */
export function checkEncodingOfText(fn: string, input: unknown, encoding: unknown): void {
  if (typeof input === "string" && encoding !== undefined && encoding !== "auto")
    throw new ArgumentError(
      fn,
      "options.encoding",
      '"auto" or absent when the input is text (an encoding applies to a file\'s bytes; the text given is already decoded)',
      describeKind(encoding),
    );
}

/**
 * Throws an ArgumentError unless `value` is undefined or a whole number of at least `min`, or "auto" (a reader's
 * line or column count).
 */
export function checkCountOrAuto(fn: string, arg: string, value: unknown, min: number, what: string): void {
  checkWith(
    fn,
    arg,
    value,
    `${what} (a whole number from ${min}) or "auto"`,
    (v) => v === "auto" || (typeof v === "number" && Number.isInteger(v) && v >= min),
    { optional: true },
  );
}

/**
 * Throws an ArgumentError unless `options` is a plain object of `valid` names with a spectral `quantity` stated:
 * the readers of spectra never assume what the values are. `what` names what holds them ("the columns").
 */
export function checkQuantityOptions(
  fn: string,
  options: unknown,
  valid: readonly string[],
  what: string,
): void {
  const hint = `the quantity is never assumed: state what ${what} hold, e.g. { quantity: "transmittance" } or { quantity: "reflectance" }`;
  if (!isRecord(options)) {
    const others = valid.filter((k) => k !== "quantity");
    throw new ArgumentError(
      fn,
      "options",
      `an options object with quantity (what ${what} hold; required)${others.length > 0 ? ` and any of ${others.join(", ")}` : ""}`,
      describeKind(options),
      hint,
    );
  }
  checkOptions(fn, "options", options, valid);
  const listed = QUANTITIES.map((q) => JSON.stringify(q)).join(", ");
  if (options.quantity === undefined)
    throw new ArgumentError(fn, "options.quantity", `what ${what} hold: one of ${listed}`, "undefined", hint);
  checkChoice(fn, "options.quantity", options.quantity, QUANTITIES, { what: `what ${what} hold` });
}

/** Throws an ArgumentError unless `value` is undefined or a list of strings (a writer's comment lines, names). */
export function checkStringList(fn: string, arg: string, value: unknown, what = "strings"): void {
  if (value === undefined) return;
  if (!Array.isArray(value)) refuse(fn, arg, `an array of ${what}`, value);
  value.forEach((v, i) => checkString(fn, `${arg}[${i}]`, v));
}

/** Throws an ArgumentError unless `value` is undefined or a record whose every value is a string. */
export function checkStringRecord(fn: string, arg: string, value: unknown, what: string): void {
  if (value === undefined) return;
  if (!isRecord(value)) refuse(fn, arg, what, value);
  for (const key of Object.keys(value)) checkString(fn, `${arg}[${JSON.stringify(key)}]`, value[key]);
}

const CGATS_TABLE = "a table of a parsed CGATS file (e.g. readCgats(path).tables[0])";

/** Throws an ArgumentError unless `value` is a table of a parsed CGATS file: { keywords, declared, fields, sets, setLines }. */
export function checkCgatsTable(fn: string, arg: string, value: unknown): void {
  if (isRecord(value) && Array.isArray(value.tables))
    refuse(fn, arg, CGATS_TABLE, value, {
      object: "for a parsed file pass one of its tables, e.g. file.tables[0]",
    });
  if (
    !isRecord(value) ||
    !isRecord(value.keywords) ||
    !Array.isArray(value.declared) ||
    !Array.isArray(value.fields) ||
    !Array.isArray(value.sets) ||
    !Array.isArray(value.setLines)
  )
    refuse(fn, arg, CGATS_TABLE, value);
  const fields = value.fields as unknown[];
  const sets = value.sets as unknown[];
  fields.forEach((f, i) => checkString(fn, `${arg}.fields[${i}]`, f, { what: "a field name (a string)" }));
  sets.forEach((set, i) => {
    if (!Array.isArray(set) || set.length !== fields.length)
      refuse(fn, `${arg}.sets[${i}]`, `an array of ${fields.length} values, one per field`, set);
  });
  if ((value.setLines as unknown[]).length !== sets.length)
    refuse(fn, `${arg}.setLines`, `an array of ${sets.length} line numbers, one per set`, value.setLines);
}

/** Throws an ArgumentError unless `value` is a parsed CGATS file: { identifier, tables, comments }. */
export function checkCgatsFile(fn: string, arg: string, value: unknown): void {
  const expected = "a parsed CGATS file (from readCgats(path) or parseCgats(text))";
  if (isRecord(value) && Array.isArray(value.fields) && Array.isArray(value.sets))
    refuse(fn, arg, expected, value, {
      object: "this is one table of a file: pass the whole file, and choose the table with options.table",
    });
  if (!isRecord(value) || !Array.isArray(value.tables)) refuse(fn, arg, expected, value);
  (value.tables as unknown[]).forEach((t, i) => checkCgatsTable(fn, `${arg}.tables[${i}]`, t));
}
