/**
 * The code the cell process runs: cells/worker.ts (the harness) and cells/tristim-entry.ts (the "tristim" module:
 * lib/ plus the display functions), bundled together by esbuild with code splitting, so the harness and every cell
 * share one instance of the library. The bundle is cached in the system's temporary folder under a key made from
 * the sizes and modification times of lib/, cells/ and the lock file, so an unchanged library is not rebuilt.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type * as Esbuild from "esbuild";
import { esbuild, esbuildVersion } from "../shared/lazy-esbuild.ts";
import { BANNER } from "../shared/require-banner.ts";
import { PACKAGE_ROOT } from "../shared/package-root.ts";
import { stampFile, stampTree } from "../shared/source-stamp.ts";
import { cacheRoot, latestWorkerFile } from "./cell-spawn.mjs";

/** Paths of a built runtime. */
export interface RuntimeBundle {
  readonly dir: string;
  /** The harness the cell process starts with. */
  readonly worker: string;
  /** The "tristim" module every cell and imported file resolves to. */
  readonly tristim: string;
}

/** The library or the harness could not be bundled (a problem in lib/ or cells/, not in the notebook). */
export class RuntimeBuildError extends Error {
  override readonly name = "RuntimeBuildError";
}

export { cacheRoot } from "./cell-spawn.mjs";

/** Returns the runtime bundle, building it when lib/ or cells/ changed since the cached one. */
export async function runtimeBundle(): Promise<RuntimeBundle> {
  const key = sourceKey();
  const dir = path.join(cacheRoot(), "runtime", key);
  const bundle = { dir, worker: path.join(dir, "worker.mjs"), tristim: path.join(dir, "tristim.mjs") };
  if (fs.existsSync(path.join(dir, "complete"))) return namedLatest(bundle);
  const temporary = `${dir}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  try {
    await esbuild().build({
      entryPoints: {
        worker: path.join(PACKAGE_ROOT, "cells", "worker.ts"),
        tristim: path.join(PACKAGE_ROOT, "cells", "tristim-entry.ts"),
      },
      bundle: true,
      splitting: true,
      platform: "node",
      format: "esm",
      target: "node20",
      outdir: temporary,
      outExtension: { ".js": ".mjs" },
      chunkNames: "chunk-[hash]",
      sourcemap: "linked",
      sourceRoot: undefined,
      logLevel: "silent",
      banner: { js: BANNER },
    });
  } catch (e) {
    fs.rmSync(temporary, { recursive: true, force: true });
    const errors = (e as Esbuild.BuildFailure).errors ?? [];
    const first = errors[0];
    const where = first?.location
      ? `${first.location.file}:${first.location.line}:${first.location.column + 1}: `
      : "";
    throw new RuntimeBuildError(
      `the standard library (lib/) or the cell harness (cells/) could not be bundled: ${where}${first?.text ?? String(e)}` +
        (errors.length > 1 ? ` (and ${errors.length - 1} more)` : ""),
    );
  }
  fs.writeFileSync(path.join(temporary, "complete"), key);
  try {
    fs.renameSync(temporary, dir);
  } catch {
    // Another run built the same bundle at the same time; theirs is identical.
    fs.rmSync(temporary, { recursive: true, force: true });
  }
  pruneOldBundles(path.dirname(dir), key);
  return namedLatest(bundle);
}

/**
 * Names `bundle`'s worker in the pointer file the launcher reads to start the next run's cell process before
 * anything else (cell-spawn.mjs); written only when it names another, and renamed into place, so a launcher reads
 * a whole path or none.
 */
function namedLatest(bundle: RuntimeBundle): RuntimeBundle {
  const file = latestWorkerFile();
  try {
    if (fs.readFileSync(file, "utf8") === bundle.worker) return bundle;
  } catch {
    // not written yet
  }
  try {
    const temporary = `${file}.${process.pid}.tmp`;
    fs.writeFileSync(temporary, bundle.worker);
    fs.renameSync(temporary, file);
  } catch {
    // A launcher without the pointer only starts its cell process later.
  }
  return bundle;
}

/** A key that changes whenever a file in lib/ or cells/ (or the installed packages) changes. */
function sourceKey(): string {
  const hash = createHash("sha256");
  hash.update(`${process.version}\n${esbuildVersion()}\n${PACKAGE_ROOT}\n`);
  for (const folder of ["lib", "cells"]) stampTree(path.join(PACKAGE_ROOT, folder), hash);
  for (const file of ["package.json", "package-lock.json"]) stampFile(path.join(PACKAGE_ROOT, file), hash);
  return hash.digest("hex").slice(0, 20);
}

/** Removes cached bundles older than a day (other than the current one). */
function pruneOldBundles(folder: string, keep: string): void {
  const dayAgo = Date.now() - 24 * 3600_000;
  for (const name of fs.readdirSync(folder)) {
    if (name === keep || name === path.basename(latestWorkerFile())) continue;
    const full = path.join(folder, name);
    try {
      if (fs.statSync(full).mtimeMs < dayAgo) fs.rmSync(full, { recursive: true, force: true });
    } catch {
      // already gone
    }
  }
}
