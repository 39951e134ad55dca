/**
 * Stage 3 of the pipeline: compiled cells → cell runs. Runs the cells in order in a cell process, with a time limit
 * per cell; stops at the first failure (later cells are marked not run) unless told to keep going, in which case a
 * cell process that had to be stopped is replaced by a fresh one (earlier bindings are then gone, and the report
 * says so). Reads the library's method log after the last cell.
 */
import type { InputValue } from "../../cells/inputs.ts";
import type { ErrorRecord, OutputRecord } from "../../cells/records.ts";
import { CellProcess, CellProcessStartError } from "./cell-process.ts";
import type { CompiledCell } from "../compile/compile-cell.ts";
import { cellLevelError, mapError } from "./map-error.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { CellRun, MethodNote } from "../records/run-record.ts";
import type { RuntimeBundle } from "./runtime-bundle.ts";
import { formatTimeLimit } from "../shared/time-limit.ts";

/** How to execute. */
export interface ExecuteOptions {
  readonly timeLimitMs: number;
  readonly keepGoing: boolean;
  readonly inputs: Readonly<Record<string, InputValue>>;
  readonly signal?: AbortSignal;
  /** Called as each cell finishes (for progress on the terminal). */
  readonly onCell?: (run: CellRun) => void;
  /** A cell process started while the cells were compiled (saves its start-up time); used for the first cell. */
  readonly started?: Promise<CellProcess>;
}

/** What execution produced. */
export interface Execution {
  readonly cells: CellRun[];
  readonly methods: MethodNote[];
  /** Cells whose process was stopped before it could report its method notes (0-based). */
  readonly methodsMissingFrom: number[];
  readonly events: string[];
}

/** Runs the compiled cells of a document. */
export async function executeCells(
  document: NotebookDocument,
  compiled: readonly (CompiledCell | undefined)[],
  runtime: RuntimeBundle,
  options: ExecuteOptions,
): Promise<Execution> {
  const outputs = document.cells.map((): OutputRecord[] => []);
  const runs: (CellRun | undefined)[] = document.cells.map(() => undefined);
  const events: string[] = [];
  const methods: MethodNote[] = [];
  const methodsMissingFrom: number[] = [];
  const methodKeys = new Set<string>();
  // Each cell reports the method log so far; merged in first-use order, so a later crash or restart loses nothing.
  const noteMethods = (notes: readonly MethodNote[]) => {
    for (const m of notes) {
      const key = `${m.topic}\0${m.statement}`;
      if (!methodKeys.has(key))
        (methodKeys.add(key), methods.push({ topic: m.topic, statement: m.statement }));
    }
  };
  const onOutput = (cell: number, records: readonly OutputRecord[]) => outputs[cell]?.push(...records);
  let process: CellProcess | undefined;
  let stopped: string | undefined;
  let lastRan: number | undefined;

  const finishCell = (run: CellRun) => {
    runs[run.index] = run;
    options.onCell?.(run);
  };
  const fail = (index: number, error: ErrorRecord, durationMs?: number, reads: readonly string[] = []) => {
    const allowed = document.cells[index]!.options.mayFail;
    outputs[index]!.push(error);
    finishCell({
      index,
      status: "failed",
      outputs: outputs[index]!,
      durationMs,
      reads,
      ...(allowed ? { failureAllowed: true } : {}),
    });
    if (!allowed && !options.keepGoing) stopped = `cell ${index + 1} failed`;
  };

  for (const cell of document.cells) {
    const index = cell.index;
    if (cell.options.noRun) {
      finishCell({ index, status: "listing", outputs: [], reads: [] });
      continue;
    }
    if (stopped) {
      finishCell({ index, status: "not-run", outputs: [], reads: [] });
      continue;
    }
    const unit = compiled[index];
    if (!unit?.code || unit.failure) {
      fail(
        index,
        unit?.failure ?? cellLevelError("compile", "the cell could not be compiled", index, document),
      );
      continue;
    }
    if (!process?.alive) {
      if (process) {
        events.push(
          `The cell process was started again before cell ${index + 1}; values from the cells before it were lost, so cells that use them may fail.`,
        );
      }
      try {
        const early = process ? undefined : options.started;
        process = await (early ?? CellProcess.start(runtime, document.path, options.inputs, options.signal));
        process.onOutput = onOutput;
      } catch (e) {
        if (!(e instanceof CellProcessStartError)) throw e;
        const error = mapError(
          { ...e.error, failure: "startup", message: `the cell process could not start: ${e.error.message}` },
          index,
          document,
          compiled,
        );
        outputs[index]!.push(error);
        finishCell({ index, status: "failed", outputs: outputs[index]!, reads: [] });
        stopped = "the cell process could not start";
        continue;
      }
    }
    const limit = cell.options.timeLimitMs ?? options.timeLimitMs;
    const outcome = await process.run(
      { type: "run", cell: index, code: unit.code, filename: unit.filename, importBundle: unit.importBundle },
      limit,
      options.signal,
    );
    lastRan = index;
    if (outcome.kind === "time-limit") {
      const how =
        cell.options.timeLimitMs === undefined
          ? `the run's time limit of ${formatTimeLimit(limit)} (raise it with --time-limit, or with time-limit=… on this cell's fence line)`
          : `its time limit of ${formatTimeLimit(limit)} (set by time-limit=… on its fence line)`;
      methodsMissingFrom.push(index);
      fail(
        index,
        cellLevelError(
          "time-limit",
          `cell ${index + 1} did not finish within ${how}; it was stopped`,
          index,
          document,
        ),
        outcome.durationMs,
      );
    } else if (outcome.kind === "crash") {
      methodsMissingFrom.push(index);
      fail(
        index,
        cellLevelError(
          "crash",
          `the cell process ended unexpectedly while cell ${index + 1} ran: ${outcome.detail}`,
          index,
          document,
        ),
        outcome.durationMs,
      );
    } else if (outcome.error) {
      noteMethods(outcome.methods);
      fail(index, mapError(outcome.error, index, document, compiled), outcome.durationMs, outcome.reads);
    } else {
      noteMethods(outcome.methods);
      finishCell({
        index,
        status: "ok",
        outputs: outputs[index]!,
        durationMs: outcome.durationMs,
        reads: outcome.reads,
        ...(outcome.writes.length ? { writes: outcome.writes } : {}),
      });
    }
  }

  if (process?.alive) {
    const finished = await process.finish();
    if (finished) {
      noteMethods(finished.methods);
      const late = finished.lateErrorCell ?? lastRan;
      if (finished.lateError && late !== undefined && runs[late]) {
        // An error raised after the cells finished, by code a cell left running: it belongs to that cell.
        const previous = runs[late]!;
        outputs[late]!.push(mapError(finished.lateError, late, document, compiled));
        runs[late] = { ...previous, status: "failed", outputs: outputs[late]! };
      }
    }
  }
  process?.kill();
  return {
    cells: runs.map((r, i) => r ?? { index: i, status: "not-run", outputs: [], reads: [] }),
    methods,
    methodsMissingFrom,
    events,
  };
}
