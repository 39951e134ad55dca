// Stages 2 and 3 meet here: a cell compiled alone (esbuild + rewrite), run in this process under its stack-frame
// file name, and its error mapped back through the rewrite and the source map to the notebook's line and column.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import vm from "node:vm";
import { afterAll, describe, expect, it } from "vitest";
import { notebookPosition } from "../../../runner/compile/cell-positions.ts";
import { compileCell, type CompileContext, type CompiledCell } from "../../../runner/compile/compile-cell.ts";
import { cellLevelError, mapError } from "../../../runner/execute/map-error.ts";
import { parseNotebook } from "../../../runner/parse/parse-notebook.ts";

const folder = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-positions-"));
afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

const FILE = path.join(folder, "lamp.md");

/** A notebook whose second cell is indented in a list item (column offset 3) and full of types to erase. */
const TEXT = [
  "# Positions", //                                                   1
  "", //                                                              2
  "```ts", //                                                         3
  "const lamps: string[] = ['A'];", //                                4
  "```", //                                                           5
  "", //                                                              6
  "1. A list item with a cell:", //                                   7
  "", //                                                              8
  "   ```ts", //                                                      9
  "   interface Reading { readonly value: number }", //              10
  "   const read = (r: Reading): number => r.value;", //             11
  "   function check2(x: number): number {", //                      12
  "     if (x > 1) throw new RangeError(`reading ${x} too high`);", //13
  "     return x;", //                                               14
  "   }", //                                                         15
  "   check2(read({ value: 3 } as Reading));", //                    16
  "   ```", //                                                       17
  "",
].join("\n");

const document = parseNotebook(TEXT, FILE);
const context: CompileContext = { document, tristimModule: path.join(folder, "tristim.mjs"), outDir: folder };

/** Runs a compiled cell's function here, with a runtime that only takes links, and returns what it threw. */
async function thrownBy(compiled: CompiledCell): Promise<Error> {
  const fn = vm.runInThisContext(compiled.code!, { filename: compiled.filename }) as (
    rt: unknown,
  ) => Promise<unknown>;
  const runtime = { declare: () => {}, link: () => {}, imported: () => ({}), lib: {}, bindImport: () => {} };
  try {
    await fn(runtime);
  } catch (e) {
    return e as Error;
  }
  throw new Error("the cell did not throw");
}

describe("positions from the compiled cell back to the notebook", () => {
  it("parses the cells with their first and last lines", () => {
    expect(document.cells.map((c) => [c.fenceLine, c.firstLine, c.lastLine, c.columnOffset])).toEqual([
      [3, 4, 4, 0],
      [9, 10, 16, 3],
    ]);
  });

  it("maps every identifier of the hoisted code to its line and column in the notebook", async () => {
    const compiled = await compileCell(document.cells[1]!, context);
    expect(compiled.failure).toBeUndefined();
    const positions = compiled.positions!;
    const code = compiled.code!;
    const body = code.indexOf("]]); ") + 5; // after the link call the rewrite puts before the cell's code
    const notebookLines = TEXT.split("\n");
    for (const word of ["read", "check2", "RangeError", "return"]) {
      const pattern = new RegExp(`\\b${word}\\b`);
      // Where the word first stands in the cell's code in the notebook, and where in the code that runs.
      const line = notebookLines.findIndex((l, i) => i >= 10 && pattern.test(l));
      const column = notebookLines[line]!.search(pattern);
      const offset = body + code.slice(body).search(pattern);
      const before = code.slice(0, offset).split("\n");
      expect(notebookPosition(positions, before.length, before.at(-1)!.length + 1)).toEqual({
        line: line + 1,
        column: column + 1,
      });
    }
  });

  it("maps a thrown error's stack to the notebook line and column of the throw, with a code frame", async () => {
    const compiled = await compileCell(document.cells[1]!, context);
    const error = await thrownBy(compiled);
    const record = mapError(
      { failure: "thrown", name: error.name, message: error.message, stack: error.stack },
      1,
      document,
      [undefined, compiled],
    );
    // `new RangeError` on line 13: column of `new` (V8 places a construction there).
    expect(record.location).toEqual({
      file: FILE,
      line: 13,
      column: TEXT.split("\n")[12]!.indexOf("new") + 1,
    });
    expect(record.message).toBe("reading 3 too high");
    // The frames of this test file are outside the notebook; the notebook's own frames are the cell's two.
    expect(record.stack?.filter((f) => f.file === FILE).map((f) => [f.function, f.line])).toEqual([
      ["check2", 13],
      [undefined, 16],
    ]);
    expect(record.codeFrame).toMatch(/> 13 \|/);
  });

  it("places a syntax error at its notebook line and column without running anything", async () => {
    const broken = parseNotebook("Intro\n\n```ts\nconst ok = 1;\nconst = 2;\n```\n", FILE);
    const compiled = await compileCell(broken.cells[0]!, { ...context, document: broken });
    expect(compiled.code).toBeUndefined();
    expect(compiled.failure).toMatchObject({
      kind: "error",
      failure: "compile",
      location: { file: FILE, line: 5, column: 7 },
    });
  });

  it("places an error without a stack at the cell's fence", () => {
    const record = cellLevelError("time-limit", "ran past 1 s", 1, document);
    expect(record.location).toEqual({ file: FILE, line: 9, column: 1 });
    expect(record.codeFrame).toMatch(/10 \|/);
  });
});
