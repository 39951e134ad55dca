/** Optical density (decadic absorbance of a filter), D = −log₁₀ T, and back, T = 10^−D (ISO 5-1 transmission density). */
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { requireFinite, requireFraction } from "./checks.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";

/**
 * Optical density (decadic), D = −log₁₀ T, of a transmittance; zero transmittance is an error. For a spectrum use `opticalDensitySpectrum`.
 *
 * @param transmittance The transmittance T, a fraction, above 0 and at most 1.
 * @returns D, dimensionless (0 for T = 1).
 * @source ISO 5-1 (transmission density).
 * @example opticalDensity(0.01)
 */
export function opticalDensity(transmittance: number): number {
  checkNumber("opticalDensity", "transmittance", transmittance, {
    unit: "fraction",
    instead: { spectrum: "for a spectrum use opticalDensitySpectrum" },
  });
  requireFraction(transmittance, "transmittance");
  if (transmittance === 0)
    throw new Error(
      "transmittance 0 has infinite optical density; give a small positive floor for blocked bands",
    );
  return -Math.log10(transmittance);
}

/**
 * Transmittance from an optical density, T = 10^−D.
 *
 * @param density The optical density D, 0 or more.
 * @returns T, a fraction.
 * @source ISO 5-1 (transmission density), inverted.
 * @example transmittanceFromDensity(2)
 */
export function transmittanceFromDensity(density: number): number {
  checkNumber("transmittanceFromDensity", "density", density, {
    unit: "optical density",
    min: 0,
    instead: { spectrum: "for a spectrum use transmittanceFromDensitySpectrum" },
  });
  requireFinite(density, "optical density");
  if (density < 0)
    throw new Error(`optical density ${density} is negative, i.e. a transmittance above 1; check the data`);
  return 10 ** -density;
}

/**
 * Optical density at each wavelength, D(λ) = −log₁₀ T(λ); a zero transmittance is an error naming its wavelength.
 *
 * @param transmittance A transmittance spectrum, fractions above 0.
 * @returns An "optical density" `Spectrum` with the same name.
 * @source ISO 5-1 (transmission density).
 * @example opticalDensitySpectrum(spectrumOnGrid(400, 100, [0.5, 0.1, 0.01]))
 */
export function opticalDensitySpectrum(transmittance: Spectrum): Spectrum {
  checkSpectrum("opticalDensitySpectrum", "transmittance", transmittance, {
    what: "a transmittance spectrum (fractions 0–1)",
    instead: { number: "for a single value use opticalDensity" },
  });
  noteMethod("optics", "Optical densities were computed as decadic densities, D = −log₁₀ T.");
  const values = transmittance.values.map((t, i) => {
    try {
      return opticalDensity(t);
    } catch (e) {
      throw new Error(
        `"${transmittance.name}" at ${transmittance.wavelengths[i]} nm: ${(e as Error).message}`,
      );
    }
  });
  return spectrum(transmittance.wavelengths, values, {
    name: transmittance.name,
    quantity: "optical density",
  });
}

/**
 * Transmittance at each wavelength from an optical density spectrum, T(λ) = 10^−D(λ).
 *
 * @param density An optical density spectrum, values 0 or more.
 * @returns A "transmittance" `Spectrum` with the same name.
 * @source ISO 5-1 (transmission density), inverted.
 * @example transmittanceFromDensitySpectrum(spectrumOnGrid(400, 100, [0.3, 1, 2]))
 */
export function transmittanceFromDensitySpectrum(density: Spectrum): Spectrum {
  checkSpectrum("transmittanceFromDensitySpectrum", "density", density, {
    what: "an optical density spectrum",
    instead: { number: "for a single value use transmittanceFromDensity" },
  });
  noteMethod("optics", "Optical densities were computed as decadic densities, D = −log₁₀ T.");
  const values = density.values.map((d, i) => {
    try {
      return transmittanceFromDensity(d);
    } catch (e) {
      throw new Error(`"${density.name}" at ${density.wavelengths[i]} nm: ${(e as Error).message}`);
    }
  });
  return spectrum(density.wavelengths, values, { name: density.name, quantity: "transmittance" });
}
