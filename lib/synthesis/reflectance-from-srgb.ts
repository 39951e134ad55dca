/**
 * A smooth reflectance whose colour under D65 (CIE 1931 2°) is a given sRGB colour: the least-slope-squared
 * reconstruction of Burns (2020), bounded to 0–1 by his iterative method (ILLSS).
 */
import { noteMethod, withoutMethodNotes } from "../methods/method-log.ts";
import { colourMatchingAt, CIE_1931_2_DEGREE } from "../observers/standard-observer.ts";
import { illuminant } from "../illuminants/standard-illuminant.ts";
import { valueAt } from "../spectrum/sample.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { gridWavelengths, type WavelengthGrid } from "../spectrum/grid.ts";
import { rgbSpace } from "../rgb/rgb-space.ts";
import { transferFunction } from "../rgb/transfer-functions.ts";
import { xyzFromRgb, type Rgb } from "../rgb/rgb-conversion.ts";
import { objectColour } from "../colorimetry/tristimulus.ts";
import { labFromXYZ } from "../colorimetry/cielab.ts";
import { deltaE2000 } from "../difference/delta-e-2000.ts";
import { checkFields, GRID_FIELDS, RGB_FIELDS } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkString } from "../arguments/check-text.ts";
import { solveSquare } from "../camera/linear-algebra.ts";

export interface ReflectanceFromSrgbOptions {
  /** The reflectance's wavelengths { start, end, step } in nm; default 380–730 nm every 10 nm (Burns's 36 bands). */
  grid?: WavelengthGrid;
  /** The spectrum's name; default "reflectance for sRGB (r, g, b)". */
  name?: string;
}

/** The recovered reflectance and how well it reproduces the colour. */
export interface RecoveredReflectance {
  readonly reflectance: Spectrum;
  /** CIEDE2000 between the sRGB colour and the reflectance's colour under D65 (CIE 1931 2°, 5 nm sums over 360–830 nm). */
  readonly deltaE00: number;
  /** How many values were held at 0 or 1 by the bounded iterations. */
  readonly heldAtBounds: number;
  /** False when no reflectance within 0–1 reproduces the colour on this grid (the result is then the nearest found). */
  readonly exact: boolean;
}

/** The linear-sRGB weighting matrix T (3 × n) on the grid: T·ρ = linear sRGB under D65, scaled so that T·1 = (1, 1, 1). */
function weights(wl: readonly number[]): number[][] {
  const d65 = illuminant("D65");
  const srgb = rgbSpace("sRGB");
  const e = wl.map((w) => valueAt(d65, w));
  const xyz = [0, 1, 2].map((c) => wl.map((w, i) => e[i]! * colourMatchingAt(CIE_1931_2_DEGREE, w)[c]!));
  const rows = [0, 1, 2].map((r) =>
    wl.map(
      (_, i) =>
        srgb.fromXYZ[r]![0]! * xyz[0]![i]! +
        srgb.fromXYZ[r]![1]! * xyz[1]![i]! +
        srgb.fromXYZ[r]![2]! * xyz[2]![i]!,
    ),
  );
  return rows.map((row) => {
    const s = row.reduce((a, b) => a + b, 0);
    return row.map((v) => v / s);
  });
}

/**
 * A smooth reflectance within 0–1 whose colour under D65 (CIE 1931 2°) matches an sRGB colour: Burns's least-slope-squared reconstruction with his iterative bounding (ILLSS).
 *
 * Minimises Σ (ρᵢ₊₁ − ρᵢ)² subject to T·ρ = linear sRGB (T the D65-weighted colour-matching functions taken to
 * linear sRGB, scaled so the perfect white gives sRGB white); values that leave 0–1 are held at the bound and the
 * rest solved again, until none leaves.
 *
 * @param rgb Encoded sRGB { r, g, b }, 0–1.
 * @param options.grid Wavelengths { start, end, step } in nm; default 380–730 nm every 10 nm.
 * @param options.name The spectrum's name; default "reflectance for sRGB (r, g, b)".
 * @returns { reflectance, deltaE00, heldAtBounds, exact }.
 * @source Burns, "Numerical methods for smoothest reflectance reconstruction", Color Res. Appl. 45(1) 2020 8–21 (LLSS and ILLSS).
 * @example reflectanceFromSrgb({ r: 0.8, g: 0.4, b: 0.2 }).deltaE00
 */
export function reflectanceFromSrgb(
  rgb: Rgb,
  options: ReflectanceFromSrgbOptions = {},
): RecoveredReflectance {
  checkFields("reflectanceFromSrgb", "rgb", rgb, RGB_FIELDS);
  checkOptions("reflectanceFromSrgb", "options", options, ["grid", "name"]);
  checkFields("reflectanceFromSrgb", "options.grid", options.grid, GRID_FIELDS, { optional: true });
  checkString("reflectanceFromSrgb", "options.name", options.name, { optional: true, what: "a name" });
  for (const k of ["r", "g", "b"] as const)
    if (rgb[k] < 0 || rgb[k] > 1) throw new Error(`reflectanceFromSrgb: rgb.${k} = ${rgb[k]} is outside 0–1`);
  const wl = gridWavelengths(options.grid ?? { start: 380, end: 730, step: 10 });
  const n = wl.length;
  if (n < 4) throw new Error("reflectanceFromSrgb: the grid needs at least 4 wavelengths");
  const tf = transferFunction("sRGB");
  const target = [tf.decode(rgb.r), tf.decode(rgb.g), tf.decode(rgb.b)];
  const T = withoutMethodNotes(() => weights(wl));
  // DᵀD of the first-difference operator (tridiagonal: 1, 2, …, 2, 1 on the diagonal, −1 beside it).
  const dtd = (i: number, j: number) =>
    i === j ? (i === 0 || i === n - 1 ? 1 : 2) : Math.abs(i - j) === 1 ? -1 : 0;
  const fixed = new Map<number, number>();
  let rho = new Array<number>(n).fill(0.5);
  let exact = true;
  for (let iter = 0; iter <= n; iter++) {
    const free = wl.map((_, i) => i).filter((i) => !fixed.has(i));
    const m = free.length;
    // KKT system [2 DᵀD_ff, T_fᵀ; T_f, 0] [ρ_f; μ] = [−2 DᵀD_fF ρ_F; c − T_F ρ_F].
    const K: number[][] = [];
    const rhs: number[] = [];
    free.forEach((i) => {
      const row = free.map((j) => 2 * dtd(i, j));
      for (let c = 0; c < 3; c++) row.push(T[c]![i]!);
      K.push(row);
      let r = 0;
      for (const [j, v] of fixed) r -= 2 * dtd(i, j) * v;
      rhs.push(r);
    });
    for (let c = 0; c < 3; c++) {
      const row = free.map((j) => T[c]![j]!);
      row.push(0, 0, 0);
      K.push(row);
      let r = target[c]!;
      for (const [j, v] of fixed) r -= T[c]![j]! * v;
      rhs.push(r);
    }
    const x = m > 0 ? solveSquare(K, rhs) : undefined;
    if (!x) {
      exact = false;
      break;
    }
    const next = new Array<number>(n);
    for (const [j, v] of fixed) next[j] = v;
    free.forEach((i, a) => (next[i] = x[a]!));
    rho = next;
    const out = free.filter((i) => rho[i]! < 0 || rho[i]! > 1);
    if (out.length === 0) break;
    for (const i of out) fixed.set(i, rho[i]! < 0 ? 0 : 1);
  }
  rho = rho.map((v) => Math.min(1, Math.max(0, v)));
  const name = options.name ?? `reflectance for sRGB (${rgb.r}, ${rgb.g}, ${rgb.b})`;
  const reflectance = spectrum(wl, rho, { name, quantity: "reflectance" });
  const dE = withoutMethodNotes(() => {
    const c = objectColour(reflectance, { illuminant: "D65", interval: 5 });
    const want = xyzFromRgb(rgb, rgbSpace("sRGB"));
    return deltaE2000(labFromXYZ(c.XYZ, c.white), labFromXYZ(want, c.white));
  });
  noteMethod(
    "other",
    `Demonstration reflectances were reconstructed from sRGB colours by Burns's least-slope-squared method with iterative bounding to 0–1 (Burns 2020) on ${wl[0]}–${wl[n - 1]} nm every ${wl[1]! - wl[0]!} nm, for D65 and the CIE 1931 2° observer.`,
  );
  return { reflectance, deltaE00: dE, heldAtBounds: fixed.size, exact: exact && dE < 0.5 };
}
