/**
 * Black-level subtraction and contrast ratios from display readings: sequential (full-screen white over full-screen
 * black) and checkerboard (the mean of the white squares over the mean of the black squares of one pattern).
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkNumberList } from "../arguments/check-list.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";

/**
 * A reading with the black level taken off: X − Xk, Y − Yk, Z − Zk (the display's light at zero drive, e.g. reflected room light and leakage).
 *
 * @param reading The reading { X, Y, Z } (cd/m² or any scale, the same as the black's).
 * @param black The black reading { X, Y, Z } on the same scale (all channels at zero drive).
 * @returns { X, Y, Z } less the black (components may go slightly negative through noise at low levels).
 * @source IEC 61966-4:2000 (additivity of a display's output less its black level); common practice in display metrology.
 * @example subtractBlack({ X: 19.4, Y: 20.3, Z: 22.1 }, { X: 0.11, Y: 0.12, Z: 0.15 })
 */
export function subtractBlack(reading: Tristimulus, black: Tristimulus): Tristimulus {
  checkFields("subtractBlack", "reading", reading, XYZ_FIELDS);
  checkFields("subtractBlack", "black", black, XYZ_FIELDS);
  checkWith(
    "subtractBlack",
    "black",
    black,
    "a black reading with X, Y, Z ≥ 0",
    () => black.X >= 0 && black.Y >= 0 && black.Z >= 0,
  );
  noteMethod(
    "other",
    "The black-level reading was subtracted from the display readings before their chromaticities were computed.",
  );
  return { X: reading.X - black.X, Y: reading.Y - black.Y, Z: reading.Z - black.Z };
}

/** A contrast ratio and the luminances it came from. */
export interface ContrastResult {
  /** Lw ÷ Lk (e.g. 1200 for "1200 : 1"). */
  readonly ratio: number;
  /** The white and black luminance used, in the readings' unit (the means for a checkerboard). */
  readonly whiteLuminance: number;
  readonly blackLuminance: number;
  readonly method: "sequential" | "checkerboard";
}

const luminanceOf = (v: number | Tristimulus): number => (typeof v === "number" ? v : v.Y);

function checkLuminance(fn: string, arg: string, v: unknown): void {
  if (typeof v === "object" && v !== null) checkFields(fn, arg, v, XYZ_FIELDS);
  else checkNumber(fn, arg, v, { unit: "cd/m²", min: 0 });
}

/**
 * Sequential (full-on/full-off) contrast: the luminance of a full-screen white over that of a full-screen black.
 *
 * @param white The white reading: luminance in cd/m², or { X, Y, Z } (Y is used).
 * @param black The black reading, the same way; must be above 0 (a zero black gives no finite ratio).
 * @returns { ratio, whiteLuminance, blackLuminance, method: "sequential" }.
 * @source ICDM Information Display Measurements Standard 1.03 (2012), full-screen contrast; common practice.
 * @example sequentialContrast(250, 0.2)
 */
export function sequentialContrast(white: number | Tristimulus, black: number | Tristimulus): ContrastResult {
  checkLuminance("sequentialContrast", "white", white);
  checkLuminance("sequentialContrast", "black", black);
  const lw = luminanceOf(white),
    lk = luminanceOf(black);
  checkNumber("sequentialContrast", "black", lk, { unit: "cd/m²", above: 0 });
  noteMethod(
    "photometry",
    "Sequential contrast was computed as the luminance of a full-screen white over that of a full-screen black.",
  );
  return { ratio: lw / lk, whiteLuminance: lw, blackLuminance: lk, method: "sequential" };
}

/**
 * Checkerboard contrast: the mean luminance of the white squares over the mean of the black squares, each measured at its centre.
 *
 * @param whites Luminances of the white squares in cd/m² (8 for a 4 × 4 pattern).
 * @param blacks Luminances of the black squares in cd/m², each above 0.
 * @returns { ratio, whiteLuminance (mean), blackLuminance (mean), method: "checkerboard" }.
 * @source ICDM Information Display Measurements Standard 1.03 (2012), checkerboard contrast (4 × 4 pattern, ratio of means).
 * @example checkerboardContrast([180, 182, 179, 181, 183, 180, 178, 181], [0.41, 0.4, 0.43, 0.42, 0.4, 0.41, 0.44, 0.42])
 */
export function checkerboardContrast(whites: readonly number[], blacks: readonly number[]): ContrastResult {
  checkNumberList("checkerboardContrast", "whites", whites, { minLength: 1 });
  checkNumberList("checkerboardContrast", "blacks", blacks, { minLength: 1 });
  whites.forEach((v, i) => checkNumber("checkerboardContrast", `whites[${i}]`, v, { unit: "cd/m²", min: 0 }));
  blacks.forEach((v, i) =>
    checkNumber("checkerboardContrast", `blacks[${i}]`, v, { unit: "cd/m²", above: 0 }),
  );
  const mean = (l: readonly number[]) => l.reduce((s, v) => s + v, 0) / l.length;
  const lw = mean(whites),
    lk = mean(blacks);
  noteMethod(
    "photometry",
    "Checkerboard contrast was computed as the mean luminance of the white squares over the mean luminance of the black squares.",
  );
  return { ratio: lw / lk, whiteLuminance: lw, blackLuminance: lk, method: "checkerboard" };
}
