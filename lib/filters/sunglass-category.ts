/**
 * The filter category of a sunglass-type filter from its luminous transmittance τv (D65, CIE 1931 2° observer), after
 * the category table of ISO 12312-1:2013 (Table 1): 0 above 80 % up to 100 %, 1 above 43 % to 80 %, 2 above 18 % to
 * 43 %, 3 above 8 % to 18 %, 4 above 3 % to 8 % (limits recalled from memory). Informative only: the result always
 * carries a caution, because eye protection is decided by the standard and accredited testing, never by this tool.
 */
import { noteMethod } from "../methods/method-log.ts";
import { requireFraction } from "./checks.ts";
import { checkNumber } from "../arguments/check-number.ts";

/** The caution every sunglass-category result carries, for the report to show beside it. */
export const EYE_PROTECTION_CAUTION =
  "Informative only: tristim does not certify eye protection. A filter's category and its fitness as sunglasses are decided by ISO 12312-1 (with its tolerances and its further requirements, e.g. ultraviolet transmittance and traffic-signal recognition), local regulations, and testing by an accredited laboratory.";

export type SunglassCategoryNumber = 0 | 1 | 2 | 3 | 4;

export interface SunglassCategory {
  /** The category 0–4, or null when τv is at or below 3 %, outside the table. */
  readonly category: SunglassCategoryNumber | null;
  /** The luminous transmittance it was judged from, as a fraction. */
  readonly luminousTransmittance: number;
  /** The category's τv range as fractions: above `above`, up to and including `upTo`. */
  readonly range: { readonly above: number; readonly upTo: number } | null;
  /** A plain description of the tint. */
  readonly description: string;
  /** Use notes tied to τv (driving), as the standard states them (recalled from memory). */
  readonly notes: readonly string[];
  readonly basis: string;
  /** Always present: the tool does not certify eye protection. */
  readonly caution: string;
}

/** ISO 12312-1:2013 Table 1 limits as fractions (recalled from memory): category k covers (above, upTo]. */
export const SUNGLASS_CATEGORY_LIMITS: ReadonlyArray<{
  category: SunglassCategoryNumber;
  above: number;
  upTo: number;
  description: string;
}> = [
  { category: 0, above: 0.8, upTo: 1, description: "clear or very light tint" },
  { category: 1, above: 0.43, upTo: 0.8, description: "light tint" },
  { category: 2, above: 0.18, upTo: 0.43, description: "medium tint" },
  { category: 3, above: 0.08, upTo: 0.18, description: "dark tint" },
  { category: 4, above: 0.03, upTo: 0.08, description: "very dark tint" },
];

/**
 * The filter category 0–4 of a sunglass-type filter from its luminous transmittance (informative only: the result always carries a caution).
 *
 * Limits (as fractions, category k covers above … up to): 0: 0.80–1, 1: 0.43–0.80, 2: 0.18–0.43, 3: 0.08–0.18,
 * 4: 0.03–0.08; at or below 0.03 the category is null. Eye protection is decided by the standard and accredited
 * testing, never by this tool.
 *
 * @param luminousTransmittance τv (D65, CIE 1931 2° observer), a fraction 0–1.
 * @returns { category (0–4 or null), luminousTransmittance, range, description, notes, basis, caution }.
 * @source ISO 12312-1:2013 Table 1 (limits recalled from memory, not transcribed from the standard).
 * @example sunglassCategory(0.12).category
 */
export function sunglassCategory(luminousTransmittance: number): SunglassCategory {
  checkNumber("sunglassCategory", "luminousTransmittance", luminousTransmittance, {
    unit: "fraction",
    instead: { spectrum: "for a transmittance spectrum use filterSunglassCategory" },
  });
  const tv = requireFraction(luminousTransmittance, "luminous transmittance τv");
  noteMethod(
    "optics",
    "Sunglass-type filter categories were assigned from the luminous transmittance (CIE illuminant D65, CIE 1931 observer) by the category limits of ISO 12312-1:2013, Table 1.",
    // The limits and notes are recalled from memory, not transcribed from the standard (see SUNGLASS_CATEGORY_LIMITS and
    // test/lib/physics/filters.test.ts); a report states only the standard and its table, and the caution defers to it.
  );
  const row = SUNGLASS_CATEGORY_LIMITS.find((r) => tv > r.above && tv <= r.upTo);
  const notes: string[] = [];
  if (row?.category === 4)
    notes.push("Category 4 filters are not suitable for driving or road use (ISO 12312-1:2013, Table 1).");
  if (tv < 0.75)
    notes.push(
      "Filters with τv below 75 % are not suitable for twilight or night driving (ISO 12312-1:2013, requirements for road use).",
    );
  if (!row)
    notes.push(
      "τv is at or below 3 %, outside the categories of the ISO 12312-1 table (not a general-purpose sunglass filter).",
    );
  return {
    category: row?.category ?? null,
    luminousTransmittance: tv,
    range: row ? { above: row.above, upTo: row.upTo } : null,
    description: row?.description ?? "outside the sunglass categories",
    notes,
    basis: "ISO 12312-1:2013 Table 1 category limits on luminous transmittance (D65, CIE 1931 2° observer)",
    caution: EYE_PROTECTION_CAUTION,
  };
}
