/**
 * Cone excitations L, M, S of a spectrum (Σ stimulus · cone fundamental · Δλ over the CIE 170-1 table) and the
 * MacLeod–Boynton chromaticity of CIE 170-1:2006 §8.
 */
import { noteMethod } from "../methods/method-log.ts";
import { illuminant as illuminantByName } from "../illuminants/standard-illuminant.ts";
import { sampler } from "../spectrum/sample.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkFields, type FieldShape } from "../arguments/check-fields.ts";
import { checkIlluminantChoice } from "../arguments/common-arguments.ts";
import {
  CONE_FUNDAMENTALS_CHOICE,
  coneFundamentals,
  isConeFundamentalsChoice,
  type ConeFundamentals,
} from "./cone-fundamentals.ts";
import { CIE_2015_10_DEGREE_LMS_TO_XYZ, CIE_2015_2_DEGREE_LMS_TO_XYZ } from "./cie-2015-observer.ts";

/** Cone excitations. */
export interface ConeExcitations {
  readonly L: number;
  readonly M: number;
  readonly S: number;
}

/** The shape of a `ConeExcitations` record, for argument checks. */
export const LMS_FIELDS: FieldShape = {
  what: "cone excitations { L, M, S } (from coneExcitations)",
  keys: ["L", "M", "S"],
};

export interface ConeExcitationOptions {
  /** The cone fundamentals: "2°" (default), "10°" or a `ConeFundamentals` object. */
  fundamentals?: "2°" | "10°" | "2" | "10" | 2 | 10 | ConeFundamentals;
  /**
   * For a reflectance or transmittance: the illuminant (a name or a spectrum); default "D65". Ignored for a light,
   * whose own spectrum is the stimulus.
   */
  illuminant?: string | Spectrum;
}

function isObject(s: Spectrum): boolean {
  return s.quantity === "reflectance" || s.quantity === "transmittance";
}

const statements = new Map<string, string>();

/**
 * Cone excitations of a light, or of a reflecting or transmitting sample under an illuminant, by summation over the CIE 2006 cone fundamentals.
 *
 * A light (any quantity other than "reflectance" or "transmittance") gives L = Σ S(λ) l̄(λ) Δλ (and so for M, S) in
 * the light's units × nm; the light is taken as zero outside its measured range. A sample gives the same sums of
 * R(λ) E(λ) scaled by k = 1/Σ E(λ) ȳF(λ) Δλ, so that the perfect white under the illuminant has the luminance
 * 0.68990272 L + 0.34832189 M = 1 (2°; the CIE 170-2 ȳF weights), its end values held beyond its measured range.
 *
 * @param stimulus A light spectrum, or a reflectance/transmittance spectrum (fractions 0–1).
 * @param options.fundamentals The cone fundamentals; default "2°" (CIE 2006 2°).
 * @param options.illuminant The illuminant for a sample, a name or a spectrum; default "D65".
 * @returns { L, M, S }.
 * @source CIE 170-1:2006 §6 (cone fundamentals); summation as CIE 015:2018 eq. 7.1 with the cone fundamentals in place of the colour-matching functions.
 * @example coneExcitations(spectrumOnGrid(380, 5, new Array(81).fill(1), { quantity: "relative power" }))
 */
export function coneExcitations(stimulus: Spectrum, options: ConeExcitationOptions = {}): ConeExcitations {
  checkSpectrum("coneExcitations", "stimulus", stimulus);
  checkOptions("coneExcitations", "options", options, ["fundamentals", "illuminant"]);
  checkWith(
    "coneExcitations",
    "options.fundamentals",
    options.fundamentals,
    CONE_FUNDAMENTALS_CHOICE,
    isConeFundamentalsChoice,
    { optional: true },
  );
  checkIlluminantChoice("coneExcitations", "options.illuminant", options.illuminant);
  const f = coneFundamentals(options.fundamentals ?? "2°");
  const object = isObject(stimulus);
  const read = sampler(stimulus, { extrapolation: object ? "hold" : "zero" });
  let ill: Spectrum | undefined;
  let readIll: ((w: number) => number) | undefined;
  if (object) {
    ill =
      typeof options.illuminant === "object"
        ? options.illuminant
        : illuminantByName(options.illuminant ?? "D65");
    readIll = sampler(ill, { extrapolation: "zero" });
  }
  const yw = ySums(f);
  let L = 0,
    M = 0,
    S = 0,
    white = 0;
  for (let i = 0; i < f.wavelengths.length; i++) {
    const w = f.wavelengths[i]!;
    const e = readIll ? readIll(w) : 1;
    const v = read(w) * e * f.step;
    L += v * f.l[i]!;
    M += v * f.m[i]!;
    S += v * f.s[i]!;
    if (readIll) white += e * f.step * (yw[0] * f.l[i]! + yw[1] * f.m[i]!);
  }
  if (object && !(white > 0))
    throw new Error(`coneExcitations: illuminant "${ill!.name}" has no power where the cones see`);
  const k = object ? 1 / white : 1;
  const key = `${f.name}|${object ? ill!.name : ""}`;
  let statement = statements.get(key);
  if (statement === undefined) {
    statement = object
      ? `Cone excitations were summed at ${f.step} nm over ${f.start}–${f.wavelengths.at(-1)} nm with the ${f.name} under ${ill!.name}, scaled so that the perfect white has luminance 1 (CIE 170-2 weights of L and M).`
      : `Cone excitations were summed at ${f.step} nm over ${f.start}–${f.wavelengths.at(-1)} nm with the ${f.name}, in the light's units × nm.`;
    statements.set(key, statement);
  }
  noteMethod("observer", statement);
  return { L: L * k, M: M * k, S: S * k };
}

function ySums(f: ConeFundamentals): readonly [number, number] {
  const m = f.fieldDegrees === 10 ? CIE_2015_10_DEGREE_LMS_TO_XYZ : CIE_2015_2_DEGREE_LMS_TO_XYZ;
  return [m[1][0], m[1][1]];
}

const sScales = new WeakMap<ConeFundamentals, number>();

/**
 * The MacLeod–Boynton weights of a set of cone fundamentals: L and M weighted as in the CIE 170-2 ȳF (their sum is the luminance), S scaled so that S/(L + M) peaks at 1 over the spectrum.
 *
 * @param which The cone fundamentals ("2°", "10°" or an object); default "2°".
 * @returns { l, m, s } weights: 2° l = 0.68990272, m = 0.34832189; s computed from the table.
 * @source CIE 170-1:2006 §8 (MacLeod–Boynton chromaticity diagram); CIE 170-2:2015 (ȳF weights).
 * @example macLeodBoyntonWeights("2°").s
 */
export function macLeodBoyntonWeights(which: "2°" | "10°" | "2" | "10" | 2 | 10 | ConeFundamentals = "2°"): {
  l: number;
  m: number;
  s: number;
} {
  checkWith("macLeodBoyntonWeights", "which", which, CONE_FUNDAMENTALS_CHOICE, isConeFundamentalsChoice, {
    optional: true,
  });
  const f = coneFundamentals(which);
  const [a, b] = ySums(f);
  let s = sScales.get(f);
  if (s === undefined) {
    let peak = 0;
    for (let i = 0; i < f.wavelengths.length; i++) {
      const v = a * f.l[i]! + b * f.m[i]!;
      if (v > 0) peak = Math.max(peak, f.s[i]! / v);
    }
    s = 1 / peak;
    sScales.set(f, s);
  }
  return { l: a, m: b, s };
}

/** A MacLeod–Boynton chromaticity. */
export interface MacLeodBoynton {
  /** l_MB = L_MB / (L_MB + M_MB), between 0 and 1. */
  readonly l: number;
  /** s_MB = S_MB / (L_MB + M_MB), 1 at the spectrum's peak. */
  readonly s: number;
  /** The luminance L_MB + M_MB on the scale of the cone excitations given. */
  readonly luminance: number;
}

/**
 * The MacLeod–Boynton chromaticity (l_MB, s_MB) of cone excitations, with the CIE 170-1 weights of the same fundamentals.
 *
 * @param lms Cone excitations { L, M, S } (from `coneExcitations` with the same fundamentals).
 * @param which The cone fundamentals they were computed with ("2°", "10°" or an object); default "2°".
 * @returns { l, s, luminance }.
 * @source CIE 170-1:2006 §8; MacLeod & Boynton, J. Opt. Soc. Am. 69 (1979) 1183–1186.
 * @example macLeodBoynton({ L: 0.6, M: 0.4, S: 0.02 })
 */
export function macLeodBoynton(
  lms: ConeExcitations,
  which: "2°" | "10°" | "2" | "10" | 2 | 10 | ConeFundamentals = "2°",
): MacLeodBoynton {
  checkFields("macLeodBoynton", "lms", lms, LMS_FIELDS);
  checkWith("macLeodBoynton", "which", which, CONE_FUNDAMENTALS_CHOICE, isConeFundamentalsChoice, {
    optional: true,
  });
  const w = macLeodBoyntonWeights(which);
  const lum = w.l * lms.L + w.m * lms.M;
  if (!(lum > 0))
    throw new Error(`macLeodBoynton: L and M give no luminance (${lms.L}, ${lms.M}); no chromaticity`);
  return { l: (w.l * lms.L) / lum, s: (w.s * lms.S) / lum, luminance: lum };
}
