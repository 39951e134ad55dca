/**
 * The Saunderson correction between the measured reflectance R_m of a paint or plastic with a glossy surface and the
 * internal reflectance R_i that Kubelka–Munk theory describes (J. L. Saunderson, "Calculation of the color of
 * pigmented plastics", J. Opt. Soc. Am. 32, 727, 1942): R_m = k₁ + (1 − k₁)(1 − k₂)R_i/(1 − k₂R_i), with k₁ the
 * external (Fresnel) reflectance of the surface and k₂ its internal reflectance for diffuse light.
 */
import { requireFraction } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";

export interface SurfaceCorrection {
  /** External surface reflectance k₁; default 0.04, the Fresnel value for n = 1.5 at normal incidence (Hecht §4.6). */
  k1?: number;
  /** Internal reflectance k₂ for diffuse light; default 0.6, about the value for n = 1.5 (common practice, no source). */
  k2?: number;
  /** Whether the instrument includes the specular reflection (SCI, default) or excludes it (SCE: the k₁ term is dropped). */
  specular?: "included" | "excluded";
}

function constants(options: SurfaceCorrection): { k1: number; k2: number; included: boolean } {
  const k1 = requireFraction(options.k1 ?? 0.04, "Saunderson k1");
  const k2 = requireFraction(options.k2 ?? 0.6, "Saunderson k2");
  if (k2 >= 1) throw new Error("Saunderson k2 = 1 would trap all light inside the layer; it must be below 1");
  const specular = options.specular ?? "included";
  if (specular !== "included" && specular !== "excluded")
    throw new Error(`Saunderson: specular "${String(specular)}" is not "included" or "excluded"`);
  noteMethod(
    "mixing",
    `Surface reflection was taken into account with the Saunderson correction (J. Opt. Soc. Am. 32, 727, 1942) with k₁ = ${k1} and k₂ = ${k2}, the specular component ${specular}.`,
  );
  return { k1, k2, included: specular === "included" };
}

/**
 * Measured reflectance from internal (Kubelka–Munk) reflectance: R_m = k₁ + (1 − k₁)(1 − k₂)R_i ÷ (1 − k₂R_i), without k₁ when the specular component is excluded.
 *
 * @param internal The internal reflectance R_i, a fraction.
 * @returns R_m, a fraction.
 * @source J. L. Saunderson, J. Opt. Soc. Am. 32:727, 1942.
 * @example saundersonMeasured(0.5, { specular: "excluded" })
 */
export function saundersonMeasured(internal: number, options: SurfaceCorrection = {}): number {
  checkNumber("saundersonMeasured", "internal", internal, { unit: "fraction" });
  checkOptions("saundersonMeasured", "options", options, ["k1", "k2", "specular"]);
  requireFraction(internal, "internal reflectance R_i");
  const { k1, k2, included } = constants(options);
  return (included ? k1 : 0) + ((1 - k1) * (1 - k2) * internal) / (1 - k2 * internal);
}

/**
 * Internal reflectance from measured reflectance: R_i = (R_m − k₁) ÷ (1 − k₁ − k₂ + k₂R_m) (without k₁ when the specular component is excluded).
 *
 * @param measured The measured reflectance R_m, a fraction.
 * @returns R_i, a fraction.
 * @source J. L. Saunderson, J. Opt. Soc. Am. 32:727, 1942, inverted.
 * @example saundersonInternal(0.35)
 */
export function saundersonInternal(measured: number, options: SurfaceCorrection = {}): number {
  checkNumber("saundersonInternal", "measured", measured, { unit: "fraction" });
  checkOptions("saundersonInternal", "options", options, ["k1", "k2", "specular"]);
  requireFraction(measured, "measured reflectance R_m");
  const { k1, k2, included } = constants(options);
  const rm = included ? measured - k1 : measured;
  if (rm < 0)
    throw new Error(
      `measured reflectance ${measured} is below the surface reflection k1 = ${k1}; with specular included it cannot be`,
    );
  return rm / ((1 - k1) * (1 - k2) + k2 * rm);
}
