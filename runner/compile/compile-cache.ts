/**
 * The compile stage's disk cache, so that running a notebook again (a re-run, a watch edit, the next command) does
 * not compile the cells that did not change: esbuild's start, 20 transforms and the bundle of the cells' npm
 * imports took about 240 ms of a 20-cell run, on the path to the first cell.
 *
 * - A cell's transform and rewrite (esbuild, then hoist-cell.ts) depend only on its code and the notebook's file
 *   name (in the source map), so they are kept under a key made of those, esbuild's version and the compile
 *   stage's own sources (sizes and modification times of runner/compile/). Positions in the notebook are not part
 *   of it: they are attached again on use.
 * - The bundle of the cells' imports depends on what each cell imports, the notebook's folder, the library module
 *   it points "tristim" to, and the files it was made from; it is kept with the list of those files (size and
 *   modification time of each) and used only while every one of them is unchanged.
 * Entries are written to a temporary name and renamed, so a reader sees a whole entry or none; one that cannot be
 * read is compiled afresh. Entries not used for a week are removed.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { esbuildVersion } from "../shared/lazy-esbuild.ts";
import { cacheRoot } from "../execute/runtime-bundle.ts";
import type { HoistedCell } from "./hoist-cell.ts";

/** A cell as esbuild and the rewrite left it. */
export interface TransformedCell {
  readonly js: string;
  readonly map: string;
  readonly hoisted: HoistedCell;
}

/** One cell's bundle of imports, as compileCells uses it. */
export interface CellImportBundle {
  readonly importBundle: string;
  readonly importedFiles: string[];
}

const WEEK_MS = 7 * 24 * 3600_000;

let stageStamp: string | undefined;

/** What identifies this version of the compile stage: esbuild's version and the stage's sources. */
function compilerStamp(): string {
  if (stageStamp !== undefined) return stageStamp;
  const hash = createHash("sha256").update(`${esbuildVersion()}\n${process.version}\n`);
  const folder = path.dirname(fileURLToPath(import.meta.url));
  for (const name of fs.readdirSync(folder).sort()) {
    const s = fs.statSync(path.join(folder, name));
    hash.update(`${name}\0${s.size}\0${s.mtimeMs}\n`);
  }
  return (stageStamp = hash.digest("hex").slice(0, 16));
}

function keyOf(...parts: string[]): string {
  return createHash("sha256")
    .update([compilerStamp(), ...parts].join("\0"))
    .digest("hex")
    .slice(0, 32);
}

function folderOf(kind: "cells" | "imports"): string {
  return path.join(cacheRoot(), "compiled", kind);
}

/** The cached transform of a cell, or undefined. */
export function cachedTransform(code: string, sourcefile: string): TransformedCell | undefined {
  const file = path.join(folderOf("cells"), `${keyOf("cell", sourcefile, code)}.json`);
  try {
    const entry = JSON.parse(fs.readFileSync(file, "utf8")) as TransformedCell;
    touch(file);
    return entry;
  } catch {
    return undefined;
  }
}

/** Keeps a cell's transform for the next run (a failure to write only costs time). */
export function keepTransform(code: string, sourcefile: string, transformed: TransformedCell): void {
  const folder = folderOf("cells");
  const file = path.join(folder, `${keyOf("cell", sourcefile, code)}.json`);
  try {
    fs.mkdirSync(folder, { recursive: true });
    const temporary = `${file}.${process.pid}.tmp`;
    fs.writeFileSync(temporary, JSON.stringify(transformed));
    fs.renameSync(temporary, file);
  } catch {
    // a cache that cannot be written only costs time
  }
  pruneOnce();
}

/** What a kept import bundle records: the files it was made from and each cell's bundle. */
interface ImportsManifest {
  readonly inputs: readonly (readonly [file: string, size: number, mtimeMs: number])[];
  readonly bundles: readonly (readonly [cell: number, importBundle: string, importedFiles: string[]])[];
}

/** The key of the import bundles of a set of cells. */
export function importsKey(
  cells: readonly { readonly index: number; readonly specifiers: readonly string[] }[],
  resolveDir: string,
  tristimModule: string,
): string {
  return keyOf(
    "imports",
    resolveDir,
    tristimModule,
    JSON.stringify(cells.map((c) => [c.index, c.specifiers])),
  );
}

/** The folder a build of the import bundles for `key` writes to (then renamed by keepImports). */
export function importsBuildFolder(key: string): string {
  return path.join(folderOf("imports"), `${key}-${process.pid}-${Date.now().toString(36)}.tmp`);
}

/**
 * The kept import bundles for `key`, when every file they were made from is unchanged. `<key>.json` names the
 * folder of the newest build; a folder is never changed once kept, so a run still importing from an older one is
 * not disturbed by a rebuild.
 */
export function cachedImports(key: string): Map<number, CellImportBundle> | undefined {
  let folder: string;
  let manifest: ImportsManifest;
  try {
    const pointer = JSON.parse(fs.readFileSync(pointerOf(key), "utf8")) as { folder: string };
    folder = path.join(folderOf("imports"), path.basename(pointer.folder));
    manifest = JSON.parse(fs.readFileSync(path.join(folder, "manifest.json"), "utf8")) as ImportsManifest;
    for (const [file, size, mtimeMs] of manifest.inputs) {
      const s = fs.statSync(file);
      if (s.size !== size || s.mtimeMs !== mtimeMs) return undefined;
    }
  } catch {
    return undefined;
  }
  touch(path.join(folder, "manifest.json"));
  return new Map(
    manifest.bundles.map(([cell, bundle, importedFiles]) => [
      cell,
      { importBundle: path.join(folder, bundle), importedFiles },
    ]),
  );
}

/**
 * Keeps the bundles just built in `built` (the folder from importsBuildFolder) under `key`, with the files they
 * were made from; returns the bundles at their kept place (or where they were built, if they cannot be kept).
 */
export function keepImports(
  key: string,
  built: string,
  bundles: Map<number, CellImportBundle>,
  inputs: readonly string[],
): Map<number, CellImportBundle> {
  const folder = built.replace(/\.tmp$/, "");
  try {
    const manifest: ImportsManifest = {
      inputs: inputs.map((file) => {
        const s = fs.statSync(file);
        return [file, s.size, s.mtimeMs] as const;
      }),
      bundles: [...bundles].map(([cell, b]) => [cell, path.relative(built, b.importBundle), b.importedFiles]),
    };
    fs.writeFileSync(path.join(built, "manifest.json"), JSON.stringify(manifest));
    fs.renameSync(built, folder);
    const temporary = `${pointerOf(key)}.${process.pid}.tmp`;
    fs.writeFileSync(temporary, JSON.stringify({ folder: path.basename(folder) }));
    fs.renameSync(temporary, pointerOf(key));
  } catch {
    // The cache cannot be written: use the bundles where they were built.
    return fs.existsSync(built) ? bundles : relocated(bundles, built, folder);
  }
  pruneOnce();
  return relocated(bundles, built, folder);
}

/** The bundles with their paths moved from folder `from` to folder `to`. */
function relocated(
  bundles: Map<number, CellImportBundle>,
  from: string,
  to: string,
): Map<number, CellImportBundle> {
  return new Map(
    [...bundles].map(([cell, b]) => [
      cell,
      { ...b, importBundle: path.join(to, path.relative(from, b.importBundle)) },
    ]),
  );
}

/** The file that names the newest kept build for `key`. */
function pointerOf(key: string): string {
  return path.join(folderOf("imports"), `${key}.json`);
}

function touch(file: string): void {
  try {
    const now = new Date();
    fs.utimesSync(file, now, now);
  } catch {
    // only affects pruning
  }
}

let pruned = false;

/** Removes entries not used for a week (once per process, after a new entry was kept). */
function pruneOnce(): void {
  if (pruned) return;
  pruned = true;
  const weekAgo = Date.now() - WEEK_MS;
  for (const kind of ["cells", "imports"] as const) {
    let names: string[];
    try {
      names = fs.readdirSync(folderOf(kind));
    } catch {
      continue;
    }
    for (const name of names) {
      const full = path.join(folderOf(kind), name);
      // A build in progress (.tmp) and a pointer (.json) by their own time, a kept build by its manifest's.
      const kept = kind === "imports" && !name.endsWith(".tmp") && !name.endsWith(".json");
      const stamp = kept ? path.join(full, "manifest.json") : full;
      try {
        if (fs.statSync(stamp).mtimeMs < weekAgo) fs.rmSync(full, { recursive: true, force: true });
      } catch {
        // a build in progress, or already gone
      }
    }
  }
}
