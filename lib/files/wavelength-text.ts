/**
 * Wavelengths as instruments write them: a header cell such as "380", "380 nm", "380nm", "nm380", "R380",
 * "SPECTRAL_NM380" or "0.38 µm", and the unit (nm or µm) named in a header or decided from the values' size.
 */

export type WavelengthUnit = "nm" | "µm";

// A letter prefix is joined to the number ("nm380", "R380", "SPECTRAL_NM380"), never spaced: "Tile 2" is a name.
const CELL = /^[A-Za-zλ_%]*?_?(\d+(?:[.,]\d+)?)\s*(nm|µm|μm|um)?$/i;

/** The wavelength a header cell names, with its unit when the cell says it, or undefined. */
export function wavelengthFromHeader(
  cell: string,
): { value: number; unit: WavelengthUnit | undefined } | undefined {
  const m = CELL.exec(cell.trim());
  if (!m) return undefined;
  const value = Number(m[1]!.replace(",", "."));
  const u = m[2]?.toLowerCase();
  return { value, unit: u === undefined ? undefined : u === "nm" ? "nm" : "µm" };
}

/** The unit a column heading names ("λ (nm)", "Wavelength [µm]", "um"), or undefined. */
export function unitFromHeading(text: string): WavelengthUnit | undefined {
  if (/µm|μm|\bum\b|micron|micrometre|micrometer/i.test(text)) return "µm";
  if (/nm|nanomet/i.test(text)) return "nm";
  return undefined;
}

/** Plausible wavelengths: 100 nm to 100 000 nm (deep UV to far IR), i.e. 0.1 µm to 100 µm (common practice, no source). */
export const PLAUSIBLE_NM: readonly [number, number] = [100, 100000];

/** The unit the values' size points to: below 100 they are read as µm, otherwise nm; undefined when neither fits. */
export function unitFromValues(min: number, max: number): WavelengthUnit | undefined {
  if (min >= PLAUSIBLE_NM[0] && max <= PLAUSIBLE_NM[1]) return "nm";
  if (min >= PLAUSIBLE_NM[0] / 1000 && max < PLAUSIBLE_NM[0]) return "µm";
  return undefined;
}
