/** Helpers for the runner tests: notebooks in temporary folders, and runs of them. */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import { runDocument, type RunOptions } from "../../runner/execute/run-notebook.ts";
import type { OutputRecord } from "../../cells/records.ts";
import type { RunRecord } from "../../runner/records/run-record.ts";
import type { NotebookDocument } from "../../runner/parse/notebook.ts";

/** A fresh temporary folder (removed by the OS's tmp cleaning; tests keep them small). */
export function tempFolder(prefix = "tristim-test-"): string {
  return fs.mkdtempSync(path.join(os.tmpdir(), prefix));
}

/** Writes files (relative path → content) into a folder. */
export function writeFiles(folder: string, files: Record<string, string>): void {
  for (const [name, content] of Object.entries(files)) {
    fs.mkdirSync(path.dirname(path.join(folder, name)), { recursive: true });
    fs.writeFileSync(path.join(folder, name), content);
  }
}

/** A notebook file in a new temporary folder, with optional extra files beside it. */
export function notebookFile(text: string, files: Record<string, string> = {}, name = "nb.md"): string {
  const folder = tempFolder();
  writeFiles(folder, { [name]: text, ...files });
  return path.join(folder, name);
}

/** Fences a cell: ts(code, "options"). */
export function ts(code: string, options = ""): string {
  return "```ts" + (options ? ` ${options}` : "") + "\n" + code + "\n```\n";
}

/** Parses and runs a notebook text; returns the document and the run record. */
export async function runText(
  text: string,
  options: RunOptions = {},
  files: Record<string, string> = {},
): Promise<{ document: NotebookDocument; run: RunRecord }> {
  const document = readNotebook(notebookFile(text, files));
  const run = await runDocument(document, options);
  return { document, run };
}

/** The records of one cell of a kind. */
export function outputsOf<K extends OutputRecord["kind"]>(
  run: RunRecord,
  cell: number,
  kind: K,
): Extract<OutputRecord, { kind: K }>[] {
  return run.cells[cell]!.outputs.filter((o): o is Extract<OutputRecord, { kind: K }> => o.kind === kind);
}

/** All console text of a cell, joined. */
export function consoleText(run: RunRecord, cell: number): string {
  return outputsOf(run, cell, "console")
    .map((o) => o.text)
    .join("");
}

/** The error record of a cell (throws when there is none, so a test fails clearly). */
export function errorOf(run: RunRecord, cell: number) {
  const error = outputsOf(run, cell, "error")[0];
  if (!error)
    throw new Error(`cell ${cell + 1} has no error record; its status is ${run.cells[cell]?.status}`);
  return error;
}
