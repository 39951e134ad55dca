/**
 * Stage 4 of the pipeline: (NotebookDocument, RunRecord) → one self-contained HTML report. Reads only plain data,
 * so the same function serves a fresh run and watch mode's prose-only re-render from the last run's records.
 *
 * Layout: title block, summary (failures, cautions), contents, the notebook's prose with each cell's folded code
 * and outputs in place, Methods, Provenance; then the run's plain-data record for tools (embedded-run-record.ts).
 * Plotly is embedded once when the report has a figure (or linked from a shared assets folder when asked).
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import type { Token } from "markdown-it";
import path from "node:path";
import { createRequire } from "node:module";
import { fileURLToPath } from "node:url";
import zlib from "node:zlib";
import { cacheRoot } from "../execute/runtime-bundle.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";
import { sevenBitText } from "./seven-bit-text.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { CellRun, RunRecord } from "../records/run-record.ts";
import { embeddedRunRecord, runRecordScript } from "./embedded-run-record.ts";
import { cssString, escapeHtml } from "./escape.ts";
import { highlight, prewarmHighlighting } from "./highlight.ts";
import { labelHeadings, proseMarkdown, type Heading } from "./markdown.ts";
import { renderMethods } from "./methods-section.ts";
import { prewarmOutputs, renderOutputs } from "./render-output.ts";
import { reportModel, type CellView, type ReportModel } from "./report-model.ts";
import type { CellFenceEnv } from "./cell-fences.ts";
import type { MathEnv } from "./prose-math.ts";
import { renderRunDetails } from "./run-details.ts";
import { carriedSources, sourcesScript } from "./carried-sources.ts";
import { renderSummary } from "./summary.ts";
import { renderRecordHead } from "./record-head.ts";
import { describeCells } from "../text/cell-numbers.ts";

/** Options of the report writer. */
export interface ReportOptions {
  /** Link Plotly from this folder (a URL relative to the report) instead of embedding it. */
  readonly assetsHref?: string;
}

/*
 * report.css is embedded byte for byte in every report (so it carries no comments of its own about this). Print
 * (`@media print` there): A4 margins, a 10 pt root size, `break-inside: avoid` on figures, tables, rows, boxes and
 * swatch pairs. Never `break-before: avoid` on a table caption: it glues tables to the text before them, and
 * Chromium then slices a later figure. No Plotly mode bar in print. Swatch patches are framed by a border, not an
 * outline: Chromium paints an outline onto the previous page. `.plot-figure` is at most 660 px wide because Plotly
 * draws for the screen and does not redraw for print: a wider plot would be cut at the page edge. Each report adds a
 * `<style media="print">` with `@page` margin boxes for its title (`pageMarginStyle`, `cssString` in escape.ts)
 * and page numbers. Check a change with Chromium's `--print-to-pdf` and `pdftoppm`; the browser tests measure what
 * can be measured.
 */
const require = createRequire(import.meta.url);
const here = path.dirname(fileURLToPath(import.meta.url));
const CSS = fs.readFileSync(path.join(here, "report.css"), "utf8");
const FIGURES_CLIENT = fs.readFileSync(path.join(here, "figures-client.js"), "utf8");
const PLOTLY_LOADER = fs.readFileSync(path.join(here, "plotly-loader.js"), "utf8");
const PLOTLY_PATH = require.resolve("plotly.js-dist-min/plotly.min.js");
const PLOTLY_VERSION = (
  JSON.parse(fs.readFileSync(path.join(path.dirname(PLOTLY_PATH), "package.json"), "utf8")) as {
    version: string;
  }
).version;
/** File name of the shared Plotly copy in an assets folder. */
export const PLOTLY_ASSET = `plotly-${PLOTLY_VERSION}.min.js`;
let plotlySource: string | undefined;

/** The Plotly script embedded in reports (read once per process). */
export function plotlyScript(): string {
  plotlySource ??= fs.readFileSync(PLOTLY_PATH, "utf8");
  return plotlySource;
}

/** Copies the shared assets (Plotly) into `folder` unless an identical copy is there. */
export function writeSharedAssets(folder: string): void {
  fs.mkdirSync(folder, { recursive: true });
  const target = path.join(folder, PLOTLY_ASSET);
  const source = plotlyScript();
  try {
    if (fs.statSync(target).size === Buffer.byteLength(source)) return;
  } catch {
    // not there yet
  }
  const temporary = `${target}.${process.pid}.tmp`;
  fs.writeFileSync(temporary, source);
  fs.renameSync(temporary, target);
}

let embeddedPlotly: { readonly text: string; readonly bytes: Buffer } | undefined;

/**
 * Plotly as embedded in a report: gzip-compressed (level 9) and written as seven-bit text (seven-bit-text.ts) in a
 * `<script type="application/gzip" id="tristim-plotly-gzip" data-bytes="n">` element, then plotly-loader.js,
 * which unpacks it with the browser's DecompressionStream: about 1.7 MB instead of 4.8 MB (base64 would need 2.0),
 * still offline. zlib's output depends only on the input, the level and zlib's version, so reproducible reports
 * stay byte for byte the same. The two script elements are made once per Plotly, zlib and loader version (0.2 s)
 * and cached on disk as the UTF-8 bytes a report holds, so a run reads them and writes them out as they are; the
 * text is decoded only when asked for.
 */
export function embeddedPlotlyScript(): { readonly text: string; readonly bytes: Buffer } {
  if (!embeddedPlotly) {
    const bytes = embeddedPlotlyBytes();
    let text: string | undefined;
    embeddedPlotly = {
      bytes,
      get text() {
        return (text ??= bytes.toString("utf8"));
      },
    };
  }
  return embeddedPlotly;
}

/** The embedded Plotly's bytes, from the disk cache when there. */
function embeddedPlotlyBytes(): Buffer {
  const loader = createHash("sha256").update(PLOTLY_LOADER).digest("hex").slice(0, 12);
  const cache = path.join(
    cacheRoot(),
    "assets",
    `plotly-${PLOTLY_VERSION}-zlib-${process.versions.zlib}-level9-loader-${loader}.html`,
  );
  try {
    return fs.readFileSync(cache);
  } catch {
    // not cached yet
  }
  const gzip = zlib.gzipSync(plotlyScript(), { level: 9 });
  const bytes = Buffer.from(
    `<script type="application/gzip" id="tristim-plotly-gzip" data-bytes="${gzip.length}">${sevenBitText(gzip)}</script>\n` +
      `<script>${PLOTLY_LOADER}</script>`,
    "utf8",
  );
  try {
    fs.mkdirSync(path.dirname(cache), { recursive: true });
    writeFileAtomic(cache, [bytes]);
  } catch {
    // a cache that cannot be written only costs time
  }
  return bytes;
}

/** The report as the text before the embedded Plotly, whether Plotly is embedded there, and the text after. */
export interface ReportParts {
  readonly before: string;
  readonly embedsPlotly: boolean;
  readonly after: string;
}

/** Renders the report HTML for a document and the record of its run. */
export function renderReport(
  document: NotebookDocument,
  run: RunRecord,
  options: ReportOptions = {},
): string {
  const parts = renderReportParts(document, run, options);
  return parts.before + (parts.embedsPlotly ? embeddedPlotlyScript().text : "") + parts.after;
}

/** The report in parts, so a writer can write the (cached) Plotly bytes without copying them into the page. */
export function renderReportParts(
  document: NotebookDocument,
  run: RunRecord,
  options: ReportOptions = {},
): ReportParts {
  const model = reportModel(document, run);
  const { notebookDir } = model;
  const env: CellFenceEnv & MathEnv = {
    mathFile: document.path,
    cellsByFence: model.cellsByFence,
    renderCell: (view) => renderCell(view, model),
  };

  const tokens = proseMarkdown.parse(document.body, env);
  const title = takeTitle(document, tokens);
  const used = new Set(["contents", "methods", "run-record", "summary", "checks", "cautions"]);
  const headings = labelHeadings(tokens, used);
  const body = proseMarkdown.renderer.render(tokens, proseMarkdown.options, env);

  const methods = renderMethods(run, "methods");
  const contentsEntries: Heading[] = headings.filter((h) => h.level <= 3);
  // The appendices sit at the level of the notebook's top headings (h1 or h2), not indented under the last one.
  const topLevel = Math.min(2, ...contentsEntries.map((h) => h.level));
  if (methods) contentsEntries.push({ level: topLevel, text: "Methods", id: "methods" });
  contentsEntries.push({ level: topLevel, text: "Provenance", id: "run-record" });
  const hasFigures = /class="plot-figure"/.test(body);
  const sources = carriedSources(document, run, { linkAssets: options.assetsHref !== undefined });
  const embedsPlotly = hasFigures && options.assetsHref === undefined;
  const plotlyLink =
    hasFigures && options.assetsHref !== undefined
      ? `<script src="${escapeHtml(`${options.assetsHref.replace(/\/$/, "")}/${PLOTLY_ASSET}`)}"></script>`
      : "";

  const before = `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${escapeHtml(`${run.tool.name} ${run.tool.version}`)}">
<title>${escapeHtml(run.batch ? `${title} — ${path.basename(String(run.inputs[run.batch.input]))}` : title)}</title>
<style>${CSS}</style>
${pageMarginStyle(run.batch ? `${title} — ${path.basename(String(run.inputs[run.batch.input]))}` : title)}
</head>
<body>
<main class="report">
${renderRecordHead(document, run, title)}
${renderSummary({ document, run, notebookDir })}
${renderContents(contentsEntries)}
<article class="report-body">
${body}
</article>
${methods}
${renderRunDetails(document, run, "run-record", { ...(hasFigures ? { plotlyVersion: PLOTLY_VERSION } : {}), sources })}
<footer class="report-footer">Made with ${escapeHtml(run.tool.name)} ${escapeHtml(run.tool.version)} from ${escapeHtml(path.basename(document.path))}.</footer>
</main>
${runRecordScript(embeddedRunRecord(document, run, title))}
${sourcesScript(sources)}
${plotlyLink}`;
  const after = `
${hasFigures ? `<script>${FIGURES_CLIENT}</script>` : ""}

</body>
</html>
`;
  return { before, embedsPlotly, after };
}

/** Printed pages carry the report's title at the foot on the left and "page n of N" on the right (CSS @page margin boxes). */
function pageMarginStyle(title: string): string {
  const box = "font-family: system-ui, sans-serif; font-size: 7.5pt; color: #5a6470;";
  return (
    `<style media="print">@page { @bottom-left { content: ${cssString(title)}; ${box} } ` +
    `@bottom-right { content: "page " counter(page) " of " counter(pages); ${box} } }</style>`
  );
}

/** The report's title: the front matter's, else the first h1 (taken out of the tokens), else the file name. */
function takeTitle(document: NotebookDocument, tokens: Token[]): string {
  let title = document.frontMatter.title;
  if (title === undefined) {
    const h1 = tokens.findIndex((t: Token) => t.type === "heading_open" && t.tag === "h1");
    if (h1 >= 0) {
      title = tokens[h1 + 1]?.content ?? "";
      tokens.splice(h1, 3);
    }
  }
  return title || path.basename(document.path).replace(/\.(md|markdown)$/i, "");
}

/** The title a notebook's report carries (as the report's title block shows it). */
export function reportTitle(document: NotebookDocument): string {
  return takeTitle(document, proseMarkdown.parse(document.body, {}));
}

function renderContents(entries: Heading[]): string {
  if (entries.length < 3) return "";
  const min = Math.min(...entries.map((e) => e.level));
  const items = entries
    .map((e) => `<li class="level-${e.level - min + 2}"><a href="#${e.id}">${escapeHtml(e.text)}</a></li>`)
    .join("");
  return `<nav class="contents" id="contents" aria-label="Contents"><h2>Contents</h2><ol${entries.length > 8 ? ' class="long"' : ""}>${items}</ol></nav>`;
}

/** The fold's sign: a small drawn page corner with lines of text, an SVG of our own (not a triangle). */
const FOLD_SIGN =
  '<svg class="fold-sign" viewBox="0 0 16 16" width="15" height="15" aria-hidden="true"><path d="M3 1.5h7l3 3v10H3z" fill="none" stroke="currentColor" stroke-width="1.3" stroke-linejoin="round"/><path d="M10 1.5v3h3" fill="none" stroke="currentColor" stroke-width="1.1"/><path class="fold-lines" d="M5.2 7.5h5.6M5.2 10h5.6M5.2 12.5h3.4" stroke="currentColor" stroke-width="1.1" stroke-linecap="round"/></svg>';

/** The language a cell's source is highlighted in. */
const CELL_LANGUAGE = "typescript";

/**
 * Does the report's costly parts while the cells run, so that the report written after the last cell finds them
 * made: highlighting of every cell's source starts at once, one cell per turn of the event loop (highlight.ts keeps what it
 * made; highlight.js builds its TypeScript grammar on first use, about 35 ms, which a notebook refused for a syntax
 * error would otherwise spend after its compile); the function returned, given as runDocument's `onCell`, encodes
 * each cell's figure specs as they come (prewarmOutputs) and reads the packed Plotly once a figure has come.
 */
export function prewarmReport(document: NotebookDocument): (run: CellRun) => void {
  prewarmHighlighting(document.cells.map((c) => ({ code: c.code, language: CELL_LANGUAGE })));
  let plotly = false;
  return (run) => {
    prewarmOutputs(run.outputs);
    if (!plotly && run.outputs.some((o) => o.kind === "figure")) {
      plotly = true;
      setImmediate(() => {
        try {
          embeddedPlotlyScript();
        } catch {
          // The report itself says what is wrong with Plotly.
        }
      }).unref();
    }
  };
}

function renderCell(view: CellView, { run, notebookDir }: ReportModel): string {
  const { cell } = view;
  const status = view.run?.status ?? "not-run";
  const number = cell.index + 1;
  const range =
    cell.lastLine > cell.firstLine ? `lines ${cell.firstLine}–${cell.lastLine}` : `line ${cell.firstLine}`;
  const code = `<pre><code class="hljs language-ts">${highlight(cell.code, CELL_LANGUAGE)}</code></pre>`;
  let source = "";
  if (status === "listing") {
    source = `<div class="listing"><p class="listing-label">Listing, not run: cell ${number}, ${range}</p>${code}</div>`;
  } else if (!cell.options.hideSource) {
    // The fold names what it holds in the words of a lab record; the drawn brackets turn to say open or closed.
    source = `<details class="cell-source"${cell.options.showSource ? " open" : ""}><summary>${FOLD_SIGN}<span class="fold-words">Calculation, cell ${number}, ${range}</span><span class="fold-hint"></span></summary>${code}</details>`;
  }
  let notRun = "";
  if (status === "not-run") {
    const failed = run.cells
      .filter((c) => c.status === "failed" && c.index < cell.index && !c.failureAllowed)
      .map((c) => c.index + 1);
    notRun = `<p class="not-run-label">Cell ${number} was not run${failed.length ? ` because ${describeCells(failed.slice(-1))} failed` : ""}.</p>`;
  }
  const outputs = renderOutputs(view.outputs, notebookDir);
  return `<section class="cell cell-${status}${status === "not-run" ? " not-run" : ""}" id="cell-${number}" data-line="${cell.fenceLine}">${source}${notRun}${
    outputs ? `<div class="cell-outputs">${outputs}</div>` : ""
  }</section>\n`;
}
