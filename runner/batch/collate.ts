/**
 * `tristim collate <shard folder>... -o <folder>`: merges the folders of the shards of one batch (`run --each ...
 * --shard K/N`, each run by an array job of an engine such as Kubernetes or Slurm) into one folder with every
 * report, one index page and, with --results, one results file. Everything comes from the results each shard's
 * index page embeds (plain data), so the merged index is the index one run of the whole batch writes (byte for byte
 * with --reproducible). Every folder is read and checked before anything is written: shards of different notebooks,
 * batches, tool versions or shard counts, a shard given twice or missing are usage errors, and nothing is written.
 */
import fs from "node:fs";
import path from "node:path";
import { batchEntry, batchResults, type BatchRecord } from "./batch-index.ts";
import { UsageError } from "../shared/errors.ts";
import { EXIT, worseExit, type ExitCode } from "../shared/exit-codes.ts";
import { makeReportFolder, sameFile } from "../shared/output-path.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";
import { renderBatchIndex } from "../report/render-index.ts";
import { readBatchResults, resultsText, type ResultsFile } from "../report/results-file.ts";
import { ASSETS_FOLDER } from "../report/report-file.ts";
import { pdfPathFor } from "../report/pdf-path.ts";
import { parseCommandWords } from "../shared/command-words.ts";

/** Where collate writes its messages. */
export interface CollateIo {
  readonly out: (text: string) => void;
  readonly err: (text: string) => void;
}

/** One shard folder, read and checked. */
interface Shard {
  readonly folder: string;
  readonly results: ResultsFile;
}

/** Runs `tristim collate`; returns the worst exit code over the batch's runs. */
export function collateCommand(
  args: readonly string[],
  io: CollateIo,
  shown: (p: string) => string,
): ExitCode | "help" {
  const parsed = parseCommandWords(
    args,
    {
      output: { type: "string", short: "o" },
      results: { type: "string", multiple: true },
      quiet: { type: "boolean" },
      help: { type: "boolean", short: "h" },
    },
    "collate: ",
  );
  if (parsed.values.help) return "help";
  const folders = parsed.positionals.map((f) => path.resolve(f));
  if (folders.length === 0)
    throw new UsageError(
      "collate needs the shard folders, e.g. tristim collate shard-1 shard-2 -o lot-reports",
    );
  if (parsed.values.output === undefined)
    throw new UsageError("collate needs -o <folder>: where the merged reports, index and results go");
  const output = path.resolve(parsed.values.output);
  for (const file of parsed.values.results ?? [])
    if (!/\.(json|csv)$/i.test(file))
      throw new UsageError(
        `--results ${file}: the file name must end in .json (every result) or .csv (the checks)`,
      );
  for (const folder of folders)
    if (sameFile(folder, output))
      throw new UsageError(`-o ${shown(output)} is one of the shard folders; merge into a folder of its own`);
  if (fs.existsSync(output) && !fs.statSync(output).isDirectory())
    throw new UsageError(`-o ${shown(output)} is a file; collate writes a folder`);

  const shards = folders.map((folder) => readShard(folder, shown));
  const record = mergedRecord(shards, shown);

  // Checked: now write. Reports (and their PDFs and the shared assets) are copied as they are.
  makeReportFolder(output);
  const copied = new Set<string>();
  for (const shard of shards) {
    for (const run of shard.results.runs) {
      if (!run.report) continue;
      for (const name of [run.report, path.basename(pdfPathFor(run.report))]) {
        const from = path.join(shard.folder, name);
        if (!fs.existsSync(from)) continue;
        writeFileAtomic(path.join(output, name), [fs.readFileSync(from)]);
      }
    }
    const assets = path.join(shard.folder, ASSETS_FOLDER);
    if (fs.existsSync(assets)) {
      fs.mkdirSync(path.join(output, ASSETS_FOLDER), { recursive: true });
      for (const name of fs.readdirSync(assets)) {
        if (copied.has(name)) continue;
        copied.add(name);
        writeFileAtomic(path.join(output, ASSETS_FOLDER, name), [fs.readFileSync(path.join(assets, name))]);
      }
    }
  }
  const index = path.join(output, "index.html");
  writeFileAtomic(index, renderBatchIndex(record));
  const results = batchResults(record);
  for (const file of parsed.values.results ?? [])
    writeFileAtomic(path.resolve(file), resultsText(results, file));

  let exit: ExitCode = EXIT.ok;
  for (const e of record.entries) exit = worseExit(exit, e.exit);
  const ok = record.entries.filter((e) => e.exit === EXIT.ok).length;
  const line = `${shards.length} shards, ${record.entries.length} runs, ${ok} passed -> ${shown(index)}\n`;
  if (exit === EXIT.ok) {
    if (!parsed.values.quiet) io.out(line);
  } else io.err(line);
  return exit;
}

function readShard(folder: string, shown: (p: string) => string): Shard {
  const index = path.join(folder, "index.html");
  let html: string;
  try {
    html = fs.readFileSync(index, "utf8");
  } catch {
    throw new UsageError(
      `${shown(folder)}: no index.html there; give the folders that run --each ... --shard K/N wrote`,
    );
  }
  let results: ResultsFile;
  try {
    results = readBatchResults(html);
  } catch (e) {
    throw new UsageError(`${shown(index)}: ${(e as Error).message}`);
  }
  if (!results.batch?.shard)
    throw new UsageError(
      `${shown(folder)} holds a whole batch, not a shard (it was not run with --shard K/N)`,
    );
  return { folder, results };
}

/** The record of the whole batch from its shards; throws a UsageError when they do not belong together. */
function mergedRecord(shards: readonly Shard[], shown: (p: string) => string): BatchRecord {
  const first = shards[0]!;
  const a = first.results;
  const batchA = a.batch!;
  const differ = (shard: Shard, what: string, mine: unknown, theirs: unknown) => {
    throw new UsageError(
      `${shown(shard.folder)} and ${shown(first.folder)} are not shards of one batch: ${what} differ ` +
        `(${JSON.stringify(theirs)} and ${JSON.stringify(mine)}); nothing was written`,
    );
  };
  const seen = new Map<number, string>();
  for (const shard of shards) {
    const b = shard.results;
    const batchB = b.batch!;
    if (batchB.notebook.sha256 !== batchA.notebook.sha256 || batchB.notebook.file !== batchA.notebook.file)
      differ(
        shard,
        "the notebooks",
        `${batchA.notebook.file} ${batchA.notebook.sha256.slice(0, 12)}`,
        `${batchB.notebook.file} ${batchB.notebook.sha256.slice(0, 12)}`,
      );
    if (b.tool.name !== a.tool.name || b.tool.version !== a.tool.version)
      differ(
        shard,
        "the tool versions",
        `${a.tool.name} ${a.tool.version}`,
        `${b.tool.name} ${b.tool.version}`,
      );
    if (b.version !== a.version) differ(shard, "the results versions", a.version, b.version);
    if (batchB.input !== batchA.input || batchB.pattern !== batchA.pattern)
      differ(
        shard,
        "the --each options",
        `${batchA.input}=${batchA.pattern}`,
        `${batchB.input}=${batchB.pattern}`,
      );
    if (batchB.count !== batchA.count) differ(shard, "the numbers of data files", batchA.count, batchB.count);
    if (batchB.shard!.of !== batchA.shard!.of)
      differ(shard, "the numbers of shards", batchA.shard!.of, batchB.shard!.of);
    if (b.reproducible !== a.reproducible) differ(shard, "--reproducible", a.reproducible, b.reproducible);
    const k = batchB.shard!.index;
    if (seen.has(k))
      throw new UsageError(
        `shard ${k} of ${batchB.shard!.of} is given twice (${shown(seen.get(k)!)} and ${shown(shard.folder)}); nothing was written`,
      );
    seen.set(k, shard.folder);
  }
  const of = batchA.shard!.of;
  const missing = Array.from({ length: of }, (_, i) => i + 1).filter((k) => !seen.has(k));
  if (missing.length)
    throw new UsageError(
      `shard${missing.length === 1 ? "" : "s"} ${missing.join(", ")} of ${of} ${missing.length === 1 ? "is" : "are"} missing; give every shard folder of the batch (nothing was written)`,
    );
  const runs = shards.flatMap((s) => s.results.runs).sort((x, y) => x.position - y.position);
  const positions = runs.map((r) => r.position).join(",");
  const expected = Array.from({ length: batchA.count }, (_, i) => i + 1).join(",");
  if (positions !== expected)
    throw new UsageError(
      `the shards hold runs ${positions || "none"}, not 1 to ${batchA.count}: they were not cut from the same list of data files; nothing was written`,
    );
  for (const shard of shards)
    for (const run of shard.results.runs)
      if (run.report && !fs.existsSync(path.join(shard.folder, run.report)))
        throw new UsageError(`${shown(path.join(shard.folder, run.report))} is missing; nothing was written`);
  const started = shards
    .map((s) => s.results.startedAt)
    .filter((t): t is string => t !== undefined)
    .sort()[0];
  const sample = runs[0]!.record;
  return {
    notebook: { path: batchA.notebook.file, sha256: batchA.notebook.sha256, title: batchA.notebook.title },
    input: batchA.input,
    pattern: batchA.pattern,
    tool: a.tool,
    node: sample.node,
    platform: sample.platform,
    startedAt: started ?? "",
    reproducible: a.reproducible,
    count: batchA.count,
    entries: runs.map((r) => batchEntry(r)),
  };
}
