/**
 * `tristim run nb.md --each name=pattern`: runs one notebook once per data file, binding each file (as a path
 * relative to the notebook) to the named front-matter input, writes one report per file named after it and an
 * index page listing every run. The exit code is the worst over the runs.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { batchEntry, type BatchEntry, type BatchRecord } from "./batch-index.ts";
import { embeddedRunRecord } from "../report/embedded-run-record.ts";
import { UsageError } from "../shared/errors.ts";
import { EXIT, worseExit, type ExitCode } from "../shared/exit-codes.ts";
import { expandFilePattern, reportNamesFor } from "./file-pattern.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import { saveReport } from "../report/report-file.ts";
import { makeReportFolder } from "../shared/output-path.ts";
import { renderBatchIndex } from "../report/render-index.ts";
import { prewarmReport, reportTitle } from "../report/render-report.ts";
import { runDocument, sharedRunParts, type SharedRunParts } from "../execute/run-notebook.ts";
import { runExitCode } from "../records/run-outcome.ts";
import type { RunRecord } from "../records/run-record.ts";
import { toolVersion } from "../shared/tool-version.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";

/** Where a run of the batch stands, for the terminal. */
export interface BatchRunPlace {
  readonly position: number;
  readonly count: number;
  readonly dataFile: string;
  readonly report?: string;
  readonly error?: string;
  /** Why the PDF (--pdf) was not written; the HTML report was. */
  readonly pdfError?: string;
}

/** One finished run of a batch, waiting to be taken in the order of the files. */
interface BatchRunResult {
  readonly run: RunRecord;
  readonly place: BatchRunPlace;
  readonly code: ExitCode;
  readonly entry: BatchEntry;
}

/** A batch as given on the command line. */
export interface EachOption {
  readonly input: string;
  readonly pattern: string;
}

/** What the batch needs from the command's options. */
export interface BatchOptions {
  readonly output?: string;
  readonly inputs: Readonly<Record<string, string>>;
  readonly timeLimitMs?: number;
  readonly keepGoing: boolean;
  readonly linkAssets: boolean;
  readonly reproducible: boolean;
  /** How many runs go at the same time (default 1); the results are taken in the order of the files all the same. */
  readonly jobs?: number;
  /** Run only the index-th (1-based) of `of` slices of the data files (--shard K/N). */
  readonly shard?: { readonly index: number; readonly of: number };
  /** The working folder the pattern is relative to. */
  readonly cwd: string;
  /** Print each report to <report>.pdf as well (--pdf). */
  readonly pdf?: boolean;
  /** Start a new cell process for every run instead of handing a clean one on (--fresh-process). */
  readonly freshProcess?: boolean;
  /** Called once the batch's runs are known, with their number (for a progress line). */
  readonly onStart?: (count: number) => void;
  /** Called after each run (for the terminal); `report` is absent and `error` set when the report could not be written. */
  readonly onRun?: (run: RunRecord, place: BatchRunPlace) => void;
}

/** Splits `name=pattern` as written after --each. */
export function parseEachArgument(argument: string): EachOption {
  const at = argument.indexOf("=");
  const input = at < 0 ? "" : argument.slice(0, at).trim();
  const pattern = at < 0 ? "" : argument.slice(at + 1);
  if (!/^[A-Za-z_$][\w$]*$/.test(input) || pattern === "") {
    throw new UsageError(`--each expects input=files, e.g. --each data=lots/*.csv, got "${argument}"`);
  }
  return { input, pattern };
}

/** The folder a batch writes to: -o, or `<notebook>-reports` beside the notebook. */
export function batchFolder(notebook: string, output: string | undefined): string {
  if (output !== undefined) return path.resolve(output);
  return path.join(
    path.dirname(notebook),
    `${path.basename(notebook).replace(/\.(md|markdown)$/i, "")}-reports`,
  );
}

/** The data files of a batch, checked against the notebook's inputs before anything runs. */
export function batchFiles(
  document: NotebookDocument,
  each: EachOption,
  options: Pick<BatchOptions, "inputs" | "cwd">,
): string[] {
  const declared = document.frontMatter.inputs;
  if (!Object.hasOwn(declared, each.input)) {
    const known = Object.keys(declared);
    throw new UsageError(
      `--each ${each.input}=...: ${path.basename(document.path)} has no input named "${each.input}" ` +
        `(${known.length ? `its inputs: ${known.join(", ")}` : "it declares no inputs in its front matter"})`,
    );
  }
  if (typeof declared[each.input] !== "string") {
    throw new UsageError(
      `--each ${each.input}=...: input "${each.input}" must have a text default (a file path) to take a data file; its default is ${JSON.stringify(declared[each.input])}`,
    );
  }
  if (Object.hasOwn(options.inputs, each.input))
    throw new UsageError(`input "${each.input}" is given by both --each and --input`);
  return expandFilePattern(each.pattern, options.cwd, `--each ${each.input}`);
}

/** The path a cell sees for a data file: relative to the notebook's folder, with forward slashes. */
export function pathForNotebook(file: string, notebookDir: string): string {
  const relative = path.relative(notebookDir, file);
  return path.isAbsolute(relative) ? file : relative.split(path.sep).join("/");
}

/** Runs the batch; writes the reports and the index; returns the worst exit code and where the index is. */
export async function runBatch(
  document: NotebookDocument,
  each: EachOption,
  options: BatchOptions,
): Promise<{ exit: ExitCode; index: string; entries: BatchEntry[]; record: BatchRecord }> {
  const allFiles = batchFiles(document, each, options);
  const slice = shardSlice(allFiles.length, options.shard);
  const files = allFiles.slice(slice.start, slice.end);
  const folder = batchFolder(document.path, options.output);
  if (fs.existsSync(folder) && !fs.statSync(folder).isDirectory()) {
    throw new UsageError(
      `-o ${options.output}: with --each, -o must name a folder (it gets one report per data file and index.html)`,
    );
  }
  makeReportFolder(folder);
  // Report names from every file of the batch, so a shard names its reports as the whole batch does.
  const names = reportNamesFor(allFiles, path.dirname(document.path));
  const title = reportTitle(document);
  const startedAt = new Date().toISOString();
  const notebookDir = path.dirname(document.path);
  let exit: ExitCode = EXIT.ok;
  const entries: BatchEntry[] = [];
  // Runs go `jobs` at a time. The cells are compiled once for all of them. Each run gets a cell process that is
  // new or was left clean by an earlier run (with --fresh-process always a new one, a spare readied for the next
  // run while a run goes on). Their results are taken strictly in the order of the files, so the messages, the
  // index and every report are those of a run one at a time.
  const share = options.freshProcess !== true;
  let shared: SharedRunParts | undefined;
  // One for all the runs: the sources are highlighted once, each run's figures encoded as they come.
  const warmReport = prewarmReport(document);
  const finished: (BatchRunResult | undefined)[] = files.map(() => undefined);
  let taken = 0;
  const takeInOrder = () => {
    for (let result = finished[taken]; result; result = finished[taken]) {
      finished[taken++] = undefined;
      options.onRun?.(result.run, result.place);
      exit = worseExit(exit, result.code);
      entries.push(result.entry);
    }
  };
  let next = 0;
  let failure: { error: unknown } | undefined;
  const worker = async () => {
    while (next < files.length && !failure) {
      const i = next++;
      try {
        finished[i] = await runOne(i);
      } catch (error) {
        failure ??= { error };
        return;
      }
      takeInOrder();
    }
  };
  const runOne = async (i: number): Promise<BatchRunResult> => {
    const file = files[i]!;
    const dataFile = pathForNotebook(file, notebookDir);
    const sha256 = createHash("sha256").update(fs.readFileSync(file)).digest("hex");
    const run = await runDocument(document, {
      onCell: warmReport,
      inputs: { ...options.inputs, [each.input]: dataFile },
      timeLimitMs: options.timeLimitMs,
      keepGoing: options.keepGoing,
      reproducible: options.reproducible,
      batch: {
        input: each.input,
        pattern: each.pattern,
        position: slice.start + i + 1,
        count: allFiles.length,
      },
      prepareNext: !share && i + 1 < files.length,
      shareProcess: share,
      shared,
    });
    const name = names.get(file)!;
    let report: string | undefined = name;
    let error: string | undefined;
    try {
      saveReport(document, run, path.join(folder, name), options.linkAssets);
    } catch (e) {
      report = undefined;
      error = (e as Error).message;
    }
    let pdfError: string | undefined;
    if (report && options.pdf) {
      const { printReportToPdf, pdfPathFor } = await import("../report/pdf.ts");
      try {
        await printReportToPdf(path.join(folder, name), pdfPathFor(path.join(folder, name)));
      } catch (e) {
        pdfError = `the PDF was not written (the HTML report was): ${(e as Error).message}`;
      }
    }
    const runCode = report ? runExitCode(run) : EXIT.internal;
    // A PDF that could not be printed makes the command exit with 4; the run's own outcome stays in the index.
    const code = worseExit(runCode, pdfError ? EXIT.internal : EXIT.ok);
    const place: BatchRunPlace = {
      position: slice.start + i + 1,
      count: allFiles.length,
      dataFile,
      ...(report ? { report: path.join(folder, name) } : {}),
      ...(error ? { error } : {}),
      ...(pdfError ? { pdfError } : {}),
    };
    const entry = batchEntry({
      position: slice.start + i + 1,
      dataFile,
      dataFileSha256: sha256,
      ...(report ? { report } : {}),
      exitCode: runCode,
      record: embeddedRunRecord(document, run, title),
    });
    return { run, place, code, entry };
  };
  const jobs = Math.max(1, Math.min(options.jobs ?? 1, Math.max(1, files.length)));
  options.onStart?.(files.length);
  try {
    if (files.length > 0) shared = await sharedRunParts(document);
    await Promise.all(Array.from({ length: jobs }, worker));
  } finally {
    shared?.dispose();
    if (options.pdf) await (await import("../report/pdf.ts")).closePdfPrinter();
  }
  if (failure) throw failure.error;
  const tool = toolVersion();
  const record: BatchRecord = {
    notebook: { path: document.path, sha256: document.sha256, title },
    input: each.input,
    pattern: each.pattern,
    tool,
    node: process.version,
    platform: `${process.platform}-${process.arch}`,
    startedAt,
    reproducible: options.reproducible,
    count: allFiles.length,
    ...(options.shard ? { shard: options.shard } : {}),
    entries,
  };
  const index = path.join(folder, "index.html");
  try {
    writeFileAtomic(index, renderBatchIndex(record));
  } catch {
    exit = EXIT.internal;
  }
  return { exit, index, entries, record };
}

/** The files of shard `index` of `of` (1-based): contiguous slices in the order of the files, sizes differing by at most one. */
export function shardSlice(
  count: number,
  shard: { index: number; of: number } | undefined,
): { start: number; end: number } {
  if (!shard) return { start: 0, end: count };
  return {
    start: Math.floor(((shard.index - 1) * count) / shard.of),
    end: Math.floor((shard.index * count) / shard.of),
  };
}

/** Reads --shard K/N: whole numbers, 1 ≤ K ≤ N. */
export function parseShardArgument(text: string): { index: number; of: number } {
  const m = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  const index = m ? Number(m[1]) : NaN;
  const of = m ? Number(m[2]) : NaN;
  if (!m || !Number.isSafeInteger(of) || of < 1 || index < 1)
    throw new UsageError(
      `--shard expects K/N, the K-th of N slices of the batch, whole numbers with 1 <= K <= N (e.g. --shard 2/4), got "${text}"`,
    );
  if (index > of)
    throw new UsageError(`--shard ${text}: there is no shard ${index} of ${of} (K must be from 1 to ${of})`);
  return { index, of };
}
