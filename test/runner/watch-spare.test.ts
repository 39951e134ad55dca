/**
 * Watch mode readies the next cell process while a run is shown: a code edit then runs in a process that was
 * started (and had loaded the library) before the edit was saved, and still a fresh one for each run (its own pid,
 * nothing left from the previous run). No timing is asserted: only which process ran, seen from inside it.
 */
import fs from "node:fs";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { startWatch, type RenderEvent, type Watcher } from "../../runner/watch/watch.ts";
import { readEmbeddedRunRecord } from "../../runner/report/embedded-run-record.ts";
import { tempFolder, ts, writeFiles } from "./helpers.ts";

let watcher: Watcher | undefined;
afterEach(async () => {
  await watcher?.close();
  watcher = undefined;
});

function nextRender(w: Watcher): Promise<RenderEvent> {
  return new Promise((resolve) => w.events.once("render", resolve));
}

/** The cell prints its process id, how long that process has existed (ms) and whether a global is left over. */
const cell = (edit: number) =>
  ts(
    `const leftOver = typeof (globalThis as any).marker;\n(globalThis as any).marker = ${edit};\n` +
      `console.log(JSON.stringify({ pid: process.pid, aliveMs: process.uptime() * 1000, leftOver }));`,
  );

function seen(folder: string): { pid: number; aliveMs: number; leftOver: string } {
  const html = fs.readFileSync(path.join(folder, "nb.html"), "utf8");
  const match = /\{&quot;pid&quot;:\d+[^<]*\}|\{"pid":\d+[^<]*\}/.exec(html);
  if (!match) throw new Error("the report shows no process line");
  return JSON.parse(match[0].replaceAll("&quot;", '"'));
}

describe("watch mode's spare cell process", () => {
  it("runs a code edit in a process started before the edit, and a new one each run", async () => {
    const folder = tempFolder();
    writeFiles(folder, { "nb.md": "# Spare\n\n" + cell(0) });
    const w = await startWatch(path.join(folder, "nb.md"), {
      port: 0,
      inputs: {},
      keepGoing: false,
      linkAssets: false,
      quiet: true,
      debounceMs: 30,
    });
    watcher = w;
    expect((await nextRender(w)).executed).toBe(true);
    const first = seen(folder);
    expect(readEmbeddedRunRecord(fs.readFileSync(path.join(folder, "nb.html"), "utf8")).counts).toBeDefined();
    // Give the spare time to start, then edit the code.
    await new Promise((r) => setTimeout(r, 1500));
    const edited = performance.now();
    const render = nextRender(w);
    fs.writeFileSync(path.join(folder, "nb.md"), "# Spare\n\n" + cell(1));
    expect((await render).executed).toBe(true);
    const sinceEdit = performance.now() - edited;
    const second = seen(folder);
    expect(second.pid).not.toBe(first.pid);
    expect(second.leftOver).toBe("undefined");
    // The process that ran the edit had existed for longer than the edit: it was started ahead of time.
    expect(second.aliveMs).toBeGreaterThan(sinceEdit);
  }, 60_000);
});
