/** Natural cubic spline through irregularly spaced samples (e.g. Burden & Faires, Numerical Analysis, §3.5). */
import { intervalIndex } from "./interpolate-linear.ts";

/** Returns f(x) of the natural cubic spline through the samples (xs strictly increasing, at least 3 points). */
export function cubicSplineInterpolator(xs: readonly number[], ys: readonly number[]): (x: number) => number {
  const n = xs.length;
  if (n < 3) throw new Error(`a cubic spline needs at least 3 samples, got ${n}`);
  // Second derivatives m[i] from the tridiagonal system with m[0] = m[n−1] = 0 (natural end conditions).
  const m = new Float64Array(n);
  const c = new Float64Array(n);
  const d = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) {
    const h0 = xs[i]! - xs[i - 1]!;
    const h1 = xs[i + 1]! - xs[i]!;
    const rhs = 6 * ((ys[i + 1]! - ys[i]!) / h1 - (ys[i]! - ys[i - 1]!) / h0);
    const diag = 2 * (h0 + h1) - h0 * c[i - 1]!;
    c[i] = h1 / diag;
    d[i] = (rhs - h0 * d[i - 1]!) / diag;
  }
  for (let i = n - 2; i >= 1; i--) m[i] = d[i]! - c[i]! * m[i + 1]!;
  return (x: number) => {
    const lo = intervalIndex(xs, x);
    const hi = lo + 1;
    const h = xs[hi]! - xs[lo]!;
    const a = (xs[hi]! - x) / h;
    const b = (x - xs[lo]!) / h;
    return a * ys[lo]! + b * ys[hi]! + (((a * a * a - a) * m[lo]! + (b * b * b - b) * m[hi]!) * (h * h)) / 6;
  };
}
