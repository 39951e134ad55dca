/**
 * Yule–Nielsen: light scattered sideways in the paper makes halftones darker than Murray–Davies predicts; the
 * n-factor model averages R^(1/n): R^(1/n) = a·R_s^(1/n) + (1 − a)·R_p^(1/n) (J. A. C. Yule & W. J. Nielsen,
 * TAGA Proc. 1951, 65). n = 1 is Murray–Davies.
 */
import {
  requireFraction,
  requireFractionSpectrum,
  requirePositive,
  requireSameGrid,
} from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkString } from "../arguments/check-text.ts";

/** R = (a·R_s^(1/n) + (1 − a)·R_p^(1/n))^n (Yule & Nielsen 1951). */
export function yuleNielsenValue(coverage: number, solid: number, paper: number, n: number): number {
  checkNumber("yuleNielsenValue", "coverage", coverage, { unit: "fraction" });
  checkNumber("yuleNielsenValue", "solid", solid, {
    unit: "fraction",
    instead: { spectrum: "for spectra use yuleNielsen" },
  });
  checkNumber("yuleNielsenValue", "paper", paper, { unit: "fraction" });
  checkNumber("yuleNielsenValue", "n", n, { min: 1, unit: "Yule–Nielsen factor" });
  requireFraction(coverage, "dot coverage");
  requireFraction(solid, "solid reflectance");
  requireFraction(paper, "paper reflectance");
  requirePositive(n, "Yule–Nielsen n factor");
  return (coverage * solid ** (1 / n) + (1 - coverage) * paper ** (1 / n)) ** n;
}

/** Spectral Yule–Nielsen: R(λ) = (a·R_s(λ)^(1/n) + (1 − a)·R_p(λ)^(1/n))^n (Yule & Nielsen 1951). */
export function yuleNielsen(
  coverage: number,
  solid: Spectrum,
  paper: Spectrum,
  n: number,
  name?: string,
): Spectrum {
  checkNumber("yuleNielsen", "coverage", coverage, { unit: "fraction" });
  checkSpectrum("yuleNielsen", "solid", solid, {
    what: "the solid's reflectance spectrum",
    instead: { number: "for single values use yuleNielsenValue" },
  });
  checkSpectrum("yuleNielsen", "paper", paper, { what: "the paper's reflectance spectrum" });
  checkNumber("yuleNielsen", "n", n, { min: 1, unit: "Yule–Nielsen factor" });
  checkString("yuleNielsen", "name", name, { optional: true });
  requireFractionSpectrum(solid, "solid reflectance");
  requireFractionSpectrum(paper, "paper reflectance");
  requireSameGrid([solid, paper], "yuleNielsen");
  noteMethod(
    "halftone",
    `Halftone reflectances were computed by the Yule–Nielsen model with n = ${n} (Yule & Nielsen 1951).`,
  );
  return spectrum(
    solid.wavelengths,
    solid.values.map((s, i) => yuleNielsenValue(coverage, s, paper.values[i]!, n)),
    {
      name: name ?? `${solid.name} at ${+(coverage * 100).toPrecision(4)} % (n = ${n})`,
      quantity: "reflectance",
    },
  );
}

/**
 * The effective coverage that best explains a measured tint by the Yule–Nielsen model, in least squares over the
 * wavelengths: a = Σ(M − P)(S − P)/Σ(S − P)² with M, S, P the 1/n-th powers of tint, solid and paper (Yule &
 * Nielsen 1951, solved for a); n = 1 gives the Murray–Davies effective coverage.
 */
export function effectiveCoverage(measured: Spectrum, solid: Spectrum, paper: Spectrum, n = 1): number {
  checkSpectrum("effectiveCoverage", "measured", measured, {
    what: "the tint's measured reflectance spectrum",
  });
  checkSpectrum("effectiveCoverage", "solid", solid, { what: "the solid's reflectance spectrum" });
  checkSpectrum("effectiveCoverage", "paper", paper, { what: "the paper's reflectance spectrum" });
  checkNumber("effectiveCoverage", "n", n, { min: 1, unit: "Yule–Nielsen factor" });
  requirePositive(n, "Yule–Nielsen n factor");
  [measured, solid, paper].forEach((s) => requireFractionSpectrum(s, "reflectance"));
  requireSameGrid([measured, solid, paper], "effectiveCoverage");
  let num = 0;
  let den = 0;
  measured.values.forEach((m, i) => {
    const M = m ** (1 / n);
    const S = solid.values[i]! ** (1 / n);
    const P = paper.values[i]! ** (1 / n);
    num += (M - P) * (S - P);
    den += (S - P) ** 2;
  });
  if (!(den > 0))
    throw new Error(
      `effectiveCoverage: solid "${solid.name}" and paper "${paper.name}" have the same reflectance everywhere, so no coverage can be inferred`,
    );
  noteMethod(
    "halftone",
    `Effective dot coverages were fitted by least squares over wavelength with the Yule–Nielsen model and n = ${n}.`,
  );
  return num / den;
}
