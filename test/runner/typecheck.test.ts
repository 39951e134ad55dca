/**
 * `tristim typecheck`: the cells checked as the runner links them. Each test writes a small notebook, checks it
 * with the typed boundary (document in, diagnostics out) and looks for the error at the notebook line and column
 * found by searching the notebook text, or for no error where the code is right.
 */
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, it, vi } from "vitest";
import { main } from "../../runner/cli/cli.ts";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import { typeErrorBanner } from "../../runner/typecheck/type-error-banner.ts";
import type { TypeDiagnostic } from "../../runner/typecheck/type-diagnostic.ts";
import { createTypecheckSession } from "../../runner/typecheck/typecheck.ts";
import { startWatch, type RenderEvent, type Watcher } from "../../runner/watch/watch.ts";
import { notebookFile, ts } from "./helpers.ts";

// The first check parses the Node types and the library's declarations (emitting those first after a library
// change: seconds on a loaded machine); later ones reuse them.
vi.setConfig({ testTimeout: 120_000 });

const session = createTypecheckSession();

function check(text: string, files: Record<string, string> = {}): { file: string; found: TypeDiagnostic[] } {
  const file = notebookFile(text, files);
  return { file, found: session.check(readNotebook(file)) };
}

/** 1-based line and column of `needle` (its `at`-th character) in the notebook text. */
function placeOf(text: string, needle: string, at = 0): { line: number; column: number } {
  const offset = text.indexOf(needle);
  if (offset < 0) throw new Error(`test setup: "${needle}" is not in the notebook`);
  const before = text.slice(0, offset + at).split("\n");
  return { line: before.length, column: before.at(-1)!.length + 1 };
}

describe("tristim typecheck: cells linked as in a run", () => {
  it("reports `const k: string = 5` in cell 2 at its notebook line and column, with a code frame", () => {
    const text = "# Two cells\n\n" + ts("const a = 1;") + "\nSome prose.\n\n" + ts("const k: string = 5;");
    const { file, found } = check(text);
    expect(found).toHaveLength(1);
    const d = found[0]!;
    expect(d.location).toEqual({ file, ...placeOf(text, "k: string", 0) });
    expect(d.cell).toBe(1);
    expect(d.message).toMatch(/Type 'number' is not assignable to type 'string'/);
    expect(d.codeFrame).toContain(`> ${d.location.line} | const k: string = 5;`);
  });

  it("keeps an earlier cell's binding with its type in a later cell", () => {
    const text =
      ts("const readings = [1.5, 2.5, 3.0];") +
      ts("const unrelated = true;") +
      ts("const total: number = readings.reduce((s, r) => s + r, 0);\nconst first: string = readings[0];");
    const { found } = check(text);
    expect(found.map((d) => d.message)).toEqual(["Type 'number' is not assignable to type 'string'."]);
    expect(found[0]!.location).toMatchObject(placeOf(text, "first: string"));
  });

  it("types a redeclared name from the cell that redeclares it on", () => {
    const text =
      ts("let mode = 1;\nfunction twice(x: number) { return 2 * x; }") +
      ts("const n: number = twice(mode);") +
      ts('const mode = "fast";') +
      ts("const m: number = mode;\nconst t: string = twice(3);");
    const { found } = check(text);
    expect(found.map((d) => [d.location.line, d.message])).toEqual([
      [placeOf(text, "m: number").line, "Type 'string' is not assignable to type 'number'."],
      [placeOf(text, "t: string").line, "Type 'number' is not assignable to type 'string'."],
    ]);
  });

  it("lets a cell assign an earlier cell's let, and not its const", () => {
    const text = ts("let count = 0;\nconst limit = 3;") + ts("count = count + 1;\nlimit = 4;");
    const { found } = check(text);
    expect(found).toHaveLength(1);
    expect(found[0]!.location.line).toBe(placeOf(text, "limit = 4").line);
    expect(found[0]!.message).toMatch(/limit/);
  });

  it("allows top-level await and types its value", () => {
    const text = ts("const v = await Promise.resolve(3);\nconst w: string = v;");
    const { found } = check(text);
    expect(found.map((d) => d.message)).toEqual(["Type 'number' is not assignable to type 'string'."]);
  });

  it("types inputs from the front-matter defaults", () => {
    const text =
      "---\ninputs:\n  tolerance: 2.0\n  batch: B-17\n  limits: [1, 2]\n---\n\n" +
      ts(
        "const t: number = inputs.tolerance;\nconst b: string = inputs.batch;\nconst l: number = inputs.limits[1]!;\n" +
          "const wrong: string = inputs.tolerance;\ninputs.missing;",
      );
    const { found } = check(text);
    expect(found.map((d) => [d.location.line, d.message])).toEqual([
      [placeOf(text, "wrong").line, "Type 'number' is not assignable to type 'string'."],
      [placeOf(text, "inputs.missing").line, expect.stringMatching(/Property 'missing' does not exist/)],
    ]);
  });

  it("knows the display functions and checks as globals, with their parameter types", () => {
    const text = ts(
      'check("white Y", 100, { target: 100, tolerance: 0.5 });\ncheckCondition("ok", true);\nshowTable([{ a: 1 }], { digits: 2 });\n' +
        'showTable("not rows");\ncheck("c", 1, { tolerence: 1 });',
    );
    const { found } = check(text);
    expect(found.map((d) => d.location.line)).toEqual([
      placeOf(text, 'showTable("not rows")').line,
      placeOf(text, "tolerence").line,
    ]);
    expect(found[0]!.message).toMatch(
      /'string' is not assignable to parameter of type 'readonly object\[\]'/,
    );
    expect(found[1]!.message).toMatch(/'tolerence' does not exist/);
  });

  it('types an import from "tristim", inputs included, and names a missing export', () => {
    const text =
      "---\ninputs:\n  tolerance: 2\n---\n" +
      ts(
        'import { deltaE2000, inputs as given, type Lab } from "tristim";\n' +
          "const p: Lab = { L: 50, a: 10, b: 10 };\nconst d: number = deltaE2000(p, p);\nconst g: number = given.tolerance;",
      ) +
      ts("const again: string = deltaE2000(p, p);") +
      ts('import { noSuchFunction } from "tristim";');
    const { found } = check(text);
    expect(found.map((d) => d.location.line)).toEqual([
      placeOf(text, "again").line,
      placeOf(text, "noSuchFunction").line,
    ]);
    expect(found[1]!.message).toMatch(/"tristim" has no exported member 'noSuchFunction'/);
  });

  it("resolves relative .ts helpers and npm packages from the notebook's folder", () => {
    const text = ts(
      'import { scale } from "./helper.ts";\nimport { meterReading } from "invented-meter";\n' +
        "const s: number = scale(meterReading());\nconst wrong: string = scale(2);",
    );
    const { found } = check(text, {
      "helper.ts": "export function scale(x: number): number {\n  return 2 * x;\n}\n",
      "node_modules/invented-meter/package.json": JSON.stringify({
        name: "invented-meter",
        version: "1.0.0",
        type: "module",
        types: "index.d.ts",
        main: "index.js",
      }),
      "node_modules/invented-meter/index.d.ts": "export declare function meterReading(): number;\n",
      "node_modules/invented-meter/index.js": "export function meterReading() { return 1; }\n",
    });
    expect(found.map((d) => [d.location.line, d.message])).toEqual([
      [placeOf(text, "wrong").line, "Type 'number' is not assignable to type 'string'."],
    ]);
  });

  it("reports an error inside a helper file at its own line", () => {
    const text = ts('import { half } from "./helper.ts";\nhalf(4);');
    const { file, found } = check(text, {
      "helper.ts": "export function half(x: number): string {\n  return x / 2;\n}\n",
    });
    expect(found).toHaveLength(1);
    expect(found[0]!.location).toEqual({
      file: path.join(path.dirname(file), "helper.ts"),
      line: 2,
      column: 3,
    });
    expect(found[0]!.cell).toBeUndefined();
  });

  it("leaves no-run cells out: what they declare does not exist in a run", () => {
    const text = ts("const listing = 1;", "no-run") + ts("const used = listing;");
    const { found } = check(text);
    expect(found.map((d) => d.message)).toEqual(["Cannot find name 'listing'."]);
  });

  it("reports a syntax error of a cell at its line", () => {
    const text = ts("const ok = 1;") + ts("const broken = (1 + ;");
    const { found } = check(text);
    expect(found).toHaveLength(1);
    expect(found[0]!.location.line).toBe(placeOf(text, "const broken").line);
  });

  it("finds no errors in the example notebooks", () => {
    const folder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../notebooks");
    const notebooks = fs.readdirSync(folder).filter((f) => f.endsWith(".md"));
    expect(notebooks).toHaveLength(4);
    for (const name of notebooks) {
      const found = session.check(readNotebook(path.join(folder, name)));
      expect(found.map((d) => `${name}:${d.location.line}: ${d.message}`)).toEqual([]);
    }
  });
});

describe("tristim typecheck on the command line", () => {
  function io() {
    const out: string[] = [];
    const err: string[] = [];
    return { io: { out: (t: string) => void out.push(t), err: (t: string) => void err.push(t) }, out, err };
  }

  it("prints notebook.md:line:column: message with a code frame and exits 1; 0 when clean; 2 without a file", async () => {
    const text = ts("const k: string = 5;");
    const file = notebookFile(text);
    const bad = io();
    expect(await main(["typecheck", file], bad.io)).toBe(1);
    const { line, column } = placeOf(text, "k: string");
    expect(bad.err.join("")).toContain(
      `${file}:${line}:${column}: Type 'number' is not assignable to type 'string'.`,
    );
    expect(bad.err.join("")).toContain(`> ${line} | const k: string = 5;`);

    const good = io();
    expect(await main(["typecheck", notebookFile(ts("const k: string = 'five';"))], good.io)).toBe(0);
    expect(good.out.join("")).toMatch(/no type errors in 1 cell/);

    expect(await main(["typecheck"], io().io)).toBe(2);
    expect(await main(["typecheck", "--no-such-option", file], io().io)).toBe(2);
  });

  it("run --typecheck does not run a notebook with type errors", async () => {
    const file = notebookFile(
      ts('import fs from "node:fs";\nfs.writeFileSync("ran.txt", "yes");\nconst k: string = 5;'),
    );
    const streams = io();
    expect(await main(["run", "--typecheck", "--quiet", file], streams.io)).toBe(1);
    expect(streams.err.join("")).toMatch(/not run: the type check found errors/);
    expect(fs.existsSync(path.join(path.dirname(file), "ran.txt"))).toBe(false);
    expect(fs.existsSync(file.replace(/\.md$/, ".html"))).toBe(false);
  });
});

describe("tristim watch with type errors", () => {
  let watcher: Watcher | undefined;
  afterAll(async () => watcher?.close());

  it("shows them in a banner on the served page and runs the cells anyway", async () => {
    const file = notebookFile(ts('console.log("ran " + 2);\nconst m: Map<string, number> = 5;'));
    watcher = await startWatch(file, {
      port: 0,
      inputs: {},
      keepGoing: false,
      linkAssets: false,
      quiet: true,
      typecheck: true,
      debounceMs: 30,
    });
    const w = watcher;
    await new Promise<RenderEvent>((resolve) => w.events.once("render", resolve));
    const body = await new Promise<string>((resolve, reject) => {
      http
        .get(
          { host: "127.0.0.1", port: w.port, path: "/", headers: { host: `127.0.0.1:${w.port}` } },
          (res) => {
            let text = "";
            res.setEncoding("utf8");
            res.on("data", (c) => (text += c));
            res.on("end", () => resolve(text));
          },
        )
        .on("error", reject);
    });
    expect(body).toContain('id="tristim-type-errors"');
    expect(body).toContain("Map&lt;string, number&gt;");
    expect(body).toContain("ran 2");
  });

  it("escapes every text in the banner and shows nothing without errors", () => {
    const html = typeErrorBanner(
      [
        {
          location: { file: "/n/nb.md", line: 3, column: 1 },
          message: "<script>x</script>",
          codeFrame: "> 3 | a < b",
        },
      ],
      "/n",
    );
    expect(html).not.toContain("<script>");
    expect(html).toContain("&lt;script&gt;");
    expect(html).toContain("nb.md:3:1");
    expect(typeErrorBanner([], "/n")).toBe("");
  });
});
