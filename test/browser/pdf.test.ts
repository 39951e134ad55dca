/**
 * `--pdf` (issue 18): the CLI prints the figures fixture to a PDF through playwright-core and Debian's Chromium.
 * The PDF is read with pdfjs-dist (Mozilla's PDF reader, an independent library): A4 pages (595.28 × 841.89 pt, ISO 216),
 * a page count equal to the one Chromium lays out for the same report, and no figure cut by a page break — the test
 * prints the same page once more with invisible marks at the top and bottom of every figure (absolutely placed, so
 * the layout does not change: the page count is compared) and finds both marks of each figure on one page.
 * Without Chromium, --pdf says how to install one and the HTML is still written (that part needs no browser).
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { chromium } from "playwright-core";
import { getDocument } from "pdfjs-dist/legacy/build/pdf.mjs";
import { describe, expect, it } from "vitest";
import { PDF_OPTIONS, PDF_VIEWPORT } from "../../runner/report/pdf.ts";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { tempFolder, ts, writeFiles } from "../runner/helpers.ts";
import { CHROMIUM, NO_CHROMIUM } from "./chromium.ts";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const NOTEBOOK = ROOT + "test/browser/fixtures/figures-and-swatches.md";
const SKIP_REASON = `${NO_CHROMIUM}, to run the PDF test`;
if (!CHROMIUM) console.warn(`test/browser/pdf: SKIPPED – ${SKIP_REASON}`);

function tristim(args: string[], env: NodeJS.ProcessEnv = {}) {
  const r = spawnSync(process.execPath, [ROOT + "runner/bin.mjs", ...args], {
    cwd: ROOT,
    encoding: "utf8",
    timeout: 240_000,
    env: { ...process.env, ...env },
  });
  return { code: r.status, out: r.stdout, err: r.stderr };
}

/** Each page's text items. */
async function pageTexts(bytes: Uint8Array): Promise<{ pages: string[][]; sizes: number[][] }> {
  const pdf = await getDocument({ data: bytes, useSystemFonts: false, isEvalSupported: false }).promise;
  const pages: string[][] = [];
  const sizes: number[][] = [];
  for (let i = 1; i <= pdf.numPages; i++) {
    const page = await pdf.getPage(i);
    const [, , w, h] = page.view;
    sizes.push([w!, h!]);
    const content = await page.getTextContent();
    pages.push(content.items.map((item) => ("str" in item ? item.str : "")));
  }
  return { pages, sizes };
}

describe.skipIf(!CHROMIUM)(`--pdf${CHROMIUM ? "" : ` (skipped: ${SKIP_REASON})`}`, () => {
  it("prints A4 pages after the figures are drawn, and cuts no figure", async () => {
    const folder = tempFolder("tristim-pdf-");
    const report = path.join(folder, "figures.html");
    const result = tristim(["run", NOTEBOOK, "-o", report, "--pdf"]);
    expect(result.code, result.err).toBe(EXIT.ok);
    const printed = await pageTexts(new Uint8Array(fs.readFileSync(path.join(folder, "figures.pdf"))));
    expect(printed.pages.length).toBeGreaterThan(1);
    // A4 is 210 × 297 mm = 595.28 × 841.89 pt (ISO 216); Chromium rounds the page box to whole device pixels.
    for (const [w, h] of printed.sizes) {
      expect(Math.abs(w! - 595.28)).toBeLessThan(1.5);
      expect(Math.abs(h! - 841.89)).toBeLessThan(1.5);
    }
    // The figures were drawn before printing: their axis tick labels are text in the PDF.
    const all = printed.pages.flat().join(" ");
    expect(all).toContain("Figure 1.");
    expect(all).toMatch(/0\.[1-7]\b/);

    // The same report, marked, printed the same way.
    const browser = await chromium.launch({
      executablePath: CHROMIUM,
      args: ["--headless", "--no-sandbox", "--disable-gpu"],
    });
    try {
      const page = await browser.newPage({ viewport: PDF_VIEWPORT });
      await page.goto(pathToFileURL(report).href);
      await page.waitForSelector('body[data-figures="drawn"]', { timeout: 60_000 });
      const count = await page.evaluate(() => {
        const figures = Array.from(document.querySelectorAll<HTMLElement>("figure.plot-figure"));
        figures.forEach((figure, i) => {
          for (const [where, css] of [
            ["top", "top:0"],
            ["bottom", "bottom:0"],
          ] as const) {
            const mark = document.createElement("span");
            mark.textContent = `MARK-${where}-${i + 1}`;
            mark.setAttribute(
              "style",
              `position:absolute;${css};left:0;font-size:3px;color:#fff;line-height:1`,
            );
            figure.appendChild(mark);
          }
          if (getComputedStyle(figure).position === "static") figure.style.position = "relative";
        });
        return figures.length;
      });
      expect(count).toBeGreaterThan(0);
      const marked = await pageTexts(new Uint8Array(await page.pdf(PDF_OPTIONS)));
      expect(marked.pages.length).toBe(printed.pages.length);
      for (let n = 1; n <= count; n++) {
        const top = marked.pages.findIndex((texts) => texts.some((t) => t.includes(`MARK-top-${n}`)));
        const bottom = marked.pages.findIndex((texts) => texts.some((t) => t.includes(`MARK-bottom-${n}`)));
        expect(top, `figure ${n}'s top mark`).toBeGreaterThanOrEqual(0);
        expect(bottom, `figure ${n} is cut by a page break`).toBe(top);
      }
    } finally {
      await browser.close();
    }
  }, 240_000);
});

describe("--pdf without Chromium", () => {
  it("says how to install one, still writes the HTML and exits with 4", () => {
    const folder = tempFolder("tristim-pdf-none-");
    writeFiles(folder, { "nb.md": "# Invented\n\n" + ts("show(1);") });
    const result = tristim(["run", path.join(folder, "nb.md"), "--pdf"], {
      CHROMIUM_PATH: "/nonexistent/chromium",
    });
    expect(result.code).toBe(EXIT.internal);
    expect(result.err).toContain("apt-get install chromium");
    expect(result.err).toContain("CHROMIUM_PATH");
    expect(fs.existsSync(path.join(folder, "nb.html"))).toBe(true);
    expect(fs.existsSync(path.join(folder, "nb.pdf"))).toBe(false);
  }, 120_000);
});
