/**
 * Taking measurements out of a CGATS.17 table: spectral fields (SPECTRAL_NMxxx, SPECTRAL_xxx or NMxxx, the
 * wavelength in nm in the name), XYZ fields (XYZ_X, XYZ_Y, XYZ_Z), Lab fields (LAB_L, LAB_A, LAB_B) and the sample
 * identifiers (SAMPLE_ID, SAMPLE_NAME).
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import type { Lab } from "../colorimetry/cielab.ts";
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type SpectralQuantity, type Spectrum } from "../spectrum/spectrum.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkChoice, checkString } from "../arguments/check-text.ts";
import { cgatsFromText, readCgatsFile, type CgatsFile, type CgatsTable } from "./cgats-read.ts";
import { DataFileError, withFileName } from "./data-file-error.ts";
import { checkCgatsFile, checkCgatsTable, checkPath, checkQuantityOptions } from "./file-arguments.ts";
import { scaleDecision, type ValueScale } from "./value-scale.ts";

const SPECTRAL_FIELD = /^(?:SPECTRAL_NM_?|SPECTRAL_|NM_?)(\d+(?:\.\d+)?)$/i;

/**
 * The spectral fields of a CGATS table with their wavelengths, in field order (they must increase).
 *
 * @param table A table of a parsed CGATS file.
 * @returns [{ field, wavelength in nm, index }, ...].
 * @source ANSI CGATS.17 (SPECTRAL_nnn fields).
 * @example cgatsSpectralFields(readCgats("data/blue-cut-plates.cgats.txt").tables[0]!).length
 */
export function cgatsSpectralFields(
  table: CgatsTable,
): { field: string; index: number; wavelength: number }[] {
  checkCgatsTable("cgatsSpectralFields", "table", table);
  return spectralFields(table);
}

function spectralFields(table: CgatsTable): { field: string; index: number; wavelength: number }[] {
  const out: { field: string; index: number; wavelength: number }[] = [];
  table.fields.forEach((field, index) => {
    const m = SPECTRAL_FIELD.exec(field);
    if (m) out.push({ field, index, wavelength: Number(m[1]) });
  });
  out.forEach((f, i) => {
    if (i > 0 && f.wavelength <= out[i - 1]!.wavelength) {
      throw new DataFileError(
        `spectral field ${f.field} (${f.wavelength} nm) does not follow ${out[i - 1]!.field} in increasing wavelength order`,
      );
    }
  });
  return out;
}

/**
 * Each set's identifier in a CGATS table: SAMPLE_NAME when present, else SAMPLE_ID, else "set N"; repeated identifiers are an error.
 *
 * @param table A table of a parsed CGATS file.
 * @returns One identifier per set.
 * @source ANSI CGATS.17 (SAMPLE_ID, SAMPLE_NAME).
 * @example cgatsSampleIds(readCgats("data/blue-cut-plates.cgats.txt").tables[0]!)
 */
export function cgatsSampleIds(table: CgatsTable): string[] {
  checkCgatsTable("cgatsSampleIds", "table", table);
  return sampleIds(table);
}

function sampleIds(table: CgatsTable): string[] {
  const nameAt = table.fields.indexOf("SAMPLE_NAME");
  const idAt = table.fields.indexOf("SAMPLE_ID");
  const ids = table.sets.map((set, i) => {
    const v = nameAt >= 0 ? set[nameAt] : idAt >= 0 ? set[idAt] : undefined;
    return v === undefined || v === "" ? `set ${i + 1}` : String(v);
  });
  ids.forEach((id, i) => {
    const first = ids.indexOf(id);
    if (first !== i)
      throw new DataFileError(
        `sample identifier "${id}" appears twice (lines ${table.setLines[first]} and ${table.setLines[i]})`,
        table.setLines[i],
      );
  });
  return ids;
}

function numericColumn(table: CgatsTable, field: string): number[] {
  const at = table.fields.indexOf(field);
  return table.sets.map((set, i) => {
    const v = set[at];
    if (typeof v !== "number")
      throw new DataFileError(
        `field ${field} must be a number, found ${JSON.stringify(v)}`,
        table.setLines[i],
      );
    return v;
  });
}

function requireFields(table: CgatsTable, wanted: readonly string[], what: string): void {
  const missing = wanted.filter((f) => !table.fields.includes(f));
  if (missing.length > 0)
    throw new DataFileError(
      `the table has no ${what} (missing ${missing.join(", ")}); its fields are ${table.fields.join(", ")}`,
    );
}

/**
 * X, Y, Z of each set of a CGATS table, from the fields XYZ_X, XYZ_Y, XYZ_Z.
 *
 * @param table A table of a parsed CGATS file.
 * @returns [{ id, XYZ }, ...] as written in the file.
 * @source ANSI CGATS.17 (XYZ_ fields).
 * @example cgatsTristimulus(parseCgats("CGATS.17\nBEGIN_DATA_FORMAT\nSAMPLE_ID XYZ_X XYZ_Y XYZ_Z\nEND_DATA_FORMAT\nBEGIN_DATA\n1 41.2 21.3 1.9\nEND_DATA\n").tables[0]!)
 */
export function cgatsTristimulus(table: CgatsTable): { id: string; XYZ: Tristimulus }[] {
  checkCgatsTable("cgatsTristimulus", "table", table);
  requireFields(table, ["XYZ_X", "XYZ_Y", "XYZ_Z"], "XYZ fields");
  const ids = sampleIds(table);
  const [X, Y, Z] = (["XYZ_X", "XYZ_Y", "XYZ_Z"] as const).map((f) => numericColumn(table, f));
  return ids.map((id, i) => ({ id, XYZ: { X: X![i]!, Y: Y![i]!, Z: Z![i]! } }));
}

/**
 * L*, a*, b* of each set of a CGATS table, from the fields LAB_L, LAB_A, LAB_B.
 *
 * @param table A table of a parsed CGATS file.
 * @returns [{ id, Lab }, ...] as written in the file.
 * @source ANSI CGATS.17 (LAB_ fields).
 * @example cgatsLab(parseCgats("CGATS.17\nBEGIN_DATA_FORMAT\nSAMPLE_ID LAB_L LAB_A LAB_B\nEND_DATA_FORMAT\nBEGIN_DATA\n1 50 20 -10\nEND_DATA\n").tables[0]!)
 */
export function cgatsLab(table: CgatsTable): { id: string; Lab: Lab }[] {
  checkCgatsTable("cgatsLab", "table", table);
  requireFields(table, ["LAB_L", "LAB_A", "LAB_B"], "Lab fields");
  const ids = sampleIds(table);
  const [L, A, B] = (["LAB_L", "LAB_A", "LAB_B"] as const).map((f) => numericColumn(table, f));
  return ids.map((id, i) => ({ id, Lab: { L: L![i]!, a: A![i]!, b: B![i]! } }));
}

export interface CgatsSpectraOptions {
  /** What the spectral fields hold; required, never assumed. */
  quantity: SpectralQuantity;
  /** For reflectance/transmittance: "percent", "fraction" or "auto" (default: inferred from the values and reported). */
  scale?: ValueScale | "auto";
  /** Which table of the file (0-based, default 0). */
  table?: number;
}

export interface CgatsSpectraResult {
  readonly spectra: Spectrum[];
  readonly scale: ValueScale | "as written";
  /** Sentences saying what was inferred rather than stated. */
  readonly inferred: readonly string[];
  /** The table's header keywords (e.g. DESCRIPTOR, ORIGINATOR), for provenance. */
  readonly keywords: Readonly<Record<string, string>>;
  readonly file: CgatsFile;
}

/**
 * The spectra of one table of a parsed CGATS file, named by sample identifier, reflectance and transmittance scaled to fractions.
 *
 * @param file A parsed CGATS file.
 * @returns { spectra, scale, inferred (sentences on what was inferred), keywords, file }.
 * @source ANSI CGATS.17.
 * @example cgatsSpectra(readCgats("data/blue-cut-plates.cgats.txt"), { quantity: "transmittance", scale: "percent" }).spectra.length
 */
export function cgatsSpectra(file: CgatsFile, options: CgatsSpectraOptions): CgatsSpectraResult {
  checkCgatsFile("cgatsSpectra", "file", file);
  checkSpectraOptions("cgatsSpectra", options);
  return spectraOf(file, options);
}

const SPECTRA_OPTIONS = ["quantity", "scale", "table"];

/** The options of the CGATS spectra readers: a quantity (required), a scale and a table number. */
function checkSpectraOptions(fn: string, options: unknown): void {
  checkQuantityOptions(fn, options, SPECTRA_OPTIONS, "the spectral fields");
  const o = options as Record<string, unknown>;
  checkChoice(fn, "options.scale", o.scale, ["percent", "fraction", "auto"], { optional: true });
  checkNumber(fn, "options.table", o.table, { integer: true, min: 0, optional: true });
}

function spectraOf(file: CgatsFile, options: CgatsSpectraOptions): CgatsSpectraResult {
  const which = options.table ?? 0;
  const table = file.tables[which];
  if (!table)
    throw new DataFileError(
      `the file has ${file.tables.length} table${file.tables.length === 1 ? "" : "s"}; table ${which} does not exist`,
    );
  const fields = spectralFields(table);
  if (fields.length === 0)
    throw new DataFileError(
      `the table has no spectral fields (SPECTRAL_NMxxx, SPECTRAL_xxx or NMxxx); its fields are ${table.fields.join(", ")}`,
    );
  const ids = sampleIds(table);
  const columns = fields.map((f) => numericColumn(table, f.field));
  const ratio = options.quantity === "reflectance" || options.quantity === "transmittance";
  const inferred: string[] = [];
  let scale: ValueScale | "as written" = "as written";
  let factor = 1;
  if (ratio || options.scale === "percent" || options.scale === "fraction") {
    const d = scaleDecision(columns.flat(), options.scale, options.quantity);
    scale = d.scale;
    factor = d.scale === "percent" ? 0.01 : 1;
    if (d.inferred) inferred.push(d.statement);
  }
  const wavelengths = fields.map((f) => f.wavelength);
  const spectra = ids.map((id, i) =>
    spectrum(
      wavelengths,
      columns.map((c) => (factor === 1 ? c[i]! : c[i]! / 100)),
      { name: id, quantity: options.quantity },
    ),
  );
  noteMethod(
    "data files",
    `Spectral data of ${spectra.length} sample${spectra.length === 1 ? "" : "s"} of ${options.quantity} (${wavelengths[0]}–${wavelengths.at(-1)} nm) were taken from CGATS spectral fields${scale === "percent" ? "; their percent values were divided by 100" : ""}.`,
  );
  for (const s of inferred) noteMethod("data files", s);
  return { spectra, scale, inferred, keywords: table.keywords, file };
}

/**
 * Parses CGATS.17 text and returns the spectra of one table (see `cgatsSpectra`).
 *
 * @param text The file's text.
 * @returns { spectra, scale, inferred, keywords, file }.
 * @source ANSI CGATS.17.
 * @example parseCgatsSpectra("CGATS.17\nBEGIN_DATA_FORMAT\nSAMPLE_ID SPECTRAL_400 SPECTRAL_500\nEND_DATA_FORMAT\nBEGIN_DATA\nA 0.2 0.4\nEND_DATA\n", { quantity: "reflectance" }).spectra[0]
 */
export function parseCgatsSpectra(text: string, options: CgatsSpectraOptions): CgatsSpectraResult {
  checkString("parseCgatsSpectra", "text", text, {
    what: "the file's text (a string)",
    instead: { object: "for a file by its path use readCgatsSpectra(path, options)" },
  });
  checkSpectraOptions("parseCgatsSpectra", options);
  return spectraOf(cgatsFromText(text), options);
}

/**
 * Reads a CGATS.17 file (path relative to the notebook's folder) and returns the spectra of one table; errors name the file and line.
 *
 * @param path The file's path.
 * @returns { spectra, scale, inferred, keywords, file }.
 * @source ANSI CGATS.17.
 * @example readCgatsSpectra("data/blue-cut-plates.cgats.txt", { quantity: "transmittance" }).spectra[0]!.name
 */
export function readCgatsSpectra(path: string, options: CgatsSpectraOptions): CgatsSpectraResult {
  checkPath("readCgatsSpectra", "path", path);
  checkSpectraOptions("readCgatsSpectra", options);
  const file = readCgatsFile(path);
  try {
    return spectraOf(file, options);
  } catch (e) {
    throw withFileName(e, path);
  }
}
