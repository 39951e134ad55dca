/**
 * The compile stage's disk cache (runner/compile/compile-cache.ts): a notebook compiled again must give what a
 * fresh compile gives — the same code, its positions in the notebook as they are now (not where the cell was when
 * it was kept), and import bundles made again when a file they were made from changed.
 */
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { compileCells } from "../../runner/compile/compile-cell.ts";
import { runDocument } from "../../runner/execute/run-notebook.ts";
import { runtimeBundle } from "../../runner/execute/runtime-bundle.ts";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import { consoleText, notebookFile, tempFolder, ts } from "./helpers.ts";

/** A cell code no other test uses, so its first compile in this test is not from the cache. */
const unique = () => `const stamp = "${Date.now()}-${Math.random()}";`;

describe("the compile cache", () => {
  it("gives the same compiled cells as the first compile", async () => {
    const file = notebookFile(
      "# Cache (invented)\n\n" +
        ts(`${unique()}\nconst x: number = 2;\nconsole.log(x * 3);`) +
        "\n" +
        ts('import { sum } from "./helper.ts";\nconsole.log(sum(1, 2));'),
      { "helper.ts": "export const sum = (a: number, b: number): number => a + b;\n" },
    );
    const document = readNotebook(file);
    const runtime = await runtimeBundle();
    const context = { document, tristimModule: runtime.tristim, outDir: tempFolder() };
    const first = await compileCells(context);
    const second = await compileCells(context);
    expect(second).toEqual(first);
    expect(first[1]?.importedFiles).toEqual([path.join(path.dirname(file), "helper.ts")]);
  });

  it("places a kept cell at its line in the notebook as it is now", async () => {
    const cell = ts(`${unique()}\nconst ok = 1;\nthrow new Error("stop here");`);
    const file = notebookFile(`# Cache (invented)\n\n${cell}`);
    const before = await runDocument(readNotebook(file));
    const beforeError = before.cells[0]!.outputs.find((o) => o.kind === "error");
    // Prose above the cell: the same cell code, kept from the first run, now six lines lower.
    fs.writeFileSync(file, `# Cache (invented)\n\nOne.\n\nTwo.\n\nThree.\n\n${cell}`);
    const after = await runDocument(readNotebook(file));
    const afterError = after.cells[0]!.outputs.find((o) => o.kind === "error");
    expect(beforeError?.kind === "error" && beforeError.location?.line).toBe(6);
    expect(afterError?.kind === "error" && afterError.location?.line).toBe(12);
  });

  it("bundles the imports again when an imported file changed", async () => {
    const file = notebookFile(
      "# Cache (invented)\n\n" + ts(`${unique()}\nimport { value } from "./helper.ts";\nconsole.log(value);`),
      { "helper.ts": "export const value = 1;\n" },
    );
    const first = await runDocument(readNotebook(file));
    expect(consoleText(first, 0).trim()).toBe("1");
    fs.writeFileSync(path.join(path.dirname(file), "helper.ts"), "export const value = 22;\n");
    const second = await runDocument(readNotebook(file));
    expect(consoleText(second, 0).trim()).toBe("22");
  });
});
