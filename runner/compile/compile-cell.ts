/**
 * Stage 2 of the pipeline: CellSource → CompiledCell. esbuild removes the types (each cell on its own, so a syntax
 * error names its own cell and line), hoist-cell.ts makes the declarations shared and the body async, and the
 * cell's imports (npm packages, relative .ts/.js/.json files) are bundled by esbuild with "tristim" kept external
 * and pointed at the one library bundle of the run.
 */
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import type * as Esbuild from "esbuild";
import { esbuild } from "../shared/lazy-esbuild.ts";
import type { ErrorRecord } from "../../cells/records.ts";
import { codeFrame } from "../text/code-frame.ts";
import { BANNER } from "../shared/require-banner.ts";
import { CellRewriteError, hoistCell, type HoistedCell } from "./hoist-cell.ts";
import { cellLineRange, type CellSource, type NotebookDocument } from "../parse/notebook.ts";
import { jsOffsetToCellPosition, type CellPositions } from "./cell-positions.ts";
import {
  cachedImports,
  cachedTransform,
  importsBuildFolder,
  importsKey,
  keepImports,
  keepTransform,
  type TransformedCell,
} from "./compile-cache.ts";

/** A cell ready to run, or the reason it cannot run. Plain data. */
export interface CompiledCell {
  readonly index: number;
  /** `(async function (__tristimCell) { ... })` (see RUNTIME_PARAMETER), or absent when compilation failed. */
  readonly code?: string;
  /** File name the cell's stack frames carry. */
  readonly filename: string;
  /** Path of the bundle of the cell's imports, if it has any besides "tristim". */
  readonly importBundle?: string;
  /** Absolute paths of the notebook's own files bundled for the cell's imports (not npm packages), for provenance. */
  readonly importedFiles?: readonly string[];
  /** The modules the cell imports besides "tristim" (as written), when it has any. */
  readonly imports?: readonly string[];
  readonly sharedNames: readonly string[];
  readonly positions?: CellPositions;
  readonly failure?: ErrorRecord;
}

/** What compiling needs to know about the run. */
export interface CompileContext {
  readonly document: NotebookDocument;
  /** Absolute path of the run's "tristim" module (see runtime-bundle.ts). */
  readonly tristimModule: string;
  /** Folder for this run's import bundles. */
  readonly outDir: string;
}

/** The file name used in stack frames of cell `index` (0-based). */
export function cellFilename(index: number): string {
  return `tristim-cell-${index + 1}.js`;
}

/** Compiles one cell; never throws for problems in the cell (they come back as `failure`). */
export async function compileCell(
  cell: CellSource,
  context: CompileContext,
  options: { readonly deferImports?: boolean } = {},
): Promise<CompiledCell> {
  const filename = cellFilename(cell.index);
  const { document } = context;
  const sourcefile = path.basename(document.path);
  const cached = cachedTransform(cell.code, sourcefile);
  if (cached) return compiledFromTransform(cell, cached, context, options);
  let js: string;
  let map: string;
  try {
    const result = await esbuild().transform(cell.code, {
      loader: "ts",
      format: "esm",
      target: "node20",
      sourcemap: "external",
      sourcefile,
      logLevel: "silent",
      // Keep every import that is not marked `type`: a later cell may use a name this cell imported but did not use.
      tsconfigRaw: { compilerOptions: { verbatimModuleSyntax: true } },
    });
    js = result.code;
    map = result.map;
  } catch (e) {
    const message = (e as Esbuild.TransformFailure).errors?.[0];
    if (!message) throw e;
    const loc = message.location;
    const line = loc ? cell.firstLine + loc.line - 1 : cell.fenceLine;
    const column = loc ? cell.columnOffset + loc.column + 1 : undefined;
    return {
      index: cell.index,
      filename,
      sharedNames: [],
      failure: compileFailure(`syntax error: ${message.text}`, document, line, column),
    };
  }

  let hoisted: HoistedCell;
  try {
    hoisted = hoistCell(js);
  } catch (e) {
    const offset = e instanceof CellRewriteError ? e.offset : ((e as { pos?: number }).pos ?? 0);
    const at = jsOffsetToCellPosition(js, map, offset);
    const line = cell.firstLine + at.line - 1;
    const text =
      e instanceof CellRewriteError
        ? e.message
        : `syntax error: ${(e as Error).message.replace(/ \(\d+:\d+\)$/, "")}`;
    return {
      index: cell.index,
      filename,
      sharedNames: [],
      failure: compileFailure(text, document, line, cell.columnOffset + at.column),
    };
  }
  keepTransform(cell.code, sourcefile, { js, map, hoisted });
  return compiledFromTransform(cell, { js, map, hoisted }, context, options);
}

/** The compiled cell from its transform (new or from the cache), with its imports bundled unless deferred. */
async function compiledFromTransform(
  cell: CellSource,
  { js, map, hoisted }: TransformedCell,
  context: CompileContext,
  options: { readonly deferImports?: boolean },
): Promise<CompiledCell> {
  const filename = cellFilename(cell.index);
  const positions: CellPositions = {
    firstLine: cell.firstLine,
    columnOffset: cell.columnOffset,
    js,
    map,
    anchors: hoisted.anchors,
    code: hoisted.code,
  };

  if (hoisted.imports.length > 0 && !options.deferImports) {
    const bundled = await bundleCellImports(cell, hoisted, positions, context);
    if ("failure" in bundled)
      return { index: cell.index, filename, sharedNames: [], failure: bundled.failure };
    return compiledCell(cell, hoisted, positions, bundled);
  }
  return compiledCell(cell, hoisted, positions, {});
}

function compiledCell(
  cell: CellSource,
  hoisted: HoistedCell,
  positions: CellPositions,
  imports: { importBundle?: string; importedFiles?: readonly string[] },
): CompiledCell {
  return {
    index: cell.index,
    code: hoisted.code,
    filename: cellFilename(cell.index),
    importBundle: imports.importBundle,
    sharedNames: hoisted.sharedNames,
    positions,
    ...(imports.importedFiles?.length ? { importedFiles: imports.importedFiles } : {}),
    ...(hoisted.imports.length ? { imports: hoisted.imports.map((i) => i.specifier) } : {}),
  };
}

/** The entry module of a cell's import bundle: re-exports each imported module as m0, m1, … */
function importsEntry(specifiers: readonly string[]): string {
  return specifiers.map((spec, i) => `export * as m${i} from ${JSON.stringify(spec)};`).join("\n");
}

function importBundlePath(cell: CellSource, context: CompileContext): string {
  return path.join(context.outDir, `cell-${cell.index + 1}-imports.mjs`);
}

/** The notebook's own files among esbuild's inputs (not npm packages, not the generated entry). */
function ownFiles(inputs: readonly string[], notebookDir: string): string[] {
  return inputs
    .filter((f) => f !== "<stdin>" && !f.includes(IMPORTS_ENTRY) && !f.includes(":"))
    .map((f) => path.resolve(f))
    .filter((f) => !inInstalledPackage(f, notebookDir));
}

/**
 * True when `file` is inside an installed package: below a node_modules folder, other than one the notebook itself
 * is inside (a notebook kept under node_modules/.cache imports its packages by paths like ../../culori/…, which
 * name no node_modules, so the test is made on absolute paths).
 */
export function inInstalledPackage(file: string, notebookDir: string): boolean {
  const parts = file.split(path.sep);
  for (let i = 0; i < parts.length - 1; i++) {
    if (parts[i] !== "node_modules") continue;
    const packageRoot = parts.slice(0, i + 2).join(path.sep);
    if (!(notebookDir === packageRoot || notebookDir.startsWith(packageRoot + path.sep))) return true;
  }
  return false;
}

/** Bundles one cell's imports on its own; a failure names the cell's import line (or the imported file's). */
async function bundleCellImports(
  cell: CellSource,
  hoisted: HoistedCell,
  positions: CellPositions,
  context: CompileContext,
): Promise<{ importBundle: string; importedFiles: string[] } | { failure: ErrorRecord }> {
  const { document } = context;
  const { js, map } = positions;
  const importBundle = importBundlePath(cell, context);
  const entry = importsEntry(hoisted.imports.map((i) => i.specifier));
  try {
    const built = await esbuild().build({
      stdin: {
        contents: entry,
        resolveDir: path.dirname(document.path),
        sourcefile: IMPORTS_ENTRY,
        loader: "js",
      },
      bundle: true,
      platform: "node",
      format: "esm",
      target: "node20",
      outfile: importBundle,
      sourcemap: "linked",
      logLevel: "silent",
      banner: { js: BANNER },
      plugins: [tristimExternal(context.tristimModule)],
      metafile: true,
    });
    return {
      importBundle,
      importedFiles: ownFiles(Object.keys(built.metafile?.inputs ?? {}), path.dirname(document.path)),
    };
  } catch (e) {
    const message = (e as Esbuild.BuildFailure).errors?.[0];
    if (!message) throw e;
    const loc = message.location;
    if (loc && path.basename(loc.file) !== IMPORTS_ENTRY && loc.file !== "<stdin>") {
      const file = path.resolve(loc.file);
      return {
        failure: {
          kind: "error",
          failure: "compile",
          message: `in a file the cell imports: ${message.text}`,
          location: { file, line: loc.line, column: loc.column + 1 },
          codeFrame: loc.lineText ? `> ${loc.line} | ${loc.lineText}` : undefined,
        },
      };
    }
    const which = loc ? Math.min(loc.line - 1, hoisted.imports.length - 1) : 0;
    const at = jsOffsetToCellPosition(js, map, hoisted.imports[which]!.start);
    const text = message.text.replace(/\s*$/, "") + importHint(message.text);
    return {
      failure: compileFailure(text, document, cell.firstLine + at.line - 1, cell.columnOffset + at.column),
    };
  }
}

/**
 * Bundles the imports of several cells in one esbuild build (one entry and one output per cell, as separate as
 * per-cell builds: no module is shared between cells' bundles). Undefined when the build fails; the caller then
 * bundles cell by cell, which names the failing cell and line.
 */
async function bundleAllImports(
  cells: readonly { cell: CellSource; specifiers: readonly string[] }[],
  context: CompileContext,
): Promise<Map<number, { importBundle: string; importedFiles: string[] }> | undefined> {
  const entries = new Map(cells.map((c) => [`cell-${c.cell.index + 1}-imports`, c]));
  const resolveDir = path.dirname(context.document.path);
  const key = importsKey(
    cells.map((c) => ({ index: c.cell.index, specifiers: c.specifiers })),
    resolveDir,
    context.tristimModule,
  );
  const kept = cachedImports(key);
  if (kept && kept.size === entries.size) return kept;
  const outdir = importsBuildFolder(key);
  let built: Esbuild.BuildResult<{ metafile: true }>;
  try {
    built = await esbuild().build({
      entryPoints: [...entries.keys()].map((name) => ({ in: `${ENTRY_NAMESPACE}:${name}`, out: name })),
      bundle: true,
      platform: "node",
      format: "esm",
      target: "node20",
      outdir,
      outExtension: { ".js": ".mjs" },
      sourcemap: "linked",
      logLevel: "silent",
      banner: { js: BANNER },
      plugins: [
        tristimExternal(context.tristimModule),
        {
          name: "tristim-cell-imports",
          setup(build) {
            build.onResolve({ filter: new RegExp(`^${ENTRY_NAMESPACE}:`) }, (args) => ({
              path: args.path.slice(ENTRY_NAMESPACE.length + 1),
              namespace: ENTRY_NAMESPACE,
            }));
            build.onLoad({ filter: /.*/, namespace: ENTRY_NAMESPACE }, (args) => ({
              contents: importsEntry(entries.get(args.path)!.specifiers),
              resolveDir,
              loader: "js",
            }));
          },
        },
      ],
      metafile: true,
    });
  } catch (e) {
    fs.rmSync(outdir, { recursive: true, force: true });
    if ((e as Esbuild.BuildFailure).errors?.length) return undefined;
    throw e;
  }
  const result = new Map<number, { importBundle: string; importedFiles: string[] }>();
  for (const [output, meta] of Object.entries(built.metafile.outputs)) {
    if (!meta.entryPoint) continue;
    const name = meta.entryPoint.slice(meta.entryPoint.indexOf(":") + 1);
    const entry = entries.get(name);
    if (!entry) continue;
    result.set(entry.cell.index, {
      importBundle: path.resolve(output),
      importedFiles: ownFiles(Object.keys(meta.inputs), resolveDir),
    });
  }
  if (result.size !== entries.size) {
    fs.rmSync(outdir, { recursive: true, force: true });
    return undefined;
  }
  // Every file the bundles were made from (npm packages included), so a changed one makes the kept bundles stale.
  const inputs = Object.keys(built.metafile.inputs)
    .filter((f) => !f.includes(":"))
    .map((f) => path.resolve(f));
  return keepImports(key, outdir, result, inputs);
}

/** esbuild namespace of the generated entries of the one-build import bundles. */
const ENTRY_NAMESPACE = "tristim-cell-imports";

/**
 * Compiles every cell to run, all at once (esbuild works on them in parallel); `no-run` cells give undefined. The
 * imports of all cells are bundled in one esbuild build (one output per cell); if that build fails, the cells with
 * imports are bundled one by one so that the error names its cell.
 */
export async function compileCells(context: CompileContext): Promise<(CompiledCell | undefined)[]> {
  const { cells } = context.document;
  const compiled = await Promise.all(
    cells.map((c) => (c.options.noRun ? undefined : compileCell(c, context, { deferImports: true }))),
  );
  const withImports = compiled.filter(
    (c): c is CompiledCell & { imports: string[] } => !!c?.imports && !c.failure,
  );
  if (withImports.length === 0) return compiled;
  const all = await bundleAllImports(
    withImports.map((c) => ({ cell: cells[c.index]!, specifiers: c.imports })),
    context,
  );
  return Promise.all(
    compiled.map(async (c) => {
      if (!c?.imports || c.failure) return c;
      if (all) return { ...c, ...all.get(c.index)! };
      return compileCell(cells[c.index]!, context);
    }),
  );
}

/** Name of the generated entry file that re-exports a cell's imports (never shown to the user). */
const IMPORTS_ENTRY = "__tristim_cell_imports__.js";

export { BANNER };

/** Resolves "tristim" to the run's library module, kept external so all cells share one instance. */
export function tristimExternal(modulePath: string): Esbuild.Plugin {
  return {
    name: "tristim-external",
    setup(build) {
      build.onResolve({ filter: /^tristim$/ }, () => ({
        path: pathToFileURL(modulePath).href,
        external: true,
      }));
    },
  };
}

function importHint(text: string): string {
  const m = /Could not resolve "([^"]+)"/.exec(text);
  if (!m) return "";
  const spec = m[1]!;
  if (spec.startsWith(".")) return ` (relative imports are resolved from the notebook's folder)`;
  return ` (install it in the notebook's folder or a parent: npm install ${spec
    .split("/")
    .slice(0, spec.startsWith("@") ? 2 : 1)
    .join("/")})`;
}

function compileFailure(
  message: string,
  document: NotebookDocument,
  line: number,
  column: number | undefined,
): ErrorRecord {
  return {
    kind: "error",
    failure: "compile",
    message,
    location: { file: document.path, line, column: column ?? 1 },
    codeFrame: codeFrame(document.text, line, column, 2, cellLineRange(document, line)),
  };
}
