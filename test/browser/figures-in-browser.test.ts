/**
 * The figures and swatches of lib/plot, checked in a real browser: the runner CLI renders a fixture notebook to a
 * report, Chromium (Debian's, driven by playwright-core; no browser download) opens it, and the test asserts that
 * every figure was drawn by Plotly with the traces its spec holds, that the page logged no errors, and that
 * wide-gamut swatches carry the CSS colour an independent library (colorjs.io) computes, that patches outside the chosen
 * display gamut are marked from their fields and that a pair's ΔE00 (culori) sits under the pair. A screenshot goes to
 * test/.artifacts/. Skipped, saying why, only when no Chromium is installed.
 */
import { existsSync, mkdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import Color from "colorjs.io";
import { differenceCiede2000 } from "culori";
import { type Browser, type Page } from "playwright-core";
import { CHROMIUM, NO_CHROMIUM, launchChromium, reportByCli } from "./chromium.ts";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { encodeRgb, linearRgb } from "../../lib/plot/display-rgb.ts";
import { GAMUT_TOLERANCE } from "../../lib/plot/swatch.ts";

const HAVE_CHROMIUM = CHROMIUM !== undefined;
const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const ARTIFACTS = ROOT + "test/.artifacts/";
const NOTEBOOK = ROOT + "test/browser/fixtures/figures-and-swatches.md";
const REPORT = ARTIFACTS + "figures-and-swatches.html";
const SCREENSHOT = ARTIFACTS + "figures-and-swatches.png";

const SKIP_REASON = `${NO_CHROMIUM}, to run the browser test`;
if (!HAVE_CHROMIUM) console.warn(`test/browser: SKIPPED – ${SKIP_REASON}`);

interface DrawnFigure {
  specTraces: number;
  drawnTraces: number;
  hasSvg: boolean;
  caption: string;
}

interface DrawnSwatch {
  label: string;
  background: string;
  style: string;
  /** The runner's class for a colour outside sRGB (its hex is an approximation). */
  flagged: boolean;
  /** The ◇ on the patch: outside the display gamut the swatch was made for. */
  marked: boolean;
  /** Texts under the patch: the swatch's own note, the gamut words beside a mark, the "outside sRGB" remark. */
  note: string;
  gamutFlag: string;
  gamutNote: string;
}

/** Numbers inside a CSS color() function, e.g. "color(display-p3 0.2 0.8 0.2)" → [0.2, 0.8, 0.2]. */
function colourNumbers(css: string): number[] {
  const m = /^color\(([a-z0-9-]+) ([^)]*)\)$/.exec(css.trim());
  if (!m) throw new Error(`"${css}" is not a CSS color() function`);
  return m[2]!.trim().split(/\s+/).map(Number);
}

describe.skipIf(!HAVE_CHROMIUM)(
  `lib/plot figures in Chromium${HAVE_CHROMIUM ? "" : ` (skipped: ${SKIP_REASON})`}`,
  () => {
    let browser: Browser;
    let page: Page;
    const errors: string[] = [];
    let figures: DrawnFigure[] = [];
    let swatches: DrawnSwatch[] = [];

    beforeAll(async () => {
      mkdirSync(ARTIFACTS, { recursive: true });
      // The report as a user makes it: the runner's CLI on the fixture notebook.
      await reportByCli(NOTEBOOK, REPORT);
      browser = await launchChromium();
      page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
      page.on("console", (m) => {
        if (m.type() === "error") errors.push(`console: ${m.text()}`);
      });
      page.on("pageerror", (e) => errors.push(`page: ${e.message}`));
      page.on("requestfailed", (r) => errors.push(`request failed: ${r.url()}`));
      await page.goto("file://" + REPORT, { waitUntil: "load" });
      // Plotly draws synchronously in the report's script; wait until every plot node has its SVG or a failure note.
      await page.waitForFunction(
        () =>
          Array.from(document.querySelectorAll(".plot[data-spec]")).every(
            (n) => n.querySelector("svg.main-svg") || n.querySelector(".plot-missing"),
          ),
        undefined,
        { timeout: 30_000 },
      );
      figures = await page.$$eval(".plot[data-spec]", (nodes) =>
        nodes.map((n) => {
          const spec = JSON.parse(document.getElementById(n.getAttribute("data-spec")!)!.textContent!) as {
            data: unknown[];
          };
          return {
            specTraces: spec.data.length,
            drawnTraces: n.querySelectorAll(".scatterlayer .trace").length,
            hasSvg: n.querySelector("svg.main-svg") !== null && n.querySelector(".plot-missing") === null,
            caption: n.closest("figure")?.querySelector("figcaption")?.textContent ?? "",
          };
        }),
      );
      swatches = await page.$$eval(".swatch", (nodes) =>
        nodes.map((n) => {
          const chip = n.querySelector(".chip") as HTMLElement;
          return {
            label: n.querySelector(".swatch-label")?.textContent ?? "",
            background: getComputedStyle(chip).backgroundColor,
            style: chip.getAttribute("style") ?? "",
            flagged: n.classList.contains("out-of-gamut"),
            marked: chip.querySelector(".gamut-mark") !== null,
            note: n.querySelector(".swatch-note")?.textContent ?? "",
            gamutFlag: n.querySelector(".gamut-flag")?.textContent ?? "",
            gamutNote: n.querySelector(".gamut-note")?.textContent ?? "",
          };
        }),
      );
      await page.screenshot({ path: SCREENSHOT, fullPage: true });
    }, 180_000);

    afterAll(async () => {
      await browser?.close();
    });

    it("draws all six figures of the fixture, each with every trace of its spec", () => {
      expect(figures).toHaveLength(6);
      for (const f of figures) {
        expect(f.hasSvg).toBe(true);
        expect(f.specTraces).toBeGreaterThan(0);
        expect(f.drawnTraces).toBe(f.specTraces);
      }
    });

    it("draws the raster layers: the colour fill of the chromaticity diagrams and the spectrum band", async () => {
      const images = await page.$$eval(".plot[data-spec]", (nodes) =>
        nodes.map((n) => n.querySelectorAll("image").length),
      );
      // Figures 1–2 are chromaticity diagrams with a fill, 3–4 spectrum plots with a band, 5–6 CIELAB views without.
      expect(images.slice(0, 4).every((k) => k >= 1)).toBe(true);
      expect(images.slice(4)).toEqual([0, 0]);
    });

    it("shows x, y, u′, v′, CCT and Duv when the pointer rests on a labelled point", async () => {
      // Lamp 1 of the fixture sits at x = 0.4369, y = 0.4041, the Planckian point at 3000 K (CIE 015 tables, recalled
      // from memory), so the hover box must read a CCT near 3000 K.
      const plot = (await page.$$(".plot[data-spec]"))[0]!;
      await plot.scrollIntoViewIfNeeded();
      const where = await plot.evaluate((node) => {
        // Plotly's axis objects: _offset is the axis start in px within the SVG, l2p maps a value to px from there.
        type Axis = { l2p(v: number): number; _offset: number };
        const fl = (node as unknown as { _fullLayout: { xaxis: Axis; yaxis: Axis } })._fullLayout;
        const r = node.querySelector("svg.main-svg")!.getBoundingClientRect();
        return {
          x: r.left + fl.xaxis._offset + fl.xaxis.l2p(0.4369),
          y: r.top + fl.yaxis._offset + fl.yaxis.l2p(0.4041),
        };
      });
      await page.mouse.move(where.x, where.y);
      await page.waitForSelector(".hoverlayer .hovertext", { timeout: 5_000 });
      const text = await plot.$eval(".hoverlayer", (n) => n.textContent ?? "");
      expect(text).toContain("Lamp 1");
      expect(text).toMatch(/x = 0\.4369, y = 0\.4041/);
      expect(text).toMatch(/u′ = 0\.\d{4}, v′ = 0\.\d{4}/);
      const cct = Number(/CCT (\d+) K/.exec(text)?.[1]);
      expect(Math.abs(cct - 3000)).toBeLessThan(15);
      expect(text).toMatch(/Duv [+−]0\.\d{4}/);
      expect(text).not.toContain("%{");
      await page.mouse.move(0, 0);
    }, 20_000);

    it("logs no errors and loads nothing that fails", () => {
      expect(errors).toEqual([]);
    });

    it("keeps the captions that call the approximate colours approximate", () => {
      expect(figures[0]!.caption).toMatch(/approximate/);
      expect(figures[2]!.caption).toMatch(/approximate spectral colours/);
    });

    it("writes the swatch inside sRGB as its hex colour", () => {
      const s = swatches.find((w) => w.label === "Inside sRGB")!;
      expect(s.background).toBe("rgb(138, 75, 47)");
      expect(s.flagged).toBe(false);
    });

    it("gives the Display P3 swatch the display-p3 colour colorjs.io computes, and Chromium reads it back so", async () => {
      const s = swatches.find((w) => w.label === "P3 green")!;
      // The fixture's XYZ (Y = 100 scale) through colorjs.io's D65 XYZ → Display P3.
      const expected = new Color("xyz-d65", [0.265, 0.641, 0.112]).to("p3").coords as number[];
      expect(s.background).toMatch(/^color\(display-p3 /);
      colourNumbers(s.background).forEach((v, i) => expect(Math.abs(v - expected[i]!)).toBeLessThan(2e-3));
      expect(s.flagged).toBe(true); // outside sRGB: the runner flags that its hex is an approximation
      // Chromium's own conversion: draw the colour on a Display P3 canvas and read the pixel.
      const pixel = await page.evaluate((css) => {
        const c = document.createElement("canvas");
        c.width = c.height = 1;
        const ctx = c.getContext("2d", { colorSpace: "display-p3" })!;
        ctx.fillStyle = css;
        ctx.fillRect(0, 0, 1, 1);
        return [...ctx.getImageData(0, 0, 1, 1, { colorSpace: "display-p3" }).data];
      }, s.background);
      expected.forEach((v, i) => expect(Math.abs(pixel[i]! - v * 255)).toBeLessThanOrEqual(2));
    });

    it("gives the BT.2020 swatches color(rec2020 …) with the BT.2020 OETF numbers colorjs.io computes", () => {
      // colorjs.io's "--rec2020-oetf" encodes with ITU-R BT.2020-2 Table 4, the encoding Chromium reads (next test).
      const inside = new Color("xyz-d65", [0.144, 0.56, 0.047]);
      // The fixture's premise, by colorjs.io: outside Display P3, inside BT.2020.
      expect([inside.inGamut("p3"), inside.inGamut("rec2020")]).toEqual([false, true]);
      const s = swatches.find((w) => w.label === "BT.2020 green")!;
      expect(s.background).toMatch(/^color\(rec2020 /);
      const expected = inside.to("--rec2020-oetf").coords as number[];
      colourNumbers(s.background).forEach((v, i) => expect(Math.abs(v - expected[i]!)).toBeLessThan(2e-3));
    });

    it("maps colours outside BT.2020 into it as colorjs.io's CSS Color 4 gamut mapping does, not by clamping", () => {
      // Fixture XYZ (Y = 100 scale) / 100. The green has BT.2020 G = 1.18 (linear) and 520 nm R < 0, so neither fits.
      for (const [label, xyz] of [
        ["Green beyond BT.2020", [0.17, 0.797, 0.033]],
        ["520 nm", [0.063, 0.71, 0.078]],
      ] as const) {
        expect(new Color("xyz-d65", [...xyz]).inGamut("rec2020")).toBe(false);
        const mapped = new Color("xyz-d65", [...xyz])
          .toGamut({ space: "rec2020", method: "css" })
          .to("--rec2020-oetf").coords as number[];
        const clamped = (new Color("xyz-d65", [...xyz]).to("--rec2020-oetf").coords as number[]).map((v) =>
          Math.min(1, Math.max(0, v)),
        );
        const s = swatches.find((w) => w.label === label)!;
        expect(s.background).toMatch(/^color\(rec2020 /);
        const shown = colourNumbers(s.background);
        shown.forEach((v, i) => expect(Math.abs(v - mapped[i]!), `${label} channel ${i}`).toBeLessThan(2e-3));
        // The clamp differs enough that this check would catch channel clipping.
        expect(Math.max(...shown.map((v, i) => Math.abs(v - clamped[i]!)))).toBeGreaterThan(0.1);
      }
    });

    it("uses the rec2020 encoding Chromium uses: sRGB #008000 written as color(rec2020 …) reads back as rgb(0, 128, 0)", async () => {
      // #008000: sRGB green channel 128/255 decoded by IEC 61966-2-1 eq. (2); D65 XYZ of the sRGB primary G
      // (IEC 61966-2-1 matrix column: 0.3576, 0.7152, 0.1192).
      const g = ((128 / 255 + 0.055) / 1.055) ** 2.4;
      const rgb = encodeRgb(linearRgb({ X: 0.3576 * g, Y: 0.7152 * g, Z: 0.1192 * g }, "BT.2020"), "BT.2020");
      const css = `color(rec2020 ${rgb.map((v) => v.toFixed(5)).join(" ")})`;
      const pixel = await page.evaluate((c) => {
        const canvas = document.createElement("canvas");
        canvas.width = canvas.height = 1;
        const ctx = canvas.getContext("2d")!;
        ctx.fillStyle = c;
        ctx.fillRect(0, 0, 1, 1);
        return [...ctx.getImageData(0, 0, 1, 1).data].slice(0, 3);
      }, css);
      expect(Math.abs(pixel[0]! - 0)).toBeLessThanOrEqual(1);
      expect(Math.abs(pixel[1]! - 128)).toBeLessThanOrEqual(1);
      expect(Math.abs(pixel[2]! - 0)).toBeLessThanOrEqual(1);
    });

    it("marks the patches outside the chosen display (Display P3) from their fields, in symbol and words, with a legend", async () => {
      const drawn = (label: string) => swatches.find((w) => w.label === label)!;
      // Which gamuts hold each fixture colour, by colorjs.io; the marks must follow them.
      const fixture: [string, [number, number, number]][] = [
        ["P3 green", [0.265, 0.641, 0.112]],
        ["BT.2020 green", [0.144, 0.56, 0.047]],
        ["Green beyond BT.2020", [0.17, 0.797, 0.033]],
        ["520 nm", [0.063, 0.71, 0.078]],
      ];
      // The marks follow lib/plot's stated rule (GAMUT_TOLERANCE): a gamut holds a colour when none of its linear
      // channels, by colorjs.io, is below −0.002; a channel above 1 is "brighter than white", not outside the gamut.
      const holds = (c: Color, linear: string) =>
        (c.to(linear).coords as number[]).every((v) => v >= -GAMUT_TOLERANCE);
      for (const [label, xyz] of fixture) {
        const c = new Color("xyz-d65", xyz);
        const s = drawn(label);
        const outsideP3 = !holds(c, "p3-linear");
        expect(s.marked, label).toBe(outsideP3);
        expect(s.flagged, label).toBe(!holds(c, "srgb-linear"));
        expect(s.gamutFlag, label).toBe(
          outsideP3 ? `◇ outside Display P3${holds(c, "rec2020-linear") ? "" : "; outside BT.2020 too"}` : "",
        );
        expect(s.gamutNote, label).toBe(outsideP3 ? "" : "outside sRGB");
        // lib/plot writes no gamut remark of its own into the note (the words above come from the fields).
        expect(s.note, label).toBe("");
      }
      expect(drawn("Inside sRGB")).toMatchObject({
        marked: false,
        flagged: false,
        gamutFlag: "",
        gamutNote: "",
        note: "",
      });
      const legend = await page.$$eval(".swatch-legend", (nodes) => nodes.map((n) => n.textContent ?? ""));
      expect(legend).toHaveLength(1);
      expect(legend[0]).toMatch(
        /^◇ marks a patch whose colour lies outside the Display P3 gamut: .*approximation/,
      );
    });

    it("draws each reference/sample pair as one unit, its ΔE00 under the pair (culori's CIEDE2000), not in a note", async () => {
      const pairs = await page.$$eval(".swatch-pair", (nodes) =>
        nodes.map((n) => ({
          name: n.querySelector(".pair-label")?.textContent ?? "",
          members: Array.from(n.querySelectorAll(".pair-member .swatch-label")).map((l) => l.textContent),
          notes: Array.from(n.querySelectorAll(".swatch-note")).map((l) => l.textContent ?? ""),
          difference: n.querySelector(".pair-difference")?.textContent ?? "",
        })),
      );
      // The fixture's invented CIELAB (D65) pairs; ΔE00 from culori (npm registry) on the same numbers.
      const fixture = [
        { name: "Chip 1", reference: [52, 41.5, 27], sample: [53.1, 39.8, 28.6] },
        { name: "Chip 2", reference: [70, -30, 20], sample: [69, -27.5, 21] },
      ];
      const ciede2000 = differenceCiede2000();
      expect(pairs.map((p) => p.name)).toEqual(fixture.map((f) => f.name));
      pairs.forEach((p, i) => {
        const [r, s] = [fixture[i]!.reference, fixture[i]!.sample].map(([l, a, b]) => ({
          mode: "lab65" as const,
          l: l!,
          a: a!,
          b: b!,
        }));
        expect(p.members).toEqual(["reference", "sample"]);
        expect(p.difference).toMatch(/^ΔE00 = \d+\.\d\d$/);
        expect(p.difference).toBe(`ΔE00 = ${ciede2000(r!, s!).toFixed(2)}`);
        expect(p.notes.join(" ")).not.toContain("ΔE00");
      });
    });

    it("saved a screenshot of the whole report", () => {
      expect(existsSync(SCREENSHOT)).toBe(true);
    });
  },
);
