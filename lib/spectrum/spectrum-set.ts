/** Sets of spectra measured on one wavelength column (e.g. 24 samples of a chart): a plain array of spectra. */
import { spectrum, type Spectrum, type SpectrumLabel } from "./spectrum.ts";
import { checkNumberList, checkSpectrumList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";

/**
 * Builds one spectrum per named column, all on the same wavelengths (e.g. the patches of a chart).
 *
 * @param wavelengths Wavelengths in nm, strictly increasing.
 * @param columns Values per spectrum name, one value per wavelength.
 * @param label Quantity and unit shared by all; default quantity "other", unit "" (none).
 * @returns An array of spectra, named after the columns.
 * @source none: a tristim data structure, no published formula.
 * @example spectrumSet([400, 500, 600], { "patch 1": [0.1, 0.2, 0.3], "patch 2": [0.5, 0.5, 0.4] }, { quantity: "reflectance" })
 */
export function spectrumSet(
  wavelengths: readonly number[],
  columns: Readonly<Record<string, readonly number[]>>,
  label: Omit<SpectrumLabel, "name"> = {},
): Spectrum[] {
  checkNumberList("spectrumSet", "wavelengths", wavelengths, { unit: "nm", minLength: 1 });
  checkWith(
    "spectrumSet",
    "columns",
    columns,
    "an object of named columns, each an array of numbers ({ name: [values] })",
    (c) => typeof c === "object" && c !== null && !Array.isArray(c) && Object.values(c).every(Array.isArray),
  );
  checkOptions("spectrumSet", "label", label, ["quantity", "unit"]);
  return Object.entries(columns).map(([name, values]) => spectrum(wavelengths, values, { ...label, name }));
}

/**
 * The spectrum of a set with the given name; an unknown name is an error listing the names there are.
 *
 * @param set An array of spectra.
 * @param name The name to find (exact).
 * @returns The spectrum.
 * @source none: a tristim helper, no published formula.
 * @example pickSpectrum(spectrumSet([400, 500], { a: [1, 2], b: [3, 4] }), "b")
 */
export function pickSpectrum(set: readonly Spectrum[], name: string): Spectrum {
  checkSpectrumList("pickSpectrum", "set", set);
  checkChoice(
    "pickSpectrum",
    "name",
    name,
    set.map((s) => s.name),
    { what: "the name of a spectrum in the set" },
  );
  const found = set.find((s) => s.name === name);
  if (!found)
    throw new Error(`no spectrum named "${name}" in this set; it has: ${set.map((s) => s.name).join(", ")}`);
  return found;
}
