/** Additive mixing of lights: the spectrum of several sources on one surface is the sum of their spectra times their drive levels (Grassmann's laws, CIE 015:2018 §7). */
import { requireNonNegative, requireSameGrid } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkList } from "../arguments/check-list.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkString } from "../arguments/check-text.ts";

/** One light in a mixture and its drive level (a multiplier of its spectrum, e.g. 0–1 of full output). */
export interface LightPart {
  readonly light: Spectrum;
  readonly level: number;
}

/**
 * The spectrum of lights added together, Σ levelᵢ·Sᵢ(λ) (additivity of radiant power).
 *
 * @param parts [{ light: a light's spectrum, level: its drive level, a multiplier 0 or more }, ...], all on the same wavelengths; filters are refused (they multiply).
 * @param name The mixture's name; default "<level>×<light> + …".
 * @returns A `Spectrum` with the first light's quantity and unit.
 * @source Grassmann's laws; CIE 015:2018 §7.
 * @example mixLights([{ light: ledSpectrum({ peak: 450, fwhm: 20 }), level: 0.4 }, { light: ledSpectrum({ peak: 590, fwhm: 15 }), level: 1 }])
 */
export function mixLights(parts: readonly LightPart[], name?: string): Spectrum {
  checkList(
    "mixLights",
    "parts",
    parts,
    "parts { light: spectrum, level: number }",
    (p) =>
      typeof p === "object" &&
      p !== null &&
      isWellFormedSpectrum((p as { light?: unknown }).light) &&
      Number.isFinite((p as { level?: unknown }).level),
    { minLength: 1 },
  );
  checkString("mixLights", "name", name, { optional: true });
  if (!Array.isArray(parts) || parts.length === 0) throw new Error("mixLights: no lights to mix");
  parts.forEach((p, i) => {
    if (p?.light?.kind !== "spectrum") throw new Error(`mixLights: part #${i + 1} has no light spectrum`);
    requireNonNegative(p.level, `mixLights: the drive level of "${p.light.name}"`);
    if (p.light.quantity === "transmittance" || p.light.quantity === "reflectance") {
      throw new Error(
        `mixLights: "${p.light.name}" is a ${p.light.quantity}, not a light; lights are added, filters multiply`,
      );
    }
  });
  const lights = parts.map((p) => p.light);
  requireSameGrid(lights, "mixLights");
  noteMethod(
    "mixing",
    "Lights were mixed additively: the mixture's spectrum is the sum of the sources' spectra times their drive levels.",
  );
  const first = lights[0]!;
  const values = first.wavelengths.map((_: number, i: number): number =>
    parts.reduce((sum, p) => sum + p.level * p.light.values[i]!, 0),
  );
  return spectrum(first.wavelengths, values, {
    name: name ?? parts.map((p) => `${+p.level.toPrecision(4)}×${p.light.name}`).join(" + "),
    quantity: first.quantity,
    unit: first.unit,
  });
}
