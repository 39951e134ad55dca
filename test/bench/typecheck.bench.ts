/**
 * Type check speed: a 20-cell notebook (invented readings) checked cold by `tristim typecheck` as a fresh process
 * (node start, loading the compiler, parsing the library's cached declarations and the Node types; the fastest of 3,
 * the least disturbed by other load), and re-checked after an edit in one session as watch does (the program and
 * parsed files reused; median of 5 edits). Targets from issue 11: cold under 3 s, re-check under 0.5 s. Two more
 * fresh processes run with a cache folder of their own (TMPDIR): one without the library's declarations (the first
 * check after a library change emits them) and one empty (after install: also the comment-free type copies and the
 * compiler's code cache are made).
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { cacheRoot } from "../../runner/execute/runtime-bundle.ts";
import { parseNotebook, readNotebook } from "../../runner/parse/parse-notebook.ts";
import { createTypecheckSession } from "../../runner/typecheck/typecheck.ts";
import { median, type Bench } from "./bench.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));
const CELLS = 20;

/** Cell i of the benchmark notebook: each uses bindings of earlier cells, library and display functions. */
function cellCode(i: number, scale: number): string {
  if (i === 0)
    return `// Invented CIELAB readings of a tile series (not measurements).
const readings: Lab[] = Array.from({ length: 12 }, (_, k) => ({ L: 50 + k / 4, a: 20 - k / 3, b: 10 + k / 5 }));
const target: Lab = { L: 51, a: 18, b: 11 };`;
  return `const dE${i} = readings.map((r) => deltaE2000(r, target) * ${scale});
const worst${i} = Math.max(...dE${i});
showTable(dE${i}.map((d, k) => ({ tile: k + 1, dE: d })), { digits: 2 });
check("worst ΔE00 of step ${i}", worst${i}, { max: inputs.tolerance });`;
}

function notebookText(scale: number): string {
  const cells = Array.from(
    { length: CELLS },
    (_, i) => "```ts\n" + cellCode(i, i === 7 ? scale : 1) + "\n```\n",
  );
  return `---\ntitle: Type check benchmark (invented data)\ninputs:\n  tolerance: 2.5\n---\n\n${cells.join("\nProse.\n\n")}`;
}

/** Seconds of one `tristim typecheck` in a fresh process whose TMPDIR (the cache folder's parent) `prepare` fills. */
function coldWithTmpdir(file: string, prepare: (tmpdir: string) => void): number {
  const tmpdir = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-bench-typecheck-cache-"));
  try {
    prepare(tmpdir);
    const started = performance.now();
    const result = spawnSync(process.execPath, [BIN, "typecheck", "--quiet", file], {
      encoding: "utf8",
      env: { ...process.env, TMPDIR: tmpdir },
    });
    if (result.status !== 0)
      throw new Error(`tristim typecheck with TMPDIR ${tmpdir} failed (${result.status}): ${result.stderr}`);
    return (performance.now() - started) / 1000;
  } finally {
    fs.rmSync(tmpdir, { recursive: true, force: true });
  }
}

function cpuSeconds(usage: NodeJS.CpuUsage): number {
  return (usage.user + usage.system) / 1e6;
}

export default {
  name: "type check of a 20-cell notebook",
  async run() {
    const folder = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-bench-typecheck-"));
    const file = path.join(folder, "bench.md");
    fs.writeFileSync(file, notebookText(1));
    const cold: number[] = [];
    for (let i = 0; i < 3; i++) {
      const started = performance.now();
      const result = spawnSync(process.execPath, [BIN, "typecheck", "--quiet", file], { encoding: "utf8" });
      cold.push(performance.now() - started);
      if (result.status !== 0)
        throw new Error(`tristim typecheck failed (${result.status}): ${result.stderr}`);
    }
    const uncachedS = coldWithTmpdir(file, () => {});
    // As after a library change: the compiler's code cache and the type copies kept, the declarations gone.
    const changedS = coldWithTmpdir(file, (tmpdir) => {
      const kept = path.join(tmpdir, path.basename(cacheRoot()));
      fs.cpSync(path.join(cacheRoot(), "compiler"), path.join(kept, "compiler"), { recursive: true });
      fs.mkdirSync(path.join(kept, "typecheck"), { recursive: true });
      for (const name of fs.readdirSync(path.join(cacheRoot(), "typecheck")))
        if (name.startsWith("types-"))
          fs.copyFileSync(path.join(cacheRoot(), "typecheck", name), path.join(kept, "typecheck", name));
    });
    const session = createTypecheckSession();
    const firstStarted = performance.now();
    const firstCpu = process.cpuUsage();
    const first = session.check(readNotebook(file));
    const inProcessCold = performance.now() - firstStarted;
    const firstCpuS = cpuSeconds(process.cpuUsage(firstCpu));
    if (first.length > 0)
      throw new Error(`unexpected type errors: ${first.map((d) => d.message).join("; ")}`);
    const again: number[] = [];
    const againCpu: number[] = [];
    for (let edit = 2; edit < 7; edit++) {
      const document = parseNotebook(notebookText(edit), file);
      const started = performance.now();
      const cpu = process.cpuUsage();
      const found = session.check(document);
      again.push(performance.now() - started);
      againCpu.push(cpuSeconds(process.cpuUsage(cpu)));
      if (found.length > 0) throw new Error(`unexpected type errors after edit ${edit}`);
    }
    fs.rmSync(folder, { recursive: true, force: true });
    const coldS = Math.min(...cold) / 1000;
    const againS = median(again) / 1000;
    return [
      {
        name: "cold: tristim typecheck, fresh process",
        value: coldS,
        unit: "s",
        target: "< 3",
        met: coldS < 3,
      },
      {
        name: "cold, library changed (declarations emitted again)",
        value: changedS,
        unit: "s",
      },
      {
        name: "cold, caches empty (first check after install)",
        value: uncachedS,
        unit: "s",
        note: "also makes the type copies and the code cache",
      },
      {
        name: "first check in a new session (compiler loaded)",
        value: inProcessCold / 1000,
        unit: "s",
        note: `what watch's first check costs; CPU time ${firstCpuS.toFixed(2)} s`,
      },
      {
        name: "re-check after an edit (program reused)",
        value: againS,
        unit: "s",
        target: "< 0.5",
        met: againS < 0.5,
      },
    ];
  },
} satisfies Bench;
