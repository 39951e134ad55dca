/**
 * Colour-accurate swatches for the report: each colour becomes an sRGB hex (drawn everywhere) and, when it lies
 * outside sRGB, a wide-gamut CSS colour `color(display-p3 r g b)` or `color(rec2020 r g b)` (CSS Color Module
 * Level 4, predefined colour spaces) so wide-gamut screens show it right. A colour a gamut cannot hold is mapped into
 * it by CSS Color 4 §13.2 gamut mapping (chroma reduced at constant OKLab lightness and hue, gamut-mapping.ts), never
 * clipped channel by channel, so a dim saturated light stays dim. The records are plain data matching the runner's
 * swatch record (cells/records.ts `SwatchRecord`): the report draws the display-gamut mark, its words and the legend
 * that calls such a patch an approximation from `display`, `outOfDisplayGamut` and `inGamut`, and a reference/sample
 * pair as one unit with its ΔE00 from `pair`, so none of that is written into `note`.
 */
import { labFromXYZ, xyzFromLab, type Lab } from "../colorimetry/cielab.ts";
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import {
  commonSummationInterval,
  objectColour,
  type ObjectColourOptions,
} from "../colorimetry/tristimulus.ts";
import { deltaE2000 } from "../difference/delta-e-2000.ts";
import { isSpectrum, type Spectrum } from "../spectrum/spectrum.ts";
import {
  DISPLAY_GAMUTS,
  encodeRgb,
  hexFromEncoded,
  linearRgb,
  xyzFromLinearRgb,
  type DisplayGamut,
} from "./display-rgb.ts";
import { adaptToD65, D65_WHITE_Y100 } from "./display-white.ts";
import { withoutMethodNotes } from "../methods/method-log.ts";
import { mapToDisplayGamut, type GamutMapping } from "./gamut-mapping.ts";
import { checkList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkString } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { isSwatchColour } from "../arguments/physics-arguments.ts";

/** One swatch: what `showSwatches` draws. */
export interface Swatch {
  readonly label: string;
  /** sRGB #rrggbb; a colour outside sRGB is gamut-mapped into it (CSS Color 4 §13.2), so the hex is approximate. */
  readonly hex: string;
  /**
   * The wide-gamut CSS colour, present only when the colour lies outside sRGB: color(display-p3 …) when Display P3
   * holds it, else color(rec2020 …) (gamut-mapped into BT.2020 when even that cannot). The best CSS colour is `css ?? hex`.
   */
  readonly css?: string;
  /** True when the colour lies outside sRGB (the runner's meaning: the hex is an approximation). */
  readonly outOfGamut: boolean;
  readonly inGamut: { readonly sRGB: boolean; readonly displayP3: boolean; readonly bt2020: boolean };
  /** The display gamut the swatch was made for. */
  readonly display: DisplayGamut;
  /** True when the colour lies outside that display's gamut: no screen of that kind can show it exactly. */
  readonly outOfDisplayGamut: boolean;
  /** The swatch's place in a reference/sample pair (the runner's `SwatchPairPlace`); ΔE00 is on the sample. */
  readonly pair?: {
    readonly label: string;
    readonly role: "reference" | "sample";
    readonly deltaE00?: number;
  };
  readonly note?: string;
}

/**
 * A colour as swatches accept it: tristimulus values on the Y = 100 scale with their reference white (default
 * D65), CIELAB with its reference white (default D65), an sRGB hex, or a reflectance/transmittance spectrum
 * (computed under D65 with the CIE 1931 observer unless `illuminant` is given in the options).
 */
export type SwatchColour =
  | { readonly XYZ: Tristimulus; readonly white?: Tristimulus }
  | { readonly lab: Lab; readonly white?: Tristimulus }
  | { readonly hex: string }
  | Spectrum;

export interface SwatchOptions {
  /** The display the report is meant for: "sRGB" (default), "Display P3" or "BT.2020"; patches outside it are marked. */
  display?: DisplayGamut;
  /** Illuminant for spectra (default "D65"). Their colour is then adapted to D65 for display (Bradford). */
  illuminant?: string;
  /**
   * Summation interval and range for spectra, as for tristimulus() (defaults: 1 nm when sample and illuminant are at
   * 1 nm, else 5 nm; 360–830 nm). The white is always summed on the same table as the sample (objectColour).
   */
  interval?: ObjectColourOptions["interval"];
  /** Summation range in nm for spectra, as for tristimulus(); default 360–830 nm. */
  range?: ObjectColourOptions["range"];
}

/** D65 on the Y = 100 scale from the chromaticity the display standards use (x = 0.3127, y = 0.3290; IEC 61966-2-1). */
export const D65_DISPLAY_WHITE: Tristimulus = D65_WHITE_Y100;

const HEX = /^#?([0-9a-f]{6})$/i;

function decodeSrgb(v: number): number {
  return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
}

/** XYZ (Y = 100 for white) of an sRGB hex, by IEC 61966-2-1:1999 eqs. (1)–(3) with the matrix from its primaries. */
export function xyzFromHex(hex: string): Tristimulus {
  const m = HEX.exec(String(hex).trim());
  if (!m) throw new Error(`swatch: "${hex}" is not an sRGB hex colour like #1a2b3c`);
  const n = parseInt(m[1]!, 16);
  const rgb = [(n >> 16) & 255, (n >> 8) & 255, n & 255].map((c) => decodeSrgb(c / 255)) as [
    number,
    number,
    number,
  ];
  const t = xyzFromLinearRgb(rgb, "sRGB");
  return { X: 100 * t.X, Y: 100 * t.Y, Z: 100 * t.Z };
}

function checkTristimulus(t: Tristimulus, what: string): Tristimulus {
  if (
    !t ||
    typeof t !== "object" ||
    ![t.X, t.Y, t.Z].every((v) => typeof v === "number" && Number.isFinite(v))
  ) {
    throw new Error(`${what}: ${JSON.stringify(t)} must be {X, Y, Z} with finite numbers`);
  }
  return t;
}

/** The colour's XYZ and its reference white (both Y = 100 scale). */
export function swatchTristimulus(
  colour: SwatchColour,
  options: SwatchOptions = {},
  what = "swatch",
): { XYZ: Tristimulus; white: Tristimulus } {
  if (isSpectrum(colour)) {
    // The sample and its white from one weighting table: same grid, interval and range (CIE 015:2018 §7).
    const c = objectColour(colour, {
      illuminant: options.illuminant ?? "D65",
      interval: options.interval,
      range: options.range,
    });
    return { XYZ: c.XYZ, white: c.white };
  }
  if (colour && typeof colour === "object") {
    if ("XYZ" in colour)
      return {
        XYZ: checkTristimulus(colour.XYZ, `${what} XYZ`),
        white: checkTristimulus(colour.white ?? D65_DISPLAY_WHITE, `${what} white`),
      };
    if ("lab" in colour) {
      const white = checkTristimulus(colour.white ?? D65_DISPLAY_WHITE, `${what} white`);
      const lab = colour.lab;
      if (!lab || ![lab.L, lab.a, lab.b].every((v) => typeof v === "number" && Number.isFinite(v)))
        throw new Error(`${what}: L*a*b* ${JSON.stringify(lab)} must be three finite numbers`);
      return { XYZ: xyzFromLab(lab, white), white };
    }
    if ("hex" in colour) return { XYZ: xyzFromHex(colour.hex), white: D65_DISPLAY_WHITE };
  }
  throw new Error(
    `${what}: ${JSON.stringify(colour)?.slice(0, 80)} is not a colour; give {XYZ}, {lab}, {hex} or a reflectance spectrum`,
  );
}

function cssNumber(v: number): string {
  return String(Math.round(Math.min(1, Math.max(0, v)) * 10000) / 10000);
}

/**
 * The stated tolerance of the gamut marks, in linear display RGB (full scale 1): a channel down to −0.002 still
 * counts as inside, so rounding in a measurement or a conversion marks nothing; a channel above 1 + 0.002 is said as
 * "brighter than the display's white". Common practice with no source: 0.2 % of full scale is below what a patch
 * can show.
 */
export const GAMUT_TOLERANCE = 0.002;

/** True when a display with these linear channels holds the colour's chromaticity (none below −GAMUT_TOLERANCE). */
function holdsColour(rgb: readonly number[]): boolean {
  return rgb.every((v) => v >= -GAMUT_TOLERANCE);
}

/**
 * What the patch shows when the mapping did more than approximate the colour: these are true on every screen (the
 * wide-gamut CSS colour is mapped to the same white or black). Reduced chroma is not claimed: where the patch has a
 * wide-gamut `css`, the browser draws that and fits it to the screen its own way (Chromium clips each channel), and the
 * report's legend already calls a marked patch an approximation.
 */
const MAPPING_REMARKS: Partial<Record<GamutMapping, string>> = {
  white: "brighter than the display's white, shown as white",
  black: "shown as black",
};

/**
 * One colour swatch for the chosen display gamut: sRGB hex (gamut-mapped when needed), a wide-gamut CSS colour when outside sRGB, and gamut flags.
 *
 * @param label The swatch's label.
 * @param colour { XYZ, white? } or { lab, white? } (white default D65, Y = 100), { hex }, or a reflectance/transmittance spectrum (coloured under `options.illuminant`).
 * @param options.note A note shown under the patch; default none.
 * @returns A `Swatch` for `showSwatches`.
 * @source IEC 61966-2-1:1999 (sRGB); CSS Color Module Level 4 §13.2 (gamut mapping); Bradford adaptation to D65 for spectra (ICC.1:2010 Annex E).
 * @example swatch("invented tile", { lab: { L: 55, a: 40, b: 25 } }).hex
 */
export function swatch(
  label: string,
  colour: SwatchColour,
  options: SwatchOptions & { note?: string } = {},
): Swatch {
  checkString("swatch", "label", label, { what: "a label for the swatch" });
  checkWith(
    "swatch",
    "colour",
    colour,
    "a colour: a spectrum, { XYZ, white? }, { lab, white? } or { hex }",
    isSwatchColour,
  );
  checkOptions("swatch", "options", options, ["display", "illuminant", "interval", "range", "note"]);
  if (typeof label !== "string") throw new Error(`swatch: label must be a string, got ${String(label)}`);
  const display = options.display ?? "sRGB";
  if (!DISPLAY_GAMUTS.includes(display))
    throw new Error(`swatch "${label}": display "${display}" must be one of ${DISPLAY_GAMUTS.join(", ")}`);
  const { XYZ, white } = swatchTristimulus(colour, options, `swatch "${label}"`);
  if (!(white.Y > 0))
    throw new Error(`swatch "${label}": the reference white has Y = ${white.Y}; it must be positive`);
  // Relative to the display white: adapt from the colour's white to D65 (Bradford), then scale so white has Y = 1.
  // Drawing only: the display conversion is not a condition of the report's results, so it notes nothing.
  const d65 = withoutMethodNotes(() => adaptToD65(XYZ, white));
  const rel = { X: d65.X / white.Y, Y: d65.Y / white.Y, Z: d65.Z / white.Y };
  const lin = {
    sRGB: linearRgb(rel, "sRGB"),
    "Display P3": linearRgb(rel, "Display P3"),
    "BT.2020": linearRgb(rel, "BT.2020"),
  };
  // A gamut holds the colour when no linear channel is below −GAMUT_TOLERANCE: one only brighter than the display's
  // white (a channel above 1) is said to be that, not marked as a gamut error (a 0.1 % overshoot of white is neither).
  const inGamut = {
    sRGB: holdsColour(lin.sRGB),
    displayP3: holdsColour(lin["Display P3"]),
    bt2020: holdsColour(lin["BT.2020"]),
  };
  const brighter = Math.max(...lin[display]) > 1 + GAMUT_TOLERANCE;
  // Drawing only, like the adaptation above: gamut mapping for display notes nothing.
  const shown = (gamut: DisplayGamut) => withoutMethodNotes(() => mapToDisplayGamut(rel, gamut));
  const hex = hexFromEncoded(encodeRgb(shown("sRGB").linear, "sRGB"));
  let css: string | undefined;
  if (inGamut.sRGB) css = undefined;
  else if (inGamut.displayP3)
    css = `color(display-p3 ${encodeRgb(shown("Display P3").linear, "Display P3").map(cssNumber).join(" ")})`;
  else css = `color(rec2020 ${encodeRgb(shown("BT.2020").linear, "BT.2020").map(cssNumber).join(" ")})`;
  const outOfDisplay = !(display === "sRGB"
    ? inGamut.sRGB
    : display === "Display P3"
      ? inGamut.displayP3
      : inGamut.bt2020);
  // The gamut mark and its words ("outside sRGB", "outside BT.2020 too") are drawn by the report from the fields below.
  const remarks: string[] = [];
  if (options.note) remarks.push(options.note);
  const how = shown(display).how;
  const mappingRemark = outOfDisplay
    ? MAPPING_REMARKS[how]
    : brighter
      ? how === "white"
        ? MAPPING_REMARKS.white
        : "brighter than the display's white, shown at its white level"
      : undefined;
  if (mappingRemark) remarks.push(mappingRemark);
  return {
    label,
    hex,
    ...(css ? { css } : {}),
    outOfGamut: !inGamut.sRGB,
    inGamut,
    display,
    outOfDisplayGamut: outOfDisplay,
    ...(remarks.length > 0 ? { note: remarks.join("; ") } : {}),
  };
}

/** A labelled colour for a grid of swatches. */
export interface SwatchEntry {
  readonly label: string;
  readonly colour: SwatchColour;
  readonly note?: string;
}

/**
 * Swatches for a set of colours (show them with `showSwatches(grid, caption)` or `show(grid)`).
 *
 * @param entries [{ label, colour, note? }, ...] with colours as `swatch` takes them.
 * @returns An array of `Swatch`.
 * @source As `swatch`: IEC 61966-2-1:1999; CSS Color Module Level 4 §13.2.
 * @example swatchGrid([{ label: "invented red", colour: { hex: "#c03030" } }, { label: "invented blue", colour: { lab: { L: 40, a: 10, b: -50 } } }])
 */
export function swatchGrid(entries: readonly SwatchEntry[], options: SwatchOptions = {}): Swatch[] {
  checkList(
    "swatchGrid",
    "entries",
    entries,
    "entries { label, colour, note? }",
    (e) =>
      typeof e === "object" &&
      e !== null &&
      typeof (e as { label?: unknown }).label === "string" &&
      isSwatchColour((e as { colour?: unknown }).colour),
  );
  checkOptions("swatchGrid", "options", options, ["display", "illuminant", "interval", "range"]);
  if (!Array.isArray(entries)) throw new Error("swatchGrid: expected an array of { label, colour }");
  return entries.map((e, i) => {
    if (!e || typeof e.label !== "string")
      throw new Error(`swatchGrid: entry ${i + 1} needs a label and a colour`);
    return swatch(e.label, e.colour, { ...options, note: e.note });
  });
}

/** A reference and a sample to compare. */
export interface SwatchPairEntry {
  readonly label: string;
  readonly reference: SwatchColour;
  readonly sample: SwatchColour;
}

function labOf(c: SwatchColour, options: SwatchOptions, what: string): { lab: Lab; white: Tristimulus } {
  if (!isSpectrum(c) && "lab" in c) return { lab: c.lab, white: c.white ?? D65_DISPLAY_WHITE };
  const t = swatchTristimulus(c, options, what);
  return { lab: labFromXYZ(t.XYZ, t.white), white: t.white };
}

/**
 * Reference/sample pairs: two swatches per pair, each with `pair` { label, role }, the sample's carrying ΔE00 from CIELAB with the pair's common white.
 *
 * @param pairs [{ label, reference, sample }, ...] with colours as `swatch` takes them.
 * @returns An array of `Swatch`, reference then sample for each pair.
 * @source CIE 142-2001 (ΔE00); IEC 61966-2-1:1999 (sRGB display).
 * @example swatchPairs([{ label: "invented lot 7", reference: { lab: { L: 50, a: 20, b: 10 } }, sample: { lab: { L: 51, a: 18, b: 12 } } }])
 */
export function swatchPairs(pairs: readonly SwatchPairEntry[], options: SwatchOptions = {}): Swatch[] {
  checkList(
    "swatchPairs",
    "pairs",
    pairs,
    "pairs { label, reference, sample }",
    (e) =>
      typeof e === "object" &&
      e !== null &&
      typeof (e as { label?: unknown }).label === "string" &&
      isSwatchColour((e as { reference?: unknown }).reference) &&
      isSwatchColour((e as { sample?: unknown }).sample),
  );
  checkOptions("swatchPairs", "options", options, ["display", "illuminant", "interval", "range"]);
  if (!Array.isArray(pairs))
    throw new Error("swatchPairs: expected an array of { label, reference, sample }");
  const out: Swatch[] = [];
  pairs.forEach((p, i) => {
    if (!p || typeof p.label !== "string" || p.label.trim() === "")
      throw new Error(
        `swatchPairs: pair ${i + 1} needs a label (got ${JSON.stringify(p?.label)}), a reference and a sample`,
      );
    // Two spectra on different grids (1 nm and 5 nm) are summed on one interval, so they share one white.
    const spectra = [p.reference, p.sample].filter(isSpectrum);
    const pairOptions =
      spectra.length === 2 && options.interval === undefined
        ? { ...options, interval: commonSummationInterval(spectra, [options.illuminant ?? "D65"]) }
        : options;
    const r = labOf(p.reference, pairOptions, `pair "${p.label}" reference`);
    const s = labOf(p.sample, pairOptions, `pair "${p.label}" sample`);
    const sameWhite =
      Math.abs(r.white.X - s.white.X) < 1e-6 * r.white.Y &&
      Math.abs(r.white.Y - s.white.Y) < 1e-9 * r.white.Y + 1e-9 &&
      Math.abs(r.white.Z - s.white.Z) < 1e-6 * r.white.Y;
    if (!sameWhite)
      throw new Error(
        `swatchPairs: pair "${p.label}" has different reference whites for reference and sample; ΔE00 needs one white`,
      );
    const de = deltaE2000(r.lab, s.lab);
    out.push({
      ...swatch(`${p.label} reference`, p.reference, pairOptions),
      pair: { label: p.label, role: "reference" },
    });
    out.push({
      ...swatch(`${p.label} sample`, p.sample, pairOptions),
      pair: { label: p.label, role: "sample", deltaE00: de },
    });
  });
  return out;
}
