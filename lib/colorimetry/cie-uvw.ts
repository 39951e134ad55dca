/** CIE 1964 uniform colour space U*V*W*, as CIE 13.3-1995 uses it for colour rendering (CIE 13.3 §5.6; CIE 015:2004 §8 note). */
import { noteMethod } from "../methods/method-log.ts";
import { chromaticityXy, uv1960FromXy, type Tristimulus } from "./chromaticity.ts";
import { XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";

export interface Uvw1964 {
  readonly U: number;
  readonly V: number;
  readonly W: number;
}

/**
 * CIE 1964 U*V*W* coordinates, as CIE 13.3 uses them for colour rendering: W* = 25 Y^(1/3) − 17, U* = 13 W*(u − un), V* = 13 W*(v − vn).
 *
 * @param t The colour's tristimulus values { X, Y, Z }, Y ≥ 0 on the 0–100 scale.
 * @param white The reference white { X, Y, Z } (its chromaticity only is used).
 * @returns { U, V, W }, with CIE 1960 u, v.
 * @source CIE 13.3-1995 eqs. 6–8.
 * @example uvwFromXYZ({ X: 30, Y: 30, Z: 25 }, { X: 95.047, Y: 100, Z: 108.883 })
 */
export function uvwFromXYZ(t: Tristimulus, white: Tristimulus): Uvw1964 {
  checkFields("uvwFromXYZ", "t", t, XYZ_FIELDS);
  checkFields("uvwFromXYZ", "white", white, XYZ_FIELDS);
  if (typeof t !== "object" || t === null || ![t.X, t.Y, t.Z].every(Number.isFinite) || t.Y < 0) {
    throw new Error(`uvwFromXYZ: tristimulus values (${t?.X}, ${t?.Y}, ${t?.Z}) must be finite with Y ≥ 0`);
  }
  noteMethod(
    "colour space",
    "CIE 1964 U*V*W* coordinates were computed as in CIE 13.3-1995, with Y on the 0–100 scale.",
  );
  const w = 25 * Math.cbrt(t.Y) - 17;
  const p = uv1960FromXy(chromaticityXy(t));
  const n = uv1960FromXy(chromaticityXy(white));
  return { W: w, U: 13 * w * (p.u - n.u), V: 13 * w * (p.v - n.v) };
}
