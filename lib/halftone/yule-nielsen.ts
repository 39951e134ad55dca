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

/**
 * Yule–Nielsen reflectance of a halftone at one wavelength: R = (a·R_s^(1/n) + (1 − a)·R_p^(1/n))^n.
 *
 * @param coverage The dot coverage a, a fraction 0–1.
 * @param solid The solid ink's reflectance R_s, a fraction.
 * @param paper The paper's reflectance R_p, a fraction.
 * @param n The Yule–Nielsen n factor, positive (1 gives Murray–Davies).
 * @returns R, a fraction.
 * @source J. A. C. Yule, W. J. Nielsen, TAGA Proc. 1951, p. 65.
 * @example yuleNielsenValue(0.4, 0.05, 0.9, 2)
 */
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

/**
 * Spectral Yule–Nielsen reflectance of a halftone: R(λ) = (a·R_s(λ)^(1/n) + (1 − a)·R_p(λ)^(1/n))^n.
 *
 * @param coverage The dot coverage a, a fraction 0–1.
 * @param solid The solid ink's reflectance spectrum, fractions.
 * @param paper The paper's reflectance spectrum on the same wavelengths.
 * @param n The Yule–Nielsen n factor, positive.
 * @param name The result's name; default "<solid> at <a·100> % (n = <n>)".
 * @returns A "reflectance" `Spectrum`.
 * @source J. A. C. Yule, W. J. Nielsen, TAGA Proc. 1951, p. 65.
 * @example yuleNielsen(0.5, spectrumOnGrid(400, 100, [0.6, 0.1, 0.05]), spectrumOnGrid(400, 100, [0.88, 0.9, 0.9]), 1.8)
 */
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
 * The effective dot coverage that best explains a measured tint by the Yule–Nielsen model, in least squares over wavelength: a = Σ(M − P)(S − P) ÷ Σ(S − P)².
 *
 * M, S, P are the 1/n-th powers of the tint, solid and paper reflectances.
 *
 * @param measured The tint's measured reflectance spectrum, fractions.
 * @param solid The solid's reflectance spectrum, same wavelengths.
 * @param paper The paper's reflectance spectrum, same wavelengths.
 * @param n The Yule–Nielsen n factor; default 1 (the Murray–Davies effective coverage).
 * @returns The coverage a (a fraction; may fall outside 0–1 for inconsistent data).
 * @source Yule & Nielsen, TAGA Proc. 1951 (the model solved for a by least squares).
 * @example effectiveCoverage(spectrumOnGrid(400, 100, [0.7, 0.4, 0.35]), spectrumOnGrid(400, 100, [0.6, 0.1, 0.05]), spectrumOnGrid(400, 100, [0.88, 0.9, 0.9]), 1.5)
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
