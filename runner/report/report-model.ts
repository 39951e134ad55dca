/**
 * The report model: everything the renderers need to know about places in the report, worked out once from
 * (document, run record) before any HTML is written. Figure and table numbers, the anchor of each check row, and
 * for each caution whether it is said in full or as a reminder are decided here in notebook order, so every
 * renderer is a pure function of its view and the same view always gives the same HTML.
 */
import path from "node:path";
import type { CheckRecord, OutputRecord } from "../../cells/records.ts";
import type { CellSource, NotebookDocument } from "../parse/notebook.ts";
import { cautionIndex, cautionKey } from "../records/caution-results.ts";
import { checkResults } from "../records/check-results.ts";
import type { CellRun, RunRecord } from "../records/run-record.ts";

/** One output record and its place in the report. */
export interface OutputView {
  /** The record as shown (with the fence line's caption given to the cell's first uncaptioned figure or table). */
  readonly record: OutputRecord;
  /** "Figure n" for figures and swatches, "Table n" for tables. */
  readonly number?: number;
  /** The element id of a check's row. */
  readonly anchor?: string;
  /** A caution's box: the anchor of the box that says its text in full, and whether this one only reminds of it. */
  readonly caution?: { readonly anchor: string | undefined; readonly repeat: boolean };
  /** For Markdown a cell showed: which cell ("cell 5"), named where its math cannot be typeset. */
  readonly shownBy?: string;
}

/** One cell as the report shows it. */
export interface CellView {
  readonly cell: CellSource;
  readonly run: CellRun | undefined;
  readonly outputs: readonly OutputView[];
}

/** The report of one run, before HTML. */
export interface ReportModel {
  readonly document: NotebookDocument;
  readonly run: RunRecord;
  /** The notebook's folder; paths in the report are shown relative to it. */
  readonly notebookDir: string;
  /** The cells in notebook order. */
  readonly cells: readonly CellView[];
  /** The cells by the 0-based line of their opening fence in the body (markdown-it's `token.map[0]`). */
  readonly cellsByFence: ReadonlyMap<number, CellView>;
}

/** Builds the model of the report of `run`, a run of `document`. */
export function reportModel(document: NotebookDocument, run: RunRecord): ReportModel {
  const checkAnchors = new Map<CheckRecord, string>(checkResults(run).map((c) => [c.record, c.anchor]));
  const cautionAnchors = cautionIndex(run).anchors;
  const cautionsShown = new Set<string>();
  let figures = 0;
  let tables = 0;
  const place = (record: OutputRecord, cellNumber: number): OutputView => {
    switch (record.kind) {
      case "figure":
      case "swatches":
        return { record, number: ++figures };
      case "table":
        return { record, number: ++tables };
      case "check":
        return { record, anchor: checkAnchors.get(record) };
      case "caution": {
        const key = cautionKey(record);
        const anchor = cautionAnchors.get(key);
        const repeat = cautionsShown.has(anchor ?? key);
        cautionsShown.add(anchor ?? key);
        return { record, caution: { anchor, repeat } };
      }
      case "markdown":
        return { record, shownBy: `cell ${cellNumber}` };
      default:
        return { record };
    }
  };
  const cells = document.cells.map((cell): CellView => {
    const cellRun = run.cells[cell.index];
    const outputs = withCaption(cellRun?.outputs ?? [], cell.options.caption).map((o) =>
      place(o, cell.index + 1),
    );
    return { cell, run: cellRun, outputs };
  });
  return {
    document,
    run,
    notebookDir: path.dirname(document.path),
    cells,
    cellsByFence: new Map(cells.map((view) => [view.cell.fenceLine - 1, view])),
  };
}

/**
 * The fence line's `caption="..."`: it goes to the cell's first figure, table or swatch row that has no caption of
 * its own. When every one has its own caption (a library figure carries one), the fence's caption wins: it comes
 * first and the figure's own caption follows it, so neither is dropped. A fence caption with no figure or table to
 * go to is said in a note under the cell's outputs.
 */
function withCaption(outputs: readonly OutputRecord[], caption: string | undefined): readonly OutputRecord[] {
  if (!caption) return outputs;
  const captioned = (o: OutputRecord) => o.kind === "figure" || o.kind === "table" || o.kind === "swatches";
  let i = outputs.findIndex((o) => captioned(o) && !(o as { caption?: string }).caption);
  const free = i >= 0;
  if (!free) i = outputs.findIndex(captioned);
  if (i < 0) {
    return [
      ...outputs,
      {
        kind: "note",
        text: `The caption on this cell's fence line ("${caption}") has no figure or table to go to.`,
      },
    ];
  }
  return outputs.map((o, j) => {
    if (j !== i) return o;
    const own = (o as { caption?: string }).caption;
    return { ...o, caption: free || !own ? caption : `${withStop(caption)} ${own}` } as OutputRecord;
  });
}

function withStop(text: string): string {
  return /[.!?]$/.test(text.trim()) ? text.trim() : `${text.trim()}.`;
}
