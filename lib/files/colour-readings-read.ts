/**
 * One reader for tables of colorimetric readings, as CSV, TSV (any separator the spectral reader knows) or CGATS.17
 * text: every record with every field, each typed and with its unit (see reading-fields.ts for the spellings
 * recognised); sample identifiers and names, RGB, CMYK, XYZ, xyY, Lab, LCh and spectral values gathered per record;
 * the preamble (CSV) or keywords (CGATS, one table per data set) kept.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import type { Lab } from "../colorimetry/cielab.ts";
import { noteMethod } from "../methods/method-log.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { cgatsFromText } from "./cgats-read.ts";
import { DataFileError, parseDataFileBytes } from "./data-file-error.ts";
import {
  FIELD_SEPARATORS,
  isCommentOrBlank,
  SEPARATOR_NAMES,
  splitCells,
  splitLines,
  withoutCommentMark,
  type FieldSeparator,
} from "./delimited-text.ts";
import { hasDecimalComma, hasDecimalPoint } from "./number-text.ts";
import { scanNumber } from "./number-scan.ts";
import {
  checkCountOrAuto,
  checkEncodingOfText,
  checkPath,
  checkStringRecord,
  checkTextOrBytes,
} from "./file-arguments.ts";
import { readPreamble } from "./preamble-metadata.ts";
import { READING_GROUPS, recogniseFields, type ReadingField, type ReadingGroup } from "./reading-fields.ts";
import { decodeMeasurementText, TEXT_ENCODINGS, type TextEncoding } from "./text-encoding.ts";

export interface ColourReadingsOptions {
  /** Text encoding of the bytes (default "auto", as for spectral tables). */
  encoding?: TextEncoding | "auto";
  /** "CGATS", "delimited" or "auto" (default: CGATS when the text has a BEGIN_DATA_FORMAT block). */
  format?: "CGATS" | "delimited" | "auto";
  /** Field separator of delimited text (default "auto"). */
  delimiter?: FieldSeparator | "auto";
  /** Decimal mark of delimited text (default "auto"). */
  decimal?: "." | "," | "auto";
  /** The 1-based line of the header row of delimited text (default "auto"). */
  headerLine?: number | "auto";
  /** Units per group where the file does not name them, e.g. { XYZ: "cd/m²" } (default: by convention per group). */
  units?: Partial<Record<ReadingGroup, string>>;
}

const OPTION_NAMES = ["encoding", "format", "delimiter", "decimal", "headerLine", "units"] as const;

/** One record (one line of the table): every field by its name as written, and the recognised groups. */
export interface ColourReading {
  /** The record's line in the file. */
  readonly line: number;
  readonly id?: string;
  readonly name?: string;
  readonly RGB?: { R: number; G: number; B: number };
  readonly CMYK?: { C: number; M: number; Y: number; K: number };
  readonly XYZ?: Tristimulus;
  readonly xyY?: { x: number; y: number; Y?: number };
  readonly Lab?: Lab;
  readonly LCh?: { L: number; C: number; h: number };
  /** Spectral values as written (no scaling), wavelengths ascending in nm. */
  readonly spectral?: { wavelengths: number[]; values: number[] };
  /** Every field, by the name written in the file. */
  readonly values: Readonly<Record<string, number | string>>;
}

export interface ColourReadingTable {
  readonly fields: ReadingField[];
  readonly records: ColourReading[];
  /** CGATS header keywords of this data set; {} for delimited text. */
  readonly keywords: Readonly<Record<string, string>>;
}

export interface ColourReadings {
  readonly format: "CGATS" | "delimited";
  /** One table per data set (a delimited file has one). */
  readonly tables: ColourReadingTable[];
  /** The first table's records and fields. */
  readonly records: ColourReading[];
  readonly fields: ReadingField[];
  /** The preamble's key/value lines (delimited text). */
  readonly metadata: Readonly<Record<string, string>>;
  /** Preamble and comment lines without comment marks (CGATS: "#" comments). */
  readonly comments: readonly string[];
  readonly encoding: TextEncoding | "text";
  readonly inferred: readonly string[];
}

/** The choices of the options, each with "auto" where the reader can decide by itself. */
const CHOICES = {
  encoding: [...TEXT_ENCODINGS, "auto"],
  format: ["CGATS", "delimited", "auto"],
  delimiter: [",", ";", "\t", " ", "auto"],
  decimal: [".", ",", "auto"],
} as const satisfies Partial<Record<keyof ColourReadingsOptions, readonly string[]>>;

/** Checks a readings reader's arguments once, at its entry (the options; for the parser, the text or bytes too). */
function checkReadingsArguments(fn: string, input: unknown, options: unknown, text: boolean): void {
  if (text) checkTextOrBytes(fn, "input", input);
  checkOptions(fn, "options", options, OPTION_NAMES);
  if (options === undefined) return;
  const o = options as Record<string, unknown>;
  for (const [key, choices] of Object.entries(CHOICES))
    checkChoice(fn, `options.${key}`, o[key], choices, { optional: true });
  checkCountOrAuto(fn, "options.headerLine", o.headerLine, 1, "the line number of the header row");
  checkStringRecord(
    fn,
    "options.units",
    o.units,
    `units by group, e.g. { XYZ: "cd/m²" }, with any of ${READING_GROUPS.join(", ")}`,
  );
  if (o.units !== undefined) checkOptions(fn, "options.units", o.units, READING_GROUPS);
  checkEncodingOfText(fn, input, o.encoding);
}

const GROUP_COMPONENTS: Partial<Record<ReadingGroup, string[]>> = {
  RGB: ["R", "G", "B"],
  CMYK: ["C", "M", "Y", "K"],
  XYZ: ["X", "Y", "Z"],
  Lab: ["L", "a", "b"],
  LCh: ["L", "C", "h"],
};

function buildRecord(
  fields: readonly ReadingField[],
  values: (number | string)[],
  line: number,
): ColourReading {
  const byName: Record<string, number | string> = {};
  const groups: Record<string, Record<string, number>> = {};
  let id: string | undefined;
  let name: string | undefined;
  const spectral: [number, number][] = [];
  fields.forEach((f, k) => {
    const v = values[k]!;
    byName[f.name] = v;
    if (f.group === "sample id") id = String(v);
    else if (f.group === "sample name") name = String(v);
    else if (f.group === "spectral") spectral.push([f.wavelength!, v as number]);
    else if (f.group !== "other") (groups[f.group] ??= {})[f.component] = v as number;
  });
  // L* is shared by CIELAB and its polar form (CIE 015:2018 §8.2.2).
  if (groups.LCh && groups.LCh.L === undefined && groups.Lab?.L !== undefined) groups.LCh.L = groups.Lab.L;
  const record: Record<string, unknown> = { line, values: byName };
  if (id !== undefined) record.id = id;
  if (name !== undefined) record.name = name;
  for (const [group, components] of Object.entries(GROUP_COMPONENTS)) {
    const g = groups[group];
    if (g && components.every((c) => c in g)) record[group] = g;
  }
  const xy = groups.xyY;
  if (xy && "x" in xy && "y" in xy)
    record.xyY = {
      x: xy.x,
      y: xy.y,
      ...(xy.Y !== undefined ? { Y: xy.Y } : groups.XYZ?.Y !== undefined ? { Y: groups.XYZ.Y } : {}),
    };
  if (spectral.length > 0) {
    spectral.sort((a, b) => a[0] - b[0]);
    record.spectral = { wavelengths: spectral.map((s) => s[0]), values: spectral.map((s) => s[1]) };
  }
  return record as unknown as ColourReading;
}

function checkUniqueNames(names: readonly string[], line: number | undefined): void {
  const seen = new Set<string>();
  for (const n of names) {
    if (seen.has(n)) throw new DataFileError(`the field "${n}" is named twice in the header`, line);
    seen.add(n);
  }
}

/**
 * Parses a table of colorimetric readings (CSV, TSV or CGATS) from text or bytes: every record with every field,
 * typed and with its unit, header names recognised in their common spellings; metadata and CGATS keywords kept.
 *
 * @param input The file's text, or its bytes (the encoding is then detected).
 * @param options Format, separator, header line and units to take instead of inferring them (default: all inferred).
 * @returns `{ records, fields, metadata, ... }`: one record per sample, with id, name, device values and readings.
 * @source none: a tristim reader; CGATS as in ISO 28178.
 * @example parseColourReadings("id,X,Y,Z\nwhite,95.05,100,108.9\n").records[0]
 */
export function parseColourReadings(
  input: string | Uint8Array,
  options: ColourReadingsOptions = {},
): ColourReadings {
  checkReadingsArguments("parseColourReadings", input, options, true);
  return colourReadings(input, options);
}

/** The reader itself, on arguments checked at the public entry. */
function colourReadings(input: string | Uint8Array, options: ColourReadingsOptions): ColourReadings {
  const encodingOption = options.encoding ?? "auto";
  const formatOption = options.format ?? "auto";
  const sepOption = options.delimiter ?? "auto";
  const decimalOption = options.decimal ?? "auto";
  const headerOption = options.headerLine ?? "auto";
  const units = options.units ?? {};
  const inferred: string[] = [];
  let text: string;
  let encoding: TextEncoding | "text";
  if (typeof input === "string") {
    text = input.replace(/^\uFEFF/, "");
    encoding = "text";
  } else {
    const d = decodeMeasurementText(input, encodingOption);
    text = d.text;
    encoding = d.encoding;
    if (d.inferred) inferred.push(d.inferred);
  }

  const format =
    formatOption !== "auto" ? formatOption : /^\s*BEGIN_DATA_FORMAT\b/m.test(text) ? "CGATS" : "delimited";
  if (formatOption === "auto")
    inferred.push(
      format === "CGATS"
        ? "The file was read as CGATS.17 text (it has a BEGIN_DATA_FORMAT block)."
        : "The file was read as delimited text (it has no CGATS data format block).",
    );
  let result: ColourReadings;
  if (format === "CGATS") {
    const file = cgatsFromText(text);
    const tables = file.tables.map((t) => {
      checkUniqueNames(t.fields, undefined);
      const fields = recogniseFields(t.fields, units);
      fields.forEach((f, k) => {
        if (f.type === "number") return;
        // Identifiers and names stay text, as written.
        void k;
      });
      const records = t.sets.map((set, i) => {
        set.forEach((v, k) => {
          const f = fields[k]!;
          if (f.type === "number" && f.group !== "other" && typeof v !== "number")
            throw new DataFileError(
              `field ${f.name} must be a number, found ${JSON.stringify(v)}`,
              t.setLines[i],
            );
        });
        return buildRecord(
          fields,
          set.map((v, k) => (fields[k]!.type === "text" ? String(v) : v)),
          t.setLines[i]!,
        );
      });
      for (const f of fields)
        if (f.group === "other" && !records.every((r) => typeof r.values[f.name] === "number"))
          (f as { type: string }).type = "text";
      return { fields, records, keywords: t.keywords };
    });
    result = {
      format,
      tables,
      records: tables[0]!.records,
      fields: tables[0]!.fields,
      metadata: {},
      comments: file.comments,
      encoding,
      inferred,
    };
  } else {
    result = readDelimited(text, sepOption, decimalOption, headerOption, units, inferred, encoding);
  }
  const counts = result.tables.map(
    (t) => `${t.records.length} record${t.records.length === 1 ? "" : "s"} × ${t.fields.length} fields`,
  );
  const groups = [...new Set(result.tables.flatMap((t) => t.fields.map((f) => f.group)))].filter(
    (g) => g !== "other",
  );
  noteMethod(
    "data files",
    `A table of colorimetric readings (${format === "CGATS" ? "CGATS.17" : "delimited text"}; ${counts.join("; ")}) was read; recognised fields: ${groups.join(", ") || "none"}.`,
  );
  for (const t of result.tables)
    for (const f of t.fields)
      if (f.unitSource === "option")
        noteMethod(
          "data files",
          `The unit of the ${f.group} readings (${f.unit || "dimensionless"}) was stated by the caller.`,
        );
  for (const s of inferred) noteMethod("data files", s);
  return result;
}

function readDelimited(
  text: string,
  sepOption: FieldSeparator | "auto",
  decimalOption: "." | "," | "auto",
  headerOption: number | "auto",
  units: Partial<Record<ReadingGroup, string>>,
  inferred: string[],
  encoding: TextEncoding | "text",
): ColourReadings {
  const lines = splitLines(text);
  const content: number[] = [];
  lines.forEach((l, i) => {
    if (!isCommentOrBlank(l)) content.push(i);
  });
  let headerIndex = -1;
  let sep: FieldSeparator | undefined;
  const separators = sepOption === "auto" ? FIELD_SEPARATORS : [sepOption];
  const cellsOf = (i: number, s: FieldSeparator) => {
    try {
      return splitCells(lines[i]!, s, i + 1);
    } catch {
      return undefined;
    }
  };
  for (let c = 0; c < content.length && headerIndex < 0; c++) {
    const i = content[c]!;
    if (headerOption !== "auto" && i !== headerOption - 1) continue;
    for (const s of separators) {
      const head = cellsOf(i, s);
      if (!head || head.length < 2) continue;
      const next = content[c + 1] !== undefined ? cellsOf(content[c + 1]!, s) : undefined;
      const recognised = recogniseFields(head).filter((f) => f.group !== "other").length;
      if (headerOption !== "auto" || (next && next.length === head.length && recognised >= 2)) {
        headerIndex = i;
        sep = s;
        break;
      }
    }
  }
  if (headerIndex < 0 || sep === undefined)
    throw new DataFileError(
      headerOption !== "auto"
        ? `line ${headerOption} is not a header row of at least two fields`
        : "no table of readings found: no line names at least two recognised fields (such as X Y Z, L* a* b*, R G B, sample name) and is followed by a row of as many fields",
    );
  if (sepOption === "auto")
    inferred.push(`The field separator (${SEPARATOR_NAMES[sep]}) was inferred from the header line.`);
  const preamble = readPreamble(lines, 0, headerIndex);
  const unmarked = lines.slice(0, headerIndex).filter((l) => !isCommentOrBlank(l)).length;
  if (headerOption === "auto" && unmarked > 0)
    inferred.push(
      `The table's header was taken to be line ${headerIndex + 1}; the ${unmarked === 1 ? "line" : `${unmarked} lines`} above it without a comment mark ${unmarked === 1 ? "was" : "were"} kept as metadata.`,
    );
  const headerCells = splitCells(lines[headerIndex]!, sep, headerIndex + 1);
  let width = headerCells.length;
  if (width > 2 && headerCells[width - 1] === "") width--;
  const names = headerCells.slice(0, width);
  names.forEach((n, k) => {
    if (n === "")
      throw new DataFileError(`header field ${k + 1} is empty; every field needs a name`, headerIndex + 1);
  });
  checkUniqueNames(names, headerIndex + 1);
  const fields = recogniseFields(names, units);
  const comments = [...preamble.lines];
  const rows: { line: number; cells: string[] }[] = [];
  for (let i = headerIndex + 1; i < lines.length; i++) {
    const l = lines[i]!;
    if (isCommentOrBlank(l)) {
      const t = withoutCommentMark(l);
      if (t !== "") comments.push(t);
      continue;
    }
    const cells = splitCells(l, sep, i + 1);
    if (cells.length === width + 1 && cells[width] === "" && width < headerCells.length) cells.pop();
    if (cells.length !== width)
      throw new DataFileError(
        `this record has ${cells.length} fields but the header names ${width}`,
        i + 1,
        undefined,
        { sample: cells[0] },
      );
    rows.push({ line: i + 1, cells });
  }
  if (rows.length === 0) throw new DataFileError("the table has a header but no records", headerIndex + 1);
  let decimal: "." | ",";
  if (decimalOption !== "auto") decimal = decimalOption;
  else if (sep === ",") decimal = ".";
  else {
    let found: "." | "," | undefined;
    outer: for (const r of rows)
      for (let k = 0; k < width; k++) {
        if (fields[k]!.type !== "number") continue;
        if (hasDecimalComma(r.cells[k]!)) {
          found = ",";
          break outer;
        }
        if (hasDecimalPoint(r.cells[k]!)) {
          found = ".";
          break outer;
        }
      }
    decimal = found ?? ".";
    if (found)
      inferred.push(`The decimal mark (${found === "," ? "comma" : "point"}) was inferred from the numbers.`);
  }
  if (decimal === "," && sep === ",")
    throw new DataFileError("a decimal comma cannot be used with comma-separated fields");
  const code = decimal.charCodeAt(0);
  const numbers = rows.map((r) => r.cells.map((c) => scanNumber(c, 0, c.length, code)));
  // Unrecognised columns are numbers when every record holds one there, else text.
  fields.forEach((f, k) => {
    if (f.group === "other" && !numbers.every((n) => !Number.isNaN(n[k]!)))
      (f as { type: string }).type = "text";
  });
  const nameAt = fields.findIndex((f) => f.group === "sample name");
  const idAt = fields.findIndex((f) => f.group === "sample id");
  const records = rows.map((r, i) => {
    const sample = r.cells[nameAt >= 0 ? nameAt : idAt >= 0 ? idAt : 0];
    const values = fields.map((f, k) => {
      if (f.type === "text") return r.cells[k]!;
      const v = numbers[i]![k]!;
      if (Number.isNaN(v)) {
        const cell = r.cells[k]!.trim();
        throw new DataFileError(
          `sample "${sample}", field ${f.name}: ${cell === "" ? "no value (blank)" : `"${cell}" is not a number`}${decimal === "." && hasDecimalComma(cell) ? ' (decimal comma; state decimal: ",")' : ""}`,
          r.line,
          undefined,
          { sample, ...(f.wavelength !== undefined ? { wavelength: f.wavelength } : {}) },
        );
      }
      return v;
    });
    return buildRecord(fields, values, r.line);
  });
  const table = { fields, records, keywords: {} };
  return {
    format: "delimited",
    tables: [table],
    records,
    fields,
    metadata: preamble.metadata,
    comments,
    encoding,
    inferred,
  };
}

/**
 * Reads a table of colorimetric readings from a file (path relative to the notebook's folder), as
 * parseColourReadings does; errors name the file and line.
 *
 * @param path The file's path, relative to the notebook's folder.
 * @param options Format, separator, header line and units to take instead of inferring them (default: all inferred).
 * @returns `{ records, fields, metadata, ... }`: one record per sample, with id, name, device values and readings.
 * @source none: a tristim reader.
 * @example readColourReadings("data/panel-kx0042.csv", { units: { XYZ: "cd/m²" } }).records.length
 */
export function readColourReadings(path: string, options: ColourReadingsOptions = {}): ColourReadings {
  checkPath("readColourReadings", "path", path);
  checkReadingsArguments("readColourReadings", undefined, options, false);
  return parseDataFileBytes(path, (bytes) => colourReadings(bytes, options));
}
