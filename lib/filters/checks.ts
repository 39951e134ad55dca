/**
 * Input checks shared by the optics, mixing, print, rendering and file modules: each names the offending value so a
 * bad input never turns into a silent NaN further on.
 */
import { sameWavelengths } from "../spectrum/grid.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";

/** Throws unless `value` is a finite number. */
export function requireFinite(value: number, what: string): number {
  if (typeof value !== "number" || !Number.isFinite(value))
    throw new Error(`${what} is ${String(value)}, not a finite number`);
  return value;
}

/** Throws unless `value` is a finite number ≥ 0. */
export function requireNonNegative(value: number, what: string): number {
  requireFinite(value, what);
  if (value < 0) throw new Error(`${what} is ${value}; it must not be negative`);
  return value;
}

/** Throws unless `value` is a finite number > 0. */
export function requirePositive(value: number, what: string): number {
  requireFinite(value, what);
  if (!(value > 0)) throw new Error(`${what} is ${value}; it must be greater than zero`);
  return value;
}

/** Throws unless `value` is a fraction in [0, 1] (transmittance, reflectance, coverage). */
export function requireFraction(value: number, what: string): number {
  requireFinite(value, what);
  if (value < 0 || value > 1)
    throw new Error(
      `${what} is ${value}; it must be a fraction from 0 to 1 (percent values must be divided by 100)`,
    );
  return value;
}

/** Throws unless every value of the spectrum is a fraction in [0, 1]; names the first wavelength that is not. */
export function requireFractionSpectrum(s: Spectrum, what: string): Spectrum {
  s.values.forEach((v, i) => {
    if (v < 0 || v > 1) {
      throw new Error(
        `${what} "${s.name}" is ${v} at ${s.wavelengths[i]} nm; it must be a fraction from 0 to 1 (percent data must be divided by 100)`,
      );
    }
  });
  return s;
}

/** Throws unless all spectra share one set of wavelengths; says how to align them. */
export function requireSameGrid(spectra: readonly Spectrum[], what: string): void {
  const first = spectra[0];
  if (!first) return;
  for (const s of spectra.slice(1)) {
    if (!sameWavelengths(first, s)) {
      throw new Error(
        `${what}: "${first.name}" and "${s.name}" are sampled at different wavelengths; resample them onto one grid first (resample(...) or alignSpectra(...))`,
      );
    }
  }
}
