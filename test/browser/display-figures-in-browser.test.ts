/**
 * The display figures of lib/plot in Chromium (issue 14): the runner renders a fixture notebook of invented readings,
 * Chromium opens it, and the test reads the tick labels Plotly actually drew on the logarithmic axes (each must be a
 * plain number or a power of ten, never an SI prefix such as "100μ", and name its tick's value), checks that each
 * legend lies below its plot area (off the data), that every figure was drawn and that the page logged no errors.
 * Screenshot: test/.artifacts/display-figures.png. Skipped, saying why, when no Chromium is installed.
 */
import { mkdirSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { type Browser, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CHROMIUM, NO_CHROMIUM, launchChromium, reportByCli } from "./chromium.ts";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const ARTIFACTS = ROOT + "test/.artifacts/";
const NOTEBOOK = ROOT + "test/browser/fixtures/display-figures.md";
const REPORT = ARTIFACTS + "display-figures.html";
const SKIP_REASON = `${NO_CHROMIUM}, to run the browser test`;
if (!CHROMIUM) console.warn(`test/browser: SKIPPED – ${SKIP_REASON}`);

interface Drawn {
  title: string;
  logTicks: string[];
  plotBottom: number;
  legendTop: number | null;
}

const SUPER = "⁰¹²³⁴⁵⁶⁷⁸⁹";
function labelValue(label: string): number {
  const m = /^10(⁻?[⁰¹²³⁴⁵⁶⁷⁸⁹]+)$/.exec(label);
  if (m)
    return 10 ** Number(m[1]!.replace("⁻", "-").replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹]/g, (c) => String(SUPER.indexOf(c))));
  return /^\d+(\.\d+)?$/.test(label) ? Number(label) : NaN;
}

describe.skipIf(!CHROMIUM)(
  `display figures in Chromium${CHROMIUM ? "" : ` (skipped: ${SKIP_REASON})`}`,
  () => {
    let browser: Browser;
    let page: Page;
    const errors: string[] = [];
    let drawn: Drawn[] = [];

    beforeAll(async () => {
      mkdirSync(ARTIFACTS, { recursive: true });
      await reportByCli(NOTEBOOK, REPORT);
      browser = await launchChromium();
      page = await browser.newPage({ viewport: { width: 1000, height: 900 } });
      page.on("console", (m) => {
        if (m.type() === "error") errors.push(m.text());
      });
      page.on("pageerror", (e) => errors.push(e.message));
      await page.goto("file://" + REPORT);
      await page.waitForFunction(
        () => document.querySelectorAll(".js-plotly-plot .main-svg").length >= 4,
        null,
        {
          timeout: 60_000,
        },
      );
      drawn = await page.$$eval(".js-plotly-plot", (plots) =>
        plots.map((el) => {
          const layout = (
            el as unknown as { layout: Record<string, { type?: string } & Record<string, unknown>> }
          ).layout;
          const logAxes = Object.keys(layout).filter(
            (k) => /^[xy]axis\d*$/.test(k) && layout[k]!.type === "log",
          );
          const logTicks = logAxes.flatMap((k) =>
            Array.from(el.querySelectorAll(`.${k.replace("axis", "")}tick text`)).map(
              (n) => n.textContent ?? "",
            ),
          );
          const area = el.querySelector(".nsewdrag")!.getBoundingClientRect();
          const legend = el.querySelector(".legend");
          return {
            title: (layout.title as unknown as { text: string }).text,
            logTicks,
            plotBottom: area.bottom,
            legendTop: legend ? legend.getBoundingClientRect().top : null,
          };
        }),
      );
      await page.screenshot({ path: ARTIFACTS + "display-figures.png", fullPage: true });
    }, 180_000);

    afterAll(async () => {
      await browser?.close();
    });

    it("draws the four figures without page errors", () => {
      expect(drawn.map((d) => d.title)).toEqual([
        "Invented EOTF",
        "Invented PQ tracking",
        "Invented grey-scale tracking",
        "Invented uniformity",
      ]);
      expect(errors).toEqual([]);
    });

    it("writes every drawn log-axis tick as a plain number or a power of ten (no '100μ')", () => {
      const eotf = drawn[0]!;
      expect(eotf.logTicks.length).toBeGreaterThan(6);
      for (const d of drawn)
        for (const label of d.logTicks) {
          expect(label, `${d.title}: "${label}"`).not.toMatch(/[μµmkMG]/);
          expect(Number.isFinite(labelValue(label)), `${d.title}: "${label}"`).toBe(true);
        }
      expect(eotf.logTicks).toContain("0.001");
      expect(
        eotf.logTicks.some((l) => l.startsWith("10⁻")),
        eotf.logTicks.join(" "),
      ).toBe(true);
    });

    it("keeps each legend below its plot area, off the data", () => {
      for (const d of drawn.slice(0, 3)) {
        expect(d.legendTop, d.title).not.toBeNull();
        expect(d.legendTop!, d.title).toBeGreaterThanOrEqual(d.plotBottom);
      }
      expect(drawn[3]!.legendTop).toBeNull();
    });
  },
);
