/** Propagation of distributions by the Monte Carlo method of JCGM 101:2008 (GUM Supplement 1). */
import { checkChoice } from "../arguments/check-text.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { UncertainInput } from "./input-models.ts";
import { prepareModel, type MeasurementModel } from "./model-evaluation.ts";
import { randomSource } from "./random-numbers.ts";
import {
  correlation,
  coverageIntervalOfSorted,
  meanAndDeviation,
  numericalTolerance,
} from "./coverage-interval.ts";
import { firstOrderOf } from "./first-order-core.ts";
import { noteInputModels } from "./method-statements.ts";
import type { AgreementCheck, OutputUncertainty, UncertaintyResult } from "./uncertainty-result.ts";

export interface MonteCarloOptions {
  /** A fixed number of trials (at least 100), or "adaptive" for the procedure of JCGM 101 §7.9; default "adaptive". */
  trials?: number | "adaptive";
  /** Seed of the pseudo-random numbers (a whole number); default 1. The Methods section states it. */
  seed?: number;
  /** Coverage probability; default 0.95. */
  coverage?: number;
  /** "symmetric" (probabilistically symmetric, §7.7.1) or "shortest" (§7.7.2); default "symmetric". */
  interval?: "symmetric" | "shortest";
  /** Significant digits of u(y) that the adaptive procedure and the comparison with first order hold to (§7.9.2); default 2. */
  digits?: number;
  /** Upper limit of trials for the adaptive procedure; default 1 000 000. */
  maxTrials?: number;
  /** Also apply the law of propagation of uncertainty and compare (§8); default true. */
  compare?: boolean;
}

const OPTIONS = ["trials", "seed", "coverage", "interval", "digits", "maxTrials", "compare"];

/**
 * Propagates the distributions of the inputs through a measurement model by the Monte Carlo method (JCGM 101).
 *
 * Each trial draws every input from its model (seeded xoshiro128** numbers, normal deviates by Box–Muller) and
 * evaluates the model; the estimate is the average of the model values, u(y) their standard deviation, the coverage
 * interval probabilistically symmetric or shortest, and correlations between outputs come from the same trials.
 * With `trials: "adaptive"` (the default) batches of 10⁴ run until twice the standard deviation of the batch
 * averages of y, u(y) and both interval ends is within the numerical tolerance of u(y) to `digits` significant
 * digits (§7.9). Unless `compare: false`, the law of propagation is applied as well and the two are compared as in
 * §8: the result's `warning` says when they disagree beyond that tolerance (a model too non-linear for first order).
 *
 * @param model A function of the inputs' values ({ name: number | Spectrum }) returning a number (output "y") or { name: number }.
 * @param inputs The uncertain inputs by name (normalInput, rectangularInput, triangularInput, spectralInput).
 * @param options.trials A number of trials (≥ 100) or "adaptive"; default "adaptive".
 * @param options.seed Seed, a whole number; default 1.
 * @param options.coverage Coverage probability; default 0.95.
 * @param options.interval "symmetric" or "shortest"; default "symmetric".
 * @param options.digits Significant digits of u(y) for the adaptive stop and the comparison; default 2.
 * @param options.maxTrials Most trials of the adaptive procedure; default 1 000 000.
 * @param options.compare Compare with the law of propagation of uncertainty; default true.
 * @returns An `UncertaintyResult`: outputs { estimate, standardUncertainty, expandedUncertainty (k = 2), coverageFactor, interval }, correlations, trials, seed, and firstOrder, agreement and warning when compared.
 * @source JCGM 101:2008 §7 (propagation, §7.6 estimate, §7.7 coverage intervals, §7.9 adaptive procedure), §8 (validation of the GUM uncertainty framework), §C.4 (Box–Muller).
 * @example monteCarloUncertainty(({ a, b }) => (a as number) + (b as number), { a: normalInput(1, 0.1), b: rectangularInput(2, 0.3) }, { trials: 10000 }).outputs.y
 */
export function monteCarloUncertainty(
  model: MeasurementModel,
  inputs: Record<string, UncertainInput>,
  options: MonteCarloOptions = {},
): UncertaintyResult {
  const fn = "monteCarloUncertainty";
  checkOptions(fn, "options", options, OPTIONS);
  checkWith(
    fn,
    "options.trials",
    options.trials,
    'a whole number of trials of at least 100, or "adaptive"',
    (t) => t === "adaptive" || (typeof t === "number" && Number.isInteger(t) && t >= 100 && t <= 1e8),
    { optional: true },
  );
  checkNumber(fn, "options.seed", options.seed, { integer: true, optional: true });
  checkNumber(fn, "options.coverage", options.coverage, { above: 0, below: 1, optional: true });
  checkChoice(fn, "options.interval", options.interval, ["symmetric", "shortest"], { optional: true });
  checkNumber(fn, "options.digits", options.digits, { integer: true, min: 1, max: 4, optional: true });
  checkNumber(fn, "options.maxTrials", options.maxTrials, { integer: true, min: 10000, optional: true });
  checkWith(fn, "options.compare", options.compare, "true or false", (v) => typeof v === "boolean", {
    optional: true,
  });
  const prepared = prepareModel(fn, model, inputs);
  const seed = options.seed ?? 1;
  const p = options.coverage ?? 0.95;
  const kind = options.interval ?? "symmetric";
  const digits = options.digits ?? 2;
  const adaptive = (options.trials ?? "adaptive") === "adaptive";
  const maxTrials = options.maxTrials ?? 1_000_000;
  const { names, dims } = prepared;
  const m = names.length;
  const rng = randomSource(seed);
  const theta = new Float64Array(dims);
  const out = new Float64Array(m);
  let capacity = adaptive ? 10_000 * 4 : (options.trials as number);
  let values = names.map(() => new Float64Array(capacity));
  let done = 0;
  const runTrials = (count: number): void => {
    if (done + count > capacity) {
      capacity = Math.max(done + count, capacity * 2);
      values = values.map((v) => {
        const grown = new Float64Array(capacity);
        grown.set(v.subarray(0, done));
        return grown;
      });
    }
    for (let t = 0; t < count; t++) {
      for (let k = 0; k < prepared.inputs.length; k++)
        prepared.inputs[k]!.sample(rng, theta, prepared.offsets[k]!);
      prepared.evaluate(theta, out);
      for (let o = 0; o < m; o++) {
        const y = out[o]!;
        if (!Number.isFinite(y))
          throw new Error(
            `${fn}: the model gave ${y} for output "${names[o]}" in trial ${done + t + 1} (seed ${seed}); the input models reach values where it is not defined`,
          );
        values[o]![done + t] = y;
      }
    }
    done += count;
  };

  let settled = true;
  if (!adaptive) runTrials(options.trials as number);
  else {
    // JCGM 101 §7.9.4: M = max(J, 10⁴) with J = ⌈100/(1 − p)⌉; batches until 2 s ≤ δ for y, u(y), y_low, y_high.
    const batch = Math.max(Math.ceil(100 / (1 - p)), 10_000);
    const stats: number[][][] = names.map(() => []);
    for (;;) {
      const start = done;
      runTrials(batch);
      names.forEach((_, o) => {
        const slice = values[o]!.slice(start, done);
        const [mean, sd] = meanAndDeviation(slice);
        const [lo, hi] = coverageIntervalOfSorted(slice.sort(), p, kind);
        stats[o]!.push([mean, sd, lo, hi]);
      });
      const h = done / batch;
      if (h < 2) continue;
      const stable = names.every((_, o) => {
        const [, u] = meanAndDeviation(values[o]!, 0, done);
        const delta = numericalTolerance(u, digits);
        return [0, 1, 2, 3].every((q) => {
          const series = Float64Array.from(stats[o]!, (s) => s[q]!);
          const [, sd] = meanAndDeviation(series);
          return 2 * (sd / Math.sqrt(h)) <= delta;
        });
      });
      if (stable) break;
      if (done + batch > maxTrials) {
        settled = false;
        break;
      }
    }
  }

  const outputs: Record<string, OutputUncertainty> = {};
  const correlations: Record<string, Record<string, number>> = {};
  const used = values.map((v) => v.subarray(0, done));
  names.forEach((name, o) => {
    const [mean, u] = meanAndDeviation(used[o]!);
    const [low, high] = coverageIntervalOfSorted(Float64Array.from(used[o]!).sort(), p, kind);
    outputs[name] = {
      estimate: mean,
      standardUncertainty: u,
      expandedUncertainty: 2 * u,
      coverageFactor: 2,
      interval: { low, high, probability: p, kind },
    };
    correlations[name] = {};
  });
  for (let a = 0; a < m; a++)
    for (let b = a + 1; b < m; b++) {
      const r = correlation(used[a]!, used[b]!);
      correlations[names[a]!]![names[b]!] = r;
      correlations[names[b]!]![names[a]!] = r;
    }

  let firstOrder: UncertaintyResult | undefined;
  let agreement: Record<string, AgreementCheck> | undefined;
  const warnings: string[] = [];
  if (!settled)
    warnings.push(
      `The adaptive Monte Carlo procedure had not settled to ${digits} significant digits after ${done} trials (the limit); the results are less certain than stated.`,
    );
  if (options.compare ?? true) {
    firstOrder = firstOrderOf(prepared, p);
    agreement = {};
    const disagreeing: string[] = [];
    for (const name of names) {
      const mc = outputs[name]!;
      const fo = firstOrder.outputs[name]!;
      const tolerance = numericalTolerance(mc.standardUncertainty, digits);
      const lowDifference = Math.abs(fo.interval.low - mc.interval.low);
      const highDifference = Math.abs(fo.interval.high - mc.interval.high);
      // Too few trials must not pass for non-linearity: twice the Monte Carlo standard error of each interval end
      // (from 10 batches of the trials) is allowed beyond δ.
      const [seLow, seHigh] = endStandardErrors(used[names.indexOf(name)]!, p, kind);
      const agrees = lowDifference <= tolerance + 2 * seLow && highDifference <= tolerance + 2 * seHigh;
      agreement[name] = {
        agrees,
        tolerance,
        lowDifference,
        highDifference,
        monteCarloAllowance: [2 * seLow, 2 * seHigh],
      };
      if (!agrees) disagreeing.push(name);
    }
    if (disagreeing.length)
      warnings.push(
        `The law of propagation of uncertainty (first order) does not agree with the Monte Carlo result for ${disagreeing.map((n) => `"${n}"`).join(", ")} within the numerical tolerance of ${digits} significant digits of u and the Monte Carlo standard error of the interval ends (JCGM 101:2008 §8): the model is not linear enough for first order there; the Monte Carlo result is the one to report.`,
      );
  }

  noteInputModels(prepared);
  noteMethod(
    "uncertainty",
    `Uncertainties were propagated by the Monte Carlo method of JCGM 101:2008 with ${done} trials${adaptive ? ` (the adaptive procedure of §7.9, u to ${digits} significant digits)` : ""}, pseudo-random numbers from xoshiro128** with seed ${seed} and normal deviates by the Box–Muller transform; coverage intervals are ${kind === "symmetric" ? "probabilistically symmetric" : "shortest"} ${formatPercent(p)} intervals (§7.7), and expanded uncertainties are stated as U = 2u (k = 2).`,
  );
  if (warnings.length)
    for (const w of warnings)
      noteMethod(
        "uncertainty",
        w.replace("does not agree", "did not agree").replace("is not linear", "was not linear"),
      );
  return {
    kind: "uncertainty result",
    method: "monte carlo",
    outputs,
    correlations,
    trials: done,
    seed,
    adaptive,
    ...(firstOrder ? { firstOrder, agreement: agreement! } : {}),
    ...(warnings.length ? { warning: warnings.join(" ") } : {}),
  };
}

/** Standard errors of the interval ends, from the spread of the ends over 10 batches of the values. */
function endStandardErrors(
  values: Float64Array,
  p: number,
  kind: "symmetric" | "shortest",
): [number, number] {
  const h = 10;
  const size = Math.floor(values.length / h);
  if (size < 100) return [0, 0];
  const lows = new Float64Array(h),
    highs = new Float64Array(h);
  for (let b = 0; b < h; b++) {
    const [lo, hi] = coverageIntervalOfSorted(values.slice(b * size, (b + 1) * size).sort(), p, kind);
    lows[b] = lo;
    highs[b] = hi;
  }
  // The batches have 1/h of the trials: the standard error of the whole run's ends is their spread ÷ √h.
  return [meanAndDeviation(lows)[1] / Math.sqrt(h), meanAndDeviation(highs)[1] / Math.sqrt(h)];
}

function formatPercent(p: number): string {
  return `${Number((p * 100).toPrecision(4))} %`;
}
