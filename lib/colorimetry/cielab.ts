/** CIE 1976 L*a*b* (CIELAB) and its polar form L*C*h (CIE 015:2018 §8.2.1, eqs. 8.3–8.12). */
import { hueAngleDegrees } from "./hue-angle.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Tristimulus } from "./chromaticity.ts";
import { LAB_FIELDS, LCH_FIELDS, XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { isPlainWhite, isPlainXyz } from "../arguments/plain-tristimulus.ts";

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
// u·u·u rather than u ** 3: V8 runs ** as a general power, several times the cost of two products (within 1 ε).
function fInverse(u: number): number {
  return u > 24 / 116 ? u * u * u : (u - 16 / 116) / KAPPA_SLOPE;
}

function requireWhite(white: Tristimulus, what: string): void {
  if (!(white.X > 0 && white.Y > 0 && white.Z > 0))
    throw new Error(`${what}: the reference white (${white.X}, ${white.Y}, ${white.Z}) must be positive`);
}

// Built once: this shape is checked on every conversion, a hot path.
const WHITE_FIELDS = {
  ...XYZ_FIELDS,
  what: "the reference white's tristimulus values { X, Y, Z } (e.g. objectColour(sample).white)",
};

// The common case of the argument checks, written out here so that it inlines into a cell's loop: checkFields sees
// every shape the library checks, and there its field reads and the call of the shape's test are slow polymorphic
// operations that cost more than the conversion. Each test accepts exactly what checkFields (and requireWhite)
// accept; anything else goes to the full checks, which throw naming what is wrong.
function isPlainLab(v: Lab): boolean {
  return (
    typeof v === "object" &&
    v !== null &&
    Number.isFinite(v.L) &&
    Number.isFinite(v.a) &&
    Number.isFinite(v.b) &&
    !Array.isArray(v)
  );
}

/**
 * CIELAB coordinates of a colour relative to a reference white: L* = 116 f(Y/Yn) − 16, a* = 500[f(X/Xn) − f(Y/Yn)], b* = 200[f(Y/Yn) − f(Z/Zn)].
 *
 * Use the white from the same weighting table as the sample (`objectColour` gives both).
 *
 * @param t The colour's tristimulus values { X, Y, Z }, finite.
 * @param white The reference white { X, Y, Z } on the same scale (all positive; Yn = 100 for object colours).
 * @returns { L, a, b }: L* 0–100 for object colours, a*, b* unbounded.
 * @source CIE 015:2018 §8.2.1, eqs. 8.3–8.11.
 * @example labFromXYZ({ X: 41.24, Y: 21.26, Z: 1.93 }, { X: 95.047, Y: 100, Z: 108.883 })
 */
export function labFromXYZ(t: Tristimulus, white: Tristimulus): Lab {
  if (!isPlainXyz(t)) checkFields("labFromXYZ", "t", t, XYZ_FIELDS);
  if (!isPlainWhite(white)) {
    checkFields("labFromXYZ", "white", white, WHITE_FIELDS);
    requireWhite(white, "labFromXYZ");
  }
  noteMethod("colour space", "CIELAB (CIE 1976 L*a*b*) values were computed per CIE 015:2018 §8.2.1.");
  const fx = f(t.X / white.X),
    fy = f(t.Y / white.Y),
    fz = f(t.Z / white.Z);
  return { L: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

/**
 * Tristimulus values of a CIELAB colour: the inverse of `labFromXYZ`.
 *
 * @param lab CIELAB { L, a, b }.
 * @param white The reference white { X, Y, Z } (all positive).
 * @returns { X, Y, Z } on the white's scale.
 * @source CIE 015:2018 §8.2.1, inverted.
 * @example xyzFromLab({ L: 53.24, a: 80.09, b: 67.2 }, { X: 95.047, Y: 100, Z: 108.883 })
 */
export function xyzFromLab(lab: Lab, white: Tristimulus): Tristimulus {
  if (!isPlainLab(lab)) checkFields("xyzFromLab", "lab", lab, LAB_FIELDS);
  if (!isPlainWhite(white)) {
    checkFields("xyzFromLab", "white", white, XYZ_FIELDS);
    requireWhite(white, "xyzFromLab");
  }
  const fy = (lab.L + 16) / 116;
  const fx = fy + lab.a / 500;
  const fz = fy - lab.b / 200;
  return { X: white.X * fInverse(fx), Y: white.Y * fInverse(fy), Z: white.Z * fInverse(fz) };
}

/**
 * The polar form of CIELAB: chroma C*ab = √(a*² + b*²) and hue angle hab = atan2(b*, a*).
 *
 * @param lab CIELAB { L, a, b }.
 * @returns { L, C, h }, h in degrees, 0 ≤ h < 360.
 * @source CIE 015:2018 eqs. 8.12–8.13.
 * @example lchFromLab({ L: 50, a: 20, b: -20 })
 */
export function lchFromLab(lab: Lab): LCh {
  if (!isPlainLab(lab)) checkFields("lchFromLab", "lab", lab, LAB_FIELDS);
  return { L: lab.L, C: Math.hypot(lab.a, lab.b), h: hueAngleDegrees(lab.a, lab.b) };
}

/**
 * CIELAB from its polar form: a* = C cos h, b* = C sin h.
 *
 * @param lch { L, C, h }, h in degrees.
 * @returns CIELAB { L, a, b }.
 * @source CIE 015:2018 eqs. 8.12–8.13, inverted.
 * @example labFromLch({ L: 50, C: 30, h: 315 })
 */
export function labFromLch(lch: LCh): Lab {
  checkFields("labFromLch", "lch", lch, LCH_FIELDS);
  const r = (lch.h * Math.PI) / 180;
  return { L: lch.L, a: lch.C * Math.cos(r), b: lch.C * Math.sin(r) };
}
