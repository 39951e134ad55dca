/**
 * The CIE colour rendering index (CIE 13.3-1995, "Method of measuring and specifying colour rendering properties
 * of light sources"): the 14 test colour samples are computed under the test source and under a reference
 * illuminant of the same CCT (Planckian radiator below 5000 K, CIE daylight at and above), their CIE 1960 UCS
 * chromaticities are brought to the reference white by the von Kries-type transform of CIE 13.3, and their
 * differences in CIE 1964 U*V*W* give the special indices Rᵢ = 100 − 4.6·ΔEᵢ; Ra is the mean of R1–R8.
 */
import {
  chromaticityXy,
  fromXyY,
  uv1960FromXy,
  xyFromUv1960,
  type Tristimulus,
} from "../colorimetry/chromaticity.ts";
import { uvwFromXYZ } from "../colorimetry/cie-uvw.ts";
import { CIE_TEST_COLOUR_SAMPLES_TABLE } from "../data/cie-test-colour-samples.ts";
import { requireFinite } from "../filters/checks.ts";
import { daylightSpectrum } from "../illuminants/daylight.ts";
import { planckianSpectrum } from "../illuminants/planckian-radiator.ts";
import { noteMethod } from "../methods/method-log.ts";
import { colourMatchingAt, CIE_1931_2_DEGREE } from "../observers/standard-observer.ts";
import { gridWavelengths } from "../spectrum/grid.ts";
import { sampler } from "../spectrum/sample.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { cctAndDuv, type CctMethod } from "../temperature/cct.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkCctOptions } from "../arguments/option-sets.ts";

/** The chromaticity distance DC (CIE 1960 uv) between test source and reference below which CIE 13.3 regards the method as applicable. */
export const CRI_DC_LIMIT = 5.4e-3;

/** The CCT (K) at which CIE 13.3 switches the reference from a Planckian radiator to CIE daylight. */
export const CRI_DAYLIGHT_FROM_K = 5000;

const WAVELENGTHS = gridWavelengths({ start: 380, end: 780, step: 5 });
const SAMPLE_NAMES = Object.keys(CIE_TEST_COLOUR_SAMPLES_TABLE.columns);

export interface SpecialIndex {
  /** "TCS01" … "TCS14". */
  readonly sample: string;
  /** The special colour rendering index Rᵢ. */
  readonly R: number;
  /** ΔEᵢ in CIE 1964 U*V*W* between the sample under the reference and under the adapted test source. */
  readonly deltaE: number;
}

export interface ColourRendering {
  /** General colour rendering index Ra, the mean of R1–R8 (unrounded; CIE 13.3 reports it rounded to a whole number). */
  readonly ra: number;
  /** R1–R14 in order. */
  readonly special: readonly SpecialIndex[];
  readonly cct: number;
  readonly duv: number;
  /** The reference illuminant used, e.g. "Planckian radiator 2940 K". */
  readonly reference: string;
  /** Chromaticity distance between test source and reference in CIE 1960 uv. */
  readonly dc: number;
  /** True when DC < 5.4 × 10⁻³, the limit of CIE 13.3. */
  readonly withinTolerance: boolean;
  readonly notes: readonly string[];
}

interface Sums {
  readonly XYZ: Tristimulus;
  readonly Y: number;
  readonly u: number;
  readonly v: number;
}

function colourOf(
  weights: { x: number[]; y: number[]; z: number[] },
  reflectance: readonly number[] | undefined,
): Sums {
  let X = 0,
    Y = 0,
    Z = 0;
  for (let i = 0; i < WAVELENGTHS.length; i++) {
    const r = reflectance ? reflectance[i]! : 1;
    X += weights.x[i]! * r;
    Y += weights.y[i]! * r;
    Z += weights.z[i]! * r;
  }
  const uv = uv1960FromXy(chromaticityXy({ X, Y, Z }));
  return { XYZ: { X, Y, Z }, Y, u: uv.u, v: uv.v };
}

/** Weighting k·S(λ)·x̄, ȳ, z̄ at 5 nm over 380–780 nm with k so that the source itself has Y = 100. */
function weightsFor(source: Spectrum): { x: number[]; y: number[]; z: number[] } {
  const read = sampler(source, { extrapolation: "refuse" });
  const s = WAVELENGTHS.map((w) => read(w));
  s.forEach((v, i) => {
    if (v < 0)
      throw new Error(`colourRenderingIndex: "${source.name}" is negative (${v}) at ${WAVELENGTHS[i]} nm`);
  });
  const cmf = WAVELENGTHS.map((w) => colourMatchingAt(CIE_1931_2_DEGREE, w));
  const sumY = s.reduce((acc, v, i) => acc + v * cmf[i]![1], 0);
  if (!(sumY > 0))
    throw new Error(`colourRenderingIndex: "${source.name}" has no luminous power in 380–780 nm`);
  const k = 100 / sumY;
  return {
    x: s.map((v, i) => k * v * cmf[i]![0]),
    y: s.map((v, i) => k * v * cmf[i]![1]),
    z: s.map((v, i) => k * v * cmf[i]![2]),
  };
}

/** CIE 13.3 adaptation coefficients c = (4 − u − 10v)/v and d = (1.708v + 0.404 − 1.481u)/v. */
function cd(p: Sums): { c: number; d: number } {
  return { c: (4 - p.u - 10 * p.v) / p.v, d: (1.708 * p.v + 0.404 - 1.481 * p.u) / p.v };
}

/**
 * The reference illuminant of the colour rendering index for a CCT: a Planckian radiator below 5000 K (380–780 nm at 5 nm), CIE daylight from 5000 K to 25000 K.
 *
 * @param cct The correlated colour temperature, in K.
 * @returns A "relative power" `Spectrum`.
 * @source CIE 13.3-1995 (choice of the reference illuminant).
 * @example renderingReference(3000).name
 */
export function renderingReference(cct: number): Spectrum {
  checkNumber("renderingReference", "cct", cct, { unit: "K", above: 0 });
  requireFinite(cct, "colour rendering reference CCT");
  if (cct < CRI_DAYLIGHT_FROM_K) return planckianSpectrum(cct, { start: 380, end: 780, step: 5 });
  if (cct > 25000)
    throw new Error(
      `colourRenderingIndex: CCT ${Math.round(cct)} K is above 25000 K, where CIE daylight (the reference) is not defined`,
    );
  return daylightSpectrum(cct);
}

/**
 * The CIE general colour rendering index Ra and the special indices R1–R14 of a light source.
 *
 * The 14 test colour samples are computed under the source and under a reference illuminant of the same CCT, adapted
 * by the von Kries-type transform of CIE 13.3, and compared in CIE 1964 U*V*W*: Rᵢ = 100 − 4.6·ΔEᵢ; Ra is the mean of
 * R1–R8 (unrounded).
 *
 * @param source The light source's spectral distribution, covering 380–780 nm.
 * @param options.cctMethod How the CCT is found: "ohno" or "robertson"; default "ohno" (see `cctAndDuv`).
 * @returns { ra, special [{ sample, R, deltaE }], cct (K), duv, reference, dc, withinTolerance (DC < 5.4e-3), notes }.
 * @source CIE 13.3-1995.
 * @example colourRenderingIndex(illuminant("FL2")).ra
 */
export function colourRenderingIndex(
  source: Spectrum,
  options: { cctMethod?: CctMethod } = {},
): ColourRendering {
  checkSpectrum("colourRenderingIndex", "source", source, { what: "a spectrum of the light source" });
  checkCctOptions("colourRenderingIndex", options, "cctMethod");
  if (source?.kind !== "spectrum") throw new Error("colourRenderingIndex: give the light source's spectrum");
  if (source.quantity === "reflectance" || source.quantity === "transmittance") {
    throw new Error(`colourRenderingIndex: "${source.name}" is a ${source.quantity}, not a light source`);
  }
  if (source.wavelengths[0]! > 380 + 1e-9 || source.wavelengths.at(-1)! < 780 - 1e-9) {
    throw new Error(
      `colourRenderingIndex: "${source.name}" covers ${source.wavelengths[0]}–${source.wavelengths.at(-1)} nm; CIE 13.3 needs 380–780 nm`,
    );
  }
  const testW = weightsFor(source);
  const k = colourOf(testW, undefined);
  const { cct, duv } = cctAndDuv(
    chromaticityXy({ X: testW.x.reduce((a, b) => a + b, 0), Y: 100, Z: testW.z.reduce((a, b) => a + b, 0) }),
    { method: options.cctMethod },
  );
  const refSpectrum = renderingReference(cct);
  const refW = weightsFor(refSpectrum);
  const r = colourOf(refW, undefined);
  const dc = Math.hypot(k.u - r.u, k.v - r.v);
  const ck = cd(k);
  const cr = cd(r);
  const special: SpecialIndex[] = SAMPLE_NAMES.map((name) => {
    const column = CIE_TEST_COLOUR_SAMPLES_TABLE.columns[name]!;
    const reflectance = WAVELENGTHS.map(
      (w) =>
        column[Math.round((w - CIE_TEST_COLOUR_SAMPLES_TABLE.start) / CIE_TEST_COLOUR_SAMPLES_TABLE.step)]!,
    );
    const ri = colourOf(refW, reflectance);
    const ki = colourOf(testW, reflectance);
    const cki = cd(ki);
    const cTerm = (cr.c / ck.c) * cki.c;
    const dTerm = (cr.d / ck.d) * cki.d;
    const denom = 16.518 + 1.481 * cTerm - dTerm;
    const uAdapted = (10.872 + 0.404 * cTerm - 4 * dTerm) / denom;
    const vAdapted = 5.52 / denom;
    // Both in CIE 1964 U*V*W* relative to the reference white (the adapted test white coincides with it).
    const ref = uvwFromXYZ(ri.XYZ, r.XYZ);
    const test = uvwFromXYZ(fromXyY({ ...xyFromUv1960({ u: uAdapted, v: vAdapted }), Y: ki.Y }), r.XYZ);
    const deltaE = Math.hypot(ref.U - test.U, ref.V - test.V, ref.W - test.W);
    return { sample: name, R: 100 - 4.6 * deltaE, deltaE };
  });
  const ra = special.slice(0, 8).reduce((s, x) => s + x.R, 0) / 8;
  const reference =
    cct < CRI_DAYLIGHT_FROM_K
      ? `Planckian radiator ${Math.round(cct)} K`
      : `CIE daylight ${Math.round(cct)} K`;
  const withinTolerance = dc < CRI_DC_LIMIT;
  const notes: string[] = [];
  if (!withinTolerance) {
    notes.push(
      `The source's chromaticity is ${dc.toFixed(4)} from the reference in CIE 1960 uv, beyond the ${CRI_DC_LIMIT} that CIE 13.3 allows; the indices are not meaningful for this source.`,
    );
  }
  noteMethod(
    "colour rendering",
    "Colour rendering indices were computed per CIE 13.3-1995 with the test colour samples TCS01–TCS14 and the CIE 1931 2° observer at 5 nm over 380–780 nm; the reference illuminant was a Planckian radiator below 5000 K and CIE daylight at and above 5000 K at the source's CCT, adaptation was the von Kries-type transform of CIE 13.3, differences were taken in CIE 1964 U*V*W*, Rᵢ = 100 − 4.6ΔEᵢ, and Ra is the mean of R1–R8.",
  );
  return { ra, special, cct, duv, reference, dc, withinTolerance, notes };
}
