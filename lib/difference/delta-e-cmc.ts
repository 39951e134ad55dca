/** CMC l:c colour difference (F. J. J. Clarke, R. McDonald, B. Rigg 1984; BS 6923:1988; ISO 105-J03:2009). */
import type { Lab } from "../colorimetry/cielab.ts";
import { noteMethod } from "../methods/method-log.ts";
import { requireFactor, requireLab } from "./check-lab.ts";
import { LAB_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";

export interface DeltaECMCOptions {
  /** Lightness weight l (default 2, the acceptability ratio 2:1). */
  l?: number;
  /** Chroma weight c (default 1). */
  c?: number;
}

/**
 * CMC l:c colour difference ΔE CMC(l:c) of a sample from a reference (default 2:1, acceptability).
 *
 * ΔE CMC = √((ΔL* ÷ l·SL)² + (ΔC* ÷ c·SC)² + (ΔH* ÷ SH)²), with SL, SC, SH from the reference (first) colour.
 *
 * @param reference The reference (standard) colour, CIELAB { L, a, b }.
 * @param sample The sample (batch) colour, CIELAB { L, a, b }.
 * @returns ΔE CMC(l:c), dimensionless.
 * @source ISO 105-J03:2009 §6; F. J. J. Clarke, R. McDonald, B. Rigg, JSDC 100:128–132, 1984.
 * @example deltaECMC({ L: 50, a: 20, b: -10 }, { L: 51, a: 18, b: -9 }, { l: 1, c: 1 })
 */
export function deltaECMC(reference: Lab, sample: Lab, options: DeltaECMCOptions = {}): number {
  checkFields("deltaECMC", "reference", reference, LAB_FIELDS);
  checkFields("deltaECMC", "sample", sample, LAB_FIELDS);
  checkOptions("deltaECMC", "options", options, ["l", "c"]);
  requireLab("deltaECMC", "reference (first)", reference);
  requireLab("deltaECMC", "sample (second)", sample);
  const l = options.l ?? 2;
  const c = options.c ?? 1;
  requireFactor("deltaECMC", "l", l);
  requireFactor("deltaECMC", "c", c);
  noteMethod(
    "colour difference",
    `Colour differences ΔE CMC(${l}:${c}) were computed per ISO 105-J03 (Clarke, McDonald & Rigg 1984); the first colour of each pair is the reference.`,
  );
  const L1 = reference.L;
  const c1 = Math.sqrt(reference.a * reference.a + reference.b * reference.b);
  const c2 = Math.sqrt(sample.a * sample.a + sample.b * sample.b);
  let h1 = (Math.atan2(reference.b, reference.a) * 180) / Math.PI;
  if (h1 < 0) h1 += 360;
  const dL = L1 - sample.L;
  const dC = c1 - c2;
  const da = reference.a - sample.a,
    db = reference.b - sample.b;
  const dH2 = Math.max(da * da + db * db - dC * dC, 0);
  const sL = L1 < 16 ? 0.511 : (0.040975 * L1) / (1 + 0.01765 * L1);
  const sC = (0.0638 * c1) / (1 + 0.0131 * c1) + 0.638;
  const c14 = c1 ** 4;
  const f = Math.sqrt(c14 / (c14 + 1900));
  const t =
    h1 >= 164 && h1 <= 345
      ? 0.56 + Math.abs(0.2 * Math.cos(((h1 + 168) * Math.PI) / 180))
      : 0.36 + Math.abs(0.4 * Math.cos(((h1 + 35) * Math.PI) / 180));
  const sH = sC * (f * t + 1 - f);
  return Math.sqrt((dL / (l * sL)) ** 2 + (dC / (c * sC)) ** 2 + dH2 / (sH * sH));
}
