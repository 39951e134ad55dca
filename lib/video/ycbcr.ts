/**
 * Y′CbCr from non-linear R′G′B′ signals and back, with the luma coefficients of ITU-R BT.709-6 (Kr 0.2126, Kb 0.0722)
 * and of ITU-R BT.2020-2 / BT.2100-2 (Kr 0.2627, Kb 0.0593; the non-constant-luminance Y′CbCr of both).
 */
import { RGB_FIELDS, checkFields, type FieldShape } from "../arguments/check-fields.ts";
import { checkChoice } from "../arguments/check-text.ts";
import type { Rgb } from "../rgb/rgb-conversion.ts";

/** Which standard's luma coefficients a Y′CbCr signal uses. */
export type LumaCoefficients = "BT.709" | "BT.2020" | "BT.2100";

/** A Y′CbCr signal: luma Y′ 0–1 and colour differences Cb, Cr −0.5 to 0.5. */
export interface Ycbcr {
  readonly Y: number;
  readonly Cb: number;
  readonly Cr: number;
}

/** Y′CbCr signal values. */
export const YCBCR_FIELDS: FieldShape = {
  what: "a Y′CbCr signal { Y, Cb, Cr } (Y 0–1, Cb and Cr −0.5 to 0.5)",
  keys: ["Y", "Cb", "Cr"],
};

const COEFFICIENTS: Record<LumaCoefficients, readonly [number, number]> = {
  // ITU-R BT.709-6 Part 2 §3.2–3.3.
  "BT.709": [0.2126, 0.0722],
  // ITU-R BT.2020-2 Table 4; ITU-R BT.2100-2 Table 8 (non-constant luminance).
  "BT.2020": [0.2627, 0.0593],
  "BT.2100": [0.2627, 0.0593],
};
const STANDARDS = Object.keys(COEFFICIENTS);

function coefficients(fn: string, standard: unknown): readonly [number, number] {
  checkChoice(fn, "standard", standard, STANDARDS, { what: "the standard whose luma coefficients apply" });
  return COEFFICIENTS[standard as LumaCoefficients];
}

/**
 * Y′CbCr of an R′G′B′ signal: Y′ = Kr·R′ + (1 − Kr − Kb)·G′ + Kb·B′, Cb = (B′ − Y′) ÷ 2(1 − Kb), Cr = (R′ − Y′) ÷ 2(1 − Kr).
 *
 * @param rgb The non-linear signal { r, g, b }, each 0–1 (after the OETF or inverse EOTF).
 * @param standard "BT.709", "BT.2020" or "BT.2100" (BT.2020 and BT.2100 share Kr 0.2627, Kb 0.0593).
 * @returns { Y, Cb, Cr }: Y′ 0–1, Cb and Cr −0.5 to 0.5.
 * @source ITU-R BT.709-6 Part 2 §3; ITU-R BT.2020-2 Table 4; ITU-R BT.2100-2 Table 8.
 * @example ycbcrFromRgbSignal({ r: 0.75, g: 0.75, b: 0 }, "BT.709")
 */
export function ycbcrFromRgbSignal(rgb: Rgb, standard: LumaCoefficients): Ycbcr {
  checkFields("ycbcrFromRgbSignal", "rgb", rgb, RGB_FIELDS);
  const [kr, kb] = coefficients("ycbcrFromRgbSignal", standard);
  const Y = kr * rgb.r + (1 - kr - kb) * rgb.g + kb * rgb.b;
  return { Y, Cb: (rgb.b - Y) / (2 * (1 - kb)), Cr: (rgb.r - Y) / (2 * (1 - kr)) };
}

/**
 * R′G′B′ of a Y′CbCr signal: the inverse of `ycbcrFromRgbSignal`.
 *
 * @param ycbcr { Y, Cb, Cr }: Y′ 0–1, Cb and Cr −0.5 to 0.5.
 * @param standard "BT.709", "BT.2020" or "BT.2100".
 * @returns The non-linear signal { r, g, b }.
 * @source ITU-R BT.709-6 Part 2 §3; ITU-R BT.2020-2 Table 4; ITU-R BT.2100-2 Table 8 (inverted).
 * @example rgbSignalFromYcbcr({ Y: 0.5, Cb: 0, Cr: 0.1 }, "BT.2100")
 */
export function rgbSignalFromYcbcr(ycbcr: Ycbcr, standard: LumaCoefficients): Rgb {
  checkFields("rgbSignalFromYcbcr", "ycbcr", ycbcr, YCBCR_FIELDS);
  const [kr, kb] = coefficients("rgbSignalFromYcbcr", standard);
  const r = ycbcr.Y + 2 * (1 - kr) * ycbcr.Cr;
  const b = ycbcr.Y + 2 * (1 - kb) * ycbcr.Cb;
  const g = (ycbcr.Y - kr * r - kb * b) / (1 - kr - kb);
  return { r, g, b };
}
