/**
 * The report's head, designed as the first lines of a lab record: a small line saying what kind of record it is,
 * the title, then the outcome (acceptance checks, failed cells, cautions) as the largest element after the title,
 * then who prepared it, when, and how it was computed, in sentences rather than a grid of labels. The marks are
 * drawn here as inline SVG (no icon set, no font glyphs), so they print the same everywhere.
 */
import path from "node:path";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { RunRecord } from "../records/run-record.ts";
import { cautionResults } from "../records/caution-results.ts";
import { checkResults, countChecks } from "../records/check-results.ts";
import { formatDuration } from "../text/duration.ts";
import { escapeHtml } from "./escape.ts";
import { hazardSign, outcomeMark, type OutcomeKind } from "./marks.ts";

/** The outcome of a run in words: a headline and the lines under it. */
export interface Outcome {
  readonly kind: OutcomeKind;
  readonly headline: string;
  /** HTML lines under the headline (already escaped). */
  readonly lines: readonly string[];
}

/** What the run came to, as the head states it. */
export function runOutcome(run: RunRecord): Outcome {
  const counts = countChecks(run);
  const total = counts.passed + counts.failed;
  const failedCells = run.cells.filter((c) => c.status === "failed");
  const blocking = failedCells.filter((c) => !c.failureAllowed);
  const ran = run.cells.filter((c) => c.status === "ok" || c.status === "failed").length;
  const lines: string[] = [];
  let kind: OutcomeKind;
  let headline: string;
  const checks = (n: number) => (n === 1 ? "1 acceptance check" : `${n} acceptance checks`);
  if (counts.failed > 0) {
    kind = "fail";
    headline = `${counts.failed} of ${checks(total)} failed`;
  } else if (blocking.length > 0) {
    kind = "incomplete";
    headline = `${blocking.length === 1 ? "A cell failed" : `${blocking.length} cells failed`}: the results are incomplete`;
  } else if (total > 0) {
    kind = "pass";
    headline = total === 1 ? "The acceptance check passed" : `All ${checks(total)} passed`;
  } else {
    kind = "none";
    headline = "No acceptance checks were stated";
  }
  if (total > 0 && blocking.length > 0 && counts.failed > 0) {
    lines.push(
      escapeHtml(
        `${blocking.length === 1 ? "A cell failed" : `${blocking.length} cells failed`}, so the results are incomplete.`,
      ),
    );
  } else if (total > 0 && blocking.length > 0) {
    lines.push(escapeHtml(`The ${checks(total)} stated before the failure passed.`));
  }
  if (failedCells.length === 0) {
    lines.push(
      escapeHtml(
        ran === 0
          ? "No cells to run."
          : `${ran === 1 ? "The 1 cell" : `All ${ran} cells`} ran without error.`,
      ),
    );
  } else if (blocking.length === 0) {
    lines.push(
      escapeHtml(
        `${failedCells.length === 1 ? "A cell" : `${failedCells.length} cells`} failed as the notebook allows.`,
      ),
    );
  }
  const first = checkResults(run).find((c) => counts.failed === 0 || !c.record.passed);
  if (first)
    lines.push(
      `<a href="${counts.failed ? "#checks" : `#${first.anchor}`}">${counts.failed ? "The failed checks are listed below" : "See the checks"}.</a>`,
    );
  return { kind, headline, lines };
}

/** The head of a report: kind of record, title, outcome panel, then who, when and how in sentences. */
export function renderRecordHead(document: NotebookDocument, run: RunRecord, title: string): string {
  const fm = document.frontMatter;
  const outcome = runOutcome(run);
  const cautions = cautionResults(run).length;
  const cautionLine =
    cautions === 0
      ? ""
      : `<p class="outcome-caution" role="note">${hazardSign(20)}<span>This report contains ${cautions === 1 ? "a caution" : `${cautions} cautions`} about the use of its results: <a href="#cautions">read ${cautions === 1 ? "it" : "them"} first</a>.</span></p>`;
  const outcomePanel =
    `<div class="outcome outcome-${outcome.kind}${cautions ? " with-caution" : ""}">` +
    `<div class="outcome-main">${outcomeMark(outcome.kind)}<div><p class="outcome-headline">${escapeHtml(outcome.headline)}</p>` +
    `<p class="outcome-lines">${outcome.lines.join(" ")}</p></div></div>${cautionLine}</div>`;

  const facts: string[] = [];
  // A reproducible report carries no wall-clock value: only the date the notebook itself states.
  const date = fm.date ?? (run.reproducible ? undefined : run.startedAt.slice(0, 10));
  if (fm.author || date) {
    facts.push(
      `<p>${fm.author ? `Prepared by ${escapeHtml(fm.author)}` : "Dated"}${date ? `${fm.author ? ", dated " : " "}<time>${escapeHtml(date)}</time>` : ""}.</p>`,
    );
  }
  if (run.batch) {
    const value = String(run.inputs[run.batch.input]);
    facts.push(
      `<p>Data file <code>${escapeHtml(value)}</code>, run ${run.batch.position} of ${run.batch.count} of this notebook (<a href="index.html">all runs</a>).</p>`,
    );
  }
  const ran = run.cells.filter((c) => c.status === "ok" || c.status === "failed").length;
  const cells = ran === 1 ? "1 cell" : `${ran} cells`;
  const how = run.reproducible
    ? `${cells}; a reproducible report`
    : `${cells} in ${formatDuration(run.durationMs)}`;
  facts.push(
    `<p>Computed from <code>${escapeHtml(path.basename(document.path))}</code> by ${escapeHtml(`${run.tool.name} ${run.tool.version}`)} (${escapeHtml(how)}).</p>`,
  );
  return (
    `<header class="record-head"><p class="record-kind">Lab record</p><h1>${escapeHtml(title)}</h1>` +
    `${outcomePanel}<div class="record-facts">${facts.join("")}</div></header>`
  );
}
