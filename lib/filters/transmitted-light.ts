/**
 * The light a filter passes from a given source: luminous transmittance τv (ISO/CIE 11664-3; CIE 015:2018 §7.1),
 * the chromaticity of the transmitted light (CIE 1931 xy, CIE 1976 u′v′), its dominant or complementary wavelength and
 * excitation purity relative to the source's own white (CIE 015:2018 §9.1–9.2), and the sunglass category that τv
 * implies (ISO 12312-1; informative only).
 */
import {
  chromaticityXy,
  uvPrimeFromXy,
  type Chromaticity,
  type Tristimulus,
  type UvPrime,
} from "../colorimetry/chromaticity.ts";
import { dominantWavelength } from "../colorimetry/dominant-wavelength.ts";
import { objectColour, type ObjectColourOptions } from "../colorimetry/tristimulus.ts";
import { luminousTransmittance } from "../photometry/photometric-quantities.ts";
import { SAFETY_DECISION_CAUTION } from "../photometry/safety-caution.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { requireFractionSpectrum } from "./checks.ts";
import { sunglassCategory, type SunglassCategory } from "./sunglass-category.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkTableOptions } from "../arguments/option-sets.ts";

export interface TransmittedLight {
  /** τv as a fraction: the source's luminous power passed, weighted by V(λ) (CIE 1931 2° ȳ). */
  readonly luminousTransmittance: number;
  /** X, Y, Z of the filter under the source (Y = 100 τv for the 2° observer). */
  readonly XYZ: Tristimulus;
  readonly xy: Chromaticity;
  readonly uvPrime: UvPrime;
  /** The source's own white (the perfect transmitter under it), against which dominant wavelength is judged. */
  readonly white: Chromaticity;
  /** Dominant wavelength in nm (or the complementary wavelength for purples); null for a colour at the white. */
  readonly dominantWavelength: number | null;
  readonly complementary: boolean;
  /** Excitation purity (CIE 015:2018 eq. 9.1); 0 for a colour at the white. */
  readonly purity: number;
  readonly illuminant: string;
  readonly notes: readonly string[];
  /** Always present: τv and the colour of transmitted light may be read for eye protection or signal lights (shown by the report). */
  readonly caution: string;
}

type LightOptions = Pick<ObjectColourOptions, "illuminant" | "observer" | "interval">;

/**
 * The light a filter passes from a source: τv, XYZ, xy, u′v′, and dominant wavelength and purity against the source's own white; with a safety caution.
 *
 * @param filter A transmittance spectrum, fractions 0–1.
 * @returns { luminousTransmittance (fraction), XYZ (Y = 100 τv), xy, uvPrime, white (xy), dominantWavelength (nm or null), complementary, purity, illuminant, notes, caution }.
 * @source ISO/CIE 11664-3 and CIE 015:2018 §7.1 (τv); CIE 015:2018 §9.1–9.2 (dominant wavelength, purity).
 * @example transmittedLight(bandPassFilter(590, 60, { edgeWidth: 10 }), { illuminant: "A" }).dominantWavelength
 */
export function transmittedLight(filter: Spectrum, options: LightOptions = {}): TransmittedLight {
  checkSpectrum("transmittedLight", "filter", filter, { what: "a transmittance spectrum (fractions 0–1)" });
  checkTableOptions("transmittedLight", options);
  if (filter?.kind !== "spectrum")
    throw new Error("transmittedLight: give the filter's transmittance spectrum");
  if (filter.quantity !== "transmittance" && filter.quantity !== "other") {
    throw new Error(
      `transmittedLight: "${filter.name}" is a ${filter.quantity} spectrum, not a transmittance`,
    );
  }
  requireFractionSpectrum(filter, "transmittance");
  const illuminant = options.illuminant ?? "D65";
  // The filter's colour and the source's own white from one weighting table (same grid, interval and range), and τv
  // on that interval too.
  const colour = objectColour(filter, { illuminant, observer: options.observer, interval: options.interval });
  const XYZ = colour.XYZ;
  // 10/20 nm data are summed with ASTM E2022 weights; τv is then Y/100 of those sums with the CIE 1931 observer (ȳ = V).
  const coarse = colour.interval === 10 || colour.interval === 20;
  const tv = coarse
    ? objectColour(filter, { illuminant, interval: colour.interval }).XYZ.Y / 100
    : luminousTransmittance(filter, { illuminant, interval: colour.interval as 1 | 5 });
  const notes: string[] = [];
  if (XYZ.X + XYZ.Y + XYZ.Z <= 0)
    throw new Error(
      `transmittedLight: "${filter.name}" passes no light of the source, so it has no chromaticity`,
    );
  const xy = chromaticityXy(XYZ);
  const white = chromaticityXy(colour.white);
  let dominant: number | null = null;
  let complementary = false;
  let purity = 0;
  if (Math.hypot(xy.x - white.x, xy.y - white.y) < 1e-7) {
    notes.push(
      "The transmitted light has the source's own chromaticity (a neutral filter): it has no dominant wavelength.",
    );
  } else {
    const d = dominantWavelength(xy, white, options.observer);
    dominant = d.wavelength;
    complementary = d.complementary;
    purity = d.purity;
  }
  return {
    luminousTransmittance: tv,
    XYZ,
    xy,
    uvPrime: uvPrimeFromXy(xy),
    white,
    dominantWavelength: dominant,
    complementary,
    purity,
    illuminant: typeof illuminant === "string" ? illuminant : illuminant.name,
    notes,
    caution: SAFETY_DECISION_CAUTION,
  };
}

/**
 * The sunglass category of a filter from its spectral transmittance: τv under D65 with the 2° observer, then `sunglassCategory` (informative only, with its caution).
 *
 * @param filter A transmittance spectrum, fractions 0–1.
 * @returns The `SunglassCategory` result with its caution.
 * @source ISO/CIE 11664-3 (τv); ISO 12312-1:2013 Table 1 (limits recalled from memory).
 * @example filterSunglassCategory(neutralDensityFilter(1)).category
 */
export function filterSunglassCategory(filter: Spectrum): SunglassCategory {
  checkSpectrum("filterSunglassCategory", "filter", filter, {
    what: "a transmittance spectrum (fractions 0–1)",
    instead: { number: "for a luminous transmittance use sunglassCategory" },
  });
  requireFractionSpectrum(filter, "transmittance");
  return sunglassCategory(luminousTransmittance(filter, { illuminant: "D65" }));
}
