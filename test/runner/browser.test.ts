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
import { renderReport } from "../../runner/report/render-report.ts";
import { runText, ts } from "./helpers.ts";

const CHROMIUM = [process.env.CHROMIUM_PATH, "/usr/bin/chromium", "/usr/bin/chromium-browser"].find((p) => p && fs.existsSync(p));

describe.skipIf(!CHROMIUM)(`report in a browser${CHROMIUM ? "" : " (skipped: no Chromium found; set CHROMIUM_PATH)"}`, () => {
  it("draws the figures offline and opens folded code on a click", async () => {
    const { document, run } = await runText(
      "# Browser check\n\n" +
        ts("showFigure({ data: [{ type: 'scatter', x: [400, 500, 600], y: [0.2, 0.9, 0.4], name: '<b>sample</b>' }], layout: { height: 300 } }, 'Invented curve');") +
        ts("showSwatches([{ label: 'grey', hex: '#808080' }]);"),
    );
    const file = path.join(path.dirname(document.path), "nb.html");
    fs.writeFileSync(file, renderReport(document, run));
    const browser = await chromium.launch({ executablePath: CHROMIUM, args: ["--no-sandbox", "--disable-gpu"] });
    try {
      const page = await browser.newPage();
      const requests: string[] = [];
      const errors: string[] = [];
      page.on("request", (r) => void (r.url().startsWith("file:") || requests.push(r.url())));
      page.on("pageerror", (e) => void errors.push(e.message));
      await page.goto(pathToFileURL(file).href);
      await page.waitForSelector("#figure-1 .plot .main-svg", { timeout: 20_000 });
      expect(await page.locator("#figure-1 .scatterlayer .trace").count()).toBe(1);
      expect(await page.locator("#figure-1 figcaption").textContent()).toBe("Figure 1. Invented curve");
      expect(await page.locator("#figure-2 .chip").count()).toBe(1);
      const code = page.locator("#cell-1 details.cell-source");
      expect(await code.getAttribute("open")).toBeNull();
      await code.locator("summary").click();
      expect(await code.getAttribute("open")).toBe("");
      expect(requests).toEqual([]);
      expect(errors).toEqual([]);
    } finally {
      await browser.close();
    }
  }, 60_000);
});
