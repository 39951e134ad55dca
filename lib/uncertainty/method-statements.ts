/** Internal: the Methods statements of uncertainty propagation (input models, method, trials, seed). */
import { noteMethod } from "../methods/method-log.ts";
import type { PreparedModel } from "./model-evaluation.ts";

/** Notes one statement per input: how it was modelled. */
export function noteInputModels(prepared: PreparedModel): void {
  for (const input of prepared.inputs)
    noteMethod("uncertainty", `The input "${input.name}" was modelled as ${input.description}.`);
}
