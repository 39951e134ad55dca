/**
 * How far a camera is from the Luther–Ives condition (its sensitivities a linear transform of the colour-matching
 * functions): the Vora–Trussell quality factor, the best 3 × 3 transform and what it leaves over.
 */
import { noteMethod } from "../methods/method-log.ts";
import {
  colourMatchingAt,
  observerByName,
  type Observer,
  type ObserverName,
} from "../observers/standard-observer.ts";
import type { Matrix3 } from "../colorimetry/matrix3.ts";
import { illuminant as illuminantByName } from "../illuminants/standard-illuminant.ts";
import { sampler } from "../spectrum/sample.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkIlluminantChoice, checkObserver } from "../arguments/common-arguments.ts";
import { checkCameraSensor, type CameraSensor } from "./camera-sensor.ts";
import { leastSquares, orthonormalBasis } from "./linear-algebra.ts";

export interface LutherIvesOptions {
  /** The observer whose colour-matching functions are the target; default "2°" (CIE 1931). */
  observer?: ObserverName | Observer | 2 | 10;
  /** Weight both sets by an illuminant (a name or a spectrum), as Vora & Trussell allow; default none (equal energy). */
  illuminant?: string | Spectrum;
}

/** The result of `lutherIvesMeasure`. */
export interface LutherIvesResult {
  /** Vora–Trussell ν, 0–1: 1 exactly when the sensor spans the same space as the colour-matching functions. */
  readonly qualityFactor: number;
  /** The 3 × 3 matrix M (rows x̄, ȳ, z̄) that best gives the colour-matching functions from the sensitivities, CMF ≈ M·[r̄, ḡ, b̄]. */
  readonly matrix: Matrix3;
  /** ‖CMF − M·sensor‖ / ‖CMF‖ (Frobenius norms over the sensor's wavelengths): 0 when the condition holds. */
  readonly relativeResidual: number;
  /** True when ν is 1 within 1e-9. */
  readonly meetsLutherIves: boolean;
}

/**
 * How far a camera's sensitivities are from the Luther–Ives condition: the Vora–Trussell quality factor ν, the best 3 × 3 transform to the colour-matching functions and the residual it leaves.
 *
 * ν = trace(P_CMF · P_sensor)/3, where P are the orthogonal projectors onto the spans of the (optionally
 * illuminant-weighted) colour-matching functions and sensitivities on the sensor's wavelengths.
 *
 * @param sensor A `CameraSensor`.
 * @param options.observer The target observer; default "2°".
 * @param options.illuminant An illuminant to weight both sets by; default none (equal energy).
 * @returns { qualityFactor, matrix, relativeResidual, meetsLutherIves }.
 * @source Luther, Z. Tech. Phys. 8 (1927) 540–558 and Ives, J. Franklin Inst. 180 (1915) 673–701 (the condition); Vora & Trussell, J. Opt. Soc. Am. A 10(7) 1993 1499–1508 (ν).
 * @example lutherIvesMeasure(inventedCameraSensor()).qualityFactor
 */
export function lutherIvesMeasure(sensor: CameraSensor, options: LutherIvesOptions = {}): LutherIvesResult {
  checkCameraSensor("lutherIvesMeasure", sensor);
  checkOptions("lutherIvesMeasure", "options", options, ["observer", "illuminant"]);
  checkObserver("lutherIvesMeasure", "options.observer", options.observer);
  checkIlluminantChoice("lutherIvesMeasure", "options.illuminant", options.illuminant);
  const obs = observerByName(options.observer ?? "2°");
  const ill =
    options.illuminant === undefined
      ? undefined
      : typeof options.illuminant === "object"
        ? options.illuminant
        : illuminantByName(options.illuminant);
  const weight = ill ? sampler(ill, { extrapolation: "zero" }) : () => 1;
  const wl = sensor.wavelengths;
  const e = wl.map((w) => weight(w));
  const cmf = [0, 1, 2].map((c) => wl.map((w, i) => e[i]! * colourMatchingAt(obs, w)[c]!));
  const sens = [sensor.r, sensor.g, sensor.b].map((ch) => ch.map((v, i) => v * e[i]!));
  const qa = orthonormalBasis(cmf);
  const qb = orthonormalBasis(sens);
  let nu = 0;
  for (const a of qa) for (const b of qb) nu += a.reduce((s, x, i) => s + x * b[i]!, 0) ** 2;
  nu /= 3;
  // CMF(λ) ≈ M · sensor(λ): one least-squares row per colour-matching function, the wavelengths as samples.
  const features = wl.map((_, i) => [sens[0]![i]!, sens[1]![i]!, sens[2]![i]!]);
  const targets = wl.map((_, i) => [cmf[0]![i]!, cmf[1]![i]!, cmf[2]![i]!]);
  const m = leastSquares(features, targets, "lutherIvesMeasure");
  let res = 0,
    norm = 0;
  features.forEach((f, i) => {
    for (let j = 0; j < 3; j++) {
      const p = m[j]![0]! * f[0]! + m[j]![1]! * f[1]! + m[j]![2]! * f[2]!;
      res += (p - targets[i]![j]!) ** 2;
      norm += targets[i]![j]! ** 2;
    }
  });
  noteMethod(
    "other",
    `The camera's distance from the Luther–Ives condition was measured by the Vora–Trussell quality factor against the ${obs.name}${ill ? `, both weighted by ${ill.name}` : ""}, on the sensor's ${wl.length} wavelengths.`,
  );
  return {
    qualityFactor: nu,
    matrix: m as unknown as Matrix3,
    relativeResidual: Math.sqrt(res / norm),
    meetsLutherIves: Math.abs(nu - 1) < 1e-9,
  };
}
