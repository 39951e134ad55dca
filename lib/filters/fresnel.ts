/**
 * Reflection at a smooth surface at normal incidence from the refractive indices on either side (Fresnel equations
 * at 0°; Hecht, Optics, 5th ed., §4.6.2: R = ((n_t − n_i)/(n_t + n_i))²).
 */
import { noteMethod } from "../methods/method-log.ts";
import { sampler } from "../spectrum/sample.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { requireFinite } from "./checks.ts";
import { checkNumberList } from "../arguments/check-list.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkRefractiveIndex } from "../arguments/physics-arguments.ts";

/** A refractive index: one number for all wavelengths, or a dispersion curve (a spectrum of n against wavelength). */
export type RefractiveIndex = number | Spectrum;

/**
 * Reflectance of one smooth surface at normal incidence, ρ = ((n − n₀) ÷ (n + n₀))².
 *
 * @param index The refractive index n of the material (at least 1).
 * @param outsideIndex The refractive index n₀ of the surrounding medium; default 1 (air).
 * @returns ρ as a fraction.
 * @source Fresnel equations at 0°; E. Hecht, Optics, 5th ed., §4.6.2.
 * @example surfaceReflectance(1.5)
 */
export function surfaceReflectance(index: number, outsideIndex = 1): number {
  checkNumber("surfaceReflectance", "index", index, {
    unit: "refractive index",
    min: 1,
    instead: { spectrum: "for a dispersive index use surfaceReflectanceAt" },
  });
  checkNumber("surfaceReflectance", "outsideIndex", outsideIndex, { unit: "refractive index", min: 1 });
  requireFinite(index, "refractive index");
  requireFinite(outsideIndex, "refractive index of the surrounding medium");
  if (index < 1 || outsideIndex < 1) {
    throw new Error(
      `refractive indices ${index} and ${outsideIndex}: optical glass and plastics have n ≥ 1; check the value`,
    );
  }
  return ((index - outsideIndex) / (index + outsideIndex)) ** 2;
}

/**
 * The refractive index at each wavelength: a constant, or a dispersion curve read by interpolation (no extrapolation).
 *
 * @param index A refractive index: a number, or a spectrum of n against wavelength.
 * @param wavelengths Wavelengths in nm (inside the curve's range).
 * @returns n at each wavelength.
 * @source none: a tristim helper; CIE 167:2005 interpolation of the curve.
 * @example indexAtWavelengths(spectrumOnGrid(400, 100, [1.53, 1.52, 1.515]), [450, 550])
 */
export function indexAtWavelengths(index: RefractiveIndex, wavelengths: readonly number[]): number[] {
  checkRefractiveIndex("indexAtWavelengths", "index", index);
  checkNumberList("indexAtWavelengths", "wavelengths", wavelengths, { unit: "nm", minLength: 1 });
  if (typeof index === "number") {
    requireFinite(index, "refractive index");
    return wavelengths.map(() => index);
  }
  const read = sampler(index, { extrapolation: "refuse" });
  return wavelengths.map((w) => read(w));
}

/**
 * Surface reflectance at normal incidence at each wavelength, from a constant index or a dispersion curve.
 *
 * @param index A refractive index: a number, or a spectrum of n against wavelength.
 * @param wavelengths Wavelengths in nm.
 * @param outsideIndex The refractive index of the surrounding medium; default 1 (air).
 * @returns ρ at each wavelength, as fractions.
 * @source Fresnel equations at 0°; E. Hecht, Optics, 5th ed., §4.6.2.
 * @example surfaceReflectanceAt(1.52, [450, 550, 650])
 */
export function surfaceReflectanceAt(
  index: RefractiveIndex,
  wavelengths: readonly number[],
  outsideIndex = 1,
): number[] {
  checkRefractiveIndex("surfaceReflectanceAt", "index", index);
  checkNumberList("surfaceReflectanceAt", "wavelengths", wavelengths, { unit: "nm", minLength: 1 });
  checkNumber("surfaceReflectanceAt", "outsideIndex", outsideIndex, { unit: "refractive index", above: 0 });
  noteMethod(
    "optics",
    "Surface reflection was computed at normal incidence from the refractive index, ρ = ((n − 1)/(n + 1))² (Fresnel equations; Hecht, Optics §4.6).",
  );
  return indexAtWavelengths(index, wavelengths).map((n) => surfaceReflectance(n, outsideIndex));
}

/**
 * A short description of a refractive index for names and Methods statements ("n = 1.5" or "n(λ) from "name"").
 *
 * @param index A refractive index: a number or a dispersion spectrum.
 * @returns The description.
 * @source none: a tristim helper, no published formula.
 * @example describeRefractiveIndex(1.5)
 */
export function describeRefractiveIndex(index: RefractiveIndex): string {
  checkRefractiveIndex("describeRefractiveIndex", "index", index);
  return typeof index === "number" ? `n = ${index}` : `n(λ) from "${index.name}"`;
}
