/**
 * `tristim typecheck <notebook.md>...` and the check before `run --typecheck`: prints each error as
 * `notebook.md:line:column: message` with a code frame, and a line per notebook.
 */
import { parseArgs } from "node:util";
import type { Io } from "../cli/command-options.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import { readNotebook } from "../parse/parse-notebook.ts";
import { NotebookError, UsageError } from "../shared/errors.ts";
import { EXIT, type ExitCode } from "../shared/exit-codes.ts";
import { displayPath } from "../text/display-path.ts";
import { indentLines, notebookErrorText } from "../text/terminal-text.ts";
import { createTypecheckSession, type TypecheckSession } from "./typecheck.ts";
import type { TypeDiagnostic } from "./type-diagnostic.ts";

/** `tristim typecheck` with the words after the command. */
export function typecheckCommand(args: readonly string[], io: Io): ExitCode | "help" {
  let parsed;
  try {
    parsed = parseArgs({
      args: [...args],
      allowPositionals: true,
      strict: true,
      options: { quiet: { type: "boolean" }, help: { type: "boolean", short: "h" } },
    });
  } catch (e) {
    throw new UsageError(
      `${(e as Error).message.replace(/\. To specify a positional argument.*$/s, "").replace(/^Unknown option/, "unknown option")} (typecheck takes --quiet)`,
    );
  }
  if (parsed.values.help) return "help";
  if (parsed.positionals.length === 0)
    throw new UsageError(
      "typecheck needs a notebook file, e.g. tristim typecheck notebooks/getting-started.md",
    );
  return typecheckFiles(parsed.positionals, io, { quiet: parsed.values.quiet === true });
}

/** Checks the notebooks; 0 when none has an error, 1 when one has (or cannot be read). */
export function typecheckFiles(
  files: readonly string[],
  io: Io,
  options: { readonly quiet: boolean },
  session: TypecheckSession = createTypecheckSession(),
): ExitCode {
  let exit: ExitCode = EXIT.ok;
  for (const file of files) {
    let document: NotebookDocument;
    try {
      document = readNotebook(file);
    } catch (e) {
      if (!(e instanceof NotebookError)) throw e;
      io.err(notebookErrorText(e, shown(e.file)));
      exit = EXIT.notebookFailed;
      continue;
    }
    const found = session.check(document);
    const cells = document.cells.filter((c) => !c.options.noRun).length;
    const cellText = cells === 1 ? "1 cell" : `${cells} cells`;
    if (found.length === 0) {
      if (!options.quiet) io.out(`${shown(document.path)}: no type errors in ${cellText}\n`);
      continue;
    }
    exit = EXIT.notebookFailed;
    for (const d of found) io.err(diagnosticText(d));
    io.err(
      `${shown(document.path)}: ${found.length === 1 ? "1 type error" : `${found.length} type errors`} in ${cellText}\n`,
    );
  }
  return exit;
}

/** One diagnostic as the terminal shows it: place, message (continuation lines indented), code frame. */
export function diagnosticText(d: TypeDiagnostic, cwd = process.cwd()): string {
  const { file, line, column } = d.location;
  const [first, ...more] = d.message.split("\n");
  const rest = more.map((l) => `  ${l.trim()}\n`).join("");
  return `${displayPath(file, cwd, "as given")}:${line}:${column}: ${first}\n${rest}${indentLines(d.codeFrame)}\n`;
}

function shown(file: string): string {
  return displayPath(file, process.cwd(), "as given");
}
