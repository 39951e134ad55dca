/**
 * `tristim editor-types <folder>`: writes into a notebook folder what an editor and `tsc` need to check the folder's
 * helper .ts files: tristim-globals.d.ts (the cell globals, inputs typed from the folder's notebooks) and a
 * tsconfig.json with the options the type check uses and "tristim" pointed at the cell entry.
 */
import fs from "node:fs";
import path from "node:path";
import type { Io } from "../cli/command-options.ts";
import { NOTEBOOK_EXTENSIONS, readNotebook } from "../parse/parse-notebook.ts";
import { NotebookError, UsageError } from "../shared/errors.ts";
import { EXIT, type ExitCode } from "../shared/exit-codes.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";
import { displayPath } from "../text/display-path.ts";
import { CELL_ENTRY, cellGlobalsDeclaration, entryExportNames } from "./cell-globals.ts";
import { mergedInputsType } from "./input-types.ts";
import { cellCompilerOptions } from "./typecheck.ts";
import ts from "./typescript.ts";
import { parseCommandWords } from "../shared/command-words.ts";

/** The files written, by name. */
export const EDITOR_FILES = { globals: "tristim-globals.d.ts", tsconfig: "tsconfig.json" } as const;

/** First line of every file written; a file without it is the user's and is never overwritten. */
const MARKER = "// Written by `tristim editor-types`";

/** `tristim editor-types` with the words after the command. */
export function editorTypesCommand(args: readonly string[], io: Io): ExitCode | "help" {
  const parsed = parseCommandWords(args, { help: { type: "boolean", short: "h" } });
  if (parsed.values.help) return "help";
  if (parsed.positionals.length !== 1)
    throw new UsageError(
      `editor-types takes one notebook folder, e.g. tristim editor-types notebooks (got ${parsed.positionals.length})`,
    );
  const folder = parsed.positionals[0]!;
  const written = writeEditorTypes(folder);
  io.out(`wrote ${written.map((f) => displayPath(f, process.cwd(), "as given")).join(" and ")}\n`);
  return EXIT.ok;
}

/** Writes the two files into `folder`; returns their paths. Throws NotebookError for a missing folder or a file of the user's. */
export function writeEditorTypes(folder: string): string[] {
  const dir = path.resolve(folder);
  if (!fs.existsSync(dir) || !fs.statSync(dir).isDirectory())
    throw new NotebookError("no such folder (editor-types writes into a notebook folder)", { file: folder });
  const targets = [path.join(dir, EDITOR_FILES.globals), path.join(dir, EDITOR_FILES.tsconfig)];
  for (const target of targets) {
    if (fs.existsSync(target) && !fs.readFileSync(target, "utf8").startsWith(MARKER))
      throw new NotebookError(
        "this file exists and was not written by tristim editor-types; move it away or merge the settings by hand",
        { file: target },
      );
  }
  const [globals, tsconfig] = targets as [string, string];
  writeFileAtomic(globals, globalsFile(dir));
  writeFileAtomic(tsconfig, tsconfigFile(dir));
  return targets;
}

/** The declaration of the cell globals for `dir`, inputs merged over the notebooks in it. */
function globalsFile(dir: string): string {
  const program = ts.createProgram([CELL_ENTRY], cellCompilerOptions());
  const inputs = fs
    .readdirSync(dir)
    .filter((f) => (NOTEBOOK_EXTENSIONS as readonly string[]).includes(path.extname(f).toLowerCase()))
    .sort()
    .flatMap((f) => {
      try {
        return [readNotebook(path.join(dir, f)).frontMatter.inputs];
      } catch {
        return []; // a notebook that cannot be parsed contributes no inputs; run or typecheck says why
      }
    });
  return `${MARKER}: the globals of a notebook cell, for editors and tsc. Run it again after moving the folder or tristim.\n${cellGlobalsDeclaration(entryExportNames(program), relative(dir, CELL_ENTRY), mergedInputsType(inputs))}`;
}

/** tsconfig.json (with comments, as tsc and editors read it) using the type check's options. */
function tsconfigFile(dir: string): string {
  const o = cellCompilerOptions();
  const config = {
    compilerOptions: {
      target: "ES2022",
      module: "ESNext",
      moduleResolution: "Bundler",
      lib: ["ES2023"],
      types: ["node"],
      typeRoots: ["./node_modules/@types", ...(o.typeRoots ?? []).map((r) => relative(dir, r))],
      strict: o.strict,
      noEmit: true,
      allowImportingTsExtensions: true,
      resolveJsonModule: true,
      esModuleInterop: true,
      skipLibCheck: true,
      paths: { tristim: [relative(dir, CELL_ENTRY)] },
    },
    include: ["**/*.ts"],
    exclude: ["node_modules"],
  };
  return `${MARKER}: lets editors and tsc check this folder's .ts files as tristim runs them.\n${JSON.stringify(config, null, 2)}\n`;
}

/** `to` relative to `from`, with "/" and a leading "./" or "../" (as import specifiers and tsconfig paths want). */
function relative(from: string, to: string): string {
  const r = path.relative(from, to).split(path.sep).join("/");
  return r.startsWith(".") ? r : `./${r}`;
}
