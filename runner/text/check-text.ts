/** Words for acceptance checks, shared by the report, the summary, the index page and the terminal. */
import { formatNumber } from "../../cells/format-number.ts";
import type { CheckRecord } from "../../cells/records.ts";
import { roundedPair } from "../../lib/uncertainty/rounded-pair.ts";

const SUPERSCRIPT: Record<string, string> = {
  "-": "⁻",
  "+": "",
  0: "⁰",
  1: "¹",
  2: "²",
  3: "³",
  4: "⁴",
  5: "⁵",
  6: "⁶",
  7: "⁷",
  8: "⁸",
  9: "⁹",
};

/** A formatted number as a report prints it: a true minus sign, and "7.1 × 10⁻¹⁵" instead of "7.1e-15". */
export function printedNumber(text: string): string {
  const m = /^(-?)(\d+(?:\.\d+)?)e([+-]?\d+)$/.exec(text);
  const out = m
    ? `${m[1]}${m[2] === "1" ? "" : `${m[2]} × `}10${[...m[3]!].map((c) => SUPERSCRIPT[c] ?? c).join("")}`
    : text;
  return out.replace(/^-/, "−");
}

/** The unit as written after a number: " K", " %", but ":1" and "°" without a space (1000:1, 2°). */
export function unitSuffix(unit: string | undefined): string {
  if (!unit) return "";
  return /^[:°′″]/.test(unit) && unit !== "°C" && unit !== "°F" ? unit : ` ${unit}`;
}

/** The limits as a spec sheet states them: "8 to 18 %", "≤ 0.004", "6500 ± 200 K" (limits as written, not rounded). */
export function limitsText(record: CheckRecord): string {
  const limits = record.limits;
  if (!limits) return "condition holds";
  const unit = unitSuffix(record.unit);
  const n = (v: number) => printedNumber(formatNumber(v));
  const parts: string[] = [];
  if (limits.target !== undefined && limits.tolerance !== undefined)
    parts.push(`${n(limits.target)} ± ${n(limits.tolerance)}${unit}`);
  if (limits.min !== undefined && limits.max !== undefined)
    parts.push(`${n(limits.min)} to ${n(limits.max)}${unit}`);
  else if (limits.min !== undefined) parts.push(`≥ ${n(limits.min)}${unit}`);
  else if (limits.max !== undefined) parts.push(`≤ ${n(limits.max)}${unit}`);
  return parts.join(", and ");
}

/**
 * The value with its unit: "12.40 %"; "condition met"/"not met" for a plain condition; with an uncertainty
 * "0.642 ± 0.012 (k = 2)", U to two significant digits and the value to the same decimal (JCGM 100 §7.2.6).
 */
export function valueText(record: CheckRecord): string {
  if (record.valueText === undefined) return record.passed ? "met" : "not met";
  if (record.decision && typeof record.value === "number") {
    const [v, U] = roundedPair(record.value, record.decision.expandedUncertainty);
    const unit = unitSuffix(record.unit);
    return `${printedNumber(v)}${unit} ± ${printedNumber(U)}${unit} (k = ${record.decision.coverageFactor})`;
  }
  const text = record.value === null ? record.valueText : printedNumber(record.valueText);
  return `${text}${record.value !== null ? unitSuffix(record.unit) : ""}`;
}

/**
 * How far the value lies from what was asked: the deviation from a target ("+35 K from target"), and for a failed
 * check how far outside the nearest limit it lies ("0.0012 above the limit"). Undefined when there is nothing to say.
 * Margins are printed at the check's `digits` (up to 6 significant digits without it); a margin that rounds to
 * zero there is said in words ("on target to 2 decimals", "less than 0.01 % above the limit"), never "−0.00".
 */
export function marginText(record: CheckRecord): string | undefined {
  const { limits, value } = record;
  if (!limits || typeof value !== "number") return undefined;
  const unit = unitSuffix(record.unit);
  const digits = record.digits;
  const roundsToZero = (v: number) => digits !== undefined && Number(Math.abs(v).toFixed(digits)) === 0;
  const fmt = (v: number) => printedNumber(formatNumber(Math.abs(v), digits));
  const step = digits === undefined ? "" : printedNumber(formatNumber(10 ** -digits, digits));
  const parts: string[] = [];
  if (limits.target !== undefined) {
    const d = value - limits.target;
    if (d === 0) parts.push("on target");
    else if (roundsToZero(d)) parts.push(`on target to ${digits} ${digits === 1 ? "decimal" : "decimals"}`);
    else parts.push(`${d > 0 ? "+" : "−"}${fmt(d)}${unit} from target`);
  }
  if (!record.passed) {
    let lower = limits.min ?? -Infinity;
    let upper = limits.max ?? Infinity;
    if (limits.target !== undefined && limits.tolerance !== undefined) {
      lower = Math.max(lower, limits.target - limits.tolerance);
      upper = Math.min(upper, limits.target + limits.tolerance);
    }
    const outside = value > upper ? value - upper : value < lower ? lower - value : 0;
    const side = value > upper ? "above" : "below";
    if (outside > 0) {
      parts.push(
        roundsToZero(outside)
          ? `less than ${step}${unit} ${side} the limit`
          : `${fmt(outside)}${unit} ${side} the limit`,
      );
    }
  }
  return parts.length ? parts.join("; ") : undefined;
}

/** The words of an outcome: "pass", "marginal pass", "marginal fail", "FAIL". */
export const OUTCOME_WORDS = {
  pass: "pass",
  "marginal pass": "marginal pass",
  "marginal fail": "marginal FAIL",
  fail: "FAIL",
} as const;

/**
 * How a check with an uncertainty was decided: "guarded acceptance, guard band 0.012 (accepted ≥ 0.662): marginal
 * FAIL, value ± U reaches across a limit". Undefined for a check without an uncertainty.
 */
export function decisionText(record: CheckRecord): string | undefined {
  const d = record.decision;
  if (!d || !record.limits) return undefined;
  const n = (v: number) => printedNumber(formatNumber(v, record.digits));
  const unit = unitSuffix(record.unit);
  const rule =
    d.rule === "simple"
      ? "simple acceptance (no guard band)"
      : `guarded acceptance, guard band ${n(d.guardBand)}${unit} (accepted: ${limitsText({ ...record, limits: d.acceptance })})`;
  const where =
    d.outcome === "marginal pass" || d.outcome === "marginal fail"
      ? ", value ± U reaches across a limit"
      : d.outcome === "pass"
        ? ", value ± U within the limits"
        : ", value ± U outside the limits";
  return `${rule}: ${OUTCOME_WORDS[d.outcome]}${where}`;
}

/** One line for the terminal or a list: "White Δu′v′: 0.0052 (limits ≤ 0.004)". */
export function checkLine(record: CheckRecord): string {
  return `${record.label}: ${checkOutcomeText(record)}`;
}

/** What a check found, without its label: "0.0052 (limits ≤ 0.004)", "NaN, not a number (limits 2.2 ± 0.1)". */
export function checkOutcomeText(record: CheckRecord): string {
  if (!record.limits)
    return `condition ${record.passed ? "met" : "not met"}${record.detail ? ` (${record.detail})` : ""}`;
  const value = record.value === null ? `${record.valueText ?? "no value"}, not a number` : valueText(record);
  const decision = decisionText(record);
  return `${value} (limits ${limitsText(record)}${decision ? `; ${decision}` : ""})`;
}
