/**
 * The "tristim" module cells get: the library and the display functions side by side. A name exported by both
 * would silently vanish from `export *`, so a clash must fail here.
 */
import { describe, expect, it } from "vitest";
import * as display from "../../cells/display.ts";
import * as entry from "../../cells/tristim-entry.ts";
import * as lib from "../../lib/index.ts";

const DISPLAY_NAMES = [
  "show",
  "showTable",
  "showFigure",
  "showSwatches",
  "showMarkdown",
  "showHtml",
  "showCaution",
  "check",
  "checkCondition",
  "acceptanceDecision",
  "inputs",
];

describe('the "tristim" module', () => {
  it("exports every library name and every display function", () => {
    for (const name of Object.keys(lib)) expect(entry, `library export ${name}`).toHaveProperty(name);
    for (const name of DISPLAY_NAMES) expect(entry, `display export ${name}`).toHaveProperty(name);
    expect(entry.showTable).toBe(display.showTable);
  });

  it("has no library name that clashes with a display function", () => {
    const clashes = Object.keys(lib).filter((name) => DISPLAY_NAMES.includes(name));
    expect(clashes).toEqual([]);
  });
});
