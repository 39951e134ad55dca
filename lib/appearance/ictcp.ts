/**
 * ICtCp of ITU-R BT.2100-2 (Table 6 and 7): linear BT.2020 RGB → LMS (the integer matrix over 4096) → PQ or HLG
 * non-linearity → I, Ct, Cp. PQ ICtCp takes display light in cd/m²; HLG ICtCp takes normalised scene light 0–1.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { applyMatrix3, invertMatrix3, type Matrix3 } from "../colorimetry/matrix3.ts";
import { checkFields } from "../arguments/check-fields.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { noteMethod } from "../methods/method-log.ts";
import { rgbSpace } from "../rgb/rgb-space.ts";
import { hlgDecode, hlgEncode, pqDecode, pqEncode } from "../rgb/transfer-functions.ts";
import type { Rgb } from "../rgb/rgb-conversion.ts";
import { ABSOLUTE_XYZ_FIELDS, ICTCP_FIELDS, LINEAR_RGB_FIELDS } from "./check-values.ts";

/** ICtCp values: intensity I (0–1) and the two chroma components Ct, Cp (about −0.5 to 0.5). */
export interface Ictcp {
  readonly I: number;
  readonly Ct: number;
  readonly Cp: number;
}

/** Which BT.2100 non-linearity ICtCp is built on. */
export interface IctcpOptions {
  /** "PQ" (display light in cd/m²) or "HLG" (normalised scene light 0–1); default "PQ". */
  transfer?: "PQ" | "HLG";
}

const over4096 = (m: number[][]): Matrix3 => m.map((row) => row.map((v) => v / 4096)) as unknown as Matrix3;

// ITU-R BT.2100-2 Table 6: linear RGB (BT.2020 primaries) → LMS.
const RGB_TO_LMS = over4096([
  [1688, 2146, 262],
  [683, 2951, 462],
  [99, 309, 3688],
]);
// ITU-R BT.2100-2 Table 6: L′M′S′ → ICtCp, for PQ and for HLG.
const PQ_LMS_TO_ICTCP = over4096([
  [2048, 2048, 0],
  [6610, -13613, 7003],
  [17933, -17390, -543],
]);
const HLG_LMS_TO_ICTCP = over4096([
  [2048, 2048, 0],
  [3625, -7465, 3840],
  [9500, -9212, -288],
]);
const LMS_TO_RGB = invertMatrix3(RGB_TO_LMS, "the BT.2100 RGB-to-LMS matrix");
const PQ_ICTCP_TO_LMS = invertMatrix3(PQ_LMS_TO_ICTCP, "the BT.2100 PQ ICtCp matrix");
const HLG_ICTCP_TO_LMS = invertMatrix3(HLG_LMS_TO_ICTCP, "the BT.2100 HLG ICtCp matrix");

const STATEMENT = {
  PQ: "ICtCp was computed per ITU-R BT.2100-2 (BT.2020 primaries, D65, LMS matrix of Table 6, PQ non-linearity of SMPTE ST 2084) from absolute display light in cd/m².",
  HLG: "ICtCp was computed per ITU-R BT.2100-2 (BT.2020 primaries, D65, LMS matrix of Table 6, HLG non-linearity) from normalised scene light.",
} as const;

function transferOf(fn: string, options: IctcpOptions): "PQ" | "HLG" {
  checkOptions(fn, "options", options, ["transfer"]);
  checkChoice(fn, "options.transfer", options.transfer, ["PQ", "HLG"], { optional: true });
  return options.transfer ?? "PQ";
}

/**
 * ICtCp from BT.2100 linear RGB: LMS = M·RGB, L′M′S′ = PQ or HLG of LMS, then the ICtCp matrix.
 *
 * @param rgb Linear RGB with BT.2020 primaries: display light in cd/m² for PQ (0–10000), scene light 0–1 for HLG.
 * @param options.transfer "PQ" or "HLG"; default "PQ".
 * @returns { I, Ct, Cp }.
 * @source ITU-R BT.2100-2 (07/2018) Table 6 (PQ and HLG ICtCp).
 * @example ictcpFromLinearRgb({ r: 100, g: 100, b: 100 })
 */
export function ictcpFromLinearRgb(rgb: Rgb, options: IctcpOptions = {}): Ictcp {
  checkFields("ictcpFromLinearRgb", "rgb", rgb, LINEAR_RGB_FIELDS);
  const transfer = transferOf("ictcpFromLinearRgb", options);
  noteMethod("colour space", STATEMENT[transfer]);
  const lms = applyMatrix3(RGB_TO_LMS, [rgb.r, rgb.g, rgb.b]);
  const f = transfer === "PQ" ? pqEncode : hlgEncode;
  const p = [f(lms[0]), f(lms[1]), f(lms[2])] as const;
  const [I, Ct, Cp] = applyMatrix3(transfer === "PQ" ? PQ_LMS_TO_ICTCP : HLG_LMS_TO_ICTCP, p);
  return { I, Ct, Cp };
}

/**
 * BT.2100 linear RGB from ICtCp: the inverse of `ictcpFromLinearRgb`.
 *
 * @param ictcp { I, Ct, Cp }.
 * @param options.transfer "PQ" or "HLG"; default "PQ".
 * @returns Linear RGB { r, g, b } with BT.2020 primaries: cd/m² for PQ, scene light 0–1 for HLG.
 * @source ITU-R BT.2100-2 (07/2018) Table 6, inverted.
 * @example linearRgbFromIctcp({ I: 0.5081, Ct: 0, Cp: 0 })
 */
export function linearRgbFromIctcp(ictcp: Ictcp, options: IctcpOptions = {}): Rgb {
  checkFields("linearRgbFromIctcp", "ictcp", ictcp, ICTCP_FIELDS);
  const transfer = transferOf("linearRgbFromIctcp", options);
  noteMethod("colour space", STATEMENT[transfer]);
  const p = applyMatrix3(transfer === "PQ" ? PQ_ICTCP_TO_LMS : HLG_ICTCP_TO_LMS, [
    ictcp.I,
    ictcp.Ct,
    ictcp.Cp,
  ]);
  const f = transfer === "PQ" ? pqDecode : hlgDecode;
  const [r, g, b] = applyMatrix3(LMS_TO_RGB, [f(p[0]), f(p[1]), f(p[2])]);
  return { r, g, b };
}

/**
 * PQ ICtCp of absolute XYZ (D65-relative, cd/m²): XYZ → BT.2020 linear RGB (SMPTE RP 177 matrix) → ICtCp.
 *
 * @param xyz Absolute tristimulus values { X, Y, Z } in cd/m², relative to a D65 white.
 * @returns { I, Ct, Cp } (PQ).
 * @source ITU-R BT.2100-2 Table 6; BT.2020 primaries of ITU-R BT.2020-2.
 * @example ictcpFromXYZ({ X: 95.047, Y: 100, Z: 108.883 })
 */
export function ictcpFromXYZ(xyz: Tristimulus): Ictcp {
  checkFields("ictcpFromXYZ", "xyz", xyz, ABSOLUTE_XYZ_FIELDS);
  const [r, g, b] = applyMatrix3(rgbSpace("BT.2020").fromXYZ, [xyz.X, xyz.Y, xyz.Z]);
  return ictcpFromLinearRgb({ r, g, b });
}

/**
 * Absolute XYZ (cd/m², D65-relative) from PQ ICtCp: the inverse of `ictcpFromXYZ`.
 *
 * @param ictcp { I, Ct, Cp } (PQ).
 * @returns Absolute tristimulus values { X, Y, Z } in cd/m².
 * @source ITU-R BT.2100-2 Table 6, inverted; BT.2020 primaries.
 * @example xyzFromIctcp({ I: 0.5081, Ct: 0, Cp: 0 })
 */
export function xyzFromIctcp(ictcp: Ictcp): Tristimulus {
  checkFields("xyzFromIctcp", "ictcp", ictcp, ICTCP_FIELDS);
  const rgb = linearRgbFromIctcp(ictcp);
  const [X, Y, Z] = applyMatrix3(rgbSpace("BT.2020").toXYZ, [rgb.r, rgb.g, rgb.b]);
  return { X, Y, Z };
}
