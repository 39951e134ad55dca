/**
 * Named inputs: front-matter defaults overridden by `--input name=value` on the command line. A value given on the
 * command line is read as the type of the default (number, true/false, text, or JSON for lists and mappings).
 */
import type { InputValue } from "../../cells/inputs.ts";
import { UsageError } from "../shared/errors.ts";

/** Splits `name=value` as written after --input. */
export function parseInputArgument(argument: string): [string, string] {
  const at = argument.indexOf("=");
  if (at <= 0) throw new UsageError(`--input expects name=value, got "${argument}"`);
  return [argument.slice(0, at).trim(), argument.slice(at + 1)];
}

/** The inputs of a run: the defaults with the given overrides, each converted to its default's type. */
export function resolveInputs(
  defaults: Readonly<Record<string, InputValue>>,
  given: Readonly<Record<string, string>>,
  notebook: string,
): { inputs: Record<string, InputValue>; set: Record<string, InputValue> } {
  const inputs: Record<string, InputValue> = { ...defaults };
  const set: Record<string, InputValue> = {};
  for (const [name, text] of Object.entries(given)) {
    if (!Object.hasOwn(defaults, name)) {
      const known = Object.keys(defaults);
      throw new UsageError(
        `${notebook} has no input named "${name}" (${known.length ? `its inputs: ${known.join(", ")}` : "it declares no inputs in its front matter"})`,
      );
    }
    set[name] = inputs[name] = convert(text, defaults[name]!, name);
  }
  return { inputs, set };
}

function convert(text: string, def: InputValue, name: string): InputValue {
  const bad = (what: string) =>
    new UsageError(
      `--input ${name}=${text}: input "${name}" takes ${what} (its default is ${JSON.stringify(def)})`,
    );
  if (typeof def === "number") {
    const n = text.trim() === "" ? NaN : Number(text);
    if (!Number.isFinite(n)) throw bad("a number");
    return n;
  }
  if (typeof def === "boolean") {
    if (text === "true") return true;
    if (text === "false") return false;
    throw bad("true or false");
  }
  if (typeof def === "string") return text;
  let parsed: unknown;
  try {
    parsed = JSON.parse(text);
  } catch {
    throw bad(Array.isArray(def) ? "a JSON list, e.g. [1, 2, 3]" : 'a JSON mapping, e.g. {"a": 1}');
  }
  if (Array.isArray(def) !== Array.isArray(parsed) || typeof parsed !== "object" || parsed === null) {
    throw bad(Array.isArray(def) ? "a JSON list, e.g. [1, 2, 3]" : 'a JSON mapping, e.g. {"a": 1}');
  }
  return parsed as InputValue;
}
