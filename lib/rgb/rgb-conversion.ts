/** Conversions between CIE XYZ and the RGB values of an RGB space, and the gamut test on RGB values. */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { RgbSpace } from "./rgb-space.ts";
import { srgbDecodeChecked, srgbEncodeChecked } from "./srgb-curve.ts";
import { PQ_PEAK_LUMINANCE, transferFunction } from "./transfer-functions.ts";
import { RGB_FIELDS, XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkRgbSpace } from "../arguments/common-arguments.ts";
import { isPlainXyz } from "../arguments/plain-tristimulus.ts";

export interface Rgb {
  readonly r: number;
  readonly g: number;
  readonly b: number;
}

/** The XYZ value that maps to linear RGB 1: Y = 100 (relative), except PQ spaces, which take absolute XYZ in cd/m². */
function xyzScale(space: RgbSpace): number {
  return space.transfer === "PQ" ? PQ_PEAK_LUMINANCE : 100;
}

function spaceStatement(space: RgbSpace, encoded: boolean): string {
  const w = space.white;
  return `Conversions between XYZ and ${space.name} RGB (${space.source}) used the primaries R (${space.primaries.r.x}, ${space.primaries.r.y}), G (${space.primaries.g.x}, ${space.primaries.g.y}), B (${space.primaries.b.x}, ${space.primaries.b.y}) and white (${w.x}, ${w.y}), with RGB–XYZ matrices derived per SMPTE RP 177-1993${encoded ? ` and ${transferFunction(space.transfer).description}` : "; the RGB values are linear (no transfer function was applied)"}.`;
}

// The statement per space and per encoded/linear, built once: the conversions run in loops over many colours, and
// building the sentence cost more than the conversion. The log itself keeps each statement once (noteMethod).
const statements = new WeakMap<RgbSpace, { encoded?: string; linear?: string }>();

// The default options, shared (an object literal as default would be allocated on every call).
const NO_OPTIONS: { readonly encode?: boolean; readonly decode?: boolean } = Object.freeze({});

// The common case of each argument check, written out here so that it inlines into a cell's loop: the shared checks
// (checkFields, checkRgbSpace) see every shape the library checks, and there their field reads and the call of the
// shape's test are slow polymorphic operations that cost more than the conversion. Each test accepts exactly what
// the shared check accepts; anything else goes to the shared check, which throws naming what is wrong.
function isPlainRgb(v: Rgb): boolean {
  return (
    typeof v === "object" &&
    v !== null &&
    Number.isFinite(v.r) &&
    Number.isFinite(v.g) &&
    Number.isFinite(v.b) &&
    !Array.isArray(v)
  );
}
function isSpace(v: RgbSpace): boolean {
  return typeof v === "object" && v !== null && v.kind === "rgb space";
}

let lastSpace: RgbSpace | undefined;
let lastStatements: { encoded?: string; linear?: string } = {};

function noteSpace(space: RgbSpace, encoded: boolean): void {
  let cached = space === lastSpace ? lastStatements : statements.get(space);
  if (cached === undefined) statements.set(space, (cached = {}));
  lastSpace = space;
  lastStatements = cached;
  const statement = encoded
    ? (cached.encoded ??= spaceStatement(space, true))
    : (cached.linear ??= spaceStatement(space, false));
  noteMethod("rgb encoding", statement);
}

/**
 * RGB values of a colour in an RGB space: linear RGB = M⁻¹·XYZ, then encoded by the space's transfer function unless `encode: false`.
 *
 * XYZ must be relative to the space's white (adapt it first with `adaptXYZ` if it is not). Values may fall outside
 * 0–1 (see `isInGamut`).
 *
 * @param xyz Tristimulus values on the Y = 100 scale (white Y = 100); for PQ spaces absolute XYZ in cd/m².
 * @param space An `RgbSpace` (from `rgbSpace` or `rgbSpaceFromPrimaries`).
 * @param options.encode Apply the space's transfer function; default true (false gives linear RGB).
 * @returns { r, g, b }, 0–1 inside the gamut.
 * @source SMPTE RP 177-1993 (matrices from primaries and white); the space's transfer function standard.
 * @example rgbFromXYZ({ X: 41.24, Y: 21.26, Z: 1.93 }, rgbSpace("sRGB"))
 */
export function rgbFromXYZ(
  xyz: Tristimulus,
  space: RgbSpace,
  options: { encode?: boolean } = NO_OPTIONS,
): Rgb {
  if (!isPlainXyz(xyz)) checkFields("rgbFromXYZ", "xyz", xyz, XYZ_FIELDS);
  if (!isSpace(space)) checkRgbSpace("rgbFromXYZ", "space", space);
  if (options !== NO_OPTIONS) checkOptions("rgbFromXYZ", "options", options, ["encode"]);
  const s = xyzScale(space);
  const m = space.fromXYZ;
  const X = xyz.X / s,
    Y = xyz.Y / s,
    Z = xyz.Z / s;
  const r = m[0][0] * X + m[0][1] * Y + m[0][2] * Z,
    g = m[1][0] * X + m[1][1] * Y + m[1][2] * Z,
    b = m[2][0] * X + m[2][1] * Y + m[2][2] * Z;
  const encode = options.encode ?? true;
  noteSpace(space, encode);
  if (!encode) return { r, g, b };
  // sRGB, the common case, without checking each finite channel again (the XYZ fields were checked).
  if (space.transfer === "sRGB")
    return { r: srgbEncodeChecked(r), g: srgbEncodeChecked(g), b: srgbEncodeChecked(b) };
  const t = transferFunction(space.transfer);
  return { r: t.encode(r), g: t.encode(g), b: t.encode(b) };
}

/**
 * Tristimulus values of RGB values in a space: decoded by its transfer function unless `decode: false`, then XYZ = M·RGB.
 *
 * @param rgb { r, g, b }, encoded (or linear with `decode: false`).
 * @param space An `RgbSpace`.
 * @param options.decode Apply the space's inverse transfer function first; default true.
 * @returns { X, Y, Z } on the Y = 100 scale (white Y = 100); cd/m² for PQ spaces.
 * @source SMPTE RP 177-1993; the space's transfer function standard.
 * @example xyzFromRgb({ r: 1, g: 0, b: 0 }, rgbSpace("sRGB"))
 */
export function xyzFromRgb(
  rgb: Rgb,
  space: RgbSpace,
  options: { decode?: boolean } = NO_OPTIONS,
): Tristimulus {
  if (!isPlainRgb(rgb)) checkFields("xyzFromRgb", "rgb", rgb, RGB_FIELDS);
  if (!isSpace(space)) checkRgbSpace("xyzFromRgb", "space", space);
  if (options !== NO_OPTIONS) checkOptions("xyzFromRgb", "options", options, ["decode"]);
  const decode = options.decode ?? true;
  noteSpace(space, decode);
  let r = rgb.r,
    g = rgb.g,
    b = rgb.b;
  if (decode && space.transfer === "sRGB") {
    // The common case, without checking each channel again (the RGB fields were checked).
    r = srgbDecodeChecked(r);
    g = srgbDecodeChecked(g);
    b = srgbDecodeChecked(b);
  } else if (decode) {
    const t = transferFunction(space.transfer);
    r = t.decode(r);
    g = t.decode(g);
    b = t.decode(b);
  }
  const m = space.toXYZ;
  const s = xyzScale(space);
  return {
    X: (m[0][0] * r + m[0][1] * g + m[0][2] * b) * s,
    Y: (m[1][0] * r + m[1][1] * g + m[1][2] * b) * s,
    Z: (m[2][0] * r + m[2][1] * g + m[2][2] * b) * s,
  };
}

/**
 * True when every channel lies in 0–1 within the tolerance; works on linear or encoded values alike.
 *
 * @param rgb { r, g, b }, finite.
 * @param tolerance How far outside 0–1 a channel may be, to absorb rounding in measured data; default 1e-6.
 * @returns true inside the gamut.
 * @source none: a tristim helper, no published formula.
 * @example isInGamut(rgbFromXYZ({ X: 20, Y: 30, Z: 10 }, rgbSpace("sRGB")))
 */
export function isInGamut(rgb: Rgb, tolerance = 1e-6): boolean {
  checkFields("isInGamut", "rgb", rgb, RGB_FIELDS);
  checkNumber("isInGamut", "tolerance", tolerance, { min: 0 });
  if (!(Number.isFinite(tolerance) && tolerance >= 0))
    throw new Error(`isInGamut: tolerance ${tolerance} must be a non-negative number`);
  return [rgb.r, rgb.g, rgb.b].every((v) => v >= -tolerance && v <= 1 + tolerance);
}
