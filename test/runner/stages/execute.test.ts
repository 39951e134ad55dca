// Stage 3 (execute) driven directly: a real cell process started with the runtime bundle, sent compiled cells one
// at a time; then executeCells over a document, without the CLI, the report or runDocument.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { OutputRecord } from "../../../cells/records.ts";
import { compileCells, type CompiledCell } from "../../../runner/compile/compile-cell.ts";
import { CellProcess } from "../../../runner/execute/cell-process.ts";
import { ExecutionState, executeCells } from "../../../runner/execute/execute.ts";
import { runtimeBundle, type RuntimeBundle } from "../../../runner/execute/runtime-bundle.ts";
import { parseNotebook } from "../../../runner/parse/parse-notebook.ts";
import type { NotebookDocument } from "../../../runner/parse/notebook.ts";

const folder = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-execute-"));
afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

let runtime: RuntimeBundle;
beforeAll(async () => {
  runtime = await runtimeBundle();
}, 120_000);

/** A document of the given cells (each a fence of its own), with its compiled cells. */
async function compiledNotebook(
  cells: string[],
  name: string,
): Promise<{ document: NotebookDocument; compiled: (CompiledCell | undefined)[] }> {
  const file = path.join(folder, `${name}.md`);
  const text = cells.map((c) => `Text.\n\n\`\`\`ts\n${c}\n\`\`\`\n`).join("\n");
  fs.writeFileSync(file, text);
  const document = parseNotebook(text, file);
  const outDir = fs.mkdtempSync(path.join(folder, "out-"));
  return { document, compiled: await compileCells({ document, tristimModule: runtime.tristim, outDir }) };
}

const runMessage = (c: CompiledCell) =>
  ({
    type: "run",
    cell: c.index,
    code: c.code!,
    filename: c.filename,
    importBundle: c.importBundle,
  }) as const;

describe("CellProcess", () => {
  it("runs cells one at a time in one process: bindings carry over, records arrive per cell", async () => {
    const { document, compiled } = await compiledNotebook(
      [
        "const lamp = 'A';\nlet count = 2;",
        "count += 1;\nshow(`${lamp} ${count}`);",
        "await 0;\nprocess.exit(3);",
      ],
      "sharing",
    );
    const process = await CellProcess.start(runtime, document.path, {});
    const records = new Map<number, OutputRecord[]>();
    process.onOutput = (cell, r) => records.set(cell, [...(records.get(cell) ?? []), ...r]);
    try {
      const first = await process.run(runMessage(compiled[0]!), 10_000);
      const second = await process.run(runMessage(compiled[1]!), 10_000);
      expect(first).toMatchObject({ kind: "done" });
      expect(second.kind === "done" && second.error).toBe(undefined);
      expect(JSON.stringify(records.get(1))).toContain("A 3");
      // process.exit() in a cell is an error of that cell, and the process stays usable.
      const third = await process.run(runMessage(compiled[2]!), 10_000);
      expect(third.kind === "done" && third.error).toMatchObject({ failure: "exit" });
      expect(process.alive).toBe(true);
      const finished = await process.finish();
      expect(finished?.type).toBe("finished");
    } finally {
      process.kill();
    }
  }, 60_000);

  it("stops a cell that runs past its time limit by ending the process", async () => {
    const { document, compiled } = await compiledNotebook(["while (true) {}"], "endless");
    const process = await CellProcess.start(runtime, document.path, {});
    try {
      const outcome = await process.run(runMessage(compiled[0]!), 300);
      expect(outcome.kind).toBe("time-limit");
    } finally {
      process.kill();
    }
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(process.alive).toBe(false);
  }, 60_000);
});

describe("executeCells", () => {
  it("stops after a failed cell, and marks the rest not run", async () => {
    const { document, compiled } = await compiledNotebook(
      ["const a = 1;", "throw new Error('lamp missing');", "show(a);"],
      "stop",
    );
    const execution = await executeCells(document, compiled, runtime, {
      timeLimitMs: 10_000,
      keepGoing: false,
      inputs: {},
    });
    expect(execution.cells.map((c) => c.status)).toEqual(["ok", "failed", "not-run"]);
    const error = execution.cells[1]!.outputs.find((o) => o.kind === "error");
    expect(error).toMatchObject({
      message: "lamp missing",
      location: { line: document.cells[1]!.firstLine },
    });
  }, 60_000);

  it("with keepGoing, replaces a killed process, says so, and lists the killed cell's missing method notes", async () => {
    const { document, compiled } = await compiledNotebook(
      ["const a = 1;", "while (true) {}", "show(typeof a);"],
      "restart",
    );
    const execution = await executeCells(document, compiled, runtime, {
      timeLimitMs: 400,
      keepGoing: true,
      inputs: {},
    });
    expect(execution.cells.map((c) => c.status)).toEqual(["ok", "failed", "ok"]);
    expect(execution.methodsMissingFrom).toEqual([1]);
    expect(execution.events).toHaveLength(1);
    expect(execution.events[0]).toMatch(/started again before cell 3/);
    // The new process has not seen cell 1's binding.
    expect(JSON.stringify(execution.cells[2]!.outputs)).toContain("undefined");
  }, 60_000);

  it("shows a no-run cell as a listing and a cell that did not compile as failed, without a process for them", async () => {
    const { document, compiled } = await compiledNotebook(["const = 1;"], "compile");
    const listing = parseNotebook("```ts no-run\nwhile (true) {}\n```\n", path.join(folder, "listing.md"));
    const failed = await executeCells(document, compiled, runtime, {
      timeLimitMs: 1000,
      keepGoing: false,
      inputs: {},
    });
    expect(failed.cells[0]).toMatchObject({ status: "failed" });
    expect(failed.cells[0]!.outputs[0]).toMatchObject({ kind: "error", failure: "compile" });
    const listed = await executeCells(listing, [undefined], runtime, {
      timeLimitMs: 1000,
      keepGoing: false,
      inputs: {},
    });
    expect(listed.cells[0]).toMatchObject({ status: "listing", outputs: [] });
  }, 60_000);
});

describe("ExecutionState, step by step", () => {
  it("runs one cell per step; unrecorded cells read as not run; finish gives a late error to the cell that left it", async () => {
    const { document, compiled } = await compiledNotebook(
      [
        "const n = 2;\nshow(n);",
        "setTimeout(() => { throw new Error('late from the timer'); }, 20);",
        "show(n + 1);",
      ],
      "steps",
    );
    const state = new ExecutionState(document, compiled, runtime, {
      timeLimitMs: 10_000,
      keepGoing: false,
      inputs: {},
    });
    try {
      await state.runCell(0);
      expect(state.result().cells.map((c) => c.status)).toEqual(["ok", "not-run", "not-run"]);
      await state.runCell(1);
      await state.runCell(2);
      expect(state.result().cells.map((c) => c.status)).toEqual(["ok", "ok", "ok"]);
      await state.finish();
      const cells = state.result().cells;
      // The timer of cell 2 threw after every cell had finished: cell 2 is the one marked failed, with the error.
      expect(cells.map((c) => c.status)).toEqual(["ok", "failed", "ok"]);
      expect(JSON.stringify(cells[1]!.outputs)).toContain("late from the timer");
    } finally {
      await state.finish();
    }
  }, 60_000);
});
