/**
 * Checks for the arguments many functions share: the observer, the illuminant, a spectrum's label, the sampling
 * options, an RGB space and a gamut. Each is one call at the top of a public function.
 */
import { checkChoice } from "./check-text.ts";
import { checkFields, hasNumberFields, XY_FIELDS } from "./check-fields.ts";
import { checkOptions } from "./check-options.ts";
import { isWellFormedSpectrum } from "./check-spectrum.ts";
import { checkWith } from "./check-with.ts";

/** The expected-value phrase for an observer argument. */
export const OBSERVER_CHOICE =
  'an observer: "2°" (CIE 1931), "10°" (CIE 1964), "CIE 2015 2°", "CIE 2015 10°", 2, 10, or an observer object';

/** True for what observerByName accepts: the names "2°", "10°", "1931", "1964", "CIE 1931", ..., 2, 10, an observer. */
export function isObserverChoice(value: unknown): boolean {
  if (typeof value === "object" && value !== null) return (value as { kind?: unknown }).kind === "observer";
  if (typeof value !== "string" && typeof value !== "number") return false;
  const key = String(value)
    .replace(/^CIE\s*/i, "")
    .replace("°", "")
    .trim();
  return (
    key === "2" || key === "10" || key === "1931" || key === "1964" || key === "2015 2" || key === "2015 10"
  );
}

/** Throws an ArgumentError unless `value` is an observer choice (undefined passes: the default applies). */
export function checkObserver(fn: string, arg: string, value: unknown): void {
  checkWith(fn, arg, value, OBSERVER_CHOICE, isObserverChoice, { optional: true });
}

/** Throws an ArgumentError unless `value` is an illuminant name or a spectrum (undefined passes). */
export function checkIlluminantChoice(fn: string, arg: string, value: unknown): void {
  checkWith(
    fn,
    arg,
    value,
    'an illuminant name ("D65", "A", "FL2", ...; see illuminantNames()) or a spectrum',
    (v) => (typeof v === "string" && v.length > 0) || isWellFormedSpectrum(v),
    { optional: true },
  );
}

/** The spectral quantities a spectrum can be labelled with (SpectralQuantity). */
export const QUANTITIES: readonly string[] = [
  "relative power",
  "radiance",
  "irradiance",
  "radiant flux",
  "transmittance",
  "reflectance",
  "absorbance",
  "optical density",
  "colour matching",
  "luminous efficiency",
  "other",
];

/** Throws an ArgumentError unless `value` is undefined or a spectrum label { name?, quantity?, unit? }. */
export function checkLabel(fn: string, arg: string, value: unknown): void {
  checkOptions(fn, arg, value, ["name", "quantity", "unit"]);
  if (value === undefined) return;
  const label = value as { name?: unknown; quantity?: unknown; unit?: unknown };
  checkWith(fn, `${arg}.name`, label.name, "a string", (v) => typeof v === "string", { optional: true });
  checkChoice(fn, `${arg}.quantity`, label.quantity, QUANTITIES, { optional: true });
  checkWith(fn, `${arg}.unit`, label.unit, "a string", (v) => typeof v === "string", { optional: true });
}

/** Throws an ArgumentError unless `value` is undefined or sampling options { interpolation?, extrapolation? }. */
export function checkSampling(fn: string, arg: string, value: unknown, more: readonly string[] = []): void {
  checkOptions(fn, arg, value, ["interpolation", "extrapolation", ...more]);
  if (value === undefined) return;
  const o = value as { interpolation?: unknown; extrapolation?: unknown };
  checkChoice(fn, `${arg}.interpolation`, o.interpolation, ["auto", "linear", "sprague", "spline"], {
    optional: true,
  });
  checkChoice(fn, `${arg}.extrapolation`, o.extrapolation, ["hold", "zero", "refuse"], { optional: true });
}

/** True for an RGB space object (from rgbSpace() or rgbSpaceFromPrimaries()). */
export function isRgbSpace(value: unknown): boolean {
  return typeof value === "object" && value !== null && (value as { kind?: unknown }).kind === "rgb space";
}

// Built once: checked on every RGB conversion, a hot path.
const RGB_SPACE_RULE = { instead: { string: 'for a space by name use rgbSpace("…")' } };

/** Throws an ArgumentError unless `value` is an RGB space object. */
export function checkRgbSpace(fn: string, arg: string, value: unknown): void {
  checkWith(
    fn,
    arg,
    value,
    'an RGB space (from rgbSpace("sRGB") or rgbSpaceFromPrimaries)',
    isRgbSpace,
    RGB_SPACE_RULE,
  );
}

/** Throws an ArgumentError unless `value` is a gamut: an RGB space or an array of at least 3 chromaticities { x, y }. */
export function checkGamut(fn: string, arg: string, value: unknown): void {
  if (Array.isArray(value)) value.forEach((c, i) => checkFields(fn, `${arg}[${i}]`, c, XY_FIELDS));
  checkWith(
    fn,
    arg,
    value,
    "a gamut: an RGB space or an array of at least 3 chromaticities { x, y }",
    (v) =>
      isRgbSpace(v) || (Array.isArray(v) && v.length >= 3 && v.every((c) => hasNumberFields(c, XY_FIELDS))),
    { instead: { string: 'for a space by name use rgbSpace("…")' } },
  );
}
