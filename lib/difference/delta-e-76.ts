/** CIE 1976 colour difference ΔE*ab: the Euclidean distance in CIELAB (CIE 015:2018 §8.2.1, eq. 8.14). */
import type { Lab } from "../colorimetry/cielab.ts";
import { noteMethod } from "../methods/method-log.ts";
import { requireLab } from "./check-lab.ts";
import { LAB_FIELDS, checkFields } from "../arguments/check-fields.ts";

/** ΔE*ab = √(ΔL*² + Δa*² + Δb*²) (CIE 015:2018 eq. 8.14). */
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
