/**
 * Runs at scale (issue 18): a batch of TRISTIM_BENCH_SCALE_FILES (default 200) small invented data files through
 * `tristim run --each` in a fresh process, one run at a time (--jobs 1) and with --jobs 2, and the per-run
 * overhead: the wall time per run beyond the cells' own time (the sum of the cells' durations, read from the
 * --results file of the one-at-a-time batch). Each is measured once per bench run (a batch is already an average
 * over its runs); the two batches alternate with TRISTIM_BENCH_REPEATS > 1 and the medians are shown.
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
      const batch = (out: string, jobs: string) => () =>
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
          ],
          folder,
        );
      const one: number[] = [];
      const two: number[] = [];
      for (let r = 0; r < REPEATS; r++) {
        one.push(batch("one", "1")());
        two.push(batch("two", "2")());
      }
      const results = JSON.parse(fs.readFileSync(path.join(folder, "one.json"), "utf8")) as ResultsFile;
      const cellMs = results.runs.reduce(
        (sum, run) => sum + run.record.cells.reduce((s, c) => s + (c.durationMs ?? 0), 0),
        0,
      );
      const oneMs = median(one);
      const twoMs = median(two);
      return [
        { name: `${FILES} runs, --jobs 1 (wall time)`, value: oneMs / 1000, unit: "s" },
        {
          name: `${FILES} runs, --jobs 2 (wall time)`,
          value: twoMs / 1000,
          unit: "s",
          note: `${(oneMs / twoMs).toFixed(2)}× faster than --jobs 1`,
        },
        {
          name: "per-run overhead, --jobs 1",
          value: (oneMs - cellMs) / FILES,
          unit: "ms",
          note: `wall ${(oneMs / FILES).toFixed(0)} ms a run, of which the cells' own ${(cellMs / FILES).toFixed(1)} ms`,
        },
        { name: "wall time per run, --jobs 2", value: twoMs / FILES, unit: "ms" },
      ];
    } finally {
      fs.rmSync(folder, { recursive: true, force: true });
    }
  },
};

export default bench;
