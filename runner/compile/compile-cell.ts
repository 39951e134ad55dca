/**
 * Stage 2 of the pipeline: CellSource → CompiledCell. esbuild removes the types (each cell on its own, so a syntax
 * error names its own cell and line), hoist-cell.ts makes the declarations shared and the body async, and the
 * cell's imports (npm packages, relative .ts/.js/.json files) are bundled by esbuild with "tristim" kept external
 * and pointed at the one library bundle of the run.
 */
import path from "node:path";
import { pathToFileURL } from "node:url";
import * as esbuild from "esbuild";
import type { ErrorRecord } from "../../cells/records.ts";
import { codeFrame } from "../text/code-frame.ts";
import { BANNER } from "../shared/require-banner.ts";
import { CellRewriteError, hoistCell, type HoistedCell } from "./hoist-cell.ts";
import { cellLineRange, type CellSource, type NotebookDocument } from "../parse/notebook.ts";
import { jsOffsetToCellPosition, type CellPositions } from "./cell-positions.ts";

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
export async function compileCell(cell: CellSource, context: CompileContext): Promise<CompiledCell> {
  const filename = cellFilename(cell.index);
  const { document } = context;
  let js: string;
  let map: string;
  try {
    const result = await esbuild.transform(cell.code, {
      loader: "ts",
      format: "esm",
      target: "node20",
      sourcemap: "external",
      sourcefile: path.basename(document.path),
      logLevel: "silent",
      // Keep every import that is not marked `type`: a later cell may use a name this cell imported but did not use.
      tsconfigRaw: { compilerOptions: { verbatimModuleSyntax: true } },
    });
    js = result.code;
    map = result.map;
  } catch (e) {
    const message = (e as esbuild.TransformFailure).errors?.[0];
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
  const positions: CellPositions = {
    firstLine: cell.firstLine,
    columnOffset: cell.columnOffset,
    js,
    map,
    anchors: hoisted.anchors,
    code: hoisted.code,
  };

  let importBundle: string | undefined;
  let importedFiles: string[] | undefined;
  if (hoisted.imports.length > 0) {
    importBundle = path.join(context.outDir, `cell-${cell.index + 1}-imports.mjs`);
    const entry = hoisted.imports
      .map((imp, i) => `export * as m${i} from ${JSON.stringify(imp.specifier)};`)
      .join("\n");
    try {
      const built = await esbuild.build({
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
      importedFiles = Object.keys(built.metafile?.inputs ?? {})
        .filter(
          (f) =>
            f !== "<stdin>" &&
            !f.includes(IMPORTS_ENTRY) &&
            !/(^|[/\\])node_modules[/\\]/.test(f) &&
            !f.includes(":"),
        )
        .map((f) => path.resolve(f));
    } catch (e) {
      const message = (e as esbuild.BuildFailure).errors?.[0];
      if (!message) throw e;
      const loc = message.location;
      if (loc && path.basename(loc.file) !== IMPORTS_ENTRY && loc.file !== "<stdin>") {
        const file = path.resolve(loc.file);
        return {
          index: cell.index,
          filename,
          sharedNames: [],
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
        index: cell.index,
        filename,
        sharedNames: [],
        failure: compileFailure(text, document, cell.firstLine + at.line - 1, cell.columnOffset + at.column),
      };
    }
  }
  return {
    index: cell.index,
    code: hoisted.code,
    filename,
    importBundle,
    sharedNames: hoisted.sharedNames,
    positions,
    ...(importedFiles?.length ? { importedFiles } : {}),
  };
}

/** Compiles every cell to run, all at once (esbuild works on them in parallel); `no-run` cells give undefined. */
export function compileCells(context: CompileContext): Promise<(CompiledCell | undefined)[]> {
  return Promise.all(
    context.document.cells.map((c) => (c.options.noRun ? undefined : compileCell(c, context))),
  );
}

/** Name of the generated entry file that re-exports a cell's imports (never shown to the user). */
const IMPORTS_ENTRY = "__tristim_cell_imports__.js";

export { BANNER };

/** Resolves "tristim" to the run's library module, kept external so all cells share one instance. */
export function tristimExternal(modulePath: string): esbuild.Plugin {
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
