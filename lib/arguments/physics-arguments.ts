/**
 * Checks for the arguments of the optics, mixing, print and swatch functions: refractive indices, plate options,
 * path changes, ink coverages, recipe parts and swatch colours.
 */
import { hasNumberFields, LAB_FIELDS, XYZ_FIELDS } from "./check-fields.ts";
import { checkNumber } from "./check-number.ts";
import { checkOptions } from "./check-options.ts";
import { isWellFormedSpectrum } from "./check-spectrum.ts";
import { checkWith } from "./check-with.ts";

function isFinitePositive(v: unknown): boolean {
  return typeof v === "number" && Number.isFinite(v) && v > 0;
}

/** A refractive index: a positive number, or a spectrum of indices by wavelength. */
export function checkRefractiveIndex(fn: string, arg: string, value: unknown): void {
  checkWith(
    fn,
    arg,
    value,
    "a refractive index: a number > 0 or a spectrum of indices",
    (v) => isFinitePositive(v) || isWellFormedSpectrum(v),
  );
}

/** Plate options { refractiveIndex, name?, ...more }: the index is required. */
export function checkPlateOptions(fn: string, options: unknown, more: readonly string[] = []): void {
  checkWith(
    fn,
    "options",
    options,
    "options { refractiveIndex: a number or a spectrum, name? }",
    (o) => typeof o === "object" && o !== null && !Array.isArray(o) && !isWellFormedSpectrum(o),
  );
  checkOptions(fn, "options", options, ["refractiveIndex", "name", ...more]);
  checkRefractiveIndex(
    fn,
    "options.refractiveIndex",
    (options as { refractiveIndex?: unknown }).refractiveIndex,
  );
}

function isPair(v: unknown): boolean {
  return Array.isArray(v) && v.length === 2 && v.every((x) => typeof x === "number" && Number.isFinite(x));
}

/** True for a path change { thickness?: [from, to], concentration?: [from, to] } with at least one of them. */
export function isPathChange(value: unknown): boolean {
  if (typeof value !== "object" || value === null || Array.isArray(value)) return false;
  const c = value as { thickness?: unknown; concentration?: unknown };
  if (c.thickness === undefined && c.concentration === undefined) return false;
  return (
    (c.thickness === undefined || isPair(c.thickness)) &&
    (c.concentration === undefined || isPair(c.concentration))
  );
}

/** A path change { thickness?: [from, to], concentration?: [from, to] } (positive numbers). */
export function checkPathChange(fn: string, arg: string, value: unknown): void {
  checkWith(
    fn,
    arg,
    value,
    "a path change { thickness?: [from, to], concentration?: [from, to] }",
    isPathChange,
  );
  checkOptions(fn, arg, value, ["thickness", "concentration"]);
}

/** Ink coverages { c?, m?, y?, k? }, each a fraction from 0 to 1. */
export function checkInkCoverages(fn: string, value: unknown): void {
  checkWith(
    fn,
    "coverages",
    value,
    "ink coverages { c?, m?, y?, k? } (fractions 0–1, at least one ink)",
    (v) => typeof v === "object" && v !== null && !Array.isArray(v) && Object.keys(v).length > 0,
  );
  checkOptions(fn, "coverages", value, ["c", "m", "y", "k"]);
  const c = value as Record<string, unknown>;
  for (const ink of ["c", "m", "y", "k"])
    checkNumber(fn, `coverages.${ink}`, c[ink], { unit: "fraction", optional: true });
}

/** True for a recipe part { colourant (from a colourant function), amount ≥ 0 }. */
export function isRecipePart(value: unknown): boolean {
  if (typeof value !== "object" || value === null) return false;
  const p = value as { colourant?: { kind?: unknown }; amount?: unknown };
  return (
    typeof p.colourant === "object" &&
    p.colourant !== null &&
    p.colourant.kind === "colourant" &&
    typeof p.amount === "number" &&
    Number.isFinite(p.amount) &&
    p.amount >= 0
  );
}

/** True for a swatch colour: a spectrum, { XYZ, white? }, { lab, white? } or { hex }. */
export function isSwatchColour(value: unknown): boolean {
  if (isWellFormedSpectrum(value)) return true;
  if (typeof value !== "object" || value === null) return false;
  const c = value as { XYZ?: unknown; lab?: unknown; hex?: unknown; white?: unknown };
  const whiteOk = c.white === undefined || hasNumberFields(c.white, XYZ_FIELDS);
  if (c.XYZ !== undefined) return hasNumberFields(c.XYZ, XYZ_FIELDS) && whiteOk;
  if (c.lab !== undefined) return hasNumberFields(c.lab, LAB_FIELDS) && whiteOk;
  return typeof c.hex === "string";
}
