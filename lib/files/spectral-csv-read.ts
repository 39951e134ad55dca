/**
 * Reading spectral tables as instruments export them, with nothing stated but the quantity: a preamble of metadata
 * lines, then a header and rows, either with wavelengths down the first column (one column per sample) or across
 * the header row (one sample per row, text columns before the wavelengths kept as the sample's attributes), in
 * ascending or descending order, in nm or µm, separated by comma, semicolon, tab or spaces, with a decimal point or
 * comma, in UTF-8, UTF-16 (with byte-order mark) or Windows-1252. Every decision not stated by the caller is
 * reported in the result and in the Methods log, and each can be stated as an option instead. A table with a
 * fault is refused whole, with the file, line, sample and wavelength of the fault.
 */
import { noteMethod } from "../methods/method-log.ts";
import { roundWavelength, spectrum, type SpectralQuantity, type Spectrum } from "../spectrum/spectrum.ts";
import { checkChoice, checkString } from "../arguments/check-text.ts";
import { DataFileError, parseDataFileBytes } from "./data-file-error.ts";
import {
  cellBounds,
  isCommentOrBlank,
  SEPARATOR_NAMES,
  splitCells,
  splitLines,
  withoutCommentMark,
  type FieldSeparator,
} from "./delimited-text.ts";
import { hasDecimalComma, hasDecimalPoint } from "./number-text.ts";
import { scanNumber, scanNumberRow } from "./number-scan.ts";
import {
  checkCountOrAuto,
  checkEncodingOfText,
  checkPath,
  checkQuantityOptions,
  checkTextOrBytes,
} from "./file-arguments.ts";
import { readPreamble, statedScale } from "./preamble-metadata.ts";
import { findTableStart, looksNumeric, wavelengthTail } from "./table-start.ts";
import { decodeMeasurementText, TEXT_ENCODINGS, type TextEncoding } from "./text-encoding.ts";
import { scaleDecision, type ValueScale } from "./value-scale.ts";
import {
  unitFromHeading,
  unitFromValues,
  wavelengthFromHeader,
  type WavelengthUnit,
} from "./wavelength-text.ts";

/** The separators the writer writes (the reader also reads runs of spaces). */
export type CsvDelimiter = "," | ";" | "\t";

/** Where the wavelengths stand: down the first column, or across the header row (one sample per row). */
export type WavelengthPlacement = "first column" | "header row";

export interface SpectralTableOptions {
  /** What the values are; required, so that a file is never silently taken for reflectance. */
  quantity: SpectralQuantity;
  /** Text encoding of the file's bytes (default "auto": byte-order mark, else UTF-8 if valid, else Windows-1252). */
  encoding?: TextEncoding | "auto";
  /** Field separator; "auto" (default) finds it with the header line. " " means runs of spaces. */
  delimiter?: FieldSeparator | "auto";
  /** Decimal mark; "auto" (default) decides from the numbers. A comma needs ";", tab or space separators. */
  decimal?: "." | "," | "auto";
  /** The 1-based line number of the header row; "auto" (default) takes the first line a table follows. */
  headerLine?: number | "auto";
  /** Where the wavelengths stand; "auto" (default) decides from the header and first row. */
  wavelengthsIn?: WavelengthPlacement | "auto";
  /** With wavelengths in the header row: how many text columns come before them (default "auto": those that are not wavelengths). */
  attributeColumns?: number | "auto";
  /** Unit of the wavelengths; "auto" (default) from the heading, else from the values' size. Always returned in nm. */
  wavelengthUnit?: WavelengthUnit | "auto";
  /** Order of the wavelengths in the file; "auto" (default) accepts either. The spectra are always ascending. */
  order?: "ascending" | "descending" | "auto";
  /** An uneven wavelength grid (a missing row) is refused unless "accept" is stated. */
  unevenGrid?: "refuse" | "accept";
  /**
   * For reflectance and transmittance: "percent", "fraction", or "auto" (default: from the file's own text, e.g.
   * "%T", else from the values). Other quantities are kept as written unless "percent" is stated.
   */
  scale?: ValueScale | "auto";
  /** Unit of the values for non-ratio quantities, e.g. "W/(sr·m²·nm)" (default: none stated; ratios are dimensionless). */
  unit?: string;
}

/** The former name of the options, kept for existing notebooks. */
export type SpectraCsvReadOptions = SpectralTableOptions;

const OPTION_NAMES = [
  "quantity",
  "encoding",
  "delimiter",
  "decimal",
  "headerLine",
  "wavelengthsIn",
  "attributeColumns",
  "wavelengthUnit",
  "order",
  "unevenGrid",
  "scale",
  "unit",
] as const satisfies readonly (keyof SpectralTableOptions)[];

export interface SpectralTableResult {
  /** The spectra, wavelengths ascending in nm, ratio quantities as fractions. */
  readonly spectra: Spectrum[];
  /** Per sample, the text columns before the wavelengths (header row layout); empty objects otherwise. */
  readonly attributes: Readonly<Record<string, string>>[];
  /** The heading of the wavelength column as written ("" when the wavelengths stand in the header row). */
  readonly wavelengthHeader: string;
  readonly wavelengthsIn: WavelengthPlacement;
  readonly wavelengthUnit: WavelengthUnit;
  /** The order of the wavelengths in the file. */
  readonly order: "ascending" | "descending";
  /** The grid step in nm, or undefined when the grid is uneven (only with unevenGrid: "accept"). */
  readonly step: number | undefined;
  /** The encoding the bytes were read in, or "text" when text was given. */
  readonly encoding: TextEncoding | "text";
  /** The 1-based line number of the header row. */
  readonly headerLine: number;
  readonly delimiter: FieldSeparator;
  readonly decimal: "." | ",";
  /** The scale the values were read in ("as written" when no percent/fraction conversion applied). */
  readonly scale: ValueScale | "as written";
  /** Sentences saying what was inferred rather than stated. */
  readonly inferred: readonly string[];
  /** Every line before the header and every comment line, without comment marks, in file order. */
  readonly comments: readonly string[];
  /** The preamble's key/value lines. */
  readonly metadata: Readonly<Record<string, string>>;
  /** The preamble's other lines. */
  readonly notes: readonly string[];
}

/** The former name of the result, kept for existing notebooks. */
export type SpectraCsvResult = SpectralTableResult;

/** The choices of the options, each with "auto" where the reader can decide by itself. */
const CHOICES = {
  encoding: [...TEXT_ENCODINGS, "auto"],
  delimiter: [",", ";", "\t", " ", "auto"],
  decimal: [".", ",", "auto"],
  wavelengthsIn: ["first column", "header row", "auto"],
  wavelengthUnit: ["nm", "µm", "auto"],
  order: ["ascending", "descending", "auto"],
  unevenGrid: ["refuse", "accept"],
  scale: ["percent", "fraction", "auto"],
} as const satisfies Partial<Record<keyof SpectralTableOptions, readonly string[]>>;

/**
 * Checks a spectral table reader's arguments once, at its entry: the options (quantity stated, every option known
 * and one of its values) and, for the parsers, the text or bytes (an encoding applies only to bytes).
 */
function checkTableArguments(fn: string, input: unknown, options: unknown, text: boolean): void {
  if (text) checkTextOrBytes(fn, "input", input);
  checkQuantityOptions(fn, options, OPTION_NAMES, "the columns");
  const o = options as Record<string, unknown>;
  for (const [key, choices] of Object.entries(CHOICES))
    checkChoice(fn, `options.${key}`, o[key], choices, { optional: true });
  checkCountOrAuto(fn, "options.headerLine", o.headerLine, 1, "the line number of the header row");
  checkCountOrAuto(fn, "options.attributeColumns", o.attributeColumns, 0, "a number of columns");
  checkString(fn, "options.unit", o.unit, {
    optional: true,
    what: 'a unit of the values, e.g. "W/(sr·m²·nm)"',
  });
  checkEncodingOfText(fn, input, o.encoding);
}

function fail(message: string, line?: number, sample?: string, wavelength?: number): never {
  throw new DataFileError(message, line, undefined, { sample, wavelength });
}

const nm = (w: number) => `${w} nm`;

/**
 * Reads a spectral table from its text or its bytes, as instruments export it: a preamble, wavelengths down the first
 * column or across the header, either order, any common encoding, separator and decimal mark; every decision is
 * stated in `inferred` and in Methods. Throws a DataFileError naming the line, sample and wavelength of the first
 * fault; nothing is returned from a faulty table.
 *
 * @param input The file's text, or its bytes (the encoding is then detected).
 * @param options What the columns hold (`quantity`, required) and any decision to take instead of inferring it.
 * @returns `{ spectra, metadata, notes, comments, inferred, ... }`: the samples on ascending wavelengths in nm.
 * @source none: a tristim reader; CGATS and CSV as in ISO 28178 and RFC 4180 where they apply.
 * @example parseSpectralTable("nm,filter A\n400,0.5\n410,0.52\n420,0.55\n", { quantity: "transmittance" }).spectra[0]
 */
export function parseSpectralTable(
  input: string | Uint8Array,
  options: SpectralTableOptions,
): SpectralTableResult {
  checkTableArguments("parseSpectralTable", input, options, true);
  return spectralTable(input, options);
}

/** The reader itself, on arguments checked at the public entry. */
function spectralTable(input: string | Uint8Array, options: SpectralTableOptions): SpectralTableResult {
  const inferred: string[] = [];
  const encodingOption = options.encoding ?? "auto";
  const separatorOption = options.delimiter ?? "auto";
  const decimalOption = options.decimal ?? "auto";
  const placementOption = options.wavelengthsIn ?? "auto";
  const unitOption = options.wavelengthUnit ?? "auto";
  const orderOption = options.order ?? "auto";
  const scaleOption = options.scale ?? "auto";
  const headerOption = options.headerLine ?? "auto";
  const attributeOption = options.attributeColumns ?? "auto";

  // Text.
  let text: string;
  let encoding: TextEncoding | "text";
  if (typeof input === "string") {
    text = input.charCodeAt(0) === 0xfeff ? input.slice(1) : input;
    encoding = "text";
  } else {
    const d = decodeMeasurementText(input, encodingOption);
    text = d.text;
    encoding = d.encoding;
    if (d.inferred) inferred.push(d.inferred);
  }
  const lines = splitLines(text);

  // Header and separator.
  const start = findTableStart(lines, { separator: separatorOption, headerLine: headerOption });
  const sep = start.separator;
  const headerNumber = start.headerIndex + 1;
  if (separatorOption === "auto")
    inferred.push(
      `The field separator (${SEPARATOR_NAMES[sep]}) was inferred from the header line (state delimiter to override).`,
    );
  const preamble = readPreamble(lines, 0, start.headerIndex);
  // Lines with a comment mark are comments by convention; lines without one are metadata only by inference.
  const unmarked = lines.slice(0, start.headerIndex).filter((l) => !isCommentOrBlank(l)).length;
  if (headerOption === "auto" && unmarked > 0)
    inferred.push(
      `The table's header was taken to be line ${headerNumber}; the ${unmarked === 1 ? "line" : `${unmarked} lines`} above it without a comment mark ${unmarked === 1 ? "was" : "were"} kept as metadata (state headerLine to override).`,
    );
  const header = splitCells(lines[start.headerIndex]!, sep, headerNumber);
  const comments = [...preamble.lines];

  // Data lines (blank and comment lines after the header are skipped; comments kept).
  const dataIndex: number[] = [];
  for (let i = start.headerIndex + 1; i < lines.length; i++) {
    const line = lines[i]!;
    const c = line.charCodeAt(0);
    if (line.length === 0) continue;
    if (c === 32 || c === 9 || c === 35 || c === 47) {
      if (isCommentOrBlank(line)) {
        const t = withoutCommentMark(line);
        if (t !== "") comments.push(t);
        continue;
      }
    }
    dataIndex.push(i);
  }
  if (dataIndex.length === 0) fail("the file has a header but no data rows", headerNumber);
  const firstRow = splitCells(lines[dataIndex[0]!]!, sep, dataIndex[0]! + 1);

  // Layout.
  let placement: WavelengthPlacement;
  if (placementOption !== "auto") placement = placementOption;
  else {
    const downLike = looksNumeric(firstRow[0] ?? "") && !looksNumeric(header[0] ?? "");
    const acrossLike = wavelengthTail(header) >= 2;
    // Both readings fit when the sample names look like numbers: one sample per row only if the first heading names
    // samples (ID, name …) rather than wavelengths.
    const first = header[0] ?? "";
    const namesSamples =
      /\b(id|name|sample|patch|label|specimen|index)\b|^(no\.?|nr|#)$/i.test(first) &&
      unitFromHeading(first) === undefined;
    placement =
      downLike && (!acrossLike || !namesSamples)
        ? "first column"
        : acrossLike
          ? "header row"
          : "first column";
    inferred.push(
      placement === "first column"
        ? "The wavelengths were found down the first column, one column per sample (state wavelengthsIn to override)."
        : "The wavelengths were found across the header row, one sample per row (state wavelengthsIn to override).",
    );
  }

  // Decimal mark.
  let decimal: "." | ",";
  if (decimalOption !== "auto") decimal = decimalOption;
  else if (sep === ",") {
    decimal = ".";
    inferred.push("The decimal mark was taken to be a point, as the fields are separated by commas.");
  } else {
    let found: "." | "," | undefined;
    for (let k = 0; k < dataIndex.length && found === undefined; k++) {
      const line = lines[dataIndex[k]!]!;
      if (!/\d[.,]\d/.test(line)) continue;
      const cells = splitCells(line, sep, dataIndex[k]! + 1);
      for (const cell of cells)
        if (hasDecimalComma(cell)) {
          found = ",";
          break;
        } else if (hasDecimalPoint(cell)) {
          found = ".";
          break;
        }
    }
    decimal = found ?? ".";
    inferred.push(
      found === ","
        ? "The decimal mark (comma) was inferred from the numbers (state decimal to override)."
        : found === "."
          ? "The decimal mark (point) was inferred from the numbers (state decimal to override)."
          : "No decimal mark was needed (all numbers are whole).",
    );
  }
  if (decimal === "," && sep === ",")
    fail(
      "a decimal comma cannot be used with comma-separated fields; the file must use semicolons, tabs or spaces",
    );
  const decimalCode = decimal.charCodeAt(0);

  const table =
    placement === "first column"
      ? readWavelengthsDown(lines, dataIndex, header, headerNumber, sep, decimal, decimalCode)
      : readWavelengthsAcross(
          lines,
          dataIndex,
          header,
          headerNumber,
          sep,
          decimal,
          decimalCode,
          attributeOption,
          inferred,
        );

  // Unit.
  let unit: WavelengthUnit;
  const raw = table.wavelengths;
  let min = Infinity;
  let max = -Infinity;
  for (const w of raw) {
    if (w < min) min = w;
    if (w > max) max = w;
  }
  if (unitOption !== "auto") unit = unitOption;
  else {
    const fromHeading = table.headingUnit;
    const fromValues = unitFromValues(min, max);
    if (fromHeading !== undefined) {
      unit = fromHeading;
      inferred.push(
        `The wavelength unit (${unit}) was taken from the heading (state wavelengthUnit to override).`,
      );
    } else if (fromValues !== undefined) {
      unit = fromValues;
      inferred.push(
        `The wavelength unit (${unit}) was inferred from the values (${min}–${max}; values below 100 are read as µm) (state wavelengthUnit to override).`,
      );
    } else
      fail(
        `wavelengths from ${min} to ${max} are plausible neither in nm (100–100000) nor in µm (0.1–100); state wavelengthUnit`,
        table.wavelengthLines[raw.indexOf(min)],
      );
  }
  const factor = unit === "µm" ? 1000 : 1;
  const wavelengths = factor === 1 ? raw : raw.map((w) => roundWavelength(w * factor));
  wavelengths.forEach((w, i) => {
    if (!(w >= 100 && w <= 100000))
      fail(
        `wavelength ${w} nm is not plausible (expected 100–100000 nm)`,
        table.wavelengthLines[i],
        undefined,
        w,
      );
  });

  // Order, repeats and grid.
  const order = checkOrder(wavelengths, table.wavelengthLines, table.where, orderOption);
  if (order === "descending") {
    inferred.push(
      orderOption === "auto"
        ? "The wavelengths were written in descending order and were sorted ascending."
        : "The wavelengths (stated descending) were sorted ascending.",
    );
    wavelengths.reverse();
    table.wavelengthLines.reverse();
    for (const c of table.columns) c.reverse();
  }
  const step = checkGrid(
    wavelengths,
    table.wavelengthLines,
    table.where,
    options.unevenGrid === "accept",
    inferred,
  );

  // Scale.
  const ratio = options.quantity === "reflectance" || options.quantity === "transmittance";
  let scale: ValueScale | "as written" = "as written";
  let valueFactor = 1;
  let largest = -Infinity;
  for (const c of table.columns) for (const v of c) if (v > largest) largest = v;
  if (ratio || scaleOption !== "auto") {
    const said =
      scaleOption === "auto"
        ? statedScale([
            ...preamble.lines.map((t, i) => ({ text: t, line: preamble.lineNumbers[i]! })),
            { text: header.join(" "), line: headerNumber },
          ])
        : undefined;
    if (said) {
      scale = said.scale;
      inferred.push(
        `The ${options.quantity} values were read as ${said.scale === "percent" ? "percent and divided by 100" : "fractions"}, as the file says on line ${said.line} ("${said.text}") (state scale to override).`,
      );
    } else {
      const d = scaleDecision([largest], scaleOption, options.quantity);
      scale = d.scale;
      if (d.inferred) inferred.push(`${d.statement.replace(/\.$/, "")} (state scale to override).`);
    }
    valueFactor = scale === "percent" ? 100 : 1; // divided, so that 41.5 % gives the double nearest 0.415
  }

  const spectra = table.names.map((name, c) => {
    const values = valueFactor === 1 ? table.columns[c]! : table.columns[c]!.map((v) => v / 100);
    return spectrum(wavelengths, values, {
      name,
      quantity: options.quantity,
      unit: ratio ? "" : (options.unit ?? ""),
    });
  });
  noteMethod(
    "data files",
    `A spectral table of ${spectra.length} sample${spectra.length === 1 ? "" : "s"} of ${options.quantity} (${step !== undefined ? `${wavelengths[0]}–${wavelengths.at(-1)} nm every ${step} nm` : `${wavelengths.length} wavelengths from ${wavelengths[0]} to ${wavelengths.at(-1)} nm`}) was read${scale === "percent" ? "; its percent values were divided by 100" : ""}.`,
  );
  for (const statement of inferred) noteMethod("data files", statement);
  return {
    spectra,
    attributes: table.attributes,
    wavelengthHeader: placement === "first column" ? header[0]! : "",
    wavelengthsIn: placement,
    wavelengthUnit: unit,
    order,
    step,
    encoding,
    headerLine: headerNumber,
    delimiter: sep,
    decimal,
    scale,
    inferred,
    comments,
    metadata: preamble.metadata,
    notes: preamble.notes,
  };
}

interface RawTable {
  names: string[];
  attributes: Record<string, string>[];
  /** Wavelengths as written, in file order. */
  wavelengths: number[];
  /** The line of each wavelength (its row, or the header line). */
  wavelengthLines: number[];
  /** How to name a wavelength's place in messages. */
  where: (i: number) => string;
  /** One array of values per sample, in the order of `wavelengths`. */
  columns: number[][];
  headingUnit: WavelengthUnit | undefined;
}

function checkNames(names: readonly string[], line: number, firstColumn: number, what: string): void {
  const seen = new Map<string, number>();
  names.forEach((n, i) => {
    if (n === "") fail(`${what} ${i + firstColumn} has an empty name; every sample needs a name`, line);
    const before = seen.get(n);
    if (before !== undefined)
      fail(
        `sample name "${n}" appears twice (${what}s ${before + firstColumn} and ${i + firstColumn})`,
        line,
        n,
      );
    seen.set(n, i);
  });
}

function badValue(cell: string, decimal: "." | ","): string {
  if (cell.trim() === "") return "no value (blank); missing values are not filled in";
  const hint =
    decimal === "." && hasDecimalComma(cell)
      ? ' (it has a decimal comma but the file uses decimal points; state decimal: ",")'
      : decimal === "," && hasDecimalPoint(cell)
        ? ' (it has a decimal point but the file uses decimal commas; state decimal: ".")'
        : "";
  return `"${cell.trim()}", which is not a number${hint}`;
}

function readWavelengthsDown(
  lines: readonly string[],
  dataIndex: readonly number[],
  header: string[],
  headerNumber: number,
  sep: FieldSeparator,
  decimal: "." | ",",
  decimalCode: number,
): RawTable {
  let width = header.length;
  const trailing = width > 2 && header[width - 1] === "";
  if (trailing) width--; // a separator at the end of every line
  const names = header.slice(1, width);
  checkNames(names, headerNumber, 2, "column");
  const rows = dataIndex.length;
  // One typed column per sample, filled in place: no array grows and no cell is cut out of its line.
  const typed = names.map(() => new Float64Array(rows));
  const wavelengths: number[] = [];
  const wavelengthLines: number[] = [];
  const bounds = new Int32Array(2 * (width + 2));
  const row = new Float64Array(width);
  const sepCode = sep === " " ? -1 : sep.charCodeAt(0);
  for (let r = 0; r < rows; r++) {
    const index = dataIndex[r]!;
    const line = lines[index]!;
    // The hot path: a line of numbers read in one pass, as many as the header names.
    if (sepCode >= 0 && scanNumberRow(line, sepCode, decimalCode, row) === width) {
      wavelengths.push(row[0]!);
      wavelengthLines.push(index + 1);
      for (let k = 1; k < width; k++) typed[k - 1]![r] = row[k]!;
      continue;
    }
    const count = sepCode < 0 ? cellBounds(line, sep, bounds) : -1;
    if (count === width) {
      const wl = scanNumber(line, bounds[0]!, bounds[1]!, decimalCode);
      if (wl !== wl) rowFault(line, index + 1, sep, width, trailing, names, decimal);
      wavelengths.push(wl);
      wavelengthLines.push(index + 1);
      for (let k = 1; k < width; k++) {
        const v = scanNumber(line, bounds[2 * k]!, bounds[2 * k + 1]!, decimalCode);
        if (v !== v) rowFault(line, index + 1, sep, width, trailing, names, decimal);
        typed[k - 1]![r] = v;
      }
      continue;
    }
    // Quoted cells, a trailing separator, or a fault: cut the cells out and check them one by one.
    const cells = rowCells(line, index + 1, sep, width, trailing, names, decimal);
    wavelengths.push(cells[0]!);
    wavelengthLines.push(index + 1);
    for (let k = 1; k < width; k++) typed[k - 1]![r] = cells[k]!;
  }
  const columns = typed.map((t) => {
    const a: number[] = []; // grown by push: a large preallocated array would be a slow dictionary in V8
    for (let i = 0; i < t.length; i++) a.push(t[i]!);
    return a;
  });
  return {
    names,
    attributes: names.map(() => ({})),
    wavelengths,
    wavelengthLines,
    where: (i) => `line ${wavelengthLines[i]}`,
    columns,
    headingUnit: unitFromHeading(header[0]!),
  };
}

/** The numbers of one row read cell by cell (quoted cells, trailing separator); a fault throws with its place. */
function rowCells(
  line: string,
  n: number,
  sep: FieldSeparator,
  width: number,
  trailing: boolean,
  names: readonly string[],
  decimal: "." | ",",
): number[] {
  const cells = splitCells(line, sep, n);
  let count = cells.length;
  if (trailing && count === width + 1 && cells[width]!.trim() === "") count = width;
  const code = decimal.charCodeAt(0);
  const num = (k: number) => scanNumber(cells[k]!, 0, cells[k]!.length, code);
  if (count > width) fail(`this row has ${count} fields but the header has ${width}`, n);
  const wl = num(0);
  if (wl !== wl)
    fail(`the first column must hold wavelengths, but it holds ${badValue(cells[0]!, decimal)}`, n);
  if (count < width) {
    const missing = names[Math.max(count, 1) - 1]!;
    fail(
      `sample "${missing}" has no value at ${nm(wl)}: the row has ${count} field${count === 1 ? "" : "s"} but the header has ${width}`,
      n,
      missing,
      wl,
    );
  }
  const out = [wl];
  for (let k = 1; k < width; k++) {
    const v = num(k);
    if (v !== v)
      fail(`sample "${names[k - 1]}" at ${nm(wl)}: ${badValue(cells[k]!, decimal)}`, n, names[k - 1], wl);
    out.push(v);
  }
  return out;
}

/** Throws the fault of a row whose fast reading failed. */
function rowFault(
  line: string,
  n: number,
  sep: FieldSeparator,
  width: number,
  trailing: boolean,
  names: readonly string[],
  decimal: "." | ",",
): never {
  rowCells(line, n, sep, width, trailing, names, decimal);
  fail("this row could not be read", n);
}

function readWavelengthsAcross(
  lines: readonly string[],
  dataIndex: readonly number[],
  header: string[],
  headerNumber: number,
  sep: FieldSeparator,
  decimal: "." | ",",
  decimalCode: number,
  attributeOption: number | "auto",
  inferred: string[],
): RawTable {
  let width = header.length;
  const trailing = width > 2 && header[width - 1] === "";
  if (trailing) width--;
  const k = attributeOption === "auto" ? width - wavelengthTail(header.slice(0, width)) : attributeOption;
  if (k >= width)
    fail(`the header row names no wavelengths after its ${k} text column${k === 1 ? "" : "s"}`, headerNumber);
  if (attributeOption === "auto" && k > 0)
    inferred.push(
      `${k === 1 ? "The first column" : `The first ${k} columns`} (${header.slice(0, k).join(", ")}) ${k === 1 ? "was" : "were"} kept as each sample's attributes (state attributeColumns to override).`,
    );
  const attributeNames = header.slice(0, k);
  const wavelengths: number[] = [];
  let headingUnit: WavelengthUnit | undefined;
  for (let c = k; c < width; c++) {
    const w = wavelengthFromHeader(header[c]!);
    if (!w) fail(`header column ${c + 1} ("${header[c]}") does not name a wavelength`, headerNumber);
    wavelengths.push(w.value);
    headingUnit ??= w.unit;
  }
  const nameAt = (() => {
    for (const pattern of [
      /^(sample[ _]?)?name$/i,
      /^(sample|patch|label|specimen)$/i,
      /^(sample[ _]?)?id$/i,
    ]) {
      const at = attributeNames.findIndex((a) => pattern.test(a.trim()));
      if (at >= 0) return at;
    }
    return k > 0 ? 0 : -1;
  })();
  if (nameAt < 0)
    inferred.push("The samples have no name column and were named by their row (sample 1, sample 2, …).");
  else if (k > 1) inferred.push(`The samples were named by the column "${attributeNames[nameAt]}".`);
  const names: string[] = [];
  const attributes: Record<string, string>[] = [];
  const nWl = width - k;
  const columns: number[][] = [];
  const bounds = new Int32Array(2 * (width + 2));
  dataIndex.forEach((index, row) => {
    const line = lines[index]!;
    const n = index + 1;
    let count = cellBounds(line, sep, bounds);
    let cells: string[] | undefined;
    if (count === -1) {
      cells = splitCells(line, sep, n);
      count = cells.length;
    }
    const cellText = (c: number) => (cells ? cells[c]! : line.slice(bounds[2 * c]!, bounds[2 * c + 1]!));
    const name = nameAt >= 0 ? (cellText(nameAt) ?? "").trim() : `sample ${row + 1}`;
    if (
      count === -2 ||
      (count > width && !(trailing && count === width + 1 && cellText(width).trim() === ""))
    )
      fail(
        `sample "${name}" has ${count < 0 ? "more" : count - k} values but the header names ${nWl} wavelengths; samples of different lengths cannot be one table`,
        n,
        name,
      );
    if (count < width) {
      const last = wavelengths[Math.max(count - k, 0)]!;
      fail(
        `sample "${name}" has ${Math.max(count - k, 0)} values but the header names ${nWl} wavelengths: it ends before ${last} (as written); samples of different lengths cannot be one table`,
        n,
        name,
        last,
      );
    }
    const attrs: Record<string, string> = {};
    for (let c = 0; c < k; c++) attrs[attributeNames[c]! || `column ${c + 1}`] = cellText(c).trim();
    const values = new Array<number>(nWl);
    for (let c = k; c < width; c++) {
      const v = cells
        ? scanNumber(cells[c]!, 0, cells[c]!.length, decimalCode)
        : scanNumber(line, bounds[2 * c]!, bounds[2 * c + 1]!, decimalCode);
      if (v !== v)
        fail(
          `sample "${name}" at ${wavelengths[c - k]} (as written): ${badValue(cellText(c), decimal)}`,
          n,
          name,
          wavelengths[c - k],
        );
      values[c - k] = v;
    }
    names.push(name);
    attributes.push(attrs);
    columns.push(values);
  });
  checkNames(names, headerNumber, 1, "row");
  // Values are stored per sample; the order checks below reverse them alongside the wavelengths.
  return {
    names,
    attributes,
    wavelengths,
    wavelengthLines: wavelengths.map(() => headerNumber),
    where: (i) => `header column ${i + k + 1}`,
    columns,
    headingUnit,
  };
}

function checkOrder(
  w: readonly number[],
  lines: readonly number[],
  where: (i: number) => string,
  stated: "ascending" | "descending" | "auto",
): "ascending" | "descending" {
  if (w.length < 2) return stated === "descending" ? "descending" : "ascending";
  const seen = new Map<number, number>();
  w.forEach((x, i) => {
    const before = seen.get(x);
    if (before !== undefined)
      fail(
        `wavelength ${nm(x)} is repeated (${where(before)} and ${where(i)}); every wavelength must appear once`,
        lines[i],
        undefined,
        x,
      );
    seen.set(x, i);
  });
  const order = w[1]! > w[0]! ? "ascending" : "descending";
  if (stated !== "auto" && stated !== order)
    fail(
      `the wavelengths are stated to be ${stated} but the file has ${nm(w[1]!)} after ${nm(w[0]!)}`,
      lines[1],
      undefined,
      w[1],
    );
  for (let i = 2; i < w.length; i++) {
    const up = w[i]! > w[i - 1]!;
    if (up !== (order === "ascending"))
      fail(
        `wavelength ${nm(w[i]!)} breaks the ${order} order after ${nm(w[i - 1]!)} (${where(i)}); the rows must be sorted`,
        lines[i],
        undefined,
        w[i],
      );
  }
  return order;
}

function checkGrid(
  w: readonly number[],
  lines: readonly number[],
  where: (i: number) => string,
  accept: boolean,
  inferred: string[],
): number | undefined {
  if (w.length < 2) return undefined;
  const step = roundWavelength(w[1]! - w[0]!);
  for (let i = 2; i < w.length; i++) {
    const d = w[i]! - w[i - 1]!;
    if (Math.abs(d - step) > 1e-6 * step) {
      if (accept) {
        inferred.push(
          `The wavelength grid is uneven (from ${nm(w[i - 1]!)} to ${nm(w[i]!)} the step is ${roundWavelength(d)} nm, elsewhere ${step} nm); it was accepted as stated (unevenGrid: "accept").`,
        );
        return undefined;
      }
      fail(
        `the wavelength grid is uneven: ${nm(w[i]!)} follows ${nm(w[i - 1]!)} (step ${roundWavelength(d)} nm) where the grid steps by ${step} nm (${where(i)}; a missing row?); state unevenGrid: "accept" to read it as it is`,
        lines[i],
        undefined,
        w[i],
      );
    }
  }
  return step;
}

/**
 * Reads a spectral table from a file (path relative to the notebook's folder), as parseSpectralTable does; errors
 * name the file, line, sample and wavelength.
 *
 * @param path The file's path, relative to the notebook's folder.
 * @param options What the columns hold (`quantity`, required) and any decision to take instead of inferring it.
 * @returns `{ spectra, metadata, notes, comments, inferred, ... }`: the samples on ascending wavelengths in nm.
 * @source none: a tristim reader.
 * @example readSpectralTable("data/filter-lot-114.csv", { quantity: "transmittance" }).spectra.length
 */
export function readSpectralTable(path: string, options: SpectralTableOptions): SpectralTableResult {
  checkPath("readSpectralTable", "path", path);
  checkTableArguments("readSpectralTable", undefined, options, false);
  return parseDataFileBytes(path, (bytes) => spectralTable(bytes, options));
}

/**
 * The former name of parseSpectralTable, kept for existing notebooks: reads a spectral table from its text or bytes.
 *
 * @param input The file's text, or its bytes.
 * @param options What the columns hold (`quantity`, required) and any decision to take instead of inferring it.
 * @returns As parseSpectralTable.
 * @source none: a tristim reader.
 * @example parseSpectraCsv("nm,filter A\n400,0.5\n410,0.52\n", { quantity: "transmittance" }).spectra.length
 */
export function parseSpectraCsv(
  input: string | Uint8Array,
  options: SpectralTableOptions,
): SpectralTableResult {
  checkTableArguments("parseSpectraCsv", input, options, true);
  return spectralTable(input, options);
}

/**
 * The former name of readSpectralTable, kept for existing notebooks: reads a spectral table from a file.
 *
 * @param path The file's path, relative to the notebook's folder.
 * @param options What the columns hold (`quantity`, required) and any decision to take instead of inferring it.
 * @returns As readSpectralTable.
 * @source none: a tristim reader.
 * @example readSpectraCsv("data/filter-lot-114.csv", { quantity: "transmittance" }).spectra.length
 */
export function readSpectraCsv(path: string, options: SpectralTableOptions): SpectralTableResult {
  checkPath("readSpectraCsv", "path", path);
  checkTableArguments("readSpectraCsv", undefined, options, false);
  return parseDataFileBytes(path, (bytes) => spectralTable(bytes, options));
}
