/**
 * A swatches record as a numbered figure. Single swatches sit in a grid; a reference/sample pair is one grid item,
 * its two patches touching side by side under the pair's name, the ΔE00 under both, so a pair is never split across
 * rows or pages. A patch outside the display gamut it was made for carries a symbol on the patch and the words
 * "outside <gamut>" (never colour alone), and a legend line under the swatches says what the symbol means.
 */
import { isSwatchCssColour } from "../../cells/swatch-record.ts";
import type { SwatchesRecord, SwatchRecord } from "../../cells/records.ts";
import { escapeHtml } from "./escape.ts";

/** The symbol on a patch outside its display gamut. */
export const GAMUT_MARK = "◇";

/** One item of the grid: a single swatch, or a reference and its sample. */
type SwatchItem =
  { readonly single: SwatchRecord } | { readonly reference: SwatchRecord; readonly sample: SwatchRecord };

/** The gamut a swatch was made for (sRGB when the record does not say). */
function displayOf(s: SwatchRecord): string {
  return s.display ?? "sRGB";
}

/** True when the patch lies outside the display gamut it was made for (a record without that field: outside sRGB). */
export function outsideDisplay(s: SwatchRecord): boolean {
  return s.outOfDisplayGamut ?? s.outOfGamut === true;
}

/** The swatches grouped into grid items: consecutive reference and sample of one pair form one item. */
export function swatchItems(swatches: readonly SwatchRecord[]): SwatchItem[] {
  const items: SwatchItem[] = [];
  for (let i = 0; i < swatches.length; i++) {
    const s = swatches[i]!;
    const next = swatches[i + 1];
    if (s.pair?.role === "reference" && next?.pair?.role === "sample" && next.pair.label === s.pair.label) {
      items.push({ reference: s, sample: next });
      i++;
    } else {
      items.push({ single: s });
    }
  }
  return items;
}

/** HTML of a swatches record; `number` is its figure number. */
export function renderSwatchFigure(record: SwatchesRecord, number: number): string {
  const items = swatchItems(record.swatches);
  const pairsOnly = items.length > 0 && items.every((item) => !("single" in item));
  const html = items
    .map((item) => ("single" in item ? renderSingle(item.single) : renderPair(item.reference, item.sample)))
    .join("");
  return (
    `<figure class="swatch-figure" id="figure-${number}"><ul class="swatches${pairsOnly ? " swatch-pairs" : ""}">${html}</ul>` +
    `${renderLegend(record.swatches)}<figcaption><span class="label">Figure ${number}.</span>${record.caption ? ` ${escapeHtml(record.caption)}` : ""}</figcaption></figure>`
  );
}

/** Classes of a patch: `out-of-gamut` outside sRGB (its hex is an approximation), `outside-display` marked. */
function gamutClasses(s: SwatchRecord): string {
  return `${s.outOfGamut ? " out-of-gamut" : ""}${outsideDisplay(s) ? " outside-display" : ""}`;
}

function renderSingle(s: SwatchRecord): string {
  return (
    `<li class="swatch${gamutClasses(s)}">${chip(s)}` +
    `<span class="swatch-label">${escapeHtml(s.label)}</span>${details(s)}</li>`
  );
}

function renderPair(reference: SwatchRecord, sample: SwatchRecord): string {
  const name = sample.pair!.label;
  const member = (s: SwatchRecord) =>
    `<div class="swatch pair-member${gamutClasses(s)}">${chip(s)}` +
    `<span class="swatch-label">${escapeHtml(memberLabel(s, name))}</span>${details(s)}</div>`;
  const difference = sample.pair!.deltaE00;
  const under =
    difference === undefined ? "" : `<p class="pair-difference">ΔE00 = ${difference.toFixed(2)}</p>`;
  return `<li class="swatch-pair"><p class="pair-label">${escapeHtml(name)}</p><div class="pair-members">${member(reference)}${member(sample)}</div>${under}</li>`;
}

/** Under each patch of a pair: its role ("reference"), or its own label when that says more than "<pair> <role>". */
function memberLabel(s: SwatchRecord, pairLabel: string): string {
  const role = s.pair!.role;
  return s.label === `${pairLabel} ${role}` || s.label === pairLabel || s.label === "" ? role : s.label;
}

function chip(s: SwatchRecord): string {
  // The css was checked in the cell process; checked again here, so no record can make the page fetch anything.
  const css = s.css !== undefined && isSwatchCssColour(s.css) ? s.css : undefined;
  const style = `background:${s.hex};${css ? `background:${css};` : ""}`;
  const mark = outsideDisplay(s)
    ? `<span class="gamut-mark" title="Outside the ${escapeHtml(displayOf(s))} gamut">${GAMUT_MARK}</span>`
    : "";
  return `<span class="chip" style="${escapeHtml(style)}">${mark}</span>`;
}

/** The hex, the note, and the gamut words (left out when the note already says them). */
function details(s: SwatchRecord): string {
  const note = s.note ? `<span class="swatch-note">${escapeHtml(s.note)}</span>` : "";
  return `<span class="swatch-value">${escapeHtml(s.hex)}</span>${note}${gamutWords(s)}`;
}

function gamutWords(s: SwatchRecord): string {
  const note = s.note ?? "";
  const display = displayOf(s);
  // Beyond BT.2020 too (a spectral colour, a laser): no standard display gamut holds it.
  const beyond =
    s.inGamut?.bt2020 === false && display !== "BT.2020" && !note.includes("outside BT.2020")
      ? "; outside BT.2020 too"
      : "";
  if (outsideDisplay(s)) {
    const words = `outside ${display}`;
    // lib/plot's current swatches already say it in their note ("outside sRGB: shown …"): not twice.
    if (note.includes(words))
      return beyond ? `<span class="gamut-note">${escapeHtml(beyond.slice(2))}</span>` : "";
    return `<span class="gamut-flag"><span aria-hidden="true">${GAMUT_MARK}</span> ${escapeHtml(words + beyond)}</span>`;
  }
  if (s.outOfGamut && !note.includes("outside sRGB")) {
    // Inside the chosen wide display gamut: exact on such a screen; only the sRGB fallback is an approximation.
    return `<span class="gamut-note">outside sRGB</span>`;
  }
  return "";
}

/** The legend line under swatches that carry the gamut mark. */
function renderLegend(swatches: readonly SwatchRecord[]): string {
  const marked = swatches.filter(outsideDisplay);
  if (marked.length === 0) return "";
  const displays = [...new Set(marked.map(displayOf))];
  const gamut =
    displays.length === 1
      ? `the ${displays[0]} gamut`
      : `the display gamut it was made for (${displays.join(", ")})`;
  return (
    `<p class="swatch-legend"><span class="gamut-mark-key">${GAMUT_MARK}</span> marks a patch whose colour lies outside ${escapeHtml(gamut)}: ` +
    `no such screen shows it exactly, so the patch is an approximation.</p>`
  );
}
