/** The law of propagation of uncertainty, first order, with sensitivity coefficients by central differences. */
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { UncertainInput } from "./input-models.ts";
import { prepareModel, type MeasurementModel } from "./model-evaluation.ts";
import type { UncertaintyResult } from "./uncertainty-result.ts";
import { firstOrderOf } from "./first-order-core.ts";
import { noteInputModels } from "./method-statements.ts";

export interface FirstOrderOptions {
  /** Coverage probability of the interval y ± k·u (k from the normal distribution); default 0.95. */
  coverage?: number;
}

/**
 * Propagates uncertainty by the law of propagation of uncertainty (first order), sensitivity coefficients by numerical differences.
 *
 * Each parameter of each input model (a scalar, or a spectral effect: scale, shift, bandwidth, every band's noise)
 * gets a sensitivity coefficient by a central difference with a step of 10⁻³ of its standard uncertainty;
 * u²(y) = Σ cᵢ² u²(xᵢ) plus the covariance terms of correlated noise. The interval is y ± k·u with k from the
 * normal distribution (1.96 for 95 %). Fast, but blind to non-linearity: compare with `monteCarloUncertainty`.
 *
 * @param model A function of the inputs' values ({ name: number | Spectrum }) returning a number or { name: number }.
 * @param inputs The uncertain inputs by name (normalInput, rectangularInput, triangularInput, spectralInput).
 * @param options.coverage Coverage probability of the interval; default 0.95.
 * @returns An `UncertaintyResult` (method "first order"): outputs { estimate, standardUncertainty, expandedUncertainty (k = 2), interval } and correlations.
 * @source JCGM 100:2008 §5.1.2 (eq. 10), §5.2.2 (eq. 13), §5.1.3 note 2 (numerical sensitivity coefficients), §G.2 (k for a normal distribution).
 * @example firstOrderUncertainty(({ a, b }) => (a as number) * (b as number), { a: normalInput(2, 0.1), b: normalInput(3, 0.2) }).outputs.y
 */
export function firstOrderUncertainty(
  model: MeasurementModel,
  inputs: Record<string, UncertainInput>,
  options: FirstOrderOptions = {},
): UncertaintyResult {
  const fn = "firstOrderUncertainty";
  checkOptions(fn, "options", options, ["coverage"]);
  checkNumber(fn, "options.coverage", options.coverage, { above: 0, below: 1, optional: true });
  const prepared = prepareModel(fn, model, inputs);
  const result = firstOrderOf(prepared, options.coverage ?? 0.95);
  noteInputModels(prepared);
  noteMethod(
    "uncertainty",
    `Uncertainties were propagated by the law of propagation of uncertainty to first order (JCGM 100:2008 §5), with sensitivity coefficients from central differences; expanded uncertainties are stated as U = 2u (k = 2).`,
  );
  return result;
}
