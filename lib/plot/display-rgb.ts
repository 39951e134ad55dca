/**
 * Display RGB for drawing (fills, bands, marker colours, swatches): the three display gamuts a report can target,
 * the XYZ → linear RGB matrices derived from their primaries and D65 white (SMPTE RP 177-1993 §3), and the
 * transfer functions CSS uses for them (sRGB piecewise curve, IEC 61966-2-1:1999 §5.2; Display P3 uses the same
 * curve, CSS Color 4 §10.5; rec2020 in CSS uses the BT.2020 OETF constants, ITU-R BT.2020-2 Table 4).
 * Private to lib/plot: drawing only, never used for a reported number.
 */
import type { Chromaticity, Tristimulus } from "../colorimetry/chromaticity.ts";

/** The display gamuts a figure or swatch can target. */
export type DisplayGamut = "sRGB" | "Display P3" | "BT.2020";
export const DISPLAY_GAMUTS: readonly DisplayGamut[] = ["sRGB", "Display P3", "BT.2020"];

export interface Primaries {
  readonly r: Chromaticity;
  readonly g: Chromaticity;
  readonly b: Chromaticity;
  readonly white: Chromaticity;
}

/**
 * Primaries and white as the standards give them (recalled from memory; checked in tests against culori):
 * sRGB: IEC 61966-2-1:1999 (= ITU-R BT.709-6 primaries); Display P3: SMPTE EG 432-1:2010 P3 primaries with D65;
 * BT.2020: ITU-R BT.2020-2 Table 3. White D65 as x = 0.3127, y = 0.3290 (the 4-decimal value these standards use).
 */
export const DISPLAY_PRIMARIES: Readonly<Record<DisplayGamut, Primaries>> = {
  sRGB: { r: { x: 0.64, y: 0.33 }, g: { x: 0.3, y: 0.6 }, b: { x: 0.15, y: 0.06 }, white: { x: 0.3127, y: 0.329 } },
  "Display P3": { r: { x: 0.68, y: 0.32 }, g: { x: 0.265, y: 0.69 }, b: { x: 0.15, y: 0.06 }, white: { x: 0.3127, y: 0.329 } },
  "BT.2020": { r: { x: 0.708, y: 0.292 }, g: { x: 0.17, y: 0.797 }, b: { x: 0.131, y: 0.046 }, white: { x: 0.3127, y: 0.329 } },
};

type Mat3 = [number, number, number, number, number, number, number, number, number];

function invert3(m: Mat3): Mat3 {
  const [a, b, c, d, e, f, g, h, i] = m;
  const A = e * i - f * h, B = -(d * i - f * g), C = d * h - e * g;
  const det = a * A + b * B + c * C;
  if (Math.abs(det) < 1e-12) throw new Error("display primaries are collinear: the RGB → XYZ matrix cannot be inverted");
  return [A / det, -(b * i - c * h) / det, (b * f - c * e) / det, B / det, (a * i - c * g) / det, -(a * f - c * d) / det, C / det, -(a * h - b * g) / det, (a * e - b * d) / det];
}

/** The normalised primary matrix RGB(linear, 0–1) → XYZ (Y of white = 1) from primaries and white (SMPTE RP 177-1993 §3.3). */
export function rgbToXyzMatrix(p: Primaries): Mat3 {
  const col = (c: Chromaticity) => [c.x / c.y, 1, (1 - c.x - c.y) / c.y] as const;
  const [R, G, B, W] = [col(p.r), col(p.g), col(p.b), col(p.white)];
  const P: Mat3 = [R[0], G[0], B[0], R[1], G[1], B[1], R[2], G[2], B[2]];
  const inv = invert3(P);
  const S = [inv[0] * W[0] + inv[1] * W[1] + inv[2] * W[2], inv[3] * W[0] + inv[4] * W[1] + inv[5] * W[2], inv[6] * W[0] + inv[7] * W[1] + inv[8] * W[2]];
  return [P[0] * S[0]!, P[1] * S[1]!, P[2] * S[2]!, P[3] * S[0]!, P[4] * S[1]!, P[5] * S[2]!, P[6] * S[0]!, P[7] * S[1]!, P[8] * S[2]!];
}

const XYZ_TO_RGB = new Map<DisplayGamut, Mat3>();
/** XYZ (Y of white = 1, D65-relative) → linear RGB matrix of a display gamut. */
export function xyzToRgbMatrix(gamut: DisplayGamut): Mat3 {
  let m = XYZ_TO_RGB.get(gamut);
  if (!m) {
    const p = DISPLAY_PRIMARIES[gamut];
    if (!p) throw new Error(`unknown display gamut "${gamut}"; use one of ${DISPLAY_GAMUTS.join(", ")}`);
    m = invert3(rgbToXyzMatrix(p));
    XYZ_TO_RGB.set(gamut, m);
  }
  return m;
}

/** Linear RGB (white = 1) of a D65-relative XYZ given on the Y = 1 scale. */
export function linearRgb(xyz: Tristimulus, gamut: DisplayGamut): [number, number, number] {
  const m = xyzToRgbMatrix(gamut);
  return [m[0] * xyz.X + m[1] * xyz.Y + m[2] * xyz.Z, m[3] * xyz.X + m[4] * xyz.Y + m[5] * xyz.Z, m[6] * xyz.X + m[7] * xyz.Y + m[8] * xyz.Z];
}

/** sRGB transfer (encoding) function, IEC 61966-2-1:1999 eq. (5); odd-extended below zero as CSS Color 4 does. */
export function encodeSrgb(v: number): number {
  const a = Math.abs(v);
  const e = a <= 0.0031308 ? 12.92 * a : 1.055 * a ** (1 / 2.4) - 0.055;
  return Math.sign(v) * e;
}

/** BT.2020 OETF with α = 1.09929682680944, β = 0.018053968510807 (ITU-R BT.2020-2 Table 4; CSS Color 4 rec2020). */
export function encodeBt2020(v: number): number {
  const alpha = 1.09929682680944, beta = 0.018053968510807;
  const a = Math.abs(v);
  const e = a < beta ? 4.5 * a : alpha * a ** 0.45 - (alpha - 1);
  return Math.sign(v) * e;
}

/** Encodes linear RGB with the transfer function CSS uses for that gamut. */
export function encodeRgb(rgb: readonly [number, number, number], gamut: DisplayGamut): [number, number, number] {
  const f = gamut === "BT.2020" ? encodeBt2020 : encodeSrgb;
  return [f(rgb[0]), f(rgb[1]), f(rgb[2])];
}

/** True when linear RGB lies inside the display's cube, with a small tolerance for rounding. */
export function insideCube(rgb: readonly number[], tolerance = 1e-4): boolean {
  return rgb.every((v) => v >= -tolerance && v <= 1 + tolerance);
}

/** #rrggbb from encoded sRGB components, clipped to 0–1. */
export function hexFromEncoded(rgb: readonly number[]): string {
  return "#" + rgb.map((v) => Math.round(Math.min(1, Math.max(0, v)) * 255).toString(16).padStart(2, "0")).join("");
}

/**
 * A displayable sRGB colour for a chromaticity, for orientation only: the brightest colour of that chromaticity the
 * display can show after moving out-of-gamut colours toward white until all channels are ≥ 0 (a simple desaturating
 * clip; common practice, no source). Returns encoded sRGB 0–1.
 */
export function brightDisplayColour(xyz: Tristimulus, gamut: DisplayGamut = "sRGB"): [number, number, number] {
  let rgb = linearRgb(xyz, gamut);
  const lo = Math.min(rgb[0], rgb[1], rgb[2]);
  if (lo < 0) rgb = [rgb[0] - lo, rgb[1] - lo, rgb[2] - lo];
  const hi = Math.max(rgb[0], rgb[1], rgb[2]);
  if (!(hi > 0)) return [0, 0, 0];
  return encodeRgb([rgb[0] / hi, rgb[1] / hi, rgb[2] / hi], gamut);
}
