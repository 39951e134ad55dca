/** Linear interpolation between neighbouring samples. */

/** Index i of the sample interval [xs[i], xs[i + 1]] that holds x, by bisection (xs strictly increasing, 2+ samples). */
export function intervalIndex(xs: readonly number[], x: number): number {
  let lo = 0;
  let hi = xs.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (xs[mid]! <= x) lo = mid;
    else hi = mid;
  }
  return lo;
}

/** Returns f(x) by straight lines between the samples (xs strictly increasing, x inside [xs[0], xs[n−1]]). */
export function linearInterpolator(xs: readonly number[], ys: readonly number[]): (x: number) => number {
  return (x: number) => {
    const n = xs.length;
    if (n === 1) return ys[0]!;
    const lo = intervalIndex(xs, x);
    const hi = lo + 1;
    const t = (x - xs[lo]!) / (xs[hi]! - xs[lo]!);
    return ys[lo]! + t * (ys[hi]! - ys[lo]!);
  };
}
