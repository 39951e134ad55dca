/** The peak wavelength and full width at half maximum (FWHM) of a band-shaped spectrum, as LED data sheets state them (CIE 127:2007 §6, "peak wavelength" and "spectral bandwidth"). */
import type { Spectrum } from "../spectrum/spectrum.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";

/**
 * The wavelength and value of a spectrum's largest sample (its peak wavelength).
 *
 * @param s A spectrum with a positive value.
 * @returns { wavelength in nm, value in the spectrum's unit }.
 * @source CIE 127:2007 §6 ("peak wavelength").
 * @example spectralPeak(ledSpectrum({ peak: 525, fwhm: 30 })).wavelength
 */
export function spectralPeak(s: Spectrum): { wavelength: number; value: number } {
  checkSpectrum("spectralPeak", "s", s);
  let best = 0;
  for (let i = 1; i < s.values.length; i++) if (s.values[i]! > s.values[best]!) best = i;
  if (!(s.values[best]! > 0)) throw new Error(`spectralPeak: "${s.name}" has no positive value`);
  return { wavelength: s.wavelengths[best]!, value: s.values[best]! };
}

/**
 * Full width at half maximum: the distance between the outermost half-peak crossings either side of the peak, each found by linear interpolation between samples.
 *
 * @param s A band-shaped spectrum that falls below half its peak on both sides within its range.
 * @returns { width, short, long } in nm (the two crossing wavelengths and their distance).
 * @source CIE 127:2007 §6 (spectral bandwidth at half intensity).
 * @example fullWidthHalfMax(ledSpectrum({ peak: 525, fwhm: 30 })).width
 */
export function fullWidthHalfMax(s: Spectrum): { width: number; short: number; long: number } {
  checkSpectrum("fullWidthHalfMax", "s", s);
  const peak = spectralPeak(s);
  const half = peak.value / 2;
  const w = s.wavelengths;
  const v = s.values;
  const ip = w.indexOf(peak.wavelength);
  let i = ip;
  while (i > 0 && v[i - 1]! >= half) i--;
  if (i === 0)
    throw new Error(
      `fullWidthHalfMax: "${s.name}" does not fall to half its peak below ${peak.wavelength} nm within its range`,
    );
  const short = w[i - 1]! + ((half - v[i - 1]!) / (v[i]! - v[i - 1]!)) * (w[i]! - w[i - 1]!);
  let j = ip;
  while (j < w.length - 1 && v[j + 1]! >= half) j++;
  if (j === w.length - 1)
    throw new Error(
      `fullWidthHalfMax: "${s.name}" does not fall to half its peak above ${peak.wavelength} nm within its range`,
    );
  const long = w[j]! + ((v[j]! - half) / (v[j]! - v[j + 1]!)) * (w[j + 1]! - w[j]!);
  return { width: long - short, short, long };
}
