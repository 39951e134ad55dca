/**
 * Tristimulus values X, Y, Z from spectra by summation over the CIE colour-matching functions
 * (CIE 015:2018 §7.1–7.2, eqs. 7.1–7.2; the 1 nm / 5 nm practice of ASTM E308-22 §7).
 */
import { noteMethod, withoutMethodNotes } from "../methods/method-log.ts";
import {
  colourMatchingAt,
  observerByName,
  type Observer,
  type ObserverName,
} from "../observers/standard-observer.ts";
import { illuminant as illuminantByName } from "../illuminants/standard-illuminant.ts";
import { regularStep } from "../spectrum/grid.ts";
import {
  interpolationStatement,
  sampler,
  type Extrapolation,
  type Interpolation,
} from "../spectrum/sample.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import type { Tristimulus } from "./chromaticity.ts";
import { checkList, checkSpectrumList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum, isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkLightOptions, checkObjectColourOptions, checkTableOptions } from "../arguments/option-sets.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { astmWeightsFor } from "./astm-weight-table.ts";

export interface ObjectColourOptions {
  /** Illuminant name ("D65", "A", "FL2", ...) or a spectrum; default D65. */
  illuminant?: string | Spectrum;
  /** Observer; default the CIE 1931 2° observer. */
  observer?: ObserverName | Observer | 2 | 10;
  /**
   * Summation interval in nm: 1 or 5 (the sample interpolated where needed), or 10 or 20 (weighting factors by the
   * method of ASTM E2022 at the sample's own wavelengths). Default: 10 or 20 when the sample is tabulated every 10 or
   * 20 nm on whole nanometres within 360–830 nm (the trade's practice, ASTM E308); else 1 when both the sample and the
   * illuminant are tabulated at 1 nm, otherwise 5 (CIE 015:2018 §7.2). Pass 1 or 5 to interpolate 10/20 nm data instead.
   */
  interval?: 1 | 5 | 10 | 20;
  /**
   * Bandpass of 10/20 nm data: "none" (default; data already corrected, or a narrow bandpass) or "included" (weights
   * with the ASTM E308 bandpass correction folded in, for uncorrected data from a triangular bandpass equal to the interval).
   */
  bandpass?: "none" | "included";
  /**
   * Wavelength range of the summation, cut to what the illuminant covers. Default 360–830 nm, the full tabulated
   * range of the colour-matching functions (CIE 015:2018 §7.2), which reproduces the ASTM E308 white points (e.g. D50
   * 2°: X = 96.422, Z = 82.521). The CIE 015:2004 Table T.3 chromaticities of the 5 nm illuminants were summed over
   * 380–780 nm: pass `range: CIE_015_TABLE_RANGE` with `interval: 5` to reproduce them (D50 2°: x = 0.34567,
   * y = 0.35851, against y = 0.35850 over 360–830 nm). The Methods statement names the range and which convention it is.
   */
  range?: readonly [number, number];
  /** How the sample is read between its samples (default "auto": Sprague for even data, CIE 167:2005). */
  interpolation?: Interpolation;
  /** How the sample is read beyond its measured range (default "hold": the end values, CIE 015:2018 §7.2.2). */
  extrapolation?: Extrapolation;
}

/** The default summation range: 360–830 nm (CIE 015:2018 §7.2), at 1 nm and at 5 nm. */
export const DEFAULT_SUMMATION_RANGE: readonly [number, number] = [360, 830];
/** 380–780 nm: the range over which the CIE 015:2004 Table T.3 white points of the 5 nm illuminants were summed. */
export const CIE_015_TABLE_RANGE: readonly [number, number] = [380, 780];

/** The weighting functions k·S(λ)·x̄(λ), k·S(λ)·ȳ(λ), k·S(λ)·z̄(λ) on a grid, k = 100/Σ S ȳ (CIE 015:2018 eq. 7.2). */
export interface WeightingTable {
  readonly wavelengths: readonly number[];
  readonly wx: Float64Array;
  readonly wy: Float64Array;
  readonly wz: Float64Array;
  readonly illuminantName: string;
  readonly observer: Observer;
  readonly interval: 1 | 5 | 10 | 20;
  /** The first and last summation wavelengths (nm). */
  readonly range: readonly [number, number];
  /** The perfect reflecting diffuser on this table, Σ k·S·x̄, Σ k·S·ȳ (= 100), Σ k·S·z̄: the reference white of its samples. */
  readonly white: Tristimulus;
  /** What the Methods section says about this table (observer, illuminant, summation, and the illuminant's interpolation if any). */
  readonly notes: {
    readonly observer: string;
    readonly illuminant: string;
    readonly integration: string;
    /** What the Methods section says when the table served only for a reference white (whitePoint). */
    readonly white: string;
    readonly interpolation?: string;
  };
}

type TableOptions = Pick<ObjectColourOptions, "illuminant" | "observer" | "interval" | "range">;

const namedCache = new Map<string, WeightingTable>();
const objectCache = new WeakMap<Spectrum, Map<string, WeightingTable>>();

function resolveIlluminant(ill: string | Spectrum | undefined): Spectrum {
  if (ill === undefined) return illuminantByName("D65");
  return typeof ill === "string" ? illuminantByName(ill) : ill;
}

function checkInterval(interval: number): asserts interval is 1 | 5 {
  if (interval !== 1 && interval !== 5)
    throw new Error(
      `tristimulus: summation interval ${interval} nm is not supported; use 1 or 5 nm (CIE 015:2018 §7.2)`,
    );
}

function resolveRange(
  requested: readonly [number, number] | undefined,
  ill: Spectrum,
  obs: Observer,
): [number, number] {
  const [a, b] = requested ?? DEFAULT_SUMMATION_RANGE;
  if (!(Number.isFinite(a) && Number.isFinite(b) && a < b))
    throw new Error(`tristimulus: wavelength range ${a}–${b} nm is not valid`);
  const start = Math.max(a, ill.wavelengths[0]!, obs.wavelengths[0]!);
  const end = Math.min(b, ill.wavelengths.at(-1)!, obs.wavelengths.at(-1)!);
  if (end <= start)
    throw new Error(
      `tristimulus: illuminant "${ill.name}" (${ill.wavelengths[0]}–${ill.wavelengths.at(-1)} nm) does not cover ${a}–${b} nm`,
    );
  return [start, end];
}

function gridFor(range: [number, number], interval: number): number[] {
  const first = Math.ceil(range[0] / interval - 1e-9) * interval;
  const out: number[] = [];
  for (let w = first; w <= range[1] + 1e-9; w += interval) out.push(Math.round(w * 1e9) / 1e9);
  return out;
}

/** Why the summation range is what it is, for the Methods statement (the choice matters in the fifth decimal of xy). */
function rangeWords(first: number, last: number, requested: readonly [number, number] | undefined): string {
  if (first === DEFAULT_SUMMATION_RANGE[0] && last === DEFAULT_SUMMATION_RANGE[1]) {
    return " (the full tabulated range of the CIE colour-matching functions, CIE 015:2018 §7.2; the convention of the ASTM E308 white points)";
  }
  if (first === CIE_015_TABLE_RANGE[0] && last === CIE_015_TABLE_RANGE[1])
    return " (the range of the CIE 015:2004 Table T.3 white points)";
  const [a, b] = requested ?? DEFAULT_SUMMATION_RANGE;
  return first > a || last < b ? " (the part of the requested range the illuminant covers)" : "";
}

function buildTable(
  ill: Spectrum,
  obs: Observer,
  interval: 1 | 5,
  range: [number, number],
  requested: readonly [number, number] | undefined,
  fromSample = false,
): WeightingTable {
  const wavelengths = gridFor(range, interval);
  // Built once and kept: the illuminant's interpolation is stated on every use of the table (notes.interpolation),
  // not by the sampler here, which would note it only for the computation that happened to build the table.
  const readS = withoutMethodNotes(() => sampler(ill, { extrapolation: "refuse" }));
  const illuminantSamples = new Set(ill.wavelengths.map((w) => Math.round(w * 1e6)));
  const interpolated = wavelengths.some((w) => !illuminantSamples.has(Math.round(w * 1e6)));
  const n = wavelengths.length;
  const wx = new Float64Array(n),
    wy = new Float64Array(n),
    wz = new Float64Array(n);
  let sumY = 0;
  for (let i = 0; i < n; i++) {
    const s = withoutMethodNotes(() => readS(wavelengths[i]!));
    const [x, y, z] = colourMatchingAt(obs, wavelengths[i]!);
    wx[i] = s * x;
    wy[i] = s * y;
    wz[i] = s * z;
    sumY += s * y;
  }
  if (!(sumY > 0))
    throw new Error(`tristimulus: illuminant "${ill.name}" has no power where the observer sees`);
  const k = 100 / sumY;
  let X = 0,
    Y = 0,
    Z = 0;
  for (let i = 0; i < n; i++) {
    wx[i]! *= k;
    wy[i]! *= k;
    wz[i]! *= k;
    X += wx[i]!;
    Y += wy[i]!;
    Z += wz[i]!;
  }
  const first = wavelengths[0]!,
    last = wavelengths.at(-1)!;
  const rangePhrase = fromSample
    ? " (the measured range of the samples within the 360–830 nm of the colour-matching functions, without extrapolation)"
    : rangeWords(first, last, requested);
  return {
    wavelengths,
    wx,
    wy,
    wz,
    illuminantName: ill.name,
    observer: obs,
    interval,
    range: [first, last],
    white: { X, Y, Z },
    notes: {
      observer: observerStatement(obs),
      illuminant: `Object colours were computed under ${ill.name}.`,
      white: `Reference whites were the perfect reflecting diffuser under ${ill.name}, summed at ${interval} nm intervals over ${first}–${last} nm${rangePhrase}, with Y = 100 (CIE 015:2018 §7.1).`,
      integration: `Tristimulus values of object colours were summed at ${interval} nm intervals over ${first}–${last} nm${rangePhrase}, with the normalising constant chosen so that the perfect reflecting diffuser has Y = 100 (CIE 015:2018 §7.1).`,
      ...(interpolated ? { interpolation: interpolationStatement(ill) } : {}),
    },
  };
}

/** The Methods statement for an observer. */
function observerStatement(obs: Observer): string {
  return `Colorimetric values were computed for the ${obs.name}.`;
}

function tableFor(
  illuminantOption: string | Spectrum | undefined,
  observerOption: TableOptions["observer"],
  interval: 1 | 5,
  rangeOption: TableOptions["range"],
  fromSample = false,
): WeightingTable {
  checkInterval(interval);
  const ill = resolveIlluminant(illuminantOption);
  const obs = observerByName(observerOption ?? "2°");
  const key = `${obs.name}|${interval}|${rangeOption ? rangeOption.join("-") : "default"}${fromSample ? "|sample" : ""}`;
  let cache: Map<string, WeightingTable> | undefined;
  if (typeof illuminantOption === "object") {
    cache = objectCache.get(illuminantOption);
    if (!cache) objectCache.set(illuminantOption, (cache = new Map()));
  } else cache = namedCache;
  const fullKey = typeof illuminantOption === "object" ? key : `${ill.name}|${key}`;
  let table = cache.get(fullKey);
  if (!table) {
    table = buildTable(ill, obs, interval, resolveRange(rangeOption, ill, obs), rangeOption, fromSample);
    cache.set(fullKey, table);
  }
  return table;
}

/**
 * The weighting table k·S(λ)·x̄(λ), k·S(λ)·ȳ(λ), k·S(λ)·z̄(λ), k = 100 ÷ Σ S ȳ, for an illuminant and observer at 1 or 5 nm (computed once per run and kept).
 *
 * @param options.interval The summation interval in nm, 1 or 5 (required here).
 * @returns The `WeightingTable`: wavelengths (nm), wx, wy, wz, the white (perfect reflecting diffuser, Y = 100), range and Methods notes.
 * @source CIE 015:2018 §7.1–7.2, eq. 7.2; ASTM E308 for the 1 nm / 5 nm practice.
 * @example weightingTable({ illuminant: "D65", interval: 5 }).white
 */
export function weightingTable(options: TableOptions & { interval: 1 | 5 }): WeightingTable {
  checkWith(
    "weightingTable",
    "options",
    options,
    "options { interval: 1 or 5 (nm), illuminant?, observer?, range? }",
    (o) =>
      typeof o === "object" &&
      o !== null &&
      [1, 5].includes((o as { interval?: unknown }).interval as number),
  );
  checkTableOptions("weightingTable", options);
  return tableFor(options.illuminant, options.observer, options.interval, options.range);
}

function defaultInterval(sample: Spectrum | undefined, ill: Spectrum): 1 | 5 {
  const illStep = regularStep(ill);
  if (illStep !== undefined && illStep > 1) return 5;
  if (!sample) return 1;
  return regularStep(sample) === 1 ? 1 : 5;
}

/**
 * The summation interval `tristimulus()` would choose for all these samples together: 1 nm only when every sample and every illuminant is tabulated at 1 nm, otherwise 5 nm.
 *
 * Use it to put samples from different grids, and their whites, on one weighting table.
 *
 * @param samples The sample spectra (at least one).
 * @param illuminants Illuminant names or spectra; default [D65] (an `undefined` entry means D65).
 * @returns 1 or 5 (nm).
 * @source CIE 015:2018 §7.2.
 * @example commonSummationInterval([spectrumOnGrid(380, 5, new Array(81).fill(0.5))], ["D65", "A"])
 */
export function commonSummationInterval(
  samples: readonly Spectrum[],
  illuminants: readonly (string | Spectrum | undefined)[] = [undefined],
): 1 | 5 {
  checkSpectrumList("commonSummationInterval", "samples", samples, { minLength: 1 });
  checkList(
    "commonSummationInterval",
    "illuminants",
    illuminants,
    "illuminant names or spectra",
    (i) => i === undefined || typeof i === "string" || isWellFormedSpectrum(i),
  );
  if (!Array.isArray(samples) || samples.length === 0)
    throw new Error("commonSummationInterval: give at least one sample spectrum");
  for (const ill of illuminants.length > 0 ? illuminants : [undefined]) {
    const s = resolveIlluminant(ill);
    for (const sample of samples) if (defaultInterval(sample, s) === 5) return 5;
  }
  return 1;
}

function checkObjectSample(sample: Spectrum, what: string): void {
  if (sample?.kind !== "spectrum")
    throw new Error(`${what}: expected a reflectance or transmittance spectrum, got ${String(sample)}`);
  if (
    sample.quantity !== "reflectance" &&
    sample.quantity !== "transmittance" &&
    sample.quantity !== "other"
  ) {
    throw new Error(
      `${what}: "${sample.name}" is a ${sample.quantity} spectrum; for a light source use lightTristimulus()`,
    );
  }
}

/**
 * The summation range a sample gets unless a range is asked for: the wavelengths it was measured at, within the
 * 360–830 nm of the colour-matching functions (no extrapolation; the library's one convention for lights and objects).
 */
function measuredRange(sample: Spectrum): [number, number] {
  return [
    Math.max(sample.wavelengths[0]!, DEFAULT_SUMMATION_RANGE[0]),
    Math.min(sample.wavelengths.at(-1)!, DEFAULT_SUMMATION_RANGE[1]),
  ];
}

/** 10 or 20 when the sample is tabulated every 10 or 20 nm on whole nanometres within 360–830 nm, else undefined. */
function coarseStep(sample: Spectrum): 10 | 20 | undefined {
  const step = regularStep(sample);
  if (step !== 10 && step !== 20) return undefined;
  const w = sample.wavelengths;
  if (!Number.isInteger(w[0]!) || w.length < 3) return undefined;
  if (w[0]! > 830 - 2 * step || w.at(-1)! < 360 + 2 * step) return undefined;
  return step;
}

/** A weighting table of ASTM E2022 factors on the sample's wavelengths within 360–830 nm (or the range asked for). */
function astmTableForSample(
  sample: Spectrum,
  options: ObjectColourOptions,
  interval: 10 | 20,
  chosen: boolean,
): WeightingTable {
  let range = options.range;
  if (!range) {
    const w = sample.wavelengths;
    const step = regularStep(sample);
    // The sample's own grid when it is at the interval, else the interval's grid within its measured range.
    const origin = step === interval && Number.isInteger(w[0]!) ? w[0]! : 0;
    const first = origin + Math.ceil((Math.max(360, w[0]!) - origin) / interval) * interval;
    const last = origin + Math.floor((Math.min(830, w.at(-1)!) - origin) / interval) * interval;
    range = [first, last];
  }
  const astm = astmWeightsFor(
    options.illuminant,
    options.observer,
    interval,
    range,
    options.bandpass ?? "none",
  );
  const why = chosen
    ? ` They were chosen because the samples were tabulated every ${interval} nm (ASTM E308 practice); interval 1 or 5 would interpolate them instead.`
    : "";
  return {
    wavelengths: astm.wavelengths,
    wx: astm.wx,
    wy: astm.wy,
    wz: astm.wz,
    illuminantName: astm.illuminantName,
    observer: astm.observer,
    interval,
    range: [astm.wavelengths[0]!, astm.wavelengths.at(-1)!],
    white: astm.white,
    notes: {
      observer: observerStatement(astm.observer),
      illuminant: `Object colours were computed under ${astm.illuminantName}.`,
      integration: astm.notes.integration + why,
      white: astm.notes.white,
      ...(astm.notes.interpolation ? { interpolation: astm.notes.interpolation } : {}),
    },
  };
}

function tableForSample(sample: Spectrum, options: ObjectColourOptions): WeightingTable {
  if (options.interval === 10 || options.interval === 20)
    return astmTableForSample(sample, options, options.interval, false);
  if (options.interval === undefined) {
    const coarse = coarseStep(sample);
    if (coarse !== undefined) return astmTableForSample(sample, options, coarse, true);
  }
  if (options.bandpass !== undefined && options.bandpass !== "none")
    throw new Error(
      `tristimulus: bandpass "${options.bandpass}" applies to 10 and 20 nm weighting factors only; for ${options.interval ?? "1 or 5"} nm summation correct the data with bandpassCorrection() first`,
    );
  const interval = options.interval ?? defaultInterval(sample, resolveIlluminant(options.illuminant));
  return tableFor(
    options.illuminant,
    options.observer,
    interval,
    options.range ?? measuredRange(sample),
    !options.range,
  );
}

/**
 * X, Y, Z of an object colour: a reflectance or transmittance under an illuminant, normalised so that the perfect reflecting diffuser has Y = 100.
 *
 * For the sample's reference white on the same weighting table, use `objectColour()`. Light sources go to
 * `lightTristimulus()`.
 *
 * @param sample A reflectance or transmittance spectrum, values as fractions (quantity "reflectance", "transmittance" or "other").
 * @returns { X, Y, Z } on the Y = 100 scale.
 * @source CIE 015:2018 §7.1–7.2, eqs. 7.1–7.2; ASTM E308-22 §7 (1 nm and 5 nm practice).
 * @example tristimulus(spectrumOnGrid(380, 5, new Array(81).fill(0.5), { quantity: "reflectance" }), { illuminant: "D50" })
 */
export function tristimulus(sample: Spectrum, options: ObjectColourOptions = {}): Tristimulus {
  checkSpectrum("tristimulus", "sample", sample, {
    what: "a reflectance or transmittance spectrum (fractions 0–1)",
  });
  checkObjectColourOptions("tristimulus", options, ["bandpass"]);
  checkChoice("tristimulus", "options.bandpass", options.bandpass, ["none", "included"], { optional: true });
  checkObjectSample(sample, "tristimulus");
  const table = tableForSample(sample, options);
  const XYZ = sumOnTable(sample, table, options);
  noteObjectColourMethod(table);
  return XYZ;
}

/** A sample's colour and its reference white, both summed on one weighting table, with the conditions used. */
export interface ObjectColour {
  /** X, Y, Z of the sample (the perfect reflecting diffuser has Y = 100). */
  readonly XYZ: Tristimulus;
  /** The reference white for CIELAB and the like: the perfect reflecting diffuser on the same table as the sample. */
  readonly white: Tristimulus;
  /** The illuminant's name. */
  readonly illuminant: string;
  /** The observer's name. */
  readonly observer: string;
  /** Summation interval in nm (10 and 20: ASTM E2022 weighting factors). */
  readonly interval: 1 | 5 | 10 | 20;
  /** First and last summation wavelengths in nm. */
  readonly range: readonly [number, number];
}

/**
 * X, Y, Z of an object colour and its reference white, both from one weighting table, with the conditions used.
 *
 * The white is the perfect reflecting diffuser summed on the same grid, interval and range, so CIELAB and the like
 * never mix summation conditions. Options and defaults are those of `tristimulus()`.
 *
 * @param sample A reflectance or transmittance spectrum, values as fractions.
 * @returns { XYZ, white (both on the Y = 100 scale), illuminant, observer (names), interval (nm), range ([first, last] nm) }.
 * @source CIE 015:2018 §7.1–7.2, eqs. 7.1–7.2.
 * @example objectColour(spectrumOnGrid(380, 5, new Array(81).fill(0.5), { quantity: "reflectance" })).white
 */
export function objectColour(sample: Spectrum, options: ObjectColourOptions = {}): ObjectColour {
  checkSpectrum("objectColour", "sample", sample, {
    what: "a reflectance or transmittance spectrum (fractions 0–1)",
  });
  checkObjectColourOptions("objectColour", options, ["bandpass"]);
  checkChoice("objectColour", "options.bandpass", options.bandpass, ["none", "included"], { optional: true });
  checkObjectSample(sample, "objectColour");
  const table = tableForSample(sample, options);
  const XYZ = sumOnTable(sample, table, options);
  noteObjectColourMethod(table);
  return {
    XYZ,
    white: { ...table.white },
    illuminant: table.illuminantName,
    observer: table.observer.name,
    interval: table.interval,
    range: [...table.range] as [number, number],
  };
}

function sumOnTable(sample: Spectrum, table: WeightingTable, options: ObjectColourOptions): Tristimulus {
  const { wx, wy, wz, interval } = table;
  const n = wx.length;
  const w = sample.wavelengths,
    v = sample.values;
  let X = 0,
    Y = 0,
    Z = 0;
  // Fast path: every summation wavelength is one of the sample's own (evenly spaced) wavelengths.
  const step = regularStep(sample);
  const first = table.wavelengths[0]!;
  const offset = step === undefined ? NaN : (first - w[0]!) / step;
  const stride = step === undefined ? NaN : interval / step;
  const io = Math.round(offset),
    is = Math.round(stride);
  if (
    step !== undefined &&
    Math.abs(offset - io) < 1e-9 &&
    Math.abs(stride - is) < 1e-9 &&
    io >= 0 &&
    is >= 1 &&
    io + (n - 1) * is < w.length
  ) {
    for (let i = 0, j = io; i < n; i++, j += is) {
      const r = v[j]!;
      X += wx[i]! * r;
      Y += wy[i]! * r;
      Z += wz[i]! * r;
    }
  } else {
    const read = sampler(sample, {
      interpolation: options.interpolation,
      extrapolation: options.extrapolation,
    });
    const grid = table.wavelengths;
    for (let i = 0; i < n; i++) {
      const r = read(grid[i]!);
      X += wx[i]! * r;
      Y += wy[i]! * r;
      Z += wz[i]! * r;
    }
  }
  return { X, Y, Z };
}

function noteObjectColourMethod(table: WeightingTable): void {
  noteMethod("observer", table.notes.observer);
  noteMethod("illuminant", table.notes.illuminant);
  noteMethod("integration", table.notes.integration);
  if (table.notes.interpolation) noteMethod("interpolation", table.notes.interpolation);
}

/**
 * Tristimulus values of the perfect reflecting diffuser under an illuminant: the reference white, Y = 100.
 *
 * Its default interval is the illuminant's own (1 nm for D65 and A, 5 nm for D50), which need not be the interval
 * `tristimulus()` picks for a 5 nm sample: for a sample's white, use `objectColour(sample)` or pass the same interval
 * and range.
 *
 * @param options.interval The summation interval in nm, 1 or 5; default 1 when the illuminant is tabulated at 1 nm (or unevenly), 5 when it is tabulated at a coarser step.
 * @returns { X, Y, Z } with Y = 100.
 * @source CIE 015:2018 §7.1–7.2; ASTM E308 (the white points the default range reproduces).
 * @example chromaticityXy(whitePoint({ illuminant: "D50", interval: 5 }))
 */
export function whitePoint(
  options: TableOptions & {
    /** A sample whose summation the white should follow: its interval and measured range, as tristimulus sums it (default none: the table's own interval over 360–830 nm). */
    sample?: Spectrum;
  } = {},
): Tristimulus {
  checkTableOptions("whitePoint", options, ["sample"]);
  const sample = options.sample;
  checkSpectrum("whitePoint", "options.sample", sample, { optional: true });
  const ill = resolveIlluminant(options.illuminant);
  const coarse =
    options.interval === 10 || options.interval === 20
      ? options.interval
      : options.interval === undefined && sample
        ? coarseStep(sample)
        : undefined;
  if (coarse !== undefined) {
    // The white of 10/20 nm data: the sum of the same ASTM E2022 weighting factors the sample's colour uses.
    const table = sample
      ? astmTableForSample(sample, options, coarse, options.interval === undefined)
      : astmTableForSample(
          { ...ill, wavelengths: [360, 830], values: [0, 0] },
          { ...options, range: options.range ?? [360, coarse === 10 ? 830 : 820] },
          coarse,
          false,
        );
    noteMethod("observer", table.notes.observer);
    noteMethod("integration", table.notes.white);
    if (table.notes.interpolation) noteMethod("interpolation", table.notes.interpolation);
    return { ...table.white };
  }
  const interval = (options.interval ?? defaultInterval(sample, ill)) as 1 | 5;
  const table = sample
    ? tableFor(
        options.illuminant,
        options.observer,
        interval,
        options.range ?? measuredRange(sample),
        !options.range,
      )
    : tableFor(options.illuminant, options.observer, interval, options.range);
  noteMethod("observer", table.notes.observer);
  noteMethod("integration", table.notes.white);
  if (table.notes.interpolation) noteMethod("interpolation", table.notes.interpolation);
  return { ...table.white };
}

export interface LightOptions {
  /** Observer: "2°" or "10°" (see `observerByName`) or an `Observer`; default the CIE 1931 2° observer. */
  observer?: ObserverName | Observer | 2 | 10;
  /**
   * "relative" (default): scaled so that Y = 100. "absolute": k = Km = 683 lm/W (CIE 015:2018 eq. 7.5;
   * the SI defines Kcd = 683 lm/W at 540 THz), so a radiance in W/(sr·m²·nm) gives Y in cd/m².
   */
  scale?: "relative" | "absolute";
}

/** Km, the maximum luminous efficacy for photopic vision used with the CIE 1931 observer: 683 lm/W (CIE 015:2018 §7.1). */
export const KM_PHOTOPIC = 683;

/**
 * X, Y, Z of a light source from its spectral distribution, summed at its own 1 nm or 5 nm samples (otherwise after interpolation to 1 nm) over the range the source and the observer share.
 *
 * @param source A spectral distribution of a light (relative, or radiance, irradiance, … in W/nm units for "absolute").
 * @returns { X, Y, Z }: Y = 100 ("relative"), or Y in the photometric unit of the source's radiometric unit ("absolute": cd/m² from W/(sr·m²·nm)).
 * @source CIE 015:2018 eq. 7.5 (Km = 683 lm/W).
 * @example lightTristimulus(illuminant("A"))
 */
export function lightTristimulus(source: Spectrum, options: LightOptions = {}): Tristimulus {
  checkSpectrum("lightTristimulus", "source", source, {
    what: "a spectrum of a light source (power, radiance, irradiance, ...)",
  });
  checkLightOptions("lightTristimulus", options);
  const obs = observerByName(options.observer ?? "2°");
  const step = regularStep(source);
  const onWholeNm =
    step !== undefined && (step === 1 || step === 5) && Number.isInteger(source.wavelengths[0]!);
  const start = Math.max(source.wavelengths[0]!, obs.wavelengths[0]!);
  const end = Math.min(source.wavelengths.at(-1)!, obs.wavelengths.at(-1)!);
  if (end <= start)
    throw new Error(
      `lightTristimulus: "${source.name}" (${source.wavelengths[0]}–${source.wavelengths.at(-1)} nm) lies outside the observer's 360–830 nm`,
    );
  const interval = onWholeNm ? step : 1;
  const grid = onWholeNm
    ? source.wavelengths.filter((w) => w >= start && w <= end)
    : gridFor([start, end], 1);
  const read = sampler(source, { extrapolation: "refuse" });
  let X = 0,
    Y = 0,
    Z = 0;
  for (const w of grid) {
    const s = read(w);
    const [x, y, z] = colourMatchingAt(obs, w);
    X += s * x;
    Y += s * y;
    Z += s * z;
  }
  noteMethod("observer", observerStatement(obs));
  const absolute = options.scale === "absolute";
  const over = `${grid[0]}–${grid.at(-1)} nm`;
  noteMethod(
    "integration",
    absolute
      ? `Tristimulus values of light sources were summed at ${interval} nm intervals over ${over} with Km = ${KM_PHOTOPIC} lm/W, giving absolute values (CIE 015:2018 eq. 7.5).`
      : `Tristimulus values of light sources were summed at ${interval} nm intervals over ${over} and scaled to Y = 100 (relative values, CIE 015:2018 eq. 7.5).`,
  );
  if (absolute) {
    const k = KM_PHOTOPIC * interval;
    return { X: k * X, Y: k * Y, Z: k * Z };
  }
  if (!(Y > 0))
    throw new Error(
      `lightTristimulus: "${source.name}" has no luminous power (Y = 0), so it cannot be scaled to Y = 100`,
    );
  const k = 100 / Y;
  return { X: k * X, Y: 100, Z: k * Z };
}
