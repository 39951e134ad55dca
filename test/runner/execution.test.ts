/**
 * Execution semantics, end to end: notebooks in temporary folders run through the real pipeline (esbuild, the cell
 * process, records). Each test asserts behaviour a notebook user relies on.
 */
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { consoleText, errorOf, outputsOf, runText, ts } from "./helpers.ts";

// These tests run real notebooks in cell processes; on a loaded machine a run takes seconds, so the budget is wide.
describe("bindings shared between cells", { timeout: 60_000 }, () => {
  it("lets later cells use and redeclare top-level const, let, function and class", async () => {
    const { run } = await runText(
      ts(
        "const data = [1, 2, 3];\nlet total = 0;\nfunction add(n: number) { total += n; return total; }\nclass Box { constructor(public v: number) {} }",
      ) +
        ts("add(10);\nconst data = 'replaced';\nconsole.log(typeof data, data, total, new Box(4).v);") +
        ts("let total = 99;\nconst { a, b: [c] } = { a: 1, b: [2] };\nconsole.log(total, a + c, data);"),
    );
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "ok", "ok"]);
    expect(consoleText(run, 1)).toBe("string replaced 10 4\n");
    expect(consoleText(run, 2)).toBe("99 3 replaced\n");
  });

  it("keeps a function's closure over a shared binding live across cells", async () => {
    const { run } = await runText(
      ts("let count = 0;\nconst bump = () => ++count;") + ts("bump(); bump();\ncount"),
    );
    expect(outputsOf(run, 1, "value")[0]?.text).toBe("2");
  });

  it("supports top-level await in any cell", async () => {
    const { run } = await runText(
      ts("const v = await new Promise<number>((r) => setTimeout(() => r(41), 20));") +
        ts("const w = await Promise.resolve(v + 1);\nw"),
    );
    expect(outputsOf(run, 1, "value")[0]?.text).toBe("42");
  });

  it("shows the last expression's value unless it is undefined", async () => {
    const { run } = await runText(
      ts("const x = { a: 1 };\nx") + ts("undefined") + ts("'plain text'") + ts("[1, 2].map((n) => n * 2)"),
    );
    expect(outputsOf(run, 0, "value")[0]?.text).toBe("{ a: 1 }");
    expect(run.cells[1]!.outputs).toEqual([]);
    expect(outputsOf(run, 2, "value")[0]?.text).toBe("plain text");
    expect(outputsOf(run, 3, "value")[0]?.text).toBe("[ 2, 4 ]");
  });

  it("shows a parenthesised last expression, with or without a semicolon, and a sequence of parentheses", async () => {
    const { run } = await runText(
      ts("const a = 1;\n({ a, b: [2] })") + ts("(a + 1);") + ts("((a) * 3)\n// a comment after"),
    );
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "ok", "ok"]);
    expect(outputsOf(run, 0, "value")[0]?.text).toBe("{ a: 1, b: [ 2 ] }");
    expect(outputsOf(run, 1, "value")[0]?.text).toBe("2");
    expect(outputsOf(run, 2, "value")[0]?.text).toBe("3");
  });
});

describe("console output", { timeout: 60_000 }, () => {
  it("captures console.log/info/warn/error and direct writes per cell, in order, with their stream", async () => {
    const { run } = await runText(
      ts(
        "console.log('one');\nconsole.warn('two');\nconsole.info('three', 3);\nconsole.error('four');\nprocess.stdout.write('five\\n');",
      ) + ts("console.log('next cell');"),
    );
    expect(outputsOf(run, 0, "console")).toEqual([
      { kind: "console", stream: "stdout", text: "one\n" },
      { kind: "console", stream: "stderr", text: "two\n" },
      { kind: "console", stream: "stdout", text: "three 3\n" },
      { kind: "console", stream: "stderr", text: "four\n" },
      { kind: "console", stream: "stdout", text: "five\n" },
    ]);
    expect(consoleText(run, 1)).toBe("next cell\n");
  });

  it("truncates huge output and says how much there was", async () => {
    const { run } = await runText(
      ts(
        "const line = 'x'.repeat(999) + '\\n';\nfor (let i = 0; i < 2000; i++) console.log(line.slice(0, -1));",
      ),
    );
    const text = consoleText(run, 0);
    expect(text.length).toBe(400_000);
    const note = outputsOf(run, 0, "note")[0]?.text ?? "";
    expect(note).toContain("Output truncated");
    expect(note).toContain("2.0 million characters");
  });
});

describe("imports", { timeout: 60_000 }, () => {
  it("imports relative .ts, .js and .json files and npm packages from the notebook's folder", async () => {
    const { run } = await runText(
      ts(
        "import { double } from './helpers/math.ts';\nimport table from './data/table.json';\nimport { greet } from 'local-pkg';\nimport legacy from './legacy.cjs';\nconsole.log(double(21), table.rows.length, greet('lab'), legacy.answer);",
      ),
      {},
      {
        "helpers/math.ts": "export const double = (n: number): number => n * 2;\n",
        "data/table.json": '{"rows": [1, 2, 3]}',
        "node_modules/local-pkg/package.json": '{"name":"local-pkg","version":"1.0.0","main":"index.js"}',
        "node_modules/local-pkg/index.js": "exports.greet = (who) => 'hello ' + who;\n",
        "legacy.cjs": "module.exports = { answer: 7 };\n",
      },
    );
    expect(run.cells[0]!.status).toBe("ok");
    expect(consoleText(run, 0)).toBe("42 3 hello lab 7\n");
  });

  it('gives "tristim" imports, globals and files that import "tristim" the same library instance', async () => {
    const { run } = await runText(
      ts(
        "import { noteMethod, methodsUsed as used } from 'tristim';\nnoteMethod('observer', 'noted through the import');",
      ) +
        ts(
          "noteMethod('illuminant', 'noted through the global');\nimport { noteFromFile } from './note.ts';\nnoteFromFile();\nconsole.log(used().length, methodsUsed().length, typeof show, typeof showTable);",
        ),
      {},
      {
        "note.ts":
          "import { noteMethod } from 'tristim';\nexport function noteFromFile() { noteMethod('other', 'noted in a file'); }\n",
      },
    );
    expect(consoleText(run, 1)).toBe("3 3 function function\n");
    expect(run.methods).toEqual([
      { topic: "observer", statement: "noted through the import" },
      { topic: "illuminant", statement: "noted through the global" },
      { topic: "other", statement: "noted in a file" },
    ]);
  });

  it("reports an import that cannot be resolved at the import's line, with a hint", async () => {
    const { document, run } = await runText(
      "# T\n\n" + ts("const a = 1;\nimport { x } from 'no-such-package-anywhere';"),
    );
    const error = errorOf(run, 0);
    expect(error.failure).toBe("compile");
    expect(error.message).toContain('Could not resolve "no-such-package-anywhere"');
    expect(error.message).toContain("npm install no-such-package-anywhere");
    expect(error.location).toEqual({ file: document.path, line: 5, column: 1 });
  });

  it("reports a missing named export of tristim clearly where it is used (a name used only as a type is fine)", async () => {
    const { run } = await runText(
      ts("import { noSuchThing, NotAValue } from 'tristim';\nlet t: NotAValue | undefined;") +
        ts("noSuchThing()"),
    );
    expect(run.cells[0]!.status).toBe("ok");
    expect(errorOf(run, 1).message).toBe('the module "tristim" has no export named "noSuchThing"');
  });

  it("resolves relative paths in cells against the notebook's folder", async () => {
    const { run, document } = await runText(
      ts(
        "import fs from 'node:fs';\nconsole.log(fs.readFileSync('data/values.csv', 'utf8').trim(), process.cwd());",
      ),
      {},
      { "data/values.csv": "a,b\n1,2\n" },
    );
    expect(consoleText(run, 0)).toBe(`a,b\n1,2 ${path.dirname(document.path)}\n`);
    expect(run.filesRead.map((f) => path.relative(path.dirname(document.path), f.path))).toEqual([
      path.join("data", "values.csv"),
    ]);
    expect(run.filesRead[0]!.cells).toEqual([0]);
  });
});

describe("inputs", { timeout: 60_000 }, () => {
  const text =
    "---\ninputs:\n  lamp: A\n  count: 2\n  strict: false\n---\n" +
    ts("console.log(inputs.lamp, inputs.count + 1, inputs.strict)");

  it("gives cells the defaults from the front matter", async () => {
    const { run } = await runText(text);
    expect(consoleText(run, 0)).toBe("A 3 false\n");
  });

  it("overrides them from the command line, typed like the defaults", async () => {
    const { run } = await runText(text, { inputs: { lamp: "LED 2", count: "10", strict: "true" } });
    expect(consoleText(run, 0)).toBe("LED 2 11 true\n");
    expect(run.inputsSet).toEqual({ lamp: "LED 2", count: 10, strict: true });
  });

  it("rejects an unknown input name and a value of the wrong type", async () => {
    await expect(runText(text, { inputs: { lmap: "x" } })).rejects.toThrow(
      /no input named "lmap".*lamp, count, strict/,
    );
    await expect(runText(text, { inputs: { count: "ten" } })).rejects.toThrow(/takes a number/);
    await expect(runText(text, { inputs: { strict: "yes" } })).rejects.toThrow(/takes true or false/);
  });
});

describe("failures", { timeout: 60_000 }, () => {
  it("stops at the first failing cell, marks later cells not run, and maps the error to the notebook line", async () => {
    const { document, run } = await runText(
      "# Title\n\n" +
        ts("const ok = 1;") +
        "\n" +
        ts("const a = 1;\nconst b = a.toFixed(1);\n(b as any).nope.deeper;") +
        ts("console.log('never');"),
    );
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "failed", "not-run"]);
    const error = errorOf(run, 1);
    expect(error.name).toBe("TypeError");
    expect(error.message).toContain("Cannot read properties of undefined (reading 'deeper')");
    expect(error.location).toEqual({ file: document.path, line: 10, column: 17 });
    expect(error.codeFrame).toContain("> 10 | (b as any).nope.deeper;");
    expect(error.codeFrame).toMatch(/\n\s+\| {17}\^/);
  });

  it("never runs the cell after a failing one, though it was sent to the cell process ahead", async () => {
    // The runner sends each next cell while the one before runs; the process must skip it when that one failed.
    const marker = 'import fs from "node:fs";\nfs.writeFileSync("after.txt", "ran");';
    const stopped = await runText(ts("throw new Error('first')") + ts(marker));
    expect(stopped.run.cells.map((c) => c.status)).toEqual(["failed", "not-run"]);
    const folder = path.dirname(stopped.document.path);
    // One more turn of the same process would have written the file by the time the run ended.
    expect(fs.existsSync(path.join(folder, "after.txt"))).toBe(false);
    // Where the run goes on, the cell sent ahead does run.
    const allowed = await runText(ts("throw new Error('first')", "may-fail") + ts(marker));
    expect(allowed.run.cells.map((c) => c.status)).toEqual(["failed", "ok"]);
    expect(fs.readFileSync(path.join(path.dirname(allowed.document.path), "after.txt"), "utf8")).toBe("ran");
  });

  it("holds a cell sent ahead to its own time limit, counted from the end of the cell before", async () => {
    const { run } = await runText(
      ts("await new Promise((r) => setTimeout(r, 400));") + ts("while (true) {}", "time-limit=300ms"),
    );
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "failed"]);
    expect(errorOf(run, 1).failure).toBe("time-limit");
  });

  it("reports a TypeScript syntax error at notebook file:line:column without running anything", async () => {
    const { document, run } = await runText("intro\n\n" + ts("const a = 1;\nconst b = ;"));
    const error = errorOf(run, 0);
    expect(error.failure).toBe("compile");
    expect(error.message).toContain("syntax error");
    expect(error.location).toEqual({ file: document.path, line: 5, column: 11 });
  });

  it("runs no cell of a notebook with cells that do not compile, and names every such cell", async () => {
    const text =
      ts("console.log('first');") + ts("const b = (1 + ;") + ts("console.log('third');") + ts("const c = ];");
    const { run } = await runText(text);
    expect(run.cells.map((c) => c.status)).toEqual(["not-run", "failed", "not-run", "failed"]);
    expect(errorOf(run, 1).failure).toBe("compile");
    expect(errorOf(run, 3).failure).toBe("compile");
    expect(run.events.join(" ")).toContain("No cell was run: cells 2 and 4 do not compile");
    // With --keep-going the cells that compile run.
    const going = await runText(text, { keepGoing: true });
    expect(going.run.cells.map((c) => c.status)).toEqual(["ok", "failed", "ok", "failed"]);
    expect(consoleText(going.run, 2).trim()).toBe("third");
  });

  it("maps errors thrown inside functions of earlier cells and of imported files", async () => {
    const { document, run } = await runText(
      ts(
        "function check(v: number) {\n  if (v < 0) throw new RangeError(`negative: ${v}`);\n  return v;\n}",
      ) + ts("import { boom } from './lib.ts';\ncheck(-2);"),
      {},
      { "lib.ts": "export function boom() { throw new Error('x'); }\n" },
    );
    const error = errorOf(run, 1);
    expect(error.message).toBe("negative: -2");
    expect(error.location?.line).toBe(9); // the call in cell 2
    expect(error.stack?.[0]).toMatchObject({ file: document.path, line: 3, function: "check" });
  });

  it("reports a rejected promise and a thrown non-Error value", async () => {
    const rejected = await runText(ts("await Promise.reject(new Error('sensor offline'));"));
    expect(errorOf(rejected.run, 0).message).toBe("sensor offline");
    const thrown = await runText(ts("throw 'plain string';"));
    expect(errorOf(thrown.run, 0).message).toBe("a value that is not an Error was thrown: 'plain string'");
  });

  it("attributes an unawaited rejection and a throwing timer to the cell that ran", async () => {
    const { run } = await runText(ts("Promise.reject(new Error('nobody waited'));\n1;") + ts("1"), {
      keepGoing: true,
    });
    expect(errorOf(run, 0).message).toContain("nobody waited");
    expect(errorOf(run, 0).failure).toBe("uncaught");
    const timer = await runText(
      ts(
        "setTimeout(() => { throw new Error('from a timer'); }, 5);\nawait new Promise((r) => setTimeout(r, 50));",
      ),
    );
    expect(errorOf(timer.run, 0).message).toContain("from a timer");
  });

  it("stops a cell that runs past its time limit, and a loop without end", async () => {
    const { run } = await runText(ts("1") + ts("while (true) {}", "time-limit=300ms") + ts("2"));
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "failed", "not-run"]);
    expect(errorOf(run, 1).failure).toBe("time-limit");
    expect(errorOf(run, 1).message).toContain("did not finish within its time limit of 300 ms");
    const global = await runText(ts("await new Promise(() => {});"), { timeLimitMs: 250 });
    expect(errorOf(global.run, 0).message).toContain("the run's time limit of 250 ms");
  });

  it("catches process.exit() in a cell and keeps the cell process alive", async () => {
    const { run } = await runText(ts("const kept = 5;") + ts("process.exit(3);") + ts("kept"), {
      keepGoing: true,
    });
    expect(errorOf(run, 1).failure).toBe("exit");
    expect(errorOf(run, 1).message).toContain("process.exit(3) was called");
    expect(outputsOf(run, 2, "value")[0]?.text).toBe("5");
    expect(run.events).toEqual([]);
  });

  it("reports a crash of the cell process and, when keeping going, restarts it and says so", async () => {
    const { run } = await runText(ts("process.kill(process.pid, 'SIGKILL');") + ts("console.log('after')"), {
      keepGoing: true,
    });
    expect(errorOf(run, 0).failure).toBe("crash");
    expect(errorOf(run, 0).message).toContain("SIGKILL");
    expect(consoleText(run, 1)).toBe("after\n");
    expect(run.events[0]).toContain("started again before cell 2");
  });

  it("after a cell is stopped at its time limit, keeping going runs the next cells in a fresh cell process", async () => {
    const { run } = await runText(
      ts("while (true) {}", "time-limit=300ms") + ts("console.log('after')") + ts("console.log('third')"),
      { keepGoing: true },
    );
    expect(run.cells.map((c) => c.status)).toEqual(["failed", "ok", "ok"]);
    expect(errorOf(run, 0).failure).toBe("time-limit");
    expect(consoleText(run, 1)).toBe("after\n");
    expect(run.events[0]).toContain("started again before cell 2");
  });

  it("runs the remaining cells after a failure when asked to keep going", async () => {
    const { run } = await runText(ts("throw new Error('first')") + ts("console.log('second')"), {
      keepGoing: true,
    });
    expect(run.cells.map((c) => c.status)).toEqual(["failed", "ok"]);
  });

  it("lets a may-fail cell fail without stopping the run", async () => {
    const { run } = await runText(
      ts("throw new Error('expected')", "may-fail") + ts("console.log('went on')"),
    );
    expect(run.cells[0]).toMatchObject({ status: "failed", failureAllowed: true });
    expect(consoleText(run, 1)).toBe("went on\n");
  });

  it("does not run no-run cells", async () => {
    const { run } = await runText(ts("throw new Error('must not run')", "no-run") + ts("1"));
    expect(run.cells.map((c) => c.status)).toEqual(["listing", "ok"]);
  });

  it("refuses to show a figure that cannot be stored as data, naming the part", async () => {
    const { run } = await runText(ts("showFigure({ data: [{ x: [1n, 2n], y: [1, 2] }] });"));
    expect(errorOf(run, 0).failure).toBe("unserializable");
    expect(errorOf(run, 0).message).toContain("the figure.data[0].x[0] is a BigInt");
    const circular = await runText(
      ts("const layout: any = {}; layout.self = layout;\nshowFigure({ data: [], layout });"),
    );
    expect(errorOf(circular.run, 0).message).toContain("the figure.layout.self refers back to itself");
  });
});
