/**
 * The index page of a batch: one self-contained HTML page in the reports' style that lists every run (its data
 * file linked to its report, cell status, acceptance checks, cautions), a summary at the top, and the batch's
 * provenance (notebook and data file SHA-256, versions, the pattern). Written from the batch record only.
 */
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { batchResults, type BatchEntry, type BatchRecord } from "../batch/batch-index.ts";
import { batchResultsScript } from "./results-file.ts";
import { EXIT } from "../shared/exit-codes.ts";
import { escapeHtml } from "./escape.ts";
import { describeCells } from "../text/cell-numbers.ts";

const here = path.dirname(fileURLToPath(import.meta.url));
const CSS = fs.readFileSync(path.join(here, "report.css"), "utf8");

/** The index page HTML. */
export function renderBatchIndex(batch: BatchRecord): string {
  const n = batch.entries.length;
  const runs = (k: number) => (k === 1 ? "1 run" : `${k} runs`);
  const passed = batch.entries.filter((e) => e.exit === EXIT.ok);
  const checkFailed = batch.entries.filter((e) => e.exit === EXIT.checkFailed);
  const cellFailed = batch.entries.filter((e) => e.exit === EXIT.notebookFailed);
  const unwritten = batch.entries.filter((e) => e.exit === EXIT.internal);
  const withCautions = batch.entries.filter((e) => e.cautions > 0).length;

  const shard = batch.shard
    ? ` This folder is shard ${batch.shard.index} of ${batch.shard.of} of a batch of ${batch.count} data files (merge the shard folders with <code>tristim collate</code>).`
    : "";
  const made = `Computed from <code>${escapeHtml(path.basename(batch.notebook.path))}</code> by ${escapeHtml(`${batch.tool.name} ${batch.tool.version}`)}, ${n === 1 ? "1 run" : `${n} runs`}, one per data file${batch.reproducible ? "" : `, on <time>${escapeHtml(batch.startedAt.slice(0, 10))}</time>`}.${shard}`;

  const parts: string[] = [];
  if (passed.length === n) {
    parts.push(
      `<div class="summary-part checks passed"><h2><span class="check-mark" aria-hidden="true">✓</span> All ${runs(n)} ran without error and passed every acceptance check</h2></div>`,
    );
  } else {
    const lines: string[] = [];
    if (cellFailed.length)
      lines.push(
        `<li><span class="check-word">FAIL</span> ${runs(cellFailed.length)} with a failed cell: ${linkList(cellFailed)}</li>`,
      );
    if (checkFailed.length)
      lines.push(
        `<li><span class="check-word">FAIL</span> ${runs(checkFailed.length)} with failed acceptance checks: ${linkList(checkFailed)}</li>`,
      );
    if (unwritten.length)
      lines.push(
        `<li><span class="check-word">FAIL</span> ${runs(unwritten.length)} whose report could not be written: ${unwritten.map((e) => escapeHtml(e.dataFile)).join(", ")}</li>`,
      );
    parts.push(
      `<div class="summary-part checks failed"><h2><span class="check-mark" aria-hidden="true">✗</span> ${n - passed.length} of ${runs(n)} did not pass</h2><ul>${lines.join("")}</ul>` +
        `<p>${passed.length === 0 ? "No run passed." : `${runs(passed.length)} ran without error and passed every check.`}</p></div>`,
    );
  }
  if (withCautions > 0) {
    parts.push(
      `<div class="summary-part cautions"><h2>${withCautions === n ? "Every report contains" : `${runs(withCautions)} of ${n} contain`} cautions about the use of the results</h2><p>Read them at the top of each report before using its results.</p></div>`,
    );
  }

  const rows = batch.entries
    .map((e, i) => {
      const result =
        e.exit === EXIT.ok
          ? `<td class="check-result"><span class="check-mark" aria-hidden="true">✓</span> pass</td>`
          : `<td class="check-result"><span class="check-mark" aria-hidden="true">✗</span> ${e.exit === EXIT.checkFailed ? "FAIL" : e.exit === EXIT.notebookFailed ? "ERROR" : "NOT WRITTEN"}</td>`;
      const file = e.report
        ? `<a href="${escapeHtml(encodeURIComponent(e.report))}">${escapeHtml(e.dataFile)}</a>`
        : escapeHtml(e.dataFile);
      const cells = e.cells.failed.length
        ? `${describeCells(e.cells.failed.map((c) => c + 1))} failed${e.cells.notRun ? `; ${e.cells.notRun} not run` : ""}`
        : `${e.cells.ran === 1 ? "1 cell" : `${e.cells.ran} cells`} ran`;
      const totalChecks = e.checks.passed + e.checks.failed;
      const shownLabels = e.failedChecks.slice(0, 3).map(escapeHtml).join("; ");
      const more = e.failedChecks.length > 3 ? `; and ${e.failedChecks.length - 3} more` : "";
      const checks =
        totalChecks === 0
          ? `<span class="muted">none</span>`
          : e.checks.failed === 0
            ? `${totalChecks} passed`
            : `<strong>${e.checks.failed} of ${totalChecks} failed</strong><span class="check-detail">${shownLabels}${more}</span>`;
      const cautions = e.cautions === 0 ? `<span class="muted">none</span>` : `${e.cautions}`;
      return (
        `<tr class="check ${e.exit === EXIT.ok ? "check-pass" : "check-fail"}" id="run-${i + 1}">${result}<td class="num">${i + 1}</td>` +
        `<td class="index-file">${file}</td><td>${cells}</td><td>${checks}</td><td class="num">${cautions}</td></tr>`
      );
    })
    .join("");

  const files = batch.entries
    .map(
      (e) =>
        `<tr><td class="file-path">${escapeHtml(e.dataFile)}</td><td><code class="hash">${escapeHtml(e.sha256)}</code></td></tr>`,
    )
    .join("");
  const facts: [string, string][] = [
    [
      "Notebook",
      `${escapeHtml(path.basename(batch.notebook.path))}<br><code class="hash">SHA-256 ${escapeHtml(batch.notebook.sha256)}</code>`,
    ],
    [
      "Batch",
      `<code>--each ${escapeHtml(batch.input)}=${escapeHtml(batch.pattern)}</code>: each matching file was bound to the input <code>${escapeHtml(batch.input)}</code> for one run`,
    ],
    [
      "Software",
      `${escapeHtml(batch.tool.name)} ${escapeHtml(batch.tool.version)}<br>Node.js ${escapeHtml(batch.node)} (${escapeHtml(batch.platform)})`,
    ],
    batch.reproducible
      ? ["Date", "left out: reproducible index (<code>--reproducible</code>)"]
      : ["Batch started", escapeHtml(batch.startedAt.replace("T", " ").replace(/\.\d+Z$/, " UTC"))],
  ];

  return (
    `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${escapeHtml(`${batch.tool.name} ${batch.tool.version}`)}">
<title>${escapeHtml(`${batch.notebook.title} — ${runs(n)}`)}</title>
<style>${CSS}</style>
</head>
<body>
<main class="report batch-index">
<header class="record-head"><p class="record-kind">Index of lab records</p><h1>${escapeHtml(batch.notebook.title)}</h1>
<div class="record-facts"><p>${made}</p></div></header>
<section class="summary" aria-label="Summary">${parts.join("")}</section>
<h2 id="runs">Runs</h2>
<div class="table-scroll"><table class="checks index-table"><thead><tr><th scope="col">Result</th><th scope="col" class="num">Run</th><th scope="col">Data file</th>` +
    `<th scope="col">Cells</th><th scope="col">Acceptance checks</th><th scope="col" class="num">Cautions</th></tr></thead><tbody>${rows}</tbody></table></div>
<p class="section-note">Each data file links to its report. Paths are relative to the notebook's folder.</p>
<section class="run-details" id="provenance"><h2>Provenance</h2>
<p class="section-note">Each report has its own provenance appendix; this records the batch. A SHA-256 identifies the exact bytes of a file.</p>
<dl class="facts">${facts.map(([k, v]) => `<dt>${k}</dt><dd>${v}</dd>`).join("")}</dl>
<h3>Data files</h3><div class="table-scroll"><table class="compact files-read"><thead><tr><th>File</th><th>SHA-256 before its run</th></tr></thead><tbody>${files}</tbody></table></div>
</section>
<footer class="report-footer">Made with ${escapeHtml(batch.tool.name)} ${escapeHtml(batch.tool.version)} from ${escapeHtml(path.basename(batch.notebook.path))}.</footer>
</main>
${batchResultsScript(batchResults(batch))}
</body>
</html>
`
  );
}

function linkList(entries: readonly BatchEntry[]): string {
  return entries
    .map((e) =>
      e.report
        ? `<a href="${escapeHtml(encodeURIComponent(e.report))}">${escapeHtml(e.dataFile)}</a>`
        : escapeHtml(e.dataFile),
    )
    .join(", ");
}
