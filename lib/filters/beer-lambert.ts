/**
 * Beer–Lambert (Bouguer–Lambert–Beer) scaling of internal transmittance: absorbance is proportional to path length
 * and concentration, so τᵢ at thickness d₂ and concentration c₂ is τᵢ(d₁, c₁)^((d₂c₂)/(d₁c₁)) (IUPAC Gold Book,
 * "Beer–Lambert law"). Only internal transmittance scales this way; surface reflections do not.
 */
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { requireFraction, requireFractionSpectrum, requireNonNegative, requirePositive } from "./checks.ts";
import { externalTransmittance, internalTransmittance, type PlateOptions } from "./plate.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkString } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkPathChange, checkPlateOptions, isPathChange } from "../arguments/physics-arguments.ts";

/**
 * Internal transmittance raised to a Beer–Lambert path ratio, τᵢ′ = τᵢ^ratio.
 *
 * @param internal The internal transmittance τᵢ, a fraction 0–1.
 * @param ratio The ratio (new thickness × concentration) ÷ (old), 0 or more.
 * @returns τᵢ′, a fraction.
 * @source IUPAC Gold Book, "Beer–Lambert law".
 * @example scaleInternalValue(0.5, 2)
 */
export function scaleInternalValue(internal: number, ratio: number): number {
  checkNumber("scaleInternalValue", "internal", internal, {
    unit: "fraction",
    instead: { spectrum: "for a spectrum use scaleInternalTransmittance" },
  });
  checkNumber("scaleInternalValue", "ratio", ratio, { min: 0, unit: "path-length ratio" });
  requireFraction(internal, "internal transmittance");
  requireNonNegative(ratio, "Beer–Lambert path ratio");
  return internal ** ratio;
}

/** From-and-to values of the thickness and/or concentration; a missing pair counts as unchanged. */
export interface PathChange {
  /** [from, to] thickness in any one unit, e.g. [2, 3] mm. */
  thickness?: readonly [number, number];
  /** [from, to] concentration in any one unit. */
  concentration?: readonly [number, number];
}

/**
 * The Beer–Lambert ratio (d₂ ÷ d₁)·(c₂ ÷ c₁) of a change of thickness and/or concentration.
 *
 * @param change { thickness?: [from, to], concentration?: [from, to] }, each pair in one unit of your choice; at least one pair; a missing pair counts as unchanged.
 * @returns The ratio, dimensionless.
 * @source IUPAC Gold Book, "Beer–Lambert law".
 * @example pathRatio({ thickness: [2, 3] })
 */
export function pathRatio(change: PathChange): number {
  checkPathChange("pathRatio", "change", change);
  let ratio = 1;
  for (const key of ["thickness", "concentration"] as const) {
    const pair = change[key];
    if (pair === undefined) continue;
    if (!Array.isArray(pair) || pair.length !== 2)
      throw new Error(`${key} must be a [from, to] pair, got ${JSON.stringify(pair)}`);
    const from = requirePositive(pair[0], `${key} (from)`);
    const to = requireNonNegative(pair[1], `${key} (to)`);
    ratio *= to / from;
  }
  if (change.thickness === undefined && change.concentration === undefined) {
    throw new Error("Beer–Lambert scaling: give thickness: [from, to] and/or concentration: [from, to]");
  }
  return ratio;
}

/**
 * Internal transmittance spectrum scaled to another thickness and/or concentration by the Beer–Lambert law, τᵢ^ratio.
 *
 * Only internal transmittance scales this way; for a measured (external) one use `scaleFilterTransmittance`.
 *
 * @param internal The internal transmittance spectrum, fractions 0–1.
 * @param change { thickness?: [from, to], concentration?: [from, to] }, or the ratio itself as a number.
 * @param name The result's name; default "<input> ×<ratio> path".
 * @returns A "transmittance" `Spectrum`.
 * @source IUPAC Gold Book, "Beer–Lambert law".
 * @example scaleInternalTransmittance(spectrumOnGrid(400, 100, [0.9, 0.5, 0.2]), { thickness: [1, 2] })
 */
export function scaleInternalTransmittance(
  internal: Spectrum,
  change: PathChange | number,
  name?: string,
): Spectrum {
  checkSpectrum("scaleInternalTransmittance", "internal", internal, {
    what: "an internal transmittance spectrum (fractions 0–1)",
  });
  checkWith(
    "scaleInternalTransmittance",
    "change",
    change,
    "a path-length ratio ≥ 0 or { thickness?: [from, to], concentration?: [from, to] }",
    (c) => (typeof c === "number" && Number.isFinite(c) && c >= 0) || isPathChange(c),
  );
  checkString("scaleInternalTransmittance", "name", name, { optional: true });
  const ratio =
    typeof change === "number" ? requireNonNegative(change, "Beer–Lambert path ratio") : pathRatio(change);
  requireFractionSpectrum(internal, "internal transmittance");
  noteMethod(
    "optics",
    "Internal transmittance was scaled to other thicknesses or concentrations by the Beer–Lambert law, τᵢ' = τᵢ^((d'c')/(dc)) (IUPAC Gold Book).",
  );
  return spectrum(
    internal.wavelengths,
    internal.values.map((t) => t ** ratio),
    {
      name: name ?? `${internal.name} ×${+ratio.toPrecision(6)} path`,
      quantity: "transmittance",
    },
  );
}

/**
 * A measured (external) filter transmittance at another thickness or concentration: surface reflections removed with the plate relation, the bulk scaled by Beer–Lambert, and the surfaces put back.
 *
 * @param external The measured external transmittance spectrum, fractions 0–1.
 * @param change { thickness?: [from, to], concentration?: [from, to] }.
 * @returns A "transmittance" `Spectrum`, named `options.name` or "<input> (rescaled)".
 * @source E. Hecht, Optics, 5th ed., §4.6 (plate relation); IUPAC Gold Book, "Beer–Lambert law".
 * @example scaleFilterTransmittance(spectrumOnGrid(400, 100, [0.8, 0.5, 0.2]), { thickness: [2, 3] }, { refractiveIndex: 1.52 })
 */
export function scaleFilterTransmittance(
  external: Spectrum,
  change: PathChange,
  options: PlateOptions,
): Spectrum {
  checkSpectrum("scaleFilterTransmittance", "external", external, {
    what: "a measured (external) transmittance spectrum (fractions 0–1)",
  });
  checkPathChange("scaleFilterTransmittance", "change", change);
  checkPlateOptions("scaleFilterTransmittance", options);
  const inner = internalTransmittance(external, options);
  const scaled = scaleInternalTransmittance(inner, change);
  return externalTransmittance(scaled, { ...options, name: options.name ?? `${external.name} (rescaled)` });
}
