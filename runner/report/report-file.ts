/** Writes a report file: renders it, copies shared assets when asked, and writes atomically. */
import path from "node:path";
import type { NotebookDocument } from "../parse/notebook.ts";
import {
  embeddedPlotlyScript,
  renderReportParts,
  writeSharedAssets,
  type ReportParts,
} from "./render-report.ts";
import type { RunRecord } from "../records/run-record.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";

/** Name of the shared assets folder written beside reports with --link-assets. */
export const ASSETS_FOLDER = "tristim-assets";

/** The default report path of a notebook: beside it, same name, .html. */
export function defaultReportPath(notebook: string): string {
  return path.join(
    path.dirname(notebook),
    `${path.basename(notebook).replace(/\.(md|markdown)$/i, "")}.html`,
  );
}

/** Renders and writes the report of a run; returns the HTML written. */
export function writeReport(
  document: NotebookDocument,
  run: RunRecord,
  file: string,
  linkAssets = false,
): string {
  const parts = saveReport(document, run, file, linkAssets);
  return parts.before + (parts.embedsPlotly ? embeddedPlotlyScript().text : "") + parts.after;
}

/**
 * Renders and writes the report of a run, without making the HTML one string (the CLI and batches need only the
 * file: joining 2 MB of embedded Plotly into a string cost about 20 ms a report); returns the parts written.
 */
export function saveReport(
  document: NotebookDocument,
  run: RunRecord,
  file: string,
  linkAssets = false,
): ReportParts {
  if (linkAssets) writeSharedAssets(path.join(path.dirname(file), ASSETS_FOLDER));
  const parts = renderReportParts(document, run, linkAssets ? { assetsHref: ASSETS_FOLDER } : {});
  const plotly = parts.embedsPlotly ? embeddedPlotlyScript() : undefined;
  // Plotly's packed 2 MB go out as the bytes cached once per process, not re-encoded with every report.
  writeFileAtomic(file, plotly ? [parts.before, plotly.bytes, parts.after] : [parts.before, parts.after]);
  return parts;
}
