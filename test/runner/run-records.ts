// The one builder of hand-made run records for tests of the renderers (no cell process involved).
import type { OutputRecord } from "../../cells/records.ts";
import type { CellRun, RunRecord } from "../../runner/records/run-record.ts";

/** A run of /lab/nb.md with the given cells (default: none); any field can be replaced through `extra`. */
export function runRecord(cells: readonly CellRun[] = [], extra: Partial<RunRecord> = {}): RunRecord {
  return {
    notebook: { path: "/lab/nb.md", sha256: "ab".repeat(32) },
    tool: { name: "tristim", version: "0.1.0" },
    node: "v20.0.0",
    platform: "linux-x64",
    startedAt: "2024-06-01T10:00:00.000Z",
    durationMs: 1234,
    inputs: {},
    inputsSet: {},
    timeLimitMs: 30_000,
    keepGoing: false,
    cells,
    methods: [],
    filesRead: [],
    events: [],
    signature: "x",
    ...extra,
  };
}

/** A cell that ran without error and showed `outputs`. */
export function okCell(index: number, outputs: OutputRecord[], durationMs = 5): CellRun {
  return { index, status: "ok", outputs, durationMs, reads: [] };
}
