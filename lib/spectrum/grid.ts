/** Regular wavelength grids: the sampling that tables and integrations use. */
import { roundWavelength, type Spectrum } from "./spectrum.ts";
import { GRID_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";

/** A regular wavelength grid from `start` to `end` nm inclusive, every `step` nm. */
export interface WavelengthGrid {
  readonly start: number;
  readonly end: number;
  readonly step: number;
}

/**
 * The wavelengths of a regular grid, checked: start ≤ end, step > 0, and end − start a whole number of steps.
 *
 * @param grid { start, end, step } in nm, end included.
 * @returns The wavelengths in nm, from start to end.
 * @source none: a tristim helper, no published formula.
 * @example gridWavelengths({ start: 380, end: 780, step: 5 }).length
 */
export function gridWavelengths(grid: WavelengthGrid): number[] {
  checkFields("gridWavelengths", "grid", grid, GRID_FIELDS);
  const { start, end, step } = grid;
  if (![start, end, step].every(Number.isFinite) || step <= 0 || end < start) {
    throw new Error(
      `wavelength grid ${start}–${end} nm every ${step} nm is not valid (need start ≤ end and step > 0)`,
    );
  }
  const n = Math.round((end - start) / step);
  if (Math.abs(start + n * step - end) > 1e-6 * step) {
    throw new Error(`wavelength grid ${start}–${end} nm is not a whole number of ${step} nm steps`);
  }
  return Array.from({ length: n + 1 }, (_, i) => roundWavelength(start + i * step));
}

/**
 * The spectrum's wavelength step if its wavelengths are evenly spaced (to 1e-6 nm), otherwise undefined.
 *
 * @param s A spectrum.
 * @returns The step in nm, or undefined for uneven spacing or a single sample.
 * @source none: a tristim helper, no published formula.
 * @example regularStep(spectrumOnGrid(400, 5, [1, 2, 3]))
 */
export function regularStep(s: Spectrum): number | undefined {
  checkSpectrum("regularStep", "s", s);
  const w = s.wavelengths;
  if (w.length < 2) return undefined;
  const step = w[1]! - w[0]!;
  for (let i = 2; i < w.length; i++) if (Math.abs(w[i]! - w[i - 1]! - step) > 1e-6) return undefined;
  return roundWavelength(step);
}

/**
 * The regular grid of an evenly spaced spectrum, or undefined when its spacing is irregular.
 *
 * @param s A spectrum.
 * @returns { start, end, step } in nm, or undefined.
 * @source none: a tristim helper, no published formula.
 * @example gridOf(spectrumOnGrid(400, 5, [1, 2, 3]))
 */
export function gridOf(s: Spectrum): WavelengthGrid | undefined {
  checkSpectrum("gridOf", "s", s);
  const step = regularStep(s);
  if (step === undefined) return undefined;
  return { start: s.wavelengths[0]!, end: s.wavelengths[s.wavelengths.length - 1]!, step };
}

/**
 * True when two spectra are sampled at exactly the same wavelengths (to 1e-9 nm).
 *
 * @param a A spectrum.
 * @param b Another spectrum.
 * @returns true when the wavelength lists match.
 * @source none: a tristim helper, no published formula.
 * @example sameWavelengths(spectrumOnGrid(400, 5, [1, 2]), spectrumOnGrid(400, 5, [3, 4]))
 */
export function sameWavelengths(a: Spectrum, b: Spectrum): boolean {
  checkSpectrum("sameWavelengths", "a", a);
  checkSpectrum("sameWavelengths", "b", b);
  if (a.wavelengths.length !== b.wavelengths.length) return false;
  for (let i = 0; i < a.wavelengths.length; i++)
    if (Math.abs(a.wavelengths[i]! - b.wavelengths[i]!) > 1e-9) return false;
  return true;
}
