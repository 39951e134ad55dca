/**
 * Display RGB for drawing (fills, bands, marker colours, swatches): the three display gamuts a report can target,
 * with primaries, white and XYZ → linear RGB matrices from lib/rgb (SMPTE RP 177-1993), and the transfer functions
 * CSS Color 4 uses for them when a browser reads `color(display-p3 …)` / `color(rec2020 …)`: the sRGB curve
 * (IEC 61966-2-1:1999) for sRGB and Display P3, the BT.2020 OETF (ITU-R BT.2020-2 Table 4) for rec2020, which is
 * what Chromium implements (checked in test/browser). Drawing only: nothing here writes to the methods log.
 */
import type { Chromaticity, Tristimulus } from "../colorimetry/chromaticity.ts";
import { rgbSpace } from "../rgb/rgb-space.ts";
import type { Matrix3 } from "../colorimetry/matrix3.ts";

/** The display gamuts a figure or swatch can target. */
export type DisplayGamut = "sRGB" | "Display P3" | "BT.2020";
export const DISPLAY_GAMUTS: readonly DisplayGamut[] = ["sRGB", "Display P3", "BT.2020"];

export interface Primaries {
  readonly r: Chromaticity;
  readonly g: Chromaticity;
  readonly b: Chromaticity;
  readonly white: Chromaticity;
}

function checkGamut(gamut: DisplayGamut): DisplayGamut {
  if (!DISPLAY_GAMUTS.includes(gamut))
    throw new Error(`unknown display gamut "${gamut}"; use one of ${DISPLAY_GAMUTS.join(", ")}`);
  return gamut;
}

/** Primaries and white of a display gamut (IEC 61966-2-1; SMPTE EG 432-1 with D65; ITU-R BT.2020-2), via lib/rgb. */
export function displayPrimaries(gamut: DisplayGamut): Primaries {
  const s = rgbSpace(checkGamut(gamut));
  return { ...s.primaries, white: s.white };
}

// The matrices per gamut, looked up once: the fill calls linearRgb for every pixel.
const FROM_XYZ = new Map<DisplayGamut, Matrix3>();
const TO_XYZ = new Map<DisplayGamut, Matrix3>();

/** Linear RGB (white = 1) of a D65-relative XYZ given on the Y = 1 scale (lib/rgb's RP 177 matrix). */
export function linearRgb(xyz: Tristimulus, gamut: DisplayGamut): [number, number, number] {
  let m = FROM_XYZ.get(gamut);
  if (!m) FROM_XYZ.set(gamut, (m = rgbSpace(checkGamut(gamut)).fromXYZ));
  return [
    m[0][0] * xyz.X + m[0][1] * xyz.Y + m[0][2] * xyz.Z,
    m[1][0] * xyz.X + m[1][1] * xyz.Y + m[1][2] * xyz.Z,
    m[2][0] * xyz.X + m[2][1] * xyz.Y + m[2][2] * xyz.Z,
  ];
}

/** Linear RGB (white = 1) → XYZ on the Y = 1 scale (lib/rgb's RP 177 matrix). */
export function xyzFromLinearRgb(rgb: readonly [number, number, number], gamut: DisplayGamut): Tristimulus {
  let m = TO_XYZ.get(gamut);
  if (!m) TO_XYZ.set(gamut, (m = rgbSpace(checkGamut(gamut)).toXYZ));
  return {
    X: m[0][0] * rgb[0] + m[0][1] * rgb[1] + m[0][2] * rgb[2],
    Y: m[1][0] * rgb[0] + m[1][1] * rgb[1] + m[1][2] * rgb[2],
    Z: m[2][0] * rgb[0] + m[2][1] * rgb[1] + m[2][2] * rgb[2],
  };
}

/** sRGB transfer (encoding) function, IEC 61966-2-1:1999 eq. (5); odd-extended below zero as CSS Color 4 does. */
export function encodeSrgb(v: number): number {
  const a = Math.abs(v);
  const e = a <= 0.0031308 ? 12.92 * a : 1.055 * a ** (1 / 2.4) - 0.055;
  return Math.sign(v) * e;
}

/** BT.2020 OETF with α = 1.09929682680944, β = 0.018053968510807 (ITU-R BT.2020-2 Table 4; CSS Color 4 rec2020). */
export function encodeBt2020(v: number): number {
  const alpha = 1.09929682680944,
    beta = 0.018053968510807;
  const a = Math.abs(v);
  const e = a < beta ? 4.5 * a : alpha * a ** 0.45 - (alpha - 1);
  return Math.sign(v) * e;
}

/** Encodes linear RGB with the transfer function CSS uses for that gamut. */
export function encodeRgb(
  rgb: readonly [number, number, number],
  gamut: DisplayGamut,
): [number, number, number] {
  const f = gamut === "BT.2020" ? encodeBt2020 : encodeSrgb;
  return [f(rgb[0]), f(rgb[1]), f(rgb[2])];
}

/** True when linear RGB lies inside the display's cube, with a small tolerance for rounding. */
export function insideCube(rgb: readonly number[], tolerance = 1e-4): boolean {
  return rgb.every((v) => v >= -tolerance && v <= 1 + tolerance);
}

/** #rrggbb from encoded sRGB components, clipped to 0–1. */
export function hexFromEncoded(rgb: readonly number[]): string {
  return (
    "#" +
    rgb
      .map((v) =>
        Math.round(Math.min(1, Math.max(0, v)) * 255)
          .toString(16)
          .padStart(2, "0"),
      )
      .join("")
  );
}

/**
 * A displayable sRGB colour for a chromaticity, for orientation only: the brightest colour of that chromaticity the
 * display can show after moving out-of-gamut colours toward white until all channels are ≥ 0 (a simple desaturating
 * clip; common practice, no source). Returns encoded sRGB 0–1.
 */
export function brightDisplayColour(
  xyz: Tristimulus,
  gamut: DisplayGamut = "sRGB",
): [number, number, number] {
  let rgb = linearRgb(xyz, gamut);
  const lo = Math.min(rgb[0], rgb[1], rgb[2]);
  if (lo < 0) rgb = [rgb[0] - lo, rgb[1] - lo, rgb[2] - lo];
  const hi = Math.max(rgb[0], rgb[1], rgb[2]);
  if (!(hi > 0)) return [0, 0, 0];
  return encodeRgb([rgb[0] / hi, rgb[1] / hi, rgb[2] / hi], gamut);
}
