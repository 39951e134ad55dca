/**
 * The CIE 2015 cone-fundamental-based colour-matching functions x̄F, ȳF, z̄F (CIE 170-2:2015), derived from the CIE
 * 2006 LMS cone fundamentals by the standard's 3 × 3 matrices, as observers usable wherever an observer is accepted.
 */
import type { Observer } from "../observers/standard-observer.ts";
import type { Matrix3 } from "../colorimetry/matrix3.ts";
import { CIE_2006_LMS_10_DEGREE, CIE_2006_LMS_2_DEGREE, type ConeFundamentals } from "./cone-fundamentals.ts";

/**
 * LMS → XYZ for the CIE 2015 2° observer, rows x̄F, ȳF, z̄F (CIE 170-2:2015 eq. for the 2° field; coefficients
 * recalled from memory to the 8 decimals printed there).
 */
export const CIE_2015_2_DEGREE_LMS_TO_XYZ: Matrix3 = [
  [1.94735469, -1.41445123, 0.36476327],
  [0.68990272, 0.34832189, 0],
  [0, 0, 1.93485343],
];

/**
 * LMS → XYZ for the CIE 2015 10° observer, rows x̄F,10, ȳF,10, z̄F,10 (CIE 170-2:2015 eq. for the 10° field;
 * coefficients recalled from memory to the 8 decimals printed there).
 */
export const CIE_2015_10_DEGREE_LMS_TO_XYZ: Matrix3 = [
  [1.93986443, -1.34664359, 0.43044935],
  [0.69283932, 0.34967567, 0],
  [0, 0, 2.14687945],
];

/** The table starts at 360 nm like the CIE 1931 and 1964 tables: 0 below 390 nm, the CIE dataset's extrapolation rule. */
const TABLE_START = 360;

function derived(name: string, f: ConeFundamentals, m: Matrix3): Observer {
  const pad = (f.start - TABLE_START) / f.step;
  const row = (r: readonly [number, number, number]) => [
    ...new Array<number>(pad).fill(0),
    ...f.wavelengths.map((_, i) => r[0] * f.l[i]! + r[1] * f.m[i]! + r[2] * f.s[i]!),
  ];
  return {
    kind: "observer",
    name,
    fieldDegrees: f.fieldDegrees,
    start: TABLE_START,
    step: f.step,
    wavelengths: [...Array.from({ length: pad }, (_, i) => TABLE_START + i * f.step), ...f.wavelengths],
    xBar: row(m[0]),
    yBar: row(m[1]),
    zBar: row(m[2]),
  };
}

/** CIE 2015 2° colour-matching functions (CIE 170-2:2015) from the 5 nm CIE 2006 2° cone fundamentals, 390–830 nm (0 at 360–385 nm). */
export const CIE_2015_2_DEGREE: Observer = derived(
  "CIE 2015 2° cone-fundamental-based observer (CIE 170-2:2015; x̄F, ȳF, z̄F derived from the 5 nm CIE 2006 LMS table by the CIE 170-2 matrix, read linearly between 5 nm samples and taken as 0 below 390 nm)",
  CIE_2006_LMS_2_DEGREE,
  CIE_2015_2_DEGREE_LMS_TO_XYZ,
);

/** CIE 2015 10° colour-matching functions (CIE 170-2:2015) from the 5 nm CIE 2006 10° cone fundamentals, 390–830 nm (0 at 360–385 nm). */
export const CIE_2015_10_DEGREE: Observer = derived(
  "CIE 2015 10° cone-fundamental-based observer (CIE 170-2:2015; x̄F,10, ȳF,10, z̄F,10 derived from the 5 nm CIE 2006 LMS table by the CIE 170-2 matrix, read linearly between 5 nm samples and taken as 0 below 390 nm)",
  CIE_2006_LMS_10_DEGREE,
  CIE_2015_10_DEGREE_LMS_TO_XYZ,
);
