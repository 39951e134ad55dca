/**
 * Acceptance checks: a cell states a measured value and its limits (`check`) or a plain condition (`checkCondition`).
 * Each becomes a check record, shown in place and counted in the report's summary; a failed check makes
 * `tristim run` exit with code 3 so a notebook can gate a QA step. The value is compared at full precision, never
 * as rounded for display.
 */
import { inspect } from "node:util";
import { emitRecord } from "./emit.ts";
import { checkDigits, formatNumber } from "./format-number.ts";
import type { CheckLimits, CheckRecord } from "./records.ts";

/** The limits argument of `check`: at least one of min, max or target ± tolerance; unit and digits for display. */
export interface CheckOptions {
  readonly min?: number;
  readonly max?: number;
  readonly target?: number;
  readonly tolerance?: number;
  /** Unit of the value and the limits, e.g. "K", "%", "cd/m²". */
  readonly unit?: string;
  /** Decimals of the value and limits in the report (the comparison always uses the full value). */
  readonly digits?: number;
}

const OPTION_KEYS = ["min", "max", "target", "tolerance", "unit", "digits"] as const;

/**
 * States an acceptance check: passes when every limit given holds (min ≤ value ≤ max, |value − target| ≤ tolerance).
 * A value that is not a finite number fails, with a note saying so. Returns whether the check passed.
 */
export function check(label: string, value: number, limits: CheckOptions): boolean {
  const record = checkRecord(label, value, limits);
  emitRecord(record);
  return record.passed;
}

/** States an acceptance check on a plain condition (true passes); `detail` says what was checked. Returns it. */
export function checkCondition(label: string, condition: boolean, detail?: string): boolean {
  const record = conditionRecord(label, condition, detail);
  emitRecord(record);
  return record.passed;
}

/** The check record of `check` (pure; throws a TypeError or RangeError naming a bad label or limit). */
export function checkRecord(label: string, value: number, limits: CheckOptions): CheckRecord {
  requireLabel(label, "check");
  const where = `check "${label}"`;
  if (typeof limits !== "object" || limits === null || Array.isArray(limits)) {
    throw new TypeError(
      `${where}: the third argument must be limits like { min, max } or { target, tolerance }, got ${describe(limits)}`,
    );
  }
  for (const key of Object.keys(limits)) {
    if (!(OPTION_KEYS as readonly string[]).includes(key)) {
      throw new TypeError(`${where}: unknown limit "${key}" (the limits are ${OPTION_KEYS.join(", ")})`);
    }
  }
  const bounds: { -readonly [K in keyof CheckLimits]: number } = {};
  for (const key of ["min", "max", "target", "tolerance"] as const) {
    const limit = limits[key];
    if (limit === undefined) continue;
    if (typeof limit !== "number" || !Number.isFinite(limit)) {
      throw new TypeError(`${where}: ${key} must be a finite number, got ${describe(limit)}`);
    }
    bounds[key] = limit;
  }
  if ((bounds.target === undefined) !== (bounds.tolerance === undefined)) {
    throw new RangeError(
      `${where}: target and tolerance go together (got ${bounds.target === undefined ? "a tolerance without a target" : "a target without a tolerance"})`,
    );
  }
  if (bounds.min === undefined && bounds.max === undefined && bounds.target === undefined) {
    throw new RangeError(`${where}: give at least one limit: min, max, or target with tolerance`);
  }
  if (bounds.tolerance !== undefined && bounds.tolerance < 0) {
    throw new RangeError(`${where}: tolerance must not be negative, got ${bounds.tolerance}`);
  }
  if (bounds.min !== undefined && bounds.max !== undefined && bounds.min > bounds.max) {
    throw new RangeError(`${where}: min ${bounds.min} is greater than max ${bounds.max}`);
  }
  if (limits.unit !== undefined && typeof limits.unit !== "string") {
    throw new TypeError(`${where}: unit must be a string, got ${describe(limits.unit)}`);
  }
  const digits = checkDigits(limits.digits, where);
  const unit = limits.unit?.trim() || undefined;
  const base = {
    kind: "check" as const,
    label,
    limits: bounds,
    ...(unit ? { unit } : {}),
    ...(digits !== undefined ? { digits } : {}),
  };

  if (typeof value !== "number" || !Number.isFinite(value)) {
    const text = typeof value === "number" ? formatNumber(value) : describe(value);
    const what = typeof value === "number" ? "not a finite number" : "not a number";
    return {
      ...base,
      passed: false,
      value: null,
      valueText: text,
      detail: `The value is ${text}, ${what}, so it cannot meet the limits.`,
    };
  }
  const passed = withinLimits(value, bounds);
  return { ...base, passed, value, valueText: valueText(value, digits, bounds, passed) };
}

/** The check record of `checkCondition` (pure; throws a TypeError for a label or condition of the wrong type). */
export function conditionRecord(label: string, condition: boolean, detail?: string): CheckRecord {
  requireLabel(label, "checkCondition");
  if (typeof condition !== "boolean") {
    throw new TypeError(
      `checkCondition "${label}": the condition must be true or false, got ${describe(condition)}; compare explicitly, e.g. list.length > 0`,
    );
  }
  if (detail !== undefined && typeof detail !== "string") {
    throw new TypeError(`checkCondition "${label}": detail must be a string, got ${describe(detail)}`);
  }
  return { kind: "check", label, passed: condition, ...(detail ? { detail } : {}) };
}

/** Whether `value` meets every limit given (the limits compared in double precision, as written). */
export function withinLimits(value: number, limits: CheckLimits): boolean {
  if (limits.min !== undefined && !(value >= limits.min)) return false;
  if (limits.max !== undefined && !(value <= limits.max)) return false;
  if (limits.target !== undefined && limits.tolerance !== undefined) {
    // Written as an interval, so that a value on a decimal limit (1.1 against 1.0 ± 0.1) passes as a reader expects.
    if (!(value >= limits.target - limits.tolerance && value <= limits.target + limits.tolerance))
      return false;
  }
  return true;
}

/**
 * The value as text. With `digits`, rounded; but when the rounded text would seem to contradict the outcome (2.004
 * shown as "2.00" failing a max of 2), the full value is shown instead, so the report never looks wrong.
 */
function valueText(value: number, digits: number | undefined, limits: CheckLimits, passed: boolean): string {
  const text = formatNumber(value, digits);
  if (withinLimits(Number(text), limits) === passed) return text;
  return String(value);
}

function requireLabel(label: unknown, fn: string): asserts label is string {
  if (typeof label !== "string" || label.trim() === "") {
    throw new TypeError(
      `${fn}: the first argument must be a label (a non-empty string), got ${describe(label)}`,
    );
  }
}

function describe(value: unknown): string {
  if (value === undefined) return "undefined";
  if (value === null) return "null";
  if (typeof value === "string") return JSON.stringify(value.length > 60 ? `${value.slice(0, 60)}…` : value);
  if (typeof value === "number") return formatNumber(value);
  return inspect(value, { depth: 0, breakLength: Infinity }).slice(0, 80);
}
