/** Throwing the ArgumentError for one refused argument, with a pointer to the function the caller probably meant. */
import { ArgumentError } from "./argument-error.ts";
import { describeKind } from "./describe-kind.ts";

/**
 * Where the caller probably meant another function, by the kind of value that came: e.g.
 * `{ spectrum: "for a spectrum use opticalDensitySpectrum" }`.
 */
export interface Instead {
  readonly spectrum?: string;
  readonly number?: string;
  readonly array?: string;
  readonly string?: string;
  readonly object?: string;
}

/** The hint for this value, if one applies. */
export function insteadHint(value: unknown, instead: Instead | undefined): string | undefined {
  if (!instead) return undefined;
  if (typeof value === "number") return instead.number;
  if (typeof value === "string") return instead.string;
  if (Array.isArray(value)) return instead.array;
  if (typeof value === "object" && value !== null) {
    return (value as { kind?: unknown }).kind === "spectrum"
      ? (instead.spectrum ?? instead.object)
      : instead.object;
  }
  return undefined;
}

/** Throws the ArgumentError: `fn: arg should be expected, but got <kind>. <hint>.` */
export function refuse(fn: string, arg: string, expected: string, value: unknown, instead?: Instead): never {
  throw new ArgumentError(fn, arg, expected, describeKind(value), insteadHint(value, instead));
}
