/** CIE 1976 colour difference ΔE*ab: the Euclidean distance in CIELAB (CIE 015:2018 §8.2.1, eq. 8.14). */
import type { Lab } from "../colorimetry/cielab.ts";
import { noteMethod } from "../methods/method-log.ts";
import { requireLab } from "./check-lab.ts";
import { LAB_FIELDS, checkFields } from "../arguments/check-fields.ts";

/**
 * CIE 1976 colour difference ΔE*ab: the Euclidean distance of two colours in CIELAB.
 *
 * ΔE*ab = √(ΔL*² + Δa*² + Δb*²); the order of the two colours does not matter.
 *
 * @param a The first colour, CIELAB { L, a, b } (L* 0–100).
 * @param b The second colour, CIELAB { L, a, b }.
 * @returns ΔE*ab, in CIELAB units (dimensionless).
 * @source CIE 015:2018 §8.2.1, eq. 8.14.
 * @example deltaE76({ L: 50, a: 2, b: -3 }, { L: 52, a: 0, b: 0 })
 */
export function deltaE76(a: Lab, b: Lab): number {
  checkFields("deltaE76", "a", a, LAB_FIELDS);
  checkFields("deltaE76", "b", b, LAB_FIELDS);
  requireLab("deltaE76", "first", a);
  requireLab("deltaE76", "second", b);
  noteMethod(
    "colour difference",
    "Colour differences ΔE*ab were computed by the CIE 1976 formula (CIE 015:2018 eq. 8.14).",
  );
  const dL = a.L - b.L,
    da = a.a - b.a,
    db = a.b - b.b;
  return Math.sqrt(dL * dL + da * da + db * db);
}
