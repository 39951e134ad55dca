/**
 * Results as data (`--results <file.json>` or `<file.csv>`, and the batch index's embedded copy): the runs of one
 * command as plain data for other systems. Built only from embedded run records (embedded-run-record.ts), which are
 * built from the run records, so the file, the report and the index can never disagree. The schema is documented in
 * docs/results.md; `format` and `version` identify it, and fields are only ever added within one version.
 */
import type { EmbeddedRunRecord } from "./embedded-run-record.ts";
import { jsonForScript } from "./escape.ts";
import { EXIT, worseExit, type ExitCode } from "../shared/exit-codes.ts";

/** The value of `format`, and the current `version`. */
export const RESULTS_FORMAT = "tristim-results";
export const RESULTS_VERSION = 1;
/** The element id of the results embedded in a batch index page. */
export const BATCH_RESULTS_ELEMENT_ID = "tristim-batch-results";

/** One run: its record, and for a batch its data file, that file's SHA-256 before the run and its report. */
export interface RunResult {
  /** 1-based place of the run among the command's runs (for a batch, in the order of the data files). */
  readonly position: number;
  /** The data file bound to the batch input (relative to the notebook's folder); batch runs only. */
  readonly dataFile?: string;
  readonly dataFileSha256?: string;
  /** The report's path relative to the results file (to the index page for a batch); absent when not written. */
  readonly report?: string;
  /** The run's exit code (4 when its report could not be written). */
  readonly exitCode: ExitCode;
  readonly record: EmbeddedRunRecord;
}

/** The batch a results file comes from. */
export interface BatchResultsPlace {
  readonly notebook: { readonly file: string; readonly sha256: string; readonly title: string };
  readonly input: string;
  readonly pattern: string;
  /** The number of data files of the whole batch. */
  readonly count: number;
  /** Set on one shard's results (`--shard K/N`): which slice of the batch they hold. */
  readonly shard?: { readonly index: number; readonly of: number };
}

/** The whole results file. */
export interface ResultsFile {
  readonly format: typeof RESULTS_FORMAT;
  readonly version: typeof RESULTS_VERSION;
  readonly tool: { readonly name: string; readonly version: string };
  readonly reproducible: boolean;
  /** ISO date and time the command started; left out when reproducible. */
  readonly startedAt?: string;
  /** The worst exit code over the runs. */
  readonly exitCode: ExitCode;
  readonly batch?: BatchResultsPlace;
  readonly runs: readonly RunResult[];
}

/** Assembles a results file from the runs' results (in order). */
export function resultsFile(
  runs: readonly RunResult[],
  facts: {
    tool: { name: string; version: string };
    reproducible: boolean;
    startedAt: string;
    batch?: BatchResultsPlace;
  },
): ResultsFile {
  return {
    format: RESULTS_FORMAT,
    version: RESULTS_VERSION,
    tool: { name: facts.tool.name, version: facts.tool.version },
    reproducible: facts.reproducible,
    ...(facts.reproducible ? {} : { startedAt: facts.startedAt }),
    exitCode: runs.reduce<ExitCode>((worst, r) => worseExit(worst, r.exitCode), EXIT.ok),
    ...(facts.batch ? { batch: facts.batch } : {}),
    runs,
  };
}

/** The columns of the checks CSV, in order. */
export const CHECK_CSV_COLUMNS = [
  "run",
  "notebook",
  "data_file",
  "cell",
  "check_id",
  "label",
  "outcome",
  "value",
  "value_text",
  "unit",
  "min",
  "max",
  "target",
  "tolerance",
  "expanded_uncertainty",
  "decision_rule",
  "guard_band",
  "detail",
] as const;

/** Every check of every run as CSV (RFC 4180: comma, CRLF, fields with a comma, quote or line break quoted). */
export function checksCsv(results: ResultsFile): string {
  const lines = [CHECK_CSV_COLUMNS.join(",")];
  for (const run of results.runs)
    for (const c of run.record.checks) {
      const row: Record<(typeof CHECK_CSV_COLUMNS)[number], string> = {
        run: String(run.position),
        notebook: run.record.notebook.file,
        data_file: run.dataFile ?? "",
        cell: String(c.cell),
        check_id: c.id,
        label: c.label,
        // With an uncertainty, the decision rule's outcome ("marginal pass", ...); else pass or fail on the value.
        outcome: c.decision?.outcome ?? (c.passed ? "pass" : "fail"),
        value: c.value === undefined || c.value === null ? "" : String(c.value),
        value_text: c.valueText ?? "",
        unit: c.unit ?? "",
        min: limit(c.limits?.min),
        max: limit(c.limits?.max),
        target: limit(c.limits?.target),
        tolerance: limit(c.limits?.tolerance),
        expanded_uncertainty: limit(c.decision?.expandedUncertainty),
        decision_rule: c.decision?.rule ?? "",
        guard_band: limit(c.decision?.guardBand),
        detail: c.detail ?? "",
      };
      lines.push(CHECK_CSV_COLUMNS.map((k) => csvField(row[k])).join(","));
    }
  return lines.join("\r\n") + "\r\n";
}

function limit(value: number | undefined): string {
  return value === undefined ? "" : String(value);
}

function csvField(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

/** The results as the file's text: JSON for `.json`, the checks as CSV for `.csv`. */
export function resultsText(results: ResultsFile, file: string): string {
  return /\.csv$/i.test(file) ? checksCsv(results) : `${JSON.stringify(results, null, 2)}\n`;
}

/** The `<script>` element of a batch index page that carries the batch's results. */
export function batchResultsScript(results: ResultsFile): string {
  return `<script type="application/json" id="${BATCH_RESULTS_ELEMENT_ID}">${jsonForScript(results)}</script>`;
}

/** Reads the results embedded in a batch index page; throws when there are none. */
export function readBatchResults(html: string): ResultsFile {
  const m = new RegExp(
    `<script type="application/json" id="${BATCH_RESULTS_ELEMENT_ID}">([^<]*)</script>`,
  ).exec(html);
  if (!m) throw new Error(`no <script id="${BATCH_RESULTS_ELEMENT_ID}"> element: not a tristim batch index`);
  const results = JSON.parse(m[1]!) as ResultsFile;
  if (results.format !== RESULTS_FORMAT)
    throw new Error(
      `the embedded results have format ${JSON.stringify(results.format)}, not "${RESULTS_FORMAT}"`,
    );
  if (results.version !== RESULTS_VERSION)
    throw new Error(
      `the embedded results have version ${results.version}; this tristim reads version ${RESULTS_VERSION}`,
    );
  return results;
}
