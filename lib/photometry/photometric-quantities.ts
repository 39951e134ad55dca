/**
 * Photometric quantities from spectral distributions: Xv = Km Σ Xe,λ(λ) V(λ) Δλ (CIE 018:2019 eq. 2; CIE 015:2018
 * eq. 7.5 for Y), luminous transmittance and reflectance (ISO/CIE 11664-3, CIE 015:2018 §7.1), and the
 * scotopic-to-photopic (S/P) ratio.
 */
import { tristimulus, type ObjectColourOptions } from "../colorimetry/tristimulus.ts";
import { noteMethod } from "../methods/method-log.ts";
import { regularStep } from "../spectrum/grid.ts";
import { sampler } from "../spectrum/sample.ts";
import { withValues, type SpectralQuantity, type Spectrum } from "../spectrum/spectrum.ts";
import { KM, KM_SCOTOPIC, luminousEfficiency, type Vision } from "./luminous-efficiency.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkLuminousOptions, checkVisionOptions } from "../arguments/option-sets.ts";

/**
 * Σ S(λ) V(λ) Δλ over the wavelengths the spectrum and V (or V′) share.
 *
 * Summed at the spectrum's own samples when they lie every 1 or 5 nm on whole nanometres, otherwise after
 * interpolating the spectrum to 1 nm (V is read linearly).
 *
 * @param spd A spectral distribution.
 * @param vision "photopic" (V) or "scotopic" (V′); default "photopic".
 * @returns { sum in the spectrum's unit × nm, interval in nm, range [first, last] in nm }.
 * @source CIE 018:2019 eq. 2 (without the factor Km); CIE 167:2005 (interpolation).
 * @example spectralLuminousSum(illuminant("D65")).sum
 */
export function spectralLuminousSum(
  spd: Spectrum,
  vision: Vision = "photopic",
): { sum: number; interval: number; range: [number, number] } {
  checkSpectrum("spectralLuminousSum", "spd", spd);
  checkChoice("spectralLuminousSum", "vision", vision, ["photopic", "scotopic"]);
  const v = luminousEfficiency(vision);
  const start = Math.max(spd.wavelengths[0]!, v.wavelengths[0]!);
  const end = Math.min(spd.wavelengths.at(-1)!, v.wavelengths.at(-1)!);
  if (end < start) {
    throw new Error(
      `"${spd.name}" (${spd.wavelengths[0]}–${spd.wavelengths.at(-1)} nm) does not overlap ${v.name} (${v.wavelengths[0]}–${v.wavelengths.at(-1)} nm)`,
    );
  }
  const step = regularStep(spd);
  const onWholeNm = step !== undefined && (step === 1 || step === 5) && Number.isInteger(spd.wavelengths[0]!);
  const interval = onWholeNm ? step : 1;
  const readS = sampler(spd, { extrapolation: "refuse" });
  const readV = sampler(v, { interpolation: "linear", extrapolation: "refuse" });
  let sum = 0;
  const first = Math.ceil(start / interval - 1e-9) * interval;
  for (let w = first; w <= end + 1e-9; w += interval) sum += readS(w) * readV(w);
  return { sum: sum * interval, interval, range: [first, end] };
}

const UNITS: Record<string, { quantity: SpectralQuantity; unit: string; spectral: string }> = {
  "luminous flux": { quantity: "radiant flux", unit: "lm", spectral: "spectral radiant flux in W/nm" },
  luminance: { quantity: "radiance", unit: "cd/m²", spectral: "spectral radiance in W/(sr·m²·nm)" },
  illuminance: { quantity: "irradiance", unit: "lx", spectral: "spectral irradiance in W/(m²·nm)" },
  "luminous intensity": {
    quantity: "other",
    unit: "cd",
    spectral: "spectral radiant intensity in W/(sr·nm)",
  },
};

function photometric(what: keyof typeof UNITS, spd: Spectrum, vision: Vision): number {
  const u = UNITS[what]!;
  if (spd.quantity !== u.quantity && spd.quantity !== "other") {
    throw new Error(`${what}: "${spd.name}" is a ${spd.quantity} spectrum; ${what} needs a ${u.spectral}`);
  }
  const k = vision === "scotopic" ? KM_SCOTOPIC : KM;
  const { sum, interval, range } = spectralLuminousSum(spd, vision);
  noteMethod(
    "photometry",
    `${vision === "scotopic" ? "Scotopic" : "Photopic"} ${what} was computed as K·Σ S(λ)·${vision === "scotopic" ? "V′" : "V"}(λ)·Δλ with K = ${k} lm/W (CIE 018:2019), summed every ${interval} nm over ${range[0]}–${range[1]} nm.`,
  );
  return k * sum;
}

/**
 * Luminous flux from spectral radiant flux: Φv = Km Σ Φe,λ V(λ) Δλ (K′m and V′ for scotopic vision).
 *
 * @param spd Spectral radiant flux in W/nm (quantity "radiant flux" or "other").
 * @param options.vision "photopic" (Km = 683 lm/W) or "scotopic" (K′m = 1700 lm/W); default "photopic".
 * @returns Φv in lm.
 * @source CIE 018:2019 eq. 2.
 * @example luminousFlux(spectrumOnGrid(550, 5, [0.01, 0.01, 0.01], { quantity: "radiant flux", unit: "W/nm" }))
 */
export function luminousFlux(spd: Spectrum, options: { vision?: Vision } = {}): number {
  checkSpectrum("luminousFlux", "spd", spd, { what: "a spectral radiant flux in W/nm" });
  checkVisionOptions("luminousFlux", options);
  return photometric("luminous flux", spd, options.vision ?? "photopic");
}

/**
 * Luminance from spectral radiance: Lv = Km Σ Le,λ V(λ) Δλ (K′m and V′ for scotopic vision).
 *
 * @param spd Spectral radiance in W/(sr·m²·nm) (quantity "radiance" or "other").
 * @param options.vision "photopic" (Km = 683 lm/W) or "scotopic" (K′m = 1700 lm/W); default "photopic".
 * @returns Lv in cd/m².
 * @source CIE 018:2019 eq. 2.
 * @example luminance(spectrumOnGrid(380, 5, new Array(81).fill(0.001), { quantity: "radiance", unit: "W/(sr·m²·nm)" }))
 */
export function luminance(spd: Spectrum, options: { vision?: Vision } = {}): number {
  checkSpectrum("luminance", "spd", spd, { what: "a spectral radiance in W/(sr·m²·nm)" });
  checkVisionOptions("luminance", options);
  return photometric("luminance", spd, options.vision ?? "photopic");
}

/**
 * Illuminance from spectral irradiance: Ev = Km Σ Ee,λ V(λ) Δλ (K′m and V′ for scotopic vision).
 *
 * @param spd Spectral irradiance in W/(m²·nm) (quantity "irradiance" or "other").
 * @param options.vision "photopic" (Km = 683 lm/W) or "scotopic" (K′m = 1700 lm/W); default "photopic".
 * @returns Ev in lx.
 * @source CIE 018:2019 eq. 2.
 * @example illuminance(spectrumOnGrid(380, 5, new Array(81).fill(0.01), { quantity: "irradiance", unit: "W/(m²·nm)" }), { vision: "scotopic" })
 */
export function illuminance(spd: Spectrum, options: { vision?: Vision } = {}): number {
  checkSpectrum("illuminance", "spd", spd, { what: "a spectral irradiance in W/(m²·nm)" });
  checkVisionOptions("illuminance", options);
  return photometric("illuminance", spd, options.vision ?? "photopic");
}

/**
 * Luminous intensity from spectral radiant intensity: Iv = Km Σ Ie,λ V(λ) Δλ (K′m and V′ for scotopic vision).
 *
 * @param spd Spectral radiant intensity in W/(sr·nm) (quantity "other").
 * @param options.vision "photopic" (Km = 683 lm/W) or "scotopic" (K′m = 1700 lm/W); default "photopic".
 * @returns Iv in cd.
 * @source CIE 018:2019 eq. 2.
 * @example luminousIntensity(spectrumOnGrid(500, 10, [0.002, 0.003, 0.004, 0.003], { unit: "W/(sr·nm)" }))
 */
export function luminousIntensity(spd: Spectrum, options: { vision?: Vision } = {}): number {
  checkSpectrum("luminousIntensity", "spd", spd, { what: "a spectral radiant intensity in W/(sr·nm)" });
  checkVisionOptions("luminousIntensity", options);
  return photometric("luminous intensity", spd, options.vision ?? "photopic");
}

/**
 * Luminous efficacy of radiation K = Km Σ S V Δλ ÷ Σ S Δλ, with the radiant power taken over the spectrum's own measured range.
 *
 * @param spd A spectral distribution (any scale) with radiant power.
 * @returns K in lm/W.
 * @source CIE 018:2019 §3.4.
 * @example luminousEfficacyOfRadiation(illuminant("D65"))
 */
export function luminousEfficacyOfRadiation(spd: Spectrum): number {
  checkSpectrum("luminousEfficacyOfRadiation", "spd", spd, { what: "a spectrum of a light source" });
  const { sum, range } = spectralLuminousSum(spd, "photopic");
  const step = regularStep(spd);
  const w = spd.wavelengths,
    v = spd.values;
  let radiant = 0;
  if (step !== undefined) radiant = v.reduce((a, b) => a + b, 0) * step;
  else for (let i = 0; i + 1 < w.length; i++) radiant += ((v[i]! + v[i + 1]!) / 2) * (w[i + 1]! - w[i]!);
  if (!(radiant > 0)) throw new Error(`luminousEfficacyOfRadiation: "${spd.name}" has no radiant power`);
  noteMethod(
    "photometry",
    `Luminous efficacy of radiation was computed as Km·Σ S·V·Δλ / Σ S·Δλ with Km = ${KM} lm/W (CIE 018:2019), the luminous sum over ${range[0]}–${range[1]} nm where the spectrum and V(λ) overlap and the radiant power Σ S·Δλ over the whole measured range, ${w[0]}–${w.at(-1)} nm.`,
  );
  return (KM * sum) / radiant;
}

/**
 * Scotopic-to-photopic ratio S/P = K′m Σ S V′ Δλ ÷ (Km Σ S V Δλ), K′m = 1700 lm/W, Km = 683 lm/W.
 *
 * @param spd A light's spectral distribution (any scale).
 * @returns S/P, dimensionless.
 * @source CIE 018:2019 (V, V′, Km and K′m).
 * @example scotopicPhotopicRatio(illuminant("A"))
 */
export function scotopicPhotopicRatio(spd: Spectrum): number {
  checkSpectrum("scotopicPhotopicRatio", "spd", spd, { what: "a spectrum of a light source" });
  const p = spectralLuminousSum(spd, "photopic");
  const s = spectralLuminousSum(spd, "scotopic");
  if (!(p.sum > 0)) throw new Error(`scotopicPhotopicRatio: "${spd.name}" has no photopic luminous power`);
  noteMethod(
    "photometry",
    `Scotopic-to-photopic ratios were computed as S/P = ${KM_SCOTOPIC}·Σ S·V′·Δλ / (${KM}·Σ S·V·Δλ) (CIE 018:2019), with V′ summed over ${s.range[0]}–${s.range[1]} nm and V over ${p.range[0]}–${p.range[1]} nm.`,
  );
  return (KM_SCOTOPIC * s.sum) / (KM * p.sum);
}

/**
 * The spectrum scaled so that its photopic value Km Σ S V Δλ equals `target`.
 *
 * @param spd A spectral distribution with luminous power.
 * @param target The photopic value wanted, positive: cd/m², lx or lm as the spectrum's unit implies.
 * @returns A new `Spectrum` on the same wavelengths.
 * @source CIE 018:2019 eq. 2 (Km = 683 lm/W).
 * @example luminance(normaliseToLuminance(spectrumOnGrid(380, 5, new Array(81).fill(1), { quantity: "radiance" }), 100))
 */
export function normaliseToLuminance(spd: Spectrum, target: number): Spectrum {
  checkSpectrum("normaliseToLuminance", "spd", spd, { what: "a spectral radiance" });
  checkNumber("normaliseToLuminance", "target", target, { unit: "cd/m²", above: 0 });
  if (!(Number.isFinite(target) && target > 0))
    throw new Error(`normaliseToLuminance: target ${target} must be a positive finite number`);
  const { sum } = spectralLuminousSum(spd, "photopic");
  if (!(sum > 0))
    throw new Error(`normaliseToLuminance: "${spd.name}" has no luminous power to scale to ${target}`);
  const k = target / (KM * sum);
  noteMethod("normalisation", `Spectra were scaled to a photopic value of ${target} (Km = ${KM} lm/W).`);
  return withValues(
    spd,
    spd.values.map((v) => v * k),
  );
}

type LuminousOptions = Pick<
  ObjectColourOptions,
  "illuminant" | "interval" | "range" | "interpolation" | "extrapolation"
>;

function luminousFactor(
  what: string,
  sample: Spectrum,
  quantity: "transmittance" | "reflectance",
  options: LuminousOptions,
): number {
  if (sample.quantity !== quantity && sample.quantity !== "other") {
    throw new Error(`${what}: "${sample.name}" is a ${sample.quantity} spectrum, not a ${quantity}`);
  }
  return tristimulus(sample, { ...options, observer: "2°" }).Y / 100;
}

/**
 * Luminous transmittance τv = Σ S τ V Δλ ÷ Σ S V Δλ, i.e. Y ÷ 100 with the CIE 1931 observer, under D65 unless another illuminant is given.
 *
 * A bare number cannot carry a caution: for a safety use, `transmittedLight()` and `filterSunglassCategory()`
 * return τv with a `caution` field the report shows.
 *
 * @param sample A transmittance spectrum, values as fractions (quantity "transmittance" or "other").
 * @returns τv as a fraction 0–1.
 * @source ISO/CIE 11664-3; CIE 015:2018 §7.1.
 * @example luminousTransmittance(spectrumOnGrid(380, 5, new Array(81).fill(0.5), { quantity: "transmittance" }))
 */
export function luminousTransmittance(sample: Spectrum, options: LuminousOptions = {}): number {
  checkSpectrum("luminousTransmittance", "sample", sample, {
    what: "a transmittance spectrum (fractions 0–1)",
  });
  checkLuminousOptions("luminousTransmittance", options);
  const t = luminousFactor("luminousTransmittance", sample, "transmittance", options);
  noteMethod(
    "photometry",
    "Luminous transmittance τv was computed as the mean of the spectral transmittance weighted by S(λ)·V(λ), i.e. Y/100 with the CIE 1931 observer (ISO/CIE 11664-3).",
  );
  return t;
}

/**
 * Luminous reflectance ρv = Σ S ρ V Δλ ÷ Σ S V Δλ, i.e. Y ÷ 100 with the CIE 1931 observer, under D65 unless another illuminant is given.
 *
 * @param sample A reflectance spectrum, values as fractions (quantity "reflectance" or "other").
 * @returns ρv as a fraction 0–1.
 * @source CIE 015:2018 §7.1.
 * @example luminousReflectance(spectrumOnGrid(380, 5, new Array(81).fill(0.2), { quantity: "reflectance" }), { illuminant: "A" })
 */
export function luminousReflectance(sample: Spectrum, options: LuminousOptions = {}): number {
  checkSpectrum("luminousReflectance", "sample", sample, { what: "a reflectance spectrum (fractions 0–1)" });
  checkLuminousOptions("luminousReflectance", options);
  const r = luminousFactor("luminousReflectance", sample, "reflectance", options);
  noteMethod(
    "photometry",
    "Luminous reflectance ρv was computed as the mean of the spectral reflectance weighted by S(λ)·V(λ), i.e. Y/100 with the CIE 1931 observer.",
  );
  return r;
}
