/**
 * The notebook's named inputs: the defaults from the front matter, with any overrides given on the command line
 * (`--input name=value`). Cells read them as `inputs.name` (a global, and `import { inputs } from "tristim"`).
 */

/** A value an input can hold: what YAML front matter gives (number, string, boolean, list, mapping). */
export type InputValue =
  number | string | boolean | readonly InputValue[] | { readonly [key: string]: InputValue };

const values: Record<string, InputValue> = {};

/** The inputs of this run (read-only for cells). */
export const inputs: Readonly<Record<string, InputValue>> = values;

/** Sets the inputs of the run once, before the first cell (called by the cell harness). */
export function setRunInputs(given: Readonly<Record<string, InputValue>>): void {
  Object.assign(values, given);
  Object.freeze(values);
}
