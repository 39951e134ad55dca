/** Uniformity of a display over an n-point grid: luminance non-uniformity and Δu′v′ to the centre or to the mean. */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { XYZ_FIELDS, hasNumberFields } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";
import { uvOf } from "./colour-input.ts";

/** One grid point's result. */
export interface UniformityPoint {
  readonly row: number;
  readonly column: number;
  readonly luminance: number;
  /** L ÷ L_reference, a fraction (1 at the reference). */
  readonly relativeLuminance: number;
  readonly u: number;
  readonly v: number;
  /** Δu′v′ from the reference chromaticity. */
  readonly deltaUv: number;
}

/** The uniformity of a grid. */
export interface Uniformity {
  readonly rows: number;
  readonly columns: number;
  readonly reference: "centre" | "mean";
  /** The reference luminance (cd/m²) and chromaticity u′, v′. */
  readonly referenceLuminance: number;
  readonly referenceUv: { readonly u: number; readonly v: number };
  readonly points: readonly UniformityPoint[];
  readonly minLuminance: number;
  readonly maxLuminance: number;
  /** 1 − Lmin ÷ Lmax, a fraction. */
  readonly nonUniformity: number;
  /** The largest |L ÷ L_reference − 1|, a fraction. */
  readonly maxLuminanceDeviation: number;
  /** The largest Δu′v′ from the reference. */
  readonly maxDeltaUv: number;
}

/**
 * Uniformity over a grid of readings (rows × columns): per point L ÷ L_ref and Δu′v′ to the reference; overall 1 − Lmin ÷ Lmax, the largest luminance deviation and Δu′v′.
 *
 * The reference is the centre point (the grid needs an odd number of rows and of columns) or the mean of all points
 * (mean luminance, and the chromaticity of the summed XYZ).
 *
 * @param grid Readings { X, Y, Z } in cd/m², as rows of equal length, top row first (e.g. 3 × 3 or 5 × 5).
 * @param options.reference "centre" or "mean"; default "centre".
 * @returns A `Uniformity`.
 * @source ICDM Information Display Measurements Standard 1.03 (2012), sampled uniformity (Lmin/Lmax) and colour non-uniformity (Δu′v′); common practice.
 * @example displayUniformity([[{ X: 95, Y: 100, Z: 108 }, { X: 97, Y: 102, Z: 110 }, { X: 93, Y: 98, Z: 106 }]], { reference: "mean" })
 */
export function displayUniformity(
  grid: readonly (readonly Tristimulus[])[],
  options: { reference?: "centre" | "mean" } = {},
): Uniformity {
  const fn = "displayUniformity";
  checkWith(
    fn,
    "grid",
    grid,
    "rows of readings { X, Y, Z } of equal length, at least 2 points",
    (g) =>
      Array.isArray(g) &&
      g.length > 0 &&
      g.every(
        (row) =>
          Array.isArray(row) &&
          row.length === (g[0] as unknown[]).length &&
          row.every((p) => hasNumberFields(p, XYZ_FIELDS) && (p as Tristimulus).Y > 0),
      ) &&
      g.length * (g[0] as unknown[]).length >= 2,
  );
  checkOptions(fn, "options", options, ["reference"]);
  checkChoice(fn, "options.reference", options.reference, ["centre", "mean"], { optional: true });
  const reference = options.reference ?? "centre";
  const rows = grid.length,
    columns = grid[0]!.length;
  checkWith(
    fn,
    "grid",
    grid,
    'a grid with odd numbers of rows and columns for reference "centre" (or use reference "mean")',
    () => reference === "mean" || (rows % 2 === 1 && columns % 2 === 1),
  );
  const all = grid.flat();
  let ref: Tristimulus;
  if (reference === "centre") ref = grid[(rows - 1) / 2]![(columns - 1) / 2]!;
  else {
    const sum = all.reduce((s, p) => ({ X: s.X + p.X, Y: s.Y + p.Y, Z: s.Z + p.Z }), { X: 0, Y: 0, Z: 0 });
    ref = { X: sum.X / all.length, Y: sum.Y / all.length, Z: sum.Z / all.length };
  }
  const uvXYZ = (t: Tristimulus) => {
    const s = t.X + t.Y + t.Z;
    return uvOf({ x: t.X / s, y: t.Y / s });
  };
  const rUv = uvXYZ(ref);
  noteMethod(
    "other",
    `Uniformity was computed over a ${rows} × ${columns} grid: luminance non-uniformity 1 − Lmin/Lmax, and each point's luminance ratio and Δu′v′ against the ${reference === "centre" ? "centre point" : "mean of all points"}.`,
  );
  const points = grid.flatMap((row, i) =>
    row.map((p, j) => {
      const uv = uvXYZ(p);
      return {
        row: i,
        column: j,
        luminance: p.Y,
        relativeLuminance: p.Y / ref.Y,
        u: uv.u,
        v: uv.v,
        deltaUv: Math.hypot(uv.u - rUv.u, uv.v - rUv.v),
      };
    }),
  );
  const ls = points.map((p) => p.luminance);
  const min = Math.min(...ls),
    max = Math.max(...ls);
  return {
    rows,
    columns,
    reference,
    referenceLuminance: ref.Y,
    referenceUv: rUv,
    points,
    minLuminance: min,
    maxLuminance: max,
    nonUniformity: 1 - min / max,
    maxLuminanceDeviation: Math.max(...points.map((p) => Math.abs(p.relativeLuminance - 1))),
    maxDeltaUv: Math.max(...points.map((p) => p.deltaUv)),
  };
}
