/**
 * What `tristim run` does before the CLI's own modules are loaded (runner/bin.mjs imports this small bundle first):
 * it starts a spare cell process for the notebook's folder, so node's start and the library's loading overlap with
 * loading the CLI, parsing and compiling. It reads the command line only roughly (the CLI checks it properly) and
 * never fails: a spare that is not used is stopped when the command ends.
 */
import path from "node:path";
import { CellProcess } from "../execute/cell-process.ts";
import { runtimeBundle } from "../execute/runtime-bundle.ts";
import { firstNotebookOfRun } from "../execute/cell-spawn.mjs";

/**
 * Readies a spare cell process for the first notebook of `tristim run` (nothing for other commands): the one the
 * launcher started (cell-spawn.mjs), when it runs this runtime, else a new one.
 */
export async function startEarly(argv: readonly string[]): Promise<void> {
  const notebook = firstNotebookOfRun(argv);
  if (notebook === undefined) return;
  try {
    CellProcess.prepare(await runtimeBundle(), path.dirname(notebook));
  } catch {
    // The run itself reports any problem with the runtime.
  }
}
