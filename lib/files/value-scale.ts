/**
 * Percent or fraction: a file's reflectance or transmittance values are scaled to fractions (the library's
 * convention). The scale is taken from the caller when stated; otherwise it is inferred from the values and the
 * inference is reported, never applied silently.
 */
import { checkNumberList } from "../arguments/check-list.ts";
import { checkChoice, checkString } from "../arguments/check-text.ts";

export type ValueScale = "fraction" | "percent";

export interface ScaleDecision {
  readonly scale: ValueScale;
  /** True when the scale was inferred from the values rather than stated. */
  readonly inferred: boolean;
  /** A sentence for the report saying what was decided and why. */
  readonly statement: string;
}

/** The largest value above which data are read as percent when the scale is not stated (common practice, no source). */
export const PERCENT_THRESHOLD = 1.5;

/**
 * Decides whether a file's values are percent or fractions: the stated scale, or inferred (largest value above 1.5 → percent) and said so.
 *
 * An inferred scale is worth confirming by stating it (percent values of a very dark sample read as fractions).
 *
 * @param values The values.
 * @param stated "fraction", "percent", or "auto"/undefined to infer (the default when absent).
 * @param what What the values are, for the statement ("transmittance").
 * @returns { scale, inferred, statement (a sentence for the report) }.
 * @source none: the 1.5 threshold is common practice with no source.
 * @example decideValueScale([12, 45, 88], "auto", "transmittance")
 */
export function decideValueScale(
  values: Iterable<number>,
  stated: ValueScale | "auto" | undefined,
  what: string,
): ScaleDecision {
  const fn = "decideValueScale";
  // Any iterable of numbers is taken (a Set, a generator), read once into a list; a string is not a list of numbers.
  const list =
    typeof values === "object" &&
    values !== null &&
    !Array.isArray(values) &&
    !ArrayBuffer.isView(values) &&
    typeof (values as { [Symbol.iterator]?: unknown })[Symbol.iterator] === "function"
      ? Array.from(values)
      : values;
  checkNumberList(fn, "values", list);
  checkChoice(fn, "stated", stated, ["fraction", "percent", "auto"], { what: "the scale", optional: true });
  checkString(fn, "what", what, { nonEmpty: true, what: 'what the values are, e.g. "transmittance"' });
  return scaleDecision(list as unknown as ArrayLike<number>, stated, what);
}

/** decideValueScale for the readers, whose arguments are already checked (one pass over the values, no checks). */
export function scaleDecision(
  values: ArrayLike<number>,
  stated: ValueScale | "auto" | undefined,
  what: string,
): ScaleDecision {
  if (stated === "fraction" || stated === "percent") {
    return {
      scale: stated,
      inferred: false,
      statement: `The ${what} values were stated by the caller to be ${stated === "percent" ? "percent (divided by 100)" : "fractions (0–1)"}.`,
    };
  }
  let max = -Infinity;
  for (let i = 0; i < values.length; i++) if (values[i]! > max) max = values[i]!;
  if (max > PERCENT_THRESHOLD) {
    return {
      scale: "percent",
      inferred: true,
      statement: `The ${what} values were read as percent and divided by 100, as inferred from the values (the largest is ${max}, above ${PERCENT_THRESHOLD}).`,
    };
  }
  return {
    scale: "fraction",
    inferred: true,
    statement: `The ${what} values were read as fractions, as inferred from the values (none above ${PERCENT_THRESHOLD}; the largest is ${max}).`,
  };
}
