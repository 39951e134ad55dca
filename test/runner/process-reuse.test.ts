/**
 * Runs that hand their cell process on (the default for the runs of a batch and for several notebooks of one folder):
 * the next run must see a process as if it were new. Each notebook here leaves behind what a careless cell might
 * (globals, a patched built-in prototype and fs function, an environment variable, another working folder, a
 * running interval, module state in a helper file) and the next run reports what it sees. A run that leaves a
 * server open, loaded an ES module with import() or wrote into a library table must not hand its process on.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, it } from "vitest";
import { runDocument, sharedRunParts } from "../../runner/execute/run-notebook.ts";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import type { RunRecord } from "../../runner/records/run-record.ts";
import { consoleText, notebookFile, ts } from "./helpers.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

/** Reports what a fresh process would show, then changes each of those things. */
const CARELESS = [
  "---\ntitle: Careless cells (invented)\ninputs:\n  n: 0\n---\n",
  ts(
    [
      'import fs from "node:fs";',
      'import { nextCount } from "./counter.ts";',
      "const seen = {",
      "  global: typeof (globalThis as any).leftBehind,",
      "  proto: typeof ([] as any).leftBehind,",
      "  fsPatched: (fs as any).leftBehind === undefined ? 'no' : 'yes',",
      '  env: process.env.TRISTIM_LEFT_BEHIND ?? "unset",',
      "  cwdIsNotebookFolder: process.cwd() === import.meta.dirname,",
      "  helperCount: nextCount(),",
      '  d65At560: valueAt(illuminant("D65"), 560),',
      "  observerAt560: CIE_1931_2_DEGREE.yBar[200],",
      "  exitCode: process.exitCode ?? 'unset',",
      "  inputN: inputs.n,",
      "};",
      "console.log(JSON.stringify(seen));",
      'console.log("pid " + process.pid);',
    ].join("\n"),
  ),
  ts(
    [
      "(globalThis as any).leftBehind = 1;",
      "(Array.prototype as any).leftBehind = 1;",
      "(fs as any).leftBehind = 1;",
      'process.env.TRISTIM_LEFT_BEHIND = "yes";',
      'process.chdir("/");',
      "process.exitCode = 3;",
      "setInterval(() => undefined, 60_000);",
      "process.exitCode = undefined;",
    ].join("\n"),
  ),
].join("\n");

const COUNTER = "let count = 0;\nexport function nextCount(): number {\n  return ++count;\n}\n";

/** The JSON line and the pid the first cell printed. */
function seenBy(run: RunRecord): { seen: Record<string, unknown>; pid: string } {
  const text = consoleText(run, 0);
  const [json, pid] = text.trim().split("\n");
  expect(run.cells.map((c) => c.status)).toEqual(["ok", "ok"]);
  return { seen: JSON.parse(json!) as Record<string, unknown>, pid: pid! };
}

async function runsOf(file: string, count: number, share: boolean): Promise<RunRecord[]> {
  const document = readNotebook(file);
  const shared = await sharedRunParts(document);
  const runs: RunRecord[] = [];
  try {
    for (let i = 0; i < count; i++)
      runs.push(
        await runDocument(document, {
          shared,
          shareProcess: share,
          inputs: { n: String(i) },
          timeLimitMs: 30_000,
        }),
      );
  } finally {
    shared.dispose();
  }
  return runs;
}

const folders: string[] = [];
afterAll(() => {
  for (const f of folders) fs.rmSync(f, { recursive: true, force: true });
});

describe("a cell process handed on to the next run", () => {
  it("is used again, and each run sees what a new process would show", async () => {
    const file = notebookFile(CARELESS, { "counter.ts": COUNTER });
    folders.push(path.dirname(file));
    const runs = await runsOf(file, 3, true);
    const seen = runs.map(seenBy);
    // The same process served all three runs (that is what this test is about)...
    expect(new Set(seen.map((s) => s.pid)).size).toBe(1);
    // ...and each run saw what the first saw, in a new process (only its own input differs).
    const first = seen[0]!.seen;
    expect(first).toMatchObject({
      global: "undefined",
      proto: "undefined",
      fsPatched: "no",
      env: "unset",
      cwdIsNotebookFolder: true,
      helperCount: 1,
      exitCode: "unset",
    });
    // D65 at 560 nm is 100.000 (CIE 015:2018, Table 5, normalised at 560 nm); ȳ(560 nm) = 0.995 (CIE 018:2019).
    expect(first.d65At560).toBeCloseTo(100, 6);
    expect(first.observerAt560).toBeCloseTo(0.995, 3);
    seen.forEach((s, i) => expect(s.seen).toEqual({ ...first, inputN: i }));
  }, 60_000);

  it("runs a cell that the run before skipped (a cell sent ahead after a failure is that run's only)", async () => {
    // In the first notebook, cell 2 is sent to the process ahead and skipped there, as cell 1 fails. The second
    // notebook of the folder takes the same process and starts at cell 2 (cell 1 is a listing): it must be sent.
    const folder = path.dirname(
      notebookFile(ts("throw new Error('the first notebook fails');") + ts('console.log("A2");'), {}, "a.md"),
    );
    folders.push(folder);
    fs.writeFileSync(path.join(folder, "b.md"), ts("1", "no-run") + ts('console.log("B2 " + process.pid);'));
    const [a, b] = [readNotebook(path.join(folder, "a.md")), readNotebook(path.join(folder, "b.md"))];
    const first = await runDocument(a, { shareProcess: true, timeLimitMs: 10_000 });
    const second = await runDocument(b, { shareProcess: true, timeLimitMs: 10_000 });
    expect(first.cells.map((c) => c.status)).toEqual(["failed", "not-run"]);
    expect(second.cells.map((c) => c.status)).toEqual(["listing", "ok"]);
    expect(consoleText(second, 1)).toMatch(/^B2 \d+\n$/);
  }, 60_000);

  it("gives each run its own process with shareProcess off", async () => {
    const file = notebookFile(CARELESS, { "counter.ts": COUNTER });
    folders.push(path.dirname(file));
    const runs = await runsOf(file, 2, false);
    const seen = runs.map(seenBy);
    expect(seen[0]!.pid).not.toBe(seen[1]!.pid);
    expect(seen[1]!.seen).toEqual({ ...seen[0]!.seen, inputN: 1 });
  }, 60_000);

  it.each([
    [
      "a server left listening",
      'import net from "node:net";\nnet.createServer().listen(0, "127.0.0.1");\nconsole.log("pid " + process.pid);',
    ],
    [
      "a library table written (an observer and a cached illuminant)",
      '(CIE_1931_2_DEGREE.yBar as number[])[200] = -1;\n(illuminant("D65").values as number[])[260] = -1;\n' +
        'console.log("pid " + process.pid);',
    ],
    [
      "an ES module loaded with import()",
      'const m = await import("./counter.mjs");\nm.nextCount();\nconsole.log("pid " + process.pid);',
    ],
  ])(
    "is not handed on after %s",
    async (_what, code) => {
      const file = notebookFile(`---\ntitle: Left running (invented)\ninputs:\n  n: 0\n---\n\n${ts(code)}`, {
        "counter.mjs": COUNTER.replace("(): number", "()"),
      });
      folders.push(path.dirname(file));
      const runs = await runsOf(file, 2, true);
      const pids = runs.map((r) => consoleText(r, 0).trim());
      expect(runs.every((r) => r.cells[0]!.status === "ok")).toBe(true);
      expect(pids[0]).toMatch(/^pid \d+$/);
      expect(pids[1]).not.toBe(pids[0]);
    },
    60_000,
  );
});

describe("--each with a shared cell process", () => {
  it("writes the same reports as --fresh-process (--reproducible, byte for byte)", () => {
    const file = notebookFile(
      "---\ntitle: Lot (invented)\ninputs:\n  data: lots/a.csv\n---\n\n" +
        ts(
          'import fs from "node:fs";\nconst v = Number(fs.readFileSync(inputs.data, "utf8"));\n' +
            '(globalThis as any).total = ((globalThis as any).total ?? 0) + v;\nshowTable([{ file: inputs.data, v, total: (globalThis as any).total }]);\ncheck("v", v, { min: 0 });',
        ),
      { "lots/a.csv": "1", "lots/b.csv": "2", "lots/c.csv": "3" },
    );
    const folder = path.dirname(file);
    folders.push(folder);
    const run = (out: string, extra: string[]) =>
      spawnSync(
        process.execPath,
        [BIN, "run", file, "--each", "data=lots/*.csv", "--reproducible", "--quiet", "-o", out, ...extra],
        { cwd: folder, encoding: "utf8", timeout: 120_000 },
      );
    const shared = run("shared", ["--jobs", "1"]);
    const fresh = run("fresh", ["--fresh-process"]);
    expect(shared.status, shared.stderr).toBe(0);
    expect(fresh.status, fresh.stderr).toBe(0);
    for (const name of ["a.html", "b.html", "c.html", "index.html"])
      expect(fs.readFileSync(path.join(folder, "shared", name))).toEqual(
        fs.readFileSync(path.join(folder, "fresh", name)),
      );
    // The running total never carries over: each run starts from nothing.
    expect(fs.readFileSync(path.join(folder, "shared", "c.html"), "utf8")).not.toMatch(/>6</);
  }, 120_000);
});

describe("a run after one that wrote into a library table", () => {
  it("gets a new process, and the tables as the library made them", async () => {
    const file = notebookFile(
      "---\ntitle: Table writes (invented)\ninputs:\n  n: 0\n---\n\n" +
        ts(
          'console.log(JSON.stringify([CIE_1931_2_DEGREE.yBar[200], valueAt(illuminant("D65"), 560), process.pid]));\n' +
            '(CIE_1931_2_DEGREE.yBar as number[])[200] = -1;\n(illuminant("D65").values as number[])[260] = -1;',
        ),
    );
    folders.push(path.dirname(file));
    const runs = await runsOf(file, 2, true);
    const [first, second] = runs.map((r) => JSON.parse(consoleText(r, 0).trim()) as [number, number, number]);
    // ȳ(560 nm) = 0.995 (CIE 018:2019); D65 at 560 nm = 100.000 (CIE 015:2018, Table 5).
    expect(first![0]).toBeCloseTo(0.995, 3);
    expect(second![0]).toBeCloseTo(0.995, 3);
    expect(second![1]).toBeCloseTo(100, 6);
    expect(second![2]).not.toBe(first![2]);
  }, 60_000);
});
