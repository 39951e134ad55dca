/** CIE 1976 L*u*v* (CIELUV) and its polar form (CIE 015:2018 §8.2.2, eqs. 8.15–8.24). */
import { hueAngleDegrees } from "./hue-angle.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Tristimulus } from "./chromaticity.ts";
import { LCH_FIELDS, LUV_FIELDS, XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { isPlainWhite, isPlainXyz } from "../arguments/plain-tristimulus.ts";

export interface Luv {
  readonly L: number;
  readonly u: number;
  readonly v: number;
}
/** CIELUV lightness, chroma C*uv and hue angle huv in degrees (0 ≤ h < 360). */
export interface LChUv {
  readonly L: number;
  readonly C: number;
  readonly h: number;
}

const EPSILON = 216 / 24389; // (6/29)³
const KAPPA = 24389 / 27; // (29/3)³

function uvPrime(t: Tristimulus): [number, number] {
  const d = t.X + 15 * t.Y + 3 * t.Z;
  return d > 0 ? [(4 * t.X) / d, (9 * t.Y) / d] : [0, 0];
}

function requireXYZ(what: string, name: string, t: Tristimulus, positive: boolean): void {
  if (
    typeof t !== "object" ||
    t === null ||
    !(Number.isFinite(t.X) && Number.isFinite(t.Y) && Number.isFinite(t.Z)) ||
    (positive && !(t.X > 0 && t.Y > 0 && t.Z > 0))
  ) {
    throw new Error(
      `${what}: ${name} (${t?.X}, ${t?.Y}, ${t?.Z}) must be ${positive ? "positive " : ""}finite tristimulus values`,
    );
  }
}

/**
 * CIELUV coordinates relative to a reference white: L* = 116 f(Y/Yn) − 16, u* = 13 L*(u′ − u′n), v* = 13 L*(v′ − v′n).
 *
 * @param t The colour's tristimulus values { X, Y, Z }, finite.
 * @param white The reference white { X, Y, Z }, all positive, on the same scale.
 * @returns { L, u, v } = L*, u*, v*.
 * @source CIE 015:2018 §8.2.2, eqs. 8.15–8.19.
 * @example luvFromXYZ({ X: 41.24, Y: 21.26, Z: 1.93 }, { X: 95.047, Y: 100, Z: 108.883 })
 */
export function luvFromXYZ(t: Tristimulus, white: Tristimulus): Luv {
  if (!(isPlainXyz(t) && isPlainWhite(white))) {
    checkFields("luvFromXYZ", "t", t, XYZ_FIELDS);
    checkFields("luvFromXYZ", "white", white, XYZ_FIELDS);
    requireXYZ("luvFromXYZ", "the colour", t, false);
    requireXYZ("luvFromXYZ", "the reference white", white, true);
  }
  noteMethod("colour space", "CIELUV (CIE 1976 L*u*v*) values were computed per CIE 015:2018 §8.2.2.");
  const yr = t.Y / white.Y;
  const L = yr > EPSILON ? 116 * Math.cbrt(yr) - 16 : KAPPA * yr;
  if (L === 0) return { L: 0, u: 0, v: 0 };
  // u′, v′ of the colour and the white as uvPrime computes them, without its arrays (this runs per colour).
  const d = t.X + 15 * t.Y + 3 * t.Z;
  const u = d > 0 ? (4 * t.X) / d : 0,
    v = d > 0 ? (9 * t.Y) / d : 0;
  const dn = white.X + 15 * white.Y + 3 * white.Z;
  const un = (4 * white.X) / dn,
    vn = (9 * white.Y) / dn;
  return { L, u: 13 * L * (u - un), v: 13 * L * (v - vn) };
}

/**
 * Tristimulus values of a CIELUV colour: the inverse of `luvFromXYZ` (L* ≤ 0 gives black).
 *
 * @param luv CIELUV { L, u, v }, finite.
 * @param white The reference white { X, Y, Z }, all positive.
 * @returns { X, Y, Z } on the white's scale.
 * @source CIE 015:2018 §8.2.2, inverted.
 * @example xyzFromLuv({ L: 53.24, u: 175, v: 37.8 }, { X: 95.047, Y: 100, Z: 108.883 })
 */
export function xyzFromLuv(luv: Luv, white: Tristimulus): Tristimulus {
  checkFields("xyzFromLuv", "luv", luv, LUV_FIELDS);
  checkFields("xyzFromLuv", "white", white, XYZ_FIELDS);
  if (typeof luv !== "object" || luv === null || ![luv.L, luv.u, luv.v].every(Number.isFinite)) {
    throw new Error(`xyzFromLuv: (L* ${luv?.L}, u* ${luv?.u}, v* ${luv?.v}) must be finite`);
  }
  requireXYZ("xyzFromLuv", "the reference white", white, true);
  if (luv.L <= 0) return { X: 0, Y: 0, Z: 0 };
  const [un, vn] = uvPrime(white);
  const fy = (luv.L + 16) / 116; // cubed as fy·fy·fy: V8 runs ** as a general power, several times the cost
  const Y = white.Y * (luv.L > 8 ? fy * fy * fy : luv.L / KAPPA);
  const u = luv.u / (13 * luv.L) + un;
  const v = luv.v / (13 * luv.L) + vn;
  const X = (Y * 9 * u) / (4 * v);
  const Z = (Y * (12 - 3 * u - 20 * v)) / (4 * v);
  return { X, Y, Z };
}

/**
 * The polar form of CIELUV: chroma C*uv = √(u*² + v*²) and hue angle huv = atan2(v*, u*).
 *
 * @param luv CIELUV { L, u, v }.
 * @returns { L, C, h }, h in degrees, 0 ≤ h < 360.
 * @source CIE 015:2018 eqs. 8.22–8.23.
 * @example lchFromLuv({ L: 50, u: 30, v: 10 })
 */
export function lchFromLuv(luv: Luv): LChUv {
  checkFields("lchFromLuv", "luv", luv, LUV_FIELDS);
  return { L: luv.L, C: Math.hypot(luv.u, luv.v), h: hueAngleDegrees(luv.u, luv.v) };
}

/**
 * CIELUV from its polar form: u* = C cos h, v* = C sin h.
 *
 * @param lch { L, C, h }, h in degrees.
 * @returns CIELUV { L, u, v }.
 * @source CIE 015:2018 eqs. 8.22–8.23, inverted.
 * @example luvFromLch({ L: 50, C: 30, h: 20 })
 */
export function luvFromLch(lch: LChUv): Luv {
  checkFields("luvFromLch", "lch", lch, LCH_FIELDS);
  const r = (lch.h * Math.PI) / 180;
  return { L: lch.L, u: lch.C * Math.cos(r), v: lch.C * Math.sin(r) };
}

/**
 * CIE 1976 u,v saturation suv = 13 √((u′ − u′n)² + (v′ − v′n)²).
 *
 * @param t The colour's tristimulus values { X, Y, Z }.
 * @param white The reference white { X, Y, Z }, all positive.
 * @returns suv, dimensionless.
 * @source CIE 015:2018 eq. 8.21.
 * @example saturationUv({ X: 41.24, Y: 21.26, Z: 1.93 }, { X: 95.047, Y: 100, Z: 108.883 })
 */
export function saturationUv(t: Tristimulus, white: Tristimulus): number {
  checkFields("saturationUv", "t", t, XYZ_FIELDS);
  checkFields("saturationUv", "white", white, XYZ_FIELDS);
  requireXYZ("saturationUv", "the colour", t, false);
  requireXYZ("saturationUv", "the reference white", white, true);
  const [u, v] = uvPrime(t);
  const [un, vn] = uvPrime(white);
  return 13 * Math.hypot(u - un, v - vn);
}
