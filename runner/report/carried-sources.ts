/**
 * The sources a report carries so that it can be run again from the report alone: the notebook's text and the files
 * its cells read or imported (within the limits of shared/carried-files.ts), as
 * `<script type="application/json" id="tristim-sources">`, and the command that runs them again. `tristim restore`
 * (restore.ts) writes them back into a folder. Built from the run record only.
 */
import path from "node:path";
import type { NotebookDocument } from "../parse/notebook.ts";
import type { RunRecord } from "../records/run-record.ts";
import { CARRIED_FILE_LIMIT, CARRIED_TOTAL_LIMIT } from "../shared/carried-files.ts";
import { DEFAULT_TIME_LIMIT_MS } from "../shared/time-limit.ts";
import { displayPath } from "../text/display-path.ts";
import { jsonForScript } from "./escape.ts";

export const SOURCES_ELEMENT_ID = "tristim-sources";
export const SOURCES_FORMAT = "tristim-sources";
export const SOURCES_VERSION = 1;

/** One file the cells used: carried (base64) or named as missing, with its SHA-256. */
export interface CarriedFile {
  /** Relative to the notebook's folder, with forward slashes. */
  readonly path: string;
  readonly sha256: string | null;
  readonly base64?: string;
  /** Why it is not carried. */
  readonly missing?: string;
}

/** What the report carries. */
export interface CarriedSources {
  readonly format: typeof SOURCES_FORMAT;
  readonly version: typeof SOURCES_VERSION;
  readonly limits: { readonly fileBytes: number; readonly totalBytes: number };
  readonly notebook: { readonly file: string; readonly sha256: string; readonly base64: string };
  readonly files: readonly CarriedFile[];
  /** The arguments of `tristim run` that give this report again, run in the restored folder. */
  readonly rerun: readonly string[];
}

/** The carried sources of a run. */
export function carriedSources(
  document: NotebookDocument,
  run: RunRecord,
  options: { linkAssets: boolean },
): CarriedSources {
  const dir = path.dirname(document.path);
  return {
    format: SOURCES_FORMAT,
    version: SOURCES_VERSION,
    limits: { fileBytes: CARRIED_FILE_LIMIT, totalBytes: CARRIED_TOTAL_LIMIT },
    notebook: {
      file: path.basename(document.path),
      sha256: run.notebook.sha256,
      base64: Buffer.from(document.text, "utf8").toString("base64"),
    },
    files: run.filesRead.map((f) => ({
      path: displayPath(f.path, dir, "relative").split(path.sep).join("/"),
      sha256: f.sha256 ?? null,
      ...(f.content !== undefined ? { base64: f.content } : { missing: f.notCarried ?? "not carried" }),
    })),
    rerun: rerunArguments(document, run, options),
  };
}

/** `run --reproducible nb.md` with the options that shaped the report. */
function rerunArguments(
  document: NotebookDocument,
  run: RunRecord,
  options: { linkAssets: boolean },
): string[] {
  const args = ["run", "--reproducible", path.basename(document.path)];
  for (const [name, value] of Object.entries(run.inputsSet))
    args.push("--input", `${name}=${typeof value === "string" ? value : JSON.stringify(value)}`);
  if (run.batch) args.push("--input", `${run.batch.input}=${String(run.inputs[run.batch.input])}`);
  if (run.timeLimitMs !== DEFAULT_TIME_LIMIT_MS) args.push("--time-limit", `${run.timeLimitMs}ms`);
  if (run.keepGoing) args.push("--keep-going");
  if (options.linkAssets) args.push("--link-assets");
  return args;
}

/** The command as one shell line (arguments quoted where a shell would split or expand them). */
export function shellLine(args: readonly string[]): string {
  return ["tristim", ...args]
    .map((a) => (/^[\w@%+=:,./-]+$/.test(a) ? a : `'${a.replaceAll("'", "'\\''")}'`))
    .join(" ");
}

/** The `<script>` element that carries the sources. */
export function sourcesScript(sources: CarriedSources): string {
  return `<script type="application/json" id="${SOURCES_ELEMENT_ID}">${jsonForScript(sources)}</script>`;
}

/** Reads the carried sources back from a report's HTML; throws when there are none. */
export function readCarriedSources(html: string): CarriedSources {
  const m = new RegExp(`<script type="application/json" id="${SOURCES_ELEMENT_ID}">([^<]*)</script>`).exec(
    html,
  );
  if (!m)
    throw new Error(
      `no <script id="${SOURCES_ELEMENT_ID}"> element: not a tristim report, or one made before reports carried their sources`,
    );
  const sources = JSON.parse(m[1]!) as CarriedSources;
  if (sources.format !== SOURCES_FORMAT || sources.version !== SOURCES_VERSION)
    throw new Error(
      `the carried sources have format ${JSON.stringify(sources.format)} version ${sources.version}; this tristim reads "${SOURCES_FORMAT}" version ${SOURCES_VERSION}`,
    );
  return sources;
}
