/**
 * The special metamerism index for a change of illuminant (CIE 015:2018, "special metamerism index: change in illuminant"; also in CIE 015:2004): two samples
 * that match under a reference illuminant are compared under a test illuminant, and the colour difference there is
 * the index. When the pair does not match exactly under the reference, sample 2 is first corrected — by default
 * multiplicatively in X, Y, Z (X₂,t·X₁,r/X₂,r, …), or additively in CIELAB — as CIE 015 describes.
 */
import { labFromXYZ, type Lab } from "../colorimetry/cielab.ts";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { commonSummationInterval, objectColour } from "../colorimetry/tristimulus.ts";
import { deltaE2000 } from "../difference/delta-e-2000.ts";
import { deltaE76 } from "../difference/delta-e-76.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Observer, ObserverName } from "../observers/standard-observer.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";

export type MetamerismCorrection = "multiplicative" | "additive" | "none";
export type MetamerismFormula = "ΔE*ab" | "ΔE00";

export interface MetamerismOptions {
  /** The illuminant under which the pair matches (default "D65"). */
  reference?: string | Spectrum;
  /** The illuminant the pair is judged under (default "A"). */
  test?: string | Spectrum;
  /** Observer: "2°" or "10°" or an `Observer`; default the CIE 1931 2° observer. */
  observer?: ObserverName | Observer | 2 | 10;
  /** Correction of an imperfect match under the reference (default "multiplicative", CIE 015). */
  correction?: MetamerismCorrection;
  /** Colour-difference formula of the index (default "ΔE*ab"). */
  formula?: MetamerismFormula;
  /** Summation interval for samples and whites alike (default: 1 nm only when both samples and both illuminants are at 1 nm, else 5 nm). */
  interval?: 1 | 5;
}

export interface MetamerismIndex {
  /** The special metamerism index: the colour difference under the test illuminant after the correction. */
  readonly index: number;
  readonly formula: MetamerismFormula;
  readonly correction: MetamerismCorrection;
  /** The colour difference of the pair under the reference illuminant (0 for a perfect metameric match). */
  readonly mismatchUnderReference: number;
  readonly reference: string;
  readonly test: string;
  /** CIELAB of both samples under the test illuminant (sample 2 after correction). */
  readonly labUnderTest: readonly [Lab, Lab];
}

function nameOf(ill: string | Spectrum): string {
  return typeof ill === "string" ? ill : ill.name;
}

/**
 * Special metamerism index for a change of illuminant: the colour difference under a test illuminant of two samples that match under a reference illuminant.
 *
 * When the pair does not match exactly under the reference, sample 2 is first corrected (multiplicatively in X, Y, Z
 * by default, or additively in CIELAB).
 *
 * @param sample1 The first sample's reflectance or transmittance spectrum (fractions).
 * @param sample2 The second sample's spectrum.
 * @returns { index, formula, correction, mismatchUnderReference, reference, test, labUnderTest }.
 * @source CIE 015:2018, special metamerism index: change in illuminant.
 * @example metamerismIndex(spectrumOnGrid(380, 40, [0.2, 0.3, 0.4, 0.35, 0.3, 0.3, 0.35, 0.4, 0.4, 0.4, 0.4]), spectrumOnGrid(380, 40, [0.25, 0.28, 0.38, 0.38, 0.28, 0.32, 0.33, 0.42, 0.38, 0.4, 0.4])).index
 */
export function metamerismIndex(
  sample1: Spectrum,
  sample2: Spectrum,
  options: MetamerismOptions = {},
): MetamerismIndex {
  checkSpectrum("metamerismIndex", "sample1", sample1, { what: "a reflectance spectrum (fractions 0–1)" });
  checkSpectrum("metamerismIndex", "sample2", sample2, { what: "a reflectance spectrum (fractions 0–1)" });
  checkOptions("metamerismIndex", "options", options, [
    "reference",
    "test",
    "observer",
    "correction",
    "formula",
    "interval",
  ]);
  const reference = options.reference ?? "D65";
  const test = options.test ?? "A";
  const correction = options.correction ?? "multiplicative";
  const formula = options.formula ?? "ΔE*ab";
  if (!["multiplicative", "additive", "none"].includes(correction))
    throw new Error(
      `metamerismIndex: correction "${String(correction)}" is not "multiplicative", "additive" or "none"`,
    );
  if (formula !== "ΔE*ab" && formula !== "ΔE00")
    throw new Error(`metamerismIndex: formula "${String(formula)}" is not "ΔE*ab" or "ΔE00"`);
  const observer = options.observer;
  const difference = (a: Lab, b: Lab) => (formula === "ΔE00" ? deltaE2000(a, b) : deltaE76(a, b));
  // Both samples and both whites on one interval: the whites are summed on the same tables as the samples.
  const interval = options.interval ?? commonSummationInterval([sample1, sample2], [reference, test]);
  const underRef = { illuminant: reference, observer, interval };
  const underTest = { illuminant: test, observer, interval };
  const c1Ref = objectColour(sample1, underRef);
  const c1Test = objectColour(sample1, underTest);
  const whiteRef = c1Ref.white;
  const whiteTest = c1Test.white;
  const r1 = c1Ref.XYZ;
  const r2 = objectColour(sample2, underRef).XYZ;
  const t1 = c1Test.XYZ;
  let t2: Tristimulus = objectColour(sample2, underTest).XYZ;
  const labR1 = labFromXYZ(r1, whiteRef);
  const labR2 = labFromXYZ(r2, whiteRef);
  const mismatchUnderReference = difference(labR1, labR2);
  const lab1 = labFromXYZ(t1, whiteTest);
  let lab2: Lab;
  if (correction === "multiplicative") {
    for (const [k, v] of Object.entries(r2)) {
      if (!(v > 0))
        throw new Error(
          `metamerismIndex: sample "${sample2.name}" has ${k} = ${v} under the reference illuminant; a multiplicative correction needs positive values`,
        );
    }
    t2 = { X: (t2.X * r1.X) / r2.X, Y: (t2.Y * r1.Y) / r2.Y, Z: (t2.Z * r1.Z) / r2.Z };
    lab2 = labFromXYZ(t2, whiteTest);
  } else if (correction === "additive") {
    const raw = labFromXYZ(t2, whiteTest);
    lab2 = { L: raw.L - (labR2.L - labR1.L), a: raw.a - (labR2.a - labR1.a), b: raw.b - (labR2.b - labR1.b) };
  } else {
    lab2 = labFromXYZ(t2, whiteTest);
  }
  noteMethod(
    "colour rendering",
    `Special metamerism indices for a change of illuminant (CIE 015:2018) were computed from ${nameOf(reference)} to ${nameOf(test)} as ${formula}, with ${correction === "none" ? "no correction" : `${correction === "additive" ? "an" : "a"} ${correction} correction`} of the residual mismatch under the reference illuminant.`,
  );
  return {
    index: difference(lab1, lab2),
    formula,
    correction,
    mismatchUnderReference,
    reference: nameOf(reference),
    test: nameOf(test),
    labUnderTest: [lab1, lab2],
  };
}
