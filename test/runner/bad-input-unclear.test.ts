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

/** The runner's own temporary script and frames, which must never reach a user. */
const RUNNER_PLACES = /worker\.mjs|\/runtime\/[0-9a-f]+\/|node::|0x[0-9a-f]{8}/;

describe("crashes and imports placed in the notebook", () => {
  it(
    "a cell that runs out of memory is said to, with the limit and how to raise it, and no engine frames",
    async () => {
      const notebook = notebookFile(
        `# Memory\n\n${ts("const kept: number[][] = [];\nwhile (true) kept.push(new Array(1e6).fill(1.5));")}`,
      );
      const r = await tristimCommand(["run", notebook], 120_000, { TRISTIM_MEMORY_LIMIT_MB: "64" });
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err).toMatch(
        /nb\.md:3:1: cell 1 failed: cell 1 ran out of memory: .* up to 64 MB .*TRISTIM_MEMORY_LIMIT_MB/,
      );
      expect(r.err).not.toMatch(RUNNER_PLACES);
      expect(r.err).not.toMatch(/SIGABRT|FATAL ERROR/);
      const html = fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8");
      expect(html).toContain("ran out of memory");
      expect(html).not.toMatch(RUNNER_PLACES);
    },
    LIMIT,
  );

  it(
    "process.abort() is placed at its notebook line, without the runner's frames or temporary paths",
    async () => {
      const notebook = notebookFile(`# Abort\n\n${ts("show(1);")}\n${ts("process.abort();")}`);
      const r = await tristimCommand(["run", notebook]);
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err).toMatch(/nb\.md:7:1: cell 2 failed: .*SIGABRT \(process\.abort\(\)/);
      expect(r.err).toContain("> 8 | process.abort();");
      expect(r.err).not.toMatch(RUNNER_PLACES);
      expect(fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8")).not.toMatch(RUNNER_PLACES);
    },
    LIMIT,
  );

  it(
    "a failed dynamic import() names the cell and notebook, not the runner's script",
    async () => {
      const notebook = notebookFile(
        `# Import\n\n${ts('const m = await import("./missing-helper.ts");\nshow(m);')}`,
      );
      const r = await tristimCommand(["run", notebook]);
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err).toMatch(
        /nb\.md:4:17: cell 1 failed: .*missing-helper\.ts.* imported from cell 1 of nb\.md/,
      );
      expect(r.err).not.toMatch(RUNNER_PLACES);
      expect(fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8")).not.toMatch(RUNNER_PLACES);
    },
    LIMIT,
  );

  it(
    "an error in an imported helper names the notebook and its import line first, then the helper's place",
    async () => {
      const notebook = notebookFile(
        `# Helper\n\nText.\n\n${ts('const x = 1;\nimport { k } from "./broken.ts";\nshow(k + x);')}`,
        { "broken.ts": 'export const k = 1;\nthrow new Error("helper broke at load");\n' },
      );
      const r = await tristimCommand(["run", notebook]);
      expect(r.code).toBe(EXIT.notebookFailed);
      const lines = r.err.split("\n");
      expect(lines[0]).toMatch(/nb\.md:7:\d+: cell 1 failed: Error: helper broke at load$/);
      expect(lines[1]).toBe("  raised in broken.ts:2:7");
      expect(r.err).toContain('> 7 | import { k } from "./broken.ts";');
    },
    LIMIT,
  );
});
