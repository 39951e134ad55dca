/** Planck's law for a blackbody (Planckian radiator), with the radiation constants CIE 015:2018 §4.1 uses. */
import { gridWavelengths, type WavelengthGrid } from "../spectrum/grid.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { noteMethod } from "../methods/method-log.ts";
import { GRID_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";

/** First radiation constant c1 = 2πhc² = 3.741771852e-16 W·m² (CODATA 2018). */
export const C1 = 3.741771852e-16;
/** Second radiation constant c2 = hc/k = 1.438776877e-2 m·K (CODATA 2018; CIE 015:2018 uses c2 = 1.4388e-2 m·K). */
export const C2 = 1.438776877e-2;
/** c2 = 1.4388e-2 m·K, the value CIE 015:2018 specifies for the Planckian locus and colour temperature. */
export const C2_CIE = 1.4388e-2;

/**
 * Spectral radiant exitance of a blackbody (Planckian radiator) by Planck's law, M(λ, T) = c1 ÷ (λ⁵ (exp(c2 ÷ λT) − 1)).
 *
 * @param wavelengthNm The wavelength, in nm (positive).
 * @param temperatureK The temperature, in K (positive).
 * @param c2 The second radiation constant, in m·K; default `C2_CIE` = 1.4388e-2 (pass `C2` for the CODATA 2018 value).
 * @returns M(λ, T) in W·m⁻²·m⁻¹ (per metre of wavelength), with c1 = 3.741771852e-16 W·m².
 * @source Planck's law with the radiation constants of CIE 015:2018 §4.1 (c2) and CODATA 2018 (c1).
 * @example planckExitance(560, 2856)
 */
export function planckExitance(wavelengthNm: number, temperatureK: number, c2 = C2_CIE): number {
  checkNumber("planckExitance", "wavelengthNm", wavelengthNm, { unit: "nm", above: 0 });
  checkNumber("planckExitance", "temperatureK", temperatureK, { unit: "K", above: 0 });
  checkNumber("planckExitance", "c2", c2, { unit: "m·K", above: 0 });
  if (!(temperatureK > 0) || !Number.isFinite(temperatureK))
    throw new Error(`Planck's law: temperature ${temperatureK} K must be a positive finite number`);
  if (!(wavelengthNm > 0)) throw new Error(`Planck's law: wavelength ${wavelengthNm} nm must be positive`);
  const l = wavelengthNm * 1e-9;
  return C1 / (l ** 5 * Math.expm1(c2 / (l * temperatureK)));
}

/**
 * Relative spectral power of a Planckian radiator at T kelvin, scaled to 100 at 560 nm.
 *
 * @param temperatureK The temperature, in K (positive).
 * @param grid Wavelengths { start, end, step } in nm; default 360–830 nm every 1 nm.
 * @param c2 The second radiation constant, in m·K; default `C2_CIE` = 1.4388e-2.
 * @returns A "relative power" `Spectrum` named "Planckian radiator T K".
 * @source CIE 015:2018 §4.1 (Planck's law, c2 = 1.4388e-2 m·K).
 * @example planckianSpectrum(3000, { start: 380, end: 780, step: 5 })
 */
export function planckianSpectrum(
  temperatureK: number,
  grid: WavelengthGrid = { start: 360, end: 830, step: 1 },
  c2 = C2_CIE,
): Spectrum {
  checkNumber("planckianSpectrum", "temperatureK", temperatureK, { unit: "K", above: 0 });
  checkFields("planckianSpectrum", "grid", grid, GRID_FIELDS);
  checkNumber("planckianSpectrum", "c2", c2, { unit: "m·K", above: 0 });
  const ref = planckExitance(560, temperatureK, c2);
  const w = gridWavelengths(grid);
  noteMethod("illuminant", `Planckian radiators were computed from Planck's law with c2 = ${c2} m·K.`);
  return spectrum(
    w,
    w.map((l) => (100 * planckExitance(l, temperatureK, c2)) / ref),
    {
      name: `Planckian radiator ${temperatureK} K`,
      quantity: "relative power",
    },
  );
}
