/**
 * Correlated colour temperature and Duv by Ohno's combined method (Y. Ohno, "Practical use and calculation of CCT
 * and Duv", LEUKOS 10(1):47–55, 2014): the nearest point of a Planckian table in CIE 1960 uv, then the triangular
 * solution when |Duv| < 0.002 and the parabolic solution otherwise. The table is fine (steps of 0.01 % of T), built
 * once on first use, so the published refinement needs no further locus evaluations.
 */
import type { Uv1960 } from "../colorimetry/chromaticity.ts";
import { planckianLocusAtReciprocal } from "./planckian-locus.ts";

/** The temperature range (K) of the Planckian table the Ohno method searches. */
export const OHNO_RANGE_K = [1000, 100000] as const;
/** Ratio between neighbouring rows of the fine table: steps of 0.01 % of T. */
export const OHNO_STEP_RATIO = 1.0001;
/** Exact locus points (Planck's law summed over the observer) every NODE_EVERY rows; rows between are interpolated. */
const NODE_EVERY = 100; // nodes 1 % apart
/**
 * Rows of the local refinement per table row: the triangular solution's error grows with the step times |Duv| times
 * the locus curvature, the parabolic one's with the step squared (much finer parabolic steps only add rounding).
 */
const TRIANGULAR_SUB_ROWS = 100;
const PARABOLIC_SUB_ROWS = 10;
/** T(c)/T(a) for the triangular solution's two refined rows, 2/TRIANGULAR_SUB_ROWS of a row apart. */
const TRIANGULAR_PAIR_RATIO = Math.exp((2 / TRIANGULAR_SUB_ROWS) * Math.log(OHNO_STEP_RATIO));
/** T(row + 1/PARABOLIC_SUB_ROWS)/T(row) for the parabolic solution's neighbouring refined rows. */
const PARABOLIC_STEP_RATIO = Math.exp((1 / PARABOLIC_SUB_ROWS) * Math.log(OHNO_STEP_RATIO));
/** Rows beyond each end of the range, so that a CCT at the very limits still has a row on either side. */
const MARGIN_ROWS = 2 * NODE_EVERY;
/**
 * Rows between the points of the search table: the nearest row is searched first among every SEARCH_EVERY-th row
 * (about 900 points, 15 kB, which stay in the processor's first-level cache), then among the 2·SEARCH_EVERY rows
 * around the point found. A search of the whole 750 kB table in one go waits on a cache miss at most of its steps.
 */
const SEARCH_EVERY = NODE_EVERY / 2;
/** Rows between the points of the coarse whole-table scan used for chromaticities far from the locus. */
const COARSE_EVERY = 25;
/**
 * Up to this distance from the locus (uv) the nearest locus point is unique and the distance falls monotonically
 * towards it along the table: the locus's smallest radius of curvature between 1000 K and 100 000 K is about 0.100
 * (near 5200 K), so a binary search on the slope of the distance finds it. Farther points get a whole-table scan.
 */
const UNIMODAL_DISTANCE = 0.05;

/**
 * The locus as a piecewise cubic in ln T: exact points (Planck's law summed over the observer) with their slopes at
 * nodes NODE_EVERY rows apart, cubic Hermite between them (exact to about 2e-11 in u and v); and the fine table, the
 * cubic sampled at every row: row i is at ln T = first + i·step.
 */
interface LocusTable {
  readonly first: number;
  readonly step: number;
  readonly t: Float64Array;
  /** u and v of row i at 2i and 2i + 1 (side by side, so each step of the search reads one cache line). */
  readonly uv: Float64Array;
  /** u and v of row SEARCH_EVERY·j at 2j and 2j + 1. */
  readonly searchUv: Float64Array;
  readonly nodeU: Float64Array;
  readonly nodeV: Float64Array;
  /** Slopes du/d ln T and dv/d ln T at the nodes, times the node spacing in ln T. */
  readonly slopeU: Float64Array;
  readonly slopeV: Float64Array;
}

let table: LocusTable | undefined;

function buildTable(): LocusTable {
  const step = Math.log(OHNO_STEP_RATIO);
  const first = Math.log(OHNO_RANGE_K[0]) - MARGIN_ROWS * step;
  const inner = Math.ceil(Math.log(OHNO_RANGE_K[1] / OHNO_RANGE_K[0]) / step);
  const nodes = Math.ceil((inner + 2 * MARGIN_ROWS) / NODE_EVERY) + 1;
  const rows = (nodes - 1) * NODE_EVERY + 1;
  const nodeU = new Float64Array(nodes),
    nodeV = new Float64Array(nodes),
    slopeU = new Float64Array(nodes),
    slopeV = new Float64Array(nodes);
  const h = NODE_EVERY * step;
  for (let k = 0; k < nodes; k++) {
    const s = Math.exp(-(first + k * h));
    const p = planckianLocusAtReciprocal(s);
    nodeU[k] = p.u;
    nodeV[k] = p.v;
    // d/d ln T = −s·d/ds, s = 1/T
    slopeU[k] = -s * p.duds * h;
    slopeV[k] = -s * p.dvds * h;
  }
  const tab = {
    first,
    step,
    t: new Float64Array(rows),
    uv: new Float64Array(2 * rows),
    searchUv: new Float64Array(2 * ((rows - 1) / SEARCH_EVERY + 1)),
    nodeU,
    nodeV,
    slopeU,
    slopeV,
  };
  // The rows between two nodes share their Hermite weights.
  const weights = new Float64Array(4 * NODE_EVERY);
  for (let j = 0; j < NODE_EVERY; j++) {
    const x = j / NODE_EVERY,
      y = 1 - x;
    weights.set([(1 + 2 * x) * y * y, x * y * y, x * x * (3 - 2 * x), -x * x * y], 4 * j);
  }
  for (let i = 0; i < rows; i++) {
    tab.t[i] = Math.exp(first + i * step);
    const k = Math.min(Math.floor(i / NODE_EVERY), nodes - 2);
    const w = 4 * (i - k * NODE_EVERY);
    const h00 = weights[w]!,
      h10 = weights[w + 1]!,
      h01 = weights[w + 2]!,
      h11 = weights[w + 3]!;
    tab.uv[2 * i] = h00 * nodeU[k]! + h10 * slopeU[k]! + h01 * nodeU[k + 1]! + h11 * slopeU[k + 1]!;
    tab.uv[2 * i + 1] = h00 * nodeV[k]! + h10 * slopeV[k]! + h01 * nodeV[k + 1]! + h11 * slopeV[k + 1]!;
  }
  for (let j = 0; 2 * j < tab.searchUv.length; j++) {
    tab.searchUv[2 * j] = tab.uv[2 * j * SEARCH_EVERY]!;
    tab.searchUv[2 * j + 1] = tab.uv[2 * j * SEARCH_EVERY + 1]!;
  }
  return tab;
}

/** The locus at a fractional row position (cubic Hermite between the nodes), written into `out`. */
function locusAtRow(tab: Omit<LocusTable, "t" | "uv">, row: number, out: { u: number; v: number }): void {
  const k = Math.min(Math.floor(row / NODE_EVERY), tab.nodeU.length - 2);
  const x = (row - k * NODE_EVERY) / NODE_EVERY;
  const y = 1 - x;
  const h00 = (1 + 2 * x) * y * y,
    h10 = x * y * y,
    h01 = x * x * (3 - 2 * x),
    h11 = -x * x * y;
  out.u = h00 * tab.nodeU[k]! + h10 * tab.slopeU[k]! + h01 * tab.nodeU[k + 1]! + h11 * tab.slopeU[k + 1]!;
  out.v = h00 * tab.nodeV[k]! + h10 * tab.slopeV[k]! + h01 * tab.nodeV[k + 1]! + h11 * tab.slopeV[k + 1]!;
}

/** The fine table, built on first use and kept for the run. */
export function ohnoTable(): LocusTable {
  return (table ??= buildTable());
}

function distance2(tab: LocusTable, i: number, u: number, v: number): number {
  return pointDistance2(tab.uv, i, u, v);
}

/** Squared distance from (u, v) to point i of an array of (u, v) pairs. */
function pointDistance2(uv: Float64Array, i: number, u: number, v: number): number {
  const a = u - uv[2 * i]!,
    b = v - uv[2 * i + 1]!;
  return a * a + b * b;
}

/** Index of the point nearest (u, v) between lo and hi (inclusive), by binary search on the slope of the distance. */
function nearestBySlope(uv: Float64Array, u: number, v: number, lo: number, hi: number): number {
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (pointDistance2(uv, mid + 1, u, v) >= pointDistance2(uv, mid, u, v)) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

/**
 * Index of the nearest row: the slope search on the search table, then on the rows either side of the point it found
 * (where the distance falls towards one point, the nearest row is within a search step of the nearest search point),
 * checked by a whole-table scan for points far from the locus.
 */
function nearestRow(tab: LocusTable, u: number, v: number): number {
  const last = tab.t.length - 1;
  const s = nearestBySlope(tab.searchUv, u, v, 0, tab.searchUv.length / 2 - 1);
  const i = nearestBySlope(
    tab.uv,
    u,
    v,
    Math.max(0, (s - 1) * SEARCH_EVERY),
    Math.min(last, (s + 1) * SEARCH_EVERY),
  );
  if (distance2(tab, i, u, v) <= UNIMODAL_DISTANCE * UNIMODAL_DISTANCE) return i;
  let best = 0,
    bestD = Infinity;
  for (let k = 0; k <= last; k += COARSE_EVERY) {
    const d = distance2(tab, k, u, v);
    if (d < bestD) [best, bestD] = [k, d];
  }
  let j = best;
  for (let k = Math.max(0, best - COARSE_EVERY); k <= Math.min(last, best + COARSE_EVERY); k++)
    if (distance2(tab, k, u, v) < distance2(tab, j, u, v)) j = k;
  return j;
}

/**
 * Ohno (2014) triangular solution from two locus points a and c either side of the nearest one, at distances d0 and
 * d2 from the chromaticity (eqs. for x, Tx and Duv).
 */
function triangular(
  ta: number,
  ua: number,
  va: number,
  tc: number,
  uc: number,
  vc: number,
  v: number,
  d0: number,
  d2: number,
) {
  const dU = uc - ua,
    dV = vc - va;
  const l = Math.sqrt(dU * dU + dV * dV);
  const x = (d0 * d0 - d2 * d2 + l * l) / (2 * l);
  const cct = ta + (tc - ta) * (x / l);
  const vTx = va + dV * (x / l);
  const duv = Math.sqrt(Math.max(d0 * d0 - x * x, 0)) * Math.sign(v - vTx);
  return { cct, duv };
}

const point = { u: 0, v: 0 };
const pointC = { u: 0, v: 0 };

function distance2At(tab: LocusTable, row: number, u: number, v: number): number {
  locusAtRow(tab, row, point);
  const a = u - point.u,
    b = v - point.v;
  return a * a + b * b;
}

/**
 * The table refined around the nearest row m to steps of 1/sub of a row, read off the locus cubic (no further locus
 * sums): the fractional row of the nearest refined row, walking downhill from an estimate of it (the triangular
 * solution on the fine table is within a few refined rows).
 */
function refinedNearest(
  tab: LocusTable,
  m: number,
  estimate: number,
  u: number,
  v: number,
  sub: number,
): number {
  const lo = 1 - sub,
    hi = sub - 1;
  let j = Math.min(hi, Math.max(lo, Math.round((estimate - m) * sub)));
  let d = distance2At(tab, m + j / sub, u, v);
  const up = j < hi ? distance2At(tab, m + (j + 1) / sub, u, v) : Infinity;
  if (up < d) {
    j++;
    d = up;
    while (j < hi) {
      const next = distance2At(tab, m + (j + 1) / sub, u, v);
      if (next >= d) break;
      j++;
      d = next;
    }
  } else {
    while (j > lo) {
      const next = distance2At(tab, m + (j - 1) / sub, u, v);
      if (next >= d) break;
      j--;
      d = next;
    }
  }
  return m + j / sub;
}

function temperatureAtRow(tab: LocusTable, row: number): number {
  return Math.exp(tab.first + row * tab.step);
}

/** The triangular solution on the two (fractional) rows `half` either side of a row. */
function triangularAround(tab: LocusTable, row: number, half: number, u: number, v: number) {
  const a = row - half,
    c = row + half;
  locusAtRow(tab, a, point);
  locusAtRow(tab, c, pointC);
  const d0 = Math.sqrt((u - point.u) ** 2 + (v - point.v) ** 2),
    d2 = Math.sqrt((u - pointC.u) ** 2 + (v - pointC.v) ** 2);
  const ta = temperatureAtRow(tab, a);
  return triangular(
    ta,
    point.u,
    point.v,
    ta * (half === 1 / TRIANGULAR_SUB_ROWS ? TRIANGULAR_PAIR_RATIO : Math.exp(2 * half * tab.step)),
    pointC.u,
    pointC.v,
    v,
    d0,
    d2,
  );
}

/**
 * Ohno (2014) parabolic solution: d(T) = aT² + bT + c through the rows `half` either side of a row and that row,
 * Tx = −b/2a, |Duv| = d(Tx). Written about the middle row's temperature, which is the same parabola with less
 * rounding error. The sign of Duv is that of v − v(Tx), with v(Tx) read off the locus cubic.
 */
function parabolicAround(tab: LocusTable, row: number, half: number, u: number, v: number) {
  const t0 = temperatureAtRow(tab, row);
  const ratio = half === 1 / PARABOLIC_SUB_ROWS ? PARABOLIC_STEP_RATIO : Math.exp(half * tab.step);
  const x1 = t0 / ratio - t0,
    x3 = t0 * ratio - t0;
  const d1 = Math.sqrt(distance2At(tab, row - half, u, v)),
    d2 = Math.sqrt(distance2At(tab, row, u, v)),
    d3 = Math.sqrt(distance2At(tab, row + half, u, v));
  // Parabola through (x1, d1), (0, d2), (x3, d3).
  const a = ((d1 - d2) / x1 - (d3 - d2) / x3) / (x1 - x3);
  const b = (d1 - d2) / x1 - a * x1;
  const xm = -b / (2 * a);
  const cct = t0 + xm;
  const dist = a * xm * xm + b * xm + d2;
  // The row of Tx to first order, ln(1 + xm/t0) ≈ xm/t0: xm is under a row, 1e-4 of t0, so the row is off by
  // under 1e-6 of a row, and the sign is asked only at |Duv| ≥ 0.002.
  locusAtRow(tab, row + xm / t0 / tab.step, point);
  return { cct, duv: dist * Math.sign(v - point.v) };
}

function outOfRange(uv: Uv1960, t: number): never {
  throw new Error(
    `CCT (Ohno 2014): the chromaticity u = ${uv.u.toFixed(5)}, v = ${uv.v.toFixed(5)} is nearest the Planckian locus at ${t < 10 * OHNO_RANGE_K[0] ? t.toFixed(0) : t.toPrecision(6)} K, outside the method's range ${OHNO_RANGE_K[0]}–${OHNO_RANGE_K[1]} K`,
  );
}

/**
 * CCT (K) and Duv of a CIE 1960 (u, v) by Ohno's combined triangular/parabolic method (Ohno 2014): the nearest row of
 * the fine table; the triangular solution on its neighbours chooses the solution (triangular when |Duv| < 0.002),
 * which is then applied on the table refined around the nearest row (0.0001 % steps triangular, 0.001 % parabolic).
 */
export function cctOhno(uv: Uv1960): { cct: number; duv: number } {
  const tab = ohnoTable();
  const u = uv.u,
    v = uv.v;
  const m = nearestRow(tab, u, v);
  if (m === 0 || m === tab.t.length - 1) outOfRange(uv, tab.t[m]!);
  const i = m - 1,
    k = m + 1;
  const d1 = Math.sqrt(distance2(tab, i, u, v)),
    d3 = Math.sqrt(distance2(tab, k, u, v));
  // The triangular solution on the fine table: which solution to use, and where on the chord the nearest point is.
  const dU = tab.uv[2 * k]! - tab.uv[2 * i]!,
    dV = tab.uv[2 * k + 1]! - tab.uv[2 * i + 1]!;
  const l2 = dU * dU + dV * dV;
  const along = (d1 * d1 - d3 * d3 + l2) / (2 * l2); // x / l of Ohno's triangular solution
  const duv2 = d1 * d1 - along * along * l2;
  const sub = duv2 < 0.002 * 0.002 ? TRIANGULAR_SUB_ROWS : PARABOLIC_SUB_ROWS;
  const row = refinedNearest(tab, m, i + 2 * along, u, v, sub);
  const result =
    sub === TRIANGULAR_SUB_ROWS
      ? triangularAround(tab, row, 1 / sub, u, v)
      : parabolicAround(tab, row, 1 / sub, u, v);
  if (result.cct < OHNO_RANGE_K[0] || result.cct > OHNO_RANGE_K[1]) outOfRange(uv, result.cct);
  return result;
}

/**
 * CIE 1960 (u, v) of the Planckian locus at T kelvin read off the fine table's cubic (within about 2e-11 of the
 * summed locus), or undefined outside the table (1000–100 000 K and a 1 % margin).
 */
export function tabulatedLocusUv(temperatureK: number): { u: number; v: number } | undefined {
  const tab = ohnoTable();
  const row = (Math.log(temperatureK) - tab.first) / tab.step;
  if (!(row >= 0 && row <= tab.t.length - 1)) return undefined;
  const out = { u: 0, v: 0 };
  locusAtRow(tab, row, out);
  return out;
}
