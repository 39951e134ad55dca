/**
 * Stage 3's result: the record of a run. Plain serializable data; the report writer and the watch mode's prose-only
 * re-render read only this (with the parsed notebook), never live objects.
 */
import type { InputValue } from "../../cells/inputs.ts";
import type { MethodNote, OutputRecord } from "../../cells/records.ts";

/** What happened to one cell. */
export type CellStatus =
  | "ok" // ran to the end
  | "failed" // raised an error, ran past its time limit, or could not be compiled
  | "not-run" // skipped because an earlier cell failed
  | "listing"; // marked no-run: shown, never run

/** One cell's run: status, output records in order, duration and the files it read. */
export interface CellRun {
  readonly index: number;
  readonly status: CellStatus;
  readonly outputs: readonly OutputRecord[];
  /** Wall-clock time of the cell in the cell process, in ms (absent for cells that did not run). */
  readonly durationMs?: number;
  /** Absolute paths of files the cell read. */
  readonly reads: readonly string[];
  /** Absolute paths of files the cell wrote (absent when it wrote none). */
  readonly writes?: readonly string[];
  /** The failure was allowed by the cell's may-fail option. */
  readonly failureAllowed?: boolean;
}

/** A file some cell read or imported, with its SHA-256 at the end of the run (for the report's record of inputs). */
export interface FileRead {
  readonly path: string;
  readonly sha256?: string;
  /** 0-based indexes of the cells that read or imported it. */
  readonly cells: readonly number[];
  /** The file was a module bundled for a cell's import (a helper .ts/.js/.json beside the notebook), not read by fs. */
  readonly imported?: boolean;
  /** The file's bytes, base64, when the report carries it (inside the notebook's folder, within the limits of carried-files.ts). */
  readonly content?: string;
  /** Why the report does not carry the file (too large, outside the notebook's folder, not a file). */
  readonly notCarried?: string;
}

/** The place of one run in a batch (`tristim run nb.md --each name=pattern`). */
export interface BatchPlace {
  /** The input bound to each data file. */
  readonly input: string;
  /** The pattern as given on the command line. */
  readonly pattern: string;
  /** 1-based position of this run and the number of runs. */
  readonly position: number;
  readonly count: number;
}

export type { MethodNote } from "../../cells/records.ts";

/** The record of one run of a notebook. */
export interface RunRecord {
  readonly notebook: { readonly path: string; readonly sha256: string };
  readonly tool: { readonly name: string; readonly version: string };
  readonly node: string;
  readonly platform: string;
  /** ISO date and time the run started. */
  readonly startedAt: string;
  /** Wall-clock duration of the whole run (compile, cells, collecting results), in ms. */
  readonly durationMs: number;
  /** Inputs as the cells saw them, and the subset set on the command line. */
  readonly inputs: Readonly<Record<string, InputValue>>;
  readonly inputsSet: Readonly<Record<string, InputValue>>;
  readonly timeLimitMs: number;
  readonly keepGoing: boolean;
  readonly cells: readonly CellRun[];
  readonly methods: readonly MethodNote[];
  /** Cells (0-based) whose process was stopped before it reported its method notes: the Methods may be incomplete. */
  readonly methodsMissingFrom?: readonly number[];
  readonly filesRead: readonly FileRead[];
  /** Files the cells wrote, each with its SHA-256 at the end of the run (absent in records made before it existed). */
  readonly filesWritten?: readonly FileRead[];
  /** Things the reader should know about the run itself (e.g. the cell process was restarted). */
  readonly events: readonly string[];
  /** Identifies what was executed (code, run options, inputs), so watch can tell a prose-only edit. */
  readonly signature: string;
  /** The report leaves out wall-clock values (date, durations) so that two runs give identical bytes. */
  readonly reproducible?: boolean;
  /** Set when the run is one of a batch over data files. */
  readonly batch?: BatchPlace;
}
