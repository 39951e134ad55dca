/**
 * Where users wait on the runner, each measured side by side in the same run (medians over alternating runs, fresh
 * processes; the machines here are loaded 2-core boxes, so ratios mean more than absolute times):
 * - a realistic 20-cell notebook (realistic-notebook.ts: figures, tables, checks, an npm import, heavy compute)
 *   through `tristim run` against the same code bundled once by esbuild and run by plain node (target ≤ 1.2);
 * - `tristim --version` against `node -e 0` (target under 150 ms);
 * - a notebook with a syntax error, which must fail fast (target under 500 ms);
 * - `--each` over many small files: the tool as it was before this work (the baseline commit, unpacked with
 *   `git archive`) one run at a time against today's `--jobs 2` (target ≥ 2× faster); TRISTIM_BENCH_BATCH sets the
 *   number of files (default 60; 200 takes several minutes here);
 * - watch mode: a code edit (save → report rendered, less the cells' own time) and a prose edit (save → page
 *   fetched, target under 150 ms), with the default debounce.
 * TRISTIM_BENCH_REPEATS sets the number of alternating runs (default 5).
 */
import { execFileSync, spawnSync } from "node:child_process";
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import { fileURLToPath } from "node:url";
import * as esbuild from "esbuild";
import { startWatch, type RenderEvent, type Watcher } from "../../runner/watch/watch.ts";
import { readEmbeddedRunRecord } from "../../runner/report/embedded-run-record.ts";
import { BENCH_CELLS, benchNotebook, plainScript } from "./realistic-notebook.ts";
import { median, type Bench, type BenchResult } from "./bench.ts";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const BIN = path.join(ROOT, "runner", "bin.mjs");
const REPEATS = Number(process.env.TRISTIM_BENCH_REPEATS ?? 5);
const BATCH_FILES = Number(process.env.TRISTIM_BENCH_BATCH ?? 60);
/** The commit the "today" was measured on (the wave's baseline). */
const BASELINE_COMMIT = "4adefc844a39e597b0f790b87f35e99cb0542434";

/** Wall-clock milliseconds of a command run to the end; `expect` is the exit code it must give. */
function timeCommand(args: string[], cwd: string, expect = 0): number {
  const started = performance.now();
  const result = spawnSync(process.execPath, args, { cwd, encoding: "utf8" });
  const ms = performance.now() - started;
  if (result.status !== expect)
    throw new Error(`${args.join(" ")} exited with ${result.status}, not ${expect}:\n${result.stderr}`);
  return ms;
}

/** Runs each command `repeats` times, alternating, and returns the median of each. */
function alternate(commands: (() => number)[], repeats = REPEATS): number[] {
  const times = commands.map((): number[] => []);
  for (let i = 0; i < repeats; i++) commands.forEach((c, k) => times[k]!.push(c()));
  return times.map(median);
}

/** The baseline commit's sources in a folder of their own, sharing this checkout's packages; undefined without git. */
function baselineCheckout(folder: string): string | undefined {
  const target = path.join(folder, "baseline");
  try {
    fs.mkdirSync(target);
    const archive = execFileSync("git", ["-C", ROOT, "archive", BASELINE_COMMIT], { maxBuffer: 1 << 28 });
    execFileSync("tar", ["-x", "-C", target], { input: archive });
  } catch {
    return undefined;
  }
  // Package by package, so that its node_modules/.cache (the CLI bundle) is its own.
  fs.mkdirSync(path.join(target, "node_modules"));
  for (const name of fs.readdirSync(path.join(ROOT, "node_modules"))) {
    if (name === ".cache") continue;
    fs.symlinkSync(path.join(ROOT, "node_modules", name), path.join(target, "node_modules", name));
  }
  return path.join(target, "runner", "bin.mjs");
}

function get(url: string): Promise<string> {
  return new Promise((resolve, reject) => {
    http
      .get(url, (res) => {
        let body = "";
        res.setEncoding("utf8");
        res.on("data", (c) => (body += c));
        res.on("end", () => resolve(body));
      })
      .on("error", reject);
  });
}

function nextRender(w: Watcher): Promise<RenderEvent> {
  return new Promise((resolve) => w.events.once("render", resolve));
}

const bench: Bench = {
  name: "Notebook runner",
  async run() {
    // Inside the package, so the notebook's `import ... from "culori"` resolves as in a user's project.
    const cacheDir = path.join(ROOT, "node_modules", ".cache");
    fs.mkdirSync(cacheDir, { recursive: true });
    const folder = fs.mkdtempSync(path.join(cacheDir, "tristim-bench-"));
    const results: BenchResult[] = [];
    try {
      // 1. Realistic notebook against plain node.
      const notebook = path.join(folder, "bench.md");
      fs.writeFileSync(notebook, benchNotebook());
      fs.writeFileSync(
        path.join(folder, "plain.ts"),
        plainScript(path.join(ROOT, "cells", "tristim-entry.ts")),
      );
      await esbuild.build({
        entryPoints: [path.join(folder, "plain.ts")],
        bundle: true,
        platform: "node",
        format: "esm",
        outfile: path.join(folder, "plain.mjs"),
        logLevel: "silent",
      });
      // Warm-up: the first runs fill the CLI's and the runtime's caches, as on any machine after the first use.
      timeCommand([BIN, "run", notebook, "--quiet"], folder);
      timeCommand([path.join(folder, "plain.mjs")], folder);
      const [plainMs, runnerMs] = alternate([
        () => timeCommand([path.join(folder, "plain.mjs")], folder),
        () => timeCommand([BIN, "run", notebook, "--quiet"], folder),
      ]);
      const ratio = runnerMs! / plainMs!;
      results.push(
        {
          name: "plain bundled script (node)",
          value: plainMs!,
          unit: "ms",
          note: `${BENCH_CELLS.length} cells`,
        },
        { name: "tristim run (report with 3 figures)", value: runnerMs!, unit: "ms" },
        { name: "ratio runner / plain script", value: ratio, unit: "×", target: "≤ 1.2", met: ratio <= 1.2 },
      );

      // 2. Cold start, 3. a syntax error.
      const bad = path.join(folder, "bad.md");
      fs.writeFileSync(
        bad,
        "# Broken (invented)\n\n```ts\nconst a = 1;\n```\n\n```ts\nconst b = (a + ;\n```\n\n```ts\nconsole.log(b);\n```\n",
      );
      timeCommand([BIN, "run", bad, "--quiet"], folder, 1);
      const [nodeMs, versionMs, badMs] = alternate(
        [
          () => timeCommand(["-e", "0"], folder),
          () => timeCommand([BIN, "--version"], folder),
          () => timeCommand([BIN, "run", bad, "--quiet"], folder, 1),
        ],
        Math.max(REPEATS, 7),
      );
      results.push(
        { name: "node -e 0", value: nodeMs!, unit: "ms" },
        {
          name: "tristim --version",
          value: versionMs!,
          unit: "ms",
          target: "< 150",
          met: versionMs! < 150,
          note: `${(versionMs! / nodeMs!).toFixed(2)}× node -e 0`,
        },
        {
          name: "notebook with a syntax error fails",
          value: badMs!,
          unit: "ms",
          target: "< 500",
          met: badMs! < 500,
          note: `${(badMs! / nodeMs!).toFixed(2)}× node -e 0`,
        },
      );

      // 4. --each over many small files.
      const lots = path.join(folder, "lots");
      fs.mkdirSync(lots);
      for (let i = 0; i < BATCH_FILES; i++)
        fs.writeFileSync(
          path.join(lots, `lot-${String(i).padStart(3, "0")}.csv`),
          `wavelength,value\n550,${i}\n`,
        );
      fs.writeFileSync(
        path.join(folder, "each.md"),
        '---\ntitle: Lot (invented)\ninputs:\n  data: lots/lot-000.csv\n---\n\n```ts\nimport fs from "node:fs";\n' +
          'const rows = fs.readFileSync(inputs.data, "utf8").trim().split("\\n").slice(1);\n' +
          'const value = Number(rows[0]!.split(",")[1]);\nshowTable([{ lot: inputs.data, value }]);\n' +
          'check("value", value, { min: 0 });\n```\n',
      );
      const each = (bin: string, out: string, extra: string[]) => () =>
        timeCommand(
          [bin, "run", "each.md", "--each", "data=lots/*.csv", "--quiet", "-o", out, ...extra],
          folder,
        );
      const baseline = baselineCheckout(folder);
      if (baseline) each(baseline, "out-then", [])();
      const [thenMs, oneMs, twoMs] = alternate(
        [
          baseline ? each(baseline, "out-then", []) : () => NaN,
          each(BIN, "out-one", ["--jobs", "1"]),
          each(BIN, "out-two", ["--jobs", "2"]),
        ],
        Math.min(REPEATS, 3),
      );
      const speedUp = thenMs! / twoMs!;
      results.push(
        {
          name: `--each ${BATCH_FILES} files, before (one at a time)`,
          value: thenMs!,
          unit: "ms",
          note: baseline ? `commit ${BASELINE_COMMIT.slice(0, 7)}` : "no git: not measured",
        },
        { name: `--each ${BATCH_FILES} files, now --jobs 1`, value: oneMs!, unit: "ms" },
        { name: `--each ${BATCH_FILES} files, now --jobs 2`, value: twoMs!, unit: "ms" },
        {
          name: "--each speed-up, before / --jobs 2",
          value: speedUp,
          unit: "×",
          target: "≥ 2",
          met: speedUp >= 2,
        },
      );

      // 5. Watch: code edits and prose edits of the realistic notebook.
      const watched = path.join(folder, "watched.md");
      fs.writeFileSync(watched, benchNotebook());
      const w = await startWatch(watched, {
        port: 0,
        inputs: {},
        keepGoing: false,
        linkAssets: false,
        quiet: true,
      });
      const codeOverhead: number[] = [];
      const prose: number[] = [];
      try {
        await nextRender(w);
        for (let i = 0; i < Math.min(REPEATS, 3); i++) {
          await new Promise((r) => setTimeout(r, 1000)); // reading the report; the spare gets ready meanwhile
          const render = nextRender(w);
          const started = performance.now();
          fs.writeFileSync(
            watched,
            benchNotebook(BENCH_CELLS.map((c, k) => (k === 19 ? `${c}\n// edit ${i}` : c))),
          );
          const event = await render;
          const ms = performance.now() - started;
          if (!event.executed) throw new Error("the code edit did not run");
          const record = readEmbeddedRunRecord(fs.readFileSync(path.join(folder, "watched.html"), "utf8"));
          const cellsMs = record.cells.reduce((s, c) => s + (c.durationMs ?? 0), 0);
          codeOverhead.push(ms - cellsMs);
        }
        for (let i = 0; i < Math.max(REPEATS, 5); i++) {
          const text = fs
            .readFileSync(watched, "utf8")
            .replace(/Some prose about step 1\.[^\n]*/, `Some prose about step 1. Edit ${i}.`);
          const render = nextRender(w);
          const started = performance.now();
          fs.writeFileSync(watched, text);
          const event = await render;
          const page = await get(w.url);
          const ms = performance.now() - started;
          if (event.executed || !page.includes(`Edit ${i}.`))
            throw new Error("the prose edit was not re-rendered");
          prose.push(ms);
        }
      } finally {
        await w.close();
      }
      results.push(
        {
          name: "watch: code edit, beyond the cells' own time",
          value: median(codeOverhead),
          unit: "ms",
          note: "save → report rendered (spare cell process)",
        },
        {
          name: "watch: prose edit served",
          value: median(prose),
          unit: "ms",
          target: "< 150",
          met: median(prose) < 150,
          note: "save → page fetched",
        },
      );
      return results;
    } finally {
      fs.rmSync(folder, { recursive: true, force: true });
    }
  },
};

export default bench;
