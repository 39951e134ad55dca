/**
 * Reading spectral measurement tables from CSV or TSV text: one wavelength column (nm) followed by one column per
 * sample, a header row with the sample names, optional comment lines starting with "#". Parsing is done by the
 * csv-parse package (RFC 4180 quoting); delimiter, decimal mark and percent/fraction are either stated or inferred,
 * and every inference is reported in the result and in the Methods log.
 */
import { parse } from "csv-parse/sync";
import { noteMethod } from "../methods/method-log.ts";
import { gridOf } from "../spectrum/grid.ts";
import { spectrum, type SpectralQuantity, type Spectrum } from "../spectrum/spectrum.ts";
import { DataFileError, parseDataFile } from "./data-file-error.ts";
import { hasDecimalComma, hasDecimalPoint, readNumber } from "./number-text.ts";
import { decideValueScale, type ValueScale } from "./value-scale.ts";

export type CsvDelimiter = "," | ";" | "\t";

export interface SpectraCsvReadOptions {
  /** What the sample columns hold; required, so that a file is never silently taken for reflectance. */
  quantity: SpectralQuantity;
  /** Field separator; "auto" (default) takes it from the header line and reports it. */
  delimiter?: CsvDelimiter | "auto";
  /** Decimal mark; "auto" (default) decides from the numbers and reports it. A comma needs ";" or tab separators. */
  decimal?: "." | "," | "auto";
  /**
   * For reflectance and transmittance: "percent", "fraction", or "auto" (default: inferred from the values and
   * reported). Other quantities are kept as written unless "percent" is stated.
   */
  scale?: ValueScale | "auto";
  /** Unit of the values for non-ratio quantities, e.g. "W/(sr·m²·nm)"; default "" (none). */
  unit?: string;
}

export interface SpectraCsvResult {
  readonly spectra: Spectrum[];
  /** The header of the wavelength column as written. */
  readonly wavelengthHeader: string;
  readonly delimiter: CsvDelimiter;
  readonly decimal: "." | ",";
  /** The scale the values were read in ("as written" when no percent/fraction conversion applied). */
  readonly scale: ValueScale | "as written";
  /** Sentences saying what was inferred rather than stated (delimiter, decimal mark, percent/fraction). */
  readonly inferred: readonly string[];
  /** Comment lines of the file, without the leading "#", e.g. provenance notes. */
  readonly comments: readonly string[];
}

const DELIMITER_NAMES: Record<CsvDelimiter, string> = { ",": "comma", ";": "semicolon", "\t": "tab" };

interface Line {
  readonly number: number;
  readonly text: string;
}

function contentLines(text: string): { comments: string[]; header: Line | undefined } {
  const comments: string[] = [];
  const lines = text.replace(/^\uFEFF/, "").split(/\r\n|\n|\r/);
  for (let i = 0; i < lines.length; i++) {
    const t = lines[i]!;
    if (t.trim() === "") continue;
    if (t.trimStart().startsWith("#")) {
      comments.push(t.trimStart().slice(1).trim());
      continue;
    }
    return { comments, header: { number: i + 1, text: t } };
  }
  return { comments, header: undefined };
}

function countOutsideQuotes(text: string, ch: string): number {
  let n = 0;
  let quoted = false;
  for (const c of text) {
    if (c === '"') quoted = !quoted;
    else if (!quoted && c === ch) n++;
  }
  return n;
}

/**
 * Parses spectral CSV/TSV text (a wavelength column and one column per sample) into spectra.
 *
 * @param text The file's text.
 * @returns { spectra, wavelengthHeader, delimiter, decimal, scale, inferred (sentences on what was inferred), comments }.
 * @source RFC 4180 (CSV).
 * @example parseSpectraCsv("wavelength_nm,A\n400,12.5\n500,40\n600,55\n", { quantity: "reflectance", scale: "percent" }).spectra[0]!.values
 */
export function parseSpectraCsv(text: string, options: SpectraCsvReadOptions): SpectraCsvResult {
  if (typeof text !== "string")
    throw new DataFileError(`expected the file's text as a string, got ${typeof text}`);
  if (!options || !options.quantity) {
    throw new DataFileError(
      'state what the columns hold, e.g. { quantity: "transmittance" } or { quantity: "reflectance" }; it is never assumed',
    );
  }
  const inferred: string[] = [];
  const { comments, header } = contentLines(text);
  if (!header) throw new DataFileError("the file has no header line and no data");

  let delimiter: CsvDelimiter;
  const stated = options.delimiter ?? "auto";
  if (stated === "auto") {
    const counts = (["\t", ";", ","] as const).map((d) => [d, countOutsideQuotes(header.text, d)] as const);
    const found = counts.find(([, n]) => n > 0);
    if (!found)
      throw new DataFileError(
        "the header has a single column; a spectral table needs a wavelength column and at least one sample column (separated by comma, semicolon or tab)",
        header.number,
      );
    delimiter = found[0];
    inferred.push(`The field separator (${DELIMITER_NAMES[delimiter]}) was inferred from the header line.`);
  } else if (stated === "," || stated === ";" || stated === "\t") {
    delimiter = stated;
  } else {
    throw new DataFileError(`delimiter ${JSON.stringify(stated)} is not ",", ";", "\\t" or "auto"`);
  }

  let records: { record: string[]; info: { lines: number } }[];
  try {
    records = parse(text, {
      delimiter,
      comment: "#",
      comment_no_infix: true,
      skip_empty_lines: true,
      bom: true,
      info: true,
      relax_column_count: false,
    }) as unknown as { record: string[]; info: { lines: number } }[];
  } catch (e) {
    const err = e as { lines?: number; message: string };
    throw new DataFileError(
      `not a well-formed ${DELIMITER_NAMES[delimiter]}-separated table: ${err.message}`,
      err.lines,
    );
  }
  if (records.length < 2) throw new DataFileError("the file has a header but no data rows", header.number);
  const head = records[0]!.record.map((h) => h.trim());
  const names = head.slice(1);
  names.forEach((n, i) => {
    if (n === "")
      throw new DataFileError(
        `sample column ${i + 2} has an empty header; every sample needs a name`,
        records[0]!.info.lines,
      );
    const first = names.indexOf(n);
    if (first !== i)
      throw new DataFileError(
        `sample name "${n}" appears twice (columns ${first + 2} and ${i + 2})`,
        records[0]!.info.lines,
      );
  });
  const rows = records.slice(1);

  let decimal: "." | ",";
  const statedDecimal = options.decimal ?? "auto";
  if (statedDecimal === "auto") {
    let commaLine: number | undefined;
    let pointLine: number | undefined;
    for (const r of rows) {
      for (const cell of r.record) {
        if (commaLine === undefined && hasDecimalComma(cell)) commaLine = r.info.lines;
        if (pointLine === undefined && hasDecimalPoint(cell)) pointLine = r.info.lines;
      }
    }
    if (commaLine !== undefined && pointLine !== undefined) {
      throw new DataFileError(
        `the numbers mix decimal commas (first on line ${commaLine}) and decimal points (first on line ${pointLine}); state decimal: "." or ","`,
        Math.max(commaLine, pointLine),
      );
    }
    decimal = commaLine !== undefined ? "," : ".";
    inferred.push(
      commaLine !== undefined
        ? "The decimal mark (comma) was inferred from the numbers."
        : pointLine !== undefined
          ? "The decimal mark (point) was inferred from the numbers."
          : "No decimal mark was needed (all numbers are whole).",
    );
  } else if (statedDecimal === "." || statedDecimal === ",") {
    decimal = statedDecimal;
  } else {
    throw new DataFileError(`decimal ${JSON.stringify(statedDecimal)} is not ".", "," or "auto"`);
  }
  if (decimal === "," && delimiter === ",") {
    throw new DataFileError(
      "a decimal comma cannot be used with comma-separated fields; the file must use semicolons or tabs",
    );
  }

  const wavelengths: number[] = [];
  const columns: number[][] = names.map(() => []);
  for (const r of rows) {
    const line = r.info.lines;
    const wl = readNumber(r.record[0]!, decimal);
    if (wl === undefined)
      throw new DataFileError(
        `the first column must hold wavelengths in nm, but it holds "${r.record[0]}", which is not a number${decimal === "," ? " (decimal comma expected)" : ""}`,
        line,
      );
    if (wl < 100 || wl > 100000)
      throw new DataFileError(
        `wavelength ${wl} is not plausible in nanometres (expected 100–100000 nm)`,
        line,
      );
    const prev = wavelengths[wavelengths.length - 1];
    if (prev !== undefined && wl <= prev)
      throw new DataFileError(
        `wavelength ${wl} nm does not increase after ${prev} nm (rows must be sorted, without repeats)`,
        line,
      );
    wavelengths.push(wl);
    for (let c = 1; c < r.record.length; c++) {
      const cell = r.record[c]!;
      if (cell.trim() === "")
        throw new DataFileError(
          `sample "${names[c - 1]}" has no value at ${wl} nm (empty cell); missing values are not filled in`,
          line,
        );
      const v = readNumber(cell, decimal);
      if (v === undefined) {
        const hint =
          decimal === "." && hasDecimalComma(cell) ? ' (it has a decimal comma; state decimal: ",")' : "";
        throw new DataFileError(
          `sample "${names[c - 1]}" at ${wl} nm: "${cell}" is not a number${hint}`,
          line,
        );
      }
      columns[c - 1]!.push(v);
    }
  }

  const ratio = options.quantity === "reflectance" || options.quantity === "transmittance";
  let scale: ValueScale | "as written" = "as written";
  let factor = 1;
  if (ratio || options.scale === "percent" || options.scale === "fraction") {
    const decision = decideValueScale(columns.flat(), options.scale, options.quantity);
    scale = decision.scale;
    factor = decision.scale === "percent" ? 0.01 : 1;
    if (decision.inferred) inferred.push(decision.statement);
  }

  const spectra = names.map((name, c) =>
    spectrum(
      wavelengths,
      columns[c]!.map((v) => v * factor),
      { name, quantity: options.quantity, unit: ratio ? "" : (options.unit ?? "") },
    ),
  );
  const g = gridOf(spectra[0]!);
  noteMethod(
    "data files",
    `A spectral table of ${names.length} sample${names.length === 1 ? "" : "s"} of ${options.quantity} (${g ? `${g.start}–${g.end} nm every ${g.step} nm` : `${wavelengths.length} wavelengths from ${wavelengths[0]} to ${wavelengths.at(-1)} nm`}) was read${scale === "percent" ? "; its percent values were divided by 100" : ""}.`,
  );
  for (const statement of inferred) noteMethod("data files", statement);
  return { spectra, wavelengthHeader: head[0]!, delimiter, decimal, scale, inferred, comments };
}

/**
 * Reads a spectral CSV/TSV file (path relative to the notebook's folder) into spectra; errors name the file and line.
 *
 * @param path The file's path.
 * @returns { spectra, wavelengthHeader, delimiter, decimal, scale, inferred, comments }.
 * @source RFC 4180 (CSV).
 * @example readSpectraCsv("data/filter-lot-114.csv", { quantity: "transmittance" }).spectra.length
 */
export function readSpectraCsv(path: string, options: SpectraCsvReadOptions): SpectraCsvResult {
  return parseDataFile(path, (text) => parseSpectraCsv(text, options));
}
