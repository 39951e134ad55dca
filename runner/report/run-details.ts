/**
 * The appendix that records how the report was made: notebook hash, tool and Node versions, date, inputs, each
 * cell's status and duration, and every file a cell read with its hash. Provenance details are added here.
 */
import path from "node:path";
import type { NotebookDocument } from "../notebook.ts";
import type { RunRecord } from "../run-record.ts";
import { escapeHtml } from "./escape.ts";
import { formatDuration } from "./format.ts";

const STATUS_TEXT = { ok: "ran", failed: "failed", "not-run": "not run", listing: "listing only" } as const;

/** The run-record appendix. */
export function renderRunDetails(document: NotebookDocument, run: RunRecord, id: string): string {
  const dir = path.dirname(document.path);
  const facts: [string, string][] = [
    ["Notebook", `${escapeHtml(path.basename(document.path))}<br><code class="hash">SHA-256 ${run.notebook.sha256}</code>`],
    ["Run started", escapeHtml(run.startedAt.replace("T", " ").replace(/\.\d+Z$/, " UTC"))],
    ["Run took", escapeHtml(formatDuration(run.durationMs))],
    ["Made with", `${escapeHtml(run.tool.name)} ${escapeHtml(run.tool.version)}, Node.js ${escapeHtml(run.node)} (${escapeHtml(run.platform)})`],
    ["Cell time limit", `${escapeHtml(formatDuration(run.timeLimitMs))}${run.keepGoing ? "; kept going after failures" : ""}`],
  ];
  const inputs = Object.entries(run.inputs);
  if (inputs.length > 0) {
    facts.push([
      "Inputs",
      inputs.map(([name, value]) =>
        `<code>${escapeHtml(name)}</code> = <code>${escapeHtml(JSON.stringify(value))}</code>${Object.hasOwn(run.inputsSet, name) ? " (set on the command line)" : " (default)"}`)
        .join("<br>"),
    ]);
  }
  const rows = run.cells.map((c) => {
    const cell = document.cells[c.index]!;
    return `<tr><td class="num"><a href="#cell-${c.index + 1}">${c.index + 1}</a></td><td class="num">${cell.firstLine}</td>` +
      `<td>${STATUS_TEXT[c.status]}</td><td class="num">${c.durationMs === undefined ? "" : escapeHtml(formatDuration(c.durationMs))}</td></tr>`;
  }).join("");
  const cellTable = run.cells.length === 0 ? "" :
    `<h3>Cells</h3><div class="table-scroll"><table class="compact"><thead><tr><th class="num">Cell</th><th class="num">Line</th><th>Status</th><th class="num">Duration</th></tr></thead><tbody>${rows}</tbody></table></div>`;
  const files = run.filesRead.length === 0 ? "" :
    `<h3>Files read by the cells</h3><div class="table-scroll"><table class="compact"><thead><tr><th>File</th><th>SHA-256</th><th>Read by</th></tr></thead><tbody>${run.filesRead.map((f) =>
      `<tr><td>${escapeHtml(path.relative(dir, f.path) || f.path)}</td><td><code class="hash">${f.sha256 ?? "(not a readable file)"}</code></td><td>${f.cells.map((i) => `<a href="#cell-${i + 1}">cell ${i + 1}</a>`).join(", ")}</td></tr>`).join("")}</tbody></table></div>`;
  return `<section class="run-details" id="${id}"><h2>Run record</h2><dl class="facts">${facts.map(([k, v]) => `<dt>${k}</dt><dd>${v}</dd>`).join("")}</dl>${cellTable}${files}</section>`;
}
