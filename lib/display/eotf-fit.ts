/**
 * Fitting a display's tone response per channel: a power law L = a·V^γ (after black subtraction) or the BT.1886
 * form L = a·max(V + b, 0)^γ with a and b fixed by the measured white and black luminance and γ fitted; each with
 * its residuals against the readings. Both are least-squares fits of log luminance, so dark and bright levels weigh
 * alike.
 */
import { checkList } from "../arguments/check-list.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";

/** One level of a ramp: the signal (0–1, e.g. from `codeValueSignal`) and the luminance measured (cd/m²). */
export interface ToneReading {
  readonly signal: number;
  readonly luminance: number;
}

/** Options of `fitEotf`. */
export interface EotfFitOptions {
  /** "power" (L − Lk = a·V^γ) or "BT.1886" (L = a·max(V + b, 0)^γ with the screen's Lw and Lk); default "power". */
  model?: "power" | "BT.1886";
  /** Lk, the black luminance in cd/m²; default the reading at signal 0 (0 if there is none). */
  blackLuminance?: number;
  /** Lw, the white luminance in cd/m²; default the reading at signal 1 (the power model fits a instead). */
  whiteLuminance?: number;
  /** A name for the channel or ramp, carried into the result; default "grey". */
  channel?: string;
}

/** One reading compared with the fitted curve. */
export interface EotfResidual {
  readonly signal: number;
  readonly measured: number;
  readonly fitted: number;
  /** measured − fitted, in cd/m². */
  readonly difference: number;
  /** (measured − fitted) ÷ fitted, a fraction. */
  readonly relative: number;
}

/** The result of an EOTF fit. */
export interface EotfFit {
  readonly channel: string;
  readonly model: "power" | "BT.1886";
  /** The fitted exponent γ. */
  readonly gamma: number;
  /** The curve's constants: L = a·max(V + b, 0)^γ + offset (power: b = 0, offset = Lk; BT.1886: offset 0). */
  readonly a: number;
  readonly b: number;
  readonly offset: number;
  readonly whiteLuminance: number;
  readonly blackLuminance: number;
  /** Residuals at every reading used (signal > 0). */
  readonly residuals: readonly EotfResidual[];
  /** Root mean square of the relative residuals, a fraction. */
  readonly rmsRelative: number;
  /** The largest relative residual by size, a fraction with its sign. */
  readonly worstRelative: number;
}

function isToneReading(v: unknown): boolean {
  const r = v as ToneReading;
  return (
    typeof v === "object" &&
    v !== null &&
    Number.isFinite(r.signal) &&
    Number.isFinite(r.luminance) &&
    r.signal >= 0 &&
    r.signal <= 1 &&
    r.luminance >= 0
  );
}

/** Golden-section search for the minimum of f on [lo, hi]. */
function minimise(f: (x: number) => number, lo: number, hi: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo,
    b = hi,
    c = b - g * (b - a),
    d = a + g * (b - a);
  let fc = f(c),
    fd = f(d);
  for (let i = 0; i < 200 && b - a > 1e-10; i++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = f(c);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = f(d);
    }
  }
  return (a + b) / 2;
}

const bt1886 = (lw: number, lk: number, gamma: number) => {
  const root = lw ** (1 / gamma) - lk ** (1 / gamma);
  return { a: root ** gamma, b: lk ** (1 / gamma) / root };
};

/**
 * Fits an EOTF to a ramp of readings: a power law or the BT.1886 form with the measured black level, with residuals.
 *
 * Power: γ and a by linear regression of ln(L − Lk) on ln V over the readings with V > 0 and L > Lk. BT.1886: a and b
 * from Lw and Lk as in BT.1886 with exponent γ, and γ (searched in 1–4) minimising the squared log residuals.
 *
 * @param readings The ramp: [{ signal 0–1, luminance in cd/m² }], at least 3 with signal > 0.
 * @param options Model, black and white luminance, channel name (see `EotfFitOptions`); default a power law.
 * @returns An `EotfFit`: gamma, constants, residuals per level, rms and worst relative residual.
 * @source ITU-R BT.1886 (03/2011) Annex 1 (the EOTF form); least squares on log luminance, common practice.
 * @example fitEotf([0, 0.25, 0.5, 0.75, 1].map((v) => ({ signal: v, luminance: 0.1 + 200 * v ** 2.2 })))
 */
export function fitEotf(readings: readonly ToneReading[], options: EotfFitOptions = {}): EotfFit {
  const fn = "fitEotf";
  checkList(fn, "readings", readings, "ramp readings { signal 0–1, luminance ≥ 0 in cd/m² }", isToneReading);
  checkOptions(fn, "options", options, ["model", "blackLuminance", "whiteLuminance", "channel"]);
  checkChoice(fn, "options.model", options.model, ["power", "BT.1886"], { optional: true });
  checkNumber(fn, "options.blackLuminance", options.blackLuminance, {
    unit: "cd/m²",
    min: 0,
    optional: true,
  });
  checkNumber(fn, "options.whiteLuminance", options.whiteLuminance, {
    unit: "cd/m²",
    above: 0,
    optional: true,
  });
  checkWith(fn, "options.channel", options.channel, "a channel name", (v) => typeof v === "string", {
    optional: true,
  });
  const model = options.model ?? "power";
  const atSignal = (s: number) => readings.find((r) => r.signal === s)?.luminance;
  const lk = options.blackLuminance ?? atSignal(0) ?? 0;
  const used = readings.filter((r) => r.signal > 0 && r.luminance > lk);
  checkWith(
    fn,
    "readings",
    readings,
    "at least 3 readings with signal above 0 and luminance above the black level",
    () => used.length >= 3,
  );
  let gamma: number, a: number, b: number, offset: number, lw: number;
  if (model === "power") {
    const xs = used.map((r) => Math.log(r.signal)),
      ys = used.map((r) => Math.log(r.luminance - lk));
    const mx = xs.reduce((s, v) => s + v, 0) / xs.length,
      my = ys.reduce((s, v) => s + v, 0) / ys.length;
    let sxy = 0,
      sxx = 0;
    xs.forEach((x, i) => {
      sxy += (x - mx) * (ys[i]! - my);
      sxx += (x - mx) ** 2;
    });
    checkWith(fn, "readings", readings, "readings at two or more different signals", () => sxx > 0);
    gamma = sxy / sxx;
    a = Math.exp(my - gamma * mx);
    b = 0;
    offset = lk;
    lw = options.whiteLuminance ?? a + lk;
    noteMethod(
      "other",
      "Power-law EOTFs L − Lk = a·V^γ were fitted by least squares of log luminance, after subtracting the black luminance Lk.",
    );
  } else {
    lw = options.whiteLuminance ?? atSignal(1) ?? Math.max(...readings.map((r) => r.luminance));
    checkWith(fn, "options.whiteLuminance", lw, "a white luminance above the black luminance", () => lw > lk);
    const cost = (g: number) => {
      const k = bt1886(lw, lk, g);
      return used.reduce((s, r) => s + Math.log(r.luminance / (k.a * (r.signal + k.b) ** g)) ** 2, 0);
    };
    gamma = minimise(cost, 1, 4);
    ({ a, b } = bt1886(lw, lk, gamma));
    offset = 0;
    noteMethod(
      "other",
      "BT.1886-form EOTFs L = a·max(V + b, 0)^γ were fitted with a and b fixed by the measured white and black luminance (ITU-R BT.1886) and γ found by least squares of log luminance.",
    );
  }
  const curve = (v: number) => a * Math.max(v + b, 0) ** gamma + offset;
  const residuals = used.map((r) => {
    const fitted = curve(r.signal);
    return {
      signal: r.signal,
      measured: r.luminance,
      fitted,
      difference: r.luminance - fitted,
      relative: (r.luminance - fitted) / fitted,
    };
  });
  const rms = Math.sqrt(residuals.reduce((s, r) => s + r.relative ** 2, 0) / residuals.length);
  const worst = residuals.reduce((w, r) => (Math.abs(r.relative) > Math.abs(w) ? r.relative : w), 0);
  return {
    channel: options.channel ?? "grey",
    model,
    gamma,
    a,
    b,
    offset,
    whiteLuminance: lw,
    blackLuminance: lk,
    residuals,
    rmsRelative: rms,
    worstRelative: worst,
  };
}

/**
 * The luminance of a fitted EOTF at a signal: a·max(V + b, 0)^γ + offset.
 *
 * @param fit A result of `fitEotf`.
 * @param signal The signal V, 0–1.
 * @returns The luminance in cd/m².
 * @source ITU-R BT.1886 (03/2011) Annex 1 (the EOTF form).
 * @example eotfLuminance(fitEotf([0.25, 0.5, 0.75, 1].map((v) => ({ signal: v, luminance: 200 * v ** 2.2 }))), 0.5)
 */
export function eotfLuminance(fit: EotfFit, signal: number): number {
  checkWith(
    "eotfLuminance",
    "fit",
    fit,
    "an EOTF fit from fitEotf",
    (f) =>
      typeof f === "object" &&
      f !== null &&
      ["gamma", "a", "b", "offset"].every((k) => Number.isFinite((f as Record<string, unknown>)[k])),
  );
  checkNumber("eotfLuminance", "signal", signal, { unit: "signal, 0–1", min: 0, max: 1 });
  return fit.a * Math.max(signal + fit.b, 0) ** fit.gamma + fit.offset;
}
