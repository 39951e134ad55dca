/** Writing spectra as a CSV/TSV table: a wavelength column and one column per sample, fields quoted per RFC 4180 when needed. */
import { ArgumentError } from "../arguments/argument-error.ts";
import { checkSpectrumList } from "../arguments/check-list.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice, checkString } from "../arguments/check-text.ts";
import { describeKind } from "../arguments/describe-kind.ts";
import { refuse } from "../arguments/refuse.ts";
import { requireSameGrid } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { writeDataFileText } from "./data-file-error.ts";
import { checkPath, checkStringList, checkStringRecord } from "./file-arguments.ts";
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

const OPTION_NAMES = [
  "delimiter",
  "wavelengthsIn",
  "attributes",
  "metadata",
  "decimal",
  "scale",
  "digits",
  "decimals",
  "wavelengthHeader",
  "comments",
] as const satisfies readonly (keyof SpectraCsvWriteOptions)[];

/** Checks the writer's arguments: spectra on one grid with names of their own, and options of the right kinds. */
function checkWriteArguments(fn: string, spectra: unknown, options: unknown): void {
  checkSpectrumList(fn, "spectra", spectra, {
    minLength: 1,
    instead: { spectrum: "for one spectrum write [spectrum]" },
  });
  checkOptions(fn, "options", options, OPTION_NAMES);
  const list = spectra as readonly Spectrum[];
  const o = (options ?? {}) as Record<string, unknown>;
  checkChoice(fn, "options.delimiter", o.delimiter, [",", ";", "\t", " "], { optional: true });
  checkChoice(fn, "options.wavelengthsIn", o.wavelengthsIn, ["first column", "header row"], {
    optional: true,
  });
  checkChoice(fn, "options.decimal", o.decimal, [".", ","], { optional: true });
  checkChoice(fn, "options.scale", o.scale, ["fraction", "percent"], { optional: true });
  checkNumber(fn, "options.digits", o.digits, { integer: true, min: 1, max: 17, optional: true });
  checkNumber(fn, "options.decimals", o.decimals, { integer: true, min: 0, max: 20, optional: true });
  checkString(fn, "options.wavelengthHeader", o.wavelengthHeader, { optional: true });
  checkStringList(fn, "options.comments", o.comments, "comment lines (strings)");
  checkStringRecord(fn, "options.metadata", o.metadata, 'metadata { key: "value", … } (strings)');
  if (o.attributes !== undefined) {
    if (!Array.isArray(o.attributes))
      refuse(fn, "options.attributes", "an array of attribute records, one per spectrum", o.attributes);
    o.attributes.forEach((a, i) =>
      checkStringRecord(fn, `options.attributes[${i}]`, a, 'an attribute record { column: "text", … }'),
    );
    if (o.attributes.length !== list.length)
      throw new ArgumentError(
        fn,
        "options.attributes",
        `an array of ${list.length} attribute records, one per spectrum`,
        describeKind(o.attributes),
      );
  }
  if (o.decimal === "," && (o.delimiter ?? ",") === ",")
    throw new ArgumentError(
      fn,
      "options.decimal",
      '"." with comma-separated fields (a decimal comma needs ";" or tab as the separator)',
      describeKind(o.decimal),
    );
  if (o.scale === "percent") {
    const other = list.findIndex((s) => s.quantity !== "reflectance" && s.quantity !== "transmittance");
    if (other >= 0)
      throw new ArgumentError(
        fn,
        "options.scale",
        `"fraction" for spectra[${other}], a ${list[other]!.quantity} spectrum (only reflectance and transmittance can be written in percent)`,
        describeKind(o.scale),
      );
  }
  const names = list.map((s) => s.name);
  const dup = names.findIndex((n, i) => names.indexOf(n) !== i);
  if (dup >= 0)
    throw new ArgumentError(
      fn,
      `spectra[${dup}]`,
      `a spectrum with a name of its own (the names are the column headings; spectra[${names.indexOf(names[dup]!)}] has the same)`,
      describeKind(list[dup]),
      "rename one with withValues(s, s.values, { name })",
    );
  for (const [key, value] of Object.entries((o.metadata ?? {}) as Record<string, string>))
    if (
      /[\r\n:;=\t]/.test(key) ||
      /[\r\n]/.test(value) ||
      key.trim() !== key ||
      value.trim() !== value ||
      !key ||
      !value
    )
      throw new ArgumentError(
        fn,
        "options.metadata",
        'entries that each make one "key: value" line (a key without ":", ";", "=", tabs or line breaks; a value without line breaks; neither empty nor with edge spaces)',
        `the entry ${JSON.stringify(key)}: ${JSON.stringify(value)}`,
      );
  requireSameGrid(list, fn);
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
  checkWriteArguments("formatSpectraCsv", spectra, options);
  return spectraCsvText(spectra, options);
}

/** The writer itself, on arguments checked at the public entry. */
function spectraCsvText(spectra: readonly Spectrum[], options: SpectraCsvWriteOptions = {}): string {
  const delimiter = options.delimiter ?? ",";
  const decimal = options.decimal ?? ".";
  const digits = options.digits ?? 6;
  const decimals = options.decimals;
  const scale = options.scale ?? "fraction";
  const factor = (s: Spectrum) =>
    scale === "percent" && (s.quantity === "reflectance" || s.quantity === "transmittance") ? 100 : 1;
  const names = spectra.map((s) => s.name);
  const lines: string[] = [];
  for (const c of options.comments ?? []) for (const part of c.split(/\r\n|\n|\r/)) lines.push(`# ${part}`);
  for (const [key, value] of Object.entries(options.metadata ?? {})) lines.push(`# ${key}: ${value}`);
  if (options.wavelengthsIn === "header row") {
    const attributes: readonly Readonly<Record<string, string>>[] =
      options.attributes ?? spectra.map((s) => ({ sample: s.name }));
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
  }
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
  checkPath("writeSpectraCsv", "path", path);
  checkWriteArguments("writeSpectraCsv", spectra, options);
  writeDataFileText(path, spectraCsvText(spectra, options));
}
