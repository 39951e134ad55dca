/**
 * Internal: a measurement model f(inputs) → output(s) evaluated on a vector of parameter deviations, shared by the
 * Monte Carlo and first-order propagators. Outputs are a number (named "y") or a record of numbers.
 */
import { checkFunction } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { ArgumentError } from "../arguments/argument-error.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { expandInput, type ExpandedInput } from "./input-parameters.ts";
import type { UncertainInput } from "./input-models.ts";

/** The values a model receives: each input's value, a number or a spectrum. */
export type ModelValues = Record<string, number | Spectrum>;
/** A measurement model: one output (a number) or several (a record of numbers). */
export type MeasurementModel = (values: ModelValues) => number | Record<string, number>;

export interface PreparedModel {
  readonly inputs: readonly ExpandedInput[];
  readonly offsets: readonly number[];
  readonly dims: number;
  /** Output names, in the model's order ("y" for a single number). */
  readonly names: readonly string[];
  readonly single: boolean;
  /** The outputs for parameter deviations theta, into out. */
  evaluate(theta: Float64Array, out: Float64Array): void;
}

const isInput = (v: unknown): boolean =>
  typeof v === "object" &&
  v !== null &&
  (v as { kind?: unknown }).kind === "uncertain input" &&
  ["normal", "rectangular", "triangular", "spectrum"].includes((v as { model?: string }).model ?? "");

/** Checks the model and its inputs, expands the inputs and names the outputs from the estimate's evaluation. */
export function prepareModel(fn: string, model: unknown, inputs: unknown): PreparedModel {
  checkFunction(fn, "model", model, {
    what: "a function of the inputs' values returning a number or { name: number }",
  });
  checkWith(
    fn,
    "inputs",
    inputs,
    "a record of uncertain inputs { name: normalInput(...) | rectangularInput(...) | triangularInput(...) | spectralInput(...) }",
    (v) =>
      typeof v === "object" &&
      v !== null &&
      !Array.isArray(v) &&
      Object.keys(v).length > 0 &&
      Object.values(v).every(isInput),
  );
  const f = model as MeasurementModel;
  const expanded = Object.entries(inputs as Record<string, UncertainInput>).map(([k, v]) =>
    expandInput(k, v),
  );
  const offsets: number[] = [];
  let dims = 0;
  for (const e of expanded) {
    offsets.push(dims);
    dims += e.dims;
  }
  const values: ModelValues = {};
  const fill = (theta: Float64Array): void => {
    for (let i = 0; i < expanded.length; i++)
      values[expanded[i]!.name] = expanded[i]!.value(theta, offsets[i]!);
  };
  fill(new Float64Array(dims));
  const first = f({ ...values });
  let names: string[];
  const single = typeof first === "number";
  if (single) names = ["y"];
  else if (typeof first === "object" && first !== null && !Array.isArray(first)) names = Object.keys(first);
  else names = [];
  const bad = single
    ? !Number.isFinite(first)
    : names.length === 0 || names.some((k) => !Number.isFinite((first as Record<string, unknown>)[k]));
  if (bad)
    throw new ArgumentError(
      fn,
      "model",
      "a function returning a finite number or a record of finite numbers",
      `one returning ${typeof first === "number" ? String(first) : JSON.stringify(first)?.slice(0, 80)} at the estimates`,
    );
  const evaluate = (theta: Float64Array, out: Float64Array): void => {
    fill(theta);
    const r = f(values);
    if (single) out[0] = r as number;
    else for (let i = 0; i < names.length; i++) out[i] = (r as Record<string, number>)[names[i]!]!;
  };
  return { inputs: expanded, offsets, dims, names, single, evaluate };
}
