/**
 * Re-rendering after a prose-only edit: the last run's records are reused as they are, except that positions in
 * the notebook (error locations, code frames, stack frames) move with the cells, whose lines shift when prose above
 * them grows or shrinks.
 */
import type { ErrorRecord, OutputRecord, StackFrameRecord } from "../../cells/records.ts";
import { codeFrame } from "../text/code-frame.ts";
import { cellLineRange, type NotebookDocument } from "../parse/notebook.ts";
import type { RunRecord } from "./run-record.ts";

/** The record of `run` (made from `before`) adjusted to the edited document `after`, which has the same cells. */
export function moveRecordsToEdit(
  run: RunRecord,
  before: NotebookDocument,
  after: NotebookDocument,
): RunRecord {
  const shift = (line: number): number => {
    for (const cell of before.cells) {
      // From the opening fence to the closing one (the line after the last code line).
      if (line >= cell.fenceLine && line <= cell.lastLine + 1)
        return line + (after.cells[cell.index]!.firstLine - cell.firstLine);
    }
    return line;
  };
  const moveFrame = (f: StackFrameRecord): StackFrameRecord =>
    f.file === before.path ? { ...f, line: shift(f.line) } : f;
  const moveOutput = (o: OutputRecord): OutputRecord => {
    if (o.kind !== "error" || !o.location || o.location.file !== before.path) return o;
    const line = shift(o.location.line);
    const moved: ErrorRecord = {
      ...o,
      location: { ...o.location, line },
      codeFrame: codeFrame(
        after.text,
        line,
        o.location.column > 1 ? o.location.column : undefined,
        2,
        cellLineRange(after, line),
      ),
      ...(o.stack ? { stack: o.stack.map(moveFrame) } : {}),
    };
    return moved;
  };
  return {
    ...run,
    notebook: { path: after.path, sha256: after.sha256 },
    cells: run.cells.map((c) => ({ ...c, outputs: c.outputs.map(moveOutput) })),
  };
}
