/**
 * Runner overhead: a 20-cell notebook run through `tristim run` against the same code as one plain script bundled by
 * esbuild and run by node (both as fresh processes, wall-clock, the fastest of several runs, which is the least
 * disturbed by other load on the machine), and the time (median of 10) of the prose-only
 * re-render watch mode does. Targets from the runner issue: runner at most 1.5× the plain script; re-render under
 * 100 ms. The workload (invented): each cell integrates many synthetic spectra against Gaussian stand-ins for
 * colour-matching functions, like a notebook that does real computation in each cell.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import * as esbuild from "esbuild";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import { moveRecordsToEdit } from "../../runner/records/rerender.ts";
import { runDocument, runSignature } from "../../runner/execute/run-notebook.ts";
import { writeReport } from "../../runner/report/report-file.ts";
import { median, type Bench } from "./bench.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));
const CELLS = 20;
const REPEATS = 5;

const HELPERS = `function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const wavelengths = Array.from({ length: 81 }, (_, i) => 380 + 5 * i);
const bump = (mu: number, sigma: number) => wavelengths.map((w) => Math.exp(-0.5 * ((w - mu) / sigma) ** 2));
const cmf = [bump(600, 40), bump(550, 45), bump(450, 25)];
function integrate(seed: number, count: number): number[] {
  const random = prng(seed);
  const sums = [0, 0, 0];
  for (let n = 0; n < count; n++) {
    const spd = wavelengths.map(() => random());
    for (let k = 0; k < 3; k++) {
      let s = 0;
      for (let i = 0; i < wavelengths.length; i++) s += spd[i]! * cmf[k]![i]!;
      sums[k]! += s;
    }
  }
  return sums.map((s) => s / count);
}`;

function cellCode(i: number): string {
  return i === 0
    ? HELPERS
    : `const xyz${i} = integrate(${i}, 60000);\nconsole.log("cell ${i}", xyz${i}.map((v) => v.toFixed(3)).join(" "));`;
}

/** Wall-clock milliseconds of a command run to the end. */
function timeCommand(args: string[], cwd: string): number {
  const started = performance.now();
  const result = spawnSync(process.execPath, args, { cwd, encoding: "utf8" });
  const ms = performance.now() - started;
  if (result.status !== 0) throw new Error(`${args.join(" ")} failed (${result.status}):\n${result.stderr}`);
  return ms;
}

const bench: Bench = {
  name: "Notebook runner",
  async run() {
    const folder = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-bench-"));
    const cells = Array.from({ length: CELLS }, (_, i) => cellCode(i));
    const notebook = path.join(folder, "bench.md");
    fs.writeFileSync(
      notebook,
      "---\ntitle: Runner benchmark (invented workload)\n---\n\n" +
        cells
          .map((c, i) => `## Step ${i + 1}\n\nSome prose about step ${i + 1}.\n\n\`\`\`ts\n${c}\n\`\`\`\n`)
          .join("\n"),
    );
    fs.writeFileSync(path.join(folder, "plain.ts"), `${cells.join("\n")}\nexport {};\n`);
    await esbuild.build({
      entryPoints: [path.join(folder, "plain.ts")],
      bundle: true,
      platform: "node",
      format: "esm",
      outfile: path.join(folder, "plain.mjs"),
      logLevel: "silent",
    });

    // Warm-up: the first runs fill tsx's and tristim's caches, as on any machine after the first use.
    timeCommand([BIN, "run", notebook, "--quiet"], folder);
    timeCommand([path.join(folder, "plain.mjs")], folder);
    const plain: number[] = [];
    const runner: number[] = [];
    for (let i = 0; i < REPEATS; i++) {
      plain.push(timeCommand([path.join(folder, "plain.mjs")], folder));
      runner.push(timeCommand([BIN, "run", notebook, "--quiet"], folder));
    }
    const plainMs = Math.min(...plain);
    const runnerMs = Math.min(...runner);

    // In-process pipeline (what watch mode pays per run, without starting node and tsx).
    const document = readNotebook(notebook);
    const inProcess: number[] = [];
    let run = await runDocument(document);
    for (let i = 0; i < REPEATS; i++) {
      const started = performance.now();
      run = await runDocument(document);
      renderReport(document, run);
      inProcess.push(performance.now() - started);
    }
    const inProcessMs = Math.min(...inProcess);

    // Prose-only re-render: read and parse the edited notebook, see that the cells are unchanged, move the records,
    // render and write the report atomically. Give the report a figure so the embedded Plotly is part of the cost.
    const withFigure = {
      ...run,
      cells: run.cells.map((c, i) =>
        i === 1
          ? {
              ...c,
              outputs: [
                ...c.outputs,
                { kind: "figure" as const, spec: { data: [{ x: [1, 2], y: [2, 1] }] } },
              ],
            }
          : c,
      ),
    };
    const rerender: number[] = [];
    for (let i = 0; i < 10; i++) {
      fs.writeFileSync(
        notebook,
        fs
          .readFileSync(notebook, "utf8")
          .replace(/Some prose about step 1\.[^\n]*/, `Some prose about step 1. Edit ${i}.`),
      );
      const started = performance.now();
      const edited = readNotebook(notebook);
      if (runSignature(edited, run.inputs, run.timeLimitMs, run.keepGoing) !== run.signature)
        throw new Error("the prose edit changed the signature");
      writeReport(edited, moveRecordsToEdit(withFigure, document, edited), path.join(folder, "bench.html"));
      rerender.push(performance.now() - started);
    }
    fs.rmSync(folder, { recursive: true, force: true });

    const ratio = runnerMs / plainMs;
    return [
      { name: "plain bundled script (node)", value: plainMs, unit: "ms" },
      { name: "tristim run (20 cells, report)", value: runnerMs, unit: "ms" },
      { name: "ratio runner / plain script", value: ratio, unit: "×", target: "≤ 1.5", met: ratio <= 1.5 },
      {
        name: "runner in-process (no node/tsx start)",
        value: inProcessMs,
        unit: "ms",
        note: "run + render, warm process",
      },
      {
        name: "fixed overhead of the command",
        value: runnerMs - plainMs,
        unit: "ms",
        note: "node start, loading the runner, esbuild, cell process, report",
      },
      {
        name: "prose-only re-render",
        value: median(rerender),
        unit: "ms",
        target: "< 100",
        met: median(rerender) < 100,
      },
    ];
  },
};

export default bench;
