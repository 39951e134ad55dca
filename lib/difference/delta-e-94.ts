/** CIE 1994 colour difference ΔE*94 (CIE 116-1995, Industrial colour-difference evaluation). */
import type { Lab } from "../colorimetry/cielab.ts";
import { noteMethod } from "../methods/method-log.ts";
import { requireLab } from "./check-lab.ts";
import { LAB_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";

export interface DeltaE94Options {
  /**
   * "graphic arts" (default): kL = 1, K1 = 0.045, K2 = 0.015; "textiles": kL = 2, K1 = 0.048, K2 = 0.014
   * (the weightings given with CIE 116-1995 for the two industries).
   */
  application?: "graphic arts" | "textiles";
}

const WEIGHTS = {
  "graphic arts": { kL: 1, k1: 0.045, k2: 0.015 },
  textiles: { kL: 2, k1: 0.048, k2: 0.014 },
} as const;

/**
 * CIE 1994 colour difference ΔE*94 of a sample from a reference.
 *
 * ΔE*94 = √((ΔL* ÷ kL·SL)² + (ΔC*ab ÷ SC)² + (ΔH*ab ÷ SH)²), SL = 1, SC = 1 + K1·C*, SH = 1 + K2·C*, with C* the
 * chroma of the first colour, taken as the reference (standard) as CIE 116-1995 specifies; so the order matters.
 *
 * @param reference The reference (standard) colour, CIELAB { L, a, b }.
 * @param sample The sample (batch) colour, CIELAB { L, a, b }.
 * @returns ΔE*94, in CIELAB units (dimensionless).
 * @source CIE 116-1995, Industrial colour-difference evaluation.
 * @example deltaE94({ L: 50, a: 20, b: -10 }, { L: 51, a: 18, b: -9 }, { application: "textiles" })
 */
export function deltaE94(reference: Lab, sample: Lab, options: DeltaE94Options = {}): number {
  checkFields("deltaE94", "reference", reference, LAB_FIELDS);
  checkFields("deltaE94", "sample", sample, LAB_FIELDS);
  checkOptions("deltaE94", "options", options, ["application"]);
  requireLab("deltaE94", "reference (first)", reference);
  requireLab("deltaE94", "sample (second)", sample);
  const application = options.application ?? "graphic arts";
  const w = WEIGHTS[application];
  if (!w)
    throw new Error(
      `deltaE94: unknown application "${String(application)}"; use "graphic arts" or "textiles"`,
    );
  noteMethod(
    "colour difference",
    `Colour differences ΔE*94 were computed by CIE 116-1995 with the ${application} weights (kL = ${w.kL}, K1 = ${w.k1}, K2 = ${w.k2}); the first colour of each pair is the reference.`,
  );
  const c1 = Math.sqrt(reference.a * reference.a + reference.b * reference.b);
  const c2 = Math.sqrt(sample.a * sample.a + sample.b * sample.b);
  const dL = reference.L - sample.L;
  const dC = c1 - c2;
  const da = reference.a - sample.a,
    db = reference.b - sample.b;
  const dH2 = Math.max(da * da + db * db - dC * dC, 0);
  const sC = 1 + w.k1 * c1;
  const sH = 1 + w.k2 * c1;
  const tL = dL / w.kL;
  return Math.sqrt(tL * tL + (dC / sC) ** 2 + dH2 / (sH * sH));
}
