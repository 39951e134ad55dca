/**
 * Runs at scale (issues 16 and 18): a batch of TRISTIM_BENCH_SCALE_FILES (default 200) small invented data files
 * through `tristim run --each`, three ways, side by side:
 *  - the way before issue 16 (the baseline): a new cell process for every run, one run at a time
 *    (--fresh-process --jobs 1);
 *  - the default with one run at a time (--jobs 1): a clean cell process is handed on to the next run;
 *  - the default with two runs at a time (--jobs 2).
 * Target (issue 16): the default with --jobs 2 at least 2× faster than the baseline on 2 cores. Also the per-run
 * overhead: the wall time per run beyond the cells' own time (the sum of the cells' durations, read from the
 * --results file). Each batch is measured once per bench run (a batch is already an average over its runs); the
 * batches alternate with TRISTIM_BENCH_REPEATS > 1 and the medians are shown.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { Bench, BenchResult } from "./bench.ts";
import { median } from "./bench.ts";
import type { ResultsFile } from "../../runner/report/results-file.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));
const FILES = Number(process.env.TRISTIM_BENCH_SCALE_FILES ?? 200);
const REPEATS = Number(process.env.TRISTIM_BENCH_REPEATS ?? 1);

function timed(args: string[], cwd: string): number {
  const start = performance.now();
  const r = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 3_600_000 });
  const ms = performance.now() - start;
  if (r.status !== 0)
    throw new Error(`tristim ${args.join(" ")} exited with ${r.status}: ${r.stderr.slice(0, 2000)}`);
  return ms;
}

const bench: Bench = {
  name: `--each over ${FILES} files: one at a time, --jobs 2, per-run overhead`,
  async run(): Promise<BenchResult[]> {
    const folder = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-bench-scale-"));
    try {
      fs.mkdirSync(path.join(folder, "lots"));
      for (let i = 0; i < FILES; i++)
        fs.writeFileSync(
          path.join(folder, "lots", `panel-${String(i).padStart(4, "0")}.csv`),
          `wavelength,value\n550,${(i % 97) + 1}\n`,
        );
      fs.writeFileSync(
        path.join(folder, "lot.md"),
        "---\ntitle: Panel lot (invented)\ninputs:\n  data: lots/panel-0000.csv\n---\n\n```ts\n" +
          'import fs from "node:fs";\nconst rows = fs.readFileSync(inputs.data, "utf8").trim().split("\\n").slice(1);\n' +
          'const value = Number(rows[0]!.split(",")[1]);\nshowTable([{ panel: inputs.data, value }]);\n' +
          'check("value", value, { min: 0, unit: "cd/m²" });\n```\n',
      );
      const batch =
        (out: string, jobs: string, extra: string[] = []) =>
        () =>
          timed(
            [
              "run",
              "lot.md",
              "--each",
              "data=lots/*.csv",
              "--quiet",
              "-o",
              out,
              "--jobs",
              jobs,
              "--results",
              `${out}.json`,
              ...extra,
            ],
            folder,
          );
      const fresh: number[] = [];
      const one: number[] = [];
      const two: number[] = [];
      for (let r = 0; r < REPEATS; r++) {
        fresh.push(batch("fresh", "1", ["--fresh-process"])());
        one.push(batch("one", "1")());
        two.push(batch("two", "2")());
      }
      const cellMsOf = (name: string) =>
        (JSON.parse(fs.readFileSync(path.join(folder, `${name}.json`), "utf8")) as ResultsFile).runs.reduce(
          (sum, run) => sum + run.record.cells.reduce((s, c) => s + (c.durationMs ?? 0), 0),
          0,
        );
      const freshMs = median(fresh);
      const oneMs = median(one);
      const twoMs = median(two);
      const speedUp = freshMs / twoMs;
      return [
        {
          name: `${FILES} runs, new process each, --jobs 1 (baseline)`,
          value: freshMs / 1000,
          unit: "s",
        },
        {
          name: `${FILES} runs, process handed on, --jobs 1`,
          value: oneMs / 1000,
          unit: "s",
          note: `${(freshMs / oneMs).toFixed(2)}× faster than the baseline`,
        },
        {
          name: `${FILES} runs, process handed on, --jobs 2`,
          value: twoMs / 1000,
          unit: "s",
          note: `${(oneMs / twoMs).toFixed(2)}× faster than --jobs 1`,
        },
        {
          name: "baseline / handed on with --jobs 2 (speed-up)",
          value: speedUp,
          unit: "×",
          target: "≥ 2",
          met: speedUp >= 2,
        },
        {
          name: "per-run overhead, new process each",
          value: (freshMs - cellMsOf("fresh")) / FILES,
          unit: "ms",
          note: `wall ${(freshMs / FILES).toFixed(0)} ms a run, of which the cells' own ${(cellMsOf("fresh") / FILES).toFixed(1)} ms`,
        },
        {
          name: "per-run overhead, handed on, --jobs 1",
          value: (oneMs - cellMsOf("one")) / FILES,
          unit: "ms",
          note: `wall ${(oneMs / FILES).toFixed(0)} ms a run, of which the cells' own ${(cellMsOf("one") / FILES).toFixed(1)} ms`,
        },
        { name: "wall time per run, handed on, --jobs 2", value: twoMs / FILES, unit: "ms" },
      ];
    } finally {
      fs.rmSync(folder, { recursive: true, force: true });
    }
  },
};

export default bench;
