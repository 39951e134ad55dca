/**
 * The machine-readable run record embedded in every report as
 * `<script type="application/json" id="tristim-run-record">`: the run's outcome in plain data (cells and their
 * status, acceptance checks with their values and limits, cautions, Methods statements, inputs, files read), so
 * tests and other tools read results without scraping HTML. Numbers are the full values the cells gave, not the
 * rounded text. A reproducible run (`--reproducible`) leaves out every wall-clock value, as the HTML does.
 *
 * Versioned: a tool checks `format` and `version`; fields are only ever added within one version.
 */
import path from "node:path";
import type { CautionRecord, CheckRecord, ErrorRecord, FailureKind, Location } from "../../cells/records.ts";
import type { InputValue } from "../../cells/inputs.ts";
import { cautionResults } from "../records/caution-results.ts";
import { checkResults, countChecks } from "../records/check-results.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import { runExitCode } from "../records/run-outcome.ts";
import type { CellStatus, RunRecord } from "../records/run-record.ts";
import { jsonForScript } from "./escape.ts";
import { reportModel } from "./report-model.ts";
import { displayPath } from "../text/display-path.ts";

/** The element id of the embedded record. */
export const RUN_RECORD_ELEMENT_ID = "tristim-run-record";
/** The value of `format`, and the current `version`. */
export const RUN_RECORD_FORMAT = "tristim-run-record";
export const RUN_RECORD_VERSION = 1;

/** One cell: its number as the report shows it (1-based), first code line, status, failure, duration. */
export interface EmbeddedCell {
  readonly cell: number;
  readonly firstLine: number;
  readonly status: CellStatus;
  /** The failure was allowed by the cell's may-fail option. */
  readonly failureAllowed?: boolean;
  readonly error?: {
    readonly failure: FailureKind;
    readonly name?: string;
    readonly message: string;
    /** Path relative to the notebook's folder. */
    readonly location?: Location;
  };
  /** How many acceptance checks the cell stated, and how many of them failed. */
  readonly checks: number;
  readonly checksFailed: number;
  /** Left out of a reproducible record. */
  readonly durationMs?: number;
}

/** One acceptance check, as the cell stated it: the check record plus where its row is in the report. */
export interface EmbeddedCheck extends Omit<CheckRecord, "kind"> {
  /** The element id of its row in the report (`check-<cell>-<n>`). */
  readonly id: string;
  readonly cell: number;
}

/** One distinct caution (each text once), where it first appears. */
export interface EmbeddedCaution {
  /** The element id of its box in the report (`caution-<n>`). */
  readonly id: string;
  readonly cell: number;
  readonly title: string;
  readonly text: string;
  readonly about?: CautionRecord["about"];
}

/** One table as the report shows it: its number ("Table n"), caption, columns with units, and the rows as shown. */
export interface EmbeddedTable {
  /** The number of the table in the report ("Table 2" → 2). */
  readonly number: number;
  readonly cell: number;
  readonly caption?: string;
  readonly columns: readonly { readonly label: string; readonly unit?: string; readonly numeric: boolean }[];
  /** Each row's cells as the report prints them (formatted in the cell process). */
  readonly rows: readonly (readonly string[])[];
  /** How many rows the cell gave; more than `rows.length` when the report shows only the first ones. */
  readonly totalRows: number;
}

/** The embedded run record. */
export interface EmbeddedRunRecord {
  readonly format: typeof RUN_RECORD_FORMAT;
  readonly version: typeof RUN_RECORD_VERSION;
  readonly title: string;
  readonly notebook: { readonly file: string; readonly sha256: string };
  readonly tool: { readonly name: string; readonly version: string };
  readonly node: string;
  readonly platform: string;
  /** True for `--reproducible`: then `startedAt` and every `durationMs` are left out. */
  readonly reproducible: boolean;
  readonly startedAt?: string;
  readonly durationMs?: number;
  /** What `tristim run` exits with for this run: 0 all well, 1 a cell failed, 3 an acceptance check failed. */
  readonly exitCode: number;
  readonly counts: {
    readonly cells: Readonly<Record<CellStatus, number>>;
    readonly checks: { readonly passed: number; readonly failed: number };
    readonly cautions: number;
  };
  readonly timeLimitMs: number;
  readonly keepGoing: boolean;
  readonly inputs: readonly {
    readonly name: string;
    readonly value: InputValue;
    readonly setBy: "default" | "--input" | "--each";
  }[];
  readonly cells: readonly EmbeddedCell[];
  readonly checks: readonly EmbeddedCheck[];
  readonly cautions: readonly EmbeddedCaution[];
  /** Every table shown, in the order of the report (added in version 1 with issue 18). */
  readonly tables: readonly EmbeddedTable[];
  readonly methods: readonly { readonly topic: string; readonly statement: string }[];
  /** Cells whose process stopped before reporting its method notes: the Methods may be incomplete. */
  readonly methodsMissingFrom: readonly number[];
  readonly filesRead: readonly {
    readonly path: string;
    readonly sha256: string | null;
    readonly cells: readonly number[];
    readonly imported?: boolean;
  }[];
  readonly events: readonly string[];
  readonly batch?: {
    readonly input: string;
    readonly pattern: string;
    readonly position: number;
    readonly count: number;
    readonly dataFile: string;
  };
}

/** The plain-data record of a run, as embedded in its report. */
export function embeddedRunRecord(
  document: NotebookDocument,
  run: RunRecord,
  title: string,
): EmbeddedRunRecord {
  const dir = path.dirname(document.path);
  const timed = !run.reproducible;
  const checks = checkResults(run);
  const counts = countChecks(run);
  const cellCounts: Record<CellStatus, number> = { ok: 0, failed: 0, "not-run": 0, listing: 0 };
  for (const c of run.cells) cellCounts[c.status]++;
  const cautions = cautionResults(run);
  return {
    format: RUN_RECORD_FORMAT,
    version: RUN_RECORD_VERSION,
    title,
    notebook: { file: path.basename(document.path), sha256: run.notebook.sha256 },
    tool: { name: run.tool.name, version: run.tool.version },
    node: run.node,
    platform: run.platform,
    reproducible: run.reproducible === true,
    ...(timed ? { startedAt: run.startedAt, durationMs: run.durationMs } : {}),
    exitCode: runExitCode(run),
    counts: { cells: cellCounts, checks: counts, cautions: cautions.length },
    timeLimitMs: run.timeLimitMs,
    keepGoing: run.keepGoing,
    inputs: Object.entries(run.inputs).map(([name, value]) => ({
      name,
      value,
      setBy:
        run.batch?.input === name ? "--each" : Object.hasOwn(run.inputsSet, name) ? "--input" : "default",
    })),
    cells: run.cells.map((c) => {
      const own = checks.filter((k) => k.cell === c.index);
      const error = c.outputs.find((o): o is ErrorRecord => o.kind === "error");
      return {
        cell: c.index + 1,
        firstLine: document.cells[c.index]?.firstLine ?? 0,
        status: c.status,
        ...(c.failureAllowed ? { failureAllowed: true } : {}),
        ...(error ? { error: embeddedError(error, dir) } : {}),
        checks: own.length,
        checksFailed: own.filter((k) => !k.record.passed).length,
        ...(timed && c.durationMs !== undefined ? { durationMs: c.durationMs } : {}),
      };
    }),
    checks: checks.map(({ record: r, cell, anchor }) => ({
      id: anchor,
      cell: cell + 1,
      label: r.label,
      passed: r.passed,
      ...(r.value !== undefined ? { value: r.value } : {}),
      ...(r.valueText !== undefined ? { valueText: r.valueText } : {}),
      ...(r.unit !== undefined ? { unit: r.unit } : {}),
      ...(r.limits !== undefined ? { limits: r.limits } : {}),
      ...(r.digits !== undefined ? { digits: r.digits } : {}),
      ...(r.detail !== undefined ? { detail: r.detail } : {}),
      ...(r.decision !== undefined ? { decision: r.decision } : {}),
    })),
    cautions: cautions.map(({ record: r, cell, anchor }) => ({
      id: anchor,
      cell: cell + 1,
      title: r.title,
      text: r.text,
      ...(r.about ? { about: r.about } : {}),
    })),
    tables: tablesShown(document, run),
    methods: run.methods.map((m) => ({ topic: m.topic, statement: m.statement })),
    methodsMissingFrom: (run.methodsMissingFrom ?? []).map((i) => i + 1),
    filesRead: run.filesRead.map((f) => ({
      path: displayPath(f.path, dir, "relative"),
      sha256: f.sha256 ?? null,
      cells: f.cells.map((i) => i + 1),
      ...(f.imported ? { imported: true } : {}),
    })),
    events: [...run.events],
    ...(run.batch ? { batch: { ...run.batch, dataFile: String(run.inputs[run.batch.input]) } } : {}),
  };
}

/** The tables of the run with the numbers and captions the report gives them (from the report model). */
function tablesShown(document: NotebookDocument, run: RunRecord): EmbeddedTable[] {
  const tables: EmbeddedTable[] = [];
  for (const view of reportModel(document, run).cells)
    for (const o of view.outputs)
      if (o.record.kind === "table")
        tables.push({
          number: o.number ?? tables.length + 1,
          cell: view.cell.index + 1,
          ...(o.record.caption !== undefined ? { caption: o.record.caption } : {}),
          columns: o.record.columns.map((c) => ({
            label: c.label,
            ...(c.unit !== undefined ? { unit: c.unit } : {}),
            numeric: c.numeric,
          })),
          rows: o.record.rows.map((r) => [...r]),
          totalRows: o.record.totalRows,
        });
  return tables;
}

function embeddedError(error: ErrorRecord, dir: string): NonNullable<EmbeddedCell["error"]> {
  return {
    failure: error.failure,
    ...(error.name ? { name: error.name } : {}),
    message: error.message,
    ...(error.location
      ? {
          location: {
            file: displayPath(error.location.file, dir, "relative"),
            line: error.location.line,
            column: error.location.column,
          },
        }
      : {}),
  };
}

/** The `<script>` element that carries the record; its JSON cannot close the element (no `<`, `>` or `&` in it). */
export function runRecordScript(record: EmbeddedRunRecord): string {
  return `<script type="application/json" id="${RUN_RECORD_ELEMENT_ID}">${jsonForScript(record)}</script>`;
}

/** Reads the embedded run record back from a report's HTML (for tests and tools); throws when there is none. */
export function readEmbeddedRunRecord(html: string): EmbeddedRunRecord {
  const m = new RegExp(`<script type="application/json" id="${RUN_RECORD_ELEMENT_ID}">([^<]*)</script>`).exec(
    html,
  );
  if (!m)
    throw new Error(
      `no <script id="${RUN_RECORD_ELEMENT_ID}"> element in this HTML; is it a tristim report?`,
    );
  const record = JSON.parse(m[1]!) as EmbeddedRunRecord;
  if (record.format !== RUN_RECORD_FORMAT)
    throw new Error(
      `the embedded record has format ${JSON.stringify(record.format)}, not "${RUN_RECORD_FORMAT}"`,
    );
  return record;
}
