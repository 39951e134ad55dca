/**
 * A plane-parallel plate in air: internal transmittance τᵢ (the bulk, between the surfaces) and external
 * transmittance T (what a spectrophotometer measures), linked by the reflection ρ at each face and the incoherent
 * multiple reflections between the faces: T = (1 − ρ)² τᵢ / (1 − ρ² τᵢ²), R = ρ + ρ(1 − ρ)² τᵢ² / (1 − ρ² τᵢ²)
 * (the geometric series of incoherent reflections inside the plate, with ρ from the Fresnel equations, Hecht, Optics
 * §4.6). For a clear plate (τᵢ = 1) this gives T = (1 − ρ)/(1 + ρ) = 2n/(n² + 1).
 */
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { requireFraction, requireFractionSpectrum } from "./checks.ts";
import { describeRefractiveIndex, surfaceReflectanceAt, type RefractiveIndex } from "./fresnel.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkPlateOptions } from "../arguments/physics-arguments.ts";

/**
 * External transmittance of a plate in air from its internal transmittance and face reflectance, T = (1 − ρ)²τᵢ ÷ (1 − ρ²τᵢ²).
 *
 * @param internal The internal transmittance τᵢ, a fraction 0–1.
 * @param faceReflectance The reflectance ρ of each face, a fraction 0–1.
 * @returns T, a fraction.
 * @source Plate relation with incoherent multiple reflections; E. Hecht, Optics, 5th ed., §4.6.
 * @example externalFromInternal(0.8, surfaceReflectance(1.5))
 */
export function externalFromInternal(internal: number, faceReflectance: number): number {
  checkNumber("externalFromInternal", "internal", internal, {
    unit: "fraction",
    instead: { spectrum: "for a spectrum use externalTransmittance" },
  });
  checkNumber("externalFromInternal", "faceReflectance", faceReflectance, { unit: "fraction", below: 1 });
  requireFraction(internal, "internal transmittance");
  requireFraction(faceReflectance, "face reflectance");
  const r = faceReflectance;
  return ((1 - r) ** 2 * internal) / (1 - r * r * internal * internal);
}

/**
 * Reflectance of a plate in air (both faces and the light returned through the bulk), R = ρ + ρ(1 − ρ)²τᵢ² ÷ (1 − ρ²τᵢ²).
 *
 * @param internal The internal transmittance τᵢ, a fraction 0–1.
 * @param faceReflectance The reflectance ρ of each face, a fraction 0–1.
 * @returns R, a fraction.
 * @source Plate relation with incoherent multiple reflections; E. Hecht, Optics, 5th ed., §4.6.
 * @example plateReflectanceValue(1, surfaceReflectance(1.5))
 */
export function plateReflectanceValue(internal: number, faceReflectance: number): number {
  checkNumber("plateReflectanceValue", "internal", internal, {
    unit: "fraction",
    instead: { spectrum: "for a spectrum use plateReflectance" },
  });
  checkNumber("plateReflectanceValue", "faceReflectance", faceReflectance, { unit: "fraction", below: 1 });
  requireFraction(internal, "internal transmittance");
  requireFraction(faceReflectance, "face reflectance");
  const r = faceReflectance;
  const t2 = internal * internal;
  return r + (r * (1 - r) ** 2 * t2) / (1 - r * r * t2);
}

/**
 * The largest external transmittance a non-absorbing plate can have, (1 − ρ) ÷ (1 + ρ) (τᵢ = 1 in the plate relation).
 *
 * @param faceReflectance The reflectance ρ of each face, a fraction 0–1.
 * @returns T of a clear plate, a fraction (2n ÷ (n² + 1) for index n).
 * @source Plate relation; E. Hecht, Optics, 5th ed., §4.6.
 * @example clearPlateTransmittance(surfaceReflectance(1.5))
 */
export function clearPlateTransmittance(faceReflectance: number): number {
  checkNumber("clearPlateTransmittance", "faceReflectance", faceReflectance, { unit: "fraction", below: 1 });
  requireFraction(faceReflectance, "face reflectance");
  return (1 - faceReflectance) / (1 + faceReflectance);
}

/** What to do with a measured external transmittance above what a clear plate of that index can pass. */
export type AboveClearPlate = "error" | "clip";

/**
 * Internal transmittance from a measured external one: the positive root of ρ²T τᵢ² + (1 − ρ)² τᵢ − T = 0.
 *
 * @param external The measured external transmittance T, a fraction 0–1.
 * @param faceReflectance The reflectance ρ of each face, a fraction 0–1.
 * @param above What to do with T above the clear-plate limit: "error" (default) or "clip" to τᵢ = 1.
 * @returns τᵢ, a fraction 0–1.
 * @source The plate relation of E. Hecht, Optics, 5th ed., §4.6, solved for τᵢ.
 * @example internalFromExternal(0.7, surfaceReflectance(1.5))
 */
export function internalFromExternal(
  external: number,
  faceReflectance: number,
  above: AboveClearPlate = "error",
): number {
  checkNumber("internalFromExternal", "external", external, {
    unit: "fraction",
    instead: { spectrum: "for a spectrum use internalTransmittance" },
  });
  checkNumber("internalFromExternal", "faceReflectance", faceReflectance, { unit: "fraction", below: 1 });
  checkChoice("internalFromExternal", "above", above, ["error", "clip"], { optional: true });
  requireFraction(external, "external transmittance");
  requireFraction(faceReflectance, "face reflectance");
  const r = faceReflectance;
  const limit = clearPlateTransmittance(r);
  if (external > limit * (1 + 1e-12)) {
    if (above === "clip") return 1;
    throw new Error(
      `external transmittance ${external} is above ${limit.toFixed(5)}, the most a non-absorbing plate with face reflectance ${r.toFixed(5)} can pass; check the refractive index or the data (or pass aboveClearPlate: "clip")`,
    );
  }
  if (external === 0) return 0;
  if (r === 0) return external;
  const a = r * r * external;
  const b = (1 - r) ** 2;
  // Stable form of (−b + √(b² + 4a·T)) / (2a): 2T / (b + √(b² + 4aT)).
  return Math.min(1, (2 * external) / (b + Math.sqrt(b * b + 4 * a * external)));
}

export interface PlateOptions {
  /** Refractive index of the plate (a number, or a dispersion curve n(λ)); required, never assumed. */
  refractiveIndex: RefractiveIndex;
  /** The result's name; default the input spectrum's name (with " (reflectance)" or " (rescaled)" where a function says so). */
  name?: string;
}

export interface InternalOptions extends PlateOptions {
  /** A measured value above the clear-plate limit: "error" (default) or "clip" to internal transmittance 1. */
  aboveClearPlate?: AboveClearPlate;
}

function requireIndex(options: PlateOptions | undefined, what: string): RefractiveIndex {
  if (!options || options.refractiveIndex === undefined) {
    throw new Error(
      `${what}: give the plate's refractiveIndex (e.g. { refractiveIndex: 1.5 }); it is never assumed`,
    );
  }
  return options.refractiveIndex;
}

function notePlate(index: RefractiveIndex): void {
  noteMethod(
    "optics",
    `Internal and external transmittance were related by the plate relation with incoherent multiple reflections between the faces, T = (1 − ρ)²τᵢ/(1 − ρ²τᵢ²), at normal incidence (${describeRefractiveIndex(index)}).`,
  );
}

/**
 * External transmittance spectrum of a plate in air from its internal transmittance (plate relation at each wavelength).
 *
 * @param internal The internal transmittance spectrum, fractions 0–1.
 * @returns A "transmittance" `Spectrum` named `options.name` or the input's name.
 * @source Fresnel equations and the plate relation; E. Hecht, Optics, 5th ed., §4.6.
 * @example externalTransmittance(spectrumOnGrid(400, 100, [0.9, 0.8, 0.7]), { refractiveIndex: 1.5 })
 */
export function externalTransmittance(internal: Spectrum, options: PlateOptions): Spectrum {
  checkSpectrum("externalTransmittance", "internal", internal, {
    what: "an internal transmittance spectrum (fractions 0–1)",
    instead: { number: "for a single value use externalFromInternal" },
  });
  checkPlateOptions("externalTransmittance", options);
  const index = requireIndex(options, "externalTransmittance");
  requireFractionSpectrum(internal, "internal transmittance");
  const rho = surfaceReflectanceAt(index, internal.wavelengths);
  notePlate(index);
  return spectrum(
    internal.wavelengths,
    internal.values.map((t, i) => externalFromInternal(t, rho[i]!)),
    {
      name: options.name ?? internal.name,
      quantity: "transmittance",
    },
  );
}

/**
 * Internal transmittance spectrum from a measured external transmittance (plate relation solved for τᵢ at each wavelength).
 *
 * @param external The measured external transmittance spectrum, fractions 0–1.
 * @returns A "transmittance" `Spectrum` named `options.name` or the input's name.
 * @source Fresnel equations and the plate relation; E. Hecht, Optics, 5th ed., §4.6.
 * @example internalTransmittance(spectrumOnGrid(400, 100, [0.8, 0.7, 0.6]), { refractiveIndex: 1.5 })
 */
export function internalTransmittance(external: Spectrum, options: InternalOptions): Spectrum {
  checkSpectrum("internalTransmittance", "external", external, {
    what: "a measured (external) transmittance spectrum (fractions 0–1)",
    instead: { number: "for a single value use internalFromExternal" },
  });
  checkPlateOptions("internalTransmittance", options, ["aboveClearPlate"]);
  const index = requireIndex(options, "internalTransmittance");
  requireFractionSpectrum(external, "external transmittance");
  const rho = surfaceReflectanceAt(index, external.wavelengths);
  notePlate(index);
  const values = external.values.map((t, i) => {
    try {
      return internalFromExternal(t, rho[i]!, options.aboveClearPlate ?? "error");
    } catch (e) {
      throw new Error(`"${external.name}" at ${external.wavelengths[i]} nm: ${(e as Error).message}`);
    }
  });
  return spectrum(external.wavelengths, values, {
    name: options.name ?? external.name,
    quantity: "transmittance",
  });
}

/**
 * Reflectance spectrum of a plate in air from its internal transmittance (both faces and the light returned through the bulk).
 *
 * @param internal The internal transmittance spectrum, fractions 0–1.
 * @returns A "reflectance" `Spectrum`, named `options.name` or "<input> (reflectance)".
 * @source Fresnel equations and the plate relation; E. Hecht, Optics, 5th ed., §4.6.
 * @example plateReflectance(spectrumOnGrid(400, 100, [1, 1, 1]), { refractiveIndex: 1.5 })
 */
export function plateReflectance(internal: Spectrum, options: PlateOptions): Spectrum {
  checkSpectrum("plateReflectance", "internal", internal, {
    what: "an internal transmittance spectrum (fractions 0–1)",
    instead: { number: "for a single value use plateReflectanceValue" },
  });
  checkPlateOptions("plateReflectance", options);
  const index = requireIndex(options, "plateReflectance");
  requireFractionSpectrum(internal, "internal transmittance");
  const rho = surfaceReflectanceAt(index, internal.wavelengths);
  notePlate(index);
  return spectrum(
    internal.wavelengths,
    internal.values.map((t, i) => plateReflectanceValue(t, rho[i]!)),
    {
      name: options.name ?? `${internal.name} (reflectance)`,
      quantity: "reflectance",
    },
  );
}
