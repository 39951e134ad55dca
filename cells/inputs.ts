/**
 * The notebook's named inputs: the defaults from the front matter, with any overrides given on the command line
 * (`--input name=value`). Cells read them as `inputs.name` (a global, and `import { inputs } from "tristim"`).
 */

/** A value an input can hold: what YAML front matter gives (number, string, boolean, list, mapping). */
export type InputValue =
  number | string | boolean | readonly InputValue[] | { readonly [key: string]: InputValue };

/** The inputs of this run (read-only for cells; a new frozen object for each run the cell process serves). */
export let inputs: Readonly<Record<string, InputValue>> = Object.freeze({});

/** Sets the inputs of the run, before its first cell (called by the cell harness). */
export function setRunInputs(given: Readonly<Record<string, InputValue>>): void {
  inputs = Object.freeze({ ...given });
}
