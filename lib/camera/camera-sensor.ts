/** Camera sensor spectral sensitivities r̄(λ), ḡ(λ), b̄(λ): supplied by the user, or smooth invented ones. */
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { sameWavelengths } from "../spectrum/grid.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkNumberList } from "../arguments/check-list.ts";
import { checkString } from "../arguments/check-text.ts";
import { checkFields, GRID_FIELDS } from "../arguments/check-fields.ts";
import { gridWavelengths, type WavelengthGrid } from "../spectrum/grid.ts";

/** A camera's three channel sensitivities on one wavelength grid. */
export interface CameraSensor {
  readonly kind: "camera sensor";
  readonly name: string;
  /** True for the invented sensitivities of `inventedCameraSensor` (demonstrations only, never a real camera). */
  readonly invented: boolean;
  readonly wavelengths: readonly number[];
  readonly r: readonly number[];
  readonly g: readonly number[];
  readonly b: readonly number[];
}

/** True for a camera-sensor object. */
export function isCameraSensor(value: unknown): value is CameraSensor {
  return (
    typeof value === "object" && value !== null && (value as { kind?: unknown }).kind === "camera sensor"
  );
}

/**
 * A camera sensor from three measured (or published) channel sensitivity spectra on one wavelength grid.
 *
 * @param red The red channel's spectral sensitivity (any scale; relative is fine).
 * @param green The green channel's, on the same wavelengths.
 * @param blue The blue channel's, on the same wavelengths.
 * @param options.name The sensor's name; default "camera sensor".
 * @returns A `CameraSensor` (invented: false).
 * @source none: a tristim record of the user's data, no published formula.
 * @example cameraSensor(...cameraSensorSpectra(inventedCameraSensor()))
 */
export function cameraSensor(
  red: Spectrum,
  green: Spectrum,
  blue: Spectrum,
  options: { name?: string } = {},
): CameraSensor {
  checkSpectrum("cameraSensor", "red", red);
  checkSpectrum("cameraSensor", "green", green);
  checkSpectrum("cameraSensor", "blue", blue);
  checkOptions("cameraSensor", "options", options, ["name"]);
  checkString("cameraSensor", "options.name", options.name, {
    optional: true,
    what: "a name for the sensor",
  });
  if (!sameWavelengths(red, green) || !sameWavelengths(red, blue))
    throw new Error("cameraSensor: the three channels must be on the same wavelengths (resample them first)");
  return {
    kind: "camera sensor",
    name: options.name ?? "camera sensor",
    invented: false,
    wavelengths: red.wavelengths,
    r: red.values,
    g: green.values,
    b: blue.values,
  };
}

export interface InventedSensorOptions {
  /** Peak wavelengths of the red, green and blue channels in nm; default [600, 535, 455] (invented). */
  peaks?: readonly number[];
  /** Gaussian widths (standard deviations) in nm; default [32, 38, 28] (invented). */
  widths?: readonly number[];
  /** Wavelength grid; default 380–780 nm every 5 nm. */
  grid?: WavelengthGrid;
}

/**
 * Smooth INVENTED camera sensitivities (Gaussians, each peaking at 1), for demonstrations only: no real camera is modelled.
 *
 * @param options.peaks Peak wavelengths [red, green, blue] in nm; default [600, 535, 455].
 * @param options.widths Standard deviations [red, green, blue] in nm; default [32, 38, 28].
 * @param options.grid Wavelengths { start, end, step } in nm; default 380–780 nm every 5 nm.
 * @returns A `CameraSensor` with invented: true and "(invented)" in its name.
 * @source none: invented demonstration data (Gaussian shapes, common practice with no source).
 * @example inventedCameraSensor({ peaks: [610, 540, 450] }).name
 */
export function inventedCameraSensor(options: InventedSensorOptions = {}): CameraSensor {
  checkOptions("inventedCameraSensor", "options", options, ["peaks", "widths", "grid"]);
  checkNumberList("inventedCameraSensor", "options.peaks", options.peaks, {
    optional: true,
    length: 3,
    unit: "nm",
  });
  checkNumberList("inventedCameraSensor", "options.widths", options.widths, {
    optional: true,
    length: 3,
    unit: "nm",
  });
  checkFields("inventedCameraSensor", "options.grid", options.grid, GRID_FIELDS, { optional: true });
  const peaks = options.peaks ?? [600, 535, 455];
  const widths = options.widths ?? [32, 38, 28];
  if (widths.some((w) => !(w > 0))) throw new Error("inventedCameraSensor: widths must be positive (nm)");
  const wl = gridWavelengths(options.grid ?? { start: 380, end: 780, step: 5 });
  const channel = (c: number) => wl.map((w) => Math.exp(-0.5 * ((w - peaks[c]!) / widths[c]!) ** 2));
  return {
    kind: "camera sensor",
    name: `invented camera sensor (peaks ${peaks.join(", ")} nm) (invented)`,
    invented: true,
    wavelengths: wl,
    r: channel(0),
    g: channel(1),
    b: channel(2),
  };
}

/**
 * The sensor's three channels as spectra (for plots), named after the sensor.
 *
 * @param sensor A `CameraSensor`.
 * @returns [red, green, blue] as `Spectrum` objects of quantity "other".
 * @source none: a tristim helper, no published formula.
 * @example cameraSensorSpectra(inventedCameraSensor())[1].name
 */
export function cameraSensorSpectra(sensor: CameraSensor): [Spectrum, Spectrum, Spectrum] {
  checkCameraSensor("cameraSensorSpectra", sensor);
  const one = (v: readonly number[], c: string) =>
    spectrum(sensor.wavelengths, v, { name: `${sensor.name}: ${c}`, quantity: "other" });
  return [one(sensor.r, "red"), one(sensor.g, "green"), one(sensor.b, "blue")];
}

/** Throws an ArgumentError unless `value` is a camera sensor. */
export function checkCameraSensor(fn: string, value: unknown, arg = "sensor"): void {
  checkWithSensor(fn, arg, value);
}

import { checkWith } from "../arguments/check-with.ts";
function checkWithSensor(fn: string, arg: string, value: unknown): void {
  checkWith(fn, arg, value, "a camera sensor (from cameraSensor or inventedCameraSensor)", isCameraSensor);
}
