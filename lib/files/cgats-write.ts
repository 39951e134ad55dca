/**
 * Writing the CGATS.17 text exchange format: identifier line, header keywords (ORIGINATOR, DESCRIPTOR, CREATED, ...;
 * other keywords declared with KEYWORD first), the data format (SAMPLE_ID, SAMPLE_NAME, spectral SPECTRAL_NMxxx
 * fields, XYZ_X/Y/Z, LAB_L/A/B) and one tab-separated set per line.
 */
import { ArgumentError } from "../arguments/argument-error.ts";
import { checkFields, LAB_FIELDS, XYZ_FIELDS } from "../arguments/check-fields.ts";
import { checkSpectrumList } from "../arguments/check-list.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice, checkString } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { describeKind } from "../arguments/describe-kind.ts";
import { refuse } from "../arguments/refuse.ts";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import type { Lab } from "../colorimetry/cielab.ts";
import { requireSameGrid } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { writeDataFileText } from "./data-file-error.ts";
import { checkPath, checkStringList, isRecord } from "./file-arguments.ts";
import { writeNumber } from "./number-text.ts";
import type { ValueScale } from "./value-scale.ts";

/** Header keywords the CGATS.17 text format defines (no KEYWORD declaration needed). */
export const CGATS_STANDARD_KEYWORDS = [
  "ORIGINATOR",
  "DESCRIPTOR",
  "CREATED",
  "MANUFACTURER",
  "PROD_DATE",
  "SERIAL",
  "MATERIAL",
  "INSTRUMENTATION",
  "MEASUREMENT_SOURCE",
  "PRINT_CONDITIONS",
  "SAMPLE_BACKING",
  "FILTER",
  "POLARIZATION",
  "WEIGHTING_FUNCTION",
  "COMPUTATIONAL_PARAMETER",
] as const;

export interface CgatsWriteInput {
  /** Sample identifiers (default 1, 2, 3, ...). */
  sampleIds?: readonly (string | number)[];
  /** Optional sample names, written as SAMPLE_NAME. */
  sampleNames?: readonly string[];
  /** Spectra on one grid (reflectance or transmittance for percent). */
  spectra?: readonly Spectrum[];
  XYZ?: readonly Tristimulus[];
  Lab?: readonly Lab[];
  /** Header keywords and values, e.g. { ORIGINATOR: "tristim", DESCRIPTOR: "...", CREATED: "2026-12-01" }. */
  keywords?: Readonly<Record<string, string | number>>;
  /** Spectral values as fractions (default) or percent. */
  scale?: ValueScale;
  /** Significant digits (default 6). */
  digits?: number;
  /** The identifier line (default "CGATS.17"). */
  identifier?: string;
}

const INPUT_KEYS = [
  "sampleIds",
  "sampleNames",
  "spectra",
  "XYZ",
  "Lab",
  "keywords",
  "scale",
  "digits",
  "identifier",
] as const satisfies readonly (keyof CgatsWriteInput)[];

const UNQUOTABLE = /["\r\n]/;

/** Throws an ArgumentError for text CGATS cannot quote: a double quote or a line break in it. */
function checkQuotable(fn: string, arg: string, value: string): void {
  if (UNQUOTABLE.test(value))
    refuse(fn, arg, "text without a double quote or line break (CGATS text cannot hold them)", value);
}

/** An array argument of the input, each item checked by `item` (undefined passes: the list is optional). */
function checkEach(
  fn: string,
  arg: string,
  value: unknown,
  what: string,
  item: (v: unknown, at: string) => void,
): void {
  if (value === undefined) return;
  if (!Array.isArray(value)) refuse(fn, arg, `an array of ${what}`, value);
  value.forEach((v, i) => item(v, `${arg}[${i}]`));
}

/**
 * Checks the writer's input once: its lists of the right kinds and of one length, at least one sample of spectra,
 * XYZ or Lab, identifiers unique, keywords writable, and every text quotable in CGATS.
 */
function checkWriteInput(fn: string, input: unknown): void {
  if (!isRecord(input))
    refuse(
      fn,
      "input",
      "what to write: { spectra?, XYZ?, Lab?, sampleIds?, sampleNames?, keywords?, … }",
      input,
      {
        spectrum: "for a spectrum write { spectra: [spectrum] }",
        array:
          "for a list of spectra write { spectra: [...] }, for XYZ { XYZ: [...] }, for CIELAB { Lab: [...] }",
      },
    );
  checkOptions(fn, "input", input, INPUT_KEYS);
  checkSpectrumList(fn, "input.spectra", input.spectra, { optional: true });
  checkEach(fn, "input.XYZ", input.XYZ, "tristimulus values { X, Y, Z }", (v, at) =>
    checkFields(fn, at, v, XYZ_FIELDS),
  );
  checkEach(fn, "input.Lab", input.Lab, "CIELAB values { L, a, b }", (v, at) =>
    checkFields(fn, at, v, LAB_FIELDS),
  );
  const isIdentifier = (v: unknown) => typeof v === "string" || (typeof v === "number" && Number.isFinite(v));
  checkEach(
    fn,
    "input.sampleIds",
    input.sampleIds,
    "sample identifiers (strings or finite numbers)",
    (v, at) => {
      checkWith(fn, at, v, "a sample identifier (a string or a finite number)", isIdentifier);
      if (typeof v === "string") checkQuotable(fn, at, v);
    },
  );
  checkStringList(fn, "input.sampleNames", input.sampleNames, "sample names (strings)");
  (input.sampleNames as string[] | undefined)?.forEach((v, i) =>
    checkQuotable(fn, `input.sampleNames[${i}]`, v),
  );
  checkChoice(fn, "input.scale", input.scale, ["fraction", "percent"], { optional: true });
  checkNumber(fn, "input.digits", input.digits, { integer: true, min: 1, max: 17, optional: true });
  checkString(fn, "input.identifier", input.identifier, { optional: true });
  if (typeof input.identifier === "string" && !/^\S+$/.test(input.identifier))
    refuse(fn, "input.identifier", 'one word, e.g. "CGATS.17"', input.identifier);
  if (input.keywords !== undefined) {
    if (!isRecord(input.keywords))
      refuse(
        fn,
        "input.keywords",
        'header keywords { ORIGINATOR: "…", … } (strings or numbers)',
        input.keywords,
      );
    for (const [key, value] of Object.entries(input.keywords)) {
      const at = `input.keywords.${key}`;
      if (!/^[A-Z][A-Z0-9_]*$/.test(key))
        throw new ArgumentError(
          fn,
          "input.keywords",
          "keywords named by upper-case letters, digits and underscores",
          `a keyword named ${JSON.stringify(key)}`,
        );
      if (/^(NUMBER_OF_|BEGIN_|END_|KEYWORD$)/.test(key))
        throw new ArgumentError(
          fn,
          "input.keywords",
          "keywords other than NUMBER_OF_…, BEGIN_…, END_… and KEYWORD (the writer writes those itself)",
          `the keyword ${key}`,
        );
      checkWith(fn, at, value, "a keyword value (a string or a finite number)", isIdentifier);
      if (typeof value === "string") checkQuotable(fn, at, value);
    }
  }
  const counts = [
    ["spectra", input.spectra],
    ["XYZ", input.XYZ],
    ["Lab", input.Lab],
    ["sampleIds", input.sampleIds],
    ["sampleNames", input.sampleNames],
  ]
    .filter(([, list]) => list !== undefined)
    .map(([k, list]) => [k, (list as unknown[]).length] as [string, number]);
  if (!counts.some(([k]) => k === "spectra" || k === "XYZ" || k === "Lab"))
    refuse(fn, "input", "samples to write: spectra, XYZ and/or Lab, one entry per sample", input);
  const n = counts[0]![1];
  if (counts.some(([, c]) => c !== n))
    throw new ArgumentError(
      fn,
      "input",
      "lists with one entry per sample",
      counts.map(([k, c]) => `${c} ${k}`).join(", "),
    );
  if (n === 0) throw new ArgumentError(fn, "input", "at least one sample to write", "empty lists");
  const ids = (input.sampleIds as readonly (string | number)[] | undefined)?.map(String) ?? [];
  const dup = ids.findIndex((id, i) => ids.indexOf(id) !== i);
  if (dup >= 0)
    throw new ArgumentError(
      fn,
      `input.sampleIds[${dup}]`,
      `an identifier of its own (sample identifiers must be unique; input.sampleIds[${ids.indexOf(ids[dup]!)}] is the same)`,
      describeKind((input.sampleIds as unknown[])[dup]),
    );
  const spectra = (input.spectra ?? []) as readonly Spectrum[];
  if (input.scale === "percent") {
    const other = spectra.findIndex((s) => s.quantity !== "reflectance" && s.quantity !== "transmittance");
    if (other >= 0)
      throw new ArgumentError(
        fn,
        "input.scale",
        `"fraction" for spectra[${other}], a ${spectra[other]!.quantity} spectrum (only reflectance and transmittance can be written in percent)`,
        describeKind(input.scale),
      );
  }
  if (spectra.length > 0) requireSameGrid(spectra, fn);
}

/**
 * CGATS.17 text for the given samples: spectra, XYZ and/or CIELAB with identifiers and header keywords.
 *
 * @param input { sampleIds (default 1, 2, …), sampleNames, spectra, XYZ, Lab, keywords, scale (default "fraction"), digits (default 6), identifier (default "CGATS.17") }.
 * @returns The file's text.
 * @source ANSI CGATS.17.
 * @example formatCgats({ Lab: [{ L: 50, a: 20, b: -10 }], keywords: { DESCRIPTOR: "invented sample" } })
 */
export function formatCgats(input: CgatsWriteInput): string {
  checkWriteInput("formatCgats", input);
  return cgatsText(input);
}

/** The writer itself, on an input checked at the public entry. */
function cgatsText(input: CgatsWriteInput): string {
  const n = (input.spectra ?? input.XYZ ?? input.Lab)!.length;
  const digits = input.digits ?? 6;
  const scale = input.scale ?? "fraction";
  const spectra = input.spectra ?? [];
  const factor = scale === "percent" ? 100 : 1;
  const ids = input.sampleIds ?? Array.from({ length: n }, (_, i) => i + 1);
  const idText = ids.map((id) => (typeof id === "number" ? String(id) : `"${id}"`));

  const fields = ["SAMPLE_ID"];
  if (input.sampleNames) fields.push("SAMPLE_NAME");
  const wl = spectra[0]?.wavelengths ?? [];
  for (const w of wl) fields.push(`SPECTRAL_NM${writeNumber(w, ".", 10)}`);
  if (input.XYZ) fields.push("XYZ_X", "XYZ_Y", "XYZ_Z");
  if (input.Lab) fields.push("LAB_L", "LAB_A", "LAB_B");

  const lines: string[] = [input.identifier ?? "CGATS.17"];
  const keywords = input.keywords ?? {};
  for (const [key, value] of Object.entries(keywords)) {
    if (!(CGATS_STANDARD_KEYWORDS as readonly string[]).includes(key)) lines.push(`KEYWORD\t"${key}"`);
    lines.push(`${key}\t${typeof value === "number" ? writeNumber(value, ".", 12) : `"${value}"`}`);
  }
  lines.push(
    `NUMBER_OF_FIELDS\t${fields.length}`,
    "BEGIN_DATA_FORMAT",
    fields.join("\t"),
    "END_DATA_FORMAT",
    `NUMBER_OF_SETS\t${n}`,
    "BEGIN_DATA",
  );
  for (let i = 0; i < n; i++) {
    const row = [idText[i]!];
    if (input.sampleNames) row.push(`"${input.sampleNames[i]!}"`);
    for (const v of spectra[i]?.values ?? []) row.push(writeNumber(v * factor, ".", digits));
    if (input.XYZ) {
      const t = input.XYZ[i]!;
      row.push(...[t.X, t.Y, t.Z].map((v) => writeNumber(v, ".", digits)));
    }
    if (input.Lab) {
      const l = input.Lab[i]!;
      row.push(...[l.L, l.a, l.b].map((v) => writeNumber(v, ".", digits)));
    }
    lines.push(row.join("\t"));
  }
  lines.push("END_DATA");
  noteMethod(
    "data files",
    `CGATS.17 text was written with ${digits} significant digits${spectra.length && scale === "percent" ? ", spectral values in percent" : ""}.`,
  );
  return lines.join("\n") + "\n";
}

/**
 * Writes CGATS.17 text to a file (path relative to the notebook's folder); see `formatCgats`.
 *
 * @param path The file's path.
 * @param input What to write, as for `formatCgats`.
 * @source ANSI CGATS.17.
 * @example writeCgats("invented-lab.cgats.txt", { Lab: [{ L: 50, a: 20, b: -10 }] })
 */
export function writeCgats(path: string, input: CgatsWriteInput): void {
  checkPath("writeCgats", "path", path);
  checkWriteInput("writeCgats", input);
  writeDataFileText(path, cgatsText(input));
}
