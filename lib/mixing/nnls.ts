/**
 * Non-negative least squares, min ‖Ax − b‖ subject to x ≥ 0, by the active-set algorithm of Lawson & Hanson
 * (Solving Least Squares Problems, 1974, ch. 23, algorithm NNLS). Small dense problems only (a few rows and columns).
 */
import { checkList, checkNumberList } from "../arguments/check-list.ts";

/** Solves the unconstrained least-squares problem for the columns in `cols` (normal equations, Gaussian elimination with pivoting). */
function leastSquaresOn(
  A: readonly (readonly number[])[],
  b: readonly number[],
  cols: readonly number[],
): number[] | undefined {
  const m = A.length;
  const k = cols.length;
  const N = Array.from({ length: k }, () => new Array<number>(k + 1).fill(0));
  for (let p = 0; p < k; p++) {
    for (let q = 0; q < k; q++) {
      let s = 0;
      for (let r = 0; r < m; r++) s += A[r]![cols[p]!]! * A[r]![cols[q]!]!;
      N[p]![q] = s;
    }
    let s = 0;
    for (let r = 0; r < m; r++) s += A[r]![cols[p]!]! * b[r]!;
    N[p]![k] = s;
  }
  return solveAugmented(N);
}

/** Gaussian elimination with partial pivoting on an augmented k×(k+1) matrix; undefined when singular. */
export function solveAugmented(M: number[][]): number[] | undefined {
  const k = M.length;
  const scale = Math.max(1e-300, ...M.flatMap((row) => row.slice(0, k).map(Math.abs)));
  for (let c = 0; c < k; c++) {
    let piv = c;
    for (let r = c + 1; r < k; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[piv]![c]!)) piv = r;
    if (Math.abs(M[piv]![c]!) <= 1e-13 * scale) return undefined;
    [M[c], M[piv]] = [M[piv]!, M[c]!];
    for (let r = 0; r < k; r++) {
      if (r === c) continue;
      const f = M[r]![c]! / M[c]![c]!;
      for (let q = c; q <= k; q++) M[r]![q]! -= f * M[c]![q]!;
    }
  }
  return M.map((row, i) => row[k]! / row[i]!);
}

/**
 * The x ≥ 0 minimising ‖Ax − b‖₂, by the active-set algorithm (small dense problems only).
 *
 * @param A The matrix, by rows (a few rows and columns).
 * @param b The right-hand side, one value per row.
 * @returns x, one non-negative value per column.
 * @source C. L. Lawson, R. J. Hanson, Solving Least Squares Problems, 1974, ch. 23 (algorithm NNLS).
 * @example nonNegativeLeastSquares([[1, 0], [0, 1], [1, 1]], [1, -1, 0.5])
 */
export function nonNegativeLeastSquares(A: readonly (readonly number[])[], b: readonly number[]): number[] {
  checkList(
    "nonNegativeLeastSquares",
    "A",
    A,
    "rows of finite numbers",
    (r) => Array.isArray(r) && r.every(Number.isFinite),
    { minLength: 1 },
  );
  checkNumberList("nonNegativeLeastSquares", "b", b, { length: A.length });
  const m = A.length;
  const n = A[0]?.length ?? 0;
  if (m === 0 || n === 0 || b.length !== m)
    throw new Error(`nonNegativeLeastSquares: a ${m}×${n} matrix and ${b.length} targets do not fit`);
  for (const v of [...A.flat(), ...b])
    if (!Number.isFinite(v)) throw new Error(`nonNegativeLeastSquares: the data contain ${v}`);
  const x = new Array<number>(n).fill(0);
  const passive = new Set<number>();
  const tol = 1e-12 * Math.max(1, ...A.flat().map(Math.abs)) * Math.max(1, ...b.map(Math.abs));
  const gradient = () => {
    const r = b.map((bi, i) => bi - A[i]!.reduce((s, a, j) => s + a * x[j]!, 0));
    return Array.from({ length: n }, (_, j) => A.reduce((s, row, i) => s + row[j]! * r[i]!, 0));
  };
  for (let outer = 0; outer < 3 * n + 30; outer++) {
    const w = gradient();
    let best = -1;
    for (let j = 0; j < n; j++)
      if (!passive.has(j) && w[j]! > tol && (best < 0 || w[j]! > w[best]!)) best = j;
    if (best < 0) break;
    passive.add(best);
    for (let inner = 0; inner < 3 * n + 30; inner++) {
      const cols = [...passive].sort((p, q) => p - q);
      const z = leastSquaresOn(A, b, cols);
      if (!z) {
        passive.delete(best);
        break;
      }
      if (z.every((v) => v > 0)) {
        cols.forEach((c, i) => (x[c] = z[i]!));
        break;
      }
      let alpha = Infinity;
      cols.forEach((c, i) => {
        if (z[i]! <= 0) alpha = Math.min(alpha, x[c]! / (x[c]! - z[i]!));
      });
      cols.forEach((c, i) => {
        x[c] = x[c]! + alpha * (z[i]! - x[c]!);
        if (x[c]! <= 1e-15) {
          x[c] = 0;
          passive.delete(c);
        }
      });
    }
  }
  return x;
}
