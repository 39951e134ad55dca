/**
 * Stacks of filters in series. Each element is described by its internal transmittance and refractive index; the
 * stack's transmittance depends on how the elements are joined:
 * - "no surface losses": the product of internal transmittances (an idealisation, or data already corrected);
 * - "cemented": index-matched joins, so only the stack's two outer faces reflect, with multiple reflections between
 *   them: T = (1 − ρ_a)(1 − ρ_b)Πτᵢ / (1 − ρ_aρ_b(Πτᵢ)²);
 * - "air gaps": each element is a plate in air (plate relation); light reflected between elements is lost;
 * - "air gaps with interreflection": as "air gaps", and light reflected back and forth between the elements is
 *   summed: T₁₂ = T₁T₂ / (1 − R₁'R₂), R₁₂ = R₁ + T₁²R₂ / (1 − R₁'R₂) (the adding relation for incoherent layers, Stokes 1862;
 *   e.g. Kubelka 1954 "New contributions to the optics of intensely light-scattering materials, part II").
 */
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { requireFractionSpectrum, requireSameGrid } from "./checks.ts";
import {
  describeRefractiveIndex,
  indexAtWavelengths,
  surfaceReflectance,
  type RefractiveIndex,
} from "./fresnel.ts";
import { externalFromInternal, internalTransmittance, plateReflectanceValue } from "./plate.ts";
import { checkList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkPlateOptions } from "../arguments/physics-arguments.ts";
import { checkChoice } from "../arguments/check-text.ts";

/** One filter of a stack: its internal (bulk) transmittance and refractive index. */
export interface FilterElement {
  readonly kind: "filter element";
  readonly name: string;
  readonly internal: Spectrum;
  readonly refractiveIndex: RefractiveIndex;
}

/**
 * One element of a filter stack, from its internal transmittance and refractive index (required, never assumed).
 *
 * @param internal The internal (bulk) transmittance spectrum, fractions 0–1.
 * @param options.refractiveIndex The element's refractive index: a number, or a dispersion spectrum n(λ) covering the data (required).
 * @param options.name The element's name; default the spectrum's name.
 * @returns A `FilterElement` for `stackTransmittance`.
 * @source none: a tristim data structure (used with the plate relation of Hecht, Optics §4.6).
 * @example filterElement(spectrumOnGrid(400, 100, [0.9, 0.6, 0.3]), { refractiveIndex: 1.52, name: "invented amber glass" })
 */
export function filterElement(
  internal: Spectrum,
  options: { refractiveIndex: RefractiveIndex; name?: string },
): FilterElement {
  checkSpectrum("filterElement", "internal", internal, {
    what: "an internal transmittance spectrum (fractions 0–1)",
  });
  checkPlateOptions("filterElement", options);
  if (!options || options.refractiveIndex === undefined) {
    throw new Error(
      `filterElement "${internal.name}": give its refractiveIndex (e.g. 1.52); it is never assumed`,
    );
  }
  requireFractionSpectrum(internal, "internal transmittance");
  indexAtWavelengths(options.refractiveIndex, internal.wavelengths).forEach((n, i) => {
    if (!(n >= 1))
      throw new Error(
        `filterElement "${internal.name}": refractive index ${n} at ${internal.wavelengths[i]} nm is below 1`,
      );
  });
  return {
    kind: "filter element",
    name: options.name ?? internal.name,
    internal,
    refractiveIndex: options.refractiveIndex,
  };
}

/**
 * A filter-stack element from a measured external transmittance: the surface reflections are removed first (plate relation).
 *
 * @param external The measured external transmittance spectrum, fractions 0–1.
 * @param options.refractiveIndex The element's refractive index: a number or a dispersion spectrum n(λ) (required).
 * @param options.name The element's name; default the spectrum's name.
 * @param options.aboveClearPlate A value above the clear-plate limit: "error" (default) or "clip" to internal transmittance 1.
 * @returns A `FilterElement`.
 * @source E. Hecht, Optics, 5th ed., §4.6 (plate relation solved for the internal transmittance).
 * @example filterElementFromMeasurement(spectrumOnGrid(400, 100, [0.8, 0.6, 0.3]), { refractiveIndex: 1.5 })
 */
export function filterElementFromMeasurement(
  external: Spectrum,
  options: { refractiveIndex: RefractiveIndex; name?: string; aboveClearPlate?: "error" | "clip" },
): FilterElement {
  checkSpectrum("filterElementFromMeasurement", "external", external, {
    what: "a measured (external) transmittance spectrum (fractions 0–1)",
  });
  checkPlateOptions("filterElementFromMeasurement", options, ["aboveClearPlate"]);
  const internal = internalTransmittance(external, options);
  return filterElement(internal, {
    refractiveIndex: options.refractiveIndex,
    name: options.name ?? external.name,
  });
}

/** How the elements of a stack are joined (see the file header for the formula of each). */
export type StackJoin = "no surface losses" | "cemented" | "air gaps" | "air gaps with interreflection";

const JOIN_WORDS: Record<StackJoin, string> = {
  "no surface losses":
    "as the product of the elements' internal transmittances (no surface reflection losses)",
  cemented:
    "as cemented (index-matched) elements: the product of internal transmittances with reflection at the two outer faces only, including multiple reflections between them",
  "air gaps":
    "as separate plates in air, each with its own surface reflections (plate relation); light reflected between elements was taken as lost",
  "air gaps with interreflection":
    "as separate plates in air with the light reflected back and forth between the elements summed (adding relation for incoherent layers)",
};

/**
 * Transmittance of filters in series for the chosen kind of join.
 *
 * "no surface losses": the product of internal transmittances; "cemented": index-matched joins, reflection only at
 * the two outer faces with multiple reflections between them, T = (1 − ρa)(1 − ρb)Πτᵢ ÷ (1 − ρaρb(Πτᵢ)²); "air gaps":
 * each element a plate in air, light reflected between elements lost; "air gaps with interreflection": the light
 * reflected back and forth between elements summed, T₁₂ = T₁T₂ ÷ (1 − R₁′R₂).
 *
 * @param elements The stack's elements (from `filterElement`), on the same wavelengths.
 * @param options.join "no surface losses", "cemented", "air gaps" or "air gaps with interreflection" (required).
 * @param options.name The result's name; default the elements' names joined by " + ".
 * @returns A "transmittance" `Spectrum`.
 * @source Fresnel equations and plate relation (Hecht, Optics, 5th ed., §4.6); adding relation for incoherent layers (Stokes 1862; Kubelka 1954).
 * @example stackTransmittance([filterElement(spectrumOnGrid(400, 100, [0.9, 0.8, 0.7]), { refractiveIndex: 1.5 }), filterElement(spectrumOnGrid(400, 100, [0.5, 0.6, 0.9]), { refractiveIndex: 1.5 })], { join: "air gaps" })
 */
export function stackTransmittance(
  elements: readonly FilterElement[],
  options: { join: StackJoin; name?: string },
): Spectrum {
  checkList(
    "stackTransmittance",
    "elements",
    elements,
    "filter elements (from filterElement or filterElementFromMeasurement)",
    (e) => typeof e === "object" && e !== null && (e as { kind?: unknown }).kind === "filter element",
    { minLength: 1, instead: { spectrum: "for spectra make filter elements first with filterElement" } },
  );
  checkWith(
    "stackTransmittance",
    "options",
    options,
    'options { join: "no surface losses" | "cemented" | "air gaps" | "air gaps with interreflection", name? }',
    (o) => typeof o === "object" && o !== null && !Array.isArray(o),
  );
  checkChoice("stackTransmittance", "options.join", options.join, Object.keys(JOIN_WORDS), {
    what: "how the elements are joined",
  });
  checkOptions("stackTransmittance", "options", options, ["join", "name"]);
  if (!Array.isArray(elements) || elements.length === 0)
    throw new Error("stackTransmittance: the stack has no elements");
  const join = options?.join;
  if (!(join in JOIN_WORDS)) {
    throw new Error(
      `stackTransmittance: join "${String(join)}" is not one of ${Object.keys(JOIN_WORDS)
        .map((k) => `"${k}"`)
        .join(", ")}`,
    );
  }
  elements.forEach((e, i) => {
    if (e?.kind !== "filter element")
      throw new Error(
        `stackTransmittance: element #${i + 1} is not a filter element (use filterElement(...))`,
      );
  });
  const internals = elements.map((e) => e.internal);
  requireSameGrid(internals, "stackTransmittance");
  const wl = internals[0]!.wavelengths;
  const rho = elements.map((e) =>
    indexAtWavelengths(e.refractiveIndex, wl).map((n) => surfaceReflectance(n)),
  );
  const values = wl.map((_: number, i: number): number => {
    const tau = elements.map((e) => e.internal.values[i]!);
    const product = tau.reduce((p, t) => p * t, 1);
    switch (join) {
      case "no surface losses":
        return product;
      case "cemented": {
        const ra = rho[0]![i]!;
        const rb = rho[rho.length - 1]![i]!;
        return ((1 - ra) * (1 - rb) * product) / (1 - ra * rb * product * product);
      }
      case "air gaps":
        return tau.reduce((p, t, k) => p * externalFromInternal(t, rho[k]![i]!), 1);
      case "air gaps with interreflection": {
        let T = externalFromInternal(tau[0]!, rho[0]![i]!);
        let R = plateReflectanceValue(tau[0]!, rho[0]![i]!); // seen from the back; a symmetric plate reflects equally both ways
        for (let k = 1; k < tau.length; k++) {
          const Tk = externalFromInternal(tau[k]!, rho[k]![i]!);
          const Rk = plateReflectanceValue(tau[k]!, rho[k]![i]!);
          const denom = 1 - R * Rk;
          const newR = Rk + (Tk * Tk * R) / denom; // back-side reflectance of the stack so far
          T = (T * Tk) / denom;
          R = newR;
        }
        return T;
      }
    }
  });
  noteMethod(
    "optics",
    `Filter stacks were computed ${JOIN_WORDS[join]}, with the refractive indices ${elements.map((e) => `${describeRefractiveIndex(e.refractiveIndex)} for ${e.name}`).join(", ")}.`,
  );
  return spectrum(wl, values, {
    name: options.name ?? elements.map((e) => e.name).join(" + "),
    quantity: "transmittance",
  });
}
