/**
 * A report as a reader sees it: opened from disk in headless Chromium (playwright-core), with no network, its
 * figures must be drawn by the embedded Plotly and its folded code must open on a click. Skipped with a message
 * when no Chromium is installed (set CHROMIUM_PATH, or install Debian's chromium as .ci/run does).
 */
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { chromium } from "playwright-core";
import { describe, expect, it } from "vitest";
import { readEmbeddedRunRecord } from "../../runner/report/embedded-run-record.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import { runText, ts } from "./helpers.ts";
import { CHROMIUM, NO_CHROMIUM } from "../browser/chromium.ts";

describe.skipIf(!CHROMIUM)(`report in a browser${CHROMIUM ? "" : ` (skipped: ${NO_CHROMIUM})`}`, () => {
  it("draws the figures offline and opens folded code on a click", async () => {
    const { document, run } = await runText(
      "# Browser check\n\n" +
        ts(
          "showFigure({ data: [{ type: 'scatter', x: [400, 500, 600], y: [0.2, 0.9, 0.4], name: '<b>sample</b>' }], layout: { height: 300 } }, 'Invented curve');",
        ) +
        ts("showSwatches([{ label: 'grey', hex: '#808080' }]);"),
    );
    const file = path.join(path.dirname(document.path), "nb.html");
    fs.writeFileSync(file, renderReport(document, run));
    const browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ["--no-sandbox", "--disable-gpu"],
    });
    try {
      const page = await browser.newPage();
      const requests: string[] = [];
      const errors: string[] = [];
      page.on("request", (r) => void (r.url().startsWith("file:") || requests.push(r.url())));
      page.on("pageerror", (e) => void errors.push(e.message));
      await page.goto(pathToFileURL(file).href);
      // Plotly is unpacked in the page first (DecompressionStream); on a loaded machine that and drawing take a while.
      await page.waitForSelector("#figure-1 .plot .main-svg", { timeout: 90_000 });
      expect(await page.locator("#figure-1 .scatterlayer .trace").count()).toBe(1);
      expect(await page.locator("#figure-1 figcaption").textContent()).toBe("Figure 1. Invented curve");
      expect(await page.locator("#figure-2 .chip").count()).toBe(1);
      const code = page.locator("#cell-1 details.cell-source");
      expect(await code.getAttribute("open")).toBeNull();
      await code.locator("summary").click();
      expect(await code.getAttribute("open")).toBe("");
      // The browser reads the embedded run record as the same data the runner's reader gives.
      const embedded = await page.evaluate(
        () => JSON.parse(window.document.getElementById("tristim-run-record")!.textContent!) as unknown,
      );
      expect(embedded).toEqual(readEmbeddedRunRecord(fs.readFileSync(file, "utf8")));
      expect(requests).toEqual([]);
      expect(errors).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 150_000);

  it("prints as a lab report: no Plotly tool bar, figures kept whole and no wider than an A4 column", async () => {
    const { document: doc, run } = await runText(
      "# Print\n\n" +
        ts(
          "showFigure({ data: [{ type: 'scatter', x: [400, 500, 600], y: [0.2, 0.9, 0.4] }], layout: { height: 420 }, config: { displayModeBar: true } }, 'Invented curve');\n" +
            "showTable([{ blank: 'HG-114-01', 'τv': 26.54 }]);",
        ),
    );
    const file = path.join(path.dirname(doc.path), "print.html");
    fs.writeFileSync(file, renderReport(doc, run));
    const browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ["--no-sandbox", "--disable-gpu"],
    });
    try {
      // A wide window: the figure is drawn for the screen before the page is printed.
      const page = await browser.newPage({ viewport: { width: 1600, height: 1000 } });
      await page.goto(pathToFileURL(file).href);
      // Plotly is unpacked in the page first (DecompressionStream); on a loaded machine that and drawing take a while.
      await page.waitForSelector("#figure-1 .plot .main-svg", { timeout: 90_000 });
      const onScreen = await page.$eval(".modebar-container", (m) => getComputedStyle(m).display);
      expect(onScreen).not.toBe("none");
      await page.emulateMedia({ media: "print" });
      const printed = await page.evaluate(() => {
        const figure = window.document.querySelector("#figure-1")!;
        return {
          modebar: getComputedStyle(window.document.querySelector(".modebar-container")!).display,
          breakInside: [
            ...Array.from(window.document.querySelectorAll("figure")),
            window.document.querySelector("table")!,
          ].map((e) => getComputedStyle(e).breakInside),
          svgWidth: figure.querySelector(".main-svg")!.getBoundingClientRect().width,
        };
      });
      expect(printed.modebar).toBe("none");
      expect(printed.breakInside.every((b) => b === "avoid")).toBe(true);
      // A4 is 210 mm wide; less the report's 16 mm side margins that leaves 178 mm = 672.8 CSS px at 96 px per inch.
      expect(printed.svgWidth).toBeLessThanOrEqual((178 / 25.4) * 96);
      // Printing works offline and gives pages (Chromium's own PDF output).
      const pdf = await page.pdf({ format: "A4" });
      expect(pdf.subarray(0, 5).toString("latin1")).toBe("%PDF-");
    } finally {
      await browser.close();
    }
  }, 150_000);

  it("keeps each swatch pair side by side on one row, marks patches outside the display gamut, and keeps IDs on one line", async () => {
    // Invented CIELAB pairs, drawn by lib/plot's swatchPairs (its current output: two swatches per pair).
    const { document: doc, run } = await runText(
      "# Pairs\n\n" +
        ts(
          "const pairs = Array.from({ length: 11 }, (_, i) => ({ label: `patch ${i + 1}`, reference: { lab: { L: 30 + 5 * i, a: 20, b: -10 } }, sample: { lab: { L: 31 + 5 * i, a: 21, b: -9 } } }));\n" +
            "pairs.push({ label: 'laser green', reference: { lab: { L: 80, a: -120, b: 90 } }, sample: { lab: { L: 80, a: -118, b: 88 } } });\n" +
            "showSwatches(swatchPairs(pairs), 'Invented pairs');\n" +
            "showTable([{ blank: 'HG-114-01', limit: '249.6 cd/m²', remark: 'a remark long enough that it has to wrap in a narrow window, and may' }]);",
        ),
    );
    expect(run.cells[0]!.status).toBe("ok");
    const file = path.join(path.dirname(doc.path), "pairs.html");
    fs.writeFileSync(file, renderReport(doc, run));
    const browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ["--no-sandbox", "--disable-gpu"],
    });
    try {
      const page = await browser.newPage();
      await page.goto(pathToFileURL(file).href);
      for (const width of [360, 620, 900, 1280]) {
        await page.setViewportSize({ width, height: 900 });
        const pairs = await page.$$eval(".swatch-pair", (nodes) =>
          nodes.map((n) => {
            const [a, b] = Array.from(n.querySelectorAll(".chip")).map((c) => c.getBoundingClientRect());
            const under = n.querySelector(".pair-difference")!.getBoundingClientRect();
            return {
              chips: n.querySelectorAll(".chip").length,
              sameRow: Math.abs(a!.top - b!.top) < 0.5,
              touching: Math.abs(a!.right - b!.left) < 0.5,
              below: under.top >= Math.max(a!.bottom, b!.bottom),
              text: n.querySelector(".pair-difference")!.textContent,
            };
          }),
        );
        expect(pairs).toHaveLength(12);
        for (const p of pairs) {
          expect(p).toMatchObject({ chips: 2, sameRow: true, touching: true, below: true });
          expect(p.text).toMatch(/^ΔE00 = \d+\.\d\d$/);
        }
        // The line boxes of a cell's text: an ID or a value with its unit takes one, prose may take several.
        const lines = await page.$$eval("td", (cells) =>
          cells.map((td) => {
            const range = document.createRange();
            range.selectNodeContents(td);
            return [
              td.textContent,
              new Set(Array.from(range.getClientRects()).map((r) => Math.round(r.top))).size,
            ] as const;
          }),
        );
        expect(lines.find(([t]) => t === "HG-114-01")![1]).toBe(1);
        expect(lines.find(([t]) => t === "249.6 cd/m²")![1]).toBe(1);
        if (width === 360) expect(lines.find(([t]) => t!.startsWith("a remark"))![1]).toBeGreaterThan(1);
      }
      // Only the laser green sample lies outside sRGB (lib/plot's default display): its patch carries the symbol.
      const marks = await page.$$eval(".gamut-mark", (nodes) =>
        nodes.map((m) => {
          const chip = m.parentElement!.getBoundingClientRect();
          const r = m.getBoundingClientRect();
          return {
            text: m.textContent,
            inside:
              r.width > 8 &&
              r.left >= chip.left &&
              r.right <= chip.right &&
              r.top >= chip.top &&
              r.bottom <= chip.bottom,
            label: m.closest(".swatch-pair")!.querySelector(".pair-label")!.textContent,
          };
        }),
      );
      expect(marks.length).toBeGreaterThanOrEqual(1);
      expect(marks.every((m) => m.text === "◇" && m.inside && m.label === "laser green")).toBe(true);
      expect(await page.locator(".swatch-legend").textContent()).toContain("outside the sRGB gamut");
    } finally {
      await browser.close();
    }
  }, 150_000);
});
