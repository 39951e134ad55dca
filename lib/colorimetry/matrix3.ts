/** 3 × 3 matrices for linear colour transforms (RGB ↔ XYZ, cone spaces), as plain nested arrays. */
import { checkMatrix3, checkNumberList } from "../arguments/check-list.ts";
import { checkString } from "../arguments/check-text.ts";

export type Vector3 = readonly [number, number, number];
export type Matrix3 = readonly [Vector3, Vector3, Vector3];

/**
 * The product of a 3 × 3 matrix and a 3-vector, m · v.
 *
 * @param m A 3 × 3 matrix as rows.
 * @param v A vector [a, b, c].
 * @returns The vector m · v.
 * @source none: linear algebra, no published formula.
 * @example applyMatrix3([[1, 0, 0], [0, 2, 0], [0, 0, 3]], [1, 1, 1])
 */
export function applyMatrix3(m: Matrix3, v: Vector3): [number, number, number] {
  checkMatrix3("applyMatrix3", "m", m);
  checkNumberList("applyMatrix3", "v", v, { length: 3 });
  return [
    m[0][0] * v[0] + m[0][1] * v[1] + m[0][2] * v[2],
    m[1][0] * v[0] + m[1][1] * v[1] + m[1][2] * v[2],
    m[2][0] * v[0] + m[2][1] * v[1] + m[2][2] * v[2],
  ];
}

/**
 * The product of two 3 × 3 matrices, a · b.
 *
 * @param a A 3 × 3 matrix as rows.
 * @param b A 3 × 3 matrix as rows.
 * @returns The matrix a · b.
 * @source none: linear algebra, no published formula.
 * @example multiplyMatrix3([[1, 2, 0], [0, 1, 0], [0, 0, 1]], [[1, 0, 0], [3, 1, 0], [0, 0, 1]])
 */
export function multiplyMatrix3(a: Matrix3, b: Matrix3): Matrix3 {
  checkMatrix3("multiplyMatrix3", "a", a);
  checkMatrix3("multiplyMatrix3", "b", b);
  const row = (i: 0 | 1 | 2): Vector3 => [
    a[i][0] * b[0][0] + a[i][1] * b[1][0] + a[i][2] * b[2][0],
    a[i][0] * b[0][1] + a[i][1] * b[1][1] + a[i][2] * b[2][1],
    a[i][0] * b[0][2] + a[i][1] * b[1][2] + a[i][2] * b[2][2],
  ];
  return [row(0), row(1), row(2)];
}

/**
 * The inverse of a 3 × 3 matrix by cofactors; a singular (or nearly singular) matrix is an error naming `what`.
 *
 * @param m A 3 × 3 matrix as rows.
 * @param what What the matrix is, for the error message; default "matrix".
 * @returns The inverse matrix.
 * @source none: linear algebra (inverse by cofactors), no published formula.
 * @example invertMatrix3([[2, 0, 0], [0, 4, 0], [0, 0, 5]])
 */
export function invertMatrix3(m: Matrix3, what = "matrix"): Matrix3 {
  checkMatrix3("invertMatrix3", "m", m);
  checkString("invertMatrix3", "what", what, {
    optional: true,
    what: "a description of the matrix for the error message",
  });
  const [[a, b, c], [d, e, f], [g, h, i]] = m;
  const A = e * i - f * h,
    B = -(d * i - f * g),
    C = d * h - e * g;
  const det = a * A + b * B + c * C;
  const scale = Math.max(...m.flat().map(Math.abs));
  if (!Number.isFinite(det) || Math.abs(det) <= 1e-12 * scale ** 3) {
    throw new Error(`${what} is singular (determinant ${det}); it cannot be inverted`);
  }
  return [
    [A / det, -(b * i - c * h) / det, (b * f - c * e) / det],
    [B / det, (a * i - c * g) / det, -(a * f - c * d) / det],
    [C / det, -(a * h - b * g) / det, (a * e - b * d) / det],
  ];
}

/**
 * A 3 × 3 diagonal matrix with the given diagonal.
 *
 * @param v The diagonal [a, b, c].
 * @returns The matrix.
 * @source none: linear algebra, no published formula.
 * @example diagonalMatrix3([1, 2, 3])
 */
export function diagonalMatrix3(v: Vector3): Matrix3 {
  checkNumberList("diagonalMatrix3", "v", v, { length: 3 });
  return [
    [v[0], 0, 0],
    [0, v[1], 0],
    [0, 0, v[2]],
  ];
}
