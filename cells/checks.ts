/**
 * Acceptance checks: a cell states a measured value and its limits (`check`) or a plain condition (`checkCondition`).
 * Each becomes a check record, shown in place and counted in the report's summary; a failed check makes
 * `tristim run` exit with code 3 so a notebook can gate a QA step. The value is compared at full precision, never
 * as rounded for display.
 */
import { inspect } from "node:util";
import { emitRecord } from "./emit.ts";
import { noteMethod } from "../lib/methods/method-log.ts";
import { checkDigits, formatNumber } from "./format-number.ts";
import type { CheckDecision, CheckLimits, CheckRecord } from "./records.ts";

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
  /**
   * Expanded uncertainty U of the value (k = 2), in its unit; or pass an uncertainty result's output
   * ({ estimate, expandedUncertainty }) as the value. Without it the check is decided on the value alone, as before.
   */
  readonly uncertainty?: number;
  /**
   * The decision rule (ILAC-G8:2019 §4.2): "simple" acceptance compares the value with the limits (default);
   * "guarded" acceptance compares it with the limits narrowed by `guardBand`.
   */
  readonly rule?: "simple" | "guarded";
  /** The guard band w of guarded acceptance, in the value's unit; default U (ILAC-G8:2019 §4.2.2, w = U). */
  readonly guardBand?: number;
}

/** A value with its expanded uncertainty, as an uncertainty result gives it (`result.outputs.y`). */
export interface UncertainValue {
  readonly estimate: number;
  readonly expandedUncertainty: number;
}

const OPTION_KEYS = [
  "min",
  "max",
  "target",
  "tolerance",
  "unit",
  "digits",
  "uncertainty",
  "rule",
  "guardBand",
] as const;

/**
 * States an acceptance check: passes when every limit given holds (min ≤ value ≤ max, |value − target| ≤ tolerance).
 * A value that is not a finite number fails, with a note saying so. With an uncertainty (the `uncertainty` option, or
 * a value { estimate, expandedUncertainty }) the decision rule decides: simple acceptance as above, guarded
 * acceptance against the limits narrowed by the guard band; the record says whether value ± U crosses a limit.
 * Returns whether the check passed.
 */
export function check(label: string, value: number | UncertainValue, limits: CheckOptions): boolean {
  const record = checkRecord(label, value, limits);
  if (record.decision) noteDecisionRule(record.decision);
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
export function checkRecord(
  label: string,
  given: number | UncertainValue,
  limits: CheckOptions,
): CheckRecord {
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
  const { value, uncertainty } = valueAndUncertainty(given, limits, where);
  if (limits.rule !== undefined && limits.rule !== "simple" && limits.rule !== "guarded")
    throw new TypeError(`${where}: rule must be "simple" or "guarded", got ${describe(limits.rule)}`);
  if ((limits.rule !== undefined || limits.guardBand !== undefined) && uncertainty === undefined)
    throw new RangeError(
      `${where}: a decision rule needs the value's expanded uncertainty: give uncertainty: U, or pass { estimate, expandedUncertainty } as the value`,
    );
  if (limits.guardBand !== undefined && limits.rule !== "guarded")
    throw new RangeError(`${where}: a guard band belongs to rule: "guarded"`);
  if (
    limits.guardBand !== undefined &&
    !(typeof limits.guardBand === "number" && Number.isFinite(limits.guardBand) && limits.guardBand >= 0)
  )
    throw new TypeError(`${where}: guardBand must be a finite number ≥ 0, got ${describe(limits.guardBand)}`);
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
  if (uncertainty === undefined) {
    const passed = withinLimits(value, bounds);
    return { ...base, passed, value, valueText: valueText(value, digits, bounds, passed) };
  }
  const decision = decide(value, uncertainty, bounds, limits.rule ?? "simple", limits.guardBand);
  const passed = decision.outcome === "pass" || decision.outcome === "marginal pass";
  return {
    ...base,
    passed,
    value,
    valueText: valueText(value, digits, decision.acceptance, passed),
    decision,
  };
}

/** The value and its expanded uncertainty from a bare number, a { estimate, expandedUncertainty }, and the options. */
function valueAndUncertainty(
  given: unknown,
  limits: CheckOptions,
  where: string,
): { value: number; uncertainty?: number } {
  let value = given as number;
  let uncertainty: number | undefined;
  if (typeof given === "object" && given !== null && "estimate" in given && "expandedUncertainty" in given) {
    const g = given as UncertainValue;
    if (limits.uncertainty !== undefined)
      throw new RangeError(
        `${where}: the value already carries its expanded uncertainty; leave out the uncertainty option`,
      );
    value = g.estimate;
    uncertainty = g.expandedUncertainty;
  } else uncertainty = limits.uncertainty;
  if (
    uncertainty !== undefined &&
    !(typeof uncertainty === "number" && Number.isFinite(uncertainty) && uncertainty >= 0)
  )
    throw new TypeError(
      `${where}: the expanded uncertainty must be a finite number ≥ 0, got ${describe(uncertainty)}`,
    );
  return uncertainty === undefined ? { value } : { value, uncertainty };
}

/**
 * Decides a value with expanded uncertainty U under a rule (ILAC-G8:2019 §4.2.1 simple acceptance, w = 0; §4.2.2
 * guarded acceptance, acceptance zone = limits narrowed by w, ISO 14253-1:2017 §5): the outcome, and whether
 * value ± U crosses a limit (marginal) or lies clear of all of them.
 */
export function decide(
  value: number,
  U: number,
  limits: CheckLimits,
  rule: "simple" | "guarded",
  guardBand?: number,
): CheckDecision {
  const w = rule === "guarded" ? (guardBand ?? U) : 0;
  const acceptance: { -readonly [K in keyof CheckLimits]: number } = {};
  if (limits.min !== undefined) acceptance.min = limits.min + w;
  if (limits.max !== undefined) acceptance.max = limits.max - w;
  if (limits.target !== undefined && limits.tolerance !== undefined) {
    acceptance.target = limits.target;
    acceptance.tolerance = limits.tolerance - w;
  }
  const accepted =
    (acceptance.tolerance === undefined || acceptance.tolerance >= 0) &&
    (acceptance.min === undefined || acceptance.max === undefined || acceptance.min <= acceptance.max) &&
    withinLimits(value, acceptance);
  // value ± U clear of every limit: wholly inside the specification, or wholly outside one of its limits.
  const inside = withinLimits(value - U, limits) && withinLimits(value + U, limits);
  const outside = !intervalMeetsLimits(value - U, value + U, limits);
  const outcome = accepted ? (inside ? "pass" : "marginal pass") : outside ? "fail" : "marginal fail";
  return { rule, expandedUncertainty: U, coverageFactor: 2, guardBand: w, acceptance, outcome };
}

/** Whether [low, high] has any point within every limit. */
function intervalMeetsLimits(low: number, high: number, limits: CheckLimits): boolean {
  let lo = low,
    hi = high;
  if (limits.min !== undefined) lo = Math.max(lo, limits.min);
  if (limits.max !== undefined) hi = Math.min(hi, limits.max);
  if (limits.target !== undefined && limits.tolerance !== undefined) {
    lo = Math.max(lo, limits.target - limits.tolerance);
    hi = Math.min(hi, limits.target + limits.tolerance);
  }
  return lo <= hi;
}

/**
 * How a value with its expanded uncertainty stands against limits under a decision rule, without stating a check
 * (for tables of verdicts that are results, not gates of the run): the rule, guard band, acceptance zone, outcome
 * ("pass", "marginal pass", "marginal fail", "fail") and whether it was accepted. Limits and options as for `check`.
 */
export function acceptanceDecision(
  value: number | UncertainValue,
  limits: CheckOptions,
): CheckDecision & { readonly accepted: boolean } {
  const record = checkRecord("acceptanceDecision", value, limits);
  if (!record.decision)
    throw new RangeError(
      "acceptanceDecision: give the value's expanded uncertainty (uncertainty: U, or { estimate, expandedUncertainty } as the value)",
    );
  noteDecisionRule(record.decision);
  return { ...record.decision, accepted: record.passed };
}

/** The Methods statement of a decision rule (topic "uncertainty"): once per rule. */
function noteDecisionRule(decision: CheckDecision): void {
  noteMethod(
    "uncertainty",
    decision.rule === "simple"
      ? "Values with an expanded uncertainty U (k = 2) were decided against their limits by simple acceptance (ILAC-G8:2019 §4.2.1, no guard band); a result whose interval value ± U reaches across a limit is marked as a marginal pass or marginal fail."
      : "Values with an expanded uncertainty U (k = 2) marked for guarded acceptance were decided against their limits narrowed by the guard band stated with each (w = U unless stated otherwise; ILAC-G8:2019 §4.2.2, ISO 14253-1:2017); a result whose interval value ± U reaches across a limit is marked as a marginal pass or marginal fail.",
  );
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
