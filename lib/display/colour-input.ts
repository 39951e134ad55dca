/** Readings given either as tristimulus values or as chromaticities (not exported from the library). */
import type { Chromaticity, Tristimulus } from "../colorimetry/chromaticity.ts";
import { hasNumberFields, XY_FIELDS, XYZ_FIELDS } from "../arguments/check-fields.ts";
import { checkWith } from "../arguments/check-with.ts";
import { refuse } from "../arguments/refuse.ts";

/** A reading as XYZ, or a chromaticity { x, y }. */
export type ColourReading = Tristimulus | Chromaticity;

/** The CIE 1931 chromaticity of a reading given as { X, Y, Z } or { x, y }; refuses anything else. */
export function readingXy(fn: string, arg: string, value: unknown): Chromaticity {
  if (hasNumberFields(value, XYZ_FIELDS)) {
    const t = value as Tristimulus;
    const s = t.X + t.Y + t.Z;
    if (!(s > 0)) refuse(fn, arg, "tristimulus values with X + Y + Z > 0", value);
    return { x: t.X / s, y: t.Y / s };
  }
  checkWith(
    fn,
    arg,
    value,
    "a reading as tristimulus values { X, Y, Z } or a chromaticity { x, y }",
    (v) => hasNumberFields(v, XY_FIELDS) && (v as Chromaticity).y > 0,
  );
  const c = value as Chromaticity;
  return { x: c.x, y: c.y };
}

/** CIE 1976 u′, v′ of a chromaticity (CIE 015:2018 eq. 8.1–8.2). */
export function uvOf(c: Chromaticity): { u: number; v: number } {
  const d = -2 * c.x + 12 * c.y + 3;
  return { u: (4 * c.x) / d, v: (9 * c.y) / d };
}

/** Checks a list of readings and returns it typed. */
export function checkReadingList<T>(fn: string, arg: string, value: unknown, what: string, min = 1): T[] {
  checkWith(fn, arg, value, `${what} (at least ${min})`, (v) => Array.isArray(v) && v.length >= min);
  return value as T[];
}
