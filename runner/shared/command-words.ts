/** The words after a command, parsed strictly (unknown options refused) into options and positionals. */
import { parseArgs, type ParseArgsConfig } from "node:util";
import { UsageError } from "./errors.ts";

type OptionsConfig = NonNullable<ParseArgsConfig["options"]>;

/**
 * `parseArgs` with positionals allowed and unknown options refused; its refusal becomes a UsageError (exit 2) that
 * starts with `prefix` (e.g. "collate: ") and leaves out Node's advice about positionals starting with "-".
 */
export function parseCommandWords<T extends OptionsConfig>(args: readonly string[], options: T, prefix = "") {
  try {
    return parseArgs({ args: [...args], allowPositionals: true, strict: true, options });
  } catch (e) {
    throw new UsageError(
      `${prefix}${(e as Error).message.replace(/\. To specify a positional argument.*$/s, "")}`,
    );
  }
}
