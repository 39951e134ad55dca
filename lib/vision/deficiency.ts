/**
 * Simulation of colour-vision deficiency: dichromats by Brettel, Viénot & Mollon (1997) and by the single-plane
 * matrix of Viénot, Brettel & Mollon (1999); anomalous trichromats at a severity by Machado, Oliveira & Fernandes
 * (2009). All work on linear sRGB (D65 white); XYZ and spectra are taken there and back.
 */
import { noteMethod } from "../methods/method-log.ts";
import { CIE_1931_2_DEGREE } from "../observers/standard-observer.ts";
import {
  applyMatrix3,
  invertMatrix3,
  multiplyMatrix3,
  type Matrix3,
  type Vector3,
} from "../colorimetry/matrix3.ts";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { rgbSpace } from "../rgb/rgb-space.ts";
import { transferFunction } from "../rgb/transfer-functions.ts";
import type { Rgb } from "../rgb/rgb-conversion.ts";
import { lightTristimulus, tristimulus } from "../colorimetry/tristimulus.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { MACHADO_2009_MATRICES } from "../data/machado-2009-cvd.ts";
import { CIE_2006_LMS_2_DEGREE } from "./cone-fundamentals.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkFields, RGB_FIELDS, XYZ_FIELDS } from "../arguments/check-fields.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";

/** Which cone class is missing (dichromat) or altered (anomalous trichromat). */
export type Deficiency = "protan" | "deutan" | "tritan";
/** The published simulation method. */
export type DeficiencyMethod = "Brettel 1997" | "Viénot 1999" | "Machado 2009";

const DEFICIENCIES = ["protan", "deutan", "tritan"] as const;
const METHODS = ["Brettel 1997", "Viénot 1999", "Machado 2009"] as const;

export interface DeficiencyOptions {
  /** "Machado 2009" (default), "Brettel 1997" or "Viénot 1999". */
  method?: DeficiencyMethod;
  /**
   * Severity 0–1 for "Machado 2009" (0 normal, 1 the dichromat; default 1). Brettel and Viénot simulate the
   * dichromat only, so they accept only 1.
   */
  severity?: number;
}

// ---- LMS of linear sRGB -------------------------------------------------------------------------------------------

/**
 * XYZ (CIE 1931) → LMS (CIE 2006 2°): the least-squares fit l̄m̄s̄ ≈ A·x̄ȳz̄ over 390–780 nm at 5 nm. Computed once.
 */
function fitXyzToLms(): Matrix3 {
  const f = CIE_2006_LMS_2_DEGREE;
  const o = CIE_1931_2_DEGREE;
  const X: number[][] = [];
  const T: number[][] = [[], [], []];
  for (let i = 0; i < f.wavelengths.length; i++) {
    const w = f.wavelengths[i]!;
    if (w > 780) break;
    const j = (w - o.start) / o.step;
    X.push([o.xBar[j]!, o.yBar[j]!, o.zBar[j]!]);
    T[0]!.push(f.l[i]!);
    T[1]!.push(f.m[i]!);
    T[2]!.push(f.s[i]!);
  }
  // Normal equations (XᵀX) a = Xᵀt per cone.
  const xtx = [0, 1, 2].map((r) => [0, 1, 2].map((c) => X.reduce((s, row) => s + row[r]! * row[c]!, 0)));
  const inv = invertMatrix3(xtx as unknown as Matrix3, "XᵀX of the CIE 1931 colour-matching functions");
  const rows = T.map((t) => {
    const xt: Vector3 = [0, 1, 2].map((r) =>
      X.reduce((s, row, k) => s + row[r]! * t[k]!, 0),
    ) as unknown as Vector3;
    return applyMatrix3(inv, xt);
  });
  return rows as unknown as Matrix3;
}

let cache:
  | {
      xyzToLms: Matrix3;
      rgbToLms: Matrix3;
      lmsToRgb: Matrix3;
      white: Vector3;
      anchor: (w: number) => Vector3;
    }
  | undefined;

function lmsSpace() {
  if (cache) return cache;
  const srgb = rgbSpace("sRGB");
  const xyzToLms = fitXyzToLms();
  const rgbToLms = multiplyMatrix3(xyzToLms, srgb.toXYZ);
  const lmsToRgb = invertMatrix3(rgbToLms, "linear sRGB → LMS");
  const white = applyMatrix3(rgbToLms, [1, 1, 1]);
  const o = CIE_1931_2_DEGREE;
  const anchor = (w: number): Vector3 => {
    const j = (w - o.start) / o.step;
    return applyMatrix3(xyzToLms, [o.xBar[j]!, o.yBar[j]!, o.zBar[j]!]);
  };
  cache = { xyzToLms, rgbToLms, lmsToRgb, white, anchor };
  return cache;
}

/**
 * The 3 × 3 matrix from CIE 1931 XYZ to CIE 2006 2° LMS used by the deficiency simulations: a least-squares fit of l̄, m̄, s̄ to x̄, ȳ, z̄.
 *
 * @returns The matrix (rows L, M, S) taking XYZ to cone excitations on the table's energy scale.
 * @source CIE 170-1:2006 (cone fundamentals) and CIE 018:2019 (CIE 1931 observer); the least-squares fit over 390–780 nm at 5 nm is a tristim choice, common practice with no source.
 * @example xyzToLmsMatrix()[0]
 */
export function xyzToLmsMatrix(): Matrix3 {
  return lmsSpace().xyzToLms;
}

const cross = (a: Vector3, b: Vector3): Vector3 => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
];
const dot = (a: Vector3, b: Vector3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const missing = (d: Deficiency): 0 | 1 | 2 => (d === "protan" ? 0 : d === "deutan" ? 1 : 2);

/** The LMS matrix that replaces cone `k` so that every colour lies on the plane through black, `white` and `anchor`. */
function planeProjection(k: 0 | 1 | 2, white: Vector3, anchor: Vector3): Matrix3 {
  const n = cross(white, anchor);
  const rows: number[][] = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  rows[k] = [0, 1, 2].map((j) => (j === k ? 0 : -n[j]! / n[k]!));
  return rows as unknown as Matrix3;
}

// ---- the three methods on linear sRGB --------------------------------------------------------------------------------

/** Brettel 1997 anchors: 475 and 575 nm for protan and deutan, 485 and 660 nm for tritan (Brettel et al. 1997 §3). */
const BRETTEL_ANCHORS: Record<Deficiency, readonly [number, number]> = {
  protan: [475, 575],
  deutan: [475, 575],
  tritan: [485, 660],
};

function brettelLinear(rgb: Vector3, d: Deficiency): Vector3 {
  const sp = lmsSpace();
  const k = missing(d);
  const q = applyMatrix3(sp.rgbToLms, rgb);
  const [a1, a2] = BRETTEL_ANCHORS[d].map(sp.anchor) as [Vector3, Vector3];
  // The two half-planes meet on the neutral axis; the plane through the neutral axis and the missing cone's axis
  // separates them (equivalent to Brettel's comparison of cone ratios with the white's).
  const axis: Vector3 = [k === 0 ? 1 : 0, k === 1 ? 1 : 0, k === 2 ? 1 : 0];
  const sep = cross(sp.white, axis);
  const side = Math.sign(dot(sep, q));
  const anchor = side === Math.sign(dot(sep, a1)) || side === 0 ? a1 : a2;
  const p = applyMatrix3(planeProjection(k, sp.white, anchor), q);
  return applyMatrix3(sp.lmsToRgb, p);
}

/** Viénot 1999 plane: through black, white and the display's blue primary (so also its yellow); tritan by its red primary. */
function viénotLinearMatrix(d: Deficiency): Matrix3 {
  const sp = lmsSpace();
  const k = missing(d);
  const anchor = applyMatrix3(sp.rgbToLms, d === "tritan" ? [1, 0, 0] : [0, 0, 1]);
  return multiplyMatrix3(sp.lmsToRgb, multiplyMatrix3(planeProjection(k, sp.white, anchor), sp.rgbToLms));
}

function machadoLinearMatrix(d: Deficiency, severity: number): Matrix3 {
  const table = MACHADO_2009_MATRICES[d];
  const identity: Matrix3 = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  const at = (i: number): Matrix3 => (i === 0 ? identity : table[i - 1]!);
  const u = severity * 10;
  const i = Math.min(Math.floor(u + 1e-9), 9);
  const t = u - i;
  const a = at(i),
    b = at(Math.min(i + 1, 10));
  return [0, 1, 2].map((r) =>
    [0, 1, 2].map((c) => a[r]![c]! + t * (b[r]![c]! - a[r]![c]!)),
  ) as unknown as Matrix3;
}

const STATEMENTS: Record<DeficiencyMethod, string> = {
  "Brettel 1997":
    "Dichromatic vision was simulated by the method of Brettel, Viénot and Mollon (1997) on linear sRGB: the missing cone's signal was replaced so that each colour falls on one of two half-planes through the sRGB white and the spectral stimuli at 475 and 575 nm (protan, deutan) or 485 and 660 nm (tritan), in CIE 2006 2° LMS fitted to CIE 1931 XYZ by least squares.",
  "Viénot 1999":
    "Dichromatic vision was simulated by the single-plane matrix of Viénot, Brettel and Mollon (1999) on linear sRGB: the plane through black, the sRGB white and the sRGB blue primary (protan, deutan), in CIE 2006 2° LMS fitted to CIE 1931 XYZ by least squares; for tritan the plane through the red primary was used, which is not in the 1999 paper.",
  "Machado 2009":
    "Colour-vision deficiency was simulated by the matrices of Machado, Oliveira and Fernandes (2009) on linear sRGB, linearly interpolated between the tabulated severities 0, 0.1, … 1.",
};

function checkDeficiencyArgs(fn: string, deficiency: unknown, options: unknown): Required<DeficiencyOptions> {
  checkChoice(fn, "deficiency", deficiency, DEFICIENCIES);
  checkOptions(fn, "options", options, ["method", "severity"]);
  const o = (options ?? {}) as DeficiencyOptions;
  checkChoice(fn, "options.method", o.method, METHODS, { optional: true });
  checkNumber(fn, "options.severity", o.severity, { optional: true, min: 0, max: 1 });
  const method = o.method ?? "Machado 2009";
  const severity = o.severity ?? 1;
  if (method !== "Machado 2009" && severity !== 1)
    throw new Error(
      `${fn}: the ${method} method simulates dichromats only (severity 1); for severity ${severity} use method "Machado 2009"`,
    );
  return { method, severity };
}

function simulateLinear(rgb: Vector3, d: Deficiency, o: Required<DeficiencyOptions>): Vector3 {
  noteMethod("colour space", STATEMENTS[o.method]);
  if (o.method === "Brettel 1997") return brettelLinear(rgb, d);
  const m = o.method === "Viénot 1999" ? viénotLinearMatrix(d) : machadoLinearMatrix(d, o.severity);
  return applyMatrix3(m, rgb);
}

/**
 * The single 3 × 3 simulation matrix on linear sRGB for a deficiency: Machado et al. 2009 at a severity, or the Viénot et al. 1999 dichromat plane.
 *
 * @param deficiency "protan", "deutan" or "tritan".
 * @param options.method "Machado 2009" (default) or "Viénot 1999" ("Brettel 1997" uses two half-planes, so it has no single matrix).
 * @param options.severity Severity 0–1 for Machado (default 1); Viénot accepts only 1.
 * @returns The matrix (rows) that takes linear sRGB to the simulated linear sRGB.
 * @source Machado, Oliveira & Fernandes, IEEE TVCG 15(6) 2009 1291–1298 (tabulated matrices, linear interpolation between severities as the authors advise); Viénot, Brettel & Mollon, Color Res. Appl. 24(4) 1999 243–252.
 * @example deficiencyMatrix("deutan", { severity: 0.6 })
 */
export function deficiencyMatrix(deficiency: Deficiency, options: DeficiencyOptions = {}): Matrix3 {
  const o = checkDeficiencyArgs("deficiencyMatrix", deficiency, options);
  if (o.method === "Brettel 1997")
    throw new Error(
      'deficiencyMatrix: Brettel 1997 projects onto two half-planes, so it has no single matrix; use "Viénot 1999" or simulateDeficiencyRgb',
    );
  noteMethod("colour space", STATEMENTS[o.method]);
  return o.method === "Viénot 1999"
    ? viénotLinearMatrix(deficiency)
    : machadoLinearMatrix(deficiency, o.severity);
}

/**
 * An sRGB colour as seen with a colour-vision deficiency: decoded, simulated on linear sRGB, encoded, and clipped to 0–1.
 *
 * @param rgb Encoded sRGB { r, g, b }, 0–1.
 * @param deficiency "protan", "deutan" or "tritan".
 * @param options.method "Machado 2009" (default), "Brettel 1997" or "Viénot 1999".
 * @param options.severity Severity 0–1 for Machado (default 1, the dichromat).
 * @returns The simulated encoded sRGB { r, g, b }, each clipped to 0–1 (common practice for display).
 * @source Brettel, Viénot & Mollon, J. Opt. Soc. Am. A 14(10) 1997 2647–2655; Viénot, Brettel & Mollon, Color Res. Appl. 24(4) 1999; Machado, Oliveira & Fernandes, IEEE TVCG 15(6) 2009; IEC 61966-2-1 (sRGB).
 * @example simulateDeficiencyRgb({ r: 0.8, g: 0.2, b: 0.2 }, "deutan", { severity: 0.6 })
 */
export function simulateDeficiencyRgb(
  rgb: Rgb,
  deficiency: Deficiency,
  options: DeficiencyOptions = {},
): Rgb {
  checkFields("simulateDeficiencyRgb", "rgb", rgb, RGB_FIELDS);
  const o = checkDeficiencyArgs("simulateDeficiencyRgb", deficiency, options);
  const tf = transferFunction("sRGB");
  const lin: Vector3 = [tf.decode(rgb.r), tf.decode(rgb.g), tf.decode(rgb.b)];
  const out = simulateLinear(lin, deficiency, o);
  const enc = (v: number) => Math.min(1, Math.max(0, tf.encode(Math.min(1, Math.max(0, v)))));
  return { r: enc(out[0]), g: enc(out[1]), b: enc(out[2]) };
}

/**
 * Tristimulus values as seen with a colour-vision deficiency: XYZ (D65 white, Y = 100) through linear sRGB (unclipped), simulated, and back.
 *
 * @param xyz Tristimulus values relative to D65 on the Y = 100 scale (adapt other whites first with adaptXYZ).
 * @param deficiency "protan", "deutan" or "tritan".
 * @param options.method "Machado 2009" (default), "Brettel 1997" or "Viénot 1999".
 * @param options.severity Severity 0–1 for Machado (default 1).
 * @returns The simulated { X, Y, Z } on the same scale.
 * @source As simulateDeficiencyRgb; IEC 61966-2-1 (the sRGB matrices).
 * @example simulateDeficiencyXYZ({ X: 41, Y: 21, Z: 2 }, "protan", { method: "Brettel 1997" })
 */
export function simulateDeficiencyXYZ(
  xyz: Tristimulus,
  deficiency: Deficiency,
  options: DeficiencyOptions = {},
): Tristimulus {
  checkFields("simulateDeficiencyXYZ", "xyz", xyz, XYZ_FIELDS);
  const o = checkDeficiencyArgs("simulateDeficiencyXYZ", deficiency, options);
  const srgb = rgbSpace("sRGB");
  const lin = applyMatrix3(srgb.fromXYZ, [xyz.X / 100, xyz.Y / 100, xyz.Z / 100]);
  const out = applyMatrix3(srgb.toXYZ, simulateLinear(lin, deficiency, o));
  return { X: out[0] * 100, Y: out[1] * 100, Z: out[2] * 100 };
}

/**
 * The colour of a spectrum as seen with a colour-vision deficiency: a sample under D65, or a light (its own XYZ, taken as seen adapted to D65).
 *
 * @param stimulus A reflectance/transmittance spectrum (seen under D65), or a light spectrum.
 * @param deficiency "protan", "deutan" or "tritan".
 * @param options.method "Machado 2009" (default), "Brettel 1997" or "Viénot 1999".
 * @param options.severity Severity 0–1 for Machado (default 1).
 * @returns The simulated { X, Y, Z } (Y = 100 for the perfect white under D65; a light's XYZ on lightTristimulus's scale).
 * @source As simulateDeficiencyXYZ; CIE 015:2018 (tristimulus values).
 * @example simulateDeficiencySpectrum(spectrumOnGrid(380, 5, new Array(81).fill(0.4), { quantity: "reflectance" }), "tritan")
 */
export function simulateDeficiencySpectrum(
  stimulus: Spectrum,
  deficiency: Deficiency,
  options: DeficiencyOptions = {},
): Tristimulus {
  checkSpectrum("simulateDeficiencySpectrum", "stimulus", stimulus);
  checkDeficiencyArgs("simulateDeficiencySpectrum", deficiency, options);
  const object = stimulus.quantity === "reflectance" || stimulus.quantity === "transmittance";
  const xyz = object ? tristimulus(stimulus, { illuminant: "D65" }) : lightTristimulus(stimulus);
  return simulateDeficiencyXYZ(xyz, deficiency, options);
}
