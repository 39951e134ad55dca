/** Sets of spectra measured on one wavelength column (e.g. 24 samples of a chart): a plain array of spectra. */
import { spectrum, type Spectrum, type SpectrumLabel } from "./spectrum.ts";

/** Builds one spectrum per named column, all on the same wavelengths. */
export function spectrumSet(
  wavelengths: readonly number[],
  columns: Readonly<Record<string, readonly number[]>>,
  label: Omit<SpectrumLabel, "name"> = {},
): Spectrum[] {
  return Object.entries(columns).map(([name, values]) => spectrum(wavelengths, values, { ...label, name }));
}

/** The spectrum of a set with the given name; an unknown name is an error listing the names there are. */
export function pickSpectrum(set: readonly Spectrum[], name: string): Spectrum {
  const found = set.find((s) => s.name === name);
  if (!found)
    throw new Error(`no spectrum named "${name}" in this set; it has: ${set.map((s) => s.name).join(", ")}`);
  return found;
}
