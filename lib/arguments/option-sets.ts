/**
 * The option objects several colorimetric functions share (summation, light, photometry, CCT, adaptation), each
 * checked in one call: unknown names are refused with the list of valid ones, known ones must have the right kind.
 */
import { ArgumentError } from "./argument-error.ts";
import { describeKind } from "./describe-kind.ts";
import { checkChoice } from "./check-text.ts";
import { checkFields, XY_FIELDS } from "./check-fields.ts";
import { checkNumberList } from "./check-list.ts";
import { checkOptions } from "./check-options.ts";
import { checkWith } from "./check-with.ts";
import { checkIlluminantChoice, checkObserver, checkSampling } from "./common-arguments.ts";

type Options = Record<string, unknown> | undefined;

const SUMMATION_KEYS = ["illuminant", "observer", "interval", "range"] as const;

function checkSummation(fn: string, o: Options): void {
  if (o === undefined) return;
  checkIlluminantChoice(fn, "options.illuminant", o.illuminant);
  checkObserver(fn, "options.observer", o.observer);
  checkChoice(fn, "options.interval", o.interval, [1, 5, 10, 20], {
    what: "a summation interval in nm",
    optional: true,
  });
  checkNumberList(fn, "options.range", o.range, { length: 2, unit: "nm", optional: true });
}

/** Options of whitePoint and weightingTable: illuminant, observer, interval (1 or 5 nm), range [first, last] nm. */
export function checkTableOptions(fn: string, options: unknown, more: readonly string[] = []): void {
  checkOptions(fn, "options", options, [...SUMMATION_KEYS, ...more]);
  checkSummation(fn, options as Options);
}

/** Options of tristimulus and objectColour: the table options plus interpolation and extrapolation. */
export function checkObjectColourOptions(fn: string, options: unknown, more: readonly string[] = []): void {
  checkSampling(fn, "options", options, [...SUMMATION_KEYS, ...more]);
  checkSummation(fn, options as Options);
}

/** Options of lightTristimulus: observer and scale ("relative" or "absolute"). */
export function checkLightOptions(fn: string, options: unknown): void {
  checkOptions(fn, "options", options, ["observer", "scale"]);
  if (options === undefined) return;
  const o = options as Record<string, unknown>;
  checkObserver(fn, "options.observer", o.observer);
  checkChoice(fn, "options.scale", o.scale, ["relative", "absolute"], { optional: true });
}

/** Options { vision } of the photometric quantities. */
export function checkVisionOptions(fn: string, options: unknown): void {
  checkOptions(fn, "options", options, ["vision"]);
  if (options === undefined) return;
  checkChoice(fn, "options.vision", (options as Record<string, unknown>).vision, ["photopic", "scotopic"], {
    optional: true,
  });
}

/** Options { method } of the CCT functions (the option is called `key`, "method" unless told). */
export function checkCctOptions(fn: string, options: unknown, key = "method"): void {
  checkOptions(fn, "options", options, [key]);
  if (options === undefined) return;
  checkChoice(fn, `options.${key}`, (options as Record<string, unknown>)[key], ["ohno", "robertson"], {
    optional: true,
  });
}

/** A chromatic adaptation transform name as chromaticAdaptation accepts it (case, spaces and dashes ignored). */
export function checkTransform(fn: string, transform: unknown): void {
  const known = ["bradford", "cat02", "cat16", "von kries"];
  checkWith(
    fn,
    "transform",
    transform,
    `a chromatic adaptation transform: ${known.map((k) => JSON.stringify(k)).join(", ")}`,
    (t) =>
      typeof t === "string" &&
      known.some(
        (k) =>
          k.replace(" ", "") ===
          t
            .trim()
            .toLowerCase()
            .replace(/[\s_-]+/g, ""),
      ),
    { optional: true },
  );
}

/** RGB primaries { r: { x, y }, g: { x, y }, b: { x, y } }. */
export function checkPrimaries(fn: string, arg: string, primaries: unknown): void {
  checkWith(
    fn,
    arg,
    primaries,
    "primaries { r: { x, y }, g: { x, y }, b: { x, y } }",
    (p) => typeof p === "object" && p !== null && !Array.isArray(p),
  );
  const p = primaries as Record<string, unknown>;
  for (const k of ["r", "g", "b"]) checkFields(fn, `${arg}.${k}`, p[k], XY_FIELDS);
}

/**
 * Options of luminousTransmittance and luminousReflectance: illuminant, interval, range, interpolation,
 * extrapolation. An observer is refused: the luminous factors are defined with V(λ), which is the CIE 1931 ȳ(λ).
 */
export function checkLuminousOptions(fn: string, options: unknown): void {
  if (typeof options === "object" && options !== null && "observer" in options) {
    throw new ArgumentError(
      fn,
      "options.observer",
      "absent: the luminous factor is weighted by V(λ), the CIE 1931 ȳ(λ), for every observer (ISO/CIE 11664-3)",
      describeKind((options as Record<string, unknown>).observer),
      'for a 10° luminance factor use tristimulus(sample, { observer: "10°" }).Y / 100',
    );
  }
  checkSampling(fn, "options", options, ["illuminant", "interval", "range"]);
  if (options === undefined) return;
  const o = options as Record<string, unknown>;
  checkIlluminantChoice(fn, "options.illuminant", o.illuminant);
  checkChoice(fn, "options.interval", o.interval, [1, 5], {
    what: "a summation interval in nm",
    optional: true,
  });
  checkNumberList(fn, "options.range", o.range, { length: 2, unit: "nm", optional: true });
}
