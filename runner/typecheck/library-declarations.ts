/**
 * Declaration files of the library (lib/ and cells/, reached from cells/tristim-entry.ts), emitted once with the
 * compiler's declaration emit and cached, so a type check reads about 0.13 MB of .d.ts instead of 1.1 MB of .ts
 * sources (parsing and binding those was most of a cold check). The cache sits in the cache folder under a key made
 * from the sizes and modification times of lib/ and cells/, the lock file and the compiler version; a folder is
 * complete only once renamed into place with its manifest, so a half-written one is never read. When the
 * declarations cannot be emitted the check reads the sources, as without a cache.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { CompilerHost, CompilerOptions, Program } from "typescript";
import { cacheRoot } from "../execute/runtime-bundle.ts";
import { PACKAGE_ROOT } from "../shared/package-root.ts";
import { entryExportNames } from "./cell-globals.ts";
import ts from "./typescript.ts";
import { stampFile, stampTree } from "../shared/source-stamp.ts";

/** A complete set of cached declarations. */
export interface LibraryDeclarations {
  /** The folder that mirrors the package root (`<dir>/lib/...d.ts`, `<dir>/cells/...d.ts`). */
  readonly dir: string;
  /** The package root the declarations were emitted from. */
  readonly root: string;
  /** The declaration of the cell entry (`<dir>/cells/tristim-entry.d.ts`). */
  readonly entry: string;
  /** The names the entry exports (what cells get as globals). */
  readonly names: readonly string[];
  /** Every declaration file in `dir` (absolute paths). */
  readonly files: ReadonlySet<string>;
}

/** Where the library is and where its declarations go (tests point both at folders of their own). */
export interface DeclarationPlace {
  readonly root: string;
  readonly cacheDir: string;
}

/** Bumped when what is written changes, so an older cache is not read. */
const FORMAT = "2";
const MANIFEST = "manifest.json";

/** The default place: this package, in the cache folder. */
export function defaultDeclarationPlace(): DeclarationPlace {
  return { root: PACKAGE_ROOT, cacheDir: path.join(cacheRoot(), "typecheck") };
}

/**
 * The declarations for the library as it is now: read from the cache, or emitted (and cached) when lib/ or cells/
 * changed since; undefined when they cannot be emitted (the caller then checks against the sources).
 */
export function libraryDeclarations(
  options: CompilerOptions,
  place: DeclarationPlace = defaultDeclarationPlace(),
  getSourceFile?: CompilerHost["getSourceFile"],
): LibraryDeclarations | undefined {
  const key = declarationKey(place.root);
  const dir = path.join(place.cacheDir, key);
  const cached = readManifest(dir, place.root);
  if (cached) return cached;
  try {
    return emitDeclarations(options, place, key, getSourceFile);
  } catch (e) {
    if (process.env.TRISTIM_DEBUG) console.error("tristim: library declarations not cached:", e);
    return undefined;
  }
}

/** The cached declarations in `dir`, when complete. */
function readManifest(dir: string, root: string): LibraryDeclarations | undefined {
  try {
    const manifest = JSON.parse(fs.readFileSync(path.join(dir, MANIFEST), "utf8")) as {
      names: string[];
      files: string[];
    };
    const entry = path.join(dir, "cells", "tristim-entry.d.ts");
    if (!Array.isArray(manifest.names) || !Array.isArray(manifest.files) || !fs.existsSync(entry))
      return undefined;
    const files = new Set(manifest.files.map((f) => path.join(dir, f)));
    return { dir, root, entry, names: manifest.names, files };
  } catch {
    return undefined;
  }
}

/** Emits the declarations into a temporary folder and renames it into place; throws when emit fails. */
function emitDeclarations(
  options: CompilerOptions,
  place: DeclarationPlace,
  key: string,
  getSourceFile: CompilerHost["getSourceFile"] | undefined,
): LibraryDeclarations {
  const { root, cacheDir } = place;
  const dir = path.join(cacheDir, key);
  const temporary = `${dir}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  const entrySource = path.join(root, "cells", "tristim-entry.ts");
  // Before any work: a cache folder that cannot be written means checking against the sources.
  fs.mkdirSync(cacheDir, { recursive: true });
  fs.accessSync(cacheDir, fs.constants.W_OK);
  const emitOptions: CompilerOptions = {
    ...options,
    noEmit: false,
    declaration: true,
    emitDeclarationOnly: true,
    removeComments: true,
    rootDir: root,
    outDir: temporary,
    listEmittedFiles: true,
  };
  const host = ts.createCompilerHost(emitOptions);
  host.jsDocParsingMode = ts.JSDocParsingMode.ParseForTypeErrors;
  // The session's reader: the comment-free Node and lib types, and parsed files shared with the check that follows.
  if (getSourceFile) host.getSourceFile = getSourceFile;
  const program = ts.createProgram({ rootNames: [entrySource], options: emitOptions, host });
  const inside = (f: string) => !path.relative(root, f).startsWith("..") && !/[/\\]node_modules[/\\]/.test(f);
  const own = program.getSourceFiles().filter((s) => inside(path.resolve(s.fileName)));
  const odd = own.find((s) => !/\.ts$/.test(s.fileName) || /\.d\.[cm]?ts$/.test(s.fileName));
  if (odd) throw new Error(`the library holds ${odd.fileName}, which is not emitted as a declaration`);
  try {
    // The last argument (forceDtsEmit, not in the published signature) emits without first type-checking every
    // file (about 3 s instead of 6 s here); the declarations are the same, and the cells are checked against them.
    const emit = program.emit as (...args: unknown[]) => ReturnType<Program["emit"]>;
    const result = emit.call(program, undefined, undefined, undefined, true, undefined, true);
    const errors = result.diagnostics.filter((d) => d.category === ts.DiagnosticCategory.Error);
    if (result.emitSkipped || errors.length > 0)
      throw new Error(
        `declaration emit failed: ${errors.map((d) => ts.flattenDiagnosticMessageText(d.messageText, " ")).join("; ")}`,
      );
    const names = entryExportNames(program, entrySource);
    const files = (result.emittedFiles ?? []).map((f) => path.relative(temporary, f));
    if (!files.includes(path.join("cells", "tristim-entry.d.ts")))
      throw new Error("declaration emit did not write cells/tristim-entry.d.ts");
    fs.writeFileSync(path.join(temporary, MANIFEST), JSON.stringify({ key, names, files }));
    // A folder of this key without a manifest is not ours to trust (left by hand or by a crash): replace it.
    if (fs.existsSync(dir) && !readManifest(dir, root)) fs.rmSync(dir, { recursive: true, force: true });
    try {
      fs.renameSync(temporary, dir);
    } catch {
      // Another check emitted the same declarations at the same time; theirs are identical.
      fs.rmSync(temporary, { recursive: true, force: true });
    }
  } catch (e) {
    fs.rmSync(temporary, { recursive: true, force: true });
    throw e;
  }
  pruneOld(cacheDir, key);
  const written = readManifest(dir, root);
  if (!written) throw new Error(`the declarations in ${dir} are incomplete`);
  return written;
}

/** A key that changes whenever a file in lib/ or cells/, the installed packages or the compiler change. */
export function declarationKey(root: string): string {
  const hash = createHash("sha256");
  hash.update(`${FORMAT}\n${ts.version}\n${root}\n`);
  for (const folder of ["lib", "cells"]) stampTree(path.join(root, folder), hash);
  for (const file of ["package.json", "package-lock.json"]) stampFile(path.join(root, file), hash);
  return hash.digest("hex").slice(0, 20);
}

/** Removes other keys' declarations older than a day (a watch started before a change may still read them). */
function pruneOld(folder: string, keep: string): void {
  const dayAgo = Date.now() - 24 * 3600_000;
  for (const name of fs.readdirSync(folder)) {
    // types-*.json are stripped-types.ts's, pruned there.
    if (name === keep || name.startsWith("types-")) continue;
    const full = path.join(folder, name);
    try {
      if (fs.statSync(full).mtimeMs < dayAgo) fs.rmSync(full, { recursive: true, force: true });
    } catch {
      // already gone
    }
  }
}
