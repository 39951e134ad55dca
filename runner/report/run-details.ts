/**
 * The provenance appendix: how the report was made. SHA-256 of the notebook and of every file a cell read or
 * imported (paths relative to the notebook), tool, Node and Plotly versions, the date, the inputs and where each
 * value came from, each cell's status and duration. A reproducible run leaves out every wall-clock value (date,
 * durations) and says so, so that two runs of the same notebook on the same files give identical bytes.
 */
import path from "node:path";
import { checkResults } from "../records/check-results.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { RunRecord } from "../records/run-record.ts";
import { escapeHtml } from "./escape.ts";
import { displayPath } from "../text/display-path.ts";
import { formatDuration } from "../text/duration.ts";
import { shellLine, type CarriedSources } from "./carried-sources.ts";
import { describeBytes } from "../shared/carried-files.ts";

const STATUS_TEXT = { ok: "ran", failed: "failed", "not-run": "not run", listing: "listing only" } as const;

/** What the appendix needs besides the run: the Plotly version when the report draws figures. */
export interface RunDetailsOptions {
  readonly plotlyVersion?: string;
  /** What the report carries to be run again (carried-sources.ts). */
  readonly sources?: CarriedSources;
}

/** The provenance appendix. */
export function renderRunDetails(
  document: NotebookDocument,
  run: RunRecord,
  id: string,
  options: RunDetailsOptions = {},
): string {
  const dir = path.dirname(document.path);
  const facts: [string, string][] = [
    [
      "Notebook",
      `${escapeHtml(path.basename(document.path))}<br><code class="hash">SHA-256 ${escapeHtml(run.notebook.sha256)}</code>`,
    ],
  ];
  if (run.reproducible) {
    facts.push([
      "Date and durations",
      "left out: this is a reproducible report (<code>--reproducible</code>), so two runs of the same notebook on the same files give identical bytes",
    ]);
  } else {
    facts.push([
      "Run started",
      escapeHtml(
        run.startedAt
          .replace("T", " ")
          .replace(/\.\d+Z$/, " UTC")
          .replace(/Z$/, " UTC"),
      ),
    ]);
    facts.push(["Run took", escapeHtml(formatDuration(run.durationMs))]);
  }
  const software = [
    `${escapeHtml(run.tool.name)} ${escapeHtml(run.tool.version)}`,
    `Node.js ${escapeHtml(run.node)} (${escapeHtml(run.platform)})`,
  ];
  if (options.plotlyVersion)
    software.push(`Plotly.js ${escapeHtml(options.plotlyVersion)} (draws the figures)`);
  facts.push(["Software", software.join("<br>")]);
  facts.push([
    "Cell time limit",
    `${escapeHtml(formatDuration(run.timeLimitMs))}${run.keepGoing ? "; kept going after failures (--keep-going)" : ""}`,
  ]);
  if (run.batch) {
    facts.push([
      "Batch",
      `run ${run.batch.position} of ${run.batch.count}: <code>--each ${escapeHtml(run.batch.input)}=${escapeHtml(run.batch.pattern)}</code>, ` +
        `one run per matching file, this one with <code>${escapeHtml(run.batch.input)}</code> = <code>${escapeHtml(String(run.inputs[run.batch.input]))}</code>`,
    ]);
  }

  if (options.sources) facts.push(["Run it again", rerunText(options.sources, run)]);

  const inputs = Object.entries(run.inputs);
  const inputTable =
    inputs.length === 0
      ? ""
      : `<h3>Inputs</h3><div class="table-scroll"><table class="compact"><thead><tr><th>Input</th><th>Value</th><th>Set by</th></tr></thead><tbody>${inputs
          .map(([name, value]) => {
            const source =
              run.batch?.input === name
                ? "--each (this run's data file)"
                : Object.hasOwn(run.inputsSet, name)
                  ? "the command line (--input)"
                  : "the notebook's default";
            return `<tr><td><code>${escapeHtml(name)}</code></td><td><code>${escapeHtml(JSON.stringify(value))}</code></td><td>${escapeHtml(source)}</td></tr>`;
          })
          .join("")}</tbody></table></div>`;

  const checks = checkResults(run);
  const withDurations = !run.reproducible;
  const rows = run.cells
    .map((c) => {
      const cell = document.cells[c.index]!;
      const own = checks.filter((k) => k.cell === c.index);
      const failed = own.filter((k) => !k.record.passed).length;
      const checkCell =
        checks.length === 0
          ? ""
          : `<td>${own.length === 0 ? "" : failed === 0 ? `${own.length} passed` : `${failed} of ${own.length} failed`}</td>`;
      return (
        `<tr><td class="num"><a href="#cell-${c.index + 1}">${c.index + 1}</a></td><td class="num">${cell.firstLine}</td>` +
        `<td>${STATUS_TEXT[c.status]}${c.failureAllowed ? " (allowed)" : ""}</td>${checkCell}` +
        `${withDurations ? `<td class="num">${c.durationMs === undefined ? "" : escapeHtml(formatDuration(c.durationMs))}</td>` : ""}</tr>`
      );
    })
    .join("");
  const cellTable =
    run.cells.length === 0
      ? ""
      : `<h3>Cells</h3><div class="table-scroll"><table class="compact"><thead><tr><th class="num">Cell</th><th class="num">Line</th><th>Status</th>` +
        `${checks.length ? "<th>Checks</th>" : ""}${withDurations ? '<th class="num">Duration</th>' : ""}</tr></thead><tbody>${rows}</tbody></table></div>`;

  const files =
    run.filesRead.length === 0
      ? `<h3>Files read by the cells</h3><p class="section-note">No cell read a file.</p>`
      : `<h3>Files read by the cells</h3><p class="section-note">Paths are relative to the notebook's folder${run.filesRead.some((f) => f.imported) ? "; “imported” marks a module a cell imported" : ""}.</p><div class="table-scroll"><table class="compact files-read"><thead><tr><th>File</th><th>SHA-256</th><th>Used by</th></tr></thead><tbody>${run.filesRead
          .map(
            (f) =>
              `<tr><td class="file-path">${escapeHtml(displayPath(f.path, dir, "relative"))}${f.imported ? ` <span class="file-how">imported</span>` : ""}</td>` +
              `<td><code class="hash">${f.sha256 ?? "(not a readable file)"}</code></td>` +
              `<td>${f.cells.map((i) => `<a href="#cell-${i + 1}">cell&nbsp;${i + 1}</a>`).join(", ")}</td></tr>`,
          )
          .join("")}</tbody></table></div>`;

  const written = run.filesWritten ?? [];
  const writtenTable =
    written.length === 0
      ? ""
      : `<h3>Files written by the cells</h3><p class="section-note">Paths are relative to the notebook's folder; each SHA-256 is of the file as the run left it.</p><div class="table-scroll"><table class="compact files-read files-written"><thead><tr><th>File</th><th>SHA-256</th><th>Written by</th></tr></thead><tbody>${written
          .map(
            (f) =>
              `<tr><td class="file-path">${escapeHtml(displayPath(f.path, dir, "relative"))}</td>` +
              `<td><code class="hash">${f.sha256 ?? "(not a readable file)"}</code></td>` +
              `<td>${f.cells.map((i) => `<a href="#cell-${i + 1}">cell&nbsp;${i + 1}</a>`).join(", ")}</td></tr>`,
          )
          .join("")}</tbody></table></div>`;

  return (
    `<section class="run-details" id="${id}"><h2>Provenance</h2>` +
    `<p class="section-note">How this report was made. A SHA-256 identifies the exact bytes of a file: compute it again (for example with <code>sha256sum</code>) to confirm a file is the one used here.</p>` +
    `<dl class="facts">${facts.map(([k, v]) => `<dt>${k}</dt><dd>${v}</dd>`).join("")}</dl>${inputTable}${cellTable}${files}${writtenTable}</section>`
  );
}

/** How to run the report again from the sources it carries. */
function rerunText(sources: CarriedSources, run: RunRecord): string {
  const carried = sources.files.filter((f) => f.base64 !== undefined).length;
  const missing = sources.files.filter((f) => f.base64 === undefined);
  const what =
    carried === 0
      ? "the notebook's source"
      : `the notebook's source and the ${carried === 1 ? "file" : `${carried} files`} its cells read or imported`;
  let text =
    `This report carries ${what} (each file up to ${describeBytes(sources.limits.fileBytes)}, ${describeBytes(sources.limits.totalBytes)} in all). ` +
    `<code>tristim restore &lt;this report&gt; &lt;new folder&gt;</code> writes them into a folder; there, ` +
    `<code>${escapeHtml(shellLine(sources.rerun))}</code> makes this report again with ${escapeHtml(`${run.tool.name} ${run.tool.version}`)}` +
    `${run.reproducible ? ", byte for byte" : " (with --reproducible, without its date and durations)"}.`;
  if (run.batch)
    text +=
      " As a single run, its title block and this appendix no longer name the batch; its results are the same.";
  if (missing.length)
    text +=
      ` Not carried, by SHA-256 only (put a copy with that SHA-256 in its place first): ` +
      missing
        .map((f) => `<code>${escapeHtml(f.path)}</code> (${escapeHtml(f.missing ?? "not carried")})`)
        .join(", ") +
      ".";
  return text;
}
