/** The CIE spectral luminous efficiency functions V(λ) (photopic) and V′(λ) (scotopic), and their maximum efficacies. */
import { CIE_SCOTOPIC_TABLE } from "../data/cie-scotopic.ts";
import { tableColumn } from "../data/table-to-spectrum.ts";
import { KM_PHOTOPIC } from "../colorimetry/tristimulus.ts";
import { CIE_1931_2_DEGREE } from "../observers/standard-observer.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { sharedTable } from "../data/shared-tables.ts";

/** Km = 683 lm/W, maximum luminous efficacy for photopic vision (CIE 018:2019 §3; the SI value Kcd at 540 THz). */
export const KM = KM_PHOTOPIC;
/** K′m = 1700 lm/W, maximum luminous efficacy for scotopic vision (CIE 018:2019; 1700.06 lm/W unrounded). */
export const KM_SCOTOPIC = 1700;

export type Vision = "photopic" | "scotopic";

let photopic: Spectrum | undefined;
let scotopic: Spectrum | undefined;

/**
 * The CIE spectral luminous efficiency function: photopic V(λ), 360–830 nm at 1 nm (identical to ȳ(λ) of the CIE 1931 observer), or scotopic V′(λ), 380–780 nm at 1 nm.
 *
 * @param vision "photopic" or "scotopic"; default "photopic".
 * @returns A "luminous efficiency" `Spectrum` (dimensionless, peak 1).
 * @source CIE 018:2019 Table 1 (V) and Table 2 (V′, CIE 1951).
 * @example valueAt(luminousEfficiency("scotopic"), 507)
 */
export function luminousEfficiency(vision: Vision = "photopic"): Spectrum {
  checkChoice("luminousEfficiency", "vision", vision, ["photopic", "scotopic"]);
  if (vision === "photopic") {
    photopic ??= sharedTable(
      spectrum(CIE_1931_2_DEGREE.wavelengths, CIE_1931_2_DEGREE.yBar, {
        name: "CIE photopic V(λ)",
        quantity: "luminous efficiency",
      }),
    );
    return photopic;
  }
  if (vision === "scotopic") {
    scotopic ??= sharedTable(
      tableColumn(CIE_SCOTOPIC_TABLE, "V'", {
        name: "CIE scotopic V′(λ)",
        quantity: "luminous efficiency",
      }),
    );
    return scotopic;
  }
  throw new Error(`luminousEfficiency: unknown vision "${String(vision)}"; use "photopic" or "scotopic"`);
}
