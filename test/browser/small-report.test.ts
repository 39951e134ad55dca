/**
 * Smaller reports (issue 18): a report with figures embeds Plotly gzip-compressed as seven-bit text and unpacks it in
 * the page with the browser's DecompressionStream. Checked in Chromium (Debian's, through playwright-core): the file
 * is at most 2.2 MB, it makes no request beyond its own file, every figure is drawn with the traces its spec holds,
 * and the figures are still drawn in print. Skipped, saying why, only when no Chromium is installed.
 */
import { mkdirSync, statSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { type Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CHROMIUM, NO_CHROMIUM, launchChromium, reportByCli } from "./chromium.ts";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const ARTIFACTS = ROOT + "test/.artifacts/";
const NOTEBOOK = ROOT + "test/browser/fixtures/figures-and-swatches.md";
const REPORT = ARTIFACTS + "small-report.html";
const SKIP_REASON = `${NO_CHROMIUM}, to run the browser test`;
if (!CHROMIUM) console.warn(`test/browser/small-report: SKIPPED – ${SKIP_REASON}`);

interface Figure {
  specTraces: number;
  drawnTraces: number;
  width: number;
}

describe.skipIf(!CHROMIUM)(
  `a compressed report in Chromium${CHROMIUM ? "" : ` (skipped: ${SKIP_REASON})`}`,
  () => {
    let browser: Browser;
    beforeAll(async () => {
      mkdirSync(ARTIFACTS, { recursive: true });
      await reportByCli(NOTEBOOK, REPORT);
      browser = await launchChromium();
    }, 180_000);
    afterAll(async () => {
      await browser?.close();
    });

    it("weighs at most 2.2 MB with its figures and Plotly inside", () => {
      expect(statSync(REPORT).size).toBeLessThanOrEqual(2_200_000);
    });

    it("draws every figure offline, on screen and in print", async () => {
      const page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
      const requests: string[] = [];
      const errors: string[] = [];
      page.on("request", (r) => void (r.url() !== `file://${REPORT}` && requests.push(r.url())));
      page.on("pageerror", (e) => void errors.push(e.message));
      page.on("console", (m) => void (m.type() === "error" && errors.push(m.text())));
      await page.route(/^(?!file:)/, (route) => route.abort());
      await page.goto(`file://${REPORT}`);
      await page.waitForSelector('body[data-figures="drawn"]', { timeout: 60_000 });
      const figures = (): Promise<Figure[]> =>
        page.$$eval(".plot[data-spec]", (nodes) =>
          nodes.map((node) => {
            const spec = JSON.parse(
              document.getElementById(node.getAttribute("data-spec")!)!.textContent!,
            ) as {
              data: unknown[];
            };
            return {
              specTraces: spec.data.length,
              // Plotly draws each trace as a .trace group (scatter) or image/heatmap layer; count what it made.
              drawnTraces: ((node as HTMLElement & { _fullData?: unknown[] })._fullData ?? []).length,
              width: node.querySelector("svg.main-svg")?.getBoundingClientRect().width ?? 0,
            };
          }),
        );
      const screen = await figures();
      expect(screen.length).toBeGreaterThan(0);
      for (const f of screen) {
        expect(f.drawnTraces).toBe(f.specTraces);
        expect(f.width).toBeGreaterThan(100);
      }
      await page.emulateMedia({ media: "print" });
      const printed = await figures();
      expect(printed.map((f) => f.drawnTraces)).toEqual(screen.map((f) => f.specTraces));
      expect(printed.every((f) => f.width > 100)).toBe(true);
      expect(errors).toEqual([]);
      expect(requests).toEqual([]);
      await page.close();
    }, 120_000);
  },
);
