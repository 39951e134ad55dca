/**
 * Model spectra of single-colour LEDs from peak wavelength and FWHM. The default shape is the one Ohno published for
 * LED modelling (Y. Ohno, "Spectral design considerations for white LED color rendering", Opt. Eng. 44(11) 111302,
 * 2005): S(λ) = [g(λ) + 2·g(λ)⁵]/3 with g(λ) = exp(−((λ − λ₀)/Δλ)²) (form recalled from memory). A plain Gaussian is
 * offered too. `asymmetry` widens the long-wavelength side and narrows the short side by the same fraction, keeping
 * the FWHM (real LEDs often tail towards long wavelengths; common practice, no source).
 */
import { requireFinite, requirePositive } from "../filters/checks.ts";
import { noteMethod, withoutMethodNotes } from "../methods/method-log.ts";
import { gridWavelengths, type WavelengthGrid } from "../spectrum/grid.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { GRID_FIELDS, checkFields, hasNumberFields } from "../arguments/check-fields.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";

export type LedShape = "ohno 2005" | "gaussian";

export interface LedOptions {
  /** Peak wavelength λ₀ in nm. */
  peak: number;
  /** Full width at half maximum in nm; the curve's FWHM equals this exactly. */
  fwhm: number;
  /** "ohno 2005" (default): Ohno's LED shape; "gaussian": a plain Gaussian. */
  shape?: LedShape;
  /** −0.9 … 0.9: long side width = (1 + a)·FWHM/2, short side (1 − a)·FWHM/2 (common practice, no source). Default 0. */
  asymmetry?: number;
  /** Value at the peak (default 1). */
  peakValue?: number;
  /** Wavelengths { start, end, step } in nm; default 360–830 nm every 1 nm. */
  grid?: WavelengthGrid;
  /** The spectrum's name; default "LED <peak> nm / <fwhm> nm". */
  name?: string;
}

/**
 * Ohno's LED band shape at normalised distance u = (λ − λ₀) ÷ Δλ: [e^(−u²) + 2e^(−5u²)] ÷ 3.
 *
 * @param u The normalised distance from the peak (dimensionless).
 * @returns The relative value, 1 at u = 0.
 * @source Y. Ohno, Opt. Eng. 44(11) 111302, 2005 (form recalled from memory).
 * @example ohnoLedShape(0.5)
 */
export function ohnoLedShape(u: number): number {
  checkNumber("ohnoLedShape", "u", u, { unit: "(λ − peak)/half width" });
  const g = Math.exp(-u * u);
  return (g + 2 * g ** 5) / 3;
}

/** Half of the full width at half maximum of ohnoLedShape in units of Δλ: the u > 0 where the shape is 1/2 (bisection). */
export const OHNO_HALF_WIDTH_U = (() => {
  let lo = 0;
  let hi = 2;
  for (let k = 0; k < 200; k++) {
    const mid = (lo + hi) / 2;
    if (ohnoLedShape(mid) > 0.5) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
})();

/**
 * A model spectrum of a single-colour LED from its peak wavelength and FWHM (Ohno 2005 shape by default, or a Gaussian).
 *
 * @returns A "relative power" `Spectrum`, named `options.name` or "LED <peak> nm / <fwhm> nm".
 * @source Y. Ohno, Opt. Eng. 44(11) 111302, 2005 (shape recalled from memory); the asymmetry is common practice with no source.
 * @example ledSpectrum({ peak: 450, fwhm: 22, asymmetry: 0.2, grid: { start: 380, end: 780, step: 1 } })
 */
export function ledSpectrum(options: LedOptions): Spectrum {
  checkWith(
    "ledSpectrum",
    "options",
    options,
    "LED options { peak (nm), fwhm (nm), shape?, asymmetry?, peakValue?, grid?, name? }",
    (o) =>
      typeof o === "object" &&
      o !== null &&
      Number.isFinite((o as { peak?: unknown }).peak) &&
      Number.isFinite((o as { fwhm?: unknown }).fwhm),
  );
  checkOptions("ledSpectrum", "options", options, [
    "peak",
    "fwhm",
    "shape",
    "asymmetry",
    "peakValue",
    "grid",
    "name",
  ]);
  checkFields("ledSpectrum", "options.grid", options.grid, GRID_FIELDS, { optional: true });
  const peak = requirePositive(options?.peak, "ledSpectrum: peak wavelength (nm)");
  const fwhm = requirePositive(options.fwhm, "ledSpectrum: FWHM (nm)");
  const a = requireFinite(options.asymmetry ?? 0, "ledSpectrum: asymmetry");
  if (Math.abs(a) >= 1) throw new Error(`ledSpectrum: asymmetry ${a} must lie between −1 and 1 (exclusive)`);
  const height = requirePositive(options.peakValue ?? 1, "ledSpectrum: peak value");
  const shape = options.shape ?? "ohno 2005";
  if (shape !== "ohno 2005" && shape !== "gaussian")
    throw new Error(`ledSpectrum: shape "${String(shape)}" is not "ohno 2005" or "gaussian"`);
  const halfU = shape === "ohno 2005" ? OHNO_HALF_WIDTH_U : Math.sqrt(Math.LN2);
  const f = shape === "ohno 2005" ? ohnoLedShape : (u: number) => Math.exp(-u * u);
  // Each side's Δλ is chosen so the curve is at half height (1 ± a)·FWHM/2 from the peak.
  const deltaShort = ((1 - a) * fwhm) / 2 / halfU;
  const deltaLong = ((1 + a) * fwhm) / 2 / halfU;
  const w = gridWavelengths(options.grid ?? { start: 360, end: 830, step: 1 });
  noteMethod(
    "mixing",
    shape === "ohno 2005"
      ? "LED spectra were modelled with Ohno's shape [g + 2g⁵]/3, g = exp(−((λ − λ₀)/Δλ)²) (Opt. Eng. 44, 111302, 2005), scaled to the stated FWHM."
      : "LED spectra were modelled as Gaussians with the stated peak wavelength and FWHM.",
  );
  return spectrum(
    w,
    w.map((l) => height * f((l - peak) / (l < peak ? deltaShort : deltaLong))),
    {
      name: options.name ?? `LED ${peak} nm / ${fwhm} nm`,
      quantity: "relative power",
    },
  );
}

export interface PhosphorWhiteOptions {
  /** The blue pump LED (peak, FWHM, shape as in ledSpectrum). */
  blue: Omit<LedOptions, "grid" | "name" | "peakValue">;
  /** The phosphor's broad emission band: a model band (Gaussian, with optional asymmetry) or a measured spectrum. */
  phosphor: { peak: number; fwhm: number; asymmetry?: number } | Spectrum;
  /** Radiant power of the phosphor band over that of the blue band (both summed over the grid). */
  phosphorToBlue: number;
  /** Wavelengths { start, end, step } in nm; default 360–830 nm every 1 nm (a measured phosphor must be on it). */
  grid?: WavelengthGrid;
  /** The spectrum's name; default "phosphor white (<peak> nm pump, ratio <r>)". */
  name?: string;
}

/**
 * A model phosphor-converted white LED: a blue pump band plus a broad phosphor band at a given ratio of radiant powers.
 *
 * @returns A "relative power" `Spectrum`, named `options.name` or "phosphor white (<peak> nm pump, ratio <r>)".
 * @source none: a model, common practice with no source (pump band as in `ledSpectrum`).
 * @example phosphorWhite({ blue: { peak: 450, fwhm: 20 }, phosphor: { peak: 560, fwhm: 110, asymmetry: 0.2 }, phosphorToBlue: 2.5 })
 */
export function phosphorWhite(options: PhosphorWhiteOptions): Spectrum {
  checkWith(
    "phosphorWhite",
    "options",
    options,
    "options { blue: { peak, fwhm }, phosphor: a spectrum or { peak, fwhm }, phosphorToBlue: number, grid?, name? }",
    (o) =>
      typeof o === "object" &&
      o !== null &&
      typeof (o as { blue?: unknown }).blue === "object" &&
      (o as { blue?: unknown }).blue !== null &&
      typeof (o as { phosphor?: unknown }).phosphor === "object" &&
      (o as { phosphor?: unknown }).phosphor !== null &&
      Number.isFinite((o as { phosphorToBlue?: unknown }).phosphorToBlue),
  );
  checkOptions("phosphorWhite", "options", options, ["blue", "phosphor", "phosphorToBlue", "grid", "name"]);
  checkFields("phosphorWhite", "options.blue", options.blue, {
    what: "the blue LED { peak, fwhm } in nm",
    keys: ["peak", "fwhm"],
  });
  checkWith(
    "phosphorWhite",
    "options.phosphor",
    options.phosphor,
    "the phosphor: an emission spectrum or { peak, fwhm } in nm",
    (p) => isWellFormedSpectrum(p) || hasNumberFields(p, { what: "", keys: ["peak", "fwhm"] }),
  );
  checkFields("phosphorWhite", "options.grid", options.grid, GRID_FIELDS, { optional: true });
  const grid = options.grid ?? { start: 360, end: 830, step: 1 };
  const ratio = requirePositive(options.phosphorToBlue, "phosphorWhite: phosphor-to-blue power ratio");
  const blue = ledSpectrum({ ...options.blue, grid, name: "blue pump" });
  const w = blue.wavelengths;
  let band: number[];
  if ("kind" in options.phosphor) {
    const p = options.phosphor;
    if (p.wavelengths.length !== w.length || p.wavelengths.some((x, i) => Math.abs(x - w[i]!) > 1e-9)) {
      throw new Error(
        `phosphorWhite: the phosphor spectrum "${p.name}" must be on the same grid as the model (${w[0]}–${w.at(-1)} nm); resample it first`,
      );
    }
    band = [...p.values];
  } else {
    // The phosphor band's shape is stated below with the white it belongs to, not as a second LED model.
    const phosphor = options.phosphor;
    band = withoutMethodNotes(
      () => ledSpectrum({ ...phosphor, shape: "gaussian", grid, name: "phosphor" }).values as number[],
    );
  }
  const sumBlue = blue.values.reduce((s, v) => s + v, 0);
  const sumBand = band.reduce((s, v) => s + v, 0);
  if (!(sumBand > 0)) throw new Error("phosphorWhite: the phosphor band has no power");
  const k = (ratio * sumBlue) / sumBand;
  noteMethod(
    "mixing",
    "kind" in options.phosphor
      ? "Phosphor-converted white light was modelled as a blue LED band plus the given phosphor spectrum at a stated ratio of radiant powers."
      : "Phosphor-converted white light was modelled as a blue LED band plus a Gaussian phosphor band of stated peak wavelength and FWHM, at a stated ratio of radiant powers.",
  );
  return spectrum(
    w,
    w.map((_, i) => blue.values[i]! + k * band[i]!),
    {
      name: options.name ?? `phosphor white (${options.blue.peak} nm pump, ratio ${ratio})`,
      quantity: "relative power",
    },
  );
}
