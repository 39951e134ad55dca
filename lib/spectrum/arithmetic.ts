/**
 * Sample-by-sample arithmetic on spectra. Spectra on different wavelengths are never combined silently: align them
 * first with `alignSpectra` (or `resample`), so the choice of grid and interpolation is written in the notebook.
 */
import { gridOf, gridWavelengths, sameWavelengths, type WavelengthGrid } from "./grid.ts";
import { resample } from "./resample.ts";
import type { SamplingOptions } from "./sample.ts";
import { spectrum, type SpectralQuantity, type Spectrum, type SpectrumLabel } from "./spectrum.ts";
import { GRID_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkLabel, checkSampling } from "../arguments/common-arguments.ts";

function requireSameWavelengths(what: string, a: Spectrum, b: Spectrum): void {
  if (!sameWavelengths(a, b)) {
    const describe = (s: Spectrum) => {
      const g = gridOf(s);
      return g
        ? `${g.start}–${g.end} nm every ${g.step} nm`
        : `${s.wavelengths.length} uneven samples from ${s.wavelengths[0]} to ${s.wavelengths.at(-1)} nm`;
    };
    throw new Error(
      `${what}: "${a.name}" (${describe(a)}) and "${b.name}" (${describe(b)}) are sampled at different wavelengths; align them first with alignSpectra(a, b) or resample(...)`,
    );
  }
}

function combine(
  what: string,
  a: Spectrum,
  b: Spectrum,
  f: (x: number, y: number) => number,
  label: SpectrumLabel,
  quantity: SpectralQuantity,
): Spectrum {
  requireSameWavelengths(what, a, b);
  return spectrum(
    a.wavelengths,
    a.values.map((x, i) => f(x, b.values[i]!)),
    {
      name: label.name ?? `${a.name} ${what} ${b.name}`,
      quantity: label.quantity ?? quantity,
      unit: label.unit ?? a.unit,
    },
  );
}

/**
 * Product of two spectra sample by sample, e.g. an illuminant through a filter or two filters in series.
 *
 * Both must be on the same wavelengths (see `alignSpectra`). The result's quantity is that of `b` when `a` is a
 * transmittance or reflectance, else that of `a`.
 *
 * @param a A spectrum.
 * @param b A spectrum on the same wavelengths.
 * @param label Name, quantity or unit of the result; default name "a × b", quantity as above, unit of `a`.
 * @returns A new `Spectrum`.
 * @source none: sample-by-sample arithmetic, no published formula.
 * @example multiplySpectra(spectrumOnGrid(400, 10, [1, 1, 1]), spectrumOnGrid(400, 10, [0.5, 0.4, 0.3]))
 */
export function multiplySpectra(a: Spectrum, b: Spectrum, label: SpectrumLabel = {}): Spectrum {
  checkSpectrum("multiplySpectra", "a", a);
  checkSpectrum("multiplySpectra", "b", b, {
    instead: { number: "to multiply by a number use scaleSpectrum" },
  });
  checkLabel("multiplySpectra", "label", label);
  const quantity = a.quantity === "transmittance" || a.quantity === "reflectance" ? b.quantity : a.quantity;
  return combine("×", a, b, (x, y) => x * y, label, quantity);
}

/**
 * Sum of two spectra sample by sample, e.g. two lights falling on the same surface (additive mixing).
 *
 * @param a A spectrum.
 * @param b A spectrum on the same wavelengths (see `alignSpectra`).
 * @param label Name, quantity or unit of the result; default name "a + b", quantity and unit of `a`.
 * @returns A new `Spectrum`.
 * @source none: sample-by-sample arithmetic, no published formula.
 * @example addSpectra(spectrumOnGrid(400, 10, [1, 2, 3]), spectrumOnGrid(400, 10, [3, 2, 1]))
 */
export function addSpectra(a: Spectrum, b: Spectrum, label: SpectrumLabel = {}): Spectrum {
  checkSpectrum("addSpectra", "a", a);
  checkSpectrum("addSpectra", "b", b);
  checkLabel("addSpectra", "label", label);
  return combine("+", a, b, (x, y) => x + y, label, a.quantity);
}

/**
 * Ratio a ÷ b sample by sample, e.g. a sample's signal over a reference's; a zero denominator is an error.
 *
 * @param a The numerator spectrum.
 * @param b The denominator spectrum, on the same wavelengths, never zero.
 * @param label Name, quantity or unit of the result; default name "a ÷ b", quantity "other", unit of `a`.
 * @returns A new `Spectrum`.
 * @source none: sample-by-sample arithmetic, no published formula.
 * @example divideSpectra(spectrumOnGrid(400, 10, [1, 2, 3]), spectrumOnGrid(400, 10, [2, 4, 4]))
 */
export function divideSpectra(a: Spectrum, b: Spectrum, label: SpectrumLabel = {}): Spectrum {
  checkSpectrum("divideSpectra", "a", a);
  checkSpectrum("divideSpectra", "b", b, {
    instead: { number: "to divide by a number use scaleSpectrum with 1/number" },
  });
  checkLabel("divideSpectra", "label", label);
  requireSameWavelengths("÷", a, b);
  b.values.forEach((y, i) => {
    if (y === 0)
      throw new Error(`÷: "${b.name}" is zero at ${b.wavelengths[i]} nm, so the ratio is undefined there`);
  });
  return combine("÷", a, b, (x, y) => x / y, label, "other");
}

/**
 * The spectrum with every value multiplied by a factor.
 *
 * @param s A spectrum.
 * @param factor A finite number (dimensionless).
 * @param label Name, quantity or unit of the result; each absent one is kept from `s` (default: all kept).
 * @returns A new `Spectrum`.
 * @source none: arithmetic, no published formula.
 * @example scaleSpectrum(spectrumOnGrid(400, 10, [1, 2, 3]), 0.5)
 */
export function scaleSpectrum(s: Spectrum, factor: number, label: SpectrumLabel = {}): Spectrum {
  checkSpectrum("scaleSpectrum", "s", s);
  checkNumber("scaleSpectrum", "factor", factor, {
    instead: { spectrum: "to multiply two spectra use multiplySpectra" },
  });
  checkLabel("scaleSpectrum", "label", label);
  if (!Number.isFinite(factor))
    throw new Error(`scaleSpectrum: the factor for "${s.name}" is ${factor}, not a finite number`);
  return spectrum(
    s.wavelengths,
    s.values.map((v) => v * factor),
    { name: label.name ?? s.name, quantity: label.quantity ?? s.quantity, unit: label.unit ?? s.unit },
  );
}

/**
 * Both spectra resampled onto one grid, so that they can be combined sample by sample.
 *
 * @param a A spectrum.
 * @param b Another spectrum.
 * @param grid The target grid { start, end, step } in nm; default `overlapGrid(a, b)`: the shared wavelengths at the finer step (1 nm when either is uneven).
 * @returns [a, b] on the grid.
 * @source CIE 167:2005 (interpolation); CIE 015:2018 §7.2.2 (extrapolation).
 * @example alignSpectra(spectrumOnGrid(400, 10, [1, 2, 3, 4, 5, 6]), spectrumOnGrid(405, 5, [1, 2, 3, 4, 5, 6, 7]))
 */
export function alignSpectra(
  a: Spectrum,
  b: Spectrum,
  grid?: WavelengthGrid,
  options: SamplingOptions = {},
): [Spectrum, Spectrum] {
  checkSpectrum("alignSpectra", "a", a);
  checkSpectrum("alignSpectra", "b", b);
  checkFields("alignSpectra", "grid", grid, GRID_FIELDS, { optional: true });
  checkSampling("alignSpectra", "options", options);
  const target = grid ?? overlapGrid(a, b);
  gridWavelengths(target);
  return [resample(a, target, options), resample(b, target, options)];
}

/**
 * The grid over the wavelengths two spectra share, at the finer of their steps (1 nm when either is uneven).
 *
 * @param a A spectrum.
 * @param b Another spectrum; the two must share some wavelengths.
 * @returns { start, end, step } in nm.
 * @source none: a tristim helper, no published formula.
 * @example overlapGrid(spectrumOnGrid(400, 10, [1, 2, 3, 4]), spectrumOnGrid(405, 5, [1, 2, 3, 4, 5, 6]))
 */
export function overlapGrid(a: Spectrum, b: Spectrum): WavelengthGrid {
  checkSpectrum("overlapGrid", "a", a);
  checkSpectrum("overlapGrid", "b", b);
  const start = Math.max(a.wavelengths[0]!, b.wavelengths[0]!);
  const end = Math.min(a.wavelengths.at(-1)!, b.wavelengths.at(-1)!);
  if (end < start) {
    throw new Error(
      `"${a.name}" (${a.wavelengths[0]}–${a.wavelengths.at(-1)} nm) and "${b.name}" (${b.wavelengths[0]}–${b.wavelengths.at(-1)} nm) share no wavelengths`,
    );
  }
  const ga = gridOf(a);
  const gb = gridOf(b);
  const step = ga && gb ? Math.min(ga.step, gb.step) : 1;
  const first = Math.ceil(start / step - 1e-9) * step;
  const n = Math.floor((end - first) / step + 1e-9);
  return { start: first, end: first + n * step, step };
}
