/**
 * The reference of the public library (issue 11): every function exported from lib/index.ts has a doc comment with a
 * summary, a @param for each argument (an options argument may instead have every option described on its type),
 * a default stated for each optional argument and option, a @returns, a @source and an @example; and every example
 * runs without throwing and type-checks. The convention is in DEVELOPERS.md ("Doc comments of public functions").
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { transformSync } from "esbuild";
import ts from "typescript";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as tristim from "../../lib/index.ts";
import { extractReference, type ReferenceEntry } from "../../runner/reference/index.ts";

const entries = extractReference();
const exported = tristim as unknown as Record<string, unknown>;

/** Words by which a comment says what happens when an optional argument or option is left out. */
const STATES_DEFAULT = /default|absent|omitted|not given|left out|unless|otherwise|when given|if given|none/i;

function problemsOf(e: ReferenceEntry): string[] {
  const problems: string[] = [];
  if (!e.documented) return ["no doc comment"];
  if (!e.summary) problems.push("no summary");
  if (!e.source) problems.push("no @source");
  if (e.examples.length === 0) problems.push("no @example");
  if (!e.returns && e.returnType !== "void") problems.push("no @returns");
  for (const p of e.parameters) {
    const optionsDocumented = p.options.length > 0 && p.options.every((o) => o.doc);
    if (!p.doc && !optionsDocumented) problems.push(`no @param ${p.name}`);
    if (p.optional && p.options.length === 0 && !STATES_DEFAULT.test(p.doc))
      problems.push(`@param ${p.name} does not state its default`);
    for (const o of p.options) {
      if (!o.doc) problems.push(`option ${p.name}.${o.name} is not described`);
      else if (o.optional && !STATES_DEFAULT.test(o.doc))
        problems.push(`option ${p.name}.${o.name} does not state its default`);
    }
  }
  return problems;
}

describe("the reference of lib/index.ts", { timeout: 60_000 }, () => {
  it("finds every exported function", () => {
    const functions = Object.entries(exported)
      .filter(([, v]) => typeof v === "function" && !/^class\b/.test(Function.prototype.toString.call(v)))
      .map(([k]) => k)
      .sort();
    expect(entries.map((e) => e.name).sort()).toEqual(functions);
    expect(entries.length).toBeGreaterThan(200);
  });

  it("every public function has a complete doc comment", () => {
    const missing = entries.flatMap((e) => problemsOf(e).map((p) => `${e.name} (${e.file}:${e.line}): ${p}`));
    expect(missing).toEqual([]);
  });

  it("every example uses its own function", () => {
    const unrelated = entries
      .filter((e) => e.examples.length > 0 && !e.examples.some((x) => new RegExp(`\\b${e.name}\\b`).test(x)))
      .map((e) => e.name);
    expect(unrelated).toEqual([]);
  });
});

describe("every example runs", () => {
  // Examples run as in a notebook of notebooks/: the working folder holds data/ (the example notebooks' invented
  // demo files), and what an example writes lands in a temporary folder that is removed afterwards.
  const here = path.dirname(fileURLToPath(import.meta.url));
  const previous = process.cwd();
  let folder = "";
  beforeAll(() => {
    folder = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-examples-"));
    fs.cpSync(path.join(here, "..", "..", "notebooks", "data"), path.join(folder, "data"), {
      recursive: true,
    });
    process.chdir(folder);
  });
  afterAll(() => {
    process.chdir(previous);
    fs.rmSync(folder, { recursive: true, force: true });
  });

  const names = Object.keys(exported);
  const AsyncFunction = async function () {}.constructor as new (
    ...args: string[]
  ) => (...values: unknown[]) => Promise<unknown>;
  for (const e of entries) {
    e.examples.forEach((example, i) => {
      it(`${e.name} example ${i + 1}`, async () => {
        const js = transformSync(example, { loader: "ts" }).code;
        const run = new AsyncFunction(...names, js);
        await expect(run(...names.map((n) => exported[n]))).resolves.not.toThrow();
      });
    });
  }
});

describe("every example type-checks", { timeout: 120_000 }, () => {
  // Each example becomes the body of a function in one virtual module that imports the library, checked with the
  // project's strictness (strict, noUncheckedIndexedAccess): an argument of the wrong shape is caught even where the
  // function would run without throwing.
  it("as the library's exports, with the project's compiler settings", () => {
    const here = path.dirname(fileURLToPath(import.meta.url));
    const file = path.join(here, "__reference-examples__.ts");
    const lines = [
      `import * as tristim from "../../lib/index.ts";`,
      `const { ${Object.keys(exported).join(", ")} } = tristim;`,
    ];
    const owner: string[] = [];
    for (const e of entries)
      e.examples.forEach((example, i) => {
        const start = lines.length;
        lines.push(`export async function example${lines.length}() {`, example, "}");
        for (let k = start; k < lines.length; k++) owner[k] = `${e.name} example ${i + 1}`;
      });
    const text = lines.join("\n");
    const options: ts.CompilerOptions = {
      target: ts.ScriptTarget.ES2022,
      module: ts.ModuleKind.NodeNext,
      moduleResolution: ts.ModuleResolutionKind.NodeNext,
      allowImportingTsExtensions: true,
      strict: true,
      noUncheckedIndexedAccess: true,
      noEmit: true,
      skipLibCheck: true,
      types: ["node"],
      lib: ["lib.es2022.d.ts", "lib.dom.d.ts"],
    };
    const host = ts.createCompilerHost(options);
    const getSourceFile = host.getSourceFile.bind(host);
    host.getSourceFile = (name, language, ...rest) =>
      path.resolve(name) === file
        ? ts.createSourceFile(name, text, language)
        : getSourceFile(name, language, ...rest);
    const fileExists = host.fileExists.bind(host);
    host.fileExists = (name) => path.resolve(name) === file || fileExists(name);
    const program = ts.createProgram([file], options, host);
    const problems = ts
      .getPreEmitDiagnostics(program)
      .filter((d) => d.file && path.resolve(d.file.fileName) === file)
      .map((d) => {
        const { line } = d.file!.getLineAndCharacterOfPosition(d.start ?? 0);
        return `${owner[line] ?? "module"}: ${ts.flattenDiagnosticMessageText(d.messageText, " ")}`;
      });
    expect(problems).toEqual([]);
  });
});
