/** CIE 1976 L*u*v* (CIELUV) and its polar form (CIE 015:2018 §8.2.2, eqs. 8.15–8.24). */
import { hueAngleDegrees } from "./hue-angle.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Tristimulus } from "./chromaticity.ts";

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

/** L* = 116 f(Y/Yn) − 16, u* = 13 L*(u′ − u′n), v* = 13 L*(v′ − v′n) (CIE 015:2018 eqs. 8.15–8.19). */
export function luvFromXYZ(t: Tristimulus, white: Tristimulus): Luv {
  requireXYZ("luvFromXYZ", "the colour", t, false);
  requireXYZ("luvFromXYZ", "the reference white", white, true);
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

/** The inverse of luvFromXYZ (CIE 015:2018 §8.2.2, inverted). */
export function xyzFromLuv(luv: Luv, white: Tristimulus): Tristimulus {
  if (typeof luv !== "object" || luv === null || ![luv.L, luv.u, luv.v].every(Number.isFinite)) {
    throw new Error(`xyzFromLuv: (L* ${luv?.L}, u* ${luv?.u}, v* ${luv?.v}) must be finite`);
  }
  requireXYZ("xyzFromLuv", "the reference white", white, true);
  if (luv.L <= 0) return { X: 0, Y: 0, Z: 0 };
  const [un, vn] = uvPrime(white);
  const Y = white.Y * (luv.L > 8 ? ((luv.L + 16) / 116) ** 3 : luv.L / KAPPA);
  const u = luv.u / (13 * luv.L) + un;
  const v = luv.v / (13 * luv.L) + vn;
  const X = (Y * 9 * u) / (4 * v);
  const Z = (Y * (12 - 3 * u - 20 * v)) / (4 * v);
  return { X, Y, Z };
}

/** C*uv = √(u*² + v*²), huv = atan2(v*, u*) in degrees (CIE 015:2018 eqs. 8.22–8.23). */
export function lchFromLuv(luv: Luv): LChUv {
  return { L: luv.L, C: Math.hypot(luv.u, luv.v), h: hueAngleDegrees(luv.u, luv.v) };
}

/** u* = C cos h, v* = C sin h. */
export function luvFromLch(lch: LChUv): Luv {
  const r = (lch.h * Math.PI) / 180;
  return { L: lch.L, u: lch.C * Math.cos(r), v: lch.C * Math.sin(r) };
}

/** CIE 1976 u,v saturation suv = 13 √((u′ − u′n)² + (v′ − v′n)²) (CIE 015:2018 eq. 8.21). */
export function saturationUv(t: Tristimulus, white: Tristimulus): number {
  requireXYZ("saturationUv", "the colour", t, false);
  requireXYZ("saturationUv", "the reference white", white, true);
  const [u, v] = uvPrime(t);
  const [un, vn] = uvPrime(white);
  return 13 * Math.hypot(u - un, v - vn);
}
