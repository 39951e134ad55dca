/**
 * `tristim typecheck`: parsed notebook in, type errors out (plain data). The cells are checked as the runner links
 * them (cell-files.ts), with the cell globals (cell-globals.ts) and a "tristim" module whose `inputs` has the
 * front matter's types, by the TypeScript compiler API. The library is read from its cached declaration files
 * (library-declarations.ts), or from its sources when those cannot be made. A session keeps its last program and the
 * parsed files, so a re-check after an edit (watch) reparses only what changed and reuses the rest.
 */
import fs from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import type { CompilerHost, CompilerOptions, Diagnostic, Program, SourceFile } from "typescript";
import ts, { saveCompilerCodeCache } from "./typescript.ts";
import { cellLineRange, type NotebookDocument } from "../parse/notebook.ts";
import { PACKAGE_ROOT } from "../shared/package-root.ts";
import { codeFrame } from "../text/code-frame.ts";
import { cellFiles, isCellFileName, notebookPositionOf, type CellFile } from "./cell-files.ts";
import { CELL_ENTRY, cellGlobalsDeclaration, entryExportNames } from "./cell-globals.ts";
import { inputsType } from "./input-types.ts";
import { currentCopy, strippedTypes, type StrippedText } from "./stripped-types.ts";
import {
  defaultDeclarationPlace,
  libraryDeclarations,
  type DeclarationPlace,
  type LibraryDeclarations,
} from "./library-declarations.ts";
import type { TypeDiagnostic } from "./type-diagnostic.ts";

/** The "tristim" module of a checked notebook: the cell entry, with `inputs` typed from the front matter. */
const NOTEBOOK_MODULE = path.join(PACKAGE_ROOT, "cells", "__tristim_notebook_module__.ts");
/** The declaration of the cell globals. */
const GLOBALS_FILE = path.join(PACKAGE_ROOT, "cells", "__tristim_cell_globals__.d.ts");

/** How the notebook module imports the cell entry (cells/tristim-entry.ts, or its cached declaration). */
const ENTRY_SPECIFIER = "./tristim-entry.ts";

/** True when `file` is inside `folder`. */
function isInside(folder: string, file: string): boolean {
  const relative = path.relative(folder, file);
  return relative !== "" && !relative.startsWith("..") && !path.isAbsolute(relative);
}

/** Messages left out: a package without type declarations is used as `any`, as a run would use it. */
const IGNORED_CODES = new Set([7016]);

/** Where @types/node is (the package's own, or hoisted beside it when tristim is installed as a dependency). */
function nodeTypeRoot(): string[] {
  try {
    const require = createRequire(path.join(PACKAGE_ROOT, "package.json"));
    return [path.dirname(path.dirname(require.resolve("@types/node/package.json")))];
  } catch {
    return [path.join(PACKAGE_ROOT, "node_modules", "@types")];
  }
}

/** The compiler options cells are checked with (editor-types.ts writes the same into a tsconfig.json). */
export function cellCompilerOptions(): CompilerOptions {
  return {
    target: ts.ScriptTarget.ES2022,
    module: ts.ModuleKind.ESNext,
    moduleResolution: ts.ModuleResolutionKind.Bundler,
    lib: ["lib.es2023.d.ts"],
    types: ["node"],
    typeRoots: nodeTypeRoot(),
    strict: true,
    noEmit: true,
    allowImportingTsExtensions: true,
    resolveJsonModule: true,
    esModuleInterop: true,
    skipLibCheck: true,
  };
}

/** A type checker that keeps its last program and parsed files between checks. */
export interface TypecheckSession {
  /** Type-checks a notebook's cells; never throws for problems in the notebook (they are diagnostics). */
  check(document: NotebookDocument): TypeDiagnostic[];
}

/** How a session reads the library. */
export interface TypecheckSessionOptions {
  /**
   * "declarations" (the default): the cached declaration files, emitted again when lib/ or cells/ changed, and the
   * sources when they cannot be emitted; "sources": always the library's .ts sources (slower, same results).
   */
  readonly library?: "declarations" | "sources";
  /** Where the library and its cached declarations are (tests only). */
  readonly place?: DeclarationPlace;
}

/** A new session (one per watch, or per command for several notebooks). */
export function createTypecheckSession(sessionOptions: TypecheckSessionOptions = {}): TypecheckSession {
  const options = cellCompilerOptions();
  const base = ts.createCompilerHost(options);
  /** Parsed real files by name, with the modification time they were read at. */
  const parsed = new Map<string, { mtimeMs: number; file: SourceFile }>();
  /** Parsed virtual files by name, with their text. */
  const virtualParsed = new Map<string, SourceFile>();
  let virtual = new Map<string, string>();
  let oldProgram: Program | undefined;
  /** The entry's export names read from the sources (when there are no declarations). */
  let sourceEntryNames: string[] | undefined;
  /** The declarations the current check reads, if any. */
  let declarations: LibraryDeclarations | undefined;
  /** Comment-free copies of the Node and lib declaration files (stripped-types.ts), read at the first check. */
  let strippedCopies: Map<string, StrippedText> | undefined;
  const resolutionCache = ts.createModuleResolutionCache(base.getCurrentDirectory(), (s) => s, options);

  const host: CompilerHost = {
    ...base,
    // As tsc does: JSDoc in .ts files is not parsed (types come from the code), except @see and @link.
    jsDocParsingMode: ts.JSDocParsingMode.ParseForTypeErrors,
    fileExists: (f) => virtual.has(f) || base.fileExists(f),
    readFile: (f) => virtual.get(f) ?? base.readFile(f),
    getSourceFile(fileName, languageVersion) {
      const text = virtual.get(fileName);
      if (text !== undefined) {
        const known = virtualParsed.get(fileName);
        if (known && known.text === text) return known;
        const file = ts.createSourceFile(fileName, text, languageVersion);
        virtualParsed.set(fileName, file);
        return file;
      }
      let stat: fs.Stats;
      try {
        stat = fs.statSync(fileName);
      } catch {
        return undefined;
      }
      const { mtimeMs } = stat;
      const known = parsed.get(fileName);
      if (known && known.mtimeMs === mtimeMs) return known.file;
      // The comment-free copy of a Node or lib declaration file, while the file is the one it was made from.
      const copy = currentCopy(strippedCopies, fileName, stat);
      const file =
        copy !== undefined
          ? ts.createSourceFile(fileName, copy, languageVersion)
          : base.getSourceFile(fileName, languageVersion);
      if (file) parsed.set(fileName, { mtimeMs, file });
      return file;
    },
    resolveModuleNameLiterals(literals, containingFile) {
      return literals.map((literal) => {
        if (literal.text === "tristim")
          return {
            resolvedModule: {
              resolvedFileName: NOTEBOOK_MODULE,
              extension: ts.Extension.Ts,
              isExternalLibraryImport: false,
            },
          };
        if (declarations && containingFile === NOTEBOOK_MODULE && literal.text === ENTRY_SPECIFIER)
          return {
            resolvedModule: {
              resolvedFileName: declarations.entry,
              extension: ts.Extension.Dts,
              isExternalLibraryImport: false,
            },
          };
        // Shortcuts that give what resolveModuleName would, without its file lookups: a cell's import of an
        // earlier cell (a virtual file), and a declaration file's relative import of another (listed in the cache).
        if (isCellFileName(containingFile) && /^\.\/__tristim_cell_\d+$/.test(literal.text)) {
          const cell = path.join(path.dirname(containingFile), `${literal.text.slice(2)}.ts`);
          if (virtual.has(cell))
            return {
              resolvedModule: {
                resolvedFileName: cell,
                extension: ts.Extension.Ts,
                isExternalLibraryImport: false,
              },
            };
        }
        if (declarations && literal.text.startsWith(".") && literal.text.endsWith(".ts")) {
          const declaration = path
            .resolve(path.dirname(containingFile), literal.text)
            .replace(/\.ts$/, ".d.ts");
          if (declarations.files.has(declaration) && isInside(declarations.dir, containingFile))
            return {
              resolvedModule: {
                resolvedFileName: declaration,
                extension: ts.Extension.Dts,
                isExternalLibraryImport: false,
                resolvedUsingTsExtension: true,
              },
            };
        }
        // A package a declaration file imports is found from the library's own folder, as from its source.
        const from =
          declarations && !literal.text.startsWith(".") && isInside(declarations.dir, containingFile)
            ? path.join(declarations.root, path.relative(declarations.dir, containingFile))
            : containingFile;
        return ts.resolveModuleName(literal.text, from, options, host, resolutionCache);
      });
    },
  };

  const build = (roots: string[]): Program => {
    const program = ts.createProgram({ rootNames: roots, options, host, oldProgram });
    oldProgram = program;
    return program;
  };

  return {
    check(document) {
      const files = cellFiles(document);
      const inputs = inputsType(document.frontMatter.inputs);
      if (sessionOptions.library !== "sources" && strippedCopies === undefined)
        strippedCopies =
          strippedTypes(options, (sessionOptions.place ?? defaultDeclarationPlace()).cacheDir) ?? new Map();
      const before = declarations;
      declarations =
        sessionOptions.library === "sources"
          ? undefined
          : libraryDeclarations(options, sessionOptions.place, host.getSourceFile);
      if (declarations?.dir !== before?.dir) {
        // The library changed (or its declarations appeared or went): the old program's resolutions of the entry
        // would be kept for the unchanged notebook module, so start a new one (parsed files are still reused).
        oldProgram = undefined;
        resolutionCache.clear();
      }
      virtual = new Map([
        [NOTEBOOK_MODULE, `export * from "${ENTRY_SPECIFIER}";\nexport declare const inputs: ${inputs};\n`],
      ]);
      const entryNames = declarations?.names ?? (sourceEntryNames ??= entryExportNames(build([CELL_ENTRY])));
      virtual.set(GLOBALS_FILE, cellGlobalsDeclaration(entryNames, "tristim", inputs));
      for (const f of files) virtual.set(f.fileName, f.text);
      const program = build([GLOBALS_FILE, ...files.map((f) => f.fileName)]);
      const read = declarations;
      const named = (d: TypeDiagnostic) =>
        read ? { ...d, message: d.message.split(read.dir).join(read.root) } : d;
      const found = [
        ...files.flatMap((f) => cellDiagnostics(program, f, document)),
        ...helperDiagnostics(program, document),
      ].map(named);
      // Now that a check has run the compiler's code, keep it compiled for the next process.
      saveCompilerCodeCache();
      return found;
    },
  };
}

/** The syntax errors of a cell, or when it has none its type errors, placed in the notebook. */
function cellDiagnostics(program: Program, file: CellFile, document: NotebookDocument): TypeDiagnostic[] {
  const source = program.getSourceFile(file.fileName)!;
  const syntactic = program.getSyntacticDiagnostics(source);
  const found = syntactic.length > 0 ? syntactic : program.getSemanticDiagnostics(source);
  return found
    .filter((d) => !IGNORED_CODES.has(d.code))
    .map((d) => {
      const { line, column } = notebookPositionOf(file, source, d.start ?? 0);
      return {
        location: { file: document.path, line, column },
        message: messageText(d),
        codeFrame: codeFrame(document.text, line, column, 2, cellLineRange(document, line)),
        cell: file.cell.index,
      };
    })
    .sort((a, b) => a.location.line - b.location.line || a.location.column - b.location.column);
}

/** Type errors in the notebook's own .ts files that its cells import (in its folder, not in node_modules). */
function helperDiagnostics(program: Program, document: NotebookDocument): TypeDiagnostic[] {
  const folder = path.dirname(document.path) + path.sep;
  return program
    .getSourceFiles()
    .filter((s) => s.fileName.startsWith(folder.split(path.sep).join("/")) || s.fileName.startsWith(folder))
    .filter(
      (s) =>
        !isCellFileName(s.fileName) && !/[/\\]node_modules[/\\]/.test(s.fileName) && !s.isDeclarationFile,
    )
    .flatMap((s) => {
      const found = [...program.getSyntacticDiagnostics(s), ...program.getSemanticDiagnostics(s)];
      return found
        .filter((d) => !IGNORED_CODES.has(d.code))
        .map((d) => {
          const at = s.getLineAndCharacterOfPosition(d.start ?? 0);
          const line = at.line + 1;
          const column = at.character + 1;
          return {
            location: { file: path.resolve(s.fileName), line, column },
            message: messageText(d),
            codeFrame: codeFrame(s.text, line, column),
          };
        });
    });
}

/** The compiler's message, with the virtual modules named as a reader knows them. */
function messageText(d: Diagnostic): string {
  return ts
    .flattenDiagnosticMessageText(d.messageText, "\n")
    .replace(/import\("[^"]*__tristim_cell_\d+(?:\.ts)?"\)\./g, "")
    .replace(/import\("[^"]*__tristim_cell_(\d+)(?:\.ts)?"\)/g, "cell $1")
    .replace(/"[^"]*__tristim_notebook_module__(?:\.ts)?"/g, '"tristim"')
    .replace(/'"([^"']+)"'/g, '"$1"');
}
