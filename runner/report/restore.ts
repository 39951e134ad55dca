/**
 * `tristim restore <report.html> <folder>`: writes the notebook and the files a report carries (carried-sources.ts)
 * into a new or empty folder and prints the command that runs them again there. Nothing is overwritten: a folder
 * that already holds any of those files is refused before anything is written. Each file is checked against the
 * SHA-256 the report records.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { UsageError } from "../shared/errors.ts";
import { EXIT, type ExitCode } from "../shared/exit-codes.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";
import { readCarriedSources, shellLine, type CarriedSources } from "./carried-sources.ts";
import { parseCommandWords } from "../shared/command-words.ts";

/** Runs `tristim restore`; 0 when every file was restored, 1 when some are missing from the report. */
export function restoreCommand(
  args: readonly string[],
  io: { out: (t: string) => void; err: (t: string) => void },
  shown: (p: string) => string,
): ExitCode | "help" {
  const parsed = parseCommandWords(args, { help: { type: "boolean", short: "h" } }, "restore: ");
  if (parsed.values.help) return "help";
  if (parsed.positionals.length !== 2)
    throw new UsageError(
      "restore takes a report and a folder, e.g. tristim restore lot-101.html lot-101-again",
    );
  const [report, folderArgument] = parsed.positionals as [string, string];
  let html: string;
  try {
    html = fs.readFileSync(report, "utf8");
  } catch (e) {
    throw new UsageError(`restore: ${report} cannot be read: ${(e as Error).message}`);
  }
  let sources: CarriedSources;
  try {
    sources = readCarriedSources(html);
  } catch (e) {
    throw new UsageError(`restore: ${report}: ${(e as Error).message}`);
  }
  const folder = path.resolve(folderArgument);
  if (fs.existsSync(folder) && !fs.statSync(folder).isDirectory())
    throw new UsageError(`restore: ${shown(folder)} is a file; give a new or empty folder`);
  const targets: { file: string; bytes: Buffer; sha256: string | null }[] = [
    {
      file: safeTarget(folder, sources.notebook.file),
      bytes: Buffer.from(sources.notebook.base64, "base64"),
      sha256: sources.notebook.sha256,
    },
  ];
  for (const f of sources.files)
    if (f.base64 !== undefined)
      targets.push({
        file: safeTarget(folder, f.path),
        bytes: Buffer.from(f.base64, "base64"),
        sha256: f.sha256,
      });
  for (const t of targets) {
    if (fs.existsSync(t.file))
      throw new UsageError(
        `restore: ${shown(t.file)} exists already; restore into a new or empty folder (nothing was written)`,
      );
    if (t.sha256 !== null && createHash("sha256").update(t.bytes).digest("hex") !== t.sha256)
      throw new UsageError(
        `restore: the copy of ${path.relative(folder, t.file)} in ${report} does not match its SHA-256; the report was altered (nothing was written)`,
      );
  }
  for (const t of targets) {
    fs.mkdirSync(path.dirname(t.file), { recursive: true });
    writeFileAtomic(t.file, [t.bytes]);
  }
  const missing = sources.files.filter((f) => f.base64 === undefined);
  io.out(
    `${targets.length === 1 ? "1 file" : `${targets.length} files`} restored into ${shown(folder)}; run the notebook again there with:\n` +
      `  cd ${shellLine([shown(folder)]).replace(/^tristim /, "")} && ${shellLine(sources.rerun)}\n`,
  );
  for (const f of missing)
    io.err(
      `  not in the report: ${f.path} (${f.missing}; SHA-256 ${f.sha256 ?? "unknown"}); put it there yourself\n`,
    );
  return missing.length ? EXIT.notebookFailed : EXIT.ok;
}

/** The path of `relative` inside `folder`; refuses a path that would leave it. */
function safeTarget(folder: string, relative: string): string {
  const target = path.resolve(folder, relative);
  const inside = path.relative(folder, target);
  if (inside.startsWith("..") || path.isAbsolute(inside) || inside === "")
    throw new UsageError(
      `restore: the report names a file outside the folder (${relative}); nothing was written`,
    );
  return target;
}
