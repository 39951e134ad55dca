/** Checking names, choices, flags and callbacks among a function's arguments. */
import { refuse, type Instead } from "./refuse.ts";

export interface TextRule {
  readonly optional?: boolean;
  /** What the string is, e.g. "an illuminant name". */
  readonly what?: string;
  readonly instead?: Instead;
}

/** Throws an ArgumentError unless `value` is a string (an empty one too, unless `nonEmpty`). */
export function checkString(
  fn: string,
  arg: string,
  value: unknown,
  rule?: TextRule & { readonly nonEmpty?: boolean },
): void {
  if (value === undefined && rule?.optional) return;
  if (typeof value !== "string" || (rule?.nonEmpty && value.length === 0))
    refuse(fn, arg, rule?.what ?? "a string", value, rule?.instead);
}

/** Throws an ArgumentError unless `value` is one of `choices`; the message lists them. */
export function checkChoice(
  fn: string,
  arg: string,
  value: unknown,
  choices: readonly (string | number)[],
  rule?: TextRule,
): void {
  if (value === undefined && rule?.optional) return;
  if (!choices.includes(value as string | number)) {
    const listed = choices.map((c) => (typeof c === "string" ? JSON.stringify(c) : String(c))).join(", ");
    refuse(fn, arg, `${rule?.what ? `${rule.what}: ` : ""}one of ${listed}`, value, rule?.instead);
  }
}

/** Throws an ArgumentError unless `value` is true or false. */
export function checkBoolean(fn: string, arg: string, value: unknown, rule?: TextRule): void {
  if (value === undefined && rule?.optional) return;
  if (typeof value !== "boolean") refuse(fn, arg, rule?.what ?? "true or false", value, rule?.instead);
}

/** Throws an ArgumentError unless `value` is a function. */
export function checkFunction(fn: string, arg: string, value: unknown, rule?: TextRule): void {
  if (value === undefined && rule?.optional) return;
  if (typeof value !== "function") refuse(fn, arg, rule?.what ?? "a function", value, rule?.instead);
}
