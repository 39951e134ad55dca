/**
 * Kubelka–Munk two-flux theory of light-scattering, absorbing layers (P. Kubelka & F. Munk, Z. techn. Physik 12,
 * 593, 1931; P. Kubelka, "New contributions to the optics of intensely light-scattering materials. Part I",
 * J. Opt. Soc. Am. 38, 448, 1948). K is the absorption and S the scattering coefficient (per unit thickness).
 */
import { requireFinite, requireFraction, requireNonNegative } from "../filters/checks.ts";
import { checkNumber } from "../arguments/check-number.ts";

/**
 * The Kubelka–Munk function of an opaque layer's internal reflectance, K/S = (1 − R∞)² ÷ (2R∞).
 *
 * @param reflectanceInfinite R∞, the internal reflectance of an opaque layer, a fraction above 0.
 * @returns K/S, dimensionless.
 * @source P. Kubelka, F. Munk, Z. techn. Physik 12:593, 1931.
 * @example ksFromReflectance(0.3)
 */
export function ksFromReflectance(reflectanceInfinite: number): number {
  checkNumber("ksFromReflectance", "reflectanceInfinite", reflectanceInfinite, {
    unit: "fraction",
  });
  requireFraction(reflectanceInfinite, "reflectance of an opaque layer (R∞)");
  if (reflectanceInfinite === 0)
    throw new Error("R∞ = 0 gives K/S = ∞; an opaque layer with no reflectance has no finite K/S");
  return (1 - reflectanceInfinite) ** 2 / (2 * reflectanceInfinite);
}

/**
 * Reflectance of an opaque layer from K/S, R∞ = 1 + K/S − √((K/S)² + 2K/S).
 *
 * @param ks K/S, 0 or more.
 * @returns R∞, a fraction.
 * @source Kubelka & Munk 1931; P. Kubelka, J. Opt. Soc. Am. 38:448, 1948, eq. 6.
 * @example reflectanceFromKs(0.8167)
 */
export function reflectanceFromKs(ks: number): number {
  checkNumber("reflectanceFromKs", "ks", ks, { min: 0, unit: "K/S ratio" });
  requireNonNegative(ks, "K/S");
  // Written as 1/(1 + K/S + √((K/S)² + 2K/S)), the same number without cancellation for large K/S.
  return 1 / (1 + ks + Math.sqrt(ks * ks + 2 * ks));
}

/** Result of a layer of finite thickness: reflectance over its background and transmittance. */
export interface LayerOptics {
  readonly reflectance: number;
  /** Reflectance of the same layer over an ideal black background (R₀). */
  readonly reflectanceOverBlack: number;
  readonly transmittance: number;
}

/**
 * Reflectance and transmittance of a scattering layer of finite thickness over a background (Kubelka's hyperbolic solution).
 *
 * With a = 1 + K/S, b = √(a² − 1): R₀ = sinh(bSX) ÷ (a·sinh(bSX) + b·cosh(bSX)), T = b ÷ (a·sinh(bSX) + b·cosh(bSX)),
 * R = R₀ + T²R_g ÷ (1 − R₀R_g). The limits S = 0 and K = 0 are handled exactly.
 *
 * @param k The absorption coefficient K, per unit thickness, 0 or more.
 * @param s The scattering coefficient S, per unit thickness, 0 or more.
 * @param thickness The layer thickness X, in the unit K and S are per.
 * @param background The background's reflectance R_g, a fraction.
 * @returns { reflectance (over the background), reflectanceOverBlack (R₀), transmittance }, fractions.
 * @source P. Kubelka, J. Opt. Soc. Am. 38:448, 1948.
 * @example layerOptics(0.2, 2, 0.5, 0.8)
 */
export function layerOptics(k: number, s: number, thickness: number, background: number): LayerOptics {
  checkNumber("layerOptics", "k", k, { min: 0, unit: "absorption coefficient" });
  checkNumber("layerOptics", "s", s, { min: 0, unit: "scattering coefficient" });
  checkNumber("layerOptics", "thickness", thickness, { min: 0 });
  checkNumber("layerOptics", "background", background, { unit: "fraction" });
  requireNonNegative(k, "absorption coefficient K");
  requireNonNegative(s, "scattering coefficient S");
  requireNonNegative(thickness, "layer thickness X");
  requireFraction(background, "background reflectance R_g");
  let r0: number;
  let t: number;
  if (s === 0) {
    r0 = 0;
    t = Math.exp(-k * thickness);
  } else if (k === 0) {
    r0 = (s * thickness) / (1 + s * thickness);
    t = 1 / (1 + s * thickness);
  } else {
    const a = 1 + k / s;
    const b = Math.sqrt(a * a - 1);
    const bsx = b * s * thickness;
    if (bsx > 300) {
      r0 = a - b;
      t = 0;
    } else {
      const sh = Math.sinh(bsx);
      const ch = Math.cosh(bsx);
      const d = a * sh + b * ch;
      r0 = sh / d;
      t = b / d;
    }
  }
  requireFinite(r0, "layer reflectance");
  const reflectance = r0 + (t * t * background) / (1 - r0 * background);
  return { reflectance, reflectanceOverBlack: r0, transmittance: t };
}

/**
 * Reflectance of a layer thick enough to hide its background, from K and S: R∞ = a − b.
 *
 * @param k The absorption coefficient K, 0 or more.
 * @param s The scattering coefficient S, above 0.
 * @returns R∞, a fraction.
 * @source P. Kubelka, J. Opt. Soc. Am. 38:448, 1948.
 * @example opaqueReflectance(0.2, 2)
 */
export function opaqueReflectance(k: number, s: number): number {
  checkNumber("opaqueReflectance", "k", k, { min: 0, unit: "absorption coefficient" });
  checkNumber("opaqueReflectance", "s", s, { above: 0, unit: "scattering coefficient" });
  requireNonNegative(k, "absorption coefficient K");
  requireNonNegative(s, "scattering coefficient S");
  if (s === 0)
    throw new Error(
      "S = 0: a layer that does not scatter reflects nothing however thick it is; R∞ is 0 and K/S is infinite",
    );
  return reflectanceFromKs(k / s);
}
