/**
 * The report's look, checked in Chromium (Debian's, driven by playwright-core) on a bundled notebook rendered by the
 * CLI: screenshots of the title block, an opened fold, a caution panel and printed pages go to test/.artifacts/ (look
 * at them after a change), and the test asserts layout facts: the outcome is the title block's most visible element
 * and is on screen without scrolling, the fold names its cell and lines, the caution is fully framed with a drawn
 * sign and a sentence-case heading, and in print no heading ends a page and no figure is cut from its caption.
 *
 * The printed pages are read back with PDF.js (pdfjs-dist, run inside the same Chromium): its text positions give
 * the last line of each page and the page of each figure's parts, and its rendering of a page is the screenshot of
 * the printed page. Skipped, saying why, only when no Chromium is installed.
 */
import { execFile } from "node:child_process";
import fs from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { promisify } from "node:util";
import { chromium, type Browser, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { CHROMIUM, NO_CHROMIUM } from "./chromium.ts";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const ARTIFACTS = path.join(ROOT, "test/.artifacts");
const NOTEBOOK = path.join(ROOT, "notebooks/filter-lot-acceptance.md");
const REPORT = path.join(ARTIFACTS, "report-look.html");
const PDF = path.join(ARTIFACTS, "report-look.pdf");
const require = createRequire(import.meta.url);
const PDFJS = path.dirname(require.resolve("pdfjs-dist/package.json"));

/** One printed page as PDF.js reads it: its text lines from top to bottom. */
interface PrintedPage {
  readonly lines: readonly string[];
}

describe.skipIf(!CHROMIUM)(
  `the report's look in Chromium${CHROMIUM ? "" : ` (skipped: ${NO_CHROMIUM})`}`,
  () => {
    let browser: Browser;
    let page: Page;

    beforeAll(async () => {
      fs.mkdirSync(ARTIFACTS, { recursive: true });
      await promisify(execFile)(
        process.execPath,
        [path.join(ROOT, "runner/bin.mjs"), "run", NOTEBOOK, "-o", REPORT, "--reproducible"],
        { cwd: ROOT, timeout: 120_000 },
      );
      browser = await chromium.launch({
        executablePath: CHROMIUM,
        args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking"],
      });
      page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
      await page.goto(pathToFileURL(REPORT).href);
      await page.waitForSelector(".plot .main-svg", { timeout: 30_000 });
    }, 180_000);

    afterAll(async () => {
      await browser?.close();
    });

    it("title block: a lab-record head whose outcome is its most visible element, on screen without scrolling", async () => {
      const head = page.locator("header.record-head");
      await head.screenshot({ path: path.join(ARTIFACTS, "look-title-block.png") });
      const facts = await page.evaluate(() => {
        const headline = document.querySelector(".record-head .outcome-headline")!;
        const box = headline.getBoundingClientRect();
        const size = (e: Element) => parseFloat(getComputedStyle(e).fontSize);
        const others = Array.from(document.querySelectorAll(".record-head *")).filter(
          (e) =>
            e !== headline && e.tagName !== "H1" && !headline.contains(e) && e.textContent!.trim() !== "",
        );
        const upper = Array.from(document.querySelectorAll(".record-head *")).filter(
          (e) => getComputedStyle(e).textTransform === "uppercase",
        );
        return {
          text: headline.textContent,
          bottom: box.bottom,
          viewport: window.innerHeight,
          headlineSize: size(headline),
          largestOther: Math.max(...others.map(size)),
          uppercase: upper.length,
          caution: document.querySelector(".record-head .outcome-caution")?.textContent ?? "",
        };
      });
      expect(facts.text).toMatch(/^All \d+ acceptance checks passed$/);
      expect(facts.bottom).toBeLessThan(facts.viewport);
      expect(facts.headlineSize).toBeGreaterThan(facts.largestOther);
      expect(facts.uppercase).toBe(0);
      expect(facts.caution).toMatch(/This report contains a caution about the use of its results/);
    });

    it("fold: a control named after the cell and its lines, that opens on a click", async () => {
      const fold = page.locator("details.cell-source").first();
      const words = (await fold.locator("summary .fold-words").textContent()) ?? "";
      expect(words).toMatch(/^Calculation, cell \d+, lines? \d+(–\d+)?$/);
      expect(await fold.locator("summary svg.fold-sign").count()).toBe(1);
      await fold.locator("summary").click();
      expect(await fold.getAttribute("open")).toBe("");
      await fold.screenshot({ path: path.join(ARTIFACTS, "look-fold.png") });
    });

    it("caution: a fully framed panel with a drawn hazard sign and a sentence-case heading", async () => {
      const caution = page.locator("aside.caution:not(.caution-repeat)").first();
      await caution.screenshot({ path: path.join(ARTIFACTS, "look-caution.png") });
      const look = await caution.evaluate((e) => {
        const s = getComputedStyle(e);
        const title = e.querySelector(".caution-title")!;
        return {
          widths: [s.borderTopWidth, s.borderRightWidth, s.borderBottomWidth, s.borderLeftWidth],
          styles: [s.borderTopStyle, s.borderRightStyle, s.borderBottomStyle, s.borderLeftStyle],
          sign: e.querySelector("svg.hazard-sign path") !== null,
          transform: getComputedStyle(title).textTransform,
          title: title.textContent ?? "",
        };
      });
      expect(new Set(look.widths).size).toBe(1);
      expect(look.styles).toEqual(["solid", "solid", "solid", "solid"]);
      expect(look.sign).toBe(true);
      expect(look.transform).toBe("none");
      expect(look.title).toMatch(/^[A-Z][^A-Z]*$/); // "Eye protection: informative only"
    });

    it("print: no heading ends a page, no figure is cut from its caption, and a page renders as an image", async () => {
      // Headings and figures as the report has them, to find in the printed text.
      const { headings, figures } = await page.evaluate(() => ({
        headings: Array.from(document.querySelectorAll(".report-body h2, .report-body h3, section > h2")).map(
          (h) => h.textContent!.trim(),
        ),
        figures: Array.from(document.querySelectorAll("figure.plot-figure")).map((f) => ({
          title: f.querySelector(".gtitle")?.textContent?.trim() ?? "",
          label: f.querySelector("figcaption .label")!.textContent!.trim(),
        })),
      }));
      expect(headings.length).toBeGreaterThan(5);
      expect(figures.length).toBeGreaterThan(2);
      await page.emulateMedia({ media: "print" });
      fs.writeFileSync(PDF, await page.pdf({ format: "A4", printBackground: true, preferCSSPageSize: true }));
      await page.emulateMedia({ media: "screen" });

      const reader = await browser.newPage({ viewport: { width: 900, height: 1300 } });
      try {
        const printed = await readPdf(reader, PDF);
        expect(printed.length).toBeGreaterThan(3);
        // The text read back is the report's: most headings come back as lines of their own (long ones may wrap).
        const found = headings.filter((h) => printed.some((p) => p.lines.includes(h)));
        expect(found.length).toBeGreaterThan(headings.length / 2);
        // The page-foot line (title, "page n of N") is not body text: the last line above it is what counts.
        const lastBodyLine = (p: PrintedPage) =>
          [...p.lines]
            .reverse()
            .find((l) => !/^page \d+ of \d+$/.test(l) && !l.startsWith("Incoming inspection")) ?? "";
        printed.forEach((p, i) => {
          if (i === printed.length - 1) return;
          const last = lastBodyLine(p);
          expect(headings, `page ${i + 1} ends with the heading "${last}"`).not.toContain(last);
        });
        for (const figure of figures.filter((f) => f.title !== "")) {
          const pageOf = (text: string) => printed.findIndex((p) => p.lines.some((l) => l.includes(text)));
          const top = pageOf(figure.title);
          const caption = pageOf(figure.label);
          expect(top, `"${figure.title}" printed`).toBeGreaterThanOrEqual(0);
          expect(caption, `${figure.label} is on the page of its plot's title "${figure.title}"`).toBe(top);
        }
        await reader
          .locator("canvas#page")
          .screenshot({ path: path.join(ARTIFACTS, "look-printed-page.png") });
      } finally {
        await reader.close();
      }
    }, 120_000);
  },
);

/**
 * Reads a PDF with PDF.js inside Chromium: each page's text as lines (items grouped by their baseline, top to
 * bottom), and page 1 rendered onto `canvas#page` for a screenshot. PDF.js is served from node_modules through a
 * routed origin, so nothing is fetched from outside.
 */
async function readPdf(page: Page, file: string): Promise<PrintedPage[]> {
  const origin = "http://pdf-reader.invalid";
  await page.route(`${origin}/**`, async (route) => {
    const name = new URL(route.request().url()).pathname;
    if (name === "/") {
      return route.fulfill({ contentType: "text/html", body: '<!doctype html><canvas id="page"></canvas>' });
    }
    if (name === "/report.pdf")
      return route.fulfill({ contentType: "application/pdf", body: fs.readFileSync(file) });
    const local = path.join(PDFJS, "build", path.basename(name));
    return route.fulfill({ contentType: "text/javascript", body: fs.readFileSync(local) });
  });
  await page.goto(`${origin}/`);
  // A module script loads PDF.js (an import() inside evaluate would be rewritten by the test's bundler).
  await page.addScriptTag({
    type: "module",
    content: `import * as pdfjs from "${origin}/pdf.mjs"; window.pdfjsForTest = pdfjs;`,
  });
  await page.waitForFunction(() => "pdfjsForTest" in window, undefined, { timeout: 20_000 });
  return page.evaluate(async (base) => {
    const pdfjs = (window as unknown as { pdfjsForTest: unknown }).pdfjsForTest as {
      GlobalWorkerOptions: { workerSrc: string };
      getDocument: (src: string) => { promise: Promise<PdfDocument> };
    };
    interface PdfPage {
      getTextContent(): Promise<{ items: { str: string; transform: number[] }[] }>;
      getViewport(o: { scale: number }): { width: number; height: number };
      render(o: { canvasContext: CanvasRenderingContext2D; viewport: unknown }): { promise: Promise<void> };
    }
    interface PdfDocument {
      numPages: number;
      getPage(n: number): Promise<PdfPage>;
    }
    pdfjs.GlobalWorkerOptions.workerSrc = `${base}/pdf.worker.mjs`;
    const doc = await pdfjs.getDocument(`${base}/report.pdf`).promise;
    const pages: { lines: string[] }[] = [];
    for (let n = 1; n <= doc.numPages; n++) {
      const p = await doc.getPage(n);
      const { items } = await p.getTextContent();
      const rows = new Map<number, { x: number; s: string }[]>();
      for (const item of items) {
        if (!item.str.trim()) continue;
        const y = Math.round(item.transform[5]! / 2) * 2;
        rows.set(y, [...(rows.get(y) ?? []), { x: item.transform[4]!, s: item.str }]);
      }
      const lines = [...rows.entries()]
        .sort((a, b) => b[0] - a[0])
        .map(([, parts]) =>
          parts
            .sort((a, b) => a.x - b.x)
            .map((q) => q.s)
            .join(" ")
            .replace(/\s+/g, " ")
            .trim(),
        );
      pages.push({ lines });
      if (n === 1) {
        const viewport = p.getViewport({ scale: 1.4 });
        const canvas = document.getElementById("page") as HTMLCanvasElement;
        canvas.width = viewport.width;
        canvas.height = viewport.height;
        await p.render({ canvasContext: canvas.getContext("2d")!, viewport }).promise;
      }
    }
    return pages;
  }, origin);
}
