/**
 * The compiler's code cache (runner/typecheck/typescript.ts): a process with an empty cache folder writes it after
 * a check, the next one reads it without writing it again, and a damaged cache file is refused (by V8) and
 * replaced, while the compiler works the same in every case. Each process runs with its own TMPDIR.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { createRequire } from "node:module";
import { describe, expect, it, vi } from "vitest";
import { tempFolder } from "./helpers.ts";

vi.setConfig({ testTimeout: 120_000 });

const COMPILER = fileURLToPath(new URL("../../runner/typecheck/typescript.ts", import.meta.url));
const TYPESCRIPT_VERSION = (createRequire(import.meta.url)("typescript") as { version: string }).version;

/** Loads the compiler in a fresh process, compiles a snippet and saves the code cache; returns what it printed. */
function compileInFreshProcess(tmpdir: string): { version: string; output: string } {
  const script = path.join(tmpdir, "load-compiler.mts");
  fs.writeFileSync(
    script,
    `import ts, { saveCompilerCodeCache } from ${JSON.stringify(pathToFileURL(COMPILER).href)};\n` +
      `const out = ts.transpileModule("const x: number = 1 + 2;", { compilerOptions: { target: ts.ScriptTarget.ES2022 } });\n` +
      `saveCompilerCodeCache();\n` +
      `console.log(JSON.stringify({ version: ts.version, output: out.outputText }));\n`,
  );
  const result = spawnSync(process.execPath, ["--import", "tsx", script], {
    encoding: "utf8",
    env: { ...process.env, TMPDIR: tmpdir },
  });
  if (result.status !== 0) throw new Error(`the child failed (${result.status}): ${result.stderr}`);
  return JSON.parse(result.stdout.trim().split("\n").at(-1)!) as { version: string; output: string };
}

function cacheFiles(tmpdir: string): string[] {
  const root = fs.readdirSync(tmpdir).find((n) => n.startsWith("tristim-"));
  if (!root) return [];
  const folder = path.join(tmpdir, root, "compiler");
  return fs.existsSync(folder) ? fs.readdirSync(folder).map((n) => path.join(folder, n)) : [];
}

describe("the compiler's code cache", () => {
  it("is written once, then read; a damaged one is replaced; the compiler works the same throughout", () => {
    const tmpdir = tempFolder("tristim-test-code-cache-");
    const first = compileInFreshProcess(tmpdir);
    expect(first.version).toBe(TYPESCRIPT_VERSION);
    expect(first.output).toContain("const x = 1 + 2;");
    const [file, ...more] = cacheFiles(tmpdir);
    expect(more).toEqual([]);
    expect(fs.statSync(file!).size).toBeGreaterThan(100_000);

    // Read, not written again (a refused cache would be rewritten after the compile).
    const written = fs.statSync(file!).mtimeMs;
    expect(compileInFreshProcess(tmpdir)).toEqual(first);
    expect(fs.statSync(file!).mtimeMs).toBe(written);

    // Damaged: V8 refuses it, the compiler is compiled from source and the cache written anew.
    fs.writeFileSync(file!, Buffer.alloc(4096, 7));
    expect(compileInFreshProcess(tmpdir)).toEqual(first);
    expect(fs.statSync(file!).size).toBeGreaterThan(100_000);
    expect(fs.readFileSync(file!).subarray(0, 4096).equals(Buffer.alloc(4096, 7))).toBe(false);
  });
});
