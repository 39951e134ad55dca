/** Checking a spectrum argument: a spectrum object with as many finite values as wavelengths. */
import { refuse, type Instead } from "./refuse.ts";

export interface SpectrumRule {
  readonly optional?: boolean;
  /** What kind of spectrum, e.g. "a transmittance spectrum (fractions 0–1)". */
  readonly what?: string;
  readonly instead?: Instead;
}

/** True when `value` is a well-formed spectrum: kind "spectrum", a name, and matching non-empty number arrays. */
export function isWellFormedSpectrum(value: unknown): boolean {
  if (typeof value !== "object" || value === null) return false;
  const s = value as { kind?: unknown; name?: unknown; wavelengths?: unknown; values?: unknown };
  return (
    s.kind === "spectrum" &&
    typeof s.name === "string" &&
    Array.isArray(s.wavelengths) &&
    Array.isArray(s.values) &&
    s.wavelengths.length > 0 &&
    s.wavelengths.length === s.values.length
  );
}

/** Throws an ArgumentError unless `value` is a spectrum (as made by spectrum(), spectrumOnGrid(), illuminant(), ...). */
export function checkSpectrum(fn: string, arg: string, value: unknown, rule?: SpectrumRule): void {
  if (value === undefined && rule?.optional) return;
  if (!isWellFormedSpectrum(value))
    refuse(
      fn,
      arg,
      rule?.what ?? "a spectrum (made by spectrum() or spectrumOnGrid())",
      value,
      rule?.instead,
    );
}
