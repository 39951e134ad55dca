/**
 * The distinct cautions of a run, in notebook order: each text once (the first place it was shown), with its anchor
 * in the report. The summary, the title block, the in-place rendering and the index page of a batch read these.
 */
import type { CautionRecord } from "../../cells/records.ts";
import type { RunRecord } from "./run-record.ts";

/** A distinct caution and where it first appears. */
export interface CautionResult {
  readonly record: CautionRecord;
  /** 0-based index of the cell that first showed it. */
  readonly cell: number;
  /** The element id of its first box in the report. */
  readonly anchor: string;
}

/** Every distinct caution text of the run, first occurrences in notebook order. */
export function cautionResults(run: RunRecord): CautionResult[] {
  return cautionIndex(run).results;
}

/**
 * The distinct cautions, and for every caution text the anchor of the box that says it in full. A text already said
 * within an earlier caution (the library's standard caution inside a notebook's longer one) is not a new caution:
 * it points to that earlier box.
 */
export function cautionIndex(run: RunRecord): { results: CautionResult[]; anchors: Map<string, string> } {
  const results: CautionResult[] = [];
  const anchors = new Map<string, string>();
  for (const cell of run.cells) {
    for (const o of cell.outputs) {
      if (o.kind !== "caution") continue;
      const key = cautionKey(o);
      if (anchors.has(key)) continue;
      const within = results.find((r) => cautionKey(r.record).includes(key));
      if (within) {
        anchors.set(key, within.anchor);
        continue;
      }
      const result = { record: o, cell: cell.index, anchor: `caution-${results.length + 1}` };
      results.push(result);
      anchors.set(key, result.anchor);
    }
  }
  return { results, anchors };
}

/** What makes two cautions the same: their text (whatever their titles). */
export function cautionKey(record: CautionRecord): string {
  return record.text.trim();
}
