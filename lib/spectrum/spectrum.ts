/**
 * The sampled spectral distribution: wavelengths in nm (strictly increasing), one value per wavelength, what the
 * values are, and a name. A plain, serializable object; every operation on it is a pure function in this folder.
 */
import { checkList, checkNumberList } from "../arguments/check-list.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkLabel } from "../arguments/common-arguments.ts";

/** What a spectrum's values measure. Transmittance and reflectance are stored as fractions (0–1), never percent. */
export type SpectralQuantity =
  | "relative power"
  | "radiance"
  | "irradiance"
  | "radiant flux"
  | "transmittance"
  | "reflectance"
  | "absorbance"
  | "optical density"
  | "colour matching"
  | "luminous efficiency"
  | "other";

export interface Spectrum {
  readonly kind: "spectrum";
  readonly name: string;
  readonly quantity: SpectralQuantity;
  /** Unit of the values, e.g. "W/(sr·m²·nm)"; empty for relative or dimensionless quantities. */
  readonly unit: string;
  readonly wavelengths: readonly number[];
  readonly values: readonly number[];
}

/** Optional description of a spectrum. */
export interface SpectrumLabel {
  name?: string;
  quantity?: SpectralQuantity;
  unit?: string;
}

/**
 * Builds a spectrum from wavelengths and values, checking that both are finite and that the wavelengths increase.
 *
 * @param wavelengths Wavelengths in nm, positive and strictly increasing.
 * @param values One value per wavelength (transmittance and reflectance as fractions 0–1), all finite.
 * @param label Name, quantity and unit of the values; default name "spectrum", quantity "other", unit "" (none).
 * @returns A new `Spectrum` (copies of both arrays).
 * @source none: a tristim data structure, no published formula.
 * @example spectrum([400, 500, 600], [0.2, 0.5, 0.4], { name: "invented filter", quantity: "transmittance" })
 */
export function spectrum(
  wavelengths: readonly number[],
  values: readonly number[],
  label: SpectrumLabel = {},
): Spectrum {
  checkNumberList("spectrum", "wavelengths", wavelengths, {
    unit: "nm",
    minLength: 1,
    instead: { spectrum: "to copy a spectrum with new values use withValues" },
  });
  checkNumberList("spectrum", "values", values, { length: wavelengths.length, unit: "one per wavelength" });
  checkLabel("spectrum", "label", label);
  const name = label.name ?? "spectrum";
  if (wavelengths.length !== values.length) {
    throw new Error(`spectrum "${name}": ${wavelengths.length} wavelengths but ${values.length} values`);
  }
  if (wavelengths.length === 0) throw new Error(`spectrum "${name}": no samples (an empty spectrum)`);
  for (let i = 0; i < wavelengths.length; i++) {
    const wl = wavelengths[i]!;
    if (!Number.isFinite(wl))
      throw new Error(`spectrum "${name}": wavelength #${i + 1} is ${wl}, not a finite number`);
    if (wl <= 0)
      throw new Error(`spectrum "${name}": wavelength #${i + 1} is ${wl} nm; wavelengths must be positive`);
    if (i > 0 && wl <= wavelengths[i - 1]!) {
      throw new Error(
        `spectrum "${name}": wavelength #${i + 1} (${wl} nm) does not increase after ${wavelengths[i - 1]} nm; sort the samples and remove duplicates`,
      );
    }
    const v = values[i]!;
    if (!Number.isFinite(v))
      throw new Error(`spectrum "${name}": the value at ${wl} nm is ${v}, not a finite number`);
  }
  return {
    kind: "spectrum",
    name,
    quantity: label.quantity ?? "other",
    unit: label.unit ?? "",
    wavelengths: [...wavelengths],
    values: [...values],
  };
}

/**
 * Builds a spectrum on a regular grid from the first wavelength, the step and one value per step.
 *
 * @param start The first wavelength, in nm.
 * @param step The wavelength step, in nm (positive).
 * @param values One value per step, all finite.
 * @param label Name, quantity and unit of the values; default name "spectrum", quantity "other", unit "" (none).
 * @returns A `Spectrum` at start, start + step, … nm.
 * @source none: a tristim data structure, no published formula.
 * @example spectrumOnGrid(400, 10, [0.1, 0.2, 0.4, 0.6], { name: "invented sample", quantity: "reflectance" })
 */
export function spectrumOnGrid(
  start: number,
  step: number,
  values: readonly number[],
  /** The label, or just the name as a string. */
  label: SpectrumLabel | string = {},
): Spectrum {
  checkNumber("spectrumOnGrid", "start", start, { unit: "nm", above: 0 });
  checkNumber("spectrumOnGrid", "step", step, { unit: "nm", above: 0 });
  checkNumberList("spectrumOnGrid", "values", values, { minLength: 1 });
  checkLabel("spectrumOnGrid", "label", typeof label === "string" ? { name: label } : label);
  if (typeof label === "string") label = { name: label };
  if (!Number.isFinite(start) || !Number.isFinite(step) || step <= 0) {
    throw new Error(
      `spectrum "${label.name ?? "spectrum"}": grid start ${start} nm, step ${step} nm is not a valid grid`,
    );
  }
  return spectrum(
    values.map((_, i) => roundWavelength(start + i * step)),
    values,
    label,
  );
}

/**
 * Builds a spectrum from [wavelength, value] pairs.
 *
 * @param pairs [wavelength in nm, value] pairs, wavelengths strictly increasing.
 * @param label Name, quantity and unit of the values; default name "spectrum", quantity "other", unit "" (none).
 * @returns A `Spectrum`.
 * @source none: a tristim data structure, no published formula.
 * @example spectrumFromPairs([[450, 0.3], [550, 0.6], [650, 0.5]], { name: "invented sample" })
 */
export function spectrumFromPairs(
  pairs: ReadonlyArray<readonly [number, number]>,
  label: SpectrumLabel = {},
): Spectrum {
  checkList(
    "spectrumFromPairs",
    "pairs",
    pairs,
    "[wavelength in nm, value] pairs",
    (p) => Array.isArray(p) && p.length === 2 && p.every(Number.isFinite),
    { minLength: 1 },
  );
  checkLabel("spectrumFromPairs", "label", label);
  return spectrum(
    pairs.map((p) => p[0]),
    pairs.map((p) => p[1]),
    label,
  );
}

/**
 * A copy of a spectrum with new values on the same wavelengths, and optionally a new label.
 *
 * @param s The spectrum whose wavelengths are kept.
 * @param values One new value per wavelength.
 * @param label New name, quantity or unit; each one absent is kept from `s` (default: all kept).
 * @returns A new `Spectrum`.
 * @source none: a tristim helper, no published formula.
 * @example withValues(spectrumOnGrid(400, 100, [1, 2, 3]), [0.5, 0.5, 0.5])
 */
export function withValues(s: Spectrum, values: readonly number[], label: SpectrumLabel = {}): Spectrum {
  checkSpectrum("withValues", "s", s);
  checkNumberList("withValues", "values", values, { length: s.wavelengths.length });
  checkLabel("withValues", "label", label);
  return spectrum(s.wavelengths, values, {
    name: label.name ?? s.name,
    quantity: label.quantity ?? s.quantity,
    unit: label.unit ?? s.unit,
  });
}

/**
 * Removes floating-point noise from a computed wavelength by rounding to 1e-9 nm.
 *
 * @param wl A wavelength in nm.
 * @returns The wavelength rounded to 1e-9 nm.
 * @source none: a tristim helper (grids are specified to well under 1e-9 nm).
 * @example roundWavelength(400 + 3 * 0.1)
 */
export function roundWavelength(wl: number): number {
  checkNumber("roundWavelength", "wl", wl, { unit: "nm" });
  return Math.round(wl * 1e9) / 1e9;
}

/**
 * True when the value is a spectrum object (`kind: "spectrum"`).
 *
 * @param value Anything.
 * @returns true for a `Spectrum`, false otherwise.
 * @source none: a tristim helper, no published formula.
 * @example isSpectrum(spectrumOnGrid(400, 10, [1, 2]))
 */
export function isSpectrum(value: unknown): value is Spectrum {
  return typeof value === "object" && value !== null && (value as { kind?: unknown }).kind === "spectrum";
}
