/**
 * Correlated colour temperature and Duv by Ohno's combined method (Y. Ohno, "Practical use and calculation of CCT
 * and Duv", LEUKOS 10(1):47–55, 2014): the nearest point of a Planckian table in CIE 1960 uv, then the triangular
 * solution when |Duv| < 0.002 and the parabolic solution otherwise.
 */
import type { Uv1960 } from "../colorimetry/chromaticity.ts";
import { planckianLocusAtReciprocal } from "./planckian-locus.ts";

/** The temperature range (K) of the Planckian table the Ohno method searches. */
export const OHNO_RANGE_K = [1000, 100000] as const;
const STEP_RATIO = 1.01; // 1 % steps, as in Ohno (2014)
const REFINEMENTS = 4; // each pass narrows the bracket five-fold: final steps ≈ 0.0003 % of T
const POINTS_PER_PASS = 11;

interface Row {
  t: number;
  u: number;
  v: number;
}

let table: Row[] | undefined;

function row(t: number): Row {
  const p = planckianLocusAtReciprocal(1 / t);
  return { t, u: p.u, v: p.v };
}

function coarseTable(): Row[] {
  if (!table) {
    table = [];
    // One step beyond each end of the range, so that a CCT at the very limits still has a row on either side.
    for (let t = OHNO_RANGE_K[0] / STEP_RATIO; t < OHNO_RANGE_K[1] * STEP_RATIO * STEP_RATIO; t *= STEP_RATIO)
      table.push(row(t));
  }
  return table;
}

function nearest(rows: readonly Row[], u: number, v: number): { index: number; d: number[] } {
  const d = rows.map((r) => Math.hypot(u - r.u, v - r.v));
  let index = 0;
  for (let i = 1; i < d.length; i++) if (d[i]! < d[index]!) index = i;
  return { index, d };
}

/** The three table rows around the nearest point: the coarse 1 % table, refined geometrically around its minimum. */
function bracket(uv: Uv1960): { rows: [Row, Row, Row]; d: [number, number, number] } {
  const coarse = coarseTable();
  const first = nearest(coarse, uv.u, uv.v);
  if (first.index === 0 || first.index === coarse.length - 1) outOfRange(uv, coarse[first.index]!.t);
  let lo = coarse[first.index - 1]!.t;
  let hi = coarse[first.index + 1]!.t;
  let rows: Row[] = [coarse[first.index - 1]!, coarse[first.index]!, coarse[first.index + 1]!];
  let d: number[] = [first.d[first.index - 1]!, first.d[first.index]!, first.d[first.index + 1]!];
  for (let pass = 0; pass < REFINEMENTS; pass++) {
    const ratio = (hi / lo) ** (1 / (POINTS_PER_PASS - 1));
    const fine: Row[] = [];
    for (let k = 0; k < POINTS_PER_PASS; k++)
      fine.push(row(k === POINTS_PER_PASS - 1 ? hi : lo * ratio ** k));
    const found = nearest(fine, uv.u, uv.v);
    const j = Math.min(Math.max(found.index, 1), POINTS_PER_PASS - 2);
    rows = [fine[j - 1]!, fine[j]!, fine[j + 1]!];
    d = [found.d[j - 1]!, found.d[j]!, found.d[j + 1]!];
    lo = rows[0]!.t;
    hi = rows[2]!.t;
  }
  return { rows: rows as [Row, Row, Row], d: d as [number, number, number] };
}

/** Ohno (2014) triangular solution from the rows either side of the nearest one (eqs. for x, Tx and Duv). */
function triangular(
  uv: Uv1960,
  rows: [Row, Row, Row],
  d: [number, number, number],
): { cct: number; duv: number } {
  const [a, , c] = rows;
  const l = Math.hypot(c.u - a.u, c.v - a.v);
  const x = (d[0] ** 2 - d[2] ** 2 + l * l) / (2 * l);
  const cct = a.t + (c.t - a.t) * (x / l);
  const vTx = a.v + (c.v - a.v) * (x / l);
  const duv = Math.sqrt(Math.max(d[0] ** 2 - x * x, 0)) * Math.sign(uv.v - vTx);
  return { cct, duv };
}

/**
 * Ohno (2014) parabolic solution: d(T) = aT² + bT + c through the three rows, Tx = −b/2a, |Duv| = d(Tx). Written
 * about the middle row's temperature, which is the same parabola with less rounding error.
 */
function parabolic(
  uv: Uv1960,
  rows: [Row, Row, Row],
  d: [number, number, number],
): { cct: number; duv: number } {
  const t0 = rows[1].t;
  const x1 = rows[0].t - t0,
    x3 = rows[2].t - t0;
  const [d1, d2, d3] = d;
  // Parabola through (x1, d1), (0, d2), (x3, d3).
  const a = ((d1 - d2) / x1 - (d3 - d2) / x3) / (x1 - x3);
  const b = (d1 - d2) / x1 - a * x1;
  const xm = -b / (2 * a);
  const cct = t0 + xm;
  const dist = a * xm * xm + b * xm + d2;
  const vT = planckianLocusAtReciprocal(1 / cct).v;
  return { cct, duv: dist * Math.sign(uv.v - vT) };
}

function outOfRange(uv: Uv1960, t: number): never {
  throw new Error(
    `CCT (Ohno 2014): the chromaticity u = ${uv.u.toFixed(5)}, v = ${uv.v.toFixed(5)} is nearest the Planckian locus at ${t < 10 * OHNO_RANGE_K[0] ? t.toFixed(0) : t.toPrecision(6)} K, outside the method's range ${OHNO_RANGE_K[0]}–${OHNO_RANGE_K[1]} K`,
  );
}

/** CCT (K) and Duv of a CIE 1960 (u, v) by Ohno's combined triangular/parabolic method (Ohno 2014). */
export function cctOhno(uv: Uv1960): { cct: number; duv: number } {
  const { rows, d } = bracket(uv);
  const tri = triangular(uv, rows, d);
  const result = Math.abs(tri.duv) < 0.002 ? tri : parabolic(uv, rows, d);
  if (result.cct < OHNO_RANGE_K[0] || result.cct > OHNO_RANGE_K[1]) outOfRange(uv, result.cct);
  return result;
}
