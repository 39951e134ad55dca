/**
 * The type check reads the library from cached declaration files (runner/typecheck/library-declarations.ts) and the
 * Node and lib types from comment-free copies (stripped-types.ts). These tests check that it finds exactly what a
 * check against the library's sources and the original types finds, that the cache is made again when a library
 * file changes (also within one session, as in watch), and that a cache that cannot be made or read falls back to
 * the sources.
 */
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it, vi } from "vitest";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import { PACKAGE_ROOT } from "../../runner/shared/package-root.ts";
import {
  declarationKey,
  libraryDeclarations,
  type DeclarationPlace,
} from "../../runner/typecheck/library-declarations.ts";
import { stripped, strippedTypes } from "../../runner/typecheck/stripped-types.ts";
import { cellCompilerOptions, createTypecheckSession } from "../../runner/typecheck/typecheck.ts";
import compiler from "../../runner/typecheck/typescript.ts";
import { notebookFile, tempFolder, ts, writeFiles } from "./helpers.ts";

// Emitting the library's declarations and checking against its sources take seconds on a loaded machine.
vi.setConfig({ testTimeout: 180_000 });

/** Notebooks with errors of many kinds (and the example notebooks, which have none). */
const CASES: { text: string; files?: Record<string, string> }[] = [
  { text: ts("const a = 1;") + ts("const k: string = 5;") },
  {
    text:
      "---\ninputs:\n  tolerance: 2.0\n---\n" +
      ts(
        "const p: Lab = { L: 50, a: 10, b: 10 };\nconst d: string = deltaE2000(p, p);\n" +
          "deltaE2000(p, { L: 1, a: 2 });\nconst wrong: string = inputs.tolerance;",
      ),
  },
  {
    text: ts(
      'showTable("not rows");\ncheck("c", 1, { tolerence: 1 });\nconst x: number = xyzToLab;\n' +
        'import { noSuchFunction } from "tristim";',
    ),
  },
  {
    // A library class (its declaration keeps a literal-typed field) and a type guard.
    text: ts(
      'const e: unknown = new ArgumentError("f", "x", "a number", "text");\n' +
        'if (isArgumentError(e)) { const n: "Other" = e.name; const r: number = e.received; }\n' +
        "const bad = new DataFileError();",
    ),
  },
  {
    // A helper type named like a library type (both appear in the message).
    text: ts(
      'import { helperLab } from "./helper.ts";\nconst p: Lab = helperLab;\nconst q: number = helperLab;',
    ),
    files: {
      "helper.ts": "export interface Lab {\n  L: string;\n}\nexport const helperLab: Lab = { L: 'x' };\n",
    },
  },
  {
    text: ts('import { half } from "./helper.ts";\nconst h: number = half(4);'),
    files: {
      "helper.ts":
        'import { deltaE76 } from "tristim";\nexport const half = (x: number): string => deltaE76(x, x);\n',
    },
  },
];

describe("library declarations in the type check", () => {
  it("are made for this library, and a check with them finds exactly what a check of the sources finds", () => {
    const declarations = libraryDeclarations(cellCompilerOptions());
    expect(declarations).toBeDefined();
    expect(fs.existsSync(declarations!.entry)).toBe(true);
    expect(declarations!.names).toContain("deltaE2000");
    expect(declarations!.names).toContain("showTable");

    const withCache = createTypecheckSession();
    const fromSources = createTypecheckSession({ library: "sources" });
    const examples = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../notebooks");
    const files = [
      ...CASES.map((c) => notebookFile(c.text, c.files)),
      ...fs
        .readdirSync(examples)
        .filter((f) => f.endsWith(".md"))
        .map((f) => path.join(examples, f)),
    ];
    let errors = 0;
    for (const file of files) {
      const document = readNotebook(file);
      const expected = fromSources.check(document);
      expect(withCache.check(document)).toEqual(expected);
      errors += expected.length;
    }
    // The cases above have errors in every notebook; the comparison is not between empty lists.
    expect(errors).toBeGreaterThanOrEqual(CASES.length * 2);
  });

  it("are made again when a library file changes, also within one session", () => {
    const place = fixtureLibrary();
    const options = cellCompilerOptions();
    const first = libraryDeclarations(options, place)!;
    expect(first.names).toEqual(["scale"]);
    expect(fs.readFileSync(path.join(first.dir, "lib", "scale.d.ts"), "utf8")).toContain(
      "scale(x: number): number",
    );
    // Unchanged library: the same folder, not emitted again.
    const manifest = path.join(first.dir, "manifest.json");
    const written = fs.statSync(manifest).mtimeMs;
    expect(libraryDeclarations(options, place)!.dir).toBe(first.dir);
    expect(fs.statSync(manifest).mtimeMs).toBe(written);

    const session = createTypecheckSession({ place });
    const notebook = readNotebook(notebookFile(ts("const n: number = scale(2);")));
    expect(session.check(notebook)).toEqual([]);

    const source = path.join(place.root, "lib", "scale.ts");
    fs.writeFileSync(source, "export function scale(x: number) {\n  return String(2 * x);\n}\n");
    const later = new Date(Date.now() + 5_000);
    fs.utimesSync(source, later, later);
    const second = libraryDeclarations(options, place)!;
    expect(second.dir).not.toBe(first.dir);
    expect(fs.readFileSync(path.join(second.dir, "lib", "scale.d.ts"), "utf8")).toContain(
      "scale(x: number): string",
    );
    expect(session.check(notebook).map((d) => d.message)).toEqual([
      "Type 'string' is not assignable to type 'number'.",
    ]);
  });

  it("replace a folder of the current key that has no manifest (half made by hand or a crash)", () => {
    const place = fixtureLibrary();
    const dir = path.join(place.cacheDir, declarationKey(place.root));
    writeFiles(dir, { "cells/tristim-entry.d.ts": "export declare const wrong: string;\n" });
    const made = libraryDeclarations(cellCompilerOptions(), place)!;
    expect(made.dir).toBe(dir);
    expect(made.names).toEqual(["scale"]);
  });

  it("fall back to the sources when they cannot be made", () => {
    // A library that imports JSON is not made into declarations (the .json would be missing beside them).
    const place = fixtureLibrary({
      "lib/table.json": "[1, 2]\n",
      "lib/index.ts": 'export { default as table } from "./table.json";\n',
    });
    expect(libraryDeclarations(cellCompilerOptions(), place)).toBeUndefined();
    // A cache folder that cannot be written: the session checks against this library's sources.
    const blocked = tempFolder();
    const file = path.join(blocked, "not-a-folder");
    fs.writeFileSync(file, "");
    const unwritable: DeclarationPlace = { root: PACKAGE_ROOT, cacheDir: path.join(file, "typecheck") };
    expect(libraryDeclarations(cellCompilerOptions(), unwritable)).toBeUndefined();
    const notebook = readNotebook(
      notebookFile(ts("const p: Lab = { L: 50, a: 10, b: 10 };\nconst d: string = deltaE2000(p, p);")),
    );
    const found = createTypecheckSession({ place: unwritable }).check(notebook);
    expect(found.map((d) => d.message)).toEqual(["Type 'number' is not assignable to type 'string'."]);
    expect(found).toEqual(createTypecheckSession({ library: "sources" }).check(notebook));
  });
});

/** The compiler's default lib file for the cell options. */
function tsLibFile(): string {
  return compiler.getDefaultLibFilePath(cellCompilerOptions());
}

/** A small library of its own (lib/ and cells/tristim-entry.ts) with an empty cache folder. */
function fixtureLibrary(extra: Record<string, string> = {}): DeclarationPlace {
  const root = tempFolder("tristim-test-library-");
  writeFiles(root, {
    "cells/tristim-entry.ts": 'export * from "../lib/index.ts";\n',
    "lib/index.ts": 'export { scale } from "./scale.ts";\n',
    "lib/scale.ts": "/** Twice x. */\nexport function scale(x: number) {\n  return 2 * x;\n}\n",
    ...extra,
  });
  return { root, cacheDir: path.join(root, "cache") };
}

describe("comment-free copies of the Node and lib declaration files", () => {
  it("drop comments and keep every `///` directive and declaration", () => {
    const text =
      '/// <reference no-default-lib="true"/>\n/// <reference lib="es2020" />\n/// <reference path="other.d.ts" />\n' +
      "/** The invented meter's reading. */\ndeclare function reading(/* channel */ c: number): number; // mA\n" +
      'declare module "invented-meter" {\n  /** Serial number. */\n  export const serial: `SN-${number}`;\n}\n';
    const copy = stripped("/x/types.d.ts", text)!;
    expect(copy).not.toMatch(/invented meter's|channel|mA|Serial number/);
    for (const kept of ['no-default-lib="true"', 'reference lib="es2020"', 'reference path="other.d.ts"'])
      expect(copy).toContain(kept);
    expect(copy).toContain("declare function reading(c: number): number;");
    expect(copy).toContain("export const serial: `SN-${number}`;");
    // A file that does not parse is not copied.
    expect(stripped("/x/broken.d.ts", "declare const x: ;\n")).toBeUndefined();
  });

  it("are made for the Node types and the compiler's libs, recorded with each original's size and mtime, then read back", () => {
    const cacheDir = tempFolder("tristim-test-types-");
    const options = cellCompilerOptions();
    const copies = strippedTypes(options, cacheDir)!;
    const nodeIndex = path.join(options.typeRoots![0]!, "node", "index.d.ts");
    const es5 = path.join(path.dirname(tsLibFile()), "lib.es5.d.ts");
    for (const file of [nodeIndex, es5]) {
      const copy = copies.get(file)!;
      const stat = fs.statSync(file);
      expect({ size: copy.size, mtimeMs: copy.mtimeMs }).toEqual({ size: stat.size, mtimeMs: stat.mtimeMs });
      expect(copy.text.length).toBeLessThan(stat.size);
    }
    const [cacheFile, ...others] = fs.readdirSync(cacheDir);
    expect(others).toEqual([]);
    const written = fs.statSync(path.join(cacheDir, cacheFile!)).mtimeMs;
    expect(strippedTypes(options, cacheDir)).toEqual(copies);
    expect(fs.statSync(path.join(cacheDir, cacheFile!)).mtimeMs).toBe(written);
  });
});
