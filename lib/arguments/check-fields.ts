/** Checking record arguments whose fields are numbers: X, Y, Z; L*, a*, b*; x, y; u′, v′; r, g, b; grids. */
import { refuse, type Instead } from "./refuse.ts";

/** A record of numbers: what it is called, its keys, and hints by the kind of value that came instead. */
export interface FieldShape {
  readonly what: string;
  readonly keys: readonly string[];
  readonly instead?: Instead;
  /**
   * The same test as the keys give, written out for the shapes conversions check on every call: a keyed read
   * `record[key]` over many shapes is a slow polymorphic load, a named read is not.
   */
  readonly accepts?: (value: unknown) => boolean;
}

type Numbers = Record<string, unknown>;
const finite = (v: unknown): boolean => typeof v === "number" && Number.isFinite(v);
const isRecord = (v: unknown): v is Numbers => typeof v === "object" && v !== null && !Array.isArray(v);

/** True when every key of the shape holds a finite number. */
export function hasNumberFields(value: unknown, shape: FieldShape): boolean {
  if (shape.accepts) return shape.accepts(value);
  if (typeof value !== "object" || value === null || Array.isArray(value)) return false;
  const record = value as Record<string, unknown>;
  for (const key of shape.keys) {
    const v = record[key];
    if (typeof v !== "number" || !Number.isFinite(v)) return false;
  }
  return true;
}

/** Throws an ArgumentError unless `value` has a finite number in every field of the shape. */
export function checkFields(
  fn: string,
  arg: string,
  value: unknown,
  shape: FieldShape,
  rule?: { readonly optional?: boolean },
): void {
  if (value === undefined && rule?.optional) return;
  if (hasNumberFields(value, shape)) return;
  // An object with the right keys but one bad value: name that field and what it holds.
  if (typeof value === "object" && value !== null && !Array.isArray(value)) {
    const record = value as Record<string, unknown>;
    if (shape.keys.some((k) => k in record)) {
      const bad = shape.keys.find(
        (k) => typeof record[k] !== "number" || !Number.isFinite(record[k] as number),
      )!;
      refuse(fn, `${arg}.${bad}`, `a finite number (${arg} should be ${shape.what})`, record[bad]);
    }
  }
  refuse(fn, arg, shape.what, value, shape.instead);
}

const FROM_SPECTRUM =
  "for a spectrum compute its tristimulus values first (objectColour or lightTristimulus)";

/** Tristimulus values. */
export const XYZ_FIELDS: FieldShape = {
  what: "tristimulus values { X, Y, Z } (white Y = 100)",
  keys: ["X", "Y", "Z"],
  accepts: (v) => isRecord(v) && finite(v.X) && finite(v.Y) && finite(v.Z),
  instead: { spectrum: FROM_SPECTRUM, array: "for an array [X, Y, Z] write { X, Y, Z }" },
};
/** CIELAB. */
export const LAB_FIELDS: FieldShape = {
  what: "CIELAB values { L, a, b }",
  keys: ["L", "a", "b"],
  accepts: (v) => isRecord(v) && finite(v.L) && finite(v.a) && finite(v.b),
  instead: { spectrum: "for a spectrum compute objectColour first, then labFromXYZ" },
};
/** CIELAB or CIELUV polar form. */
export const LCH_FIELDS: FieldShape = {
  what: "polar values { L, C, h } (h in degrees)",
  keys: ["L", "C", "h"],
};
/** CIELUV. */
export const LUV_FIELDS: FieldShape = {
  what: "CIELUV values { L, u, v }",
  keys: ["L", "u", "v"],
  accepts: (v) => isRecord(v) && finite(v.L) && finite(v.u) && finite(v.v),
};
/** CIE 1931 chromaticity. */
export const XY_FIELDS: FieldShape = {
  what: "a chromaticity { x, y }",
  keys: ["x", "y"],
  accepts: (v) => isRecord(v) && finite(v.x) && finite(v.y),
  instead: { spectrum: "for a spectrum use chromaticityXy(lightTristimulus(spectrum))" },
};
/** Chromaticity and luminance factor. */
export const XYY_FIELDS: FieldShape = {
  what: "a chromaticity with luminance { x, y, Y }",
  keys: ["x", "y", "Y"],
};
/** CIE 1976 u′v′ or CIE 1960 uv. */
export const UV_FIELDS: FieldShape = {
  what: "chromaticity coordinates { u, v }",
  keys: ["u", "v"],
  accepts: (v) => isRecord(v) && finite(v.u) && finite(v.v),
};
/** RGB components. */
export const RGB_FIELDS: FieldShape = {
  what: "RGB values { r, g, b }",
  keys: ["r", "g", "b"],
  accepts: (v) => isRecord(v) && finite(v.r) && finite(v.g) && finite(v.b),
  instead: { array: "for an array [r, g, b] write { r, g, b }" },
};
/** A regular wavelength grid. */
export const GRID_FIELDS: FieldShape = {
  what: "a wavelength grid { start, end, step } in nm",
  keys: ["start", "end", "step"],
};
