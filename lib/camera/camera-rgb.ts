/** Camera RGB of a spectrum: Σ stimulus · channel sensitivity, for a light or for a sample under an illuminant. */
import { noteMethod } from "../methods/method-log.ts";
import { illuminant as illuminantByName } from "../illuminants/standard-illuminant.ts";
import { sampler } from "../spectrum/sample.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import type { Rgb } from "../rgb/rgb-conversion.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkIlluminantChoice } from "../arguments/common-arguments.ts";
import { checkCameraSensor, type CameraSensor } from "./camera-sensor.ts";

export interface CameraRgbOptions {
  /** For a reflectance or transmittance: the illuminant, a name or a spectrum; default "D65". Ignored for a light. */
  illuminant?: string | Spectrum;
}

/** The stimulus E(λ)·R(λ) (or the light) on the sensor's grid, and the white's green sum for a sample. */
export function stimulusOnSensorGrid(
  stimulus: Spectrum,
  sensor: CameraSensor,
  illuminant: string | Spectrum | undefined,
): { values: number[]; object: boolean; illuminantName: string; illuminantValues: number[] } {
  const object = stimulus.quantity === "reflectance" || stimulus.quantity === "transmittance";
  const read = sampler(stimulus, { extrapolation: object ? "hold" : "zero" });
  const ill = object
    ? typeof illuminant === "object"
      ? illuminant
      : illuminantByName(illuminant ?? "D65")
    : undefined;
  const readIll = ill ? sampler(ill, { extrapolation: "zero" }) : () => 1;
  const illuminantValues = sensor.wavelengths.map((w) => readIll(w));
  const values = sensor.wavelengths.map((w, i) => read(w) * illuminantValues[i]!);
  return { values, object, illuminantName: ill?.name ?? "", illuminantValues };
}

const statements = new Map<string, string>();

/**
 * Camera RGB of a light, or of a reflecting or transmitting sample under an illuminant: ρc = Σ E(λ) R(λ) c̄(λ), each channel scaled so the perfect white under the illuminant gives 1 (white-balanced).
 *
 * A light (any quantity other than reflectance/transmittance) gives the raw sums Σ S(λ) c̄(λ) Δλ instead.
 *
 * @param stimulus A reflectance/transmittance spectrum (fractions 0–1) or a light spectrum.
 * @param sensor A `CameraSensor`.
 * @param options.illuminant The illuminant for a sample, a name or a spectrum; default "D65".
 * @returns { r, g, b }: white-balanced for a sample (white = 1, 1, 1), raw for a light.
 * @source The linear sensor model (e.g. Vora, Farrell, Tietz & Brainard, IEEE Trans. Image Proc. 10 (2001) 307–316), summed as CIE 015:2018 eq. 7.1 with the sensitivities in place of the colour-matching functions.
 * @example cameraRgb(spectrumOnGrid(380, 5, new Array(81).fill(0.5), { quantity: "reflectance" }), inventedCameraSensor())
 */
export function cameraRgb(stimulus: Spectrum, sensor: CameraSensor, options: CameraRgbOptions = {}): Rgb {
  checkSpectrum("cameraRgb", "stimulus", stimulus);
  checkCameraSensor("cameraRgb", sensor);
  checkOptions("cameraRgb", "options", options, ["illuminant"]);
  checkIlluminantChoice("cameraRgb", "options.illuminant", options.illuminant);
  const st = stimulusOnSensorGrid(stimulus, sensor, options.illuminant);
  const n = sensor.wavelengths.length;
  const step = n > 1 ? (sensor.wavelengths[n - 1]! - sensor.wavelengths[0]!) / (n - 1) : 1;
  let r = 0,
    g = 0,
    b = 0,
    wr = 0,
    wg = 0,
    wb = 0;
  for (let i = 0; i < n; i++) {
    r += st.values[i]! * sensor.r[i]!;
    g += st.values[i]! * sensor.g[i]!;
    b += st.values[i]! * sensor.b[i]!;
    wr += st.illuminantValues[i]! * sensor.r[i]!;
    wg += st.illuminantValues[i]! * sensor.g[i]!;
    wb += st.illuminantValues[i]! * sensor.b[i]!;
  }
  const key = `${sensor.name}|${st.illuminantName}`;
  let statement = statements.get(key);
  if (statement === undefined) {
    statement = st.object
      ? `Camera RGB values were summed over the sensitivities of the ${sensor.name} under ${st.illuminantName}, each channel scaled so that the perfect white gives 1.`
      : `Camera RGB values of lights were summed over the sensitivities of the ${sensor.name}, unscaled.`;
    statements.set(key, statement);
  }
  noteMethod("other", statement);
  if (!st.object) return { r: r * step, g: g * step, b: b * step };
  if (!(wr > 0 && wg > 0 && wb > 0))
    throw new Error(
      `cameraRgb: a channel of "${sensor.name}" sees nothing of the illuminant; cannot white-balance`,
    );
  return { r: r / wr, g: g / wg, b: b / wb };
}
