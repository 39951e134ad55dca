/**
 * Opaque paints and other scattering colourants: a recipe becomes a reflectance by Kubelka–Munk theory, with
 * Duncan's additivity of the coefficients of the components (D. R. Duncan, "The colour of pigment mixtures",
 * Proc. Phys. Soc. 52, 390, 1940): two-constant K = ΣcⱼKⱼ, S = ΣcⱼSⱼ; single-constant (K/S) = Σcⱼ(K/S)ⱼ when all
 * components scatter alike. The Saunderson correction (1942) turns the internal reflectance into what an
 * instrument measures.
 */
import { objectColour, type ObjectColourOptions } from "../colorimetry/tristimulus.ts";
import { labFromXYZ, type Lab } from "../colorimetry/cielab.ts";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import {
  requireFraction,
  requireFractionSpectrum,
  requireNonNegative,
  requirePositive,
  requireSameGrid,
} from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { ksFromReflectance, layerOptics, reflectanceFromKs } from "./kubelka-munk.ts";
import { saundersonInternal, saundersonMeasured, type SurfaceCorrection } from "./saunderson.ts";
import { checkList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum, isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkString } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { isRecipePart } from "../arguments/physics-arguments.ts";

/** A colourant described by its K/S alone (single-constant theory). */
export interface SingleConstantColourant {
  readonly kind: "colourant";
  readonly model: "single constant";
  readonly name: string;
  /** K/S per unit amount at each wavelength. */
  readonly ks: Spectrum;
}

/** A colourant described by its absorption K and scattering S (two-constant theory), per unit amount and thickness. */
export interface TwoConstantColourant {
  readonly kind: "colourant";
  readonly model: "two constant";
  readonly name: string;
  readonly k: Spectrum;
  readonly s: Spectrum;
}

export type Colourant = SingleConstantColourant | TwoConstantColourant;

/** How surface reflection is treated: Saunderson constants, or "none" for data already internal. */
export type SurfaceTreatment = SurfaceCorrection | "none";

function requireNonNegativeSpectrum(s: Spectrum, what: string): void {
  s.values.forEach((v, i) => {
    if (!(v >= 0)) throw new Error(`${what} "${s.name}" is ${v} at ${s.wavelengths[i]} nm; it must be ≥ 0`);
  });
}

/**
 * A colourant described by its K/S alone (single-constant Kubelka–Munk theory).
 *
 * @param ks K/S per unit amount at each wavelength, 0 or more.
 * @param name The colourant's name; default the spectrum's name.
 * @returns A `SingleConstantColourant`.
 * @source D. R. Duncan, Proc. Phys. Soc. 52:390, 1940 (single-constant additivity).
 * @example singleConstantColourant(spectrumOnGrid(400, 100, [2, 0.5, 0.1]), "invented ochre")
 */
export function singleConstantColourant(ks: Spectrum, name: string = ks?.name): SingleConstantColourant {
  checkSpectrum("singleConstantColourant", "ks", ks, { what: "a K/S spectrum" });
  checkString("singleConstantColourant", "name", name);
  requireNonNegativeSpectrum(ks, "K/S");
  return { kind: "colourant", model: "single constant", name, ks };
}

/**
 * A colourant described by its absorption K and scattering S (two-constant Kubelka–Munk theory), per unit amount and thickness.
 *
 * @param k The absorption K at each wavelength, 0 or more.
 * @param s The scattering S on the same wavelengths, 0 or more.
 * @param name The colourant's name; default the K spectrum's name.
 * @returns A `TwoConstantColourant`.
 * @source D. R. Duncan, Proc. Phys. Soc. 52:390, 1940 (two-constant additivity).
 * @example twoConstantColourant(spectrumOnGrid(400, 100, [2, 0.5, 0.1]), spectrumOnGrid(400, 100, [1, 1, 1]), "invented ochre")
 */
export function twoConstantColourant(k: Spectrum, s: Spectrum, name: string = k?.name): TwoConstantColourant {
  checkSpectrum("twoConstantColourant", "k", k, { what: "an absorption K spectrum" });
  checkSpectrum("twoConstantColourant", "s", s, { what: "a scattering S spectrum" });
  checkString("twoConstantColourant", "name", name);
  requireNonNegativeSpectrum(k, "absorption K");
  requireNonNegativeSpectrum(s, "scattering S");
  requireSameGrid([k, s], `twoConstantColourant "${name}"`);
  return { kind: "colourant", model: "two constant", name, k, s };
}

function toInternal(r: number, surface: SurfaceTreatment): number {
  return surface === "none" ? r : saundersonInternal(r, surface);
}
function toMeasured(r: number, surface: SurfaceTreatment): number {
  return surface === "none" ? r : saundersonMeasured(r, surface);
}

/**
 * A single-constant colourant from the measured reflectance of an opaque layer (masstone): K/S = (1 − Rᵢ)² ÷ (2Rᵢ) after the Saunderson inversion.
 *
 * @param masstone The measured reflectance of the opaque masstone, fractions above 0.
 * @param options.surface Saunderson constants (k1, k2, specular) or "none" for data already internal; default {} (k₁ = 0.04, k₂ = 0.6, specular included).
 * @param options.name The colourant's name; default the masstone's name.
 * @returns A `SingleConstantColourant`.
 * @source Kubelka & Munk 1931; Saunderson, J. Opt. Soc. Am. 32:727, 1942.
 * @example colourantFromMasstone(spectrumOnGrid(400, 100, [0.05, 0.3, 0.6], { quantity: "reflectance" }))
 */
export function colourantFromMasstone(
  masstone: Spectrum,
  options: { surface?: SurfaceTreatment; name?: string } = {},
): SingleConstantColourant {
  checkSpectrum("colourantFromMasstone", "masstone", masstone, {
    what: "a masstone reflectance spectrum (fractions 0–1)",
  });
  checkOptions("colourantFromMasstone", "options", options, ["surface", "name"]);
  requireFractionSpectrum(masstone, "masstone reflectance");
  const surface = options.surface ?? {};
  const ks = masstone.values.map((r, i) => {
    try {
      return ksFromReflectance(toInternal(r, surface));
    } catch (e) {
      throw new Error(
        `colourantFromMasstone "${masstone.name}" at ${masstone.wavelengths[i]} nm: ${(e as Error).message}`,
      );
    }
  });
  return singleConstantColourant(
    spectrum(masstone.wavelengths, ks, { name: `${masstone.name} K/S`, quantity: "other" }),
    options.name ?? masstone.name,
  );
}

/**
 * Two-constant K and S of a colourant from opaque drawdowns of its masstone and of a tint with a white, relative to the white's scattering (S_white = 1).
 *
 * With m = K/S of the masstone, t = K/S of the tint at colourant fraction c: S = (1 − c)(t − K_w) ÷ (c(m − t)) and
 * K = m·S.
 *
 * @param input { masstone, tint, white: measured reflectance spectra on one grid; tintFraction c, strictly between 0 and 1; surface: Saunderson constants or "none", default {} (k₁ = 0.04, k₂ = 0.6); name: default the masstone's name }.
 * @returns { colourant, white }: two-constant colourants (the white with S = 1).
 * @source D. R. Duncan, Proc. Phys. Soc. 52:390, 1940 (the masstone-and-tint method follows from its additivity); Saunderson 1942.
 * @example colourantFromTint({ masstone: spectrumOnGrid(400, 100, [0.05, 0.2, 0.5]), tint: spectrumOnGrid(400, 100, [0.3, 0.5, 0.7]), white: spectrumOnGrid(400, 100, [0.85, 0.88, 0.9]), tintFraction: 0.2 }).colourant.name
 */
export function colourantFromTint(input: {
  masstone: Spectrum;
  tint: Spectrum;
  white: Spectrum;
  /** Fraction of the colourant in the tint (0 < c < 1). */
  tintFraction: number;
  surface?: SurfaceTreatment;
  name?: string;
}): { colourant: TwoConstantColourant; white: TwoConstantColourant } {
  checkWith(
    "colourantFromTint",
    "input",
    input,
    "{ masstone, tint, white: reflectance spectra; tintFraction: number; surface?, name? }",
    (i) =>
      typeof i === "object" &&
      i !== null &&
      ["masstone", "tint", "white"].every((k) => isWellFormedSpectrum((i as Record<string, unknown>)[k])) &&
      Number.isFinite((i as { tintFraction?: unknown }).tintFraction),
  );
  checkOptions("colourantFromTint", "input", input, [
    "masstone",
    "tint",
    "white",
    "tintFraction",
    "surface",
    "name",
  ]);
  const c = requireFraction(input.tintFraction, "colourantFromTint: tint fraction");
  if (c === 0 || c === 1)
    throw new Error(`colourantFromTint: tint fraction ${c} must lie strictly between 0 and 1`);
  const { masstone, tint, white } = input;
  [masstone, tint, white].forEach((s) => requireFractionSpectrum(s, "reflectance"));
  requireSameGrid([masstone, tint, white], "colourantFromTint");
  const surface = input.surface ?? {};
  const w = masstone.wavelengths;
  const K: number[] = [];
  const S: number[] = [];
  const Kw: number[] = [];
  w.forEach((wl, i) => {
    const m = ksFromReflectance(toInternal(masstone.values[i]!, surface));
    const t = ksFromReflectance(toInternal(tint.values[i]!, surface));
    const kw = ksFromReflectance(toInternal(white.values[i]!, surface));
    if (Math.abs(m - t) < 1e-12)
      throw new Error(
        `colourantFromTint: masstone and tint have the same K/S at ${wl} nm, so S cannot be separated from K there`,
      );
    const s = ((1 - c) * (t - kw)) / (c * (m - t));
    if (!(s > 0)) {
      throw new Error(
        `colourantFromTint: the data give a scattering of ${s.toPrecision(3)} at ${wl} nm (the tint is not between the white and the masstone there); check the samples and the fraction`,
      );
    }
    K.push(m * s);
    S.push(s);
    Kw.push(kw);
  });
  const name = input.name ?? masstone.name;
  noteMethod(
    "mixing",
    "Two-constant K and S were derived from masstone and tint-with-white drawdowns, relative to the white's scattering (S_white = 1).",
  );
  return {
    colourant: twoConstantColourant(
      spectrum(w, K, { name: `${name} K` }),
      spectrum(w, S, { name: `${name} S` }),
      name,
    ),
    white: twoConstantColourant(
      spectrum(w, Kw, { name: `${white.name} K` }),
      spectrum(
        w,
        w.map(() => 1),
        { name: `${white.name} S` },
      ),
      white.name,
    ),
  };
}

/** One component of a recipe: a colourant and its amount (parts by weight or volume; normalised to fractions). */
export interface RecipePart {
  readonly colourant: Colourant;
  readonly amount: number;
}

export interface PaintOptions {
  /** Surface correction (Saunderson defaults k₁ = 0.04, k₂ = 0.6, specular included), or "none". */
  surface?: SurfaceTreatment;
  /** For two-constant colourants only: a layer of this thickness (in the units of K and S) over `background` (a reflectance fraction) instead of an opaque layer; default (absent) an opaque layer. */
  layer?: { thickness: number; background: number };
  /** The result's name; default the recipe, "<amount> <colourant> + …". */
  name?: string;
}

/**
 * Reflectance of a paint mixed from a recipe: parts normalised to fractions, coefficients added, Kubelka–Munk reflectance, then the surface correction.
 *
 * @param recipe [{ colourant, amount (parts by weight or volume, ≥ 0) }, ...], all single-constant or all two-constant.
 * @returns A "reflectance" `Spectrum` (fractions), named `options.name` or "<amount> <colourant> + …".
 * @source Duncan, Proc. Phys. Soc. 52:390, 1940; Kubelka & Munk 1931; Kubelka, JOSA 38:448, 1948; Saunderson, JOSA 32:727, 1942.
 * @example mixPaint([{ colourant: demoPaints().white, amount: 3 }, { colourant: demoPaints().blue, amount: 1 }])
 */
export function mixPaint(recipe: readonly RecipePart[], options: PaintOptions = {}): Spectrum {
  checkList("mixPaint", "recipe", recipe, "recipe parts { colourant, amount }", isRecipePart, {
    minLength: 1,
  });
  checkOptions("mixPaint", "options", options, ["surface", "layer", "name"]);
  if (!Array.isArray(recipe) || recipe.length === 0) throw new Error("mixPaint: the recipe is empty");
  recipe.forEach((p, i) => {
    if (p?.colourant?.kind !== "colourant") throw new Error(`mixPaint: part #${i + 1} is not a colourant`);
    requireNonNegative(p.amount, `mixPaint: amount of "${p.colourant.name}"`);
  });
  const total = recipe.reduce((s, p) => s + p.amount, 0);
  requirePositive(total, "mixPaint: total amount of the recipe");
  const models = new Set(recipe.map((p) => p.colourant.model));
  if (models.size > 1)
    throw new Error(
      "mixPaint: the recipe mixes single-constant and two-constant colourants; characterise them all one way",
    );
  const model = recipe[0]!.colourant.model;
  const surface = options.surface ?? {};
  const fractions = recipe.map((p) => p.amount / total);
  let internal: number[];
  let wavelengths: readonly number[];
  if (model === "single constant") {
    if (options.layer)
      throw new Error("mixPaint: a finite layer needs K and S separately (two-constant colourants)");
    const parts = recipe.map((p) => p.colourant as SingleConstantColourant);
    requireSameGrid(
      parts.map((p) => p.ks),
      "mixPaint",
    );
    wavelengths = parts[0]!.ks.wavelengths;
    internal = wavelengths.map((_: number, i: number) =>
      reflectanceFromKs(parts.reduce((s, p, j) => s + fractions[j]! * p.ks.values[i]!, 0)),
    );
    noteMethod(
      "mixing",
      "Paint mixtures were computed by single-constant Kubelka–Munk theory: (K/S) of the mixture = Σ cⱼ(K/S)ⱼ (Duncan 1940), for an opaque layer, R∞ (Kubelka & Munk 1931).",
    );
  } else {
    const parts = recipe.map((p) => p.colourant as TwoConstantColourant);
    requireSameGrid(
      parts.flatMap((p) => [p.k, p.s]),
      "mixPaint",
    );
    wavelengths = parts[0]!.k.wavelengths;
    const layer = options.layer;
    if (layer) {
      requireNonNegative(layer.thickness, "mixPaint: layer thickness");
      requireFraction(layer.background, "mixPaint: background reflectance");
    }
    internal = wavelengths.map((wl: number, i: number) => {
      const K = parts.reduce((s, p, j) => s + fractions[j]! * p.k.values[i]!, 0);
      const S = parts.reduce((s, p, j) => s + fractions[j]! * p.s.values[i]!, 0);
      if (layer) return layerOptics(K, S, layer.thickness, layer.background).reflectance;
      if (!(S > 0))
        throw new Error(
          `mixPaint: the mixture does not scatter at ${wl} nm (S = 0), so an opaque layer has no reflectance there; give a layer and background`,
        );
      return reflectanceFromKs(K / S);
    });
    noteMethod(
      "mixing",
      `Paint mixtures were computed by two-constant Kubelka–Munk theory: K = ΣcⱼKⱼ, S = ΣcⱼSⱼ (Duncan 1940), ${layer ? "for a layer of finite thickness over its background (Kubelka 1948)" : "for an opaque layer, R∞ (Kubelka & Munk 1931)"}.`,
    );
  }
  const measured = internal.map((r) => Math.min(1, Math.max(0, toMeasured(r, surface))));
  return spectrum(wavelengths, measured, {
    name: options.name ?? recipe.map((p) => `${+p.amount.toPrecision(4)} ${p.colourant.name}`).join(" + "),
    quantity: "reflectance",
  });
}

/**
 * A recipe's reflectance and its colour: X, Y, Z and CIELAB under an illuminant and observer, the white summed on the same weighting table.
 *
 * @param recipe [{ colourant, amount (parts by weight or volume, ≥ 0) }, ...], as for `mixPaint`.
 * @returns { reflectance, XYZ (Y = 100 scale), Lab, white }.
 * @source Kubelka–Munk mixing as `mixPaint`; CIE 015:2018 §7 and §8.2.1 (colour).
 * @example recipeColour([{ colourant: demoPaints().yellow, amount: 1 }, { colourant: demoPaints().blue, amount: 1 }], { illuminant: "D50" }).Lab
 */
export function recipeColour(
  recipe: readonly RecipePart[],
  options: PaintOptions & Pick<ObjectColourOptions, "illuminant" | "observer"> = {},
): { reflectance: Spectrum; XYZ: Tristimulus; Lab: Lab; white: Tristimulus } {
  checkList("recipeColour", "recipe", recipe, "recipe parts { colourant, amount }", isRecipePart, {
    minLength: 1,
  });
  checkOptions("recipeColour", "options", options, ["surface", "layer", "name", "illuminant", "observer"]);
  const reflectance = mixPaint(recipe, {
    surface: options.surface,
    layer: options.layer,
    name: options.name,
  });
  const { XYZ, white } = objectColour(reflectance, {
    illuminant: options.illuminant,
    observer: options.observer,
  });
  return { reflectance, XYZ, Lab: labFromXYZ(XYZ, white), white };
}
