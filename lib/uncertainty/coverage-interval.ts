/** Internal: coverage intervals and summary statistics of Monte Carlo values (JCGM 101:2008 §7.6–7.7). */

/** The probabilistically symmetric (§7.7.1) or shortest (§7.7.2) coverage interval of sorted values. */
export function coverageIntervalOfSorted(
  sorted: Float64Array,
  p: number,
  kind: "symmetric" | "shortest",
): [number, number] {
  const M = sorted.length;
  // q = pM rounded to an integer (§7.7.1: pM + 1/2 when pM is not whole), as indices from 0.
  const q = Math.min(M - 1, Math.max(1, Math.floor(p * M + 0.5)));
  if (kind === "symmetric") {
    // r = (M − q) ÷ 2 rounded, 1-based (§7.7.1); as an index from 0, one less.
    const r = Math.max(0, Math.min(M - 1 - q, Math.floor((M - q) / 2 + 0.5) - 1));
    return [sorted[r]!, sorted[r + q]!];
  }
  let best = 0;
  let width = Infinity;
  for (let r = 0; r + q < M; r++) {
    const w = sorted[r + q]! - sorted[r]!;
    if (w < width) {
      width = w;
      best = r;
    }
  }
  return [sorted[best]!, sorted[best + q]!];
}

/** Mean and standard deviation (divisor M − 1) of values (§7.6). */
export function meanAndDeviation(values: Float64Array, from = 0, to = values.length): [number, number] {
  let sum = 0;
  for (let i = from; i < to; i++) sum += values[i]!;
  const m = sum / (to - from);
  let ss = 0;
  for (let i = from; i < to; i++) ss += (values[i]! - m) ** 2;
  return [m, Math.sqrt(ss / Math.max(1, to - from - 1))];
}

/** The numerical tolerance δ of a standard uncertainty given to ndig significant digits (§7.9.2): ½ × 10^ℓ. */
export function numericalTolerance(u: number, digits: number): number {
  if (!(u > 0)) return 0;
  const l = Math.floor(Math.log10(u)) - digits + 1;
  return 0.5 * 10 ** l;
}

/** The correlation coefficient of two equally long series. */
export function correlation(a: Float64Array, b: Float64Array, n = a.length): number {
  let ma = 0,
    mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i]!;
    mb += b[i]!;
  }
  ma /= n;
  mb /= n;
  let sab = 0,
    saa = 0,
    sbb = 0;
  for (let i = 0; i < n; i++) {
    const da = a[i]! - ma,
      db = b[i]! - mb;
    sab += da * db;
    saa += da * da;
    sbb += db * db;
  }
  return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : 0;
}
