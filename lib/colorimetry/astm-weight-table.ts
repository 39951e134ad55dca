/** Internal: building and caching ASTM E2022 weighting tables (see astm-weights.ts for the method). */
import { withoutMethodNotes } from "../methods/method-log.ts";
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
import { checkChoice } from "../arguments/check-text.ts";
import { ArgumentError } from "../arguments/argument-error.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkIlluminantChoice, checkObserver } from "../arguments/common-arguments.ts";

import { STEARNS_ALPHA, type AstmWeightOptions, type AstmWeights } from "./astm-weights.ts";

const cache = new Map<string, AstmWeights>();
const objectCache = new WeakMap<Spectrum, Map<string, AstmWeights>>();

/** Internal: the weights for checked arguments, cached per illuminant, observer, interval, range and bandpass. */
export function astmWeightsFor(
  ill: string | Spectrum | undefined,
  obsOption: AstmWeightOptions["observer"],
  interval: 10 | 20,
  range: readonly [number, number] | undefined,
  bandpass: "none" | "included",
): AstmWeights {
  const obs = observerByName(obsOption ?? "2°");
  const [a, b] = range ?? [360, interval === 10 ? 830 : 820];
  const key = `${obs.name}|${interval}|${a}-${b}|${bandpass}`;
  let store: Map<string, AstmWeights>;
  if (typeof ill === "object") {
    store = objectCache.get(ill) ?? new Map();
    objectCache.set(ill, store);
  } else store = cache;
  const full = typeof ill === "object" ? key : `${ill ?? "D65"}|${key}`;
  let table = store.get(full);
  if (!table) {
    const s =
      ill === undefined ? illuminantByName("D65") : typeof ill === "string" ? illuminantByName(ill) : ill;
    table = buildAstmWeights(s, obs, interval, a, b, bandpass);
    store.set(full, table);
  }
  return table;
}

function buildAstmWeights(
  ill: Spectrum,
  obs: Observer,
  interval: 10 | 20,
  first: number,
  last: number,
  bandpass: "none" | "included",
): AstmWeights {
  const n = Math.round((last - first) / interval) + 1;
  const grid = Array.from({ length: n }, (_, i) => first + i * interval);
  const readS = withoutMethodNotes(() => sampler(ill, { extrapolation: "refuse" }));
  const illStart = ill.wavelengths[0]!,
    illEnd = ill.wavelengths.at(-1)!;
  if (illStart > 360 || illEnd < 830)
    throw new Error(
      `astmWeightingFactors: illuminant "${ill.name}" (${illStart}–${illEnd} nm) must cover 360–830 nm, the range E2022 sums at 1 nm`,
    );
  const onGrid = new Set(ill.wavelengths.map((w) => Math.round(w * 1e6)));
  let interpolated = false;
  const wx = new Float64Array(n),
    wy = new Float64Array(n),
    wz = new Float64Array(n);
  let sumY = 0;
  const coeff = new Float64Array(4);
  for (let l = 360; l <= 830; l++) {
    if (!onGrid.has(l * 1e6)) interpolated = true;
    const s = withoutMethodNotes(() => readS(l));
    const [x, y, z] = colourMatchingAt(obs, l);
    sumY += s * y;
    const ex = s * x,
      ey = s * y,
      ez = s * z;
    if (l <= first || l >= last) {
      // On or beyond an end of the measured range: the end value (held beyond it).
      const j = l <= first ? 0 : n - 1;
      wx[j]! += ex;
      wy[j]! += ey;
      wz[j]! += ez;
      continue;
    }
    const j = Math.floor((l - first) / interval); // l lies in [grid[j], grid[j + 1])
    const t = (l - grid[j]!) / interval;
    if (t === 0) {
      wx[j]! += ex;
      wy[j]! += ey;
      wz[j]! += ez;
      continue;
    }
    // Lagrange coefficients: quadratic in the first/last interval (or when only three points exist), else cubic.
    let base: number, count: number;
    if (n < 3) {
      base = j;
      count = 2;
    } else if (n === 3 || j === 0) {
      base = 0 + (j === 0 ? 0 : n - 3);
      count = 3;
    } else if (j === n - 2) {
      base = n - 3;
      count = 3;
    } else {
      base = j - 1;
      count = 4;
    }
    const u = (l - grid[base]!) / interval; // position in units of the interval from the first node used
    for (let m = 0; m < count; m++) {
      let c = 1;
      for (let q = 0; q < count; q++) if (q !== m) c *= (u - q) / (m - q);
      coeff[m] = c;
    }
    for (let m = 0; m < count; m++) {
      wx[base + m]! += ex * coeff[m]!;
      wy[base + m]! += ey * coeff[m]!;
      wz[base + m]! += ez * coeff[m]!;
    }
  }
  if (!(sumY > 0))
    throw new Error(`astmWeightingFactors: illuminant "${ill.name}" has no power where the observer sees`);
  const k = 100 / sumY;
  for (const w of [wx, wy, wz]) for (let i = 0; i < n; i++) w[i]! *= k;
  if (bandpass === "included") for (const w of [wx, wy, wz]) applyTransposedCorrection(w);
  let X = 0,
    Y = 0,
    Z = 0;
  for (let i = 0; i < n; i++) {
    X += wx[i]!;
    Y += wy[i]!;
    Z += wz[i]!;
  }
  const band =
    bandpass === "included"
      ? " with the ASTM E308 Stearns–Stearns bandpass correction (α = 0.083) folded into the weights"
      : " without bandpass correction";
  return {
    wavelengths: grid,
    wx,
    wy,
    wz,
    white: { X, Y, Z },
    interval,
    bandpass,
    illuminantName: ill.name,
    observer: obs,
    notes: {
      integration: `Tristimulus values of object colours measured at ${interval} nm over ${first}–${last} nm were summed with weighting factors computed by the method of ASTM E2022 from the 1 nm illuminant and colour-matching functions over 360–830 nm (Lagrange interpolation coefficients, end values held)${band}, with the normalising constant chosen so that the perfect reflecting diffuser has Y = 100.`,
      white: `Reference whites were the sums of the ASTM E2022 weighting factors at ${interval} nm over ${first}–${last} nm under ${ill.name}${band}, with Y = 100.`,
      ...(interpolated ? { interpolation: interpolationStatement(ill) } : {}),
    },
  };
}

/** W ← Cᵀ W for the Stearns–Stearns correction C (interior rows −α, 1 + 2α, −α; end rows 1 + α, −α). */
function applyTransposedCorrection(w: Float64Array): void {
  const n = w.length;
  if (n < 2) return;
  const a = STEARNS_ALPHA;
  const src = Float64Array.from(w);
  // Column j of C holds the coefficients by which measured value j enters each corrected value.
  for (let j = 0; j < n; j++) {
    let acc = 0;
    for (let i = Math.max(0, j - 1); i <= Math.min(n - 1, j + 1); i++)
      acc += src[i]! * correctionCoefficient(i, j, n, a);
    w[j] = acc;
  }
}

/** C[i][j] of the Stearns–Stearns correction of n values. */
function correctionCoefficient(i: number, j: number, n: number, a: number): number {
  if (i === 0) return j === 0 ? 1 + a : j === 1 ? -a : 0;
  if (i === n - 1) return j === n - 1 ? 1 + a : j === n - 2 ? -a : 0;
  return j === i ? 1 + 2 * a : Math.abs(j - i) === 1 ? -a : 0;
}
