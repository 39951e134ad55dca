/** CIE 1976 L*a*b* (CIELAB) and its polar form L*C*h (CIE 015:2018 §8.2.1, eqs. 8.3–8.12). */
import { hueAngleDegrees } from "./hue-angle.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Tristimulus } from "./chromaticity.ts";

export interface Lab {
  readonly L: number;
  readonly a: number;
  readonly b: number;
}
export interface LCh {
  readonly L: number;
  readonly C: number;
  /** Hue angle in degrees, 0 ≤ h < 360. */
  readonly h: number;
}

const EPSILON = (24 / 116) ** 3; // (6/29)³ = 216/24389
const KAPPA_SLOPE = 841 / 108; // (1/3)(29/6)²

function f(t: number): number {
  return t > EPSILON ? Math.cbrt(t) : KAPPA_SLOPE * t + 16 / 116;
}
function fInverse(u: number): number {
  return u > 24 / 116 ? u ** 3 : (u - 16 / 116) / KAPPA_SLOPE;
}

function requireWhite(white: Tristimulus, what: string): void {
  if (!(white.X > 0 && white.Y > 0 && white.Z > 0))
    throw new Error(`${what}: the reference white (${white.X}, ${white.Y}, ${white.Z}) must be positive`);
}

/** L* = 116 f(Y/Yn) − 16, a* = 500[f(X/Xn) − f(Y/Yn)], b* = 200[f(Y/Yn) − f(Z/Zn)] (CIE 015:2018 eqs. 8.3–8.11). */
export function labFromXYZ(t: Tristimulus, white: Tristimulus): Lab {
  requireWhite(white, "labFromXYZ");
  if (!(Number.isFinite(t.X) && Number.isFinite(t.Y) && Number.isFinite(t.Z)))
    throw new Error(`labFromXYZ: tristimulus values (${t.X}, ${t.Y}, ${t.Z}) must be finite`);
  noteMethod("colour space", "CIELAB (CIE 1976 L*a*b*) values were computed per CIE 015:2018 §8.2.1.");
  const fx = f(t.X / white.X),
    fy = f(t.Y / white.Y),
    fz = f(t.Z / white.Z);
  return { L: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

/** The inverse of labFromXYZ (CIE 015:2018 §8.2.1, inverted). */
export function xyzFromLab(lab: Lab, white: Tristimulus): Tristimulus {
  requireWhite(white, "xyzFromLab");
  const fy = (lab.L + 16) / 116;
  const fx = fy + lab.a / 500;
  const fz = fy - lab.b / 200;
  return { X: white.X * fInverse(fx), Y: white.Y * fInverse(fy), Z: white.Z * fInverse(fz) };
}

/** C*ab = √(a*² + b*²), hab = atan2(b*, a*) in degrees (CIE 015:2018 eqs. 8.12–8.13). */
export function lchFromLab(lab: Lab): LCh {
  return { L: lab.L, C: Math.hypot(lab.a, lab.b), h: hueAngleDegrees(lab.a, lab.b) };
}

/** a* = C cos h, b* = C sin h. */
export function labFromLch(lch: LCh): Lab {
  const r = (lch.h * Math.PI) / 180;
  return { L: lch.L, a: lch.C * Math.cos(r), b: lch.C * Math.sin(r) };
}
