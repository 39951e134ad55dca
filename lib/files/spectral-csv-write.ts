/** Writing spectra as a CSV/TSV table: a wavelength column and one column per sample, fields quoted per RFC 4180 when needed. */
import { writeFileSync } from "node:fs";
import { requireSameGrid } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { writeNumber } from "./number-text.ts";
import type { ValueScale } from "./value-scale.ts";
import type { FieldSeparator } from "./delimited-text.ts";
import type { WavelengthPlacement } from "./spectral-csv-read.ts";

export interface SpectraCsvWriteOptions {
  /** Field separator (default ","); " " writes single spaces (names with spaces are then quoted). */
  delimiter?: FieldSeparator;
  /** Wavelengths down the first column (default) or across the header row, one sample per row. */
  wavelengthsIn?: WavelengthPlacement;
  /** With wavelengths in the header row: per sample, text columns written before the values (same keys for all; default none). */
  attributes?: readonly Readonly<Record<string, string>>[];
  /** Key/value lines written at the top as "# key: value" (default none). */
  metadata?: Readonly<Record<string, string>>;
  /** Decimal mark (default "."); a comma needs ";" or tab as the separator. */
  decimal?: "." | ",";
  /** For reflectance/transmittance: write fractions (default) or percent. */
  scale?: ValueScale;
  /** Significant digits of the values (default 6). */
  digits?: number;
  /**
   * At most this many decimals (0–20; default none): with it no value is written with an exponent, and a value that
   * rounds to 0 there is written as 0 (e.g. `decimals: 6` writes 6.3929e-75 as 0 and 0.1234567 as 0.123457). Without
   * it values keep `digits` significant digits, written out in full down to 20 decimals, with an exponent below that.
   */
  decimals?: number;
  /** Header of the wavelength column (default "wavelength_nm"). */
  wavelengthHeader?: string;
  /** Lines written at the top as "# ..." comments (e.g. provenance); default none. */
  comments?: readonly string[];
}

/** One field, quoted when it holds the separator, a quote, a line break or edge spaces (RFC 4180 §2). */
function field(text: string, delimiter: string): string {
  return /["\r\n]/.test(text) ||
    text.includes(delimiter) ||
    text !== text.trim() ||
    (delimiter === " " && /[\s]/.test(text)) ||
    text === ""
    ? `"${text.replace(/"/g, '""')}"`
    : text;
}

/** The Methods statement of a written table: its rule for digits and decimals. */
function writtenStatement(digits: number, decimals: number | undefined, scale: ValueScale): string {
  const rule =
    decimals === undefined
      ? `${digits} significant digits (an exponent only below 10⁻²⁰)`
      : `${digits} significant digits and at most ${decimals} decimals (smaller values written as 0, no exponents)`;
  return `Spectral tables were written with ${rule}${scale === "percent" ? " in percent" : ""}.`;
}

/**
 * The spectra (all on one grid) as CSV/TSV text with a header row; the inverse of `parseSpectraCsv`.
 *
 * @param spectra Spectra on the same wavelengths.
 * @returns The text.
 * @source RFC 4180 (CSV).
 * @example formatSpectraCsv([spectrumOnGrid(400, 100, [0.2, 0.4, 0.5], { name: "invented A", quantity: "reflectance" })], { scale: "percent" })
 */
export function formatSpectraCsv(spectra: readonly Spectrum[], options: SpectraCsvWriteOptions = {}): string {
  if (!Array.isArray(spectra) || spectra.length === 0)
    throw new Error("formatSpectraCsv: no spectra to write");
  requireSameGrid(spectra, "formatSpectraCsv");
  const delimiter = options.delimiter ?? ",";
  if (![",", ";", "\t", " "].includes(delimiter))
    throw new Error(`formatSpectraCsv: delimiter ${JSON.stringify(delimiter)} is not ",", ";", "\\t" or " "`);
  const decimal = options.decimal ?? ".";
  if (decimal !== "." && decimal !== ",")
    throw new Error(`formatSpectraCsv: decimal ${JSON.stringify(decimal)} is not "." or ","`);
  if (decimal === "," && delimiter === ",")
    throw new Error('formatSpectraCsv: a decimal comma needs ";" or tab as the separator');
  const digits = options.digits ?? 6;
  if (!Number.isInteger(digits) || digits < 1 || digits > 17)
    throw new Error(`formatSpectraCsv: digits ${digits} must be a whole number from 1 to 17`);
  const decimals = options.decimals;
  if (decimals !== undefined && (!Number.isInteger(decimals) || decimals < 0 || decimals > 20))
    throw new Error(`formatSpectraCsv: decimals ${decimals} must be a whole number from 0 to 20`);
  const scale = options.scale ?? "fraction";
  if (scale !== "fraction" && scale !== "percent")
    throw new Error(`formatSpectraCsv: scale "${String(scale)}" is not "fraction" or "percent"`);
  const factor = (s: Spectrum) =>
    scale === "percent" && (s.quantity === "reflectance" || s.quantity === "transmittance") ? 100 : 1;
  if (scale === "percent") {
    const other = spectra.find((s) => s.quantity !== "reflectance" && s.quantity !== "transmittance");
    if (other)
      throw new Error(
        `formatSpectraCsv: "${other.name}" is a ${other.quantity} spectrum; only reflectance and transmittance can be written in percent`,
      );
  }
  const names = spectra.map((s) => s.name);
  const dup = names.find((n, i) => names.indexOf(n) !== i);
  if (dup !== undefined)
    throw new Error(`formatSpectraCsv: two spectra are named "${dup}"; column names must differ`);
  const lines: string[] = [];
  for (const c of options.comments ?? [])
    for (const part of String(c).split(/\r\n|\n|\r/)) lines.push(`# ${part}`);
  for (const [key, value] of Object.entries(options.metadata ?? {})) {
    if (
      /[\r\n:;=\t]/.test(key) ||
      /[\r\n]/.test(value) ||
      key.trim() !== key ||
      value.trim() !== value ||
      !key ||
      !value
    )
      throw new Error(
        `formatSpectraCsv: metadata ${JSON.stringify(key)}: ${JSON.stringify(value)} cannot be written as one "key: value" line`,
      );
    lines.push(`# ${key}: ${value}`);
  }
  if (options.wavelengthsIn === "header row") {
    const attributes: readonly Readonly<Record<string, string>>[] =
      options.attributes ?? spectra.map((s) => ({ sample: s.name }));
    if (attributes.length !== spectra.length)
      throw new Error(
        `formatSpectraCsv: ${attributes.length} attribute records for ${spectra.length} spectra`,
      );
    const keys = Object.keys(attributes[0] ?? {});
    lines.push(
      [...keys, ...spectra[0]!.wavelengths.map((w: number) => writeNumber(w, decimal, 10))]
        .map((t) => field(t, delimiter))
        .join(delimiter),
    );
    spectra.forEach((s, k) => {
      const a = attributes[k]!;
      lines.push(
        [
          ...keys.map((key) => field(a[key] ?? "", delimiter)),
          ...s.values.map((v: number) => writeNumber(v * factor(s), decimal, digits, decimals)),
        ].join(delimiter),
      );
    });
    noteMethod("data files", writtenStatement(digits, decimals, scale));
    return lines.join("\n") + "\n";
  } else if (options.wavelengthsIn !== undefined && options.wavelengthsIn !== "first column")
    throw new Error(
      `formatSpectraCsv: wavelengthsIn ${JSON.stringify(options.wavelengthsIn)} is not "first column" or "header row"`,
    );
  lines.push(
    [options.wavelengthHeader ?? "wavelength_nm", ...names].map((t) => field(t, delimiter)).join(delimiter),
  );
  spectra[0]!.wavelengths.forEach((w: number, i: number) => {
    lines.push(
      [
        writeNumber(w, decimal, 10),
        ...spectra.map((s) => writeNumber(s.values[i]! * factor(s), decimal, digits, decimals)),
      ].join(delimiter),
    );
  });
  noteMethod("data files", writtenStatement(digits, decimals, scale));
  return lines.join("\n") + "\n";
}

/**
 * Writes the spectra to a CSV/TSV file (path relative to the notebook's folder); see `formatSpectraCsv`.
 *
 * @param path The file's path.
 * @param spectra Spectra on the same wavelengths.
 * @source RFC 4180 (CSV).
 * @example writeSpectraCsv("invented-spectra.csv", [spectrumOnGrid(400, 100, [0.2, 0.4, 0.5], { name: "invented A" })])
 */
export function writeSpectraCsv(
  path: string,
  spectra: readonly Spectrum[],
  options: SpectraCsvWriteOptions = {},
): void {
  writeFileSync(path, formatSpectraCsv(spectra, options), "utf8");
}
