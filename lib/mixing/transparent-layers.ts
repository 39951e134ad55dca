/**
 * Subtractive mixing of transparent media: layers in contact multiply their internal transmittances, and dyes
 * dissolved together add their absorbances, τᵢ = 10^(−d·Σ cⱼAⱼ(λ)) (Beer–Lambert law with additivity of absorbance,
 * IUPAC Gold Book "Beer–Lambert law").
 */
import { requireFractionSpectrum, requireNonNegative, requireSameGrid } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkList, checkSpectrumList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkString } from "../arguments/check-text.ts";

/**
 * Internal transmittance of transparent layers in optical contact, Π τⱼ(λ) (no reflections between them).
 *
 * @param layers Transmittance spectra (fractions 0–1) on the same wavelengths.
 * @param name The result's name; default the layers' names joined by " × ".
 * @returns A "transmittance" `Spectrum`.
 * @source IUPAC Gold Book, "Beer–Lambert law" (absorbances of layers add).
 * @example layeredTransmittance([spectrumOnGrid(400, 100, [0.9, 0.5, 0.2]), spectrumOnGrid(400, 100, [0.3, 0.8, 0.9])])
 */
export function layeredTransmittance(layers: readonly Spectrum[], name?: string): Spectrum {
  checkSpectrumList("layeredTransmittance", "layers", layers, { minLength: 1 });
  checkString("layeredTransmittance", "name", name, { optional: true });
  if (!Array.isArray(layers) || layers.length === 0) throw new Error("layeredTransmittance: no layers given");
  layers.forEach((l) => requireFractionSpectrum(l, "layer transmittance"));
  requireSameGrid(layers, "layeredTransmittance");
  noteMethod(
    "mixing",
    "Transparent layers were combined as the product of their internal transmittances (no reflections between layers).",
  );
  const first = layers[0]!;
  return spectrum(
    first.wavelengths,
    first.wavelengths.map((_: number, i: number) => layers.reduce((p, l) => p * l.values[i]!, 1)),
    {
      name: name ?? layers.map((l) => l.name).join(" × "),
      quantity: "transmittance",
    },
  );
}

/** One dye of a solution: its decadic absorbance per unit concentration and unit path, and its concentration. */
export interface DyeAmount {
  readonly absorbance: Spectrum;
  readonly concentration: number;
}

/**
 * Internal transmittance of dyes dissolved in one layer, 10^(−path·Σ cⱼAⱼ(λ)) (absorbances add).
 *
 * @param dyes [{ absorbance: decadic absorbance per unit concentration and path, ≥ 0; concentration, ≥ 0 }, ...] on the same wavelengths.
 * @param options.path The path length, in the unit the absorbances are per; default 1.
 * @param options.name The result's name; default "<c>×<dye> + …".
 * @returns A "transmittance" `Spectrum`.
 * @source IUPAC Gold Book, "Beer–Lambert law".
 * @example dyeMixture([{ absorbance: spectrumOnGrid(400, 100, [1, 0.2, 0.1]), concentration: 0.5 }, { absorbance: spectrumOnGrid(400, 100, [0.1, 0.3, 1.5]), concentration: 0.2 }], { path: 2 })
 */
export function dyeMixture(
  dyes: readonly DyeAmount[],
  options: { path?: number; name?: string } = {},
): Spectrum {
  checkList(
    "dyeMixture",
    "dyes",
    dyes,
    "dyes { absorbance: spectrum, concentration: number }",
    (d) =>
      typeof d === "object" &&
      d !== null &&
      isWellFormedSpectrum((d as { absorbance?: unknown }).absorbance) &&
      Number.isFinite((d as { concentration?: unknown }).concentration),
    { minLength: 1 },
  );
  checkOptions("dyeMixture", "options", options, ["path", "name"]);
  if (!Array.isArray(dyes) || dyes.length === 0) throw new Error("dyeMixture: no dyes given");
  const path = requireNonNegative(options.path ?? 1, "dyeMixture: path length");
  dyes.forEach((d) => {
    requireNonNegative(d.concentration, `dyeMixture: concentration of "${d.absorbance?.name}"`);
    d.absorbance.values.forEach((a: number, i: number) => {
      if (!(a >= 0))
        throw new Error(
          `dyeMixture: absorbance of "${d.absorbance.name}" is ${a} at ${d.absorbance.wavelengths[i]} nm; it must be ≥ 0`,
        );
    });
  });
  requireSameGrid(
    dyes.map((d) => d.absorbance),
    "dyeMixture",
  );
  noteMethod("mixing", "Dyes in one layer were mixed by adding their absorbances (Beer–Lambert law).");
  const first = dyes[0]!.absorbance;
  return spectrum(
    first.wavelengths,
    first.wavelengths.map(
      (_: number, i: number) =>
        10 ** (-path * dyes.reduce((s, d) => s + d.concentration * d.absorbance.values[i]!, 0)),
    ),
    {
      name: options.name ?? dyes.map((d) => `${d.concentration}×${d.absorbance.name}`).join(" + "),
      quantity: "transmittance",
    },
  );
}
