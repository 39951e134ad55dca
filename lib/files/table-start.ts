/**
 * Where a delimited table begins below an instrument's preamble, and which separator it uses: the first line that,
 * split by one separator, has at least two cells, the same count as the next content line, and is followed by
 * numbers in the place a spectral table puts them (first cell: wavelengths down the first column; or a header
 * whose last cells are wavelengths: one sample per row). Separators are tried in the order tab, semicolon, comma,
 * runs of spaces.
 */
import { DataFileError } from "./data-file-error.ts";
import { FIELD_SEPARATORS, isCommentOrBlank, splitCells, type FieldSeparator } from "./delimited-text.ts";
import { wavelengthFromHeader } from "./wavelength-text.ts";

const NUMBER_LIKE = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;

/** True when a cell reads as a number with either decimal mark. */
export function looksNumeric(cell: string): boolean {
  return NUMBER_LIKE.test(cell.trim());
}

/** How many of the header's last cells name wavelengths in one direction (ascending or descending). */
export function wavelengthTail(header: readonly string[]): number {
  let count = 0;
  let direction = 0;
  let prev: number | undefined;
  for (let i = header.length - 1; i >= 0; i--) {
    const w = wavelengthFromHeader(header[i]!);
    if (!w) break;
    if (prev !== undefined) {
      const d = Math.sign(prev - w.value);
      if (d === 0 || (direction !== 0 && d !== direction)) break;
      // A cell far below the others (an ID column such as "Lot7" before "380") is not part of the run.
      if (w.value < prev / 10 || w.value > prev * 10) break;
      direction = d;
    }
    prev = w.value;
    count++;
  }
  return count;
}

export interface TableStart {
  /** 0-based index of the header line. */
  readonly headerIndex: number;
  readonly separator: FieldSeparator;
}

function nextContent(lines: readonly string[], from: number): number {
  for (let j = from; j < lines.length; j++) if (!isCommentOrBlank(lines[j]!)) return j;
  return -1;
}

let firstFault: DataFileError | undefined;

function safeSplit(line: string, sep: FieldSeparator, lineNumber?: number): string[] | undefined {
  try {
    return splitCells(line, sep, lineNumber);
  } catch (e) {
    if (lineNumber !== undefined && firstFault === undefined && e instanceof DataFileError) firstFault = e;
    return undefined;
  }
}

/** Finds the header line and separator (either may be stated); see the module comment. */
export function findTableStart(
  lines: readonly string[],
  stated: { separator: FieldSeparator | "auto"; headerLine: number | "auto" },
): TableStart {
  const separators = stated.separator === "auto" ? FIELD_SEPARATORS : [stated.separator];
  if (stated.headerLine !== "auto") {
    const i = stated.headerLine - 1;
    if (i < 0 || i >= lines.length || isCommentOrBlank(lines[i]!))
      throw new DataFileError(
        `headerLine ${stated.headerLine} is not a line of the table's header (the file has ${lines.length} lines; that line is blank, a comment or missing)`,
      );
    if (stated.separator !== "auto") return { headerIndex: i, separator: stated.separator };
    for (const sep of separators) {
      const cells = safeSplit(lines[i]!, sep);
      if (cells && cells.length >= 2) return { headerIndex: i, separator: sep };
    }
    throw new DataFileError(
      "the stated header line has a single column; a spectral table needs at least two (separated by comma, semicolon, tab or spaces)",
      i + 1,
    );
  }
  firstFault = undefined;
  for (let i = nextContent(lines, 0); i >= 0; i = nextContent(lines, i + 1)) {
    const j = nextContent(lines, i + 1);
    if (j < 0) break;
    for (const sep of separators) {
      const head = safeSplit(lines[i]!, sep);
      if (!head || head.length < 2) continue;
      const row = safeSplit(lines[j]!, sep, j + 1);
      if (!row || row.length !== head.length) continue;
      const down = looksNumeric(row[0]!) && !looksNumeric(head[0]!);
      const across = wavelengthTail(head) >= 2 && looksNumeric(row[row.length - 1]!);
      if (down || across) return { headerIndex: i, separator: sep };
    }
  }
  // A quoted field left open under a header is the likelier fault than a missing table.
  if (firstFault) throw firstFault;
  throw new DataFileError(
    "no spectral table found: no line is followed by rows of numbers with the same number of fields (separated by tab, semicolon, comma or spaces); a table needs a header row and at least one data row",
  );
}
