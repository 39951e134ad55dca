/**
 * `tristim editor-types <folder>`: the declaration of the cell globals and the tsconfig.json it writes let the
 * TypeScript compiler (as an editor or `tsc -p` runs it) check a helper file in the folder.
 */
import fs from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it, vi } from "vitest";
import { main } from "../../runner/cli/cli.ts";
import { EDITOR_FILES, writeEditorTypes } from "../../runner/typecheck/editor-types.ts";
import { tempFolder, ts as cell, writeFiles } from "./helpers.ts";

vi.setConfig({ testTimeout: 120_000 });

/** The diagnostics tsc gives for the folder's tsconfig.json, as "file:line: message". */
function tscDiagnostics(folder: string): string[] {
  const config = ts.getParsedCommandLineOfConfigFile(path.join(folder, EDITOR_FILES.tsconfig), undefined, {
    ...ts.sys,
    onUnRecoverableConfigFileDiagnostic: (d) => {
      throw new Error(ts.flattenDiagnosticMessageText(d.messageText, "\n"));
    },
  });
  if (!config) throw new Error("tsconfig.json could not be read");
  expect(config.errors).toEqual([]);
  const program = ts.createProgram(config.fileNames, config.options);
  return ts.getPreEmitDiagnostics(program).map((d) => {
    const line = d.file ? d.file.getLineAndCharacterOfPosition(d.start ?? 0).line + 1 : 0;
    return `${d.file ? path.basename(d.file.fileName) : "-"}:${line}: ${ts.flattenDiagnosticMessageText(d.messageText, " ")}`;
  });
}

describe("tristim editor-types", () => {
  it("lets tsc check a helper file with the cell globals, inputs from the folder's notebooks and tristim imports", () => {
    const folder = tempFolder();
    writeFiles(folder, {
      "lot.md": "---\ninputs:\n  tolerance: 1.5\n  batch: A-3\n---\n\n" + cell("const x = 1;"),
      "helper.ts":
        'import { deltaE2000, type Lab } from "tristim";\n\n' +
        "/** Checks one invented reading against the target (uses cell globals). */\n" +
        "export function judge(reading: Lab, target: Lab): boolean {\n" +
        "  const dE = deltaE2000(reading, target);\n" +
        "  showTable([{ batch: inputs.batch, dE }], { digits: 2 });\n" +
        '  return check("ΔE00", dE, { max: inputs.tolerance });\n' +
        "}\n",
      "wrong.ts":
        'export const limit: string = inputs.tolerance;\nexport const n: number = showTable("rows");\n',
    });
    const written = writeEditorTypes(folder);
    expect(written.map((f) => path.basename(f))).toEqual([EDITOR_FILES.globals, EDITOR_FILES.tsconfig]);
    const found = tscDiagnostics(folder);
    expect(found).toHaveLength(3);
    expect(found[0]).toMatch(/^wrong\.ts:1: Type 'number' is not assignable to type 'string'/);
    expect(found.slice(1).every((d) => d.startsWith("wrong.ts:2:"))).toBe(true);
  });

  it("writes again over its own files and refuses to overwrite a tsconfig.json of the user's", async () => {
    const folder = tempFolder();
    writeEditorTypes(folder);
    expect(() => writeEditorTypes(folder)).not.toThrow();
    const other = tempFolder();
    fs.writeFileSync(path.join(other, "tsconfig.json"), "{}\n");
    const err: string[] = [];
    const io = { out: () => undefined, err: (t: string) => void err.push(t) };
    expect(await main(["editor-types", other], io)).toBe(1);
    expect(err.join("")).toMatch(
      /tsconfig\.json: this file exists and was not written by tristim editor-types/,
    );
    expect(fs.readFileSync(path.join(other, "tsconfig.json"), "utf8")).toBe("{}\n");
    expect(await main(["editor-types"], io)).toBe(2);
  });
});
