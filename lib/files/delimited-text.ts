/**
 * Lines and cells of delimited measurement text: fields separated by comma, semicolon, tab or runs of spaces, with
 * RFC 4180 quoting (a field in double quotes may hold the separator; a doubled quote stands for one). A quoted field
 * must close on its own line. Spaces around a field are not part of it.
 */
import { DataFileError } from "./data-file-error.ts";

/** A field separator: comma, semicolon, tab, or " " for runs of spaces (and tabs). */
export type FieldSeparator = "," | ";" | "\t" | " ";

export const FIELD_SEPARATORS: readonly FieldSeparator[] = ["\t", ";", ",", " "];

export const SEPARATOR_NAMES: Record<FieldSeparator, string> = {
  ",": "comma",
  ";": "semicolon",
  "\t": "tab",
  " ": "runs of spaces",
};

/** The text's lines without their line ends (CR LF, LF or CR). */
export function splitLines(text: string): string[] {
  return text.split(/\r\n|\n|\r/);
}

/** True for a line that is blank or starts with a comment mark ("#" or "//"). */
export function isCommentOrBlank(line: string): boolean {
  const t = line.trimStart();
  return t === "" || t.startsWith("#") || t.startsWith("//");
}

/** The line without its comment mark and surrounding spaces. */
export function withoutCommentMark(line: string): string {
  const t = line.trim();
  if (t.startsWith("#")) return t.slice(1).trim();
  if (t.startsWith("//")) return t.slice(2).trim();
  return t;
}

/**
 * Finds the cells of a line: their start and end offsets go into `bounds` (2 per cell, reused between lines so
 * that no array is made per line); returns the count, or −1 when a cell is quoted (read those with splitCells).
 */
export function cellBounds(line: string, sep: FieldSeparator, bounds: Int32Array): number {
  const n = line.length;
  let count = 0;
  if (sep === " ") {
    let i = 0;
    for (;;) {
      while (i < n && (line.charCodeAt(i) === 32 || line.charCodeAt(i) === 9)) i++;
      if (i >= n) return count;
      if (line.charCodeAt(i) === 34) return -1;
      const s = i;
      while (i < n && line.charCodeAt(i) !== 32 && line.charCodeAt(i) !== 9) i++;
      if (count * 2 + 1 >= bounds.length) return -2;
      bounds[count * 2] = s;
      bounds[count * 2 + 1] = i;
      count++;
    }
  }
  const code = sep.charCodeAt(0);
  let s = 0;
  for (let i = 0; i <= n; i++) {
    const c = i < n ? line.charCodeAt(i) : code;
    if (c === 34) return -1;
    if (c === code) {
      if (count * 2 + 1 >= bounds.length) return -2;
      bounds[count * 2] = s;
      bounds[count * 2 + 1] = i;
      count++;
      s = i + 1;
    }
  }
  return count;
}

/** The cells of one line as strings, quotes removed (RFC 4180 §2.5–2.7); `lineNumber` is for the error message. */
export function splitCells(line: string, sep: FieldSeparator, lineNumber?: number): string[] {
  const cells: string[] = [];
  const n = line.length;
  const spaces = sep === " ";
  let i = 0;
  for (;;) {
    while (i < n && (line[i] === " " || (line[i] === "\t" && sep !== "\t"))) i++;
    if (spaces && i >= n) return cells;
    let cell: string;
    if (i < n && line[i] === '"') {
      let j = i + 1;
      let text = "";
      for (;;) {
        const q = line.indexOf('"', j);
        if (q < 0)
          throw new DataFileError(
            `a quoted field opened at column ${i + 1} is not closed on this line`,
            lineNumber,
          );
        text += line.slice(j, q);
        if (line[q + 1] === '"') {
          text += '"';
          j = q + 2;
        } else {
          j = q + 1;
          break;
        }
      }
      cell = text;
      i = j;
      while (i < n && (line[i] === " " || (line[i] === "\t" && sep !== "\t"))) i++;
      if (i < n && (spaces ? i === j : line[i] !== sep))
        throw new DataFileError(
          `unexpected text after the quoted field ending at column ${i}; quote the whole field`,
          lineNumber,
        );
    } else {
      let j = i;
      if (spaces) while (j < n && line[j] !== " " && line[j] !== "\t") j++;
      else {
        const k = line.indexOf(sep, i);
        j = k < 0 ? n : k;
      }
      cell = line.slice(i, j).trim();
      i = j;
    }
    cells.push(cell);
    if (i >= n) return cells;
    if (spaces) continue;
    i++; // past the separator
    if (!spaces && i >= n) {
      cells.push("");
      return cells;
    }
  }
}
