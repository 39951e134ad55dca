/** CIE standard illuminant A from its defining formula (CIE 015:2018 eq. 4.1; ISO/CIE 11664-2:2022). */
import { gridWavelengths, type WavelengthGrid } from "../spectrum/grid.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { GRID_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";

/** S_A(λ) = 100 (560/λ)^5 (exp(1.435e7/(2848·560)) − 1) / (exp(1.435e7/(2848 λ)) − 1), λ in nm (CIE 015:2018 eq. 4.1). */
export function illuminantAValue(wavelengthNm: number): number {
  checkNumber("illuminantAValue", "wavelengthNm", wavelengthNm, { unit: "nm", above: 0 });
  const c2 = 1.435e7;
  return (
    100 * (560 / wavelengthNm) ** 5 * (Math.expm1(c2 / (2848 * 560)) / Math.expm1(c2 / (2848 * wavelengthNm)))
  );
}

/** CIE standard illuminant A on a grid (default 300–830 nm at 1 nm, the range of the CIE table). */
export function illuminantA(grid: WavelengthGrid = { start: 300, end: 830, step: 1 }): Spectrum {
  checkFields("illuminantA", "grid", grid, GRID_FIELDS);
  const w = gridWavelengths(grid);
  return spectrum(w, w.map(illuminantAValue), { name: "CIE illuminant A", quantity: "relative power" });
}
