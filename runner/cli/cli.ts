/**
 * The `tristim` command: `run` and `watch`. Turns every expected problem into a clear message and an exit code
 * (exit-codes.ts); only an internal error mentions the runner's own code, and its stack only with TRISTIM_DEBUG=1.
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import type { ErrorRecord } from "../../cells/records.ts";
import { NotebookError, UsageError } from "../shared/errors.ts";
import { parseEachArgument, parseShardArgument, runBatch, type EachOption } from "../batch/batch.ts";
import { batchResults } from "../batch/batch-index.ts";
import { embeddedRunRecord } from "../report/embedded-run-record.ts";
import { prewarmReport, reportTitle } from "../report/render-report.ts";
import { resultsFile, resultsText, type RunResult } from "../report/results-file.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";
import { runExitCode } from "../records/run-outcome.ts";
import { ProgressLine } from "./progress.ts";
import { pdfPathFor } from "../report/pdf-path.ts";
import type { CommandOptions, Io } from "./command-options.ts";
import { checkResults } from "../records/check-results.ts";
import { EXIT, worseExit, type ExitCode } from "../shared/exit-codes.ts";
import { helpText } from "./help.ts";
import { parseInputArgument, resolveInputs } from "../execute/inputs.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import { readNotebook } from "../parse/parse-notebook.ts";
import { defaultReportPath, saveReport } from "../report/report-file.ts";
import { formatDuration } from "../text/duration.ts";
import { displayLocation, errorHeadline } from "../text/error-text.ts";
import { displayPath } from "../text/display-path.ts";
import { checkLine } from "../text/check-text.ts";
import { describeCells } from "../text/cell-numbers.ts";
import { PACKAGE_ROOT } from "../shared/package-root.ts";
import { escapeControls, indentLines, notebookErrorText } from "../text/terminal-text.ts";
import type { RunRecord } from "../records/run-record.ts";
import { runDocument } from "../execute/run-notebook.ts";
import { RuntimeBuildError } from "../execute/runtime-bundle.ts";
import { parseTimeLimit } from "../shared/time-limit.ts";
import { toolVersion } from "../shared/tool-version.ts";
import {
  clashingFile,
  makeReportFolder,
  ReportFolderError,
  notebookGuardedFiles,
  type GuardedFile,
} from "../shared/output-path.ts";
import { DEFAULT_PORT, startWatch } from "../watch/watch.ts";

const terminal: Io = {
  out: (t) => void process.stdout.write(t),
  err: (t) => void process.stderr.write(t),
  ...(process.stderr.isTTY ? { progress: (t: string) => void process.stderr.write(t) } : {}),
};

/** Runs the command line; resolves to the exit code (watch resolves when the server stops). */
export async function main(argv: readonly string[], given: Io = terminal): Promise<ExitCode> {
  // Everything printed may hold text from data or cells: control characters are shown escaped, never obeyed.
  const io: Io = {
    out: (t) => given.out(escapeControls(t)),
    err: (t) => given.err(escapeControls(t)),
    ...(given.progress ? { progress: given.progress } : {}),
  };
  try {
    return await dispatch(argv, io);
  } catch (e) {
    if (e instanceof UsageError) {
      io.err(`tristim: ${e.message}\nRun "tristim --help" for the commands and options.\n`);
      return EXIT.usage;
    }
    if (e instanceof NotebookError) {
      io.err(notebookErrorText(e, shown(e.file)));
      return EXIT.notebookFailed;
    }
    if (e instanceof ReportFolderError) {
      io.err(`tristim: the reports could not be written: ${e.message}\n`);
      return EXIT.internal;
    }
    if (e instanceof RuntimeBuildError) {
      io.err(`tristim: ${e.message}\n`);
      return EXIT.internal;
    }
    const error = e as Error;
    io.err(
      `tristim: internal error: ${error?.message ?? String(e)}\n${process.env.TRISTIM_DEBUG ? `${error?.stack}\n` : "(set TRISTIM_DEBUG=1 to see where it happened)\n"}`,
    );
    return EXIT.internal;
  }
}

async function dispatch(argv: readonly string[], io: Io): Promise<ExitCode> {
  const [command, ...rest] = argv;
  if (command === undefined || command === "help" || command === "--help" || command === "-h") {
    io.out(helpText(toolVersion().version));
    return command === undefined ? EXIT.usage : EXIT.ok;
  }
  if (command === "--version" || command === "-v") {
    io.out(`${toolVersion().version}\n`);
    return EXIT.ok;
  }
  if (command === "reference") {
    // Loaded on demand: the TypeScript compiler it reads the doc comments with is large.
    const { referenceCommand } = await import("../reference/command.ts");
    return (await referenceCommand(rest, { write: io.out })) as ExitCode;
  }
  if (command === "typecheck" || command === "editor-types") {
    // Loaded only here: the type check brings in the TypeScript compiler, which run and watch need not load.
    const run =
      command === "typecheck"
        ? (await import("../typecheck/typecheck-command.ts")).typecheckCommand
        : (await import("../typecheck/editor-types.ts")).editorTypesCommand;
    const exit = run(rest, io);
    if (exit === "help") io.out(helpText(toolVersion().version));
    return exit === "help" ? EXIT.ok : exit;
  }
  if (command === "collate") {
    const { collateCommand } = await import("../batch/collate.ts");
    const exit = collateCommand(rest, io, shown);
    if (exit === "help") io.out(helpText(toolVersion().version));
    return exit === "help" ? EXIT.ok : exit;
  }
  if (command === "restore") {
    const { restoreCommand } = await import("../report/restore.ts");
    const exit = restoreCommand(rest, io, shown);
    if (exit === "help") io.out(helpText(toolVersion().version));
    return exit === "help" ? EXIT.ok : exit;
  }
  if (command !== "run" && command !== "watch") {
    throw new UsageError(
      `unknown command "${command}"; the commands are run, watch, collate, restore, typecheck, editor-types, reference and help`,
    );
  }
  const { options, files, help } = parseOptions(rest, command);
  if (help) {
    io.out(helpText(toolVersion().version));
    return EXIT.ok;
  }
  if (command === "run") return runCommand(files, options, io);
  if (files.length !== 1) throw new UsageError(`watch takes exactly one notebook, got ${files.length}`);
  const document = readNotebook(files[0]!);
  const watched = resolveInputs(document.frontMatter.inputs, options.inputs, shown(document.path));
  refuseClash(
    options.output ? path.resolve(options.output) : defaultReportPath(document.path),
    notebookGuardedFiles(document.path, watched.inputs),
  );
  const watcher = await startWatch(document.path, { ...options, io });
  io.out(`Serving ${watcher.url} - watching ${shown(document.path)} (Ctrl+C to stop)\n`);
  await new Promise<void>((resolve) => {
    const stop = () => void watcher.close().then(resolve);
    process.once("SIGINT", stop);
    process.once("SIGTERM", stop);
  });
  return EXIT.ok;
}

/** Reads and checks the options after the command. */
export function parseOptions(
  args: readonly string[],
  command: "run" | "watch",
): { options: CommandOptions; files: string[]; help: boolean } {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...args],
      allowPositionals: true,
      strict: true,
      options: {
        output: { type: "string", short: "o" },
        input: { type: "string", multiple: true },
        "time-limit": { type: "string" },
        "keep-going": { type: "boolean" },
        "link-assets": { type: "boolean" },
        quiet: { type: "boolean" },
        port: { type: "string" },
        reproducible: { type: "boolean" },
        each: { type: "string", multiple: true },
        typecheck: { type: "boolean" },
        "no-typecheck": { type: "boolean" },
        jobs: { type: "string" },
        shard: { type: "string" },
        results: { type: "string", multiple: true },
        pdf: { type: "boolean" },
        "fresh-process": { type: "boolean" },
        help: { type: "boolean", short: "h" },
      },
    });
  } catch (e) {
    throw new UsageError(
      (e as Error).message
        .replace(/\. To specify a positional argument.*$/s, "")
        .replace(/^Unknown option/, "unknown option"),
    );
  }
  const v = parsed.values;
  if (v.help)
    return {
      options: {
        inputs: {},
        keepGoing: false,
        linkAssets: false,
        quiet: false,
        port: DEFAULT_PORT,
        reproducible: false,
      },
      files: [],
      help: true,
    };
  if (v.port !== undefined && command !== "watch")
    throw new UsageError("--port is an option of watch, not of run");
  if (v.each !== undefined && command !== "run")
    throw new UsageError("--each is an option of run, not of watch");
  if (v.reproducible && command !== "run")
    throw new UsageError("--reproducible is an option of run, not of watch");
  if (v.typecheck && command !== "run")
    throw new UsageError("--typecheck is an option of run (watch checks unless given --no-typecheck)");
  if (v["no-typecheck"] && command !== "watch")
    throw new UsageError("--no-typecheck is an option of watch (run checks only when given --typecheck)");
  if ((v.each?.length ?? 0) > 1)
    throw new UsageError("--each can be given once (one input takes the data files)");
  const each = v.each?.[0] === undefined ? undefined : parseEachArgument(v.each[0]);
  if (v.jobs !== undefined && command !== "run")
    throw new UsageError("--jobs is an option of run (it sets how many runs go at once), not of watch");
  const jobs = v.jobs === undefined ? undefined : parseJobs(v.jobs);
  if (v.shard !== undefined && each === undefined)
    throw new UsageError("--shard is an option of run --each (it runs one slice of the batch's data files)");
  const shard = v.shard === undefined ? undefined : parseShardArgument(v.shard);
  if (v.results !== undefined && command !== "run")
    throw new UsageError("--results is an option of run, not of watch");
  if (v.pdf && command !== "run") throw new UsageError("--pdf is an option of run, not of watch");
  if (v["fresh-process"] && command !== "run")
    throw new UsageError(
      "--fresh-process is an option of run (watch starts a new cell process for each run)",
    );
  for (const file of v.results ?? []) {
    if (!/\.(json|csv)$/i.test(file))
      throw new UsageError(
        `--results ${file}: the file name must end in .json (every result) or .csv (the acceptance checks)`,
      );
  }
  const inputs: Record<string, string> = {};
  for (const argument of v.input ?? []) {
    const [name, value] = parseInputArgument(argument);
    if (Object.hasOwn(inputs, name)) throw new UsageError(`--input ${name} is given twice`);
    inputs[name] = value;
  }
  let port = DEFAULT_PORT;
  if (v.port !== undefined) {
    port = Number(v.port);
    if (!/^\d+$/.test(v.port) || port > 65535)
      throw new UsageError(`--port expects a port number from 0 to 65535, got "${v.port}"`);
  }
  if (parsed.positionals.length === 0)
    throw new UsageError(
      `${command} needs a notebook file, e.g. tristim ${command} notebooks/getting-started.md`,
    );
  return {
    files: parsed.positionals,
    help: false,
    options: {
      output: v.output,
      inputs,
      timeLimitMs:
        v["time-limit"] === undefined ? undefined : parseTimeLimit(v["time-limit"], "--time-limit"),
      keepGoing: v["keep-going"] === true,
      linkAssets: v["link-assets"] === true,
      quiet: v.quiet === true,
      port,
      reproducible: v.reproducible === true,
      typecheck: command === "watch" ? v["no-typecheck"] !== true : v.typecheck === true,
      ...(each ? { each } : {}),
      ...(jobs !== undefined ? { jobs } : {}),
      ...(shard ? { shard } : {}),
      ...(v.results?.length ? { results: v.results.map((f) => path.resolve(f)) } : {}),
      ...(v.pdf ? { pdf: true } : {}),
      ...(v["fresh-process"] ? { freshProcess: true } : {}),
    },
  };
}

/** Reads --jobs: a whole number of runs at the same time, at least 1. */
function parseJobs(text: string): number {
  const jobs = Number(text);
  if (!/^\d+$/.test(text.trim()) || !Number.isSafeInteger(jobs) || jobs < 1)
    throw new UsageError(
      `--jobs expects how many runs go at the same time, a whole number from 1, got "${text}"`,
    );
  return jobs;
}

/** Where the report of `notebook` goes, given -o and the number of notebooks. */
export function reportPathFor(notebook: string, output: string | undefined, several: boolean): string {
  if (output === undefined) return defaultReportPath(notebook);
  const isFolder = several || output.endsWith("/") || output.endsWith(path.sep) || isDirectory(output);
  if (isFolder) return path.join(path.resolve(output), path.basename(defaultReportPath(notebook)));
  return path.resolve(output);
}

async function runCommand(files: string[], options: CommandOptions, io: Io): Promise<ExitCode> {
  if (options.typecheck) {
    const { typecheckFiles } = await import("../typecheck/typecheck-command.ts");
    if (typecheckFiles(files, io, { quiet: true }) !== EXIT.ok) {
      io.err("not run: the type check found errors (run without --typecheck to run anyway)\n");
      return EXIT.notebookFailed;
    }
  }
  if (options.each) {
    if (files.length !== 1)
      throw new UsageError(`--each runs one notebook once per data file; got ${files.length} notebooks`);
    return eachCommand(readNotebook(files[0]!), options.each, options, io);
  }
  let exit: ExitCode = EXIT.ok;
  const documents: NotebookDocument[] = [];
  for (const file of files) {
    try {
      documents.push(readNotebook(file));
    } catch (e) {
      if (!(e instanceof NotebookError)) throw e;
      io.err(notebookErrorText(e, shown(e.file)));
      exit = EXIT.notebookFailed;
    }
  }
  // Check the inputs against every notebook before running any of them.
  for (const document of documents)
    resolveInputs(document.frontMatter.inputs, options.inputs, shown(document.path));
  const several = files.length > 1;
  if (
    several &&
    options.output !== undefined &&
    fs.existsSync(options.output) &&
    !isDirectory(options.output)
  ) {
    throw new UsageError(`-o ${options.output}: with several notebooks, -o must name a folder`);
  }
  // A report never replaces a notebook of this command or a file one of them takes as an input.
  const guarded = documents.flatMap((d) =>
    notebookGuardedFiles(d.path, resolveInputs(d.frontMatter.inputs, options.inputs, shown(d.path)).inputs),
  );
  for (const document of documents)
    refuseClash(reportPathFor(document.path, options.output, several), guarded);
  for (const file of options.results ?? []) refuseClash(file, guarded);
  const startedAt = new Date().toISOString();
  const results: (RunResult | undefined)[] = documents.map(() => undefined);
  const progress =
    io.progress && documents.length > 1 && !options.quiet
      ? new ProgressLine(documents.length, io.progress)
      : undefined;
  progress?.draw();
  // Runs go `jobs` at a time, each in a cell process of its own; each one's messages are printed strictly in the
  // order of the notebooks, so the output is that of a run one at a time.
  await inOrder(
    documents.length,
    options.jobs ?? os.availableParallelism(),
    async (i) => {
      const document = documents[i]!;
      const run = await runDocument(document, {
        onCell: prewarmReport(document),
        inputs: options.inputs,
        timeLimitMs: options.timeLimitMs,
        keepGoing: options.keepGoing,
        reproducible: options.reproducible,
        shareProcess: options.freshProcess !== true,
      });
      const target = reportPathFor(document.path, options.output, several);
      const read = clashingFile(target, readByCells(run));
      if (read)
        return {
          document,
          run,
          target,
          problem: `${clashText(target, read)}; nothing was written`,
          code: EXIT.usage,
        };
      try {
        makeReportFolder(path.dirname(target));
        saveReport(document, run, target, options.linkAssets);
      } catch (e) {
        // A fault in the notebook found while writing (math in the prose that cannot be typeset): its file and line.
        if (e instanceof NotebookError) {
          const [first, ...frame] = notebookErrorText(e, shown(e.file)).split("\n");
          const text = [`${first}; nothing was written`, ...frame].join("\n");
          return { document, run, target, problemText: text, code: EXIT.notebookFailed };
        }
        return {
          document,
          run,
          target,
          problem: `the report could not be written to ${shown(target)}: ${(e as Error).message}`,
          code: EXIT.internal,
        };
      }
      const pdfProblem = options.pdf ? await writePdfBeside(target) : undefined;
      return { document, run, target, pdfProblem, code: runExitCode(run) };
    },
    (done, i) => {
      progress?.clear();
      const { document, run, target } = done;
      let code: ExitCode = done.code;
      if (done.problemText !== undefined) io.err(done.problemText);
      else if (done.problem) io.err(`${shown(document.path)}: ${done.problem}\n`);
      else {
        code = printOutcome(document, run, target, options, io);
        if (done.pdfProblem) {
          io.err(`${shown(document.path)}: ${done.pdfProblem}\n`);
          code = worseExit(code, EXIT.internal);
        } else if (options.pdf && !options.quiet) io.out(`  and ${shown(pdfPathFor(target))}\n`);
      }
      exit = worseExit(exit, code);
      results[i] = {
        position: i + 1,
        ...(done.problem
          ? {}
          : { report: path.relative(resultsBase(options), target).split(path.sep).join("/") }),
        exitCode: code,
        record: embeddedRunRecord(document, run, reportTitle(document)),
      };
      progress?.finished(code !== EXIT.ok);
    },
  );
  progress?.clear();
  if (options.pdf) await (await import("../report/pdf.ts")).closePdfPrinter();
  if (options.results?.length) {
    const file = resultsFile(
      results.filter((r): r is RunResult => r !== undefined),
      { tool: toolVersion(), reproducible: options.reproducible, startedAt },
    );
    exit = worseExit(exit, writeResults(file, options.results, io));
  }
  return exit;
}

/** The folder report paths in a results file are relative to (the first results file's). */
function resultsBase(options: CommandOptions): string {
  return path.dirname(options.results?.[0] ?? path.join(process.cwd(), "results.json"));
}

/** Writes the results to each --results file (atomically); returns 4 when one could not be written. */
function writeResults(results: ReturnType<typeof resultsFile>, files: readonly string[], io: Io): ExitCode {
  let exit: ExitCode = EXIT.ok;
  for (const file of files) {
    try {
      writeFileAtomic(file, resultsText(results, file));
    } catch (e) {
      io.err(`tristim: the results could not be written to ${shown(file)}: ${(e as Error).message}\n`);
      exit = EXIT.internal;
    }
  }
  return exit;
}

/**
 * Runs `start(i)` for i = 0 … count − 1, `jobs` at a time, and calls `take` with each result strictly in order of
 * i (a finished run waits until all earlier ones are taken). A failure of `start` (an internal error) stops
 * scheduling further runs and is raised after the running ones end.
 */
async function inOrder<T>(
  count: number,
  jobs: number,
  start: (i: number) => Promise<T>,
  take: (result: T, i: number) => void,
): Promise<void> {
  const finished: ({ value: T } | undefined)[] = Array.from({ length: count }, () => undefined);
  let taken = 0;
  let next = 0;
  let failure: { error: unknown } | undefined;
  const worker = async () => {
    while (next < count && !failure) {
      const i = next++;
      try {
        finished[i] = { value: await start(i) };
      } catch (error) {
        failure ??= { error };
        return;
      }
      for (let r = finished[taken]; r && !failure; r = finished[taken]) {
        finished[taken] = undefined;
        take(r.value, taken++);
      }
    }
  };
  await Promise.all(Array.from({ length: Math.max(1, Math.min(jobs, count)) }, worker));
  if (failure) throw failure.error;
}

/** Prints the report beside its HTML as <report>.pdf; returns what went wrong, or undefined. */
async function writePdfBeside(report: string): Promise<string | undefined> {
  const { printReportToPdf, pdfPathFor } = await import("../report/pdf.ts");
  try {
    await printReportToPdf(report, pdfPathFor(report));
    return undefined;
  } catch (e) {
    return `the PDF was not written (the HTML report was): ${(e as Error).message}`;
  }
}

/** Throws a UsageError when the report path is a guarded file (before anything runs or is written). */
function refuseClash(target: string, guarded: readonly GuardedFile[]): void {
  const clash = clashingFile(target, guarded);
  if (clash) throw new UsageError(`${clashText(target, clash)}; nothing was run or written`);
}

function clashText(target: string, clash: GuardedFile): string {
  return `the report path ${shown(target)} is ${clash.what}${sameShown(target, clash.path) ? "" : ` (${shown(clash.path)})`}, which the report would replace; choose another path with -o`;
}

function sameShown(a: string, b: string): boolean {
  return shown(a) === shown(b);
}

/** The files the cells of a run read or imported, as guarded files. */
function readByCells(run: RunRecord): GuardedFile[] {
  return run.filesRead.map((f) => ({
    path: f.path,
    what: `a file ${describeCells(f.cells.map((c) => c + 1))} ${f.imported ? "imported" : "read"}`,
  }));
}

/** Runs one notebook once per data file; prints a line per run and where the index is. */
async function eachCommand(
  document: NotebookDocument,
  each: EachOption,
  options: CommandOptions,
  io: Io,
): Promise<ExitCode> {
  resolveInputs(document.frontMatter.inputs, options.inputs, shown(document.path));
  const guarded = notebookGuardedFiles(document.path, {});
  for (const file of options.results ?? []) refuseClash(file, guarded);
  let progress: ProgressLine | undefined;
  const batch = await runBatch(document, each, {
    ...options,
    jobs: options.jobs ?? os.availableParallelism(),
    cwd: process.cwd(),
    onStart: (count) => {
      if (io.progress && !options.quiet && count > 1)
        (progress = new ProgressLine(count, io.progress)).draw();
    },
    onRun: (run, place) => {
      progress?.clear();
      const label = `${shown(document.path)} [${place.position}/${place.count} ${each.input}=${place.dataFile}]`;
      let code: ExitCode = EXIT.internal;
      if (place.report) code = printOutcome(document, run, place.report, options, io, label);
      else io.err(`${label}: the report could not be written: ${place.error}\n`);
      if (place.pdfError) io.err(`${label}: ${place.pdfError}\n`);
      progress?.finished(code !== EXIT.ok || place.pdfError !== undefined);
    },
  });
  progress?.clear();
  let exit = batch.exit;
  const { index, entries } = batch;
  if (options.results?.length)
    exit = worseExit(exit, writeResults(batchResults(batch.record), options.results, io));
  const ok = entries.filter((e) => e.exit === EXIT.ok).length;
  const shard = options.shard
    ? ` (shard ${options.shard.index} of ${options.shard.of} of ${batch.record.count} data files)`
    : "";
  const line = `${entries.length === 1 ? "1 run" : `${entries.length} runs`}${shard}, ${ok} passed -> ${shown(index)}\n`;
  if (exit === EXIT.ok) {
    if (!options.quiet) io.out(line);
  } else io.err(line);
  return exit;
}

/** Prints one notebook's outcome (failed cells, then failed checks, on the error stream); returns its exit code. */
export function printOutcome(
  document: NotebookDocument,
  run: RunRecord,
  target: string,
  options: Pick<CommandOptions, "quiet">,
  io: Io,
  label = shown(document.path),
): ExitCode {
  const failures = run.cells.filter((c) => c.status === "failed" && !c.failureAllowed);
  const ran = run.cells.filter((c) => c.status === "ok" || c.status === "failed").length;
  const checks = checkResults(run);
  const failedChecks = checks.filter((c) => !c.record.passed);
  if (failures.length === 0) {
    const checkText =
      checks.length === 0
        ? ""
        : failedChecks.length === 0
          ? `, ${checks.length === 1 ? "1 check" : `${checks.length} checks`} passed${marginalPasses(checks)}`
          : `, ${failedChecks.length} of ${checks.length === 1 ? "1 check" : `${checks.length} checks`} FAILED`;
    const line = `${label}: ${ran === 1 ? "1 cell" : `${ran} cells`} ran in ${formatDuration(run.durationMs)}${checkText} -> ${shown(target)}\n`;
    if (failedChecks.length === 0) {
      if (!options.quiet) {
        io.out(line);
        for (const c of checks)
          if (c.record.decision?.outcome === "marginal pass")
            io.out(`  marginal pass (cell ${c.cell + 1}): ${checkLine(c.record)}\n`);
      }
      return EXIT.ok;
    }
    io.err(line);
    for (const c of failedChecks) io.err(`  check failed (cell ${c.cell + 1}): ${checkLine(c.record)}\n`);
    return EXIT.checkFailed;
  }
  const dir = path.dirname(document.path);
  if (label !== shown(document.path))
    io.err(`${label}: ${failures.length === 1 ? "a cell" : `${failures.length} cells`} failed\n`);
  for (const cell of failures) {
    const error = cell.outputs.find((o): o is ErrorRecord => o.kind === "error");
    const where = error?.location ? displayLocation(error.location, dir) : shown(document.path);
    const place =
      error?.location && error.location.file === document.path
        ? `${shown(document.path)}:${error.location.line}:${error.location.column}`
        : where;
    // Raised in a helper file the cell imported: the notebook's place first, then the helper's own.
    const raised = error?.stack?.[0];
    const helper =
      raised &&
      error?.location?.file === document.path &&
      raised.file !== document.path &&
      !isLibraryFile(raised.file)
        ? `  raised in ${displayLocation(raised, dir)}\n`
        : "";
    io.err(
      `${place}: cell ${cell.index + 1} failed: ${error ? errorHeadline(error) : "failed"}\n${helper}${error?.codeFrame ? `${indentLines(error.codeFrame)}\n` : ""}`,
    );
  }
  const notRun = run.cells.filter((c) => c.status === "not-run").map((c) => c.index + 1);
  // A notebook with a cell that does not compile runs no cell at all (ExecutionState.refuseUncompiled): every
  // failure is a compile error and no cell took any time.
  const ranNothing = run.cells.every(
    (c) =>
      c.durationMs === undefined &&
      (c.status !== "failed" || c.outputs.some((o) => o.kind === "error" && o.failure === "compile")),
  );
  if (notRun.length)
    io.err(
      `  ${describeCells(notRun)} not run${ranNothing ? ": a notebook runs when all its cells compile" : ""} (use --keep-going to run them anyway)\n`,
    );
  for (const c of failedChecks) io.err(`  check failed (cell ${c.cell + 1}): ${checkLine(c.record)}\n`);
  io.err(`  report with the error: ${shown(target)}\n`);
  return EXIT.notebookFailed;
}

/** True for a file of tristim itself (its library), whose place means little to the notebook's author. */
function isLibraryFile(file: string): boolean {
  return file.startsWith(PACKAGE_ROOT + path.sep);
}

function isDirectory(p: string): boolean {
  try {
    return fs.statSync(p).isDirectory();
  } catch {
    return false;
  }
}

/** A path as the user would type it: relative to the working folder when inside it. */
function shown(file: string): string {
  return displayPath(file, process.cwd(), "as given");
}

/** ", 1 of them marginal" when passes were decided with value ± U reaching across a limit (ILAC-G8:2019 §4.2). */
function marginalPasses(checks: readonly { record: { decision?: { outcome: string } } }[]): string {
  const n = checks.filter((c) => c.record.decision?.outcome === "marginal pass").length;
  return n === 0 ? "" : `, ${n} of them marginal`;
}
