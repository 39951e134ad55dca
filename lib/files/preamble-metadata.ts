/**
 * The block of lines an instrument writes above its table (instrument, operator, date, integration time, "%T"):
 * kept as key/value pairs where a line reads "key: value", "key;value", "key=value" or "key<tab>value", otherwise
 * as free lines; comment marks ("#", "//") are removed.
 */
import { withoutCommentMark } from "./delimited-text.ts";
import type { ValueScale } from "./value-scale.ts";

export interface Preamble {
  /** Every non-blank line, comment mark removed, in file order. */
  readonly lines: string[];
  /** The lines that read as key/value pairs (a repeated key keeps its first value). */
  readonly metadata: Record<string, string>;
  /** The lines that are not key/value pairs. */
  readonly notes: string[];
  /** The 1-based line number of each entry of `lines`. */
  readonly lineNumbers: number[];
}

const PAIR = /^([^:;=\t]{1,80}?)\s*[:;=\t]\s*(.*)$/;

function unquote(s: string): string {
  const t = s.trim();
  return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1).replace(/""/g, '"') : t;
}

/** The preamble of lines[from, to), line numbers counted from `firstLineNumber`. */
export function readPreamble(lines: readonly string[], from: number, to: number): Preamble {
  const out: Preamble = { lines: [], metadata: {}, notes: [], lineNumbers: [] };
  for (let i = from; i < to; i++) {
    const t = withoutCommentMark(lines[i]!);
    if (t === "") continue;
    out.lines.push(t);
    out.lineNumbers.push(i + 1);
    const m = PAIR.exec(t);
    const key = m ? unquote(m[1]!) : "";
    const value = m ? unquote(m[2]!.replace(/[;,\t\s]+$/, "")) : "";
    if (m && key !== "" && value !== "" && !/^\d+(?:[.,]\d+)?$/.test(key)) {
      if (!(key in out.metadata)) out.metadata[key] = value;
    } else out.notes.push(t);
  }
  return out;
}

const PERCENT = /%\s*[TR]\b|\b[TR]\s*%|[([]\s*%\s*[)\]]|\bpercent\b|\bin\s*%/i;
const FRACTION = /\bfractions?\b|\b0\s*(?:-|–|to)\s*1\b/i;

/** The scale a file's own text states (e.g. "%T", "in percent"), with the line that says so; undefined if none or both. */
export function statedScale(
  texts: readonly { text: string; line: number }[],
): { scale: ValueScale; line: number; text: string } | undefined {
  let percent: { text: string; line: number } | undefined;
  let fraction: { text: string; line: number } | undefined;
  for (const t of texts) {
    if (!percent && PERCENT.test(t.text)) percent = t;
    if (!fraction && FRACTION.test(t.text)) fraction = t;
  }
  if (percent && !fraction) return { scale: "percent", ...percent };
  if (fraction && !percent) return { scale: "fraction", ...fraction };
  return undefined;
}
