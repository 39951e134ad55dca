/**
 * The TypeScript compiler, loaded when a type-check module is first imported. The CLI imports those modules only for
 * the commands that check, so `run` and `watch` without checking do not pay for loading it (the bundled CLI keeps a
 * static import of an npm package at the top of the bundle, a require here it does not).
 *
 * Its 9 MB of JavaScript are compiled with V8's code cache: `saveCompilerCodeCache` (called after a first check)
 * stores the compiled code, the functions a check ran included, in the cache folder, and later processes start from
 * it (measured: about 0.25 s less compiling, and less compiling during the check). The cache is keyed on the
 * compiler file, node version and flags; V8 itself refuses data that does not fit, and then the code is compiled
 * from source as without a cache. Any problem with the cache falls back to a plain require.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import vm from "node:vm";
import type TypeScript from "typescript";
import { cacheRoot } from "../execute/runtime-bundle.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";

const require = createRequire(import.meta.url);

interface Loaded {
  readonly ts: typeof TypeScript;
  /** Writes the code cache when there was none that fit (once). */
  save(): void;
}

function load(): Loaded {
  const file = require.resolve("typescript");
  let cacheFile: string;
  let script: vm.Script;
  let cached: Buffer | undefined;
  const module: { exports: object } = { exports: {} };
  try {
    const stat = fs.statSync(file);
    const key = createHash("sha256")
      .update(
        `${process.version}\n${process.arch}\n${process.execArgv.join(" ")}\n${file}\n${stat.size}\n${stat.mtimeMs}`,
      )
      .digest("hex")
      .slice(0, 20);
    cacheFile = path.join(cacheRoot(), "compiler", `typescript-${key}.bin`);
    try {
      cached = fs.readFileSync(cacheFile);
    } catch {
      cached = undefined;
    }
    const source = fs.readFileSync(file, "utf8");
    // The wrapper node puts around a CommonJS file.
    const wrapped = `(function (exports, require, module, __filename, __dirname) { ${source}\n})`;
    script = new vm.Script(wrapped, { filename: file, cachedData: cached });
    const run = script.runInThisContext() as (...args: unknown[]) => void;
    run.call(module.exports, module.exports, createRequire(file), module, file, path.dirname(file));
  } catch (e) {
    if (process.env.TRISTIM_DEBUG) console.error("tristim: compiler code cache not used:", e);
    return { ts: require("typescript") as typeof TypeScript, save() {} };
  }
  let stale = cached === undefined || script.cachedDataRejected === true;
  return {
    ts: module.exports as typeof TypeScript,
    save() {
      if (!stale) return;
      stale = false;
      try {
        fs.mkdirSync(path.dirname(cacheFile), { recursive: true });
        writeFileAtomic(cacheFile, [script.createCachedData()]);
        pruneOld(path.dirname(cacheFile), path.basename(cacheFile));
      } catch (e) {
        if (process.env.TRISTIM_DEBUG) console.error("tristim: compiler code cache not written:", e);
      }
    },
  };
}

/** Removes other code caches not used for a day (another node version's). */
function pruneOld(folder: string, keep: string): void {
  const dayAgo = Date.now() - 24 * 3600_000;
  for (const name of fs.readdirSync(folder)) {
    if (name === keep || !name.startsWith("typescript-")) continue;
    try {
      const full = path.join(folder, name);
      if (fs.statSync(full).mtimeMs < dayAgo) fs.rmSync(full, { force: true });
    } catch {
      // already gone
    }
  }
}

const loaded = load();

/** Stores the compiled compiler for the next process, when the cache was missing or did not fit. */
export function saveCompilerCodeCache(): void {
  loaded.save();
}

const ts = loaded.ts;
export default ts;
