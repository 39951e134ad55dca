/**
 * Copies of the Node types (@types/node, undici-types) and the compiler's lib.*.d.ts files without their comments,
 * kept in the cache folder: 2.7 MB of declarations that are mostly JSDoc, which the parser scans on every first
 * check (measured: about 0.25 s less CPU to parse @types/node without it). Each copy is printed by the compiler's
 * printer and kept only when its syntax tree is the original's (same nodes, flags, names, literals and `///`
 * directives), so the program is the same; the check reads a copy only while the original's size and mtime are
 * those it was made from, and the original otherwise. Positions inside these files differ, which no diagnostic
 * shows (only cells and the notebook's own files are reported).
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import type { CompilerOptions, Node, SourceFile } from "typescript";
import { writeFileAtomic } from "../shared/write-atomic.ts";
import ts from "./typescript.ts";

/** A comment-free copy and the size and mtime of the original it was made from. */
export interface StrippedText {
  readonly size: number;
  readonly mtimeMs: number;
  readonly text: string;
}

/** The copy of `fileName` when there is one made from the file as it is now (`stat`), else undefined. */
export function currentCopy(
  copies: ReadonlyMap<string, StrippedText> | undefined,
  fileName: string,
  stat: { readonly size: number; readonly mtimeMs: number },
): string | undefined {
  const copy = copies?.get(fileName);
  return copy && copy.size === stat.size && copy.mtimeMs === stat.mtimeMs ? copy.text : undefined;
}

/** Bumped when what is written changes. */
const FORMAT = "1";

/** The folders whose .d.ts files are copied: the Node types, undici-types (which they import), the compiler's libs. */
function typeFolders(options: CompilerOptions): string[] {
  const folders: string[] = [];
  for (const root of options.typeRoots ?? []) {
    const node = path.join(root, "node");
    if (!fs.existsSync(path.join(node, "package.json"))) continue;
    folders.push(node);
    try {
      const undici = createRequire(path.join(node, "package.json")).resolve("undici-types/package.json");
      folders.push(path.dirname(undici));
    } catch {
      // not installed: nothing to copy
    }
  }
  folders.push(path.dirname(ts.getDefaultLibFilePath(options)));
  return folders;
}

/**
 * The comment-free copies by file name, read from the cache or made (and cached) when missing; undefined when they
 * cannot be made (the check then reads the originals).
 */
export function strippedTypes(
  options: CompilerOptions,
  cacheDir: string,
): Map<string, StrippedText> | undefined {
  try {
    const folders = typeFolders(options);
    const hash = createHash("sha256").update(`${FORMAT}\n${ts.version}\n`);
    for (const folder of folders) {
      const manifest = path.join(folder, "package.json");
      const stat = fs.statSync(manifest, { throwIfNoEntry: false });
      hash.update(`${folder}\0${stat?.size}\0${stat?.mtimeMs}\n`);
    }
    const file = path.join(cacheDir, `types-${hash.digest("hex").slice(0, 20)}.json`);
    try {
      return new Map(
        Object.entries(JSON.parse(fs.readFileSync(file, "utf8")) as Record<string, StrippedText>),
      );
    } catch {
      // missing or unreadable: made below
    }
    // A cache folder that cannot be written would make the copies on every check: use the originals.
    fs.mkdirSync(cacheDir, { recursive: true });
    fs.accessSync(cacheDir, fs.constants.W_OK);
    const made: Record<string, StrippedText> = {};
    for (const folder of folders)
      for (const name of declarationFiles(folder, folder === folders.at(-1))) {
        const stat = fs.statSync(name);
        const original = fs.readFileSync(name, "utf8");
        const text = stripped(name, original);
        if (text !== undefined) made[name] = { size: stat.size, mtimeMs: stat.mtimeMs, text };
      }
    writeFileAtomic(file, JSON.stringify(made));
    pruneOld(cacheDir, path.basename(file));
    return new Map(Object.entries(made));
  } catch (e) {
    if (process.env.TRISTIM_DEBUG) console.error("tristim: comment-free type copies not used:", e);
    return undefined;
  }
}

/** Removes other copies (of other package versions) not written for a day. */
function pruneOld(folder: string, keep: string): void {
  const dayAgo = Date.now() - 24 * 3600_000;
  for (const name of fs.readdirSync(folder)) {
    if (name === keep || !/^types-.*\.json$/.test(name)) continue;
    try {
      const full = path.join(folder, name);
      if (fs.statSync(full).mtimeMs < dayAgo) fs.rmSync(full, { force: true });
    } catch {
      // already gone
    }
  }
}

/** The .d.ts files in a folder and below (not in a nested node_modules); in the compiler's folder only lib.*.d.ts. */
function declarationFiles(folder: string, compilerLibs: boolean): string[] {
  return fs.readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(folder, entry.name);
    if (entry.isDirectory())
      return compilerLibs || entry.name === "node_modules" ? [] : declarationFiles(full, false);
    if (!entry.name.endsWith(".d.ts")) return [];
    return !compilerLibs || /^lib\..*\.d\.ts$/.test(entry.name) ? [full] : [];
  });
}

/** `text` without comments (`///` directives kept), or undefined when the copy's syntax tree would differ. */
export function stripped(fileName: string, text: string): string | undefined {
  const options = {
    languageVersion: ts.ScriptTarget.Latest,
    jsDocParsingMode: ts.JSDocParsingMode.ParseNone,
  };
  const original = ts.createSourceFile(fileName, text, options);
  if ((original as { parseDiagnostics?: unknown[] }).parseDiagnostics?.length) return undefined;
  const printed = ts.createPrinter({ removeComments: true }).printFile(original);
  const copy = ts.createSourceFile(fileName, printed, options);
  return shape(copy) === shape(original) ? printed : undefined;
}

/** Everything of a syntax tree that a program uses: node kinds, flags, names and literal texts, and directives. */
function shape(file: SourceFile): string {
  const parts: string[] = [
    JSON.stringify([
      file.referencedFiles.map((r) => r.fileName),
      file.typeReferenceDirectives.map((r) => [r.fileName, r.resolutionMode]),
      file.libReferenceDirectives.map((r) => r.fileName),
      file.hasNoDefaultLib,
      file.isDeclarationFile,
    ]),
  ];
  const visit = (node: Node): void => {
    const named = node as { text?: unknown };
    const text = node.kind !== ts.SyntaxKind.SourceFile && typeof named.text === "string" ? named.text : "";
    parts.push(`${node.kind}:${node.flags}:${text}`);
    ts.forEachChild(node, visit);
  };
  visit(file);
  return parts.join("\n");
}
