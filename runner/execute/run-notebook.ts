/**
 * The pipeline for one notebook: parsed document → compiled cells → executed cells → RunRecord. The report stage
 * (report/render-report.ts) then turns document + record into HTML.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { CellProcess } from "./cell-process.ts";
import { compileCells } from "../compile/compile-cell.ts";
import { executeCells } from "./execute.ts";
import { resolveInputs } from "./inputs.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { BatchPlace, FileRead, RunRecord } from "../records/run-record.ts";
import type { CompiledCell } from "../compile/compile-cell.ts";
import type { OutputRecord } from "../../cells/records.ts";
import { cacheRoot, runtimeBundle, type RuntimeBundle } from "./runtime-bundle.ts";
import type { CellRun } from "../records/run-record.ts";
import { DEFAULT_TIME_LIMIT_MS } from "../shared/time-limit.ts";
import { toolVersion } from "../shared/tool-version.ts";
import {
  CARRIED_FILE_LIMIT,
  CARRIED_TOTAL_LIMIT,
  carryRefusal,
  describeBytes,
} from "../shared/carried-files.ts";

/** Options of a run (all optional). */
export interface RunOptions {
  /** Input overrides as written on the command line (name → text). */
  readonly inputs?: Readonly<Record<string, string>>;
  /** Default time limit of each cell in ms. */
  readonly timeLimitMs?: number;
  /** Run the remaining cells after a failure. */
  readonly keepGoing?: boolean;
  readonly signal?: AbortSignal;
  readonly onCell?: (run: CellRun) => void;
  /** Make the report byte-reproducible: it leaves out the date and durations. */
  readonly reproducible?: boolean;
  /** This run's place in a batch over data files. */
  readonly batch?: BatchPlace;
  /**
   * Another run of a notebook in the same folder follows (watch, a batch): once this run has its cell process, a
   * spare one is started and loads the library while this run goes on (see CellProcess.prepare).
   */
  readonly prepareNext?: boolean;
  /**
   * Hand the cell process on when the run leaves it clean (see CellProcess.finish), so the next run of a notebook
   * in the same folder skips node's start and the library's loading.
   */
  readonly shareProcess?: boolean;
  /** The runtime and compiled cells shared by the runs of a batch (sharedRunParts); the run compiles when absent. */
  readonly shared?: SharedRunParts;
}

/**
 * What every run of one notebook in a batch has in common: the runtime and the compiled cells (compiling depends on
 * the cells alone, not on the inputs), with the folder of the cells' import bundles, kept until `dispose`.
 */
export interface SharedRunParts {
  readonly runtime: RuntimeBundle;
  readonly outDir: string;
  readonly compiled: Promise<(CompiledCell | undefined)[]>;
  dispose(): void;
}

/** Compiles a notebook's cells once for the runs of a batch. */
export async function sharedRunParts(document: NotebookDocument): Promise<SharedRunParts> {
  const runtime = await runtimeBundle();
  const outDir = runFolder();
  const compiled = compileCells({ document, tristimModule: runtime.tristim, outDir });
  compiled.catch(() => undefined);
  return { runtime, outDir, compiled, dispose: () => fs.rmSync(outDir, { recursive: true, force: true }) };
}

/** A new folder for a run's (or a batch's) import bundles, under the cache root. */
function runFolder(): string {
  fs.mkdirSync(path.join(cacheRoot(), "runs"), { recursive: true });
  return fs.mkdtempSync(path.join(cacheRoot(), "runs", `${process.pid}-`));
}

/** Runs every cell of a parsed notebook and returns the record of the run. */
export async function runDocument(document: NotebookDocument, options: RunOptions = {}): Promise<RunRecord> {
  const started = performance.now();
  const startedAt = new Date().toISOString();
  const { inputs, set } = resolveInputs(
    document.frontMatter.inputs,
    options.inputs ?? {},
    path.basename(document.path),
  );
  const timeLimitMs = options.timeLimitMs ?? DEFAULT_TIME_LIMIT_MS;
  const keepGoing = options.keepGoing ?? false;
  const { shared } = options;
  const runtime = shared?.runtime ?? (await runtimeBundle());
  const outDir = shared?.outDir ?? runFolder();
  // Start the cell process (node, library) while esbuild compiles the cells.
  const early = document.cells.some((c) => !c.options.noRun)
    ? CellProcess.start(runtime, document.path, inputs, options.signal)
    : undefined;
  early?.catch(() => undefined);
  if (options.prepareNext) CellProcess.prepare(runtime, path.dirname(document.path));
  try {
    const compiled = await (shared?.compiled ??
      compileCells({ document, tristimModule: runtime.tristim, outDir }));
    const execution = await executeCells(document, compiled, runtime, {
      timeLimitMs,
      keepGoing,
      inputs,
      signal: options.signal,
      onCell: options.onCell,
      started: early,
      reuseProcess: options.shareProcess === true,
    });
    const cells = execution.cells.map((c) => withoutTemporaryPaths(c, outDir));
    return {
      notebook: { path: document.path, sha256: document.sha256 },
      tool: toolVersion(),
      node: process.version,
      platform: `${process.platform}-${process.arch}`,
      startedAt,
      durationMs: performance.now() - started,
      inputs,
      inputsSet: set,
      timeLimitMs,
      keepGoing,
      cells,
      methods: execution.methods,
      ...(execution.methodsMissingFrom.length ? { methodsMissingFrom: execution.methodsMissingFrom } : {}),
      filesRead: filesRead(cells, compiled, path.dirname(document.path)),
      ...(cells.some((c) => c.writes?.length) ? { filesWritten: filesWritten(cells) } : {}),
      events: execution.events,
      signature: runSignature(document, inputs, timeLimitMs, keepGoing),
      ...(options.reproducible ? { reproducible: true } : {}),
      ...(options.batch ? { batch: options.batch } : {}),
    };
  } finally {
    void early?.then(
      (p) => p.kill(),
      () => undefined,
    );
    if (!shared) fs.rmSync(outDir, { recursive: true, force: true });
  }
}

/**
 * What decides the outcome of running a notebook: each cell's code and run options, the inputs and the run options.
 * Two documents with the same signature give the same records (barring changed data files), so an edit that keeps
 * the signature (prose, captions, hide-source) can be re-rendered from the last run's records.
 */
export function runSignature(
  document: NotebookDocument,
  inputs: Readonly<Record<string, unknown>>,
  timeLimitMs: number,
  keepGoing: boolean,
): string {
  const cells = document.cells.map((c) => [
    c.code,
    c.options.noRun,
    c.options.mayFail,
    c.options.timeLimitMs ?? null,
  ]);
  return createHash("sha256")
    .update(JSON.stringify({ cells, inputs, timeLimitMs, keepGoing, path: document.path }))
    .digest("hex");
}

/** True when a cell up to `index` wrote `file`: reading it back then reads an output of the run, not an input. */
function writtenBefore(cells: readonly CellRun[], file: string, index: number): boolean {
  return cells.some((c) => c.index <= index && c.writes?.includes(file));
}

/** The files the cells wrote, each with its SHA-256 at the end of the run and the cells that wrote it. */
function filesWritten(cells: readonly CellRun[]): FileRead[] {
  const byPath = new Map<string, number[]>();
  for (const cell of cells)
    for (const file of cell.writes ?? []) {
      const writers = byPath.get(file) ?? [];
      if (!writers.includes(cell.index)) writers.push(cell.index);
      byPath.set(file, writers);
    }
  return [...byPath.entries()].map(([file, writers]) => {
    try {
      if (!fs.statSync(file).isFile()) return { path: file, cells: writers };
      return {
        path: file,
        sha256: createHash("sha256").update(fs.readFileSync(file)).digest("hex"),
        cells: writers,
      };
    } catch {
      return { path: file, cells: writers };
    }
  });
}

/** The files the cells read or imported, each with its SHA-256 now and the cells that used it. */
function filesRead(
  cells: readonly CellRun[],
  compiled: readonly (CompiledCell | undefined)[],
  notebookDir: string,
): FileRead[] {
  const byPath = new Map<string, { cells: number[]; read: boolean }>();
  const add = (file: string, cell: number, read: boolean) => {
    const entry = byPath.get(file) ?? { cells: [], read: false };
    if (!entry.cells.includes(cell)) entry.cells.push(cell);
    entry.read ||= read;
    byPath.set(file, entry);
  };
  for (const cell of cells) {
    for (const file of compiled[cell.index]?.importedFiles ?? [])
      if (cell.status !== "listing") add(file, cell.index, false);
    for (const file of cell.reads) if (!writtenBefore(cells, file, cell.index)) add(file, cell.index, true);
  }
  let carried = 0;
  return [...byPath.entries()].map(([file, { cells: readers, read }]): FileRead => {
    const imported = read ? {} : { imported: true as const };
    try {
      const stat = fs.statSync(file);
      if (!stat.isFile()) return { path: file, cells: readers, ...imported, notCarried: "not a file" };
      const bytes = fs.readFileSync(file);
      // The report carries the file so that it can be run again from the report alone (carried-files.ts).
      let notCarried = carryRefusal(file, notebookDir);
      if (!notCarried && bytes.length > CARRIED_FILE_LIMIT)
        notCarried = `larger than ${describeBytes(CARRIED_FILE_LIMIT)}`;
      if (!notCarried && carried + bytes.length > CARRIED_TOTAL_LIMIT)
        notCarried = `the carried files reached ${describeBytes(CARRIED_TOTAL_LIMIT)}`;
      if (!notCarried) carried += bytes.length;
      return {
        path: file,
        sha256: createHash("sha256").update(bytes).digest("hex"),
        cells: readers,
        ...imported,
        ...(notCarried ? { notCarried } : { content: bytes.toString("base64") }),
      };
    } catch {
      return { path: file, cells: readers, ...imported, notCarried: "not readable after the run" };
    }
  });
}

/**
 * A cell's records with the run's temporary folder (import bundles, removed after the run) replaced by a plain
 * placeholder: the path means nothing after the run and would make two runs' reports differ.
 */
function withoutTemporaryPaths(cell: CellRun, outDir: string): CellRun {
  if (!cell.outputs.some((o) => o.kind === "error" && JSON.stringify(o).includes(outDir))) return cell;
  const scrub = (text: string) => text.split(outDir).join("<run folder>");
  const outputs = cell.outputs.map((o): OutputRecord => {
    if (o.kind !== "error") return o;
    return {
      ...o,
      message: scrub(o.message),
      ...(o.location ? { location: { ...o.location, file: scrub(o.location.file) } } : {}),
      ...(o.stack ? { stack: o.stack.map((f) => ({ ...f, file: scrub(f.file) })) } : {}),
    };
  });
  return { ...cell, outputs };
}
