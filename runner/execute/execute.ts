/**
 * Stage 3 of the pipeline: compiled cells → cell runs. Runs the cells in order in a cell process, with a time limit
 * per cell; stops at the first failure (later cells are marked not run) unless told to keep going, in which case a
 * cell process that had to be stopped is replaced by a fresh one (earlier bindings are then gone, and the report
 * says so). Reads the library's method log after the last cell.
 *
 * The state of one execution is an `ExecutionState`, driven by named steps that a test can call one by one:
 * `startProcess` (a cell process when none is alive), `runCell` (one cell to its CellRun), `finish` (the process's
 * last method notes, and an error raised after the cells finished, given to the cell that left code running).
 */
import type { InputValue } from "../../cells/inputs.ts";
import type { RunCellMessage } from "../../cells/protocol.ts";
import type { ErrorRecord, OutputRecord } from "../../cells/records.ts";
import { CellProcess, CellProcessStartError } from "./cell-process.ts";
import type { CompiledCell } from "../compile/compile-cell.ts";
import { cellLevelError, mapError } from "./map-error.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { CellRun, MethodNote } from "../records/run-record.ts";
import type { RuntimeBundle } from "./runtime-bundle.ts";
import { formatTimeLimit } from "../shared/time-limit.ts";
import { describeCells } from "../text/cell-numbers.ts";

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
  /** Hand the cell process on to a later run when it finishes clean (CellProcess.finish). */
  readonly reuseProcess?: boolean;
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
  const state = new ExecutionState(document, compiled, runtime, options);
  if (state.refuseUncompiled()) return state.result();
  for (const cell of document.cells) await state.runCell(cell.index);
  await state.finish();
  return state.result();
}

/** One cell's place in an execution: the outputs it has sent so far, and its run once it finished. */
interface CellSlot {
  readonly outputs: OutputRecord[];
  run?: CellRun;
}

/** The state of one execution of a document's cells, with the steps that advance it. */
export class ExecutionState {
  private readonly slots: CellSlot[];
  private readonly events: string[] = [];
  private readonly methods: MethodNote[] = [];
  private readonly methodKeys = new Set<string>();
  private readonly methodsMissingFrom: number[] = [];
  private process: CellProcess | undefined;
  /** Why later cells do not run (a failure, or a cell process that could not start); unset while they do. */
  private stopped: string | undefined;
  /** The last cell that ran in the current process: an error raised after the cells finished is its. */
  private lastRan: number | undefined;

  constructor(
    private readonly document: NotebookDocument,
    private readonly compiled: readonly (CompiledCell | undefined)[],
    private readonly runtime: RuntimeBundle,
    private readonly options: ExecuteOptions,
  ) {
    this.slots = document.cells.map(() => ({ outputs: [] }));
  }

  /**
   * Step, before any cell runs: a notebook with a cell that does not compile is not run at all (unless told to keep
   * going, or the cell may fail), as a program with a syntax error is not: every such cell is marked failed with
   * its error, so all of them are seen at once, the others not run, and no cell process is needed, so bad input
   * fails at once (issue 16: a notebook with a syntax error fails in under 0.5 s). True when it refused.
   */
  refuseUncompiled(): boolean {
    if (this.options.keepGoing) return false;
    const uncompiled = this.document.cells.filter(
      (cell) => !cell.options.noRun && !cell.options.mayFail && this.compileFailure(cell.index),
    );
    if (uncompiled.length === 0) return false;
    for (const cell of this.document.cells) {
      const failure = uncompiled.includes(cell) ? this.compileFailure(cell.index) : undefined;
      if (failure) this.fail(cell.index, failure);
      else {
        const status = cell.options.noRun ? "listing" : "not-run";
        this.record({ index: cell.index, status, outputs: [], reads: [] });
      }
    }
    const which = describeCells(uncompiled.map((c) => c.index + 1));
    this.events.push(
      `No cell was run: ${which} ${uncompiled.length > 1 ? "do" : "does"} not compile. A notebook runs when all its cells compile (with --keep-going the others run).`,
    );
    return true;
  }

  /** The error of cell `index` when it did not compile (undefined when it did). */
  private compileFailure(index: number): ErrorRecord | undefined {
    const unit = this.compiled[index];
    if (unit?.code && !unit.failure) return undefined;
    return unit?.failure ?? cellLevelError("compile", "the cell could not be compiled", index, this.document);
  }

  /** Step: runs cell `index` (or marks it a listing or not run) and records its CellRun. */
  async runCell(index: number): Promise<void> {
    const cell = this.document.cells[index]!;
    if (cell.options.noRun) return this.record({ index, status: "listing", outputs: [], reads: [] });
    if (this.stopped) return this.record({ index, status: "not-run", outputs: [], reads: [] });
    const failure = this.compileFailure(index);
    if (failure) return this.fail(index, failure);
    const process = await this.startProcess(index);
    if (!process) return;
    const limit = cell.options.timeLimitMs ?? this.options.timeLimitMs;
    const running = process.run(this.runMessage(index), limit, this.options.signal);
    this.sendNextAhead(index, process);
    const outcome = await running;
    this.lastRan = index;
    if (outcome.kind === "time-limit") {
      const how =
        cell.options.timeLimitMs === undefined
          ? `the run's time limit of ${formatTimeLimit(limit)} (raise it with --time-limit, or with time-limit=… on this cell's fence line)`
          : `its time limit of ${formatTimeLimit(limit)} (set by time-limit=… on its fence line)`;
      this.methodsMissingFrom.push(index);
      const message = `cell ${index + 1} did not finish within ${how}; it was stopped`;
      this.fail(index, cellLevelError("time-limit", message, index, this.document), outcome.durationMs);
    } else if (outcome.kind === "out-of-memory") {
      this.methodsMissingFrom.push(index);
      const message = `cell ${index + 1} ran out of memory: a cell process may use up to ${outcome.limitMb} MB of heap; raise the limit by setting TRISTIM_MEMORY_LIMIT_MB (in MB) before the run, or make the cell keep less`;
      this.fail(index, cellLevelError("out-of-memory", message, index, this.document), outcome.durationMs);
    } else if (outcome.kind === "crash") {
      this.methodsMissingFrom.push(index);
      const message = `the cell process ended unexpectedly while cell ${index + 1} ran: ${outcome.detail}`;
      this.fail(index, cellLevelError("crash", message, index, this.document), outcome.durationMs);
    } else if (outcome.error) {
      this.noteMethods(outcome.methods);
      const error = mapError(outcome.error, index, this.document, this.compiled);
      this.fail(index, error, outcome.durationMs, outcome.reads);
    } else {
      this.noteMethods(outcome.methods);
      const { outputs } = this.slots[index]!;
      const writes = outcome.writes.length ? { writes: outcome.writes } : {};
      this.record({
        index,
        status: "ok",
        outputs,
        durationMs: outcome.durationMs,
        reads: outcome.reads,
        ...writes,
      });
    }
  }

  /** The "run" message of a cell that compiled. */
  private runMessage(index: number): RunCellMessage {
    // Only cells that compiled are run, so the cell has its code.
    const unit = this.compiled[index] as CompiledCell & { readonly code: string };
    return {
      type: "run",
      cell: index,
      code: unit.code,
      filename: unit.filename,
      importBundle: unit.importBundle,
    };
  }

  /**
   * While cell `index` runs, sends the next cell that will run to the same process, so it starts as soon as this one
   * ends instead of a round trip later (about 1.5 ms a cell, more after large outputs). When a failure of `index`
   * stops the run, the process is told to skip it in that case. Not past a cell that did not compile (it fails here,
   * without the process).
   */
  private sendNextAhead(index: number, process: CellProcess): void {
    let next = index + 1;
    while (next < this.document.cells.length && this.document.cells[next]!.options.noRun) next++;
    if (next >= this.document.cells.length || this.compileFailure(next)) return;
    const stopsOnFailure = !this.document.cells[index]!.options.mayFail && !this.options.keepGoing;
    process.sendAhead({ ...this.runMessage(next), ...(stopsOnFailure ? { unlessFailed: index } : {}) });
  }

  /**
   * Step: the live cell process for cell `index`, started (or started again, which the report states) when none is
   * alive. On a failure to start, fails the cell, stops the run and gives undefined.
   */
  async startProcess(index: number): Promise<CellProcess | undefined> {
    if (this.process?.alive) return this.process;
    if (this.process) {
      this.events.push(
        `The cell process was started again before cell ${index + 1}; values from the cells before it were lost, so cells that use them may fail.`,
      );
      this.lastRan = undefined;
    }
    try {
      const early = this.process ? undefined : this.options.started;
      const { runtime, document, options } = this;
      this.process = await (early ??
        CellProcess.start(runtime, document.path, options.inputs, options.signal));
      this.process.onOutput = (cell, records) => this.slots[cell]?.outputs.push(...records);
      return this.process;
    } catch (e) {
      if (!(e instanceof CellProcessStartError)) throw e;
      const message = `the cell process could not start: ${e.error.message}`;
      const error = mapError(
        { ...e.error, failure: "startup", message },
        index,
        this.document,
        this.compiled,
      );
      const { outputs } = this.slots[index]!;
      outputs.push(error);
      this.record({ index, status: "failed", outputs, reads: [] });
      this.stopped = "the cell process could not start";
      return undefined;
    }
  }

  /**
   * Step, after the last cell: reads the process's last method notes and an error raised after the cells finished
   * by code a cell left running (a timer, a promise); that error makes its cell failed. Then ends the process.
   */
  async finish(): Promise<void> {
    if (this.process?.alive) {
      const finished = await this.process.finish({ reuse: this.options.reuseProcess === true });
      if (finished) {
        this.noteMethods(finished.methods);
        const late = finished.lateErrorCell ?? this.lastRan;
        const slot = late === undefined ? undefined : this.slots[late];
        if (finished.lateError && late !== undefined && slot?.run) {
          slot.outputs.push(mapError(finished.lateError, late, this.document, this.compiled));
          slot.run = { ...slot.run, status: "failed", outputs: slot.outputs };
        }
      }
    }
    this.process?.kill();
  }

  /** What the execution produced so far (every cell not yet recorded counts as not run). */
  result(): Execution {
    return {
      cells: this.slots.map(
        (slot, index) => slot.run ?? { index, status: "not-run", outputs: [], reads: [] },
      ),
      methods: [...this.methods],
      methodsMissingFrom: [...this.methodsMissingFrom],
      events: [...this.events],
    };
  }

  /** Each cell reports the method log so far; merged in first-use order, so a later crash or restart loses nothing. */
  private noteMethods(notes: readonly MethodNote[]): void {
    for (const { topic, statement } of notes) {
      const key = `${topic}\0${statement}`;
      if (this.methodKeys.has(key)) continue;
      this.methodKeys.add(key);
      this.methods.push({ topic, statement });
    }
  }

  private record(run: CellRun): void {
    this.slots[run.index]!.run = run;
    this.options.onCell?.(run);
  }

  private fail(index: number, error: ErrorRecord, durationMs?: number, reads: readonly string[] = []): void {
    const allowed = this.document.cells[index]!.options.mayFail;
    const { outputs } = this.slots[index]!;
    outputs.push(error);
    this.record({
      index,
      status: "failed",
      outputs,
      durationMs,
      reads,
      ...(allowed ? { failureAllowed: true } : {}),
    });
    if (!allowed && !this.options.keepGoing) this.stopped = `cell ${index + 1} failed`;
  }
}
