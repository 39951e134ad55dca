/** Conversions between CIE XYZ and the RGB values of an RGB space, and the gamut test on RGB values. */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { applyMatrix3 } from "../colorimetry/matrix3.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { RgbSpace } from "./rgb-space.ts";
import { PQ_PEAK_LUMINANCE, transferFunction } from "./transfer-functions.ts";
import { RGB_FIELDS, XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkRgbSpace } from "../arguments/common-arguments.ts";

export interface Rgb {
  readonly r: number;
  readonly g: number;
  readonly b: number;
}

/** The XYZ value that maps to linear RGB 1: Y = 100 (relative), except PQ spaces, which take absolute XYZ in cd/m². */
function xyzScale(space: RgbSpace): number {
  return space.transfer === "PQ" ? PQ_PEAK_LUMINANCE : 100;
}

function noteSpace(space: RgbSpace, encoded: boolean): void {
  const w = space.white;
  noteMethod(
    "rgb encoding",
    `Conversions between XYZ and ${space.name} RGB (${space.source}) used the primaries R (${space.primaries.r.x}, ${space.primaries.r.y}), G (${space.primaries.g.x}, ${space.primaries.g.y}), B (${space.primaries.b.x}, ${space.primaries.b.y}) and white (${w.x}, ${w.y}), with RGB–XYZ matrices derived per SMPTE RP 177-1993${encoded ? ` and ${transferFunction(space.transfer).description}` : "; the RGB values are linear (no transfer function was applied)"}.`,
  );
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
export function rgbFromXYZ(xyz: Tristimulus, space: RgbSpace, options: { encode?: boolean } = {}): Rgb {
  checkFields("rgbFromXYZ", "xyz", xyz, XYZ_FIELDS);
  checkRgbSpace("rgbFromXYZ", "space", space);
  checkOptions("rgbFromXYZ", "options", options, ["encode"]);
  if (typeof xyz !== "object" || xyz === null || ![xyz.X, xyz.Y, xyz.Z].every(Number.isFinite)) {
    throw new Error(
      `rgbFromXYZ: tristimulus values (${xyz?.X}, ${xyz?.Y}, ${xyz?.Z}) must be finite numbers`,
    );
  }
  const s = xyzScale(space);
  const [r, g, b] = applyMatrix3(space.fromXYZ, [xyz.X / s, xyz.Y / s, xyz.Z / s]);
  const encode = options.encode ?? true;
  noteSpace(space, encode);
  if (!encode) return { r, g, b };
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
export function xyzFromRgb(rgb: Rgb, space: RgbSpace, options: { decode?: boolean } = {}): Tristimulus {
  checkFields("xyzFromRgb", "rgb", rgb, RGB_FIELDS);
  checkRgbSpace("xyzFromRgb", "space", space);
  checkOptions("xyzFromRgb", "options", options, ["decode"]);
  if (typeof rgb !== "object" || rgb === null || ![rgb.r, rgb.g, rgb.b].every(Number.isFinite)) {
    throw new Error(`xyzFromRgb: RGB values (${rgb?.r}, ${rgb?.g}, ${rgb?.b}) must be finite numbers`);
  }
  const decode = options.decode ?? true;
  noteSpace(space, decode);
  const t = transferFunction(space.transfer);
  const lin = decode
    ? ([t.decode(rgb.r), t.decode(rgb.g), t.decode(rgb.b)] as const)
    : ([rgb.r, rgb.g, rgb.b] as const);
  const [X, Y, Z] = applyMatrix3(space.toXYZ, lin);
  const s = xyzScale(space);
  return { X: X * s, Y: Y * s, Z: Z * s };
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
  if (typeof rgb !== "object" || rgb === null || ![rgb.r, rgb.g, rgb.b].every(Number.isFinite)) {
    throw new Error(`isInGamut: RGB values (${rgb?.r}, ${rgb?.g}, ${rgb?.b}) must be finite numbers`);
  }
  if (!(Number.isFinite(tolerance) && tolerance >= 0))
    throw new Error(`isInGamut: tolerance ${tolerance} must be a non-negative number`);
  return [rgb.r, rgb.g, rgb.b].every((v) => v >= -tolerance && v <= 1 + tolerance);
}
