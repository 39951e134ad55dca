/**
 * Writing the CGATS.17 text exchange format: identifier line, header keywords (ORIGINATOR, DESCRIPTOR, CREATED, ...;
 * other keywords declared with KEYWORD first), the data format (SAMPLE_ID, SAMPLE_NAME, spectral SPECTRAL_NMxxx
 * fields, XYZ_X/Y/Z, LAB_L/A/B) and one tab-separated set per line.
 */
import { writeFileSync } from "node:fs";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import type { Lab } from "../colorimetry/cielab.ts";
import { requireSameGrid } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
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

function quote(value: string, what: string): string {
  if (/["\r\n]/.test(value))
    throw new Error(
      `formatCgats: ${what} ${JSON.stringify(value)} contains a double quote or line break, which CGATS text cannot hold`,
    );
  return `"${value}"`;
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
  const counts = [
    ["spectra", input.spectra?.length],
    ["XYZ", input.XYZ?.length],
    ["Lab", input.Lab?.length],
    ["sampleIds", input.sampleIds?.length],
    ["sampleNames", input.sampleNames?.length],
  ].filter(([, n]) => n !== undefined) as [string, number][];
  const measured = counts.filter(([k]) => k === "spectra" || k === "XYZ" || k === "Lab");
  if (measured.length === 0) throw new Error("formatCgats: nothing to write; give spectra, XYZ and/or Lab");
  const n = counts[0]![1];
  const odd = counts.find(([, c]) => c !== n);
  if (odd)
    throw new Error(
      `formatCgats: ${counts.map(([k, c]) => `${c} ${k}`).join(", ")} — every list must have one entry per sample`,
    );
  if (n === 0) throw new Error("formatCgats: no samples to write");
  const digits = input.digits ?? 6;
  if (!Number.isInteger(digits) || digits < 1 || digits > 17)
    throw new Error(`formatCgats: digits ${digits} must be a whole number from 1 to 17`);
  const scale = input.scale ?? "fraction";
  if (scale !== "fraction" && scale !== "percent")
    throw new Error(`formatCgats: scale "${String(scale)}" is not "fraction" or "percent"`);
  const spectra = input.spectra ?? [];
  if (spectra.length > 0) requireSameGrid(spectra, "formatCgats");
  if (scale === "percent") {
    const other = spectra.find((s) => s.quantity !== "reflectance" && s.quantity !== "transmittance");
    if (other)
      throw new Error(
        `formatCgats: "${other.name}" is a ${other.quantity} spectrum; only reflectance and transmittance can be written in percent`,
      );
  }
  const factor = scale === "percent" ? 100 : 1;
  const ids = input.sampleIds ?? Array.from({ length: n }, (_, i) => i + 1);
  const idText = ids.map((id) => {
    if (typeof id === "number") {
      if (!Number.isFinite(id))
        throw new Error(`formatCgats: sample identifier ${id} is not a finite number`);
      return String(id);
    }
    return quote(String(id), "sample identifier");
  });
  if (new Set(ids.map(String)).size !== ids.length)
    throw new Error("formatCgats: sample identifiers must be unique");

  const fields = ["SAMPLE_ID"];
  if (input.sampleNames) fields.push("SAMPLE_NAME");
  const wl = spectra[0]?.wavelengths ?? [];
  for (const w of wl) fields.push(`SPECTRAL_NM${writeNumber(w, ".", 10)}`);
  if (input.XYZ) fields.push("XYZ_X", "XYZ_Y", "XYZ_Z");
  if (input.Lab) fields.push("LAB_L", "LAB_A", "LAB_B");

  const lines: string[] = [input.identifier ?? "CGATS.17"];
  if (!/^\S+$/.test(lines[0]!))
    throw new Error(`formatCgats: identifier ${JSON.stringify(lines[0])} must be one word`);
  const keywords = input.keywords ?? {};
  for (const [key, value] of Object.entries(keywords)) {
    if (!/^[A-Z][A-Z0-9_]*$/.test(key))
      throw new Error(
        `formatCgats: keyword ${JSON.stringify(key)} must be upper-case letters, digits and underscores`,
      );
    if (/^(NUMBER_OF_|BEGIN_|END_|KEYWORD$)/.test(key))
      throw new Error(`formatCgats: keyword ${key} is written by the writer itself`);
    if (!(CGATS_STANDARD_KEYWORDS as readonly string[]).includes(key)) lines.push(`KEYWORD\t"${key}"`);
    lines.push(
      `${key}\t${typeof value === "number" ? writeNumber(value, ".", 12) : quote(String(value), `keyword ${key}`)}`,
    );
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
    if (input.sampleNames) row.push(quote(input.sampleNames[i]!, "sample name"));
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
  writeFileSync(path, formatCgats(input), "utf8");
}
