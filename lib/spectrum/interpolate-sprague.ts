/**
 * Sprague (1880) fifth-order interpolation for evenly spaced data, as CIE 167:2005 recommends for spectral data,
 * with the two extra points at each end extrapolated by the CIE 167:2005 boundary coefficients.
 */

const BOUNDARY = [
  [884, -1960, 3033, -2648, 1080, -180],
  [508, -540, 488, -367, 144, -24],
] as const;

/** Pads the samples with two extrapolated points at each end (CIE 167:2005, Table 1 boundary coefficients / 209). */
export function spraguePad(ys: readonly number[]): number[] {
  const n = ys.length;
  if (n < 6) throw new Error(`Sprague interpolation needs at least 6 evenly spaced samples, got ${n}`);
  const dot = (c: readonly number[], v: readonly number[]) =>
    c.reduce((sum, ci, i) => sum + ci * v[i]!, 0) / 209;
  const head = ys.slice(0, 6);
  const tail = ys.slice(n - 6).reverse();
  return [
    dot(BOUNDARY[0], head),
    dot(BOUNDARY[1], head),
    ...ys,
    dot(BOUNDARY[1], tail),
    dot(BOUNDARY[0], tail),
  ];
}

/** Returns f(x) by Sprague interpolation of samples starting at `start` every `step` (x inside the sampled range). */
export function spragueInterpolator(
  start: number,
  step: number,
  ys: readonly number[],
): (x: number) => number {
  const r = spraguePad(ys);
  const last = ys.length - 1;
  return (x: number) => {
    const u = (x - start) / step;
    let i = Math.floor(u);
    if (i >= last) i = last - 1;
    if (i < 0) i = 0;
    const t = u - i;
    // r[k + 2] is sample k; the six points around the interval [i, i + 1] are samples i − 2 … i + 3.
    const m2 = r[i]!,
      m1 = r[i + 1]!,
      p0 = r[i + 2]!,
      p1 = r[i + 3]!,
      p2 = r[i + 4]!,
      p3 = r[i + 5]!;
    const a1 = (2 * m2 - 16 * m1 + 16 * p1 - 2 * p2) / 24;
    const a2 = (-m2 + 16 * m1 - 30 * p0 + 16 * p1 - p2) / 24;
    const a3 = (-9 * m2 + 39 * m1 - 70 * p0 + 66 * p1 - 33 * p2 + 7 * p3) / 24;
    const a4 = (13 * m2 - 64 * m1 + 126 * p0 - 124 * p1 + 61 * p2 - 12 * p3) / 24;
    const a5 = (-5 * m2 + 25 * m1 - 50 * p0 + 50 * p1 - 25 * p2 + 5 * p3) / 24;
    return p0 + t * (a1 + t * (a2 + t * (a3 + t * (a4 + t * a5))));
  };
}
