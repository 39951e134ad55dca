/**
 * Reading a spectrum between and beyond its samples: interpolation (linear; Sprague for evenly spaced data as
 * CIE 167:2005 recommends; a natural cubic spline for uneven data) and extrapolation (holding the end values, the
 * CIE 015:2018 §7.2.2 practice; zero; or refusing).
 */
import { methodNotesActive, noteMethod } from "../methods/method-log.ts";
import { regularStep } from "./grid.ts";
import { cubicSplineInterpolator } from "./interpolate-spline.ts";
import { linearInterpolator } from "./interpolate-linear.ts";
import { spragueInterpolator } from "./interpolate-sprague.ts";
import type { Spectrum } from "./spectrum.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkSampling } from "../arguments/common-arguments.ts";

export type Interpolation = "linear" | "sprague" | "spline" | "auto";
export type Extrapolation = "hold" | "zero" | "refuse";

export interface SamplingOptions {
  /** "auto" (default): Sprague for evenly spaced data with at least 6 samples, otherwise a cubic spline (3+ samples) or linear. */
  interpolation?: Interpolation;
  /** "hold" (default): the nearest end value, as CIE 015:2018 advises; "zero"; or "refuse" to throw outside the data. */
  extrapolation?: Extrapolation;
}

/**
 * The interpolation method "auto" resolves to for this spectrum: Sprague for 6+ evenly spaced samples, a natural cubic spline for 3+ samples, else linear.
 *
 * @param s A spectrum.
 * @param requested The interpolation asked for; default "auto". "sprague" and "spline" are checked against the data.
 * @returns "linear", "sprague" or "spline".
 * @source CIE 167:2005 (Sprague interpolation of evenly spaced data).
 * @example resolveInterpolation(spectrumOnGrid(400, 10, [1, 2, 3, 4, 5, 6]))
 */
export function resolveInterpolation(
  s: Spectrum,
  requested: Interpolation = "auto",
): Exclude<Interpolation, "auto"> {
  checkSpectrum("resolveInterpolation", "s", s);
  checkChoice("resolveInterpolation", "requested", requested, ["auto", "linear", "sprague", "spline"], {
    optional: true,
  });
  const n = s.wavelengths.length;
  const step = regularStep(s);
  if (requested === "sprague") {
    if (step === undefined)
      throw new Error(
        `spectrum "${s.name}": Sprague interpolation needs evenly spaced wavelengths; use "spline" for uneven data`,
      );
    if (n < 6)
      throw new Error(`spectrum "${s.name}": Sprague interpolation needs at least 6 samples, it has ${n}`);
    return "sprague";
  }
  if (requested === "spline") {
    if (n < 3) throw new Error(`spectrum "${s.name}": a cubic spline needs at least 3 samples, it has ${n}`);
    return "spline";
  }
  if (requested === "linear") return "linear";
  if (step !== undefined && n >= 6) return "sprague";
  if (n >= 3) return "spline";
  return "linear";
}

const METHOD_WORDS: Record<Exclude<Interpolation, "auto">, string> = {
  linear: "linear interpolation between samples",
  sprague: "Sprague interpolation of evenly spaced data (CIE 167:2005)",
  spline: "natural cubic spline interpolation of unevenly spaced data",
};

/**
 * The Methods statement for reading this spectrum between its samples (the one `sampler` notes when it interpolates).
 *
 * @param s A spectrum.
 * @param requested The interpolation asked for; default "auto" (see `resolveInterpolation`).
 * @returns A sentence for the Methods section.
 * @source CIE 167:2005 (Sprague interpolation); none for the wording.
 * @example interpolationStatement(spectrumOnGrid(400, 10, [1, 2, 3, 4, 5, 6]))
 */
export function interpolationStatement(s: Spectrum, requested: Interpolation = "auto"): string {
  checkSpectrum("interpolationStatement", "s", s);
  checkChoice("interpolationStatement", "requested", requested, ["auto", "linear", "sprague", "spline"], {
    optional: true,
  });
  return `Spectral data were interpolated by ${METHOD_WORDS[resolveInterpolation(s, requested)]}.`;
}

/**
 * A function giving the spectrum's value at any wavelength, built once for repeated reading.
 *
 * Measured values are returned exactly; between samples the interpolation applies, beyond them the extrapolation.
 * The first interpolation and the first extrapolation are each noted in the Methods log.
 *
 * @param s A spectrum.
 * @returns A function from a wavelength in nm to a value in the spectrum's unit.
 * @source CIE 167:2005 (interpolation); CIE 015:2018 §7.2.2 (holding the end values beyond the measured range).
 * @example sampler(spectrumOnGrid(400, 10, [1, 2, 3, 4, 5, 6]))(415)
 */
export function sampler(s: Spectrum, options: SamplingOptions = {}): (wavelength: number) => number {
  checkSpectrum("sampler", "s", s);
  checkSampling("sampler", "options", options);
  const method = resolveInterpolation(s, options.interpolation);
  const extrapolation = options.extrapolation ?? "hold";
  const w = s.wavelengths;
  const v = s.values;
  const first = w[0]!;
  const last = w[w.length - 1]!;
  const inner =
    w.length === 1
      ? () => v[0]!
      : method === "sprague"
        ? spragueInterpolator(first, regularStep(s)!, v)
        : method === "spline"
          ? cubicSplineInterpolator(w, v)
          : linearInterpolator(w, v);
  let notedInterpolation = false;
  let notedExtrapolation = false;
  return (wavelength: number) => {
    if (!Number.isFinite(wavelength))
      throw new Error(`spectrum "${s.name}": cannot read a value at wavelength ${wavelength}`);
    const tol = 1e-9;
    if (wavelength < first - tol || wavelength > last + tol) {
      if (extrapolation === "refuse") {
        throw new Error(
          `spectrum "${s.name}" covers ${first}–${last} nm; ${wavelength} nm is outside it (extrapolation refused)`,
        );
      }
      // Remembered only when actually recorded: a sampler made for a figure may later serve a real computation.
      if (!notedExtrapolation && methodNotesActive()) {
        notedExtrapolation = true;
        noteMethod(
          "extrapolation",
          extrapolation === "hold"
            ? "Values beyond the measured range were taken equal to the nearest measured value (CIE 015:2018 practice)."
            : "Values beyond the measured range were taken as zero.",
        );
      }
      if (extrapolation === "zero") return 0;
      return wavelength < first ? v[0]! : v[v.length - 1]!;
    }
    const index = exactIndex(w, wavelength);
    if (index >= 0) return v[index]!;
    if (!notedInterpolation && methodNotesActive()) {
      notedInterpolation = true;
      noteMethod("interpolation", `Spectral data were interpolated by ${METHOD_WORDS[method]}.`); // = interpolationStatement
    }
    return inner(Math.min(Math.max(wavelength, first), last));
  };
}

/**
 * The spectrum's value at one wavelength, interpolated or extrapolated as `sampler` does.
 *
 * @param s A spectrum.
 * @param wavelength The wavelength, in nm.
 * @returns The value in the spectrum's unit.
 * @source CIE 167:2005 (interpolation); CIE 015:2018 §7.2.2 (extrapolation by holding the end values).
 * @example valueAt(spectrumOnGrid(400, 10, [1, 2, 3, 4, 5, 6]), 425, { interpolation: "linear" })
 */
export function valueAt(s: Spectrum, wavelength: number, options: SamplingOptions = {}): number {
  checkSpectrum("valueAt", "s", s);
  checkNumber("valueAt", "wavelength", wavelength, { unit: "nm" });
  checkSampling("valueAt", "options", options);
  return sampler(s, options)(wavelength);
}

function exactIndex(w: readonly number[], x: number): number {
  let lo = 0;
  let hi = w.length - 1;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const d = w[mid]! - x;
    if (Math.abs(d) <= 1e-9) return mid;
    if (d < 0) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}
