/**
 * Input models for uncertainty propagation (JCGM 101:2008 §6.4): probability distributions for scalar quantities,
 * and for measured spectra the effects a spectrophotometer's uncertainty budget lists (photometric scale, noise per
 * band, noise correlated across bands, wavelength scale, bandwidth). Each model is a plain object; the Monte Carlo and
 * first-order propagators read it.
 */
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkString } from "../arguments/check-text.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";

/** A scalar input quantity with its probability distribution. */
export interface ScalarInput {
  readonly kind: "uncertain input";
  readonly model: "normal" | "rectangular" | "triangular";
  /** The best estimate (the distribution's expectation). */
  readonly estimate: number;
  /** The standard uncertainty (the distribution's standard deviation), in the unit of the estimate. */
  readonly standardUncertainty: number;
  /** Half-width of a rectangular or triangular distribution; absent for a normal one. */
  readonly halfWidth?: number;
  /** Unit of the estimate, for the Methods statement; "" when none was given. */
  readonly unit: string;
}

/** Noise correlated across bands: exponential correlation exp(−|λi − λj| ÷ length) between bands i and j. */
export interface CorrelatedNoise {
  /** Standard uncertainty of the correlated part, in the spectrum's unit (a fraction for transmittance). */
  readonly u: number;
  /** Correlation length in nm. */
  readonly length: number;
}

/** A bandwidth error: the instrument's triangular bandpass (FWHM, nm) and the standard uncertainty of that width (nm). */
export interface BandwidthError {
  readonly bandwidth: number;
  readonly u: number;
}

/** The effects making up a spectral input's uncertainty; each is normal with the standard uncertainty given. */
export interface SpectralEffects {
  /** Relative standard uncertainty of the photometric scale (a fraction: 0.002 for 0.2 %), one factor for all bands. */
  readonly scale?: number;
  /** Standard uncertainty of independent noise in each band, in the spectrum's unit. */
  readonly bandNoise?: number;
  /** Noise correlated across bands. */
  readonly correlatedNoise?: CorrelatedNoise;
  /** Standard uncertainty of the wavelength scale in nm (one shift for all bands). */
  readonly wavelengthShift?: number;
  /** The bandwidth and its standard uncertainty (the change modelled to second order, S″·Δ(b²)/12). */
  readonly bandwidthError?: BandwidthError;
}

/** A measured spectrum with the model of its uncertainty. */
export interface SpectralInput extends SpectralEffects {
  readonly kind: "uncertain input";
  readonly model: "spectrum";
  readonly estimate: Spectrum;
}

/** Any input of `monteCarloUncertainty` and `firstOrderUncertainty`. */
export type UncertainInput = ScalarInput | SpectralInput;

function checkUnit(fn: string, unit: unknown): string {
  checkString(fn, "unit", unit, { optional: true, what: "a unit (text)" });
  return ((unit as string | undefined) ?? "").trim();
}

/**
 * A scalar input with a normal (Gaussian) distribution.
 *
 * @param estimate The best estimate (the mean).
 * @param standardUncertainty The standard uncertainty u (the standard deviation), ≥ 0.
 * @param unit The unit of the estimate, for the Methods statement; default none.
 * @returns A `ScalarInput` (model "normal").
 * @source JCGM 101:2008 §6.4.7 (Gaussian distribution).
 * @example normalInput(100, 0.05, "mg")
 */
export function normalInput(estimate: number, standardUncertainty: number, unit?: string): ScalarInput {
  checkNumber("normalInput", "estimate", estimate);
  checkNumber("normalInput", "standardUncertainty", standardUncertainty, { min: 0 });
  const u = checkUnit("normalInput", unit);
  return { kind: "uncertain input", model: "normal", estimate, standardUncertainty, unit: u };
}

/**
 * A scalar input with a rectangular (uniform) distribution of half-width a: standard uncertainty a ÷ √3.
 *
 * @param estimate The centre of the interval.
 * @param halfWidth The half-width a, ≥ 0 (the quantity lies in estimate ± a).
 * @param unit The unit, for the Methods statement; default none.
 * @returns A `ScalarInput` (model "rectangular").
 * @source JCGM 101:2008 §6.4.2 (rectangular distribution).
 * @example rectangularInput(1.2, 0.1, "kg/m³")
 */
export function rectangularInput(estimate: number, halfWidth: number, unit?: string): ScalarInput {
  checkNumber("rectangularInput", "estimate", estimate);
  checkNumber("rectangularInput", "halfWidth", halfWidth, { min: 0 });
  const u = checkUnit("rectangularInput", unit);
  return {
    kind: "uncertain input",
    model: "rectangular",
    estimate,
    standardUncertainty: halfWidth / Math.sqrt(3),
    halfWidth,
    unit: u,
  };
}

/**
 * A scalar input with a symmetric triangular distribution of half-width a: standard uncertainty a ÷ √6.
 *
 * @param estimate The centre (the mode).
 * @param halfWidth The half-width a, ≥ 0.
 * @param unit The unit, for the Methods statement; default none.
 * @returns A `ScalarInput` (model "triangular").
 * @source JCGM 101:2008 §6.4.5 (triangular distribution).
 * @example triangularInput(0, 0.5, "nm")
 */
export function triangularInput(estimate: number, halfWidth: number, unit?: string): ScalarInput {
  checkNumber("triangularInput", "estimate", estimate);
  checkNumber("triangularInput", "halfWidth", halfWidth, { min: 0 });
  const u = checkUnit("triangularInput", unit);
  return {
    kind: "uncertain input",
    model: "triangular",
    estimate,
    standardUncertainty: halfWidth / Math.sqrt(6),
    halfWidth,
    unit: u,
  };
}

const EFFECTS = ["scale", "bandNoise", "correlatedNoise", "wavelengthShift", "bandwidthError"] as const;

/**
 * A measured spectrum with its uncertainty: photometric-scale error, noise per band, correlated noise, wavelength shift, bandwidth error.
 *
 * Every effect is normal and independent of the others. A measured value at band i becomes
 * (S(λi + δλ) + S″(λi)·((b + δb)² − b²) ÷ 12)·(1 + δs) + ei + ci, with S″ from second differences of the estimate
 * (a triangular bandpass of FWHM b has variance b² ÷ 6) and c an exponentially correlated noise.
 *
 * @param estimate The measured spectrum (the best estimate).
 * @param effects Standard uncertainties: scale (relative, a fraction), bandNoise and correlatedNoise.u (in the spectrum's unit), correlatedNoise.length, wavelengthShift, bandwidthError.bandwidth and .u (nm); each optional, default none.
 * @returns A `SpectralInput`.
 * @source JCGM 101:2008 §6 (input models); second-order bandpass effect as in ASTM E308 §8 (bandpass and Stearns–Stearns correction, triangular bandpass).
 * @example spectralInput(spectrumOnGrid(380, 10, new Array(41).fill(0.6), { quantity: "transmittance" }), { scale: 0.002, bandNoise: 0.0005 })
 */
export function spectralInput(estimate: Spectrum, effects: SpectralEffects = {}): SpectralInput {
  const fn = "spectralInput";
  checkSpectrum(fn, "estimate", estimate);
  checkOptions(fn, "effects", effects, EFFECTS);
  checkNumber(fn, "effects.scale", effects.scale, { min: 0, optional: true, unit: "relative units" });
  checkNumber(fn, "effects.bandNoise", effects.bandNoise, { min: 0, optional: true });
  checkNumber(fn, "effects.wavelengthShift", effects.wavelengthShift, { min: 0, optional: true, unit: "nm" });
  if (effects.correlatedNoise !== undefined) {
    checkOptions(fn, "effects.correlatedNoise", effects.correlatedNoise, ["u", "length"]);
    checkNumber(fn, "effects.correlatedNoise.u", effects.correlatedNoise.u, { min: 0 });
    checkNumber(fn, "effects.correlatedNoise.length", effects.correlatedNoise.length, {
      above: 0,
      unit: "nm",
    });
  }
  if (effects.bandwidthError !== undefined) {
    checkOptions(fn, "effects.bandwidthError", effects.bandwidthError, ["bandwidth", "u"]);
    checkNumber(fn, "effects.bandwidthError.bandwidth", effects.bandwidthError.bandwidth, {
      min: 0,
      unit: "nm",
    });
    checkNumber(fn, "effects.bandwidthError.u", effects.bandwidthError.u, { min: 0, unit: "nm" });
  }
  return {
    kind: "uncertain input",
    model: "spectrum",
    estimate,
    ...(effects.scale !== undefined ? { scale: effects.scale } : {}),
    ...(effects.bandNoise !== undefined ? { bandNoise: effects.bandNoise } : {}),
    ...(effects.correlatedNoise ? { correlatedNoise: { ...effects.correlatedNoise } } : {}),
    ...(effects.wavelengthShift !== undefined ? { wavelengthShift: effects.wavelengthShift } : {}),
    ...(effects.bandwidthError ? { bandwidthError: { ...effects.bandwidthError } } : {}),
  };
}
