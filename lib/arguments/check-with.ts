/** Checking an argument against a test of its own (observers, illuminants, RGB spaces, unions of kinds). */
import { refuse, type Instead } from "./refuse.ts";

/** Throws an ArgumentError, saying `expected`, unless `accept(value)`; undefined passes when optional. */
export function checkWith(
  fn: string,
  arg: string,
  value: unknown,
  expected: string,
  accept: (value: unknown) => boolean,
  rule?: { readonly optional?: boolean; readonly instead?: Instead },
): void {
  if (value === undefined && rule?.optional) return;
  if (!accept(value)) refuse(fn, arg, expected, value, rule?.instead);
}
