/**
 * The cell process the launcher starts before anything else (runner/execute/cell-spawn.mjs): the run takes it on when
 * it runs the current runtime's worker, and stops it and starts its own when it does not (a runtime rebuilt since
 * the pointer was written). Each cell prints its process id, which says which process ran it.
 */
import fs from "node:fs";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import {
  EARLY_PROCESS,
  firstNotebookOfRun,
  latestWorkerFile,
  memoryLimitMb,
  spawnCellProcess,
  startEarlyCellProcess,
  type EarlyCellProcess,
} from "../../runner/execute/cell-spawn.mjs";
import { runDocument } from "../../runner/execute/run-notebook.ts";
import { runtimeBundle } from "../../runner/execute/runtime-bundle.ts";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import { consoleText, notebookFile, ts } from "./helpers.ts";

const folders: string[] = [];
afterAll(() => {
  for (const f of folders) fs.rmSync(f, { recursive: true, force: true });
});

const PRINT_PID = ts("console.log(String(process.pid));");

function notebook(): string {
  const file = notebookFile(PRINT_PID);
  folders.push(path.dirname(file));
  return file;
}

const registry = globalThis as { [EARLY_PROCESS]?: EarlyCellProcess };

describe("the launcher's cell process", () => {
  it("is taken on by the run when it runs the current runtime's worker", async () => {
    const runtime = await runtimeBundle();
    // runtimeBundle names its worker for the next launcher.
    expect(fs.readFileSync(latestWorkerFile(), "utf8")).toBe(runtime.worker);
    const file = notebook();
    startEarlyCellProcess(["run", "--quiet", file]);
    const early = registry[EARLY_PROCESS];
    expect(early?.child.pid).toBeTypeOf("number");
    const run = await runDocument(readNotebook(file));
    expect(consoleText(run, 0).trim()).toBe(String(early!.child.pid));
    expect(early!.adopted).toBe(true);
    expect(registry[EARLY_PROCESS]).toBeUndefined();
  }, 60_000);

  it("is stopped, and a process of the run's own used, when it runs another worker", async () => {
    const runtime = await runtimeBundle();
    const file = notebook();
    const folder = path.dirname(file);
    const child = spawnCellProcess(runtime.worker, folder, memoryLimitMb());
    const exited = new Promise((resolve) => child.once("exit", resolve));
    // As if the pointer named the worker of a runtime built before lib/ changed.
    const stale = path.join(path.dirname(path.dirname(runtime.worker)), "older", "worker.mjs");
    registry[EARLY_PROCESS] = {
      child,
      worker: stale,
      folder,
      limitMb: memoryLimitMb(),
      adopted: false,
      failed: false,
    };
    const run = await runDocument(readNotebook(file));
    expect(consoleText(run, 0).trim()).toMatch(/^\d+$/);
    expect(consoleText(run, 0).trim()).not.toBe(String(child.pid));
    await exited;
    expect(child.signalCode).toBe("SIGKILL");
  }, 60_000);

  it("is started only for `run` with a notebook that exists (the command line read roughly)", () => {
    const file = notebook();
    expect(firstNotebookOfRun(["run", "--time-limit", "5s", file, "other.md"])).toBe(file);
    expect(firstNotebookOfRun(["run", "-o", "out.html", file])).toBe(file);
    expect(firstNotebookOfRun(["watch", file])).toBeUndefined();
    expect(firstNotebookOfRun(["run", path.join(path.dirname(file), "missing.md")])).toBeUndefined();
    startEarlyCellProcess(["check", file]);
    expect(registry[EARLY_PROCESS]).toBeUndefined();
  });
});
