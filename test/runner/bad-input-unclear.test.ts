/**
 * Unclear messages made clear: invalid front matter at its real line and column, CR-only line endings read like
 * LF, out of memory, process.abort(), failed dynamic imports and errors in imported helpers placed in the notebook.
 */
import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { notebookFile, runText, ts } from "./helpers.ts";
import { tristimCommand } from "./bad-input-helpers.ts";

const LIMIT = 180_000;

describe("front matter and line endings", () => {
  it(
    "invalid YAML front matter is reported at its real line and column",
    async () => {
      const notebook = notebookFile("---\ntitle: ok\nauthor: Lab\ninputs:\n  levels: [1, 2\n---\n# T\n");
      const r = await tristimCommand(["run", notebook]);
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err).toMatch(/nb\.md:5:\d+: invalid front matter: /);
      const unique = notebookFile("---\ntitle: ok\nauthor: A\ntitle: again\n---\n# T\n");
      const r2 = await tristimCommand(["run", unique]);
      expect(r2.err).toMatch(/nb\.md:4:1: invalid front matter: .*unique/);
    },
    LIMIT,
  );

  it(
    "a notebook with CR-only line endings runs like the same notebook with LF or CRLF",
    async () => {
      const lf = `---\ntitle: Endings\n---\n# Endings\n\nSome prose.\n\n${ts("const a = 2;\na * 21")}`;
      const values: unknown[] = [];
      for (const eol of ["\n", "\r\n", "\r"]) {
        const notebook = notebookFile(lf.replace(/\n/g, eol));
        const r = await tristimCommand(["run", notebook, "--reproducible", "--quiet"]);
        expect(r.err).toBe("");
        expect(r.code).toBe(EXIT.ok);
        const html = fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8");
        expect(html).toContain("<title>Endings");
        values.push(html.includes(">42<"));
      }
      expect(values).toEqual([true, true, true]);
    },
    LIMIT,
  );

  it("a cell of a CR-only notebook keeps its line numbers", async () => {
    const { run } = await runText(
      `# T\r\r${ts("const x = 1;\nthrow new Error('at line 5')").replace(/\n/g, "\r")}`,
    );
    expect(run.cells[0]!.status).toBe("failed");
    const error = run.cells[0]!.outputs.find((o) => o.kind === "error");
    expect(error && "location" in error ? error.location?.line : undefined).toBe(5);
  });
});
