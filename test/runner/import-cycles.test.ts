// The runner and the cell harness must form an import graph without cycles: each stage imports only from stages
// before it (and from shared/ and text/), so a stage can be read, tested and replaced alone. The graph is read with
// TypeScript's own pre-processor (every `import`, `import type`, `export … from` and `import("…")` counts).
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import ts from "typescript";
import { describe, expect, it } from "vitest";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));
const FOLDERS = ["runner", "cells"];

function sourceFiles(folder: string): string[] {
  return fs.readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(folder, entry.name);
    if (entry.isDirectory()) return sourceFiles(full);
    return /\.(ts|mjs)$/.test(entry.name) ? [full] : [];
  });
}

/** Relative imports of one file, resolved to files inside runner/ or cells/. */
function importsOf(file: string, inside: ReadonlySet<string>): string[] {
  const info = ts.preProcessFile(fs.readFileSync(file, "utf8"), true, true);
  return info.importedFiles
    .map((f) => f.fileName)
    .filter((name) => name.startsWith("."))
    .map((name) => path.resolve(path.dirname(file), name))
    .filter((target) => inside.has(target));
}

/** Every cycle's files in order, found by a depth-first search (each cycle reported once, from its first file). */
function importCycles(graph: ReadonlyMap<string, readonly string[]>): string[][] {
  const cycles: string[][] = [];
  const seen = new Set<string>();
  const state = new Map<string, "open" | "done">();
  const stack: string[] = [];
  const visit = (file: string): void => {
    state.set(file, "open");
    stack.push(file);
    for (const next of graph.get(file) ?? []) {
      if (state.get(next) === "open") {
        const cycle = stack.slice(stack.indexOf(next));
        const key = [...cycle].sort().join("\n");
        if (!seen.has(key)) {
          seen.add(key);
          cycles.push(cycle);
        }
      } else if (!state.has(next)) visit(next);
    }
    stack.pop();
    state.set(file, "done");
  };
  for (const file of [...graph.keys()].sort()) if (!state.has(file)) visit(file);
  return cycles;
}

describe("import graph of runner/ and cells/", () => {
  const files = FOLDERS.flatMap((f) => sourceFiles(path.join(ROOT, f)));
  const inside = new Set(files);
  const graph = new Map(files.map((f) => [f, importsOf(f, inside)]));

  it("reads the graph (the finder sees real imports)", () => {
    const cli = [...graph.entries()].find(([file]) => file.endsWith(`${path.sep}cli.ts`));
    expect(cli?.[1].length).toBeGreaterThan(3);
  });

  it("finds a cycle when there is one (the finder can fail)", () => {
    const made = new Map([
      ["a", ["b"]],
      ["b", ["c"]],
      ["c", ["a"]],
      ["d", ["a"]],
    ]);
    expect(importCycles(made)).toEqual([["a", "b", "c"]]);
  });

  it("has no import cycle", () => {
    const shown = importCycles(graph).map((cycle) =>
      [...cycle, cycle[0]!].map((f) => path.relative(ROOT, f)).join(" → "),
    );
    expect(shown).toEqual([]);
  });
});
