/**
 * The messages between the runner and the cell process (over Node's IPC channel, as JSON). Plain data only.
 */
import type { InputValue } from "./inputs.ts";
import type { FailureKind, MethodNote, OutputRecord } from "./records.ts";

/** Runner → cell process: set up a run (sent first, and again for each further run of a process handed on). */
export interface InitMessage {
  readonly type: "init";
  readonly notebookPath: string;
  readonly inputs: Readonly<Record<string, InputValue>>;
}

/** Runner → cell process: run one compiled cell. */
export interface RunCellMessage {
  readonly type: "run";
  readonly cell: number;
  /** The cell compiled to a function expression `(async function (__tristimCell) { ... })`, its parameter a CellRuntime. */
  readonly code: string;
  /** File name the cell's stack frames carry, so the runner can map them back to the notebook. */
  readonly filename: string;
  /** Absolute path of the bundle of the cell's imports, if it has any (other than "tristim"). */
  readonly importBundle?: string;
  /**
   * Set when the runner sent this cell ahead, while cell `unlessFailed` still ran (so the harness starts it without
   * waiting for a round trip): the harness skips it, sending nothing, when that cell failed, since the runner stops
   * there.
   */
  readonly unlessFailed?: number;
}

/**
 * Runner → cell process: no more cells; send the method log and end; or, with `reuse`, put the process's state
 * back and stay for another run if it is clean (the answer's `reusable` says which).
 */
export interface FinishMessage {
  readonly type: "finish";
  readonly reuse?: boolean;
}

export type ToCellProcess = InitMessage | RunCellMessage | FinishMessage;

/** A thrown value as the cell process saw it, before the runner maps its stack to the notebook. */
export interface RawError {
  readonly failure: FailureKind;
  readonly name?: string;
  readonly message: string;
  /** The `stack` text of the error, if it was an Error. */
  readonly stack?: string;
}

/** Cell process → runner: the library is loaded and the harness is ready. */
export interface ReadyMessage {
  readonly type: "ready";
}

/** Cell process → runner: records shown by the running cell (sent in batches). */
export interface OutputMessage {
  readonly type: "output";
  readonly cell: number;
  readonly records: readonly OutputRecord[];
}

/** Cell process → runner: a cell finished. */
export interface CellDoneMessage {
  readonly type: "done";
  readonly cell: number;
  readonly durationMs: number;
  readonly error?: RawError;
  /** Absolute paths of the files the cell read. */
  readonly reads: readonly string[];
  /** Absolute paths of the files the cell wrote (absent from older cell processes). */
  readonly writes?: readonly string[];
  /** The method log so far (every condition noted since the run began), so a later crash cannot lose it. */
  readonly methods?: readonly MethodNote[];
}

/** Cell process → runner: the answer to "finish". */
export interface FinishedMessage {
  readonly type: "finished";
  readonly methods: readonly MethodNote[];
  /** An error raised after the last cell finished, by code it left running (timer, unawaited promise). */
  readonly lateError?: RawError;
  /** The cell whose timer or callback raised `lateError` (0-based), when known. */
  readonly lateErrorCell?: number;
  /** True when the process was asked to stay for another run and is clean: it then waits for "init". */
  readonly reusable?: boolean;
}

/** Cell process → runner: the harness itself could not start (e.g. the library threw while loading). */
export interface StartupFailedMessage {
  readonly type: "startup-failed";
  readonly error: RawError;
}

export type FromCellProcess =
  ReadyMessage | OutputMessage | CellDoneMessage | FinishedMessage | StartupFailedMessage;

/** The object a compiled cell receives as its only parameter: the hooks its rewritten code calls. */
export interface CellRuntime {
  /** Makes sure each shared name exists as a writable global before the cell assigns it. */
  declare(names: readonly string[]): void;
  /**
   * Makes each [name, get, set] a global accessor of the cell's own binding, for the cells after it; a binding marked
   * constant (a fourth element 1, for `const`) becomes a read-only value when the cell has finished.
   */
  link(bindings: readonly (readonly [string, () => unknown, (value: unknown) => void, 1?])[]): void;
  /** The namespace of the cell's import number `i` (loaded before the cell runs). */
  imported(i: number): Record<string, unknown>;
  /** The "tristim" module namespace. */
  readonly lib: Record<string, unknown>;
  /**
   * Binds an imported name as a shared global. When the module has no such export, the global throws a clear error
   * when used (so a name that was only used as a type, and erased, costs nothing).
   */
  bindImport(local: string, namespace: Record<string, unknown>, name: string, from: string): void;
  /** `import(...)` inside a cell, resolved against the notebook's folder. */
  dynamicImport(specifier: string): Promise<unknown>;
  /** `import.meta` inside a cell: the notebook's URL, folder and file. */
  readonly meta: { readonly url: string; readonly dirname: string; readonly filename: string };
}
