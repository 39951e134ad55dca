/** Checking an options argument: undefined or a plain object whose every key is a known option. */
import { ArgumentError } from "./argument-error.ts";
import { describeKind } from "./describe-kind.ts";
import { refuse } from "./refuse.ts";

/** Throws an ArgumentError unless `value` is undefined or a plain object with only the `valid` keys (listed on error). */
export function checkOptions(fn: string, arg: string, value: unknown, valid: readonly string[]): void {
  if (value === undefined) return;
  if (
    typeof value !== "object" ||
    value === null ||
    Array.isArray(value) ||
    (value as { kind?: unknown }).kind !== undefined
  ) {
    refuse(fn, arg, `an options object with any of ${valid.join(", ")}`, value);
  }
  for (const key in value) {
    if (!valid.includes(key)) {
      const known = valid.length > 0 ? `valid options are ${valid.join(", ")}` : "it takes no options";
      throw new ArgumentError(
        fn,
        arg,
        valid.length > 0 ? `an options object with any of ${valid.join(", ")}` : "an empty object",
        `${describeKind(value)} (unknown option "${key}"; ${known})`,
      );
    }
  }
}
