/**
 * Correlated colour temperature by Robertson's method (A. R. Robertson, "Computation of correlated color temperature
 * and distribution temperature", J. Opt. Soc. Am. 58(11):1528–1535, 1968): linear interpolation in reciprocal
 * temperature between the two isotemperature lines that bracket the chromaticity in CIE 1960 uv.
 * Robertson's 31 lines at 0–600 MK⁻¹ are recomputed here from the Planckian locus with c2 = 1.4388e-2 m·K.
 */
import type { Uv1960 } from "../colorimetry/chromaticity.ts";
import { planckianLocusAtReciprocal } from "./planckian-locus.ts";

/** The reciprocal temperatures (MK⁻¹, "mireds") of Robertson's isotemperature lines (Robertson 1968, Table 1). */
export const ROBERTSON_MIREDS: readonly number[] = [
  0, 10, 20, 30, 40, 50, 60, 70, 80, 90, 100, 125, 150, 175, 200, 225, 250, 275, 300, 325, 350, 375, 400, 425,
  450, 475, 500, 525, 550, 575, 600,
];

/** One isotemperature line: the locus point (u, v) and the line's direction as the locus tangent it is normal to. */
export interface IsotemperatureLine {
  readonly mired: number;
  readonly u: number;
  readonly v: number;
  /** Slope dv/du of the isotemperature line (Robertson's t). */
  readonly slope: number;
  /** Unit tangent of the locus towards larger mireds (lower temperature). */
  readonly tu: number;
  readonly tv: number;
}

let lines: IsotemperatureLine[] | undefined;

/** Robertson's isotemperature lines, recomputed from the Planckian locus (CIE 015:2018 c2 and 1931 observer). */
export function robertsonLines(): readonly IsotemperatureLine[] {
  if (!lines) {
    lines = ROBERTSON_MIREDS.map((mired) => {
      const p = planckianLocusAtReciprocal(mired * 1e-6);
      const len = Math.hypot(p.duds, p.dvds);
      return { mired, u: p.u, v: p.v, slope: -p.duds / p.dvds, tu: p.duds / len, tv: p.dvds / len };
    });
  }
  return lines;
}

/** CCT (K) of a CIE 1960 (u, v) by Robertson (1968), valid from about 1667 K (600 MK⁻¹) upward. */
export function cctRobertson(uv: Uv1960): number {
  const table = robertsonLines();
  // Signed distance of the point from each isotemperature line, positive on the low-temperature side.
  let previous = (uv.u - table[0]!.u) * table[0]!.tu + (uv.v - table[0]!.v) * table[0]!.tv;
  if (previous < 0) {
    throw new Error(
      `CCT (Robertson 1968): u = ${uv.u.toFixed(5)}, v = ${uv.v.toFixed(5)} lies beyond the isotemperature line of infinite temperature`,
    );
  }
  for (let i = 1; i < table.length; i++) {
    const line = table[i]!;
    const di = (uv.u - line.u) * line.tu + (uv.v - line.v) * line.tv;
    if (di <= 0) {
      const m0 = table[i - 1]!.mired;
      const mired = m0 + ((line.mired - m0) * previous) / (previous - di);
      if (mired <= 0)
        throw new Error(
          `CCT (Robertson 1968): u = ${uv.u.toFixed(5)}, v = ${uv.v.toFixed(5)} lies at infinite temperature`,
        );
      return 1e6 / mired;
    }
    previous = di;
  }
  throw new Error(
    `CCT (Robertson 1968): u = ${uv.u.toFixed(5)}, v = ${uv.v.toFixed(5)} lies beyond the 600 MK⁻¹ isotemperature line, i.e. below about 1667 K, the lower limit of the method`,
  );
}
