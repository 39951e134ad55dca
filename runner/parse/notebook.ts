/**
 * The parsed notebook: plain data produced by parse-notebook.ts and read by every later stage.
 */
import type { InputValue } from "../../cells/inputs.ts";

/** The YAML front matter: title block fields and named inputs with their defaults. */
export interface FrontMatter {
  readonly title?: string;
  readonly author?: string;
  readonly date?: string;
  /** Named inputs and their defaults; a run may override them from the command line. */
  readonly inputs: Readonly<Record<string, InputValue>>;
}

/** The words that may follow `ts` on a cell's fence line, as parsed. */
export interface CellOptions {
  /** `hide-source`: the report leaves out the cell's code and shows only its output. */
  readonly hideSource: boolean;
  /** `show-source`: the report shows the code unfolded instead of folded. */
  readonly showSource: boolean;
  /** `no-run`: the code is shown as a listing and not run. */
  readonly noRun: boolean;
  /** `may-fail`: a failure of this cell is shown but does not stop the run or fail it. */
  readonly mayFail: boolean;
  /** `caption="..."`: caption of the cell's first figure or table that has none of its own. */
  readonly caption?: string;
  /** `time-limit=90s`: this cell's time limit in milliseconds (default: the run's). */
  readonly timeLimitMs?: number;
}

/** One TypeScript cell as written in the notebook. */
export interface CellSource {
  /** Position among the notebook's cells, from 0 (the report numbers cells from 1). */
  readonly index: number;
  readonly code: string;
  /** 1-based line of the opening fence. */
  readonly fenceLine: number;
  /** 1-based line of the first line of code (the line after the fence). */
  readonly firstLine: number;
  /** 1-based line of the last line of code (the closing fence is on the line after it). */
  readonly lastLine: number;
  /** Columns before the code on each line in the file (indentation or block-quote markers). */
  readonly columnOffset: number;
  readonly options: CellOptions;
}

/** A notebook after parsing. */
export interface NotebookDocument {
  /** Absolute path of the notebook file. */
  readonly path: string;
  readonly text: string;
  /** SHA-256 of the notebook file's bytes, hex. */
  readonly sha256: string;
  readonly frontMatter: FrontMatter;
  /** The Markdown after the front matter, with the front matter's lines left blank so line numbers still match. */
  readonly body: string;
  readonly cells: readonly CellSource[];
}

/** The first and last code lines of the cell that holds notebook line `line`, if any. */
export function cellLineRange(document: NotebookDocument, line: number): [number, number] | undefined {
  const cell = document.cells.find((c) => line >= c.firstLine && line <= c.lastLine);
  return cell && [cell.firstLine, cell.lastLine];
}
