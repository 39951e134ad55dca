/** The CIE 2006 LMS cone fundamentals (CIE 170-1:2006) for 2° and 10° fields, as plain tables with their source. */
import { CIE2006_LMS_10DEG_TABLE, CIE2006_LMS_2DEG_TABLE } from "../data/cie2006-lms.ts";
import type { TabulatedData } from "../data/tabulated-data.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkWith } from "../arguments/check-with.ts";

/** Cone spectral sensitivities l̄(λ), m̄(λ), s̄(λ) in terms of energy, each peaking near 1, on one regular grid. */
export interface ConeFundamentals {
  readonly kind: "cone fundamentals";
  /** Full name as a Methods section states it. */
  readonly name: string;
  /** Field size in degrees. */
  readonly fieldDegrees: 2 | 10;
  readonly start: number;
  readonly step: number;
  readonly wavelengths: readonly number[];
  readonly l: readonly number[];
  readonly m: readonly number[];
  readonly s: readonly number[];
}

function fromTable(name: string, fieldDegrees: 2 | 10, t: TabulatedData): ConeFundamentals {
  const l = t.columns.l!;
  return {
    kind: "cone fundamentals",
    name,
    fieldDegrees,
    start: t.start,
    step: t.step,
    wavelengths: l.map((_, i) => t.start + i * t.step),
    l,
    m: t.columns.m!,
    s: t.columns.s!,
  };
}

/** CIE 2006 LMS cone fundamentals, 2° field, energy units, 390–830 nm at 5 nm (CIE 170-1:2006 Table 6.7). */
export const CIE_2006_LMS_2_DEGREE: ConeFundamentals = fromTable(
  "CIE 2006 LMS cone fundamentals for a 2° field (CIE 170-1:2006, 5 nm table)",
  2,
  CIE2006_LMS_2DEG_TABLE,
);

/** CIE 2006 LMS cone fundamentals, 10° field, energy units, 390–830 nm at 5 nm (CIE 170-1:2006 Table 6.2). */
export const CIE_2006_LMS_10_DEGREE: ConeFundamentals = fromTable(
  "CIE 2006 LMS cone fundamentals for a 10° field (CIE 170-1:2006, 5 nm table)",
  10,
  CIE2006_LMS_10DEG_TABLE,
);

/** True for a cone-fundamentals object or a field-size name. */
export function isConeFundamentalsChoice(value: unknown): boolean {
  if (typeof value === "object" && value !== null)
    return (value as { kind?: unknown }).kind === "cone fundamentals";
  return value === 2 || value === 10 || value === "2°" || value === "10°" || value === "2" || value === "10";
}

/** The expected-value phrase for a cone-fundamentals argument. */
export const CONE_FUNDAMENTALS_CHOICE =
  'cone fundamentals: "2°", "10°", 2, 10, or a cone-fundamentals object';

/**
 * The CIE 2006 LMS cone fundamentals for a 2° or 10° field, or the cone-fundamentals object itself.
 *
 * @param which "2°", "2" or 2 for the 2° field; "10°", "10" or 10 for the 10° field; or a `ConeFundamentals` object, returned as it is. Default "2°".
 * @returns The `ConeFundamentals`: l̄, m̄, s̄ in energy units, 390–830 nm at 5 nm (s̄ is 0 above 615 nm, where CIE 170-1 leaves it blank).
 * @source CIE 170-1:2006 Tables 6.7 (2°) and 6.2 (10°); CIE datasets 10.25039/CIE.DS.tijidesg and 10.25039/CIE.DS.nxsqeri8.
 * @example coneFundamentals("10°").name
 */
export function coneFundamentals(
  which: "2°" | "10°" | "2" | "10" | 2 | 10 | ConeFundamentals = "2°",
): ConeFundamentals {
  checkWith("coneFundamentals", "which", which, CONE_FUNDAMENTALS_CHOICE, isConeFundamentalsChoice, {
    optional: true,
  });
  if (typeof which === "object") return which;
  return String(which).replace("°", "") === "10" ? CIE_2006_LMS_10_DEGREE : CIE_2006_LMS_2_DEGREE;
}

/**
 * The three cone fundamentals as spectra (for plots and spectral arithmetic), named "l̄", "m̄" and "s̄" with the field size.
 *
 * @param which The cone fundamentals ("2°", "10°" or an object); default "2°".
 * @returns [l̄, m̄, s̄] as `Spectrum` objects of quantity "other", 390–830 nm at 5 nm.
 * @source CIE 170-1:2006 (the tables).
 * @example coneFundamentalSpectra("2°")[0].name
 */
export function coneFundamentalSpectra(
  which: "2°" | "10°" | "2" | "10" | 2 | 10 | ConeFundamentals = "2°",
): [Spectrum, Spectrum, Spectrum] {
  checkWith("coneFundamentalSpectra", "which", which, CONE_FUNDAMENTALS_CHOICE, isConeFundamentalsChoice, {
    optional: true,
  });
  const f = coneFundamentals(which);
  const one = (values: readonly number[], bar: string) =>
    spectrum(f.wavelengths, values, { name: `${bar} ${f.fieldDegrees}° (CIE 2006)`, quantity: "other" });
  return [one(f.l, "l̄"), one(f.m, "m̄"), one(f.s, "s̄")];
}
