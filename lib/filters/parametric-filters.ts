/**
 * Parametric filter curves for demonstrations and what-if studies (not measurements): ideal and smoothed band-pass,
 * long-pass and short-pass edges, neutral density, and an absorbing dye from its absorbance curve. Smoothed edges are
 * logistic curves whose 10 %–90 % rise spans `edgeWidth` nm (common practice, no source); the dye follows the
 * Beer–Lambert law (IUPAC Gold Book).
 */
import { noteMethod } from "../methods/method-log.ts";
import { gridWavelengths, type WavelengthGrid } from "../spectrum/grid.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { requireFinite, requireFraction, requireNonNegative, requirePositive } from "./checks.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";

/** The default grid of parametric curves: 360–830 nm every 1 nm, the range of the CIE observers. */
export const PARAMETRIC_GRID: WavelengthGrid = { start: 360, end: 830, step: 1 };

export interface EdgeShape {
  /** Transmittance in the pass band, a fraction (default 1). */
  peak?: number;
  /** Transmittance in the blocked band, a fraction (default 0). */
  floor?: number;
  /** Distance in nm over which the edge rises from 10 % to 90 % of its step; 0 (default) gives an ideal, sharp edge. */
  edgeWidth?: number;
  /** Wavelengths { start, end, step } in nm; default `PARAMETRIC_GRID`, 360–830 nm every 1 nm. */
  grid?: WavelengthGrid;
  /** The spectrum's name; default a description such as "long-pass 500 nm". */
  name?: string;
}

/**
 * A logistic step rising through 0.5 at x = 0 with a 10 %–90 % width w: 1 ÷ (1 + exp(−x·2 ln 9 ÷ w)); a unit step when w = 0.
 *
 * @param x The distance from the edge, in nm (positive on the passing side).
 * @param edgeWidth The 10 %–90 % width w, in nm (0 for a sharp edge).
 * @returns A value 0–1.
 * @source none: a logistic edge shape, common practice with no source.
 * @example logisticEdge(5, 10)
 */
export function logisticEdge(x: number, edgeWidth: number): number {
  checkNumber("logisticEdge", "x", x, { unit: "nm from the edge" });
  checkNumber("logisticEdge", "edgeWidth", edgeWidth, { unit: "nm", min: 0 });
  if (edgeWidth === 0) return x >= 0 ? 1 : 0;
  return 1 / (1 + Math.exp((-x * 2 * Math.log(9)) / edgeWidth));
}

function shape(options: EdgeShape): {
  peak: number;
  floor: number;
  edgeWidth: number;
  wavelengths: number[];
} {
  const peak = requireFraction(options.peak ?? 1, "pass-band transmittance (peak)");
  const floor = requireFraction(options.floor ?? 0, "blocking transmittance (floor)");
  if (floor > peak)
    throw new Error(`the blocking transmittance ${floor} is above the pass-band transmittance ${peak}`);
  const edgeWidth = requireNonNegative(options.edgeWidth ?? 0, "edge width (nm)");
  noteMethod(
    "optics",
    "Parametric (modelled, not measured) filter curves were used; their smoothed edges are logistic with the stated 10–90 % edge width.",
  );
  return { peak, floor, edgeWidth, wavelengths: gridWavelengths(options.grid ?? PARAMETRIC_GRID) };
}

/**
 * A parametric long-pass filter (modelled, not measured): blocks below `edge` nm, its 50 % point, and passes above.
 *
 * @param edge The 50 % wavelength, in nm.
 * @returns A "transmittance" `Spectrum`, named `options.name` or "long-pass <edge> nm".
 * @source none: a logistic edge, common practice with no source.
 * @example longPassFilter(500, { edgeWidth: 20 })
 */
export function longPassFilter(edge: number, options: EdgeShape = {}): Spectrum {
  checkNumber("longPassFilter", "edge", edge, { unit: "nm", above: 0 });
  checkOptions("longPassFilter", "options", options, ["peak", "floor", "edgeWidth", "grid", "name"]);
  requirePositive(edge, "long-pass edge wavelength (nm)");
  const s = shape(options);
  return spectrum(
    s.wavelengths,
    s.wavelengths.map((w) => s.floor + (s.peak - s.floor) * logisticEdge(w - edge, s.edgeWidth)),
    {
      name: options.name ?? `long-pass ${edge} nm`,
      quantity: "transmittance",
    },
  );
}

/**
 * A parametric short-pass filter (modelled, not measured): passes below `edge` nm, its 50 % point, and blocks above.
 *
 * @param edge The 50 % wavelength, in nm.
 * @returns A "transmittance" `Spectrum`, named `options.name` or "short-pass <edge> nm".
 * @source none: a logistic edge, common practice with no source.
 * @example shortPassFilter(600, { edgeWidth: 15, floor: 0.01 })
 */
export function shortPassFilter(edge: number, options: EdgeShape = {}): Spectrum {
  checkNumber("shortPassFilter", "edge", edge, { unit: "nm", above: 0 });
  checkOptions("shortPassFilter", "options", options, ["peak", "floor", "edgeWidth", "grid", "name"]);
  requirePositive(edge, "short-pass edge wavelength (nm)");
  const s = shape(options);
  return spectrum(
    s.wavelengths,
    s.wavelengths.map((w) => s.floor + (s.peak - s.floor) * logisticEdge(edge - w, s.edgeWidth)),
    {
      name: options.name ?? `short-pass ${edge} nm`,
      quantity: "transmittance",
    },
  );
}

/**
 * A parametric band-pass filter (modelled, not measured): the product of a long-pass and a short-pass edge.
 *
 * @param centre The centre wavelength, in nm.
 * @param width The full width between the 50 % points, in nm.
 * @returns A "transmittance" `Spectrum`, named `options.name` or "band-pass <centre>/<width> nm".
 * @source none: logistic edges, common practice with no source.
 * @example bandPassFilter(550, 40, { edgeWidth: 10, peak: 0.9 })
 */
export function bandPassFilter(centre: number, width: number, options: EdgeShape = {}): Spectrum {
  checkNumber("bandPassFilter", "centre", centre, { unit: "nm", above: 0 });
  checkNumber("bandPassFilter", "width", width, { unit: "nm", above: 0 });
  checkOptions("bandPassFilter", "options", options, ["peak", "floor", "edgeWidth", "grid", "name"]);
  requirePositive(centre, "band-pass centre wavelength (nm)");
  requirePositive(width, "band-pass width (nm)");
  const s = shape(options);
  const lo = centre - width / 2;
  const hi = centre + width / 2;
  return spectrum(
    s.wavelengths,
    s.wavelengths.map(
      (w) =>
        s.floor + (s.peak - s.floor) * logisticEdge(w - lo, s.edgeWidth) * logisticEdge(hi - w, s.edgeWidth),
    ),
    { name: options.name ?? `band-pass ${centre}/${width} nm`, quantity: "transmittance" },
  );
}

/**
 * A parametric neutral density filter: T = 10^−D at every wavelength.
 *
 * @param density The optical density D, 0 or more.
 * @param options.grid Wavelengths { start, end, step } in nm; default `PARAMETRIC_GRID`, 360–830 nm every 1 nm.
 * @param options.name The spectrum's name; default "ND <density>".
 * @returns A "transmittance" `Spectrum`.
 * @source ISO 5-1 (transmission density).
 * @example neutralDensityFilter(0.3, { grid: { start: 380, end: 780, step: 5 } })
 */
export function neutralDensityFilter(
  density: number,
  options: { grid?: WavelengthGrid; name?: string } = {},
): Spectrum {
  checkNumber("neutralDensityFilter", "density", density, { unit: "optical density", min: 0 });
  checkOptions("neutralDensityFilter", "options", options, ["grid", "name"]);
  requireNonNegative(density, "neutral density");
  const w = gridWavelengths(options.grid ?? PARAMETRIC_GRID);
  noteMethod(
    "optics",
    "Parametric (modelled, not measured) filter curves were used; their smoothed edges are logistic with the stated 10–90 % edge width.",
  );
  return spectrum(
    w,
    w.map(() => 10 ** -density),
    { name: options.name ?? `ND ${density}`, quantity: "transmittance" },
  );
}

/**
 * Internal transmittance of an absorbing dye layer from its decadic absorbance curve, τᵢ = 10^(−amount·A).
 *
 * @param absorbance The decadic absorbance A(λ) at a reference concentration and path, 0 or more.
 * @param options.amount (c·d) ÷ (c_ref·d_ref), relative concentration × path, 0 or more; default 1.
 * @param options.name The spectrum's name; default "<absorbance> ×<amount>".
 * @returns A "transmittance" `Spectrum` (internal transmittance).
 * @source IUPAC Gold Book, "Beer–Lambert law".
 * @example dyeFilter(spectrumOnGrid(400, 50, [0.1, 0.8, 1.2, 0.4, 0.05]), { amount: 0.5 })
 */
export function dyeFilter(absorbance: Spectrum, options: { amount?: number; name?: string } = {}): Spectrum {
  checkSpectrum("dyeFilter", "absorbance", absorbance, { what: "an absorbance (decadic) spectrum" });
  checkOptions("dyeFilter", "options", options, ["amount", "name"]);
  const amount = requireNonNegative(options.amount ?? 1, "dye amount (relative concentration × path)");
  absorbance.values.forEach((a, i) => {
    requireFinite(a, `absorbance of "${absorbance.name}" at ${absorbance.wavelengths[i]} nm`);
    if (a < 0)
      throw new Error(
        `absorbance of "${absorbance.name}" is ${a} at ${absorbance.wavelengths[i]} nm; a dye's absorbance cannot be negative`,
      );
  });
  noteMethod(
    "optics",
    "Dye layers were modelled by the Beer–Lambert law, τᵢ = 10^(−A·c·d) with decadic absorbance A (IUPAC Gold Book).",
  );
  return spectrum(
    absorbance.wavelengths,
    absorbance.values.map((a) => 10 ** (-amount * a)),
    {
      name: options.name ?? `${absorbance.name} ×${amount}`,
      quantity: "transmittance",
    },
  );
}
