/**
 * The TypeScript type of a notebook's `inputs`, written from the front-matter defaults: a command-line override is
 * read as its default's type (runner/execute/inputs.ts), so `tolerance: 2.0` makes `inputs.tolerance` a number.
 */
import type { InputValue } from "../../cells/inputs.ts";

/** Type text of one default value: number, string, boolean, a readonly array or a readonly object type. */
export function inputValueType(value: InputValue): string {
  if (typeof value === "number") return "number";
  if (typeof value === "string") return "string";
  if (typeof value === "boolean") return "boolean";
  if (Array.isArray(value)) {
    const items = [...new Set((value as readonly InputValue[]).map(inputValueType))];
    if (items.length === 0) return "readonly unknown[]";
    return `readonly (${items.join(" | ")})[]`;
  }
  return inputsType(value as Readonly<Record<string, InputValue>>);
}

/** Type text of the whole `inputs` object, e.g. `{ readonly tolerance: number; readonly batch: string }`. */
export function inputsType(inputs: Readonly<Record<string, InputValue>>): string {
  const fields = Object.entries(inputs).map(
    ([name, value]) => `readonly ${JSON.stringify(name)}: ${inputValueType(value)};`,
  );
  return fields.length === 0 ? "{}" : `{ ${fields.join(" ")} }`;
}

/**
 * Type text of `inputs` for a folder of notebooks: each name with the union of its types over the notebooks, optional
 * where a notebook lacks it.
 */
export function mergedInputsType(all: readonly Readonly<Record<string, InputValue>>[]): string {
  const types = new Map<string, Set<string>>();
  const count = new Map<string, number>();
  for (const inputs of all) {
    for (const [name, value] of Object.entries(inputs)) {
      types.set(name, (types.get(name) ?? new Set()).add(inputValueType(value)));
      count.set(name, (count.get(name) ?? 0) + 1);
    }
  }
  const fields = [...types].map(
    ([name, set]) =>
      `readonly ${JSON.stringify(name)}${count.get(name) === all.length ? "" : "?"}: ${[...set].join(" | ")};`,
  );
  return fields.length === 0 ? "{}" : `{ ${fields.join(" ")} }`;
}
