/**
 * Murray–Davies: the reflectance of a halftone is the area-weighted mean of the solid ink and the bare paper,
 * R = a·R_solid + (1 − a)·R_paper (A. Murray, J. Franklin Inst. 221, 721, 1936); the tone value (dot area) follows
 * from densities relative to paper as a = (1 − 10^(−D_t))/(1 − 10^(−D_s)) (the form ISO 12647-1 uses for tone value).
 */
import {
  requireFinite,
  requireFraction,
  requireFractionSpectrum,
  requireSameGrid,
} from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkString } from "../arguments/check-text.ts";

/**
 * Murray–Davies reflectance of a halftone at one wavelength (or a filtered, e.g. densitometric, reflectance): R = a·R_solid + (1 − a)·R_paper.
 *
 * @param coverage The dot coverage a, a fraction 0–1.
 * @param solid The solid ink's reflectance, a fraction.
 * @param paper The bare paper's reflectance, a fraction.
 * @returns R, a fraction.
 * @source A. Murray, J. Franklin Inst. 221:721, 1936.
 * @example murrayDaviesValue(0.4, 0.05, 0.9)
 */
export function murrayDaviesValue(coverage: number, solid: number, paper: number): number {
  checkNumber("murrayDaviesValue", "coverage", coverage, { unit: "fraction" });
  checkNumber("murrayDaviesValue", "solid", solid, {
    unit: "fraction",
    instead: { spectrum: "for spectra use murrayDavies" },
  });
  checkNumber("murrayDaviesValue", "paper", paper, { unit: "fraction" });
  requireFraction(coverage, "dot coverage");
  requireFraction(solid, "solid reflectance");
  requireFraction(paper, "paper reflectance");
  return coverage * solid + (1 - coverage) * paper;
}

/**
 * Spectral Murray–Davies reflectance of a halftone: R(λ) = a·R_solid(λ) + (1 − a)·R_paper(λ).
 *
 * @param coverage The dot coverage a, a fraction 0–1.
 * @param solid The solid ink's reflectance spectrum, fractions.
 * @param paper The paper's reflectance spectrum on the same wavelengths.
 * @param name The result's name; default "<solid> at <a·100> %".
 * @returns A "reflectance" `Spectrum`.
 * @source A. Murray, J. Franklin Inst. 221:721, 1936.
 * @example murrayDavies(0.5, spectrumOnGrid(400, 100, [0.6, 0.1, 0.05]), spectrumOnGrid(400, 100, [0.88, 0.9, 0.9]))
 */
export function murrayDavies(coverage: number, solid: Spectrum, paper: Spectrum, name?: string): Spectrum {
  checkNumber("murrayDavies", "coverage", coverage, { unit: "fraction" });
  checkSpectrum("murrayDavies", "solid", solid, {
    what: "the solid's reflectance spectrum",
    instead: { number: "for single values use murrayDaviesValue" },
  });
  checkSpectrum("murrayDavies", "paper", paper, { what: "the paper's reflectance spectrum" });
  checkString("murrayDavies", "name", name, { optional: true });
  requireFraction(coverage, "dot coverage");
  requireFractionSpectrum(solid, "solid reflectance");
  requireFractionSpectrum(paper, "paper reflectance");
  requireSameGrid([solid, paper], "murrayDavies");
  noteMethod(
    "halftone",
    "Halftone reflectances were computed as the Murray–Davies area-weighted mean of solid and paper (Murray 1936).",
  );
  return spectrum(
    solid.wavelengths,
    solid.values.map((s, i) => coverage * s + (1 - coverage) * paper.values[i]!),
    {
      name: name ?? `${solid.name} at ${+(coverage * 100).toPrecision(4)} %`,
      quantity: "reflectance",
    },
  );
}

/**
 * Tone value (effective dot area) from densities relative to paper: (1 − 10^(−D_t)) ÷ (1 − 10^(−D_s)).
 *
 * @param tintDensity The tint's density relative to paper, D_t, 0 to D_s.
 * @param solidDensity The solid's density relative to paper, D_s, above 0.
 * @returns The tone value as a fraction 0–1.
 * @source Murray–Davies (Murray 1936), in the form ISO 12647-1 uses for tone value.
 * @example toneValueFromDensity(0.35, 1.4)
 */
export function toneValueFromDensity(tintDensity: number, solidDensity: number): number {
  checkNumber("toneValueFromDensity", "tintDensity", tintDensity, { unit: "optical density" });
  checkNumber("toneValueFromDensity", "solidDensity", solidDensity, { unit: "optical density", above: 0 });
  requireFinite(tintDensity, "tint density");
  requireFinite(solidDensity, "solid density");
  if (!(solidDensity > 0))
    throw new Error(`solid density ${solidDensity} must be above the paper (relative density > 0)`);
  if (tintDensity < 0 || tintDensity > solidDensity) {
    throw new Error(
      `tint density ${tintDensity} lies outside paper (0) to solid (${solidDensity}); Murray–Davies tone value needs 0 ≤ D_t ≤ D_s`,
    );
  }
  noteMethod(
    "halftone",
    "Tone values were computed from densities relative to paper by the Murray–Davies formula (as ISO 12647-1 defines tone value).",
  );
  return (1 - 10 ** -tintDensity) / (1 - 10 ** -solidDensity);
}
