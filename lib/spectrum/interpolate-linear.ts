/** Linear interpolation between neighbouring samples. */

/** Returns f(x) by straight lines between the samples (xs strictly increasing, x inside [xs[0], xs[n−1]]). */
export function linearInterpolator(xs: readonly number[], ys: readonly number[]): (x: number) => number {
  return (x: number) => {
    const n = xs.length;
    if (n === 1) return ys[0]!;
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (xs[mid]! <= x) lo = mid;
      else hi = mid;
    }
    const t = (x - xs[lo]!) / (xs[hi]! - xs[lo]!);
    return ys[lo]! + t * (ys[hi]! - ys[lo]!);
  };
}
