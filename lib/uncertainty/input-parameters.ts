/**
 * Internal: each uncertain input as a vector of independent (or, for correlated noise, AR(1)-correlated) deviations
 * θ with known standard deviations, a way to draw θ, and the input's value for a given θ. Both propagators work on
 * this one form, so Monte Carlo and the law of propagation see exactly the same model.
 */
import type { Spectrum } from "../spectrum/spectrum.ts";
import type { RandomSource } from "./random-numbers.ts";
import type { SpectralInput, UncertainInput } from "./input-models.ts";

/** An exponentially correlated block of parameters: correlation exp(−|λi − λj| ÷ length). */
export interface CorrelatedBlock {
  readonly start: number;
  readonly wavelengths: readonly number[];
  readonly length: number;
}

/** One input expanded into parameters. */
export interface ExpandedInput {
  readonly name: string;
  readonly dims: number;
  /** Standard deviation of each parameter. */
  readonly std: Float64Array;
  readonly correlated?: CorrelatedBlock;
  /** Draws the parameters into theta[offset .. offset + dims). */
  sample(rng: RandomSource, theta: Float64Array, offset: number): void;
  /** The input's value for the parameters at theta[offset ..]. */
  value(theta: Float64Array, offset: number): number | Spectrum;
  /** The estimate (all parameters zero). */
  readonly estimate: number | Spectrum;
  /** The Methods wording of the model ("a normal distribution with standard uncertainty 0.05 mg"). */
  readonly description: string;
}

const fmt = (v: number): string => String(Number(v.toPrecision(3)));

/** Expands an input model. */
export function expandInput(name: string, input: UncertainInput): ExpandedInput {
  if (input.model === "spectrum") return expandSpectrum(name, input);
  const { estimate, standardUncertainty: u } = input;
  const unit = input.unit ? ` ${input.unit}` : "";
  const a = input.halfWidth ?? 0;
  const std = new Float64Array([u]);
  let sample: ExpandedInput["sample"];
  let description: string;
  if (input.model === "normal") {
    sample = (rng, t, o) => void (t[o] = u * rng.normal());
    description = `a normal distribution with expectation ${fmt(estimate)}${unit} and standard uncertainty ${fmt(u)}${unit}`;
  } else if (input.model === "rectangular") {
    sample = (rng, t, o) => void (t[o] = a * (2 * rng.uniform() - 1));
    description = `a rectangular distribution over ${fmt(estimate)} ± ${fmt(a)}${unit}`;
  } else {
    sample = (rng, t, o) => void (t[o] = a * (rng.uniform() + rng.uniform() - 1));
    description = `a triangular distribution over ${fmt(estimate)} ± ${fmt(a)}${unit}`;
  }
  return {
    name,
    dims: 1,
    std,
    sample,
    value: (t, o) => estimate + t[o]!,
    estimate,
    description,
  };
}

function expandSpectrum(name: string, input: SpectralInput): ExpandedInput {
  const s = input.estimate;
  const wl = s.wavelengths;
  const v = s.values;
  const n = wl.length;
  const scale = input.scale ?? 0;
  const shift = input.wavelengthShift ?? 0;
  const bw = input.bandwidthError;
  const noise = input.bandNoise ?? 0;
  const corr = input.correlatedNoise;
  // Layout: [scale, shift, bandwidth, noise × n, correlated × n], each present only when its uncertainty is given.
  let dims = 0;
  const iScale = scale > 0 ? dims++ : -1;
  const iShift = shift > 0 ? dims++ : -1;
  const iBw = bw && bw.u > 0 ? dims++ : -1;
  const iNoise = noise > 0 ? ((dims += n), dims - n) : -1;
  const iCorr = corr && corr.u > 0 ? ((dims += n), dims - n) : -1;
  const std = new Float64Array(dims);
  if (iScale >= 0) std[iScale] = scale;
  if (iShift >= 0) std[iShift] = shift;
  if (iBw >= 0) std[iBw] = bw!.u;
  if (iNoise >= 0) std.fill(noise, iNoise, iNoise + n);
  if (iCorr >= 0) std.fill(corr!.u, iCorr, iCorr + n);
  // Second derivative of the estimate (three-point formula on any grid; zero at the ends), for the bandwidth effect.
  const second = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) {
    const h1 = wl[i]! - wl[i - 1]!,
      h2 = wl[i + 1]! - wl[i]!;
    second[i] = (2 * ((v[i + 1]! - v[i]!) / h2 - (v[i]! - v[i - 1]!) / h1)) / (h1 + h2);
  }
  // AR(1) coefficients between neighbouring bands: the exact exponential correlation on any grid.
  const rho = new Float64Array(n);
  const rhoC = new Float64Array(n);
  if (corr)
    for (let i = 1; i < n; i++) {
      rho[i] = Math.exp(-(wl[i]! - wl[i - 1]!) / corr.length);
      rhoC[i] = Math.sqrt(1 - rho[i]! * rho[i]!);
    }
  const sample: ExpandedInput["sample"] = (rng, t, o) => {
    if (iScale >= 0) t[o + iScale] = scale * rng.normal();
    if (iShift >= 0) t[o + iShift] = shift * rng.normal();
    if (iBw >= 0) t[o + iBw] = bw!.u * rng.normal();
    if (iNoise >= 0) for (let i = 0; i < n; i++) t[o + iNoise + i] = noise * rng.normal();
    if (iCorr >= 0) {
      const u = corr!.u;
      let prev = rng.normal();
      t[o + iCorr] = u * prev;
      for (let i = 1; i < n; i++) {
        prev = rho[i]! * prev + rhoC[i]! * rng.normal();
        t[o + iCorr + i] = u * prev;
      }
    }
  };
  const value: ExpandedInput["value"] = (t, o) => {
    const out = new Array<number>(n);
    const d = iShift >= 0 ? t[o + iShift]! : 0;
    if (d !== 0) {
      // S(λi + δ) by linear interpolation of the estimate, end values held.
      let j = 0;
      for (let i = 0; i < n; i++) {
        const w = wl[i]! + d;
        if (w <= wl[0]!) out[i] = v[0]!;
        else if (w >= wl[n - 1]!) out[i] = v[n - 1]!;
        else {
          while (j < n - 2 && wl[j + 1]! < w) j++;
          while (j > 0 && wl[j]! > w) j--;
          const f = (w - wl[j]!) / (wl[j + 1]! - wl[j]!);
          out[i] = v[j]! + f * (v[j + 1]! - v[j]!);
        }
      }
    } else for (let i = 0; i < n; i++) out[i] = v[i]!;
    if (iBw >= 0) {
      const b = bw!.bandwidth,
        db = t[o + iBw]!;
      const k = ((b + db) * (b + db) - b * b) / 12;
      for (let i = 0; i < n; i++) out[i]! += k * second[i]!;
    }
    const f = iScale >= 0 ? 1 + t[o + iScale]! : 1;
    if (f !== 1) for (let i = 0; i < n; i++) out[i]! *= f;
    if (iNoise >= 0) for (let i = 0; i < n; i++) out[i]! += t[o + iNoise + i]!;
    if (iCorr >= 0) for (let i = 0; i < n; i++) out[i]! += t[o + iCorr + i]!;
    return {
      kind: "spectrum",
      name: s.name,
      quantity: s.quantity,
      unit: s.unit,
      wavelengths: wl,
      values: out,
    };
  };
  const parts: string[] = [];
  if (iScale >= 0)
    parts.push(`a relative photometric-scale error (standard uncertainty ${fmt(scale * 100)} %)`);
  if (iNoise >= 0) parts.push(`independent noise in each band (standard uncertainty ${fmt(noise)})`);
  if (iCorr >= 0)
    parts.push(
      `noise correlated across bands (standard uncertainty ${fmt(corr!.u)}, exponential correlation length ${fmt(corr!.length)} nm)`,
    );
  if (iShift >= 0) parts.push(`a wavelength-scale shift (standard uncertainty ${fmt(shift)} nm)`);
  if (iBw >= 0)
    parts.push(
      `a bandwidth error (triangular bandpass ${fmt(bw!.bandwidth)} nm, standard uncertainty ${fmt(bw!.u)} nm, effect S″·Δ(b²)/12)`,
    );
  const description = parts.length
    ? `a measured ${s.quantity === "other" ? "" : `${s.quantity} `}spectrum with ${joinWords(parts)}, each normal and independent of the others`
    : `a measured spectrum with no uncertainty stated`;
  return {
    name,
    dims,
    std,
    ...(iCorr >= 0 ? { correlated: { start: iCorr, wavelengths: wl, length: corr!.length } } : {}),
    sample,
    value,
    estimate: s,
    description,
  };
}

function joinWords(parts: readonly string[]): string {
  if (parts.length < 2) return parts.join("");
  return `${parts.slice(0, -1).join(", ")} and ${parts.at(-1)}`;
}
