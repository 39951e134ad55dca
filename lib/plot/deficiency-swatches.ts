/** Swatch sets "as seen with" a colour-vision deficiency: each colour simulated, then drawn as a swatch. */
import { withoutMethodNotes } from "../methods/method-log.ts";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import {
  simulateDeficiencyRgb,
  simulateDeficiencySpectrum,
  simulateDeficiencyXYZ,
  type Deficiency,
  type DeficiencyOptions,
} from "../vision/deficiency.ts";
import { D65_DISPLAY_WHITE, swatch, type Swatch } from "./swatch.ts";

/** One colour of a set: an sRGB hex, a spectrum (a sample seen under D65, or a light), or XYZ relative to D65. */
export interface DeficiencySwatchEntry {
  readonly label: string;
  readonly colour: { readonly hex: string } | { readonly XYZ: Tristimulus } | Spectrum;
}

const HEX = /^#?[0-9a-f]{6}$/i;

function isEntry(e: unknown): boolean {
  if (typeof e !== "object" || e === null) return false;
  const q = e as { label?: unknown; colour?: unknown };
  if (typeof q.label !== "string" || typeof q.colour !== "object" || q.colour === null) return false;
  const c = q.colour as { hex?: unknown; XYZ?: unknown };
  return (
    (typeof c.hex === "string" && HEX.test(c.hex)) || typeof c.XYZ === "object" || isWellFormedSpectrum(c)
  );
}

/** The condition's name: protanomaly … tritanopia, with the severity. */
export function deficiencyName(deficiency: Deficiency, severity: number): string {
  const stem = deficiency === "protan" ? "prot" : deficiency === "deutan" ? "deuter" : "trit";
  return severity >= 1 ? `${stem}anopia` : `${stem}anomaly, severity ${severity}`;
}

/**
 * Swatches of a set of colours as seen with a colour-vision deficiency (e.g. deuteranomaly, severity 0.6), each noted "as seen with …".
 *
 * @param entries [{ label, colour }] with colour { hex } (sRGB), { XYZ } (D65 white, Y = 100) or a spectrum (a sample under D65, or a light).
 * @param deficiency "protan", "deutan" or "tritan".
 * @param options.method "Machado 2009" (default), "Brettel 1997" or "Viénot 1999".
 * @param options.severity Severity 0–1 for Machado (default 1, the dichromat).
 * @returns An array of `Swatch` for `showSwatches`, labelled as given, each with the note "as seen with <condition> (<method>)".
 * @source As simulateDeficiencyRgb (Brettel et al. 1997; Viénot et al. 1999; Machado et al. 2009).
 * @example deficiencySwatches([{ label: "invented red", colour: { hex: "#c03030" } }], "deutan", { severity: 0.6 })
 */
export function deficiencySwatches(
  entries: readonly DeficiencySwatchEntry[],
  deficiency: Deficiency,
  options: DeficiencyOptions = {},
): Swatch[] {
  checkList(
    "deficiencySwatches",
    "entries",
    entries,
    "entries { label, colour: { hex } | { XYZ } | spectrum }",
    isEntry,
  );
  checkChoice("deficiencySwatches", "deficiency", deficiency, ["protan", "deutan", "tritan"]);
  checkOptions("deficiencySwatches", "options", options, ["method", "severity"]);
  const method = options.method ?? "Machado 2009";
  const note = `as seen with ${deficiencyName(deficiency, options.severity ?? 1)} (${method})`;
  return entries.map((e) => {
    const c = e.colour as { hex?: string; XYZ?: Tristimulus };
    let XYZ: Tristimulus;
    if (typeof c.hex === "string") {
      const h = c.hex.replace("#", "");
      const rgb = {
        r: parseInt(h.slice(0, 2), 16) / 255,
        g: parseInt(h.slice(2, 4), 16) / 255,
        b: parseInt(h.slice(4, 6), 16) / 255,
      };
      const s = simulateDeficiencyRgb(rgb, deficiency, options);
      const hex =
        "#" +
        [s.r, s.g, s.b]
          .map((v) =>
            Math.round(v * 255)
              .toString(16)
              .padStart(2, "0"),
          )
          .join("");
      return withoutMethodNotes(() => swatch(e.label, { hex }, { note }));
    }
    if (c.XYZ) XYZ = simulateDeficiencyXYZ(c.XYZ, deficiency, options);
    else XYZ = simulateDeficiencySpectrum(e.colour as Spectrum, deficiency, options);
    return withoutMethodNotes(() => swatch(e.label, { XYZ, white: D65_DISPLAY_WHITE }, { note }));
  });
}
