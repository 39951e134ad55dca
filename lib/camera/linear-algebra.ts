/** Small dense linear algebra for the camera model: least squares by normal equations, orthonormal bases. */

/** Solves A x = b (square, by Gaussian elimination with partial pivoting); undefined when singular. */
export function solveSquare(A: number[][], b: number[]): number[] | undefined {
  const n = A.length;
  const M = A.map((row, i) => [...row, b[i]!]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(M[r]![c]!) > Math.abs(M[p]![c]!)) p = r;
    if (Math.abs(M[p]![c]!) < 1e-300) return undefined;
    [M[c], M[p]] = [M[p]!, M[c]!];
    for (let r = c + 1; r < n; r++) {
      const f = M[r]![c]! / M[c]![c]!;
      if (f === 0) continue;
      for (let k = c; k <= n; k++) M[r]![k]! -= f * M[c]![k]!;
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = M[r]![n]!;
    for (let k = r + 1; k < n; k++) s -= M[r]![k]! * x[k]!;
    x[r] = s / M[r]![r]!;
  }
  return x;
}

/**
 * Least squares: the coefficients c (one row per target column) minimising Σ_i (targets[i][j] − Σ_k c[j][k] features[i][k])².
 * Throws when the features are linearly dependent.
 */
export function leastSquares(features: number[][], targets: number[][], what: string): number[][] {
  const k = features[0]!.length;
  const ata = Array.from({ length: k }, (_, r) =>
    Array.from({ length: k }, (_, c) => features.reduce((s, f) => s + f[r]! * f[c]!, 0)),
  );
  const outs = targets[0]!.length;
  const rows: number[][] = [];
  for (let j = 0; j < outs; j++) {
    const atb = Array.from({ length: k }, (_, r) =>
      features.reduce((s, f, i) => s + f[r]! * targets[i]![j]!, 0),
    );
    const x = solveSquare(ata, atb);
    if (!x) throw new Error(`${what}: the terms are linearly dependent (too few or too alike samples)`);
    rows.push(x);
  }
  return rows;
}

/** Orthonormal basis (modified Gram–Schmidt) of the span of the given vectors; dependent ones are dropped. */
export function orthonormalBasis(vectors: number[][]): number[][] {
  const out: number[][] = [];
  for (const v of vectors) {
    const u = [...v];
    for (const q of out) {
      const d = u.reduce((s, x, i) => s + x * q[i]!, 0);
      for (let i = 0; i < u.length; i++) u[i]! -= d * q[i]!;
    }
    const n = Math.hypot(...u);
    const scale = Math.hypot(...v);
    if (n > 1e-10 * (scale || 1)) out.push(u.map((x) => x / n));
  }
  return out;
}
