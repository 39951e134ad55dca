/**
 * Runs over many inputs: `tristim run nb.md --each name=pattern` runs the notebook once per data file, binding the
 * file to the named input, writes one report per file named after it and an index page; the exit code is the worst
 * over the runs. Expected matches are written out by hand from the files each test creates.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { parseEachArgument } from "../../runner/batch/batch.ts";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { expandFilePattern, reportNamesFor } from "../../runner/batch/file-pattern.ts";
import { readEmbeddedRunRecord } from "../../runner/report/embedded-run-record.ts";
import { tempFolder, ts, writeFiles } from "./helpers.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

function tristim(args: string[], cwd?: string): { code: number | null; out: string; err: string } {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 120_000 });
  return { code: result.status, out: result.stdout, err: result.stderr };
}

describe("file patterns", () => {
  const folder = tempFolder();
  writeFiles(folder, {
    "lots/a.csv": "1",
    "lots/b.csv": "2",
    "lots/notes.txt": "x",
    "lots/.hidden.csv": "h",
    "lots/old/c.csv": "3",
    "lots/old/deeper/d.csv": "4",
  });
  const rel = (files: string[]) => files.map((f) => path.relative(folder, f).split(path.sep).join("/"));

  it("expands a folder, a wildcard, ? and ** (sorted; hidden files left out)", () => {
    expect(rel(expandFilePattern("lots", folder, "--each data"))).toEqual([
      "lots/a.csv",
      "lots/b.csv",
      "lots/notes.txt",
    ]);
    expect(rel(expandFilePattern("lots/*.csv", folder, "--each data"))).toEqual(["lots/a.csv", "lots/b.csv"]);
    expect(rel(expandFilePattern("lots/?.csv", folder, "--each data"))).toEqual(["lots/a.csv", "lots/b.csv"]);
    expect(rel(expandFilePattern("lots/**/*.csv", folder, "--each data"))).toEqual([
      "lots/a.csv",
      "lots/b.csv",
      "lots/old/c.csv",
      "lots/old/deeper/d.csv",
    ]);
    expect(rel(expandFilePattern("lots/.*.csv", folder, "--each data"))).toEqual(["lots/.hidden.csv"]);
    expect(rel(expandFilePattern("lots/a.csv", folder, "--each data"))).toEqual(["lots/a.csv"]);
  });

  it("says clearly when nothing matches", () => {
    expect(() => expandFilePattern("lots/*.cgats", folder, "--each data")).toThrow(
      "--each data: no files match lots/*.cgats",
    );
    expect(() => expandFilePattern("nope", folder, "--each data")).toThrow("nope: no such file or folder");
  });

  it("names reports after the data files, avoiding clashes and index.html", () => {
    const base = "/d";
    const names = reportNamesFor(
      ["/d/x/lot-1.csv", "/d/x/lot-2.csv", "/d/x/index.csv", "/d/x/p.csv", "/d/x/p.txt", "/d/y/lot-1.csv"],
      base,
    );
    expect([...names.values()]).toEqual([
      "x_lot-1.csv.html",
      "lot-2.html",
      "index.csv.html",
      "p.csv.html",
      "p.txt.html",
      "y_lot-1.csv.html",
    ]);
  });

  it("reads --each as input=files", () => {
    expect(parseEachArgument("data=lots/*.csv")).toEqual({ input: "data", pattern: "lots/*.csv" });
    expect(() => parseEachArgument("lots/*.csv")).toThrow("--each expects input=files");
    expect(() => parseEachArgument("9x=a")).toThrow("--each expects input=files");
  });
});

describe("tristim run --each", () => {
  const NOTEBOOK =
    "---\ntitle: Lot check (invented data)\ninputs:\n  data: lots/a.csv\n  limit: 5\n---\n# Lot check\n\n" +
    ts(
      "import fs from 'node:fs';\nconst v = Number(fs.readFileSync(inputs.data, 'utf8'));\ncheck('value', v, { max: inputs.limit });\nconsole.log(inputs.data);",
    );

  it("writes one report per data file and an index, exits with the worst code, and is reproducible", () => {
    const folder = tempFolder();
    writeFiles(folder, { "nb.md": NOTEBOOK, "lots/a.csv": "1", "lots/b.csv": "7", "lots/c.csv": "3" });
    const args = ["run", "nb.md", "--each", "data=lots/*.csv", "--reproducible", "--link-assets"];
    const first = tristim([...args, "-o", "one"], folder);
    expect(first.code).toBe(EXIT.checkFailed);
    expect(first.err).toContain("nb.md [2/3 data=lots/b.csv]");
    expect(first.err).toContain("check failed (cell 1): value: 7 (limits ≤ 5)");
    expect(fs.readdirSync(path.join(folder, "one")).sort()).toEqual([
      "a.html",
      "b.html",
      "c.html",
      "index.html",
      "tristim-assets",
    ]);
    // Each report ran with its own file bound to the input.
    for (const name of ["a", "b", "c"]) {
      const html = fs.readFileSync(path.join(folder, "one", `${name}.html`), "utf8");
      expect(html).toContain(`<pre class="out-console out-stdout">lots/${name}.csv</pre>`);
      expect(html).toContain("--each (this run&#39;s data file)");
      // The embedded run record names the data file and the check's full value (the files hold 1, 7 and 3).
      const record = readEmbeddedRunRecord(html);
      expect(record.batch).toEqual({
        input: "data",
        pattern: "lots/*.csv",
        position: ["a", "b", "c"].indexOf(name) + 1,
        count: 3,
        dataFile: `lots/${name}.csv`,
      });
      expect(record.inputs.find((i) => i.name === "data")).toEqual({
        name: "data",
        value: `lots/${name}.csv`,
        setBy: "--each",
      });
      expect(record.checks.map((c) => [c.value, c.passed])).toEqual([
        [{ a: 1, b: 7, c: 3 }[name], name !== "b"],
      ]);
      expect(record.exitCode).toBe(name === "b" ? EXIT.checkFailed : EXIT.ok);
    }
    const index = fs.readFileSync(path.join(folder, "one", "index.html"), "utf8");
    expect(index).toContain("<h1>Lot check (invented data)</h1>");
    expect(index).toContain('<a href="a.html">lots/a.csv</a>');
    expect(index).toContain('<a href="b.html">lots/b.csv</a>');
    expect(index).toContain("1 of 3 runs did not pass");
    expect(index).toMatch(
      /<tr class="check check-fail" id="run-2">.*FAIL.*lots\/b\.csv.*1 of 1 failed.*value/,
    );
    // The only script is the batch's results as data (JSON, never run).
    expect(index.match(/<script\b[^>]*>/g)).toEqual([
      '<script type="application/json" id="tristim-batch-results">',
    ]);

    // Same command again into another folder: byte-identical (diff -r).
    const second = tristim([...args, "-o", "two"], folder);
    expect(second.code).toBe(EXIT.checkFailed);
    const diff = spawnSync("diff", ["-r", "one", "two"], { cwd: folder, encoding: "utf8" });
    expect(diff.stdout).toBe("");
    expect(diff.status).toBe(0);
  }, 240_000);

  it("exits with the worst code over the runs: a failed cell (1) wins over a failed check (3)", () => {
    const folder = tempFolder();
    writeFiles(folder, { "nb.md": NOTEBOOK, "lots/a.csv": "1", "lots/c.csv": "not a number" });
    // c.csv reads as NaN, which fails its check (never a silent pass).
    const checks = tristim(["run", "nb.md", "--each", "data=lots/*.csv", "--link-assets", "--quiet"], folder);
    expect(checks.code).toBe(EXIT.checkFailed);
    expect(checks.err).toContain("value: NaN, not a number");
    writeFiles(folder, {
      "lots/b.csv": "7",
      "nb2.md": NOTEBOOK.replace(
        "console.log(inputs.data);",
        "if (v > 6) throw new Error('reading out of range');",
      ),
    });
    const mixed = tristim(["run", "nb2.md", "--each", "data=lots/*.csv", "--link-assets", "--quiet"], folder);
    expect(mixed.code).toBe(EXIT.notebookFailed);
    expect(mixed.err).toContain("nb2.md [2/3 data=lots/b.csv]: a cell failed");
    const index = fs.readFileSync(path.join(folder, "nb2-reports", "index.html"), "utf8");
    expect(index).toContain("1 run with a failed cell");
    // b.csv failed its check too, but it counts under the failed cell, as its exit code does.
    expect(index).toContain("1 run with failed acceptance checks");
  }, 240_000);

  it("refuses a wrong batch with exit code 2", () => {
    const folder = tempFolder();
    writeFiles(folder, { "nb.md": NOTEBOOK, "lots/a.csv": "1" });
    const unknown = tristim(["run", "nb.md", "--each", "lot=lots/*.csv"], folder);
    expect(unknown.code).toBe(EXIT.usage);
    expect(unknown.err).toContain('has no input named "lot"');
    const number = tristim(["run", "nb.md", "--each", "limit=lots/*.csv"], folder);
    expect(number.code).toBe(EXIT.usage);
    expect(number.err).toContain('input "limit" must have a text default');
    const both = tristim(["run", "nb.md", "--each", "data=lots/*.csv", "--input", "data=x.csv"], folder);
    expect(both.code).toBe(EXIT.usage);
    const none = tristim(["run", "nb.md", "--each", "data=lots/*.cgats"], folder);
    expect(none.code).toBe(EXIT.usage);
    expect(none.err).toContain("no files match lots/*.cgats");
    const twoNotebooks = tristim(["run", "nb.md", "nb.md", "--each", "data=lots/*.csv"], folder);
    expect(twoNotebooks.code).toBe(EXIT.usage);
  }, 120_000);
});
