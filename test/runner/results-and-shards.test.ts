/**
 * Runs at scale and results out (issue 18), through the real CLI: --results as JSON and as CSV (the CSV read back
 * with csv-parse, an independent RFC 4180 reader; data-file hashes recomputed here with node:crypto), the tables in
 * the embedded run record and the batch's results in its index page; --jobs over several notebooks gives the output
 * of a run one at a time; a batch run as 4 shards and merged with `tristim collate` gives the index, reports and
 * results of one run byte for byte (--reproducible); bad shards and merges are refused with exit 2 and nothing
 * written. All data are invented. Timings are not asserted (see test/bench/).
 */
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { readEmbeddedRunRecord } from "../../runner/report/embedded-run-record.ts";
import { CHECK_CSV_COLUMNS, readBatchResults, type ResultsFile } from "../../runner/report/results-file.ts";
import { ProgressLine } from "../../runner/cli/progress.ts";
import { tempFolder, ts, writeFiles } from "./helpers.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

function tristim(args: string[], cwd: string): { code: number | null; out: string; err: string } {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 240_000 });
  return { code: result.status, out: result.stdout, err: result.stderr };
}

/** Invented lot readings: a table with units and a caption, a check with limits and unit, a caution. */
const NOTEBOOK =
  "---\ntitle: Panel lot (invented data)\ninputs:\n  data: lots/a.txt\n---\n\n" +
  ts(
    'import fs from "node:fs";\nconst [name, value] = fs.readFileSync(inputs.data, "utf8").trim().split(",");\n' +
      'showTable([{ panel: name, L: Number(value) }], { units: { L: "cd/m²" } });',
    'caption="Readings, one row"',
  ) +
  ts(
    'showCaution("Invented demonstration data, not a measurement.");\ncheck("luminance", Number(value), { min: 100, max: 200, unit: "cd/m²" });',
  );

const LOTS: Record<string, string> = {
  "lots/a.txt": "A-1,150.25",
  "lots/b.txt": 'B "two",99.5',
  "lots/c.txt": "C-3,180",
  "lots/d.txt": "D-4,120",
  "lots/e.txt": "E-5,201",
};

function folderWithLots(): string {
  const folder = tempFolder("tristim-scale-");
  writeFiles(folder, { "nb.md": NOTEBOOK, ...LOTS });
  return folder;
}

function files(folder: string): Record<string, Buffer> {
  return Object.fromEntries(
    fs
      .readdirSync(folder)
      .sort()
      .map((name) => [name, fs.readFileSync(path.join(folder, name))]),
  );
}

const sha256 = (text: string) => createHash("sha256").update(text).digest("hex");
const EACH = ["run", "nb.md", "--each", "data=lots/*.txt", "--reproducible"];

describe("results as data", () => {
  it("writes every check, table, caution, input and data-file hash of a batch as JSON and the checks as CSV", () => {
    const folder = folderWithLots();
    const result = tristim([...EACH, "-o", "out", "--results", "r.json", "--results", "r.csv"], folder);
    expect(result.code).toBe(EXIT.checkFailed); // b (99.5) and e (201) are out of limits
    const json = JSON.parse(fs.readFileSync(path.join(folder, "r.json"), "utf8")) as ResultsFile;
    expect(json.format).toBe("tristim-results");
    expect(json.version).toBe(1);
    expect(json.exitCode).toBe(EXIT.checkFailed);
    expect(json.batch).toMatchObject({ input: "data", pattern: "lots/*.txt", count: 5 });
    expect(json.runs.map((r) => r.dataFile)).toEqual(Object.keys(LOTS));
    for (const run of json.runs) expect(run.dataFileSha256).toBe(sha256(LOTS[run.dataFile!]!));
    const b = json.runs[1]!.record;
    expect(b.cells.map((c) => c.status)).toEqual(["ok", "ok"]);
    expect(b.checks).toEqual([
      expect.objectContaining({
        label: "luminance",
        passed: false,
        value: 99.5,
        unit: "cd/m²",
        limits: { min: 100, max: 200 },
      }),
    ]);
    expect(b.tables).toEqual([
      {
        number: 1,
        cell: 1,
        caption: "Readings, one row",
        columns: [
          { label: "panel", numeric: false },
          { label: "L", unit: "cd/m²", numeric: true },
        ],
        rows: [['B "two"', "99.5"]],
        totalRows: 1,
      },
    ]);
    expect(b.cautions.map((c) => c.text)).toEqual(["Invented demonstration data, not a measurement."]);
    expect(b.inputs).toEqual([{ name: "data", value: "lots/b.txt", setBy: "--each" }]);
    expect(b.filesRead).toEqual([{ path: "lots/b.txt", sha256: sha256(LOTS["lots/b.txt"]!), cells: [1] }]);

    // The CSV, read by an independent RFC 4180 reader: one row per check, the quote in the label's data kept.
    const rows = parse(fs.readFileSync(path.join(folder, "r.csv"), "utf8"), { columns: true }) as Record<
      string,
      string
    >[];
    expect(Object.keys(rows[0]!)).toEqual([...CHECK_CSV_COLUMNS]);
    expect(rows.map((r) => [r.data_file, r.outcome, r.value, r.min, r.max, r.unit])).toEqual([
      ["lots/a.txt", "pass", "150.25", "100", "200", "cd/m²"],
      ["lots/b.txt", "fail", "99.5", "100", "200", "cd/m²"],
      ["lots/c.txt", "pass", "180", "100", "200", "cd/m²"],
      ["lots/d.txt", "pass", "120", "100", "200", "cd/m²"],
      ["lots/e.txt", "fail", "201", "100", "200", "cd/m²"],
    ]);

    // The index embeds the same results; each report's run record carries its tables.
    const index = fs.readFileSync(path.join(folder, "out", "index.html"), "utf8");
    expect(readBatchResults(index)).toEqual(json);
    expect(readEmbeddedRunRecord(fs.readFileSync(path.join(folder, "out", "b.html"), "utf8")).tables).toEqual(
      b.tables,
    );
  }, 240_000);

  it("refuses a results file that is neither .json nor .csv, before running", () => {
    const folder = folderWithLots();
    const result = tristim(["run", "nb.md", "--results", "r.txt"], folder);
    expect(result.code).toBe(EXIT.usage);
    expect(result.err).toContain("must end in .json");
    expect(fs.existsSync(path.join(folder, "nb.html"))).toBe(false);
  });
});

describe("--jobs over several notebooks", () => {
  it("prints, writes and exits as one run at a time, and a failing notebook does not stop the others", () => {
    const folder = tempFolder("tristim-jobs-many-");
    const notebook = (n: number, body: string) =>
      `# Notebook ${n} (invented)\n\n` +
      ts(`const until = Date.now() + ${(3 - (n % 3)) * 120};\nwhile (Date.now() < until);\n${body}`);
    writeFiles(folder, {
      "n1.md": notebook(1, 'check("one", 1, { max: 2 });'),
      "n2.md": notebook(2, 'throw new Error("invented failure");'),
      "n3.md": notebook(3, 'check("three", 3, { max: 2 });'),
      "n4.md": notebook(4, "showTable([{ a: 1 }]);"),
    });
    const args = (out: string, jobs: string) => [
      "run",
      "n1.md",
      "n2.md",
      "n3.md",
      "n4.md",
      "--reproducible",
      "-o",
      out,
      "--jobs",
      jobs,
      "--results",
      `${out}.json`,
    ];
    const one = tristim(args("one", "1"), folder);
    const four = tristim(args("four", "4"), folder);
    expect(one.code).toBe(EXIT.notebookFailed);
    expect(four.code).toBe(EXIT.notebookFailed);
    const same = (text: string) => text.replaceAll("four", "one").replace(/ ran in [^,\n]+/g, " ran in …");
    expect(same(four.err)).toBe(same(one.err));
    expect(same(four.out)).toBe(same(one.out));
    // Not a terminal: plain lines, no progress line redrawn with carriage returns.
    expect(four.err).not.toContain("\r");
    expect(files(path.join(folder, "four"))).toEqual(files(path.join(folder, "one")));
    expect(fs.readFileSync(path.join(folder, "four.json"), "utf8").replaceAll("four/", "one/")).toBe(
      fs.readFileSync(path.join(folder, "one.json"), "utf8"),
    );
    expect(Object.keys(files(path.join(folder, "four")))).toEqual([
      "n1.html",
      "n2.html",
      "n3.html",
      "n4.html",
    ]);
  }, 240_000);

  it.skipIf(!fs.existsSync("/usr/bin/script"))(
    "draws the progress line on a terminal (a pseudo-terminal from util-linux script)",
    () => {
      const folder = folderWithLots();
      const log = path.join(folder, "tty.log");
      const command = `${JSON.stringify(process.execPath)} ${JSON.stringify(BIN)} run nb.md --each 'data=lots/*.txt' --jobs 2 -o tty`;
      spawnSync("/usr/bin/script", ["-qec", command, log], {
        cwd: folder,
        encoding: "utf8",
        timeout: 240_000,
      });
      const text = fs.readFileSync(log, "utf8");
      expect(text).toContain("\r\x1b[2K0 of 5 runs done, 0 failed");
      expect(text).toMatch(/\r\x1b\[2K2 of 5 runs done, 1 failed, about .+ left/);
      expect(text).toContain("\r\x1b[2K5 of 5 runs done, 2 failed");
    },
    240_000,
  );

  it("draws a progress line with runs done, failures and time left", () => {
    let t = 0;
    let written = "";
    const line = new ProgressLine(
      4,
      (text) => void (written += text),
      () => t,
    );
    t = 1000;
    line.finished(false);
    t = 2000;
    line.finished(true);
    // 2 runs in 2 s: 1 s a run, 2 to go.
    expect(line.text()).toBe("2 of 4 runs done, 1 failed, about 2 s left");
    expect(written.endsWith("\r\x1b[2K2 of 4 runs done, 1 failed, about 2 s left")).toBe(true);
    line.finished(false);
    line.finished(false);
    expect(line.text()).toBe("4 of 4 runs done, 1 failed");
  });
});

describe("--shard and tristim collate", () => {
  it("gives, for 4 shards merged, the same index, reports and results as one run, byte for byte", () => {
    const folder = folderWithLots();
    expect(tristim([...EACH, "-o", "whole", "--results", "whole.json"], folder).code).toBe(EXIT.checkFailed);
    const sizes: number[] = [];
    for (const k of [1, 2, 3, 4]) {
      const shard = tristim([...EACH, "-o", `shard-${k}`, "--shard", `${k}/4`], folder);
      expect([EXIT.ok, EXIT.checkFailed]).toContain(shard.code);
      sizes.push(
        readBatchResults(fs.readFileSync(path.join(folder, `shard-${k}`, "index.html"), "utf8")).runs.length,
      );
    }
    // Deterministic slices in the order of the files, every file in exactly one.
    expect(sizes).toEqual([1, 1, 1, 2]);
    const merged = tristim(
      ["collate", "shard-3", "shard-1", "shard-4", "shard-2", "-o", "merged", "--results", "merged.json"],
      folder,
    );
    expect(merged.code).toBe(EXIT.checkFailed);
    expect(merged.err).toContain("4 shards, 5 runs, 3 passed");
    expect(files(path.join(folder, "merged"))).toEqual(files(path.join(folder, "whole")));
    expect(fs.readFileSync(path.join(folder, "merged.json"), "utf8")).toBe(
      fs.readFileSync(path.join(folder, "whole.json"), "utf8"),
    );
  }, 300_000);

  it("refuses --shard 5/4, missing or doubled shards, and shards of another notebook or tool version, writing nothing", () => {
    const folder = folderWithLots();
    const bad = tristim([...EACH, "--shard", "5/4"], folder);
    expect(bad.code).toBe(EXIT.usage);
    expect(bad.err).toContain("there is no shard 5 of 4");
    expect(fs.existsSync(path.join(folder, "nb-reports"))).toBe(false);
    for (const text of ["0/4", "2", "a/b"])
      expect(tristim([...EACH, "--shard", text], folder).code).toBe(EXIT.usage);
    expect(tristim(["run", "nb.md", "--shard", "1/2"], folder).err).toContain(
      "--shard is an option of run --each",
    );

    for (const k of [1, 2]) tristim([...EACH, "-o", `s${k}`, "--shard", `${k}/2`], folder);
    // Another notebook's shard 2 (one word changed) and a shard made by another tool version.
    writeFiles(folder, {
      "other/nb.md": NOTEBOOK.replace("one row", "a row"),
      ...Object.fromEntries(Object.entries(LOTS).map(([k, v]) => [`other/${k}`, v])),
    });
    tristim(
      ["run", "nb.md", "--each", "data=lots/*.txt", "--reproducible", "-o", "../o2", "--shard", "2/2"],
      path.join(folder, "other"),
    );
    fs.cpSync(path.join(folder, "s2"), path.join(folder, "v2"), { recursive: true });
    const v2 = path.join(folder, "v2", "index.html");
    fs.writeFileSync(
      v2,
      fs.readFileSync(v2, "utf8").replace(/("tool":\{"name":"tristim","version":")[^"]+/, "$19.9.9"),
    );
    // A folder that is already there must keep its content.
    writeFiles(folder, { "out/keep.txt": "mine" });
    const before = files(path.join(folder, "out"));
    for (const [args, message] of [
      [["s1"], "shard 2 of 2 is missing"],
      [["s1", "s1", "s2"], "shard 1 of 2 is given twice"],
      [["s1", "o2"], "the notebooks differ"],
      [["s1", "v2"], "the tool versions differ"],
      [["s1", "lots"], "no index.html there"],
    ] as const) {
      const result = tristim(["collate", ...args, "-o", "out", "--results", "out.json"], folder);
      expect(result.code, args.join(" ")).toBe(EXIT.usage);
      expect(result.err).toContain(message);
      expect(files(path.join(folder, "out"))).toEqual(before);
      expect(fs.existsSync(path.join(folder, "out.json"))).toBe(false);
    }
    expect(tristim(["collate", "s1", "s2", "-o", "s1"], folder).code).toBe(EXIT.usage);
  }, 300_000);
});
