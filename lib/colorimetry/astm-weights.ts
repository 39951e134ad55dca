/**
 * Tristimulus weighting factors at 10 and 20 nm by the method of ASTM E2022 (the method behind the tables of ASTM
 * E308), with and without the bandpass correction of ASTM E308, and that correction applied to measured spectra.
 *
 * E2022's method, as implemented here: the 1 nm illuminant and colour-matching functions are summed against the
 * Lagrange interpolation coefficients by which the measured values at the coarse interval give the 1 nm values
 * (cubic through the two measured points on each side, quadratic in the first and last interval), so a weight is
 * Wᵢ = k Σλ S(λ) x̄(λ) Lᵢ(λ); the colour-matching functions beyond the measured range are added to the end weights
 * (the end values held, as E308 directs for unmeasured ends); k = 100 ÷ Σλ S(λ) ȳ(λ) over 360–830 nm at 1 nm, so the
 * weights of ȳ sum to 100. Weights "with bandpass correction" fold the Stearns–Stearns correction of E308 into the
 * weights: W′ = Cᵀ W, where C is the correction of the measured values, so Σ W′ᵢ Rᵢ = Σ Wᵢ (C R)ᵢ.
 */
import { noteMethod, withoutMethodNotes } from "../methods/method-log.ts";
import {
  colourMatchingAt,
  observerByName,
  type Observer,
  type ObserverName,
} from "../observers/standard-observer.ts";
import { illuminant as illuminantByName } from "../illuminants/standard-illuminant.ts";
import { interpolationStatement, sampler } from "../spectrum/sample.ts";
import { regularStep } from "../spectrum/grid.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { spectrum as makeSpectrum } from "../spectrum/spectrum.ts";
import type { Tristimulus } from "./chromaticity.ts";
import { astmWeightsFor } from "./astm-weight-table.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { ArgumentError } from "../arguments/argument-error.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkIlluminantChoice, checkObserver } from "../arguments/common-arguments.ts";

/** The Stearns–Stearns bandpass-correction coefficient α of ASTM E308 (recalled from memory: 0.083). */
export const STEARNS_ALPHA = 0.083;

export interface AstmWeightOptions {
  /** Illuminant name or spectrum; default D65. Read at 1 nm (interpolated when tabulated coarser, and so stated). */
  illuminant?: string | Spectrum;
  /** Observer; default the CIE 1931 2° observer. */
  observer?: ObserverName | Observer | 2 | 10;
  /** The measurement interval in nm: 10 or 20 (required). */
  interval: 10 | 20;
  /** First and last measured wavelengths in nm, on the interval's grid; default [360, 830] for 10 nm, [360, 820] for 20 nm. */
  range?: readonly [number, number];
  /** "none" (default): for data already bandpass corrected or measured with a narrow bandpass; "included": the E308 correction folded in, for uncorrected data from a triangular bandpass equal to the interval. */
  bandpass?: "none" | "included";
}

/** A table of weighting factors for data at 10 or 20 nm. */
export interface AstmWeights {
  readonly wavelengths: readonly number[];
  readonly wx: Float64Array;
  readonly wy: Float64Array;
  readonly wz: Float64Array;
  /** Σ of the weights: the perfect reflecting diffuser (Y = 100). */
  readonly white: Tristimulus;
  readonly interval: 10 | 20;
  readonly bandpass: "none" | "included";
  readonly illuminantName: string;
  readonly observer: Observer;
  /** The Methods statements of this table. */
  readonly notes: { readonly integration: string; readonly white: string; readonly interpolation?: string };
}

/**
 * Tristimulus weighting factors for data at 10 or 20 nm by the method of ASTM E2022, with or without bandpass correction.
 *
 * @param options.interval The measurement interval in nm, 10 or 20 (required).
 * @param options.illuminant Illuminant name or spectrum; default D65.
 * @param options.observer Observer; default the CIE 1931 2° observer.
 * @param options.range First and last measured wavelengths in nm; default 360–830 nm (10 nm) or 360–820 nm (20 nm).
 * @param options.bandpass "none" or "included" (the E308 bandpass correction folded in); default "none".
 * @returns An `AstmWeights` table: wavelengths (nm), wx, wy, wz, and white (their sums, Y = 100).
 * @source ASTM E2022 (weighting factors from 1 nm data by Lagrange interpolation coefficients); ASTM E308 (Stearns–Stearns bandpass correction, α = 0.083, recalled from memory).
 * @example astmWeightingFactors({ interval: 10, illuminant: "D50", range: [380, 780] }).white
 */
export function astmWeightingFactors(options: AstmWeightOptions): AstmWeights {
  const fn = "astmWeightingFactors";
  checkOptions(fn, "options", options, ["illuminant", "observer", "interval", "range", "bandpass"]);
  checkChoice(fn, "options.interval", options?.interval, [10, 20], { what: "a measurement interval in nm" });
  checkIlluminantChoice(fn, "options.illuminant", options.illuminant);
  checkObserver(fn, "options.observer", options.observer);
  checkChoice(fn, "options.bandpass", options.bandpass, ["none", "included"], { optional: true });
  const range = options.range;
  if (range !== undefined) checkRange(fn, range, options.interval);
  const table = astmWeightsFor(
    options.illuminant,
    options.observer,
    options.interval,
    range,
    options.bandpass ?? "none",
  );
  noteMethod("integration", table.notes.integration);
  if (table.notes.interpolation) noteMethod("interpolation", table.notes.interpolation);
  return table;
}

function checkRange(fn: string, range: unknown, interval: number): void {
  const ok =
    Array.isArray(range) &&
    range.length === 2 &&
    range.every((v) => Number.isInteger(v)) &&
    range[0] >= 360 &&
    range[1] <= 830 &&
    range[1] - range[0] >= 2 * interval &&
    (range[1] - range[0]) % interval === 0;
  if (!ok)
    throw new ArgumentError(
      fn,
      "options.range",
      `[first, last] in whole nm within 360–830 nm, a whole number of ${interval} nm intervals apart (at least two)`,
      JSON.stringify(range) ?? String(range),
    );
}

/**
 * Bandpass correction of a measured spectrum by the Stearns–Stearns method of ASTM E308: R′ᵢ = −α Rᵢ₋₁ + (1 + 2α) Rᵢ − α Rᵢ₊₁, at the ends (1 + α) R − α R(neighbour).
 *
 * For data from a triangular bandpass equal to the measurement interval, before summation with weights that do not
 * include the correction. The data must be evenly spaced.
 *
 * @param measured A measured spectrum on an even grid (at least 3 values).
 * @returns A new spectrum with the corrected values (name "<name> (bandpass corrected)").
 * @source ASTM E308 (Stearns & Stearns 1988, Color Res. Appl. 13, 257–259), α = 0.083 (recalled from memory).
 * @example bandpassCorrection(spectrumOnGrid(400, 10, [0.2, 0.4, 0.5, 0.4, 0.2], { quantity: "transmittance" })).values
 */
export function bandpassCorrection(measured: Spectrum): Spectrum {
  checkSpectrum("bandpassCorrection", "measured", measured, { what: "an evenly spaced measured spectrum" });
  const v = measured.values;
  const n = v.length;
  if (n < 3 || regularStep(measured) === undefined)
    throw new Error(
      `bandpassCorrection: "${measured.name}" must have at least 3 evenly spaced values (it has ${n}${regularStep(measured) === undefined ? ", unevenly spaced" : ""})`,
    );
  const a = STEARNS_ALPHA;
  const out = v.map((r, i) =>
    i === 0
      ? (1 + a) * r - a * v[1]!
      : i === n - 1
        ? (1 + a) * r - a * v[n - 2]!
        : -a * v[i - 1]! + (1 + 2 * a) * r - a * v[i + 1]!,
  );
  noteMethod(
    "interpolation",
    "Measured spectra were bandpass corrected by the Stearns–Stearns method of ASTM E308 (α = 0.083) before summation.",
  );
  return makeSpectrum(measured.wavelengths, out, {
    name: `${measured.name} (bandpass corrected)`,
    quantity: measured.quantity,
    unit: measured.unit,
  });
}
