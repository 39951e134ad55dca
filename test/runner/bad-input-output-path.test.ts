/**
 * Bad output paths: a report never replaces the notebook, an input file or a file a cell read (exit 2, nothing
 * written), and an output path that cannot be written ends the command with exit 4 and a message.
 */
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { notebookFile, ts } from "./helpers.ts";
import { tristimCommand } from "./bad-input-helpers.ts";

const LIMIT = 180_000;

function notebookWithData(): { notebook: string; data: string; other: string; text: string } {
  const text = `---\ninputs:\n  data: data.csv\n---\n# Guarded\n\n${ts('import fs from "node:fs";\nfs.readFileSync("other.txt", "utf8").length')}`;
  const notebook = notebookFile(text, { "data.csv": "a,b\n1,2\n", "other.txt": "keep me\n" });
  const folder = path.dirname(notebook);
  return { notebook, data: path.join(folder, "data.csv"), other: path.join(folder, "other.txt"), text };
}

describe("a report never replaces the notebook or its data", () => {
  it(
    "refuses -o naming the notebook itself (also through another spelling of the path)",
    async () => {
      const { notebook, text } = notebookWithData();
      for (const target of [notebook, path.join(path.dirname(notebook), ".", "nb.md")]) {
        const r = await tristimCommand(["run", notebook, "-o", target]);
        expect(r.code).toBe(EXIT.usage);
        expect(r.err).toContain("is the notebook itself");
        expect(r.err).toContain("nothing was run or written");
        expect(fs.readFileSync(notebook, "utf8")).toBe(text);
      }
      expect(fs.readdirSync(path.dirname(notebook)).sort()).toEqual(["data.csv", "nb.md", "other.txt"]);
    },
    LIMIT,
  );

  it(
    "refuses -o naming a symbolic link to the notebook",
    async () => {
      const { notebook, text } = notebookWithData();
      const link = path.join(path.dirname(notebook), "link.md");
      fs.symlinkSync(notebook, link);
      const r = await tristimCommand(["run", notebook, "-o", link]);
      expect(r.code).toBe(EXIT.usage);
      expect(fs.readFileSync(notebook, "utf8")).toBe(text);
    },
    LIMIT,
  );

  it(
    "refuses -o naming the file of an input (front-matter default or --input)",
    async () => {
      const { notebook, data } = notebookWithData();
      const r = await tristimCommand(["run", notebook, "-o", data]);
      expect(r.code).toBe(EXIT.usage);
      expect(r.err).toContain('the file of input "data"');
      expect(fs.readFileSync(data, "utf8")).toBe("a,b\n1,2\n");
      const other = path.join(path.dirname(notebook), "other.txt");
      const r2 = await tristimCommand(["run", notebook, "--input", "data=other.txt", "-o", other]);
      expect(r2.code).toBe(EXIT.usage);
      expect(fs.readFileSync(other, "utf8")).toBe("keep me\n");
    },
    LIMIT,
  );

  it(
    "refuses, after the run, -o naming a file a cell read, and writes nothing",
    async () => {
      const { notebook, other, text } = notebookWithData();
      const r = await tristimCommand(["run", notebook, "-o", other]);
      expect(r.code).toBe(EXIT.usage);
      expect(r.err).toContain("is a file cell 1 read");
      expect(r.err).toContain("nothing was written");
      expect(fs.readFileSync(other, "utf8")).toBe("keep me\n");
      expect(fs.readFileSync(notebook, "utf8")).toBe(text);
      expect(fs.readdirSync(path.dirname(notebook)).sort()).toEqual(["data.csv", "nb.md", "other.txt"]);
    },
    LIMIT,
  );

  it(
    "still writes a report to a fresh path (the check refuses only real clashes)",
    async () => {
      const { notebook } = notebookWithData();
      const target = path.join(path.dirname(notebook), "out", "report.html");
      const r = await tristimCommand(["run", notebook, "-o", target, "--quiet"]);
      expect(r.code).toBe(EXIT.ok);
      expect(fs.readFileSync(target, "utf8")).toMatch(/^<!doctype html>/);
    },
    LIMIT,
  );
});
