/**
 * What `tristim run` does before the CLI's own modules are loaded (runner/bin.mjs imports this small bundle first):
 * it starts a spare cell process for the notebook's folder, so node's start and the library's loading overlap with
 * loading the CLI, parsing and compiling. It reads the command line only roughly (the CLI checks it properly) and
 * never fails: a spare that is not used is stopped when the command ends.
 */
import fs from "node:fs";
import path from "node:path";
import { CellProcess } from "../execute/cell-process.ts";
import { runtimeBundle } from "../execute/runtime-bundle.ts";

/** Options of run that take a value (their value is not a notebook). */
const VALUE_OPTIONS = new Set(["-o", "--output", "--input", "--time-limit", "--each", "--port", "--jobs"]);

/** Starts a spare cell process for the first notebook of `tristim run`; does nothing for other commands. */
export async function startEarly(argv: readonly string[]): Promise<void> {
  if (argv[0] !== "run") return;
  let notebook: string | undefined;
  for (let i = 1; i < argv.length; i++) {
    const arg = argv[i]!;
    if (VALUE_OPTIONS.has(arg)) i++;
    else if (!arg.startsWith("-")) {
      notebook = arg;
      break;
    }
  }
  if (notebook === undefined || !fs.existsSync(notebook)) return;
  try {
    CellProcess.prepare(await runtimeBundle(), path.dirname(path.resolve(notebook)));
  } catch {
    // The run itself reports any problem with the runtime.
  }
}
