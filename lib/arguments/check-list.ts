/** Checking array arguments: lists of numbers (with a length or a unit), of spectra, of records. */
import { refuse, type Instead } from "./refuse.ts";
import { isWellFormedSpectrum } from "./check-spectrum.ts";

export interface ListRule {
  readonly optional?: boolean;
  /** Exact length. */
  readonly length?: number;
  /** Least length (default 0). */
  readonly minLength?: number;
  /** Unit of the numbers, e.g. "nm". */
  readonly unit?: string;
  readonly instead?: Instead;
}

function lengthWords(rule: ListRule | undefined, items: string): string {
  if (rule?.length !== undefined) return `an array of ${rule.length} ${items}`;
  if (rule?.minLength !== undefined && rule.minLength > 0)
    return `an array of at least ${rule.minLength} ${items}`;
  return `an array of ${items}`;
}

function lengthFits(n: number, rule: ListRule | undefined): boolean {
  if (rule?.length !== undefined) return n === rule.length;
  return n >= (rule?.minLength ?? 0);
}

/** Throws an ArgumentError unless `value` is an array (or typed array) of finite numbers meeting the rule. */
export function checkNumberList(fn: string, arg: string, value: unknown, rule?: ListRule): void {
  if (value === undefined && rule?.optional) return;
  const expected = lengthWords(rule, `finite numbers${rule?.unit ? ` (${rule.unit})` : ""}`);
  if (!Array.isArray(value) && !(ArrayBuffer.isView(value) && !(value instanceof DataView)))
    refuse(fn, arg, expected, value, rule?.instead);
  const list = value as ArrayLike<unknown>;
  if (!lengthFits(list.length, rule)) refuse(fn, arg, expected, value, rule?.instead);
  for (let i = 0; i < list.length; i++) {
    const v = list[i];
    if (typeof v !== "number" || !Number.isFinite(v)) refuse(fn, `${arg}[${i}]`, "a finite number", v);
  }
}

/** Throws an ArgumentError unless `value` is an array whose every item passes `isItem` (described by `items`). */
export function checkList(
  fn: string,
  arg: string,
  value: unknown,
  items: string,
  isItem: (item: unknown) => boolean,
  rule?: ListRule,
): void {
  if (value === undefined && rule?.optional) return;
  const expected = lengthWords(rule, items);
  if (!Array.isArray(value) || !lengthFits(value.length, rule))
    refuse(fn, arg, expected, value, rule?.instead);
  value.forEach((item, i) => {
    if (!isItem(item)) refuse(fn, `${arg}[${i}]`, `one of ${items}`, item);
  });
}

/** Throws an ArgumentError unless `value` is an array of spectra. */
export function checkSpectrumList(fn: string, arg: string, value: unknown, rule?: ListRule): void {
  checkList(fn, arg, value, "spectra", isWellFormedSpectrum, rule);
}

/** Throws an ArgumentError unless `value` is a 3×3 matrix: an array of 3 rows of 3 finite numbers. */
export function checkMatrix3(fn: string, arg: string, value: unknown): void {
  const expected = "a 3×3 matrix (an array of 3 rows of 3 finite numbers)";
  if (!Array.isArray(value) || value.length !== 3) refuse(fn, arg, expected, value);
  value.forEach((row, i) => checkNumberList(fn, `${arg}[${i}]`, row, { length: 3 }));
}
