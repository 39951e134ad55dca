/**
 * Maps positions in a compiled cell back to the notebook: hoisted code → the cell's JavaScript (anchors kept by
 * hoist-cell.ts) → the cell's TypeScript (esbuild's source map) → the notebook line and column.
 */
import { SourceMap } from "node:module";
import type { Location } from "../../cells/records.ts";
import { toInputOffset } from "./hoist-cell.ts";

/** What is needed to map a compiled cell's positions (plain data, kept with the compiled cell). */
export interface CellPositions {
  readonly firstLine: number;
  readonly columnOffset: number;
  /** The cell's JavaScript as esbuild produced it, and esbuild's source map of it (JSON). */
  readonly js: string;
  readonly map: string;
  readonly anchors: readonly (readonly [number, number, number])[];
  /** The hoisted code that ran. */
  readonly code: string;
}

/** A 1-based line and column in a file known from the context. */
export type LineColumn = Omit<Location, "file">;

/** Position in the cell's TypeScript (line 1-based, column 1-based) of an offset in its JavaScript. */
export function jsOffsetToCellPosition(js: string, map: string, offset: number): LineColumn {
  const before = js.slice(0, offset).split("\n");
  const jsLine = before.length - 1;
  const jsColumn = before.at(-1)!.length;
  try {
    const entry = new SourceMap(JSON.parse(map)).findEntry(jsLine, jsColumn) as {
      originalLine?: number;
      originalColumn?: number;
    };
    if (typeof entry.originalLine === "number") {
      return { line: entry.originalLine + 1, column: (entry.originalColumn ?? 0) + 1 };
    }
  } catch {
    // fall through to the JavaScript position, which is close for type-free code
  }
  return { line: jsLine + 1, column: jsColumn + 1 };
}

/** Notebook line and column of a 1-based line and column in the hoisted code of a cell (as in a stack frame). */
export function notebookPosition(positions: CellPositions, line: number, column: number): LineColumn {
  const lines = positions.code.split("\n");
  let offset = 0;
  for (let i = 0; i < line - 1 && i < lines.length; i++) offset += lines[i]!.length + 1;
  offset += Math.max(0, column - 1);
  const jsOffset = Math.min(toInputOffset(positions.anchors, offset), positions.js.length);
  const inCell = jsOffsetToCellPosition(positions.js, positions.map, jsOffset);
  return { line: positions.firstLine + inCell.line - 1, column: positions.columnOffset + inCell.column };
}
