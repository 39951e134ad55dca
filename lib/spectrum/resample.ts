/** Resampling a spectrum onto new wavelengths, by the interpolation and extrapolation rules of sample.ts. */
import { gridWavelengths, type WavelengthGrid } from "./grid.ts";
import { sampler, type SamplingOptions } from "./sample.ts";
import { spectrum, type Spectrum } from "./spectrum.ts";
import { GRID_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumberList } from "../arguments/check-list.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkSampling } from "../arguments/common-arguments.ts";

/**
 * The spectrum read at every wavelength of a regular grid (Sprague interpolation for even data by default).
 *
 * @param s A spectrum.
 * @param grid The target grid { start, end, step } in nm.
 * @returns A new `Spectrum` on the grid, with the same name, quantity and unit.
 * @source CIE 167:2005 (interpolation); CIE 015:2018 §7.2.2 (extrapolation).
 * @example resample(spectrumOnGrid(400, 10, [1, 2, 3, 4, 5, 6]), { start: 400, end: 450, step: 5 })
 */
export function resample(s: Spectrum, grid: WavelengthGrid, options: SamplingOptions = {}): Spectrum {
  checkSpectrum("resample", "s", s);
  checkFields("resample", "grid", grid, {
    ...GRID_FIELDS,
    instead: { array: "for a list of wavelengths use resampleAt" },
  });
  checkSampling("resample", "options", options);
  return resampleAt(s, gridWavelengths(grid), options);
}

/**
 * The spectrum read at the given wavelengths.
 *
 * @param s A spectrum.
 * @param wavelengths The target wavelengths in nm, strictly increasing.
 * @returns A new `Spectrum` at those wavelengths, with the same name, quantity and unit.
 * @source CIE 167:2005 (interpolation); CIE 015:2018 §7.2.2 (extrapolation).
 * @example resampleAt(spectrumOnGrid(400, 10, [1, 2, 3]), [405, 415])
 */
export function resampleAt(
  s: Spectrum,
  wavelengths: readonly number[],
  options: SamplingOptions = {},
): Spectrum {
  checkSpectrum("resampleAt", "s", s);
  checkNumberList("resampleAt", "wavelengths", wavelengths, {
    unit: "nm",
    minLength: 1,
    instead: { object: "for a grid { start, end, step } use resample" },
  });
  checkSampling("resampleAt", "options", options);
  const read = sampler(s, options);
  return spectrum(wavelengths, wavelengths.map(read), { name: s.name, quantity: s.quantity, unit: s.unit });
}
