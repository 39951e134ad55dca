/** Resampling a spectrum onto new wavelengths, by the interpolation and extrapolation rules of sample.ts. */
import { gridWavelengths, type WavelengthGrid } from "./grid.ts";
import { sampler, type SamplingOptions } from "./sample.ts";
import { spectrum, type Spectrum } from "./spectrum.ts";

/** The spectrum read at every wavelength of a regular grid (CIE 167:2005 interpolation by default). */
export function resample(s: Spectrum, grid: WavelengthGrid, options: SamplingOptions = {}): Spectrum {
  return resampleAt(s, gridWavelengths(grid), options);
}

/** The spectrum read at the given wavelengths (strictly increasing). */
export function resampleAt(
  s: Spectrum,
  wavelengths: readonly number[],
  options: SamplingOptions = {},
): Spectrum {
  const read = sampler(s, options);
  return spectrum(wavelengths, wavelengths.map(read), { name: s.name, quantity: s.quantity, unit: s.unit });
}
