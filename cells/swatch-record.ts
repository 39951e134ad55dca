/**
 * Swatch records from what a cell passes to `showSwatches`: every field checked (nothing can break out of a style
 * attribute, no NaN difference), only known fields kept, and reference/sample pairs made explicit.
 *
 * A pair arrives in one of two shapes:
 * - a `pair` field on both members ({ label, role, deltaE00 }), reference right before sample — the record's own
 *   shape, for notebooks and for lib/plot once its `swatchPairs` emits it;
 * - lib/plot's current `swatchPairs` output: two consecutive swatches labelled "<name> reference" and "<name> sample",
 *   the sample's note starting with "ΔE00 = 1.23". This is turned into the first shape: the difference moves from
 *   the note into `pair.deltaE00`, so the report draws it once, under the pair.
 */
import { describeValue as describe } from "./describe-value.ts";
import type { SwatchGamuts, SwatchPairPlace, SwatchRecord } from "./records.ts";

const HEX = /^#[0-9a-fA-F]{6}$/;
/** One argument of a CSS colour function: a number (percent or angle allowed) or `none`. */
const CSS_ARGUMENT = String.raw`(?:[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:e[+-]?\d+)?(?:%|deg|grad|rad|turn)?|none)`;
const CSS_ARGUMENTS = String.raw`${CSS_ARGUMENT}(?:\s*[\s,/]\s*${CSS_ARGUMENT})*`;
/**
 * The colour values a swatch's css may hold (CSS Color 4): hex, the colour functions with plain numbers, and
 * color() in a predefined colour space. Nothing else — no url(), image, var() or keyword — so a report never
 * fetches anything.
 */
const CSS_COLOUR = new RegExp(
  String.raw`^(?:#(?:[0-9a-f]{3,4}|[0-9a-f]{6}|[0-9a-f]{8})` +
    String.raw`|(?:rgba?|hsla?|hwb|lab|lch|oklab|oklch)\(\s*${CSS_ARGUMENTS}\s*\)` +
    String.raw`|color\(\s*(?:srgb|srgb-linear|display-p3|a98-rgb|prophoto-rgb|rec2020|xyz|xyz-d50|xyz-d65)\s+${CSS_ARGUMENTS}\s*\))$`,
  "i",
);

/** True when `text` is a CSS colour value a swatch may use (see CSS_COLOUR). */
export function isSwatchCssColour(text: string): boolean {
  return CSS_COLOUR.test(text.trim());
}
const PAIR_ROLES = ["reference", "sample"] as const;
/** lib/plot's current pair labels and the difference it writes at the start of the sample's note. */
const LEGACY_REFERENCE = /^(.+) reference$/;
const LEGACY_SAMPLE = /^(.+) sample$/;
const LEGACY_DIFFERENCE = /^ΔE00 = (\d+(?:\.\d+)?)(?:; (.*))?$/s;

type Mutable<T> = { -readonly [K in keyof T]: T[K] };

/** Checked swatch records, pairs made explicit; throws a TypeError naming the swatch and field at fault. */
export function swatchRecords(swatches: readonly unknown[]): SwatchRecord[] {
  const records = swatches.map((s, i) => checkSwatch(s, i));
  inferLegacyPairs(records);
  checkPairsAdjacent(records);
  return records;
}

function checkSwatch(input: unknown, i: number): Mutable<SwatchRecord> {
  const where = `showSwatches: swatch ${i + 1}`;
  if (typeof input !== "object" || input === null)
    throw new TypeError(`${where} is ${describe(input)}, not { label, hex }`);
  const s = input as Record<string, unknown>;
  if (typeof s.label !== "string")
    throw new TypeError(`${where}: label must be a string, got ${describe(s.label)}`);
  const named = `${where} ("${s.label}")`;
  if (typeof s.hex !== "string" || !HEX.test(s.hex)) {
    throw new TypeError(`${named}: hex must be an sRGB colour like #1a2b3c, got ${describe(s.hex)}`);
  }
  if (s.css !== undefined && (typeof s.css !== "string" || !CSS_COLOUR.test(s.css.trim()))) {
    throw new TypeError(
      `${named}: css must be a CSS colour value (hex, or rgb(), hsl(), hwb(), lab(), lch(), oklab(), oklch() or color() with numbers), like color(display-p3 1 0.2 0.1); got ${describe(s.css)}`,
    );
  }
  const out: Mutable<SwatchRecord> = { label: s.label, hex: s.hex.toLowerCase() };
  if (s.css !== undefined) out.css = (s.css as string).trim();
  if (s.outOfGamut === true) out.outOfGamut = true;
  if (s.display !== undefined) {
    if (typeof s.display !== "string" || s.display.trim() === "")
      throw new TypeError(
        `${named}: display must be the name of a display gamut such as "sRGB", got ${describe(s.display)}`,
      );
    out.display = s.display.trim();
  }
  if (s.outOfDisplayGamut !== undefined) {
    if (typeof s.outOfDisplayGamut !== "boolean")
      throw new TypeError(
        `${named}: outOfDisplayGamut must be true or false, got ${describe(s.outOfDisplayGamut)}`,
      );
    out.outOfDisplayGamut = s.outOfDisplayGamut;
  }
  if (s.inGamut !== undefined) out.inGamut = checkGamuts(s.inGamut, named);
  if (s.pair !== undefined) out.pair = checkPair(s.pair, named);
  if (typeof s.note === "string" && s.note !== "") out.note = s.note;
  return out;
}

function checkGamuts(value: unknown, named: string): SwatchGamuts {
  const g = value as Record<string, unknown> | null;
  if (
    typeof g !== "object" ||
    g === null ||
    !["sRGB", "displayP3", "bt2020"].every((k) => typeof g[k] === "boolean")
  ) {
    throw new TypeError(
      `${named}: inGamut must be { sRGB, displayP3, bt2020 } with true or false each, got ${describe(value)}`,
    );
  }
  return { sRGB: g.sRGB as boolean, displayP3: g.displayP3 as boolean, bt2020: g.bt2020 as boolean };
}

function checkPair(value: unknown, named: string): SwatchPairPlace {
  const p = value as Record<string, unknown> | null;
  if (typeof p !== "object" || p === null)
    throw new TypeError(`${named}: pair must be { label, role, deltaE00? }, got ${describe(value)}`);
  if (typeof p.label !== "string" || p.label.trim() === "")
    throw new TypeError(`${named}: pair.label must name the pair, got ${describe(p.label)}`);
  if (!PAIR_ROLES.includes(p.role as never))
    throw new TypeError(`${named}: pair.role must be "reference" or "sample", got ${describe(p.role)}`);
  const place: Mutable<SwatchPairPlace> = { label: p.label, role: p.role as SwatchPairPlace["role"] };
  if (p.deltaE00 !== undefined) {
    if (typeof p.deltaE00 !== "number" || !Number.isFinite(p.deltaE00) || p.deltaE00 < 0) {
      throw new TypeError(`${named}: pair.deltaE00 must be a finite number ≥ 0, got ${describe(p.deltaE00)}`);
    }
    if (place.role !== "sample")
      throw new TypeError(`${named}: pair.deltaE00 belongs on the pair's sample, not on its reference`);
    place.deltaE00 = p.deltaE00;
  }
  return place;
}

/** lib/plot's current shape: "<name> reference" then "<name> sample" (ΔE00 in its note) becomes an explicit pair. */
function inferLegacyPairs(records: Mutable<SwatchRecord>[]): void {
  for (let i = 0; i + 1 < records.length; i++) {
    const a = records[i]!;
    const b = records[i + 1]!;
    if (a.pair || b.pair) continue;
    const name = LEGACY_REFERENCE.exec(a.label)?.[1];
    if (name === undefined || LEGACY_SAMPLE.exec(b.label)?.[1] !== name) continue;
    a.pair = { label: name, role: "reference" };
    const difference = b.note === undefined ? null : LEGACY_DIFFERENCE.exec(b.note);
    if (difference) {
      b.pair = { label: name, role: "sample", deltaE00: Number(difference[1]) };
      if (difference[2]) b.note = difference[2];
      else delete b.note;
    } else {
      b.pair = { label: name, role: "sample" };
    }
    i++;
  }
}

/** Every pair member must sit in a complete pair: its reference right before its sample, same label. */
function checkPairsAdjacent(records: readonly SwatchRecord[]): void {
  for (let i = 0; i < records.length; i++) {
    const pair = records[i]!.pair;
    if (!pair) continue;
    const next = records[i + 1]?.pair;
    if (pair.role === "reference" && next?.role === "sample" && next.label === pair.label) {
      i++;
      continue;
    }
    const named = `showSwatches: swatch ${i + 1} ("${records[i]!.label}")`;
    throw new TypeError(
      pair.role === "reference"
        ? `${named} is the reference of pair "${pair.label}", but swatch ${i + 2} is not its sample; put each pair's sample right after its reference`
        : `${named} is the sample of pair "${pair.label}", but ${i === 0 ? "no swatch comes before it" : `swatch ${i} is not its reference`}; put each pair's reference right before its sample`,
    );
  }
}
