/**
 * Chromatic adaptation transforms of the von Kries type: XYZ to a cone-like space, scaling by the ratio of the
 * destination and source whites there, and back (von Kries 1902; CIE 159:2004 for CAT02).
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import {
  applyMatrix3,
  diagonalMatrix3,
  invertMatrix3,
  multiplyMatrix3,
  type Matrix3,
} from "../colorimetry/matrix3.ts";
import { noteMethod } from "../methods/method-log.ts";
import { XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkTransform } from "../arguments/option-sets.ts";

export type AdaptationTransform = "bradford" | "cat02" | "cat16" | "von kries";

interface ConeSpace {
  readonly matrix: Matrix3;
  readonly words: string;
}

/** The XYZ → cone-space matrices of each transform, with the publication each comes from. */
export const ADAPTATION_MATRICES: Readonly<Record<AdaptationTransform, ConeSpace>> = {
  // Linearised Bradford transform (K. M. Lam, PhD thesis, University of Bradford 1985; ICC.1:2010 Annex E).
  bradford: {
    matrix: [
      [0.8951, 0.2664, -0.1614],
      [-0.7502, 1.7135, 0.0367],
      [0.0389, -0.0685, 1.0296],
    ],
    words: "the linearised Bradford transform (Lam 1985; ICC.1:2010 Annex E)",
  },
  // CAT02 (CIE 159:2004, CIECAM02, eq. 7).
  cat02: {
    matrix: [
      [0.7328, 0.4296, -0.1624],
      [-0.7036, 1.6975, 0.0061],
      [0.003, 0.0136, 0.9834],
    ],
    words: "CAT02 (CIE 159:2004)",
  },
  // CAT16 (C. Li et al., "Comprehensive color solutions: CAM16, CAT16, and CAM16-UCS", Color Res. Appl. 42:703–718, 2017).
  cat16: {
    matrix: [
      [0.401288, 0.650173, -0.051461],
      [-0.250268, 1.204414, 0.045854],
      [-0.002079, 0.048952, 0.953127],
    ],
    words: "CAT16 (Li et al. 2017, one-step form)",
  },
  // von Kries scaling of Hunt–Pointer–Estévez cone responses (M_HPE of CIE 159:2004, normalised to illuminant E).
  "von kries": {
    matrix: [
      [0.38971, 0.68898, -0.07868],
      [-0.22981, 1.1834, 0.04641],
      [0, 0, 1],
    ],
    words: "von Kries scaling of Hunt–Pointer–Estévez cone responses (M_HPE of CIE 159:2004)",
  },
};

function resolveTransform(t: string): AdaptationTransform {
  const key = String(t)
    .trim()
    .toLowerCase()
    .replace(/[\s_-]+/g, " ");
  const found = (Object.keys(ADAPTATION_MATRICES) as AdaptationTransform[]).find(
    (k) => k === key || k.replace(" ", "") === key.replace(" ", ""),
  );
  if (!found)
    throw new Error(
      `unknown chromatic adaptation transform "${t}"; use "bradford", "cat02", "cat16" or "von kries"`,
    );
  return found;
}

function requireWhite(what: string, w: Tristimulus): void {
  if (typeof w !== "object" || w === null || ![w.X, w.Y, w.Z].every((v) => Number.isFinite(v) && v > 0)) {
    throw new Error(`${what} (${w?.X}, ${w?.Y}, ${w?.Z}) must have positive finite X, Y, Z`);
  }
}

export interface AdaptationOptions {
  /** Degree of adaptation D, 0–1 (default 1: complete adaptation, as for the conversion of white to white). */
  degree?: number;
}

/**
 * The 3 × 3 matrix M⁻¹·diag(D·ρd ÷ ρs + 1 − D)·M that adapts XYZ from a source white to a destination white.
 *
 * The whites are normalised to equal Y first, so only their chromaticity matters.
 *
 * @param sourceWhite The white the colour was seen under, { X, Y, Z }, all positive.
 * @param destinationWhite The white to adapt to, { X, Y, Z }, all positive.
 * @param transform "bradford", "cat02", "cat16" or "von kries" (case, spaces, "-" and "_" ignored); default "bradford".
 * @returns The matrix as rows (XYZ → adapted XYZ).
 * @source Lam 1985 and ICC.1:2010 Annex E (Bradford); CIE 159:2004 (CAT02, M_HPE); Li et al., Color Res. Appl. 42:703–718, 2017 (CAT16); von Kries 1902.
 * @example adaptationMatrix(whitePoint({ illuminant: "D65" }), whitePoint({ illuminant: "D50", interval: 5 }))
 */
export function adaptationMatrix(
  sourceWhite: Tristimulus,
  destinationWhite: Tristimulus,
  transform: AdaptationTransform = "bradford",
  options: AdaptationOptions = {},
): Matrix3 {
  checkFields("adaptationMatrix", "sourceWhite", sourceWhite, XYZ_FIELDS);
  checkFields("adaptationMatrix", "destinationWhite", destinationWhite, XYZ_FIELDS);
  checkTransform("adaptationMatrix", transform);
  checkOptions("adaptationMatrix", "options", options, ["degree"]);
  requireWhite("adaptation: the source white", sourceWhite);
  requireWhite("adaptation: the destination white", destinationWhite);
  const key = resolveTransform(transform);
  const d = options.degree ?? 1;
  if (!(Number.isFinite(d) && d >= 0 && d <= 1))
    throw new Error(`adaptation: degree of adaptation ${d} must be between 0 and 1`);
  const m = ADAPTATION_MATRICES[key].matrix;
  const s = applyMatrix3(m, [sourceWhite.X / sourceWhite.Y, 1, sourceWhite.Z / sourceWhite.Y]);
  const t = applyMatrix3(m, [
    destinationWhite.X / destinationWhite.Y,
    1,
    destinationWhite.Z / destinationWhite.Y,
  ]);
  const gain = [0, 1, 2].map((i) => d * (t[i]! / s[i]!) + 1 - d) as [number, number, number];
  return multiplyMatrix3(invertMatrix3(m, key), multiplyMatrix3(diagonalMatrix3(gain), m));
}

/**
 * Tristimulus values seen under a source white, adapted to a destination white by a von Kries-type transform.
 *
 * The result keeps the scale of the input: the source white maps to the destination white's chromaticity at the
 * source white's Y.
 *
 * @param xyz The colour's tristimulus values { X, Y, Z }, finite.
 * @param sourceWhite The white the colour was seen under, { X, Y, Z }.
 * @param destinationWhite The white to adapt to, { X, Y, Z }.
 * @param transform "bradford", "cat02", "cat16" or "von kries"; default "bradford".
 * @returns The adapted { X, Y, Z }, on the scale of `xyz`.
 * @source CIE 160:2004 (review of von Kries-type transforms); Lam 1985 and ICC.1:2010 Annex E (Bradford); CIE 159:2004 (CAT02); Li et al. 2017 (CAT16).
 * @example adaptXYZ({ X: 40, Y: 35, Z: 20 }, { X: 95.047, Y: 100, Z: 108.883 }, { X: 96.422, Y: 100, Z: 82.521 }, "cat16", { degree: 0.8 })
 */
export function adaptXYZ(
  xyz: Tristimulus,
  sourceWhite: Tristimulus,
  destinationWhite: Tristimulus,
  transform: AdaptationTransform = "bradford",
  options: AdaptationOptions = {},
): Tristimulus {
  checkFields("adaptXYZ", "xyz", xyz, XYZ_FIELDS);
  checkFields("adaptXYZ", "sourceWhite", sourceWhite, XYZ_FIELDS);
  checkFields("adaptXYZ", "destinationWhite", destinationWhite, XYZ_FIELDS);
  checkTransform("adaptXYZ", transform);
  checkOptions("adaptXYZ", "options", options, ["degree"]);
  if (typeof xyz !== "object" || xyz === null || ![xyz.X, xyz.Y, xyz.Z].every(Number.isFinite)) {
    throw new Error(`adaptXYZ: tristimulus values (${xyz?.X}, ${xyz?.Y}, ${xyz?.Z}) must be finite numbers`);
  }
  const m = adaptationMatrix(sourceWhite, destinationWhite, transform, options);
  const key = resolveTransform(transform);
  const d = options.degree ?? 1;
  noteMethod(
    "chromatic adaptation",
    `Colours were adapted between reference whites by ${ADAPTATION_MATRICES[key].words}${d === 1 ? " with complete adaptation" : ` with a degree of adaptation D = ${d}`}.`,
  );
  const [X, Y, Z] = applyMatrix3(m, [xyz.X, xyz.Y, xyz.Z]);
  return { X, Y, Z };
}
