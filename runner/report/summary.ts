/**
 * The summary at the top of the report: what a reader must know before reading on. Each section is a function of
 * the document and the run record that returns HTML or nothing; add a section by adding a function to
 * SUMMARY_SECTIONS.
 */
import type { ErrorRecord } from "../../cells/records.ts";
import { cautionResults } from "../records/caution-results.ts";
import { checkResults } from "../records/check-results.ts";
import { checkOutcomeText } from "../text/check-text.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { RunRecord } from "../records/run-record.ts";
import { escapeHtml } from "./escape.ts";
import { hazardSign } from "./marks.ts";
import { displayLocation, errorHeadline } from "../text/error-text.ts";
import { describeCells } from "../text/cell-numbers.ts";

/** What a summary section may look at. */
export interface SummaryContext {
  readonly document: NotebookDocument;
  readonly run: RunRecord;
  readonly notebookDir: string;
}

/** One part of the summary: HTML, or undefined when it has nothing to say. */
export type SummarySection = (ctx: SummaryContext) => string | undefined;

/** Failed cells, with their error and place, and the cells that were not run because of them. */
export const failedCellsSection: SummarySection = ({ run, notebookDir }) => {
  const failed = run.cells.filter((c) => c.status === "failed");
  if (failed.length === 0) return undefined;
  const blocking = failed.filter((c) => !c.failureAllowed);
  const items = failed.map((c) => {
    const error = c.outputs.find((o): o is ErrorRecord => o.kind === "error");
    const where = error?.location
      ? ` <span class="where">(${escapeHtml(displayLocation(error.location, notebookDir))})</span>`
      : "";
    const allowed = c.failureAllowed ? ` <span class="allowed">failure allowed by may-fail</span>` : "";
    return `<li><a href="#cell-${c.index + 1}">Cell ${c.index + 1}</a>${where}: ${escapeHtml(error ? errorHeadline(error) : "failed")}${allowed}</li>`;
  });
  const notRun = run.cells.filter((c) => c.status === "not-run").map((c) => c.index + 1);
  const notRunText = notRun.length ? `<p>Not run because of the failure: ${describeCells(notRun)}.</p>` : "";
  const heading =
    blocking.length === 0
      ? `${failed.length === 1 ? "A cell" : `${failed.length} cells`} failed as allowed`
      : `${blocking.length === 1 ? "A cell failed" : `${blocking.length} cells failed`}: results below are incomplete`;
  return `<div class="summary-part failures${blocking.length === 0 ? " allowed" : ""}"><h2>${heading}</h2><ul>${items.join("")}</ul>${notRunText}</div>`;
};

/** The acceptance checks: how many passed and failed, each failed one linked to its row. */
export const checksSection: SummarySection = ({ run }) => {
  const checks = checkResults(run);
  const incomplete = run.cells.some((c) => c.status === "failed" || c.status === "not-run");
  const missing = incomplete
    ? `<p class="checks-missing">Checks that cells would have stated after a failure, or in cells that were not run, are missing from this count.</p>`
    : "";
  if (checks.length === 0) return undefined;
  const failed = checks.filter((c) => !c.record.passed);
  const total = checks.length === 1 ? "1 acceptance check" : `${checks.length} acceptance checks`;
  // Passes whose value ± U reaches across a limit are named, with the rule that passed them (ILAC-G8:2019 §4.2).
  const marginal = checks.filter((c) => c.record.decision?.outcome === "marginal pass");
  const marginalText = marginal.length
    ? `<p class="checks-marginal">${marginal.length === 1 ? "One pass is marginal" : `${marginal.length} passes are marginal`} (value ± U reaches across a limit): ${marginal.map((c) => `<a href="#${c.anchor}">${escapeHtml(c.record.label)}</a>`).join(", ")}.</p>`
    : "";
  // All passed: the report's head says so in its outcome panel; left to say are marginal passes and missing checks.
  if (failed.length === 0)
    return missing || marginalText
      ? `<div class="summary-part checks passed" id="checks">${marginalText}${missing}</div>`
      : undefined;
  const items = failed.map(
    (c) =>
      `<li><span class="check-word">${c.record.decision?.outcome === "marginal fail" ? "marginal FAIL" : "FAIL"}</span> <a href="#${c.anchor}">${escapeHtml(c.record.label)}</a>: ${escapeHtml(checkOutcomeText(c.record))} <span class="where">(cell ${c.cell + 1})</span></li>`,
  );
  const passed = checks.length - failed.length;
  return (
    `<div class="summary-part checks failed" id="checks"><h2><span class="check-mark" aria-hidden="true">✗</span> ${failed.length} of ${total} failed</h2>` +
    `<ul>${items.join("")}</ul><p>${passed === 0 ? "None passed." : `${passed} passed.`}</p>${marginalText}${missing}</div>`
  );
};

/** Every distinct caution raised by a cell or carried by a result, repeated here so no reader misses one. */
export const cautionsSection: SummarySection = ({ run }) => {
  const items = cautionResults(run).map(
    (c) =>
      `<li>${c.record.title === "Caution" ? "" : `<strong>${escapeHtml(c.record.title)}.</strong> `}${escapeHtml(c.record.text)} <a href="#${c.anchor}">(cell ${c.cell + 1})</a></li>`,
  );
  if (items.length === 0) return undefined;
  return `<div class="summary-part cautions" id="cautions"><h2>${hazardSign(18)} ${items.length === 1 ? "Caution" : "Cautions"}</h2><ul>${items.join("")}</ul></div>`;
};

/** Things that happened to the run itself (e.g. the cell process had to be restarted). */
export const runEventsSection: SummarySection = ({ run }) => {
  if (run.events.length === 0) return undefined;
  return `<div class="summary-part events"><h2>About this run</h2><ul>${run.events.map((e) => `<li>${escapeHtml(e)}</li>`).join("")}</ul></div>`;
};

/** The summary sections, in the order they appear. */
export const SUMMARY_SECTIONS: SummarySection[] = [
  failedCellsSection,
  checksSection,
  cautionsSection,
  runEventsSection,
];

/** The summary block under the report's head (which already states the outcome): every section with something to say. */
export function renderSummary(ctx: SummaryContext): string {
  const parts = SUMMARY_SECTIONS.map((section) => section(ctx)).filter((p): p is string => p !== undefined);
  if (parts.length === 0) return "";
  return `<section class="summary" aria-label="Summary">${parts.join("")}</section>`;
}
