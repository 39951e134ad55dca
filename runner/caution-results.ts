/**
 * The distinct cautions of a run, in notebook order: each text once (the first place it was shown), with its anchor
 * in the report. The summary, the title block, the in-place rendering and the index page of a batch read these.
 */
import type { CautionRecord } from "../cells/records.ts";
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
  const results: CautionResult[] = [];
  const seen = new Set<string>();
  for (const cell of run.cells) {
    for (const o of cell.outputs) {
      if (o.kind !== "caution" || seen.has(cautionKey(o))) continue;
      seen.add(cautionKey(o));
      results.push({ record: o, cell: cell.index, anchor: `caution-${results.length + 1}` });
    }
  }
  return results;
}

/** What makes two cautions the same: their text (whatever their titles). */
export function cautionKey(record: CautionRecord): string {
  return record.text.trim();
}
