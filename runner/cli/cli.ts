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
import { parseEachArgument, runBatch, type EachOption } from "../batch/batch.ts";
import type { CommandOptions, Io } from "./command-options.ts";
import { checkResults } from "../records/check-results.ts";
import { EXIT, worseExit, type ExitCode } from "../shared/exit-codes.ts";
import { helpText } from "./help.ts";
import { parseInputArgument, resolveInputs } from "../execute/inputs.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import { readNotebook } from "../parse/parse-notebook.ts";
import { defaultReportPath, writeReport } from "../report/report-file.ts";
import { formatDuration } from "../text/duration.ts";
import { displayLocation, errorHeadline } from "../text/error-text.ts";
import { displayPath } from "../text/display-path.ts";
import { checkLine } from "../text/check-text.ts";
import { describeCells } from "../text/cell-numbers.ts";
import { escapeControls } from "../text/terminal-text.ts";
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

const terminal: Io = { out: (t) => void process.stdout.write(t), err: (t) => void process.stderr.write(t) };

/** Runs the command line; resolves to the exit code (watch resolves when the server stops). */
export async function main(argv: readonly string[], given: Io = terminal): Promise<ExitCode> {
  // Everything printed may hold text from data or cells: control characters are shown escaped, never obeyed.
  const io: Io = { out: (t) => given.out(escapeControls(t)), err: (t) => given.err(escapeControls(t)) };
  try {
    return await dispatch(argv, io);
  } catch (e) {
    if (e instanceof UsageError) {
      io.err(`tristim: ${e.message}\nRun "tristim --help" for the commands and options.\n`);
      return EXIT.usage;
    }
    if (e instanceof NotebookError) {
      io.err(`${e.where(shown(e.file))}\n${e.codeFrame ? `${indent(e.codeFrame)}\n` : ""}`);
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
  if (command !== "run" && command !== "watch") {
    throw new UsageError(
      `unknown command "${command}"; the commands are run, watch, typecheck, editor-types, reference and help`,
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
  if (v.jobs !== undefined && each === undefined)
    throw new UsageError("--jobs is an option of run --each (it sets how many of its runs go at once)");
  const jobs = v.jobs === undefined ? undefined : parseJobs(v.jobs);
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
      io.err(`${e.where(shown(e.file))}\n${e.codeFrame ? `${indent(e.codeFrame)}\n` : ""}`);
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
  for (const document of documents) {
    const run = await runDocument(document, {
      inputs: options.inputs,
      timeLimitMs: options.timeLimitMs,
      keepGoing: options.keepGoing,
      reproducible: options.reproducible,
    });
    const target = reportPathFor(document.path, options.output, several);
    const read = clashingFile(target, readByCells(run));
    if (read) {
      io.err(`${shown(document.path)}: ${clashText(target, read)}; nothing was written\n`);
      exit = worseExit(exit, EXIT.usage);
      continue;
    }
    try {
      makeReportFolder(path.dirname(target));
      writeReport(document, run, target, options.linkAssets);
    } catch (e) {
      // A fault in the notebook found while writing (math in the prose that cannot be typeset): its file and line.
      if (e instanceof NotebookError) {
        io.err(
          `${e.where(shown(e.file))}; nothing was written\n${e.codeFrame ? `${indent(e.codeFrame)}\n` : ""}`,
        );
        exit = worseExit(exit, EXIT.notebookFailed);
        continue;
      }
      io.err(
        `${shown(document.path)}: the report could not be written to ${shown(target)}: ${(e as Error).message}\n`,
      );
      exit = EXIT.internal;
      continue;
    }
    exit = worseExit(exit, printOutcome(document, run, target, options, io));
  }
  return exit;
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
  const { exit, index, entries } = await runBatch(document, each, {
    ...options,
    jobs: options.jobs ?? os.availableParallelism(),
    cwd: process.cwd(),
    onRun: (run, place) => {
      const label = `${shown(document.path)} [${place.position}/${place.count} ${each.input}=${place.dataFile}]`;
      if (place.report) printOutcome(document, run, place.report, options, io, label);
      else io.err(`${label}: the report could not be written: ${place.error}\n`);
    },
  });
  const ok = entries.filter((e) => e.exit === EXIT.ok).length;
  const line = `${entries.length === 1 ? "1 run" : `${entries.length} runs`}, ${ok} passed -> ${shown(index)}\n`;
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
          ? `, ${checks.length === 1 ? "1 check" : `${checks.length} checks`} passed`
          : `, ${failedChecks.length} of ${checks.length === 1 ? "1 check" : `${checks.length} checks`} FAILED`;
    const line = `${label}: ${ran === 1 ? "1 cell" : `${ran} cells`} ran in ${formatDuration(run.durationMs)}${checkText} -> ${shown(target)}\n`;
    if (failedChecks.length === 0) {
      if (!options.quiet) io.out(line);
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
    io.err(
      `${place}: cell ${cell.index + 1} failed: ${error ? errorHeadline(error) : "failed"}\n${error?.codeFrame ? `${indent(error.codeFrame)}\n` : ""}`,
    );
  }
  const notRun = run.cells.filter((c) => c.status === "not-run").map((c) => c.index + 1);
  if (notRun.length) io.err(`  ${describeCells(notRun)} not run (use --keep-going to run them anyway)\n`);
  for (const c of failedChecks) io.err(`  check failed (cell ${c.cell + 1}): ${checkLine(c.record)}\n`);
  io.err(`  report with the error: ${shown(target)}\n`);
  return EXIT.notebookFailed;
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

function indent(text: string): string {
  return text
    .split("\n")
    .map((l) => `  ${l}`)
    .join("\n");
}
