/**
 * `--each` with `--jobs`: runs go several at a time, yet the terminal output, the index (in the order of the files)
 * and, with --reproducible, every report are byte for byte those of a run one at a time; a failing run does not stop
 * the others and the exit code is the worst; `--jobs 0` is a usage error. Timings are not asserted (see the bench).
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { tempFolder, ts, writeFiles } from "./helpers.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

function tristim(args: string[], cwd: string): { code: number | null; out: string; err: string } {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 180_000 });
  return { code: result.status, out: result.stdout, err: result.stderr };
}

/** A notebook that reads its data file, fails on a file saying "fail" and fails a check on "low" (invented data). */
const NOTEBOOK =
  "---\ntitle: Lot check (invented)\ninputs:\n  data: lots/a.txt\n---\n\n" +
  ts(
    'import fs from "node:fs";\nconst text = fs.readFileSync(inputs.data, "utf8").trim();\n' +
      "// Uneven run times, so that parallel runs finish out of order.\n" +
      "const until = Date.now() + (text.length % 3) * 150;\nwhile (Date.now() < until);\n" +
      'if (text === "fail") throw new Error("lot rejected: " + inputs.data);\nconsole.log("lot", text);',
  ) +
  ts('check("reading", text === "low" ? 1 : 5, { min: 2 });');

function batchFolder(): string {
  const folder = tempFolder("tristim-jobs-");
  writeFiles(folder, {
    "nb.md": NOTEBOOK,
    "lots/a.txt": "alpha-long",
    "lots/b.txt": "fail",
    "lots/c.txt": "low",
    "lots/d.txt": "d",
    "lots/e.txt": "epsilon",
  });
  return folder;
}

function reports(folder: string): Record<string, string> {
  return Object.fromEntries(
    fs
      .readdirSync(folder)
      .sort()
      .map((name) => [name, fs.readFileSync(path.join(folder, name), "utf8")]),
  );
}

describe("--each --jobs", () => {
  it("gives the same messages, index and reproducible reports as one run at a time, with the worst exit code", () => {
    const folder = batchFolder();
    const args = (out: string, jobs: string) => [
      "run",
      "nb.md",
      "--each",
      "data=lots/*.txt",
      "--reproducible",
      "-o",
      out,
      "--jobs",
      jobs,
    ];
    const one = tristim(args("one", "1"), folder);
    const three = tristim(args("three", "3"), folder);
    // b fails a cell (exit 1), c fails a check (3): the worst is 1 (4 > 2 > 1 > 3 > 0), and d, e still ran.
    expect(one.code).toBe(EXIT.notebookFailed);
    expect(three.code).toBe(EXIT.notebookFailed);
    // The terminal says how long each run took (the reports, with --reproducible, do not): those words aside.
    const same = (text: string) => text.replaceAll("three", "one").replace(/ ran in [^,]+,/g, " ran in …,");
    expect(same(three.err)).toBe(same(one.err));
    expect(same(three.out)).toBe(same(one.out));
    const positions = [...one.err.matchAll(/\[(\d)\/5 data=/g)].map((m) => Number(m[1]));
    expect(positions).toEqual([...positions].sort());
    const a = reports(path.join(folder, "one"));
    const b = reports(path.join(folder, "three"));
    expect(Object.keys(b)).toEqual(["a.html", "b.html", "c.html", "d.html", "e.html", "index.html"]);
    expect(b).toEqual(a);
    expect(b["e.html"]).toContain("lot epsilon");
  }, 240_000);

  it("refuses --jobs 0, a fraction, and --jobs with watch (exit 2)", () => {
    const folder = batchFolder();
    for (const [args, message] of [
      [
        ["--each", "data=lots/*.txt", "--jobs", "0"],
        '--jobs expects how many runs go at the same time, a whole number from 1, got "0"',
      ],
      [["--each", "data=lots/*.txt", "--jobs", "1.5"], 'got "1.5"'],
      [["--jobs", "0"], 'got "0"'],
    ] as const) {
      const result = tristim(["run", "nb.md", ...args], folder);
      expect(result.code).toBe(EXIT.usage);
      expect(result.err).toContain(message);
    }
    const watch = tristim(["watch", "nb.md", "--jobs", "2"], folder);
    expect(watch.code).toBe(EXIT.usage);
    expect(watch.err).toContain("--jobs is an option of run");
    expect(fs.existsSync(path.join(folder, "nb-reports"))).toBe(false);
    expect(fs.existsSync(path.join(folder, "nb.html"))).toBe(false);
  }, 60_000);
});
