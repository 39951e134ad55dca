/** CIE standard illuminant A from its defining formula (CIE 015:2018 eq. 4.1; ISO/CIE 11664-2:2022). */
import { gridWavelengths, type WavelengthGrid } from "../spectrum/grid.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { GRID_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";

/**
 * Relative spectral power of CIE standard illuminant A at one wavelength, from its defining formula.
 *
 * S_A(λ) = 100 (560 ÷ λ)⁵ (exp(1.435e7 ÷ (2848 · 560)) − 1) ÷ (exp(1.435e7 ÷ (2848 λ)) − 1), λ in nm.
 *
 * @param wavelengthNm The wavelength, in nm.
 * @returns S_A(λ), relative (100 at 560 nm).
 * @source CIE 015:2018 eq. 4.1; ISO/CIE 11664-2:2022.
 * @example illuminantAValue(560)
 */
export function illuminantAValue(wavelengthNm: number): number {
  checkNumber("illuminantAValue", "wavelengthNm", wavelengthNm, { unit: "nm", above: 0 });
  const c2 = 1.435e7;
  return (
    100 * (560 / wavelengthNm) ** 5 * (Math.expm1(c2 / (2848 * 560)) / Math.expm1(c2 / (2848 * wavelengthNm)))
  );
}

/**
 * CIE standard illuminant A on a wavelength grid, from its defining formula.
 *
 * @param grid Wavelengths { start, end, step } in nm; default 300–830 nm every 1 nm (the range of the CIE table).
 * @returns A "relative power" `Spectrum` named "CIE illuminant A" (100 at 560 nm).
 * @source CIE 015:2018 eq. 4.1; ISO/CIE 11664-2:2022.
 * @example illuminantA({ start: 380, end: 780, step: 5 })
 */
export function illuminantA(grid: WavelengthGrid = { start: 300, end: 830, step: 1 }): Spectrum {
  checkFields("illuminantA", "grid", grid, GRID_FIELDS);
  const w = gridWavelengths(grid);
  return spectrum(w, w.map(illuminantAValue), { name: "CIE illuminant A", quantity: "relative power" });
}
