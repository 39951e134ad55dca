/**
 * Colour-correction from camera RGB to XYZ, fitted by least squares on a chart: a 3 × 3 matrix, or the
 * root-polynomial terms of Finlayson, Mackiewicz & Hurlbert (2015).
 */
import { noteMethod } from "../methods/method-log.ts";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import type { Rgb } from "../rgb/rgb-conversion.ts";
import { checkList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkFields, hasNumberFields, RGB_FIELDS, XYZ_FIELDS } from "../arguments/check-fields.ts";
import { checkWith } from "../arguments/check-with.ts";
import { leastSquares } from "./linear-algebra.ts";

/** A fitted colour correction: XYZ = matrix · terms(rgb). Plain data. */
export interface ColourCorrection {
  readonly kind: "colour correction";
  /** "linear" (the 3 × 3 matrix) or "root-polynomial". */
  readonly model: "linear" | "root-polynomial";
  /** 1 for linear; 2 or 3 for root-polynomial. */
  readonly degree: 1 | 2 | 3;
  /** The names of the terms, e.g. ["r", "g", "b", "√(rg)", ...]. */
  readonly terms: readonly string[];
  /** 3 rows (X, Y, Z) of one coefficient per term. */
  readonly matrix: readonly (readonly number[])[];
  /** Root-mean-square of the fit's XYZ residuals over the chart (same scale as the XYZ given). */
  readonly rmsResidual: number;
}

const TERM_NAMES: Record<1 | 2 | 3, string[]> = {
  1: ["r", "g", "b"],
  2: ["r", "g", "b", "√(rg)", "√(gb)", "√(rb)"],
  3: [
    "r",
    "g",
    "b",
    "√(rg)",
    "√(gb)",
    "√(rb)",
    "∛(rg²)",
    "∛(gb²)",
    "∛(rb²)",
    "∛(gr²)",
    "∛(bg²)",
    "∛(br²)",
    "∛(rgb)",
  ],
};

/** The root-polynomial terms of Finlayson et al. 2015 (eqs. 8–9); negative products give 0. */
function terms(c: Rgb, degree: 1 | 2 | 3): number[] {
  const { r, g, b } = c;
  if (degree === 1) return [r, g, b];
  const sq = (v: number) => (v > 0 ? Math.sqrt(v) : 0);
  const t2 = [r, g, b, sq(r * g), sq(g * b), sq(r * b)];
  if (degree === 2) return t2;
  return [
    ...t2,
    Math.cbrt(r * g * g),
    Math.cbrt(g * b * b),
    Math.cbrt(r * b * b),
    Math.cbrt(g * r * r),
    Math.cbrt(b * g * g),
    Math.cbrt(b * r * r),
    Math.cbrt(r * g * b),
  ];
}

export interface ColourCorrectionOptions {
  /** "linear" (default: a 3 × 3 matrix) or "root-polynomial". */
  model?: "linear" | "root-polynomial";
  /** Degree of the root-polynomial model, 2 (6 terms) or 3 (13 terms); default 2. */
  degree?: 2 | 3;
}

/**
 * Fits a colour correction from camera RGB to XYZ by least squares over a chart's patches: a 3 × 3 matrix, or root-polynomial terms.
 *
 * The root-polynomial terms scale with exposure as the RGB do, so the correction is unchanged by a change of
 * exposure (Finlayson et al. 2015 §3).
 *
 * @param rgb The camera RGB of each patch (e.g. from `cameraRgb`).
 * @param xyz The XYZ of the same patches (e.g. from `tristimulus`), in the same order.
 * @param options.model "linear" (default) or "root-polynomial".
 * @param options.degree 2 (default) or 3 for root-polynomial.
 * @returns A `ColourCorrection` { model, degree, terms, matrix, rmsResidual }.
 * @source Least squares (e.g. Hung, J. Electron. Imaging 2 (1993) 53–61); root polynomials: Finlayson, Mackiewicz & Hurlbert, IEEE Trans. Image Proc. 24(5) 2015 1460–1470.
 * @example fitColourCorrection([{ r: 1, g: 0, b: 0 }, { r: 0, g: 1, b: 0 }, { r: 0, g: 0, b: 1 }, { r: 1, g: 1, b: 1 }], [{ X: 41, Y: 21, Z: 2 }, { X: 36, Y: 72, Z: 12 }, { X: 18, Y: 7, Z: 95 }, { X: 95, Y: 100, Z: 109 }])
 */
export function fitColourCorrection(
  rgb: readonly Rgb[],
  xyz: readonly Tristimulus[],
  options: ColourCorrectionOptions = {},
): ColourCorrection {
  checkList(
    "fitColourCorrection",
    "rgb",
    rgb,
    "camera RGB { r, g, b }",
    (v) => hasNumberFields(v, RGB_FIELDS),
    {
      minLength: 3,
    },
  );
  checkList(
    "fitColourCorrection",
    "xyz",
    xyz,
    "tristimulus values { X, Y, Z }",
    (v) => hasNumberFields(v, XYZ_FIELDS),
    {
      minLength: 3,
    },
  );
  checkOptions("fitColourCorrection", "options", options, ["model", "degree"]);
  checkChoice("fitColourCorrection", "options.model", options.model, ["linear", "root-polynomial"], {
    optional: true,
  });
  checkWith("fitColourCorrection", "options.degree", options.degree, "2 or 3", (d) => d === 2 || d === 3, {
    optional: true,
  });
  if (rgb.length !== xyz.length)
    throw new Error(
      `fitColourCorrection: ${rgb.length} RGB values but ${xyz.length} XYZ values; give one per patch`,
    );
  const model = options.model ?? "linear";
  const degree: 1 | 2 | 3 = model === "linear" ? 1 : (options.degree ?? 2);
  const names = TERM_NAMES[degree];
  if (rgb.length < names.length)
    throw new Error(
      `fitColourCorrection: ${names.length} terms need at least ${names.length} patches, got ${rgb.length}`,
    );
  const F = rgb.map((c) => terms(c, degree));
  const T = xyz.map((v) => [v.X, v.Y, v.Z]);
  const matrix = leastSquares(F, T, "fitColourCorrection");
  let ss = 0;
  F.forEach((f, i) => {
    for (let j = 0; j < 3; j++) {
      const p = matrix[j]!.reduce((s, c, k) => s + c * f[k]!, 0);
      ss += (p - T[i]![j]!) ** 2;
    }
  });
  noteMethod(
    "other",
    model === "linear"
      ? `A 3 × 3 colour-correction matrix from camera RGB to XYZ was fitted by least squares over ${rgb.length} chart patches.`
      : `A root-polynomial colour correction of degree ${degree} (${names.length} terms; Finlayson, Mackiewicz and Hurlbert 2015) was fitted by least squares over ${rgb.length} chart patches.`,
  );
  return {
    kind: "colour correction",
    model,
    degree,
    terms: names,
    matrix,
    rmsResidual: Math.sqrt(ss / (3 * F.length)),
  };
}

/**
 * XYZ from camera RGB by a fitted colour correction.
 *
 * @param correction A `ColourCorrection` from `fitColourCorrection`.
 * @param rgb Camera RGB { r, g, b } on the scale the correction was fitted on.
 * @returns { X, Y, Z } on the scale of the chart's XYZ.
 * @source As fitColourCorrection (Finlayson et al. 2015 for the root-polynomial terms).
 * @example applyColourCorrection(fitColourCorrection([{ r: 1, g: 0, b: 0 }, { r: 0, g: 1, b: 0 }, { r: 0, g: 0, b: 1 }], [{ X: 41, Y: 21, Z: 2 }, { X: 36, Y: 72, Z: 12 }, { X: 18, Y: 7, Z: 95 }]), { r: 0.5, g: 0.5, b: 0.5 })
 */
export function applyColourCorrection(correction: ColourCorrection, rgb: Rgb): Tristimulus {
  checkWith(
    "applyColourCorrection",
    "correction",
    correction,
    "a colour correction (from fitColourCorrection)",
    (c) => typeof c === "object" && c !== null && (c as { kind?: unknown }).kind === "colour correction",
  );
  checkFields("applyColourCorrection", "rgb", rgb, RGB_FIELDS);
  const f = terms(rgb, correction.degree);
  const row = (j: number) => correction.matrix[j]!.reduce((s, c, k) => s + c * f[k]!, 0);
  return { X: row(0), Y: row(1), Z: row(2) };
}
