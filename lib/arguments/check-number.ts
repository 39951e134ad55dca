/** Checking one numeric argument: finite, in its range, in its unit. */
import { ArgumentError } from "./argument-error.ts";
import { describeKind } from "./describe-kind.ts";
import { refuse, type Instead } from "./refuse.ts";

/** What a numeric argument must be. Units are stated in the message ("nm", "K", "fraction from 0 to 1"). */
export interface NumberRule {
  /** Unit or meaning, e.g. "nm", "K", "cd/m²"; "fraction" reads as "a fraction from 0 to 1". */
  readonly unit?: string;
  readonly min?: number;
  readonly max?: number;
  /** Strictly greater than. */
  readonly above?: number;
  /** Strictly less than. */
  readonly below?: number;
  readonly integer?: boolean;
  /** undefined is accepted (the default applies). */
  readonly optional?: boolean;
  readonly instead?: Instead;
}

/** The expected-value phrase for a rule, e.g. "a number in nm greater than 0". */
export function numberExpectation(rule: NumberRule = {}): string {
  if (rule.unit === "fraction") {
    return "a fraction from 0 to 1 (divide percent by 100)";
  }
  const parts = [rule.integer ? "a whole number" : "a finite number"];
  if (rule.unit) parts.push(`in ${rule.unit}`);
  const range: string[] = [];
  if (rule.min !== undefined && rule.max !== undefined) range.push(`from ${rule.min} to ${rule.max}`);
  else if (rule.min !== undefined) range.push(`of at least ${rule.min}`);
  else if (rule.max !== undefined) range.push(`of at most ${rule.max}`);
  if (rule.above !== undefined) range.push(`greater than ${rule.above}`);
  if (rule.below !== undefined) range.push(`less than ${rule.below}`);
  return [...parts, ...range].join(" ");
}

/** Throws an ArgumentError unless `value` is a finite number meeting the rule. */
export function checkNumber(fn: string, arg: string, value: unknown, rule?: NumberRule): void {
  if (value === undefined && rule?.optional) return;
  if (typeof value !== "number" || !Number.isFinite(value)) {
    refuse(fn, arg, numberExpectation(rule), value, rule?.instead);
  }
  if (!rule) return;
  const min = rule.unit === "fraction" ? (rule.min ?? 0) : rule.min;
  const max = rule.unit === "fraction" ? (rule.max ?? 1) : rule.max;
  if (
    (min !== undefined && value < min) ||
    (max !== undefined && value > max) ||
    (rule.above !== undefined && !(value > rule.above)) ||
    (rule.below !== undefined && !(value < rule.below)) ||
    (rule.integer && !Number.isInteger(value))
  ) {
    // A number out of range is shown with its unit ("3000 K"), when the unit is a short symbol.
    const unit = rule.unit && !/\s|fraction/.test(rule.unit) ? ` ${rule.unit}` : "";
    throw new ArgumentError(fn, arg, numberExpectation(rule), unit ? `${value}${unit}` : describeKind(value));
  }
}
