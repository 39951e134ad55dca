/** Normalising and trimming spectra. */
import { sampler, type SamplingOptions } from "./sample.ts";
import { spectrum, withValues, type Spectrum } from "./spectrum.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkSampling } from "../arguments/common-arguments.ts";

/**
 * The spectrum scaled so that its largest value equals `peak`.
 *
 * @param s A spectrum with at least one positive value.
 * @param peak The value the largest sample becomes; default 1.
 * @returns A new `Spectrum` with the same name, quantity and unit.
 * @source none: arithmetic, no published formula.
 * @example normaliseToPeak(spectrumOnGrid(400, 10, [1, 4, 2]))
 */
export function normaliseToPeak(s: Spectrum, peak = 1): Spectrum {
  checkSpectrum("normaliseToPeak", "s", s);
  checkNumber("normaliseToPeak", "peak", peak, { above: 0 });
  const max = Math.max(...s.values);
  if (!(max > 0)) throw new Error(`normaliseToPeak: "${s.name}" has no positive value to scale to ${peak}`);
  return withValues(
    s,
    s.values.map((v) => (v / max) * peak),
  );
}

/**
 * The spectrum scaled so that its value at `wavelength` equals `value` (e.g. 100 at 560 nm, the CIE 015 convention for illuminants).
 *
 * @param s A spectrum covering `wavelength` (no extrapolation).
 * @param wavelength The wavelength in nm where the value is fixed.
 * @param value The value there after scaling; default 100.
 * @returns A new `Spectrum` with the same name, quantity and unit.
 * @source CIE 015:2018 convention: relative spectral power distributions of illuminants are given as 100 at 560 nm.
 * @example normaliseAt(spectrumOnGrid(500, 20, [2, 3, 4, 5, 6, 7]), 560)
 */
export function normaliseAt(
  s: Spectrum,
  wavelength: number,
  value = 100,
  options: SamplingOptions = {},
): Spectrum {
  checkSpectrum("normaliseAt", "s", s);
  checkNumber("normaliseAt", "wavelength", wavelength, { unit: "nm" });
  checkNumber("normaliseAt", "value", value);
  checkSampling("normaliseAt", "options", options);
  const at = sampler(s, { ...options, extrapolation: "refuse" })(wavelength);
  if (at === 0)
    throw new Error(
      `normaliseAt: "${s.name}" is zero at ${wavelength} nm, so it cannot be scaled to ${value} there`,
    );
  return withValues(
    s,
    s.values.map((v) => (v / at) * value),
  );
}

/**
 * The samples of the spectrum between `from` and `to` nm inclusive.
 *
 * @param s A spectrum.
 * @param from The shortest wavelength kept, in nm.
 * @param to The longest wavelength kept, in nm.
 * @returns A new `Spectrum` with the samples in range (at least one).
 * @source none: a tristim helper, no published formula.
 * @example trimSpectrum(spectrumOnGrid(380, 10, [1, 2, 3, 4, 5]), 390, 410)
 */
export function trimSpectrum(s: Spectrum, from: number, to: number): Spectrum {
  checkSpectrum("trimSpectrum", "s", s);
  checkNumber("trimSpectrum", "from", from, { unit: "nm" });
  checkNumber("trimSpectrum", "to", to, { unit: "nm" });
  const keep = s.wavelengths
    .map((w, i) => [w, i] as const)
    .filter(([w]) => w >= from - 1e-9 && w <= to + 1e-9);
  if (keep.length === 0)
    throw new Error(
      `trimSpectrum: "${s.name}" (${s.wavelengths[0]}–${s.wavelengths.at(-1)} nm) has no samples in ${from}–${to} nm`,
    );
  return spectrum(
    keep.map(([w]) => w),
    keep.map(([, i]) => s.values[i]!),
    { name: s.name, quantity: s.quantity, unit: s.unit },
  );
}
