/** What the run and watch commands are given: checked options and where to write messages. */
import type { EachOption } from "../batch/batch.ts";

/** Where the command writes its messages (the terminal, or a test's buffers). */
export interface Io {
  readonly out: (text: string) => void;
  readonly err: (text: string) => void;
  /** Raw terminal text for a progress line; only set when the error stream is a terminal. */
  readonly progress?: (text: string) => void;
}

/** Options common to run and watch, after checking. */
export interface CommandOptions {
  readonly output?: string;
  readonly inputs: Readonly<Record<string, string>>;
  readonly timeLimitMs?: number;
  readonly keepGoing: boolean;
  readonly linkAssets: boolean;
  readonly quiet: boolean;
  readonly port: number;
  /** Make reports byte-reproducible (no date, no durations). */
  readonly reproducible: boolean;
  /** Type-check the cells first: run --typecheck (then no run on errors), watch unless --no-typecheck (banner). */
  readonly typecheck?: boolean;
  /** Run once per data file: --each name=pattern. */
  readonly each?: EachOption;
  /** How many runs at the same time, of several notebooks or of --each (--jobs; default the number of cores). */
  readonly jobs?: number;
  /** With --each: run only the index-th of `of` slices of the data files (--shard K/N). */
  readonly shard?: { readonly index: number; readonly of: number };
  /** Files to write the results to (--results): .json for everything, .csv for the checks. */
  readonly results?: readonly string[];
  /** Also print each report to <report>.pdf through headless Chromium (--pdf). */
  readonly pdf?: boolean;
  /** Start a new cell process for every run (--fresh-process), instead of handing a clean one on to the next run. */
  readonly freshProcess?: boolean;
}
