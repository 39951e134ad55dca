/**
 * HTML for each kind of output record. One function per kind, looked up by `kind`; a record of a kind this writer
 * does not know is shown as a short note instead of breaking the report.
 */
import type {
  CautionRecord,
  CheckRecord,
  ConsoleRecord,
  ErrorRecord,
  FigureRecord,
  HtmlRecord,
  MarkdownRecord,
  NoteRecord,
  OutputRecord,
  SwatchesRecord,
  TableRecord,
  ValueRecord,
} from "../../cells/records.ts";
import type { OutputView } from "./report-model.ts";
import { keepsOnOneLine } from "./cell-wrap.ts";
import { limitsText, marginText, valueText, decisionText, OUTCOME_WORDS } from "../text/check-text.ts";
import { escapeHtml, jsonForScript } from "./escape.ts";
import { renderCellMarkdown } from "./markdown.ts";
import { renderSwatchFigure } from "./render-swatches.ts";
import { hazardSign } from "./marks.ts";
import { displayLocation, errorTitle } from "../text/error-text.ts";

/** A renderer of one kind: the record, its place in the report, and the notebook's folder (for paths). */
type Renderers = {
  [K in OutputRecord["kind"]]: (
    record: Extract<OutputRecord, { kind: K }>,
    view: OutputView,
    notebookDir: string,
  ) => string;
};

const renderers: Renderers = {
  console: renderConsole,
  value: renderValue,
  table: renderTable,
  figure: renderFigure,
  swatches: renderSwatches,
  markdown: renderMarkdown,
  html: renderHtml,
  caution: renderCaution,
  check: (_record, view) => renderChecks([view]),
  note: renderNote,
  error: renderError,
};

/** HTML for one output record. */
export function renderOutput(view: OutputView, notebookDir: string): string {
  const { record } = view;
  const render = (
    renderers as Record<string, ((r: OutputRecord, v: OutputView, dir: string) => string) | undefined>
  )[record.kind];
  if (!render)
    return `<p class="out-note">An output of kind “${escapeHtml(String(record.kind))}” that this version cannot show.</p>`;
  return render(record, view, notebookDir);
}

/** HTML for a cell's outputs in order; consecutive checks share one table. */
export function renderOutputs(views: readonly OutputView[], notebookDir: string): string {
  const parts: string[] = [];
  for (let i = 0; i < views.length; i++) {
    if (views[i]!.record.kind !== "check") {
      parts.push(renderOutput(views[i]!, notebookDir));
      continue;
    }
    let j = i;
    while (j + 1 < views.length && views[j + 1]!.record.kind === "check") j++;
    parts.push(renderChecks(views.slice(i, j + 1)));
    i = j;
  }
  return parts.join("\n");
}

/** A table of acceptance checks: result (word and symbol, not colour alone), label, value, limits. */
function renderChecks(views: readonly OutputView[]): string {
  const rows = views
    .map((view) => {
      const r = view.record as CheckRecord;
      const id = view.anchor!;
      const margin = marginText(r);
      const decision = decisionText(r);
      const detail =
        (r.detail ? `<span class="check-detail">${escapeHtml(r.detail)}</span>` : "") +
        (decision ? `<span class="check-detail check-decision">${escapeHtml(decision)}</span>` : "");
      const word = r.decision ? OUTCOME_WORDS[r.decision.outcome] : r.passed ? "pass" : "FAIL";
      const result = r.passed
        ? `<td class="check-result"><span class="check-mark" aria-hidden="true">✓</span> ${word}</td>`
        : `<td class="check-result"><span class="check-mark" aria-hidden="true">✗</span> ${word}</td>`;
      const measured = r.limits
        ? `<td class="num check-value">${escapeHtml(valueText(r))}${margin ? `<span class="check-margin">${escapeHtml(margin)}</span>` : ""}</td><td class="check-limits">${escapeHtml(limitsText(r))}</td>`
        : `<td class="num check-value">${escapeHtml(valueText(r))}</td><td class="check-limits">condition</td>`;
      return `<tr class="check ${r.passed ? "check-pass" : "check-fail"}" id="${id}">${result}<td class="check-label">${escapeHtml(r.label)}${detail}</td>${measured}</tr>`;
    })
    .join("");
  return (
    `<div class="table-scroll"><table class="checks"><thead><tr><th scope="col">Result</th><th scope="col">Acceptance check</th>` +
    `<th scope="col" class="num">Value</th><th scope="col">Limits</th></tr></thead><tbody>${rows}</tbody></table></div>`
  );
}

function renderConsole(record: ConsoleRecord): string {
  const label = record.stream === "stderr" ? `<span class="stream-label">error stream</span>` : "";
  return `<pre class="out-console out-${record.stream}">${label}${escapeHtml(record.text.replace(/\n$/, ""))}</pre>`;
}

function renderValue(record: ValueRecord): string {
  return `<pre class="out-value">${escapeHtml(record.text)}</pre>`;
}

function renderTable(record: TableRecord, view: OutputView): string {
  const number = view.number!;
  const id = `table-${number}`;
  // A table the cell gave no caption is described by its columns, so no bare "Table 2." is printed.
  const described =
    record.caption ??
    `Columns: ${record.columns.map((c) => `${c.label}${c.unit ? ` (${c.unit})` : ""}`).join(", ")}.`;
  const caption = `<figcaption><span class="label">Table ${number}.</span> ${escapeHtml(described)}</figcaption>`;
  const head = record.columns
    .map(
      (c) =>
        `<th scope="col"${c.numeric ? ' class="num"' : ""}>${escapeHtml(c.label)}${c.unit ? `<span class="unit">${escapeHtml(c.unit)}</span>` : ""}</th>`,
    )
    .join("");
  const body = record.rows
    .map(
      (row) =>
        `<tr>${row.map((cell, i) => `<td${cellClass(cell, record.columns[i]?.numeric === true)}>${escapeHtml(cell)}</td>`).join("")}</tr>`,
    )
    .join("\n");
  const more =
    record.totalRows > record.rows.length
      ? `<p class="out-note">Table truncated: the first ${record.rows.length.toLocaleString("en-US")} of ${record.totalRows.toLocaleString("en-US")} rows are shown.</p>`
      : "";
  const wide = record.columns.length >= WIDE_TABLE_COLUMNS ? ' class="wide"' : "";
  return `<figure class="table-figure" id="${id}">${caption}<div class="table-scroll"><table${wide}><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table></div>${more}</figure>`;
}

/** Tables with this many columns or more are set tighter in print, so they fit the width of an A4 page. */
const WIDE_TABLE_COLUMNS = 9;

/** The class attribute of a table cell: numbers right-aligned, short codes and values kept on one line. */
function cellClass(text: string, numeric: boolean): string {
  if (numeric) return ' class="num"';
  return keepsOnOneLine(text) ? ' class="one-line"' : "";
}

function renderFigure(record: FigureRecord, view: OutputView): string {
  const number = view.number!;
  const id = `figure-${number}`;
  const caption = record.caption ?? plotTitle(record.spec);
  return (
    `<figure class="plot-figure" id="${id}"><div class="plot" data-spec="${id}-spec" role="img" aria-label="Figure ${number}"><noscript>This figure is drawn by JavaScript, which is turned off.</noscript></div>` +
    `<script type="application/json" id="${id}-spec">${specJson(record.spec)}</script>` +
    `<figcaption><span class="label">Figure ${number}.</span>${caption ? ` ${escapeHtml(caption)}` : ""}</figcaption></figure>`
  );
}

/** Each figure spec as the page holds it, made once (prewarmOutputs makes it while the cells run). */
const specJsonMade = new WeakMap<object, string>();

function specJson(spec: FigureRecord["spec"]): string {
  let json = specJsonMade.get(spec);
  if (json === undefined) specJsonMade.set(spec, (json = jsonForScript(spec)));
  return json;
}

/**
 * Encodes the figure specs among a cell's records for the page ahead of the report (about 6 ms of the realistic
 * notebook's report, its three figures), so the report written after the last cell finds them made.
 */
export function prewarmOutputs(records: readonly OutputRecord[]): void {
  for (const record of records) if (record.kind === "figure") specJson(record.spec);
}

/** A figure the cell gave no caption is captioned by its plot title, when it has one (tags taken out). */
function plotTitle(spec: FigureRecord["spec"]): string | undefined {
  const title = spec.layout?.["title"];
  const text = typeof title === "string" ? title : (title as { text?: unknown } | undefined)?.text;
  if (typeof text !== "string") return undefined;
  const plain = text
    .replace(/<br\s*\/?>/gi, " ")
    .replace(/<[^>]*>/g, "")
    .replace(/\s+/g, " ")
    .trim();
  return plain ? (/[.!?]$/.test(plain) ? plain : `${plain}.`) : undefined;
}

function renderSwatches(record: SwatchesRecord, view: OutputView): string {
  return renderSwatchFigure(record, view.number!);
}

function renderMarkdown(record: MarkdownRecord, view: OutputView): string {
  return `<div class="out-markdown">${renderCellMarkdown(record.text, record.trusted, view.shownBy)}</div>`;
}

function renderHtml(record: HtmlRecord): string {
  if (record.trusted) return `<div class="out-html">${record.html}</div>`;
  return `<pre class="out-value">${escapeHtml(record.html)}</pre>`;
}

const CAUTION_ABOUT: Record<NonNullable<CautionRecord["about"]>, string> = {
  value: "the result above",
  table: "the table above",
  figure: "the figure above",
  swatches: "the swatches above",
};

/**
 * A caution box. Each distinct text is shown in full once, where it first appears; later places repeat its first
 * sentence with a link to the full text, so the caution stays beside every result it belongs to without flooding.
 */
function renderCaution(record: CautionRecord, view: OutputView): string {
  const anchor = view.caution?.anchor;
  const about = record.about
    ? ` <span class="caution-about">(applies to ${CAUTION_ABOUT[record.about] ?? "the result above"})</span>`
    : "";
  const title = sentenceCase(record.title);
  if (view.caution?.repeat) {
    const first = /^(.*?[.!?])(\s|$)/s.exec(record.text)?.[1] ?? record.text;
    const more = first.length < record.text.length ? " …" : "";
    return (
      `<aside class="caution caution-repeat" role="note">${hazardSign(16)}<p><span class="caution-title">${escapeHtml(title)}.</span>${about} ` +
      `${escapeHtml(first)}${more} ${anchor ? `<a href="#${anchor}">(full text above)</a>` : ""}</p></aside>`
    );
  }
  return (
    `<aside class="caution" role="note"${anchor ? ` id="${anchor}"` : ""}>${hazardSign(26)}<div class="caution-body">` +
    `<p class="caution-title">${escapeHtml(title)}${about}</p><p>${escapeHtml(record.text)}</p></div></aside>`
  );
}

/** A caution's heading as the panel prints it: its first letter capitalised, the rest as the author wrote it, no
 * shouting (a title written all in capitals is set in sentence case). */
function sentenceCase(title: string): string {
  const text = /[a-z]/.test(title) ? title : title.toLowerCase();
  return text.charAt(0).toUpperCase() + text.slice(1);
}

function renderNote(record: NoteRecord): string {
  return `<p class="out-note">${escapeHtml(record.text)}</p>`;
}

const FAILURE_LABEL: Record<ErrorRecord["failure"], string> = {
  compile: "could not be compiled",
  thrown: "raised an error",
  uncaught: "raised an error outside its own flow",
  "time-limit": "ran past its time limit",
  exit: "called process.exit()",
  crash: "stopped the cell process",
  "out-of-memory": "ran out of memory",
  unserializable: "tried to show something that cannot be stored",
  startup: "could not start",
};

function renderError(record: ErrorRecord, _view: OutputView, notebookDir: string): string {
  const where = record.location
    ? `<p class="error-where">at ${escapeHtml(displayLocation(record.location, notebookDir))}</p>`
    : "";
  const frame = record.codeFrame ? `<pre class="code-frame">${escapeHtml(record.codeFrame)}</pre>` : "";
  const stack =
    record.stack && record.stack.length > 1
      ? `<details class="stack"><summary>Call stack</summary><pre>${escapeHtml(
          record.stack
            .map((f) => `at ${f.function ? `${f.function} ` : ""}${displayLocation(f, notebookDir)}`)
            .join("\n"),
        )}</pre></details>`
      : "";
  return (
    `<div class="out-error" role="alert"><p class="error-kind">This cell ${FAILURE_LABEL[record.failure] ?? "failed"}</p>` +
    `<p class="error-message">${escapeHtml(errorTitle(record))}</p>${where}${frame}${stack}</div>`
  );
}
