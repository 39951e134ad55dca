import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { NotebookError } from "../../runner/shared/errors.ts";
import { parseNotebook, readNotebook } from "../../runner/parse/parse-notebook.ts";
import { notebookFile, tempFolder, ts } from "./helpers.ts";

function parseError(text: string): NotebookError {
  try {
    parseNotebook(text, "/x/nb.md");
  } catch (e) {
    if (e instanceof NotebookError) return e;
    throw e;
  }
  throw new Error("expected a NotebookError");
}

describe("parsing a notebook", () => {
  it("reads the front matter: title, author, date and inputs with typed defaults", () => {
    const doc = parseNotebook(
      "---\ntitle: Lamp survey\nauthor: A. Tester\ndate: 2024-05-01\ninputs:\n  lamp: LED-2\n  tolerance: 1.5\n  strict: false\n  bands: [450, 550]\n---\n# Body\n",
      "/x/nb.md",
    );
    expect(doc.frontMatter).toEqual({
      title: "Lamp survey",
      author: "A. Tester",
      date: "2024-05-01",
      inputs: { lamp: "LED-2", tolerance: 1.5, strict: false, bands: [450, 550] },
    });
    expect(doc.body.split("\n")[10]).toBe("# Body");
  });

  it("finds ts and typescript fences as cells, with notebook line numbers; other fences are not cells", () => {
    const text =
      "# T\n\n" + ts("const a = 1;") + "\n```js\nnot a cell\n```\n\n```typescript\nconst b = 2;\nb\n```\n";
    const doc = parseNotebook(text, "/x/nb.md");
    expect(doc.cells.map((c) => c.code)).toEqual(["const a = 1;", "const b = 2;\nb"]);
    expect(doc.cells[0]!.fenceLine).toBe(3);
    expect(doc.cells[0]!.firstLine).toBe(4);
    expect(doc.cells[1]!.fenceLine).toBe(11);
  });

  it("reads cell options: flags, a quoted caption and a time limit", () => {
    const doc = parseNotebook(
      ts("1", 'hide-source caption="Radiance of lamp \\"B\\"" time-limit=2m may-fail'),
      "/x/nb.md",
    );
    expect(doc.cells[0]!.options).toEqual({
      hideSource: true,
      showSource: false,
      noRun: false,
      mayFail: true,
      caption: 'Radiance of lamp "B"',
      timeLimitMs: 120_000,
    });
    expect(parseNotebook(ts("1", "no-run show-source"), "/x/nb.md").cells[0]!.options).toMatchObject({
      noRun: true,
      showSource: true,
    });
  });

  it("rejects an unknown cell option, naming it and its line", () => {
    const e = parseError("intro\n\n" + ts("1", "hide-source fold"));
    expect(e.message).toContain('unknown cell option "fold"');
    expect(e.line).toBe(3);
  });

  it("rejects option values that make no sense", () => {
    expect(parseError(ts("1", "time-limit=soon")).message).toContain('"soon" is not a time limit');
    expect(parseError(ts("1", "caption")).message).toContain("needs a value");
    expect(parseError(ts("1", "hide-source=yes")).message).toContain("takes no value");
    expect(parseError(ts("1", "hide-source hide-source")).message).toContain("given twice");
    expect(parseError(ts("1", "hide-source show-source")).message).toContain("contradict");
  });

  it("rejects an unterminated fence, naming the line where it opens", () => {
    const e = parseError("# T\n\ntext\n\n```ts\nconst a = 1;\n");
    expect(e.message).toContain("never closed");
    expect(e.line).toBe(5);
  });

  it("rejects invalid front matter: bad YAML, unknown keys, an input without a default, an unclosed block", () => {
    expect(parseError("---\ntitle: [unclosed\n---\n").message).toContain("invalid front matter");
    const unknown = parseError("---\ntitle: x\ncolour: red\n---\n");
    expect(unknown.message).toContain('unknown key "colour"');
    expect(unknown.line).toBe(3);
    expect(parseError("---\ninputs:\n  lamp:\n---\n").message).toContain('input "lamp" needs a default');
    expect(parseError("---\ninputs:\n  bad-name: 1\n---\n").message).toContain("plain identifier");
    expect(parseError("---\ntitle: x\n").message).toContain("never closed");
  });

  it("finds cells inside list items and records how far the code is indented", () => {
    const doc = parseNotebook("1. Step one\n\n   ```ts\n   const x = 1;\n   ```\n", "/x/nb.md");
    expect(doc.cells[0]!.code).toBe("const x = 1;");
    expect(doc.cells[0]!.columnOffset).toBe(3);
  });
});

describe("reading notebook files", () => {
  it("reports a missing file", () => {
    expect(() => readNotebook(path.join(tempFolder(), "nope.md"))).toThrow(/no such file/);
  });

  it("refuses files that are not notebooks: other extensions, folders, binary content", () => {
    const folder = tempFolder();
    fs.writeFileSync(path.join(folder, "data.csv"), "a,b\n");
    expect(() => readNotebook(path.join(folder, "data.csv"))).toThrow(/not a notebook/);
    fs.mkdirSync(path.join(folder, "dir.md"));
    expect(() => readNotebook(path.join(folder, "dir.md"))).toThrow(/folder/);
    fs.writeFileSync(path.join(folder, "image.md"), Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x00, 0x01]));
    expect(() => readNotebook(path.join(folder, "image.md"))).toThrow(/binary/);
  });

  it("hashes the file's bytes with SHA-256", async () => {
    const file = notebookFile("# x\n");
    const { createHash } = await import("node:crypto");
    // SHA-256 as computed independently by Node's crypto module over the same bytes.
    expect(readNotebook(file).sha256).toBe(createHash("sha256").update(fs.readFileSync(file)).digest("hex"));
  });
});
