/** Chromaticity coordinates: CIE 1931 xy, CIE 1976 u′v′ and CIE 1960 uv (CIE 015:2018 §7.3, §8.1). */
import { UV_FIELDS, XYY_FIELDS, XYZ_FIELDS, XY_FIELDS, checkFields } from "../arguments/check-fields.ts";

export interface Tristimulus {
  readonly X: number;
  readonly Y: number;
  readonly Z: number;
}
export interface Chromaticity {
  readonly x: number;
  readonly y: number;
}
export interface ChromaticityLuminance extends Chromaticity {
  readonly Y: number;
}
/** CIE 1976 UCS u′, v′. */
export interface UvPrime {
  readonly u: number;
  readonly v: number;
}
/** CIE 1960 UCS u, v (v = 2/3 v′). */
export interface Uv1960 {
  readonly u: number;
  readonly v: number;
}

function requireSum(sum: number, what: string): void {
  if (!(sum > 0) || !Number.isFinite(sum))
    throw new Error(`${what}: X + Y + Z = ${sum}; chromaticity needs a positive finite sum`);
}

/**
 * CIE 1931 chromaticity coordinates of tristimulus values, x = X ÷ (X+Y+Z), y = Y ÷ (X+Y+Z).
 *
 * @param t Tristimulus values { X, Y, Z } with a positive sum (any scale).
 * @returns { x, y }, dimensionless.
 * @source CIE 015:2018 eq. 7.3.
 * @example chromaticityXy({ X: 95.047, Y: 100, Z: 108.883 })
 */
export function chromaticityXy(t: Tristimulus): Chromaticity {
  checkFields("chromaticityXy", "t", t, XYZ_FIELDS);
  const s = t.X + t.Y + t.Z;
  requireSum(s, "chromaticityXy");
  return { x: t.X / s, y: t.Y / s };
}

/**
 * Chromaticity x, y with the luminance factor (or luminance) Y kept.
 *
 * @param t Tristimulus values { X, Y, Z } with a positive sum.
 * @returns { x, y, Y }, Y on the scale of `t`.
 * @source CIE 015:2018 §7.3.
 * @example toXyY({ X: 41.24, Y: 21.26, Z: 1.93 })
 */
export function toXyY(t: Tristimulus): ChromaticityLuminance {
  checkFields("toXyY", "t", t, XYZ_FIELDS);
  const { x, y } = chromaticityXy(t);
  return { x, y, Y: t.Y };
}

/**
 * Tristimulus values from chromaticity and Y: X = xY ÷ y, Z = (1 − x − y)Y ÷ y.
 *
 * @param c { x, y, Y } with y > 0.
 * @returns { X, Y, Z } on the scale of Y.
 * @source CIE 015:2018 eq. 7.4.
 * @example fromXyY({ x: 0.3127, y: 0.329, Y: 100 })
 */
export function fromXyY(c: ChromaticityLuminance): Tristimulus {
  checkFields("fromXyY", "c", c, XYY_FIELDS);
  if (!(c.y > 0)) throw new Error(`fromXyY: y = ${c.y}; tristimulus values need y > 0`);
  return { X: (c.x * c.Y) / c.y, Y: c.Y, Z: ((1 - c.x - c.y) * c.Y) / c.y };
}

/**
 * CIE 1976 UCS chromaticity u′ = 4X ÷ (X+15Y+3Z), v′ = 9Y ÷ (X+15Y+3Z).
 *
 * @param t Tristimulus values { X, Y, Z } (X + 15Y + 3Z > 0).
 * @returns { u, v } = u′, v′, dimensionless.
 * @source CIE 015:2018 eq. 8.1.
 * @example uvPrimeFromXYZ({ X: 95.047, Y: 100, Z: 108.883 })
 */
export function uvPrimeFromXYZ(t: Tristimulus): UvPrime {
  checkFields("uvPrimeFromXYZ", "t", t, XYZ_FIELDS);
  const d = t.X + 15 * t.Y + 3 * t.Z;
  if (!(d > 0)) throw new Error(`uvPrimeFromXYZ: X + 15Y + 3Z = ${d}; u′v′ needs a positive denominator`);
  return { u: (4 * t.X) / d, v: (9 * t.Y) / d };
}

/**
 * CIE 1976 UCS chromaticity from xy: u′ = 4x ÷ (−2x+12y+3), v′ = 9y ÷ (−2x+12y+3).
 *
 * @param c Chromaticity { x, y } (CIE 1931).
 * @returns { u, v } = u′, v′, dimensionless.
 * @source CIE 015:2018 eq. 8.2.
 * @example uvPrimeFromXy({ x: 0.3127, y: 0.329 })
 */
export function uvPrimeFromXy(c: Chromaticity): UvPrime {
  checkFields("uvPrimeFromXy", "c", c, XY_FIELDS);
  const d = -2 * c.x + 12 * c.y + 3;
  if (!(d > 0)) throw new Error(`uvPrimeFromXy: −2x + 12y + 3 = ${d} for (${c.x}, ${c.y})`);
  return { u: (4 * c.x) / d, v: (9 * c.y) / d };
}

/**
 * CIE 1931 xy from CIE 1976 u′v′: x = 9u′ ÷ (6u′−16v′+12), y = 4v′ ÷ (6u′−16v′+12).
 *
 * @param c { u, v } = u′, v′.
 * @returns { x, y }, dimensionless.
 * @source CIE 015:2018 eq. 8.2, inverted.
 * @example xyFromUvPrime({ u: 0.1978, v: 0.4683 })
 */
export function xyFromUvPrime(c: UvPrime): Chromaticity {
  checkFields("xyFromUvPrime", "c", c, UV_FIELDS);
  const d = 6 * c.u - 16 * c.v + 12;
  if (!(d > 0)) throw new Error(`xyFromUvPrime: 6u′ − 16v′ + 12 = ${d} for (${c.u}, ${c.v})`);
  return { x: (9 * c.u) / d, y: (4 * c.v) / d };
}

/**
 * CIE 1960 UCS chromaticity u, v from xy: u = u′, v = (2 ÷ 3) v′.
 *
 * @param c Chromaticity { x, y } (CIE 1931).
 * @returns { u, v } of the CIE 1960 UCS (used for CCT and colour rendering), dimensionless.
 * @source CIE 015:2018 §8.1 (note); CIE 13.3-1995.
 * @example uv1960FromXy({ x: 0.3127, y: 0.329 })
 */
export function uv1960FromXy(c: Chromaticity): Uv1960 {
  checkFields("uv1960FromXy", "c", c, XY_FIELDS);
  const p = uvPrimeFromXy(c);
  return { u: p.u, v: (2 * p.v) / 3 };
}

/**
 * CIE 1931 xy from CIE 1960 uv: x = 3u ÷ (2u−8v+4), y = 2v ÷ (2u−8v+4).
 *
 * @param c { u, v } of the CIE 1960 UCS.
 * @returns { x, y }, dimensionless.
 * @source CIE 015:2018 §8.1 (the 1960 UCS), inverted.
 * @example xyFromUv1960({ u: 0.1978, v: 0.3122 })
 */
export function xyFromUv1960(c: Uv1960): Chromaticity {
  checkFields("xyFromUv1960", "c", c, UV_FIELDS);
  const d = 2 * c.u - 8 * c.v + 4;
  if (!(d > 0)) throw new Error(`xyFromUv1960: 2u − 8v + 4 = ${d} for (${c.u}, ${c.v})`);
  return { x: (3 * c.u) / d, y: (2 * c.v) / d };
}
