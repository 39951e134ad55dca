/**
 * Recognising the columns of a table of colorimetric readings by their common spellings: sample identifier and
 * name, device values (RGB, CMYK), CIE XYZ, chromaticity x, y with Y, CIELAB L*, a*, b*, CIELCh L*, C*, h, and
 * spectral columns (a wavelength in the name). The CGATS.17 reserved field names (SAMPLE_ID, RGB_R, XYZ_X, XYY_X,
 * LAB_L, LCH_C, SPECTRAL_NM380 …) are among the spellings. A unit in brackets after the name, "X (cd/m²)", is kept.
 */
import { unitFromValues, wavelengthFromHeader } from "./wavelength-text.ts";

/** What a column of readings holds. */
export type ReadingGroup =
  "sample id" | "sample name" | "RGB" | "CMYK" | "XYZ" | "xyY" | "Lab" | "LCh" | "spectral" | "other";

/** Every group a column of readings can belong to. */
export const READING_GROUPS: readonly ReadingGroup[] = [
  "sample id",
  "sample name",
  "RGB",
  "CMYK",
  "XYZ",
  "xyY",
  "Lab",
  "LCh",
  "spectral",
  "other",
];

export interface ReadingField {
  /** The column's name as written. */
  readonly name: string;
  readonly group: ReadingGroup;
  /** The component within the group, e.g. "X", "L", "C", "h"; the wavelength (nm) as text for spectral fields. */
  readonly component: string;
  readonly type: "number" | "text";
  /** The unit: from the heading, from the caller, or the quantity's convention ("" for dimensionless). */
  unit: string;
  /** Where the unit came from. */
  unitSource: "heading" | "option" | "convention" | "not stated";
  /** For spectral fields, the wavelength in nm. */
  readonly wavelength?: number;
}

type Key = { group: ReadingGroup; component: string };

// Spellings compared after lower-casing and removing spaces, "_", "-", "*" and "°"; single letters are resolved
// by the columns around them (see recogniseFields).
const NAMED: Record<string, Key> = {};
function spell(group: ReadingGroup, component: string, ...names: string[]): void {
  for (const n of names) NAMED[n] = { group, component };
}
spell("sample id", "id", "sampleid", "id", "no", "no.", "nr", "number", "patchid", "index", "sampleno");
spell("sample name", "name", "samplename", "name", "patch", "patchname", "sample", "label", "specimen");
spell("RGB", "R", "rgbr", "red", "dr");
spell("RGB", "G", "rgbg", "green", "dg");
spell("RGB", "B", "rgbb", "blue", "db");
spell("CMYK", "C", "cmykc", "cyan");
spell("CMYK", "M", "cmykm", "magenta");
spell("CMYK", "Y", "cmyky", "yellow");
spell("CMYK", "K", "cmykk", "black", "key");
spell("XYZ", "X", "xyzx", "ciex");
spell("XYZ", "Y", "xyzy", "ciey");
spell("XYZ", "Z", "xyzz", "ciez");
spell("xyY", "x", "xyyx", "chromaticityx");
spell("xyY", "y", "xyyy", "chromaticityy");
spell("xyY", "Y", "xyycapy");
spell("Lab", "L", "labl", "ciel", "lab_l");
spell("Lab", "a", "laba", "ciea");
spell("Lab", "b", "labb", "cieb");
spell("LCh", "L", "lchl");
spell("LCh", "C", "lchc", "cab", "chroma");
spell("LCh", "h", "lchh", "hab", "hue", "hueangle");

const UNIT_IN_NAME = /^(.*?)\s*[([]\s*([^)\]]*?)\s*[)\]]\s*$/;

function squash(name: string): string {
  return name.toLowerCase().replace(/[\s_\-*°]/g, "");
}

/** Conventional units where a column does not name one (CIE 015: L*, a*, b*, C*, x, y are dimensionless; hue in degrees). */
const CONVENTION: Partial<Record<string, string>> = {
  "LCh h": "°",
  "Lab L": "",
  "Lab a": "",
  "Lab b": "",
  "LCh L": "",
  "LCh C": "",
  "xyY x": "",
  "xyY y": "",
};

/** The fields of a header row (or CGATS data format), recognised; `units` are the caller's units per group. */
export function recogniseFields(
  names: readonly string[],
  units: Readonly<Partial<Record<ReadingGroup, string>>> = {},
): ReadingField[] {
  const parts = names.map((raw) => {
    const m = UNIT_IN_NAME.exec(raw.trim());
    return { raw, base: (m ? m[1]! : raw).trim(), unit: m ? m[2]! : undefined };
  });
  const keys: (Key | undefined)[] = parts.map((p) => NAMED[squash(p.base)]);
  // "a*", "b*", "L*", "C*" with their star, and single letters by their neighbours.
  const single = new Map<string, number>();
  parts.forEach((p, i) => {
    if (keys[i]) return;
    const b = p.base
      .replace(/^CIE\s*/i, "")
      .replace(/\*$/, "")
      .trim();
    if (b.length === 1 && !single.has(b)) single.set(b, i);
  });
  const has = (...letters: string[]) => letters.every((l) => single.has(l));
  const take = (letter: string, group: ReadingGroup, component: string) => {
    const i = single.get(letter);
    if (i !== undefined && !keys[i]) keys[i] = { group, component };
  };
  if (has("C", "M", "Y", "K")) for (const l of ["C", "M", "Y", "K"]) take(l, "CMYK", l);
  if (has("X", "Y", "Z")) for (const l of ["X", "Y", "Z"]) take(l, "XYZ", l);
  if (has("x", "y")) {
    take("x", "xyY", "x");
    take("y", "xyY", "y");
    take("Y", "xyY", "Y");
  }
  if (has("R", "G", "B")) for (const l of ["R", "G", "B"]) take(l, "RGB", l);
  const L = single.has("L") ? "L" : single.has("l") ? "l" : undefined;
  if (L && (has("a", "b") || has("A", "B"))) {
    take(L, "Lab", "L");
    take(single.has("a") ? "a" : "A", "Lab", "a");
    take(single.has("b") ? "b" : "B", "Lab", "b");
  }
  if (
    L &&
    has("C") &&
    (single.has("h") || single.has("H") || keys.some((k) => k?.group === "LCh" && k.component === "h"))
  ) {
    take(L, "LCh", "L");
    take("C", "LCh", "C");
    if (single.has("h") || single.has("H")) take(single.has("h") ? "h" : "H", "LCh", "h");
  }
  if (has("r", "g", "b") && !keys[single.get("b")!])
    for (const l of ["r", "g", "b"]) take(l, "RGB", l.toUpperCase());
  // Spectral columns: a wavelength in the name, all in one unit.
  const spectral = parts.map((p, i) => (keys[i] ? undefined : wavelengthFromHeader(p.base)));
  const wls = spectral.filter((w) => w !== undefined).map((w) => w.value);
  const wlUnit = wls.length
    ? (spectral.find((w) => w?.unit)?.unit ?? unitFromValues(Math.min(...wls), Math.max(...wls)))
    : undefined;
  return parts.map((p, i) => {
    const key = keys[i];
    const w = spectral[i];
    const group: ReadingGroup = key ? key.group : w && wlUnit && wls.length >= 2 ? "spectral" : "other";
    const component = key ? key.component : group === "spectral" ? String(w!.value) : p.raw;
    const type = group === "sample id" || group === "sample name" ? "text" : "number";
    let unit = "";
    let unitSource: ReadingField["unitSource"] = "not stated";
    const conventional = CONVENTION[`${group} ${component}`];
    if (p.unit !== undefined) [unit, unitSource] = [p.unit, "heading"];
    else if (units[group] !== undefined) [unit, unitSource] = [units[group]!, "option"];
    else if (conventional !== undefined) [unit, unitSource] = [conventional, "convention"];
    else if (group === "sample id" || group === "sample name") unitSource = "convention";
    const field: ReadingField = {
      name: p.raw,
      group,
      component,
      type,
      unit,
      unitSource,
      ...(group === "spectral"
        ? { wavelength: wlUnit === "µm" ? Math.round(w!.value * 1e6) / 1e3 : w!.value }
        : {}),
    };
    return field;
  });
}
