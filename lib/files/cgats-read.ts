/**
 * Reading the CGATS.17 text exchange format (ANSI CGATS.17; its successor ISO 28178): a file identifier line, header
 * keywords with values, a data format block naming the fields (BEGIN_DATA_FORMAT … END_DATA_FORMAT) and a data block
 * with one set per line (BEGIN_DATA … END_DATA); "#" starts a comment; a file may hold several such tables.
 * Declared counts (NUMBER_OF_FIELDS, NUMBER_OF_SETS) are checked; every fault is reported with its line number.
 */
import { noteMethod } from "../methods/method-log.ts";
import { checkString } from "../arguments/check-text.ts";
import { DataFileError, parseDataFileText } from "./data-file-error.ts";
import { checkPath } from "./file-arguments.ts";
import { readNumber } from "./number-text.ts";

export type CgatsValue = string | number;

export interface CgatsTable {
  /** Header keywords and their values as written (quotes removed); KEYWORD declarations are listed in `declared`. */
  readonly keywords: Readonly<Record<string, string>>;
  readonly declared: readonly string[];
  readonly fields: readonly string[];
  /** One array of values per set, in field order: quoted tokens as strings, unquoted numbers as numbers. */
  readonly sets: ReadonlyArray<ReadonlyArray<CgatsValue>>;
  /** The line number of each set, for messages. */
  readonly setLines: readonly number[];
}

export interface CgatsFile {
  /** The first line's identifier, e.g. "CGATS.17". */
  readonly identifier: string;
  readonly tables: readonly CgatsTable[];
  /** Comment text from "#" to the end of each line. */
  readonly comments: readonly string[];
}

interface Token {
  readonly text: string;
  readonly quoted: boolean;
}

function tokenise(line: string, lineNumber: number, comments: string[]): Token[] {
  const tokens: Token[] = [];
  let i = 0;
  while (i < line.length) {
    const c = line[i]!;
    if (c === " " || c === "\t" || c === "\r") {
      i++;
    } else if (c === "#") {
      comments.push(line.slice(i + 1).trim());
      break;
    } else if (c === '"') {
      const end = line.indexOf('"', i + 1);
      if (end < 0)
        throw new DataFileError(
          `a quoted value opened at column ${i + 1} is not closed on this line`,
          lineNumber,
        );
      tokens.push({ text: line.slice(i + 1, end), quoted: true });
      i = end + 1;
    } else {
      let j = i;
      while (j < line.length && !/[\s"#]/.test(line[j]!)) j++;
      tokens.push({ text: line.slice(i, j), quoted: false });
      i = j;
    }
  }
  return tokens;
}

/** Field name prefixes whose values must be numbers (CGATS.17 reserved measurement fields). */
const NUMERIC_FIELD = /^(SPECTRAL_|NM_?\d|XYZ_|XYY_|LAB_|LCH_|CMYK_|CMY_|RGB_|D_|STDEV_)/i;

/**
 * True when a CGATS field of this name must hold numbers (the reserved measurement fields SPECTRAL_, XYZ_, LAB_, …).
 *
 * @param field The field name.
 * @returns true for a numeric field.
 * @source ANSI CGATS.17 (reserved field names).
 * @example isNumericCgatsField("LAB_L")
 */
export function isNumericCgatsField(field: string): boolean {
  checkString("isNumericCgatsField", "field", field, { what: "a CGATS field name (a string)" });
  return NUMERIC_FIELD.test(field);
}

const KEYWORD_NAME = /^[A-Za-z][A-Za-z0-9_.]*$/;

/**
 * Parses CGATS.17 text into its tables; a malformed file gives a DataFileError with the line number.
 *
 * @param text The file's text.
 * @returns { identifier, tables [{ keywords, declared, fields, sets, setLines }], comments }.
 * @source ANSI CGATS.17 (exchange format for colour and process control data).
 * @example parseCgats("CGATS.17\nBEGIN_DATA_FORMAT\nSAMPLE_ID\tXYZ_X\tXYZ_Y\tXYZ_Z\nEND_DATA_FORMAT\nBEGIN_DATA\n1\t41.2\t21.3\t1.9\nEND_DATA\n").tables[0]!.fields
 */
export function parseCgats(text: string): CgatsFile {
  checkString("parseCgats", "text", text, {
    what: "the file's text (a string)",
    instead: { object: "for a file by its path use readCgats(path)" },
  });
  return cgatsFromText(text);
}

/** parseCgats for the readers, whose text is already checked. */
export function cgatsFromText(text: string): CgatsFile {
  const lines = text.replace(/^\uFEFF/, "").split(/\r\n|\n|\r/);
  const comments: string[] = [];
  const tables: CgatsTable[] = [];
  let identifier: string | undefined;
  let state: "header" | "format" | "data" = "header";
  let keywords: Record<string, string> = {};
  let keywordLines: Record<string, number> = {};
  let declared: string[] = [];
  let fields: string[] = [];
  let sets: CgatsValue[][] = [];
  let setLines: number[] = [];
  let openedAt = 0;

  const finishTable = (line: number) => {
    if (fields.length === 0)
      throw new DataFileError(
        "BEGIN_DATA comes before any BEGIN_DATA_FORMAT … END_DATA_FORMAT block naming the fields",
        line,
      );
    const declaredSets = keywords.NUMBER_OF_SETS;
    if (declaredSets !== undefined && Number(declaredSets) !== sets.length) {
      throw new DataFileError(
        `NUMBER_OF_SETS says ${declaredSets} but the data block has ${sets.length} set${sets.length === 1 ? "" : "s"}`,
        keywordLines.NUMBER_OF_SETS,
      );
    }
    tables.push({ keywords, declared, fields, sets, setLines });
    keywords = {};
    keywordLines = {};
    declared = [];
    fields = [];
    sets = [];
    setLines = [];
  };

  for (let i = 0; i < lines.length; i++) {
    const n = i + 1;
    const tokens = tokenise(lines[i]!, n, comments);
    if (tokens.length === 0) continue;
    const first = tokens[0]!;
    if (identifier === undefined) {
      if (first.quoted || tokens.length > 1 || /^(BEGIN_|END_|NUMBER_OF_|KEYWORD$)/.test(first.text)) {
        throw new DataFileError(
          `the first line must be the file identifier (e.g. CGATS.17), found ${JSON.stringify(lines[i]!.trim())}`,
          n,
        );
      }
      identifier = first.text;
      continue;
    }
    if (state === "header") {
      if (first.quoted || !KEYWORD_NAME.test(first.text))
        throw new DataFileError(`expected a keyword, found ${JSON.stringify(first.text)}`, n);
      const word = first.text;
      if (word === "BEGIN_DATA_FORMAT") {
        state = "format";
        openedAt = n;
        fields = [];
        for (const t of tokens.slice(1)) {
          if (t.text === "END_DATA_FORMAT" && !t.quoted) state = "header";
          else fields.push(t.text);
        }
        if (state === "header") checkFieldCount(fields, keywords, keywordLines, n);
        continue;
      }
      if (word === "BEGIN_DATA") {
        if (tokens.length > 1) throw new DataFileError("BEGIN_DATA must stand alone on its line", n);
        if (fields.length === 0)
          throw new DataFileError(
            "BEGIN_DATA comes before any BEGIN_DATA_FORMAT … END_DATA_FORMAT block naming the fields",
            n,
          );
        state = "data";
        openedAt = n;
        continue;
      }
      if (word === "END_DATA" || word === "END_DATA_FORMAT")
        throw new DataFileError(`${word} without a matching BEGIN`, n);
      if (word === "KEYWORD") {
        if (tokens.length !== 2)
          throw new DataFileError('KEYWORD takes one name, e.g. KEYWORD "MY_FIELD"', n);
        declared.push(tokens[1]!.text);
        continue;
      }
      if (tokens.length > 2)
        throw new DataFileError(
          `keyword ${word} has ${tokens.length - 1} values; quote a value that contains spaces`,
          n,
        );
      const value = tokens[1]?.text ?? "";
      if ((word === "NUMBER_OF_FIELDS" || word === "NUMBER_OF_SETS") && !/^\d+$/.test(value)) {
        throw new DataFileError(`${word} must be a whole number, found ${JSON.stringify(value)}`, n);
      }
      keywords[word] = value;
      keywordLines[word] = n;
      continue;
    }
    if (state === "format") {
      for (const t of tokens) {
        if (t.text === "END_DATA_FORMAT" && !t.quoted) {
          state = "header";
          checkFieldCount(fields, keywords, keywordLines, n);
        } else if (state === "header") {
          throw new DataFileError(
            `unexpected ${JSON.stringify(t.text)} after END_DATA_FORMAT on the same line`,
            n,
          );
        } else {
          fields.push(t.text);
        }
      }
      continue;
    }
    // state === "data"
    if (!first.quoted && first.text === "END_DATA") {
      if (tokens.length > 1) throw new DataFileError("END_DATA must stand alone on its line", n);
      finishTable(n);
      state = "header";
      continue;
    }
    if (tokens.length !== fields.length) {
      throw new DataFileError(
        `this set has ${tokens.length} value${tokens.length === 1 ? "" : "s"} but the data format names ${fields.length} fields`,
        n,
      );
    }
    const row: CgatsValue[] = tokens.map((t, k) => {
      const field = fields[k]!;
      if (t.quoted) {
        if (NUMERIC_FIELD.test(field))
          throw new DataFileError(`field ${field} must be a number, found the text "${t.text}"`, n);
        return t.text;
      }
      const v = readNumber(t.text, ".");
      if (v === undefined && NUMERIC_FIELD.test(field)) {
        const hint = /^[+-]?\d*,\d+$/.test(t.text) ? " (CGATS numbers use a decimal point)" : "";
        throw new DataFileError(`field ${field} must be a number, found ${JSON.stringify(t.text)}${hint}`, n);
      }
      return v ?? t.text;
    });
    sets.push(row);
    setLines.push(n);
  }
  if (identifier === undefined) throw new DataFileError("the file is empty");
  if (state === "format")
    throw new DataFileError(
      `BEGIN_DATA_FORMAT on line ${openedAt} is never closed by END_DATA_FORMAT`,
      lines.length,
    );
  if (state === "data")
    throw new DataFileError(`BEGIN_DATA on line ${openedAt} is never closed by END_DATA`, lines.length);
  if (tables.length === 0)
    throw new DataFileError("the file has no data block (BEGIN_DATA … END_DATA)", lines.length);
  if (Object.keys(keywords).length > 0 || fields.length > 0) {
    throw new DataFileError(
      "header lines after the last END_DATA are not followed by a data block",
      lines.length,
    );
  }
  noteMethod(
    "data files",
    `A CGATS.17 file (identifier ${identifier}) with ${tables.length} table${tables.length === 1 ? "" : "s"} (${tables.map((t) => `${t.sets.length} set${t.sets.length === 1 ? "" : "s"} × ${t.fields.length} field${t.fields.length === 1 ? "" : "s"}`).join("; ")}) was read.`,
  );
  return { identifier, tables, comments };
}

function checkFieldCount(
  fields: string[],
  keywords: Record<string, string>,
  lines: Record<string, number>,
  n: number,
): void {
  if (fields.length === 0) throw new DataFileError("the data format block names no fields", n);
  const dup = fields.find((f, i) => fields.indexOf(f) !== i);
  if (dup) throw new DataFileError(`field ${dup} is named twice in the data format`, n);
  const declared = keywords.NUMBER_OF_FIELDS;
  if (declared !== undefined && Number(declared) !== fields.length) {
    throw new DataFileError(
      `NUMBER_OF_FIELDS says ${declared} but the data format names ${fields.length} fields`,
      lines.NUMBER_OF_FIELDS,
    );
  }
}

/**
 * Reads a CGATS.17 file (path relative to the notebook's folder); errors name the file and line.
 *
 * @param path The file's path.
 * @returns The parsed file, as `parseCgats` gives it.
 * @source ANSI CGATS.17.
 * @example readCgats("data/blue-cut-plates.cgats.txt").tables.length
 */
export function readCgats(path: string): CgatsFile {
  checkPath("readCgats", "path", path);
  return readCgatsFile(path);
}

/** readCgats for the readers, whose path is already checked. */
export function readCgatsFile(path: string): CgatsFile {
  return parseDataFileText(path, cgatsFromText);
}
