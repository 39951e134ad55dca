/** Checking a reader's options object: an option name the reader does not know is an error listing the ones it knows. */
import { DataFileError } from "./data-file-error.ts";

/** Throws when `options` holds a name not in `valid`, naming the valid ones (a misspelt option must not be ignored). */
export function checkOptionNames(options: object, valid: readonly string[], reader: string): void {
  if (options === null || typeof options !== "object")
    throw new DataFileError(`${reader}: expected an options object, got ${String(options)}`);
  const unknown = Object.keys(options).filter((k) => !valid.includes(k));
  if (unknown.length > 0)
    throw new DataFileError(
      `${reader}: unknown option${unknown.length === 1 ? "" : "s"} ${unknown.map((k) => JSON.stringify(k)).join(", ")}; the options are ${valid.join(", ")}`,
    );
}

/** The stated value of a choice option, checked against its allowed values (undefined means "auto"). */
export function choiceOption<T extends string | number>(
  value: unknown,
  allowed: readonly T[],
  name: string,
  reader: string,
): T | "auto" {
  if (value === undefined || value === "auto") return "auto";
  if (!(allowed as readonly unknown[]).includes(value))
    throw new DataFileError(
      `${reader}: option ${name} is ${JSON.stringify(value)}; expected ${[...allowed, "auto"].map((v) => JSON.stringify(v)).join(", ")}`,
    );
  return value as T;
}
