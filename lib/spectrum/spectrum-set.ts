/** Sets of spectra measured on one wavelength column (e.g. 24 samples of a chart): a plain array of spectra. */
import { spectrum, type Spectrum, type SpectrumLabel } from "./spectrum.ts";
import { checkNumberList, checkSpectrumList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";

/** Builds one spectrum per named column, all on the same wavelengths. */
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

/** The spectrum of a set with the given name; an unknown name is an error listing the names there are. */
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
