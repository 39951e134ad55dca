/**
 * Spectral Neugebauer model of halftone colour prints: the print's reflectance is the area-weighted sum of the
 * reflectances of its Neugebauer primaries (paper, each ink alone and every overprint), with the areas given by
 * Demichel's equations for independently placed dots (H. E. J. Neugebauer, Z. wiss. Photogr. 36, 73, 1937;
 * M. E. Demichel, Procédé 26, 17–21 and 26–27, 1924); optionally in Yule–Nielsen form with an n factor
 * (Viggiano 1990, "Modeling the color of multi-colored halftones", TAGA Proc.).
 */
import {
  requireFraction,
  requireFractionSpectrum,
  requirePositive,
  requireSameGrid,
} from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkInkCoverages } from "../arguments/physics-arguments.ts";

/** Ink coverages as fractions 0–1; leave out an ink that is not printed (k may be omitted for three-colour prints). */
export interface InkCoverages {
  c?: number;
  m?: number;
  y?: number;
  k?: number;
}

/** The ink letters in their fixed order; a primary's key lists its inks in this order ("paper" for none). */
export const INK_ORDER = ["c", "m", "y", "k"] as const;

/**
 * The key of the Neugebauer primary printed with the given inks: "paper", "c", "cm", "cmy", "cmyk", … (inks in the order c, m, y, k).
 *
 * @param inks The printed ink letters, any of "c", "m", "y", "k".
 * @returns The key.
 * @source none: a tristim naming convention.
 * @example primaryKey(["y", "c"])
 */
export function primaryKey(inks: readonly string[]): string {
  checkList("primaryKey", "inks", inks, 'ink letters ("c", "m", "y", "k")', (i) => typeof i === "string");
  const key = INK_ORDER.filter((i) => inks.includes(i)).join("");
  return key === "" ? "paper" : key;
}

/**
 * Demichel's areas of the Neugebauer primaries for independently placed dots: for each combination of the printed inks, the product of cᵢ for the inks present and (1 − cᵢ) for the others.
 *
 * @param coverages { c?, m?, y?, k? }: ink coverages as fractions 0–1; leave out an ink that is not printed.
 * @returns Areas by primary key (see `primaryKey`), summing to 1.
 * @source M. E. Demichel, Procédé 26:17–21 and 26–27, 1924.
 * @example demichelAreas({ c: 0.5, m: 0.2 })
 */
export function demichelAreas(coverages: InkCoverages): Record<string, number> {
  checkInkCoverages("demichelAreas", coverages);
  const inks = INK_ORDER.filter((i) => coverages[i] !== undefined);
  if (inks.length === 0) throw new Error("demichelAreas: give at least one ink coverage (c, m, y or k)");
  for (const key of Object.keys(coverages)) {
    if (!(INK_ORDER as readonly string[]).includes(key))
      throw new Error(`demichelAreas: unknown ink "${key}"; use c, m, y and k`);
  }
  inks.forEach((i) => requireFraction(coverages[i]!, `coverage of ${i}`));
  const areas: Record<string, number> = {};
  for (let mask = 0; mask < 1 << inks.length; mask++) {
    const present = inks.filter((_, q) => mask & (1 << q));
    areas[primaryKey(present)] = inks.reduce(
      (p, ink, q) => p * (mask & (1 << q) ? coverages[ink]! : 1 - coverages[ink]!),
      1,
    );
  }
  return areas;
}

/** Reflectances of the Neugebauer primaries by key ("paper", "c", "m", "cm", ..., "cmyk"), all on one grid. */
export type NeugebauerPrimaries = Readonly<Record<string, Spectrum>>;

/**
 * Print reflectance by the spectral Neugebauer model, R(λ)^(1/n) = Σ aᵢ·Rᵢ(λ)^(1/n) with Demichel areas aᵢ; n = 1 is the classical model, n > 1 its Yule–Nielsen modification.
 *
 * @param coverages { c?, m?, y?, k? }: ink coverages as fractions 0–1.
 * @param primaries Reflectance spectra of the Neugebauer primaries by key ("paper", "c", "m", "cm", …), one grid; every combination of the printed inks is needed.
 * @param options.n The Yule–Nielsen n factor, positive; default 1.
 * @param options.name The result's name; default "print C50 M20 …".
 * @returns A "reflectance" `Spectrum`.
 * @source H. E. J. Neugebauer, Z. wiss. Photogr. 36:73, 1937; Demichel 1924; J. A. S. Viggiano, TAGA Proc. 1990 (n factor).
 * @example neugebauerReflectance({ c: 0.5 }, { paper: spectrumOnGrid(400, 100, [0.9, 0.9, 0.9]), c: spectrumOnGrid(400, 100, [0.7, 0.5, 0.05]) }, { n: 1.7 })
 */
export function neugebauerReflectance(
  coverages: InkCoverages,
  primaries: NeugebauerPrimaries,
  options: { n?: number; name?: string } = {},
): Spectrum {
  checkInkCoverages("neugebauerReflectance", coverages);
  checkWith(
    "neugebauerReflectance",
    "primaries",
    primaries,
    'Neugebauer primaries: an object of reflectance spectra keyed "paper", "c", "m", "cm", ...',
    (p) =>
      typeof p === "object" &&
      p !== null &&
      !Array.isArray(p) &&
      !isWellFormedSpectrum(p) &&
      Object.values(p).every(isWellFormedSpectrum),
  );
  checkOptions("neugebauerReflectance", "options", options, ["n", "name"]);
  const n = requirePositive(options.n ?? 1, "Yule–Nielsen n factor");
  const areas = demichelAreas(coverages);
  const missing = Object.keys(areas).filter((key) => !primaries[key]);
  if (missing.length > 0) {
    throw new Error(
      `neugebauerReflectance: missing primaries ${missing.map((k) => `"${k}"`).join(", ")}; the printed inks need all of ${Object.keys(areas).join(", ")}`,
    );
  }
  const used = Object.keys(areas).map((k) => primaries[k]!);
  used.forEach((s) => requireFractionSpectrum(s, "primary reflectance"));
  requireSameGrid(used, "neugebauerReflectance");
  const keys = Object.keys(areas);
  noteMethod(
    "halftone",
    n === 1
      ? "Print reflectances were computed by the spectral Neugebauer model with Demichel's dot-overlap areas (Neugebauer 1937; Demichel 1924)."
      : `Print reflectances were computed by the Yule–Nielsen modified spectral Neugebauer model with n = ${n} and Demichel's areas (Viggiano 1990).`,
  );
  const first = used[0]!;
  const values = first.wavelengths.map(
    (_: number, i: number) =>
      keys.reduce((s, k) => s + areas[k]! * primaries[k]!.values[i]! ** (1 / n), 0) ** n,
  );
  const label = INK_ORDER.filter((i) => coverages[i] !== undefined)
    .map((i) => `${i.toUpperCase()}${+(coverages[i]! * 100).toPrecision(4)}`)
    .join(" ");
  return spectrum(first.wavelengths, values, {
    name: options.name ?? `print ${label}`,
    quantity: "reflectance",
  });
}
