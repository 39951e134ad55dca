/**
 * Reports fetch nothing: a swatch's css accepts only colour values (hex and the CSS Color 4 colour functions), and
 * opening a report in headless Chromium (playwright-core, the shared Chromium lookup) makes no request at all
 * besides the page's own file. Skipped with a message when no Chromium is installed.
 */
import fs from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { chromium } from "playwright-core";
import { describe, expect, it } from "vitest";
import { swatchRecords } from "../../cells/swatch-record.ts";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { parseNotebook } from "../../runner/parse/parse-notebook.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import { CHROMIUM, NO_CHROMIUM } from "../browser/chromium.ts";
import { notebookFile, tempFolder, ts } from "./helpers.ts";
import { tristimCommand } from "./bad-input-helpers.ts";
import { okCell, runRecord } from "./run-records.ts";

const LIMIT = 240_000;

const FETCHING_CSS = [
  "url(//tracker.invalid/pixel)",
  "url(http://tracker.invalid/p.png)",
  "image-set(url(a.png) 1x)",
  "var(--x)",
  "red",
  "rgb(1 2 3) url(x)",
  "color(display-p3 1 0 0) , url(x)",
  "linear-gradient(red, blue)",
  "rgb(calc(1) 2 3)",
  "color(--custom 1 2 3)",
];
// CSS Color 4 syntax (W3C CSS Color Module Level 4, §4–§10: hex, rgb/hsl/hwb, lab/lch, oklab/oklch, color()).
const COLOURS = [
  "#abc",
  "#aabbccdd",
  "rgb(10 20 30)",
  "rgba(10, 20, 30, 0.5)",
  "hsl(120deg 50% 50% / 0.5)",
  "lab(50% 20 -30)",
  "oklch(0.7 0.1 120)",
  "color(display-p3 1 0.2 0.1)",
  "color(rec2020 0.5 0.5 0.5 / 50%)",
  "color(xyz-d65 0.3 0.3 0.3)",
];

describe("swatch css holds only colour values", () => {
  it("refuses anything that is not a colour value, naming the swatch and the field", () => {
    for (const css of FETCHING_CSS)
      expect(() => swatchRecords([{ label: "lot 7", hex: "#808080", css }]), css).toThrow(
        /swatch 1 \("lot 7"\): css must be a CSS colour value/,
      );
  });

  it("accepts hex and the CSS colour functions", () => {
    for (const css of COLOURS) expect(swatchRecords([{ label: "c", hex: "#808080", css }])[0]!.css).toBe(css);
  });

  it(
    "the command fails the cell with a clear error for url() css",
    async () => {
      const notebook = notebookFile(
        `# Pixel\n\n${ts('showSwatches([{ label: "x", hex: "#808080", css: "url(//tracker.invalid/pixel)" }]);')}`,
      );
      const r = await tristimCommand(["run", notebook]);
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err).toContain("css must be a CSS colour value");
      expect(fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8")).not.toContain("background:url");
    },
    LIMIT,
  );

  it("the renderer drops a css that is not a colour even if a record carries one", () => {
    const document = parseNotebook("# R\n\n```ts\n1\n```\n", "/lab/nb.md");
    const html = renderReport(
      document,
      runRecord([
        okCell(0, [
          {
            kind: "swatches",
            swatches: [{ label: "x", hex: "#808080", css: "url(//tracker.invalid/pixel)" }],
          },
        ]),
      ]),
    );
    expect(html).toContain("background:#808080;");
    expect(html).not.toContain("url(//tracker.invalid");
  });
});

describe.skipIf(!CHROMIUM)(
  `opening a report makes no request${CHROMIUM ? "" : ` (skipped: ${NO_CHROMIUM})`}`,
  () => {
    it(
      "reports with every output kind, and the example notebooks' reports, request nothing",
      async () => {
        const folder = tempFolder();
        const notebook = path.join(folder, "all.md");
        fs.writeFileSync(
          notebook,
          "---\ntitle: Everything\n---\n# Everything (invented data)\n\n![picture](http://tracker.invalid/a.png)\n\n" +
            ts(
              [
                'show("text");',
                'showTable([{ a: 1, b: "x" }]);',
                "showFigure({ data: [{ type: 'scatter', x: [1, 2], y: [3, 4] }], layout: {} }, 'Invented');",
                'showSwatches([{ label: "p3", hex: "#ff0000", css: "color(display-p3 1 0 0)" }]);',
                'showMarkdown("**bold** ![img](http://tracker.invalid/b.png)");',
                'showHtml("<img src=\\"http://tracker.invalid/c.png\\">");',
                'showCaution("Invented caution.", "Caution");',
                'check("invented", 1, { min: 0 });',
              ].join("\n"),
            ),
        );
        const reports = [notebook.replace(/\.md$/, ".html")];
        const r = await tristimCommand(["run", notebook, "--quiet"]);
        expect(r.code).toBe(EXIT.ok);
        const examples = fileURLToExamples();
        for (const example of examples) {
          const target = path.join(folder, `${path.basename(example, ".md")}.html`);
          const e = await tristimCommand(["run", example, "-o", target, "--quiet", "--reproducible"]);
          expect([EXIT.ok, EXIT.checkFailed]).toContain(e.code);
          reports.push(target);
        }
        const browser = await chromium.launch({
          executablePath: CHROMIUM,
          args: ["--no-sandbox", "--disable-gpu"],
        });
        try {
          for (const report of reports) {
            const page = await browser.newPage();
            const requests: string[] = [];
            page.on("request", (q) => void requests.push(q.url()));
            const href = pathToFileURL(report).href;
            await page.goto(href, { waitUntil: "load" });
            await page.waitForTimeout(500);
            expect(requests, report).toEqual([href]);
            if (report.endsWith("all.html")) expect(await page.locator(".image-link a").count()).toBe(2);
            await page.close();
          }
        } finally {
          await browser.close();
        }
      },
      LIMIT,
    );
  },
);

function fileURLToExamples(): string[] {
  const dir = new URL("../../notebooks/", import.meta.url).pathname;
  return fs
    .readdirSync(dir)
    .filter((f) => f.endsWith(".md"))
    .map((f) => path.join(dir, f));
}
