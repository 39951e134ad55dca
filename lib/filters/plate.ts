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

/** External transmittance of a plate with internal transmittance τᵢ and face reflectance ρ: (1 − ρ)²τᵢ/(1 − ρ²τᵢ²) (Hecht, Optics §4.6). */
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

/** Reflectance of a plate (both faces and the light returned through the bulk): ρ + ρ(1 − ρ)²τᵢ²/(1 − ρ²τᵢ²) (Hecht, Optics §4.6). */
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

/** The largest external transmittance a non-absorbing plate can have: (1 − ρ)/(1 + ρ) (τᵢ = 1 in the plate relation). */
export function clearPlateTransmittance(faceReflectance: number): number {
  checkNumber("clearPlateTransmittance", "faceReflectance", faceReflectance, { unit: "fraction", below: 1 });
  requireFraction(faceReflectance, "face reflectance");
  return (1 - faceReflectance) / (1 + faceReflectance);
}

/** What to do with a measured external transmittance above what a clear plate of that index can pass. */
export type AboveClearPlate = "error" | "clip";

/**
 * Internal transmittance from a measured external one: the positive root of ρ²T τᵢ² + (1 − ρ)² τᵢ − T = 0
 * (the plate relation of Hecht, Optics §4.6, solved for τᵢ).
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

/** External transmittance of a plate from its internal transmittance spectrum (plate relation, Hecht §4.6). */
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

/** Internal transmittance from a measured external transmittance spectrum (plate relation solved for τᵢ). */
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

/** Reflectance spectrum of a plate from its internal transmittance (plate relation, Hecht §4.6). */
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
