/**
 * Turns an error as the cell process saw it (RawError) into the ErrorRecord the report shows: stack frames mapped to
 * notebook lines (for cell code) or original source files (for bundled imports and the library), the runner's own
 * frames removed, the location and a code frame from the notebook.
 */
import fs from "node:fs";
import { SourceMap } from "node:module";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { RawError } from "../../cells/protocol.ts";
import type { ErrorRecord, StackFrameRecord } from "../../cells/records.ts";
import { notebookPosition } from "../compile/cell-positions.ts";
import { codeFrame } from "../text/code-frame.ts";
import type { CompiledCell } from "../compile/compile-cell.ts";
import { cellLineRange, type NotebookDocument } from "../parse/notebook.ts";
import { PACKAGE_ROOT } from "../shared/package-root.ts";

const FRAME = /^\s*at (?:(.*?) \()?(.+?):(\d+):(\d+)\)?$/;
const CELL_FILE = /^tristim-cell-(\d+)\.js$/;

/** Maps a raw error of cell `cellIndex` to an error record. */
export function mapError(
  raw: RawError,
  cellIndex: number,
  document: NotebookDocument,
  compiled: readonly (CompiledCell | undefined)[],
): ErrorRecord {
  const frames = raw.stack ? parseFrames(raw.stack, document, compiled) : [];
  const cell = document.cells[cellIndex]!;
  const inCell =
    frames.find((f) => f.file === document.path && f.line >= cell.firstLine) ??
    frames.find((f) => f.file === document.path);
  // An error raised in a helper the cell imported (while it loads, or in a callback): the notebook's import line.
  const importLine = inCell || !frames[0] ? undefined : importLineOf(frames[0].file, cell, document);
  const location = inCell ?? importLine ?? frames[0];
  const record: { -readonly [K in keyof ErrorRecord]: ErrorRecord[K] } = {
    kind: "error",
    failure: raw.failure,
    message: withoutRunnerPaths(raw.message, cellIndex, document),
  };
  if (raw.name) record.name = raw.name;
  if (location) {
    record.location = { file: location.file, line: location.line, column: location.column };
    record.codeFrame = frameOf(location.file, location.line, location.column, document);
  } else {
    record.location = { file: document.path, line: cell.fenceLine, column: 1 };
    record.codeFrame = codeFrame(document.text, cell.fenceLine);
  }
  if (frames.length > 0) record.stack = frames;
  return record;
}

/** The runner's own cell-process script, named in Node's messages ("imported from …/runtime/…/worker.mjs"). */
const RUNNER_SCRIPT = /(file:\/\/)?\/\S*?\/runtime\/[0-9a-f]+\/worker\.mjs/g;

/** A message with the runner's temporary paths replaced by the cell that was running (the user's code). */
function withoutRunnerPaths(message: string, cellIndex: number, document: NotebookDocument): string {
  return message.replace(RUNNER_SCRIPT, `cell ${cellIndex + 1} of ${path.basename(document.path)}`);
}

/** The place in `cell` of the import statement (static or dynamic) that names `file`, when there is one. */
function importLineOf(
  file: string,
  cell: NotebookDocument["cells"][number],
  document: NotebookDocument,
): StackFrameRecord | undefined {
  const folder = path.dirname(document.path);
  const stem = (p: string) => p.replace(/\.(m|c)?[jt]sx?$/, "");
  const lines = cell.code.split("\n");
  for (let i = 0; i < lines.length; i++) {
    for (const m of lines[i]!.matchAll(/(?:\bfrom|\bimport)\s*\(?\s*["']([^"']+)["']/g)) {
      const specifier = m[1]!;
      if (!specifier.startsWith(".") && !specifier.startsWith("/")) continue;
      if (stem(path.resolve(folder, specifier)) !== stem(file)) continue;
      const column = (m.index ?? 0) + 1 + cell.columnOffset;
      return { file: document.path, line: cell.firstLine + i, column };
    }
  }
  return undefined;
}

/** An error record for a failure that has no stack (time limit, crash), placed at the cell's fence line. */
export function cellLevelError(
  failure: ErrorRecord["failure"],
  message: string,
  cellIndex: number,
  document: NotebookDocument,
): ErrorRecord {
  const cell = document.cells[cellIndex];
  const line = cell?.fenceLine ?? 1;
  const frame = cell
    ? codeFrame(document.text, cell.firstLine, undefined, 2, cellLineRange(document, cell.firstLine))
    : codeFrame(document.text, line);
  return {
    kind: "error",
    failure,
    message,
    location: { file: document.path, line, column: 1 },
    codeFrame: frame,
  };
}

function parseFrames(
  stack: string,
  document: NotebookDocument,
  compiled: readonly (CompiledCell | undefined)[],
): StackFrameRecord[] {
  const frames: StackFrameRecord[] = [];
  for (const line of stack.split("\n")) {
    const m = FRAME.exec(line);
    if (!m) continue;
    const fn = m[1]?.replace(/^async /, "");
    const file = m[2]!.replace(/^async /, "");
    const lineNo = Number(m[3]);
    const column = Number(m[4]);
    const cell = CELL_FILE.exec(file);
    if (cell) {
      const positions = compiled[Number(cell[1]) - 1]?.positions;
      if (!positions) continue;
      const at = notebookPosition(positions, lineNo, column);
      frames.push(withFunction({ file: document.path, line: at.line, column: at.column }, fn, true));
      continue;
    }
    if (
      file.startsWith("node:") ||
      file === "native" ||
      file.startsWith("internal/") ||
      file.startsWith("evalmachine")
    )
      continue;
    const absolute = file.startsWith("file://") ? fileURLToPath(file) : file;
    const mapped = mapThroughSourceMap(absolute, lineNo, column);
    if (mapped === "internal") continue;
    frames.push(withFunction(mapped ?? { file: absolute, line: lineNo, column }, fn, false));
  }
  return frames;
}

function withFunction(frame: StackFrameRecord, fn: string | undefined, inCell: boolean): StackFrameRecord {
  if (!fn || fn === "<anonymous>" || (inCell && /^(Object\.)?<anonymous>$|^__tristimCell/.test(fn)))
    return frame;
  return { ...frame, function: fn };
}

const maps = new Map<string, SourceMap | null>();

/** Maps a frame in a bundle to its original source; "internal" for the runner's own cells/ code. */
function mapThroughSourceMap(
  file: string,
  line: number,
  column: number,
): StackFrameRecord | "internal" | undefined {
  if (!file.endsWith(".mjs")) return undefined;
  let map = maps.get(file);
  if (map === undefined) {
    try {
      map = new SourceMap(JSON.parse(fs.readFileSync(`${file}.map`, "utf8")));
    } catch {
      map = null;
    }
    maps.set(file, map);
  }
  if (!map) return undefined;
  const entry = map.findEntry(line - 1, column - 1) as {
    originalSource?: string;
    originalLine?: number;
    originalColumn?: number;
  };
  if (!entry.originalSource || entry.originalLine === undefined) return undefined;
  const source = entry.originalSource.startsWith("file://")
    ? fileURLToPath(entry.originalSource)
    : path.resolve(path.dirname(file), entry.originalSource);
  if (source.startsWith(path.join(PACKAGE_ROOT, "cells") + path.sep)) return "internal";
  return { file: source, line: entry.originalLine + 1, column: (entry.originalColumn ?? 0) + 1 };
}

function frameOf(file: string, line: number, column: number, document: NotebookDocument): string | undefined {
  if (file === document.path) return codeFrame(document.text, line, column, 2, cellLineRange(document, line));
  try {
    return codeFrame(fs.readFileSync(file, "utf8"), line, column);
  } catch {
    return undefined;
  }
}
