// Stage 2 (compile), the rewrite alone: JavaScript in → hoisted code, shared names, imports and anchors out.
// The rewritten code is also run with a hand-made runtime, so the test checks what the code does, not its spelling.
import { describe, expect, it } from "vitest";
import {
  CellRewriteError,
  hoistCell,
  RUNTIME_PARAMETER,
  toInputOffset,
  type HoistedCell,
} from "../../../runner/compile/hoist-cell.ts";

/** Runs hoisted code with a runtime that records links and declarations in `globals`. */
async function runHoisted(
  hoisted: HoistedCell,
  scope: Record<string, unknown> = {},
  imported: Record<string, unknown>[] = [],
): Promise<{ value: unknown; globals: Map<string, () => unknown>; declared: string[] }> {
  const globals = new Map<string, () => unknown>();
  const declared: string[] = [];
  const runtime = {
    declare: (names: readonly string[]) => void declared.push(...names),
    link: (bindings: readonly (readonly [string, () => unknown, (v: unknown) => void])[]) => {
      for (const [name, get] of bindings) globals.set(name, get);
    },
    imported: (i: number) => imported[i]!,
    lib: { default: "the library" },
    bindImport: (name: string, namespace: Record<string, unknown>, exported: string) =>
      void globals.set(name, () => namespace[exported]),
  };
  const names = Object.keys(scope);
  const cell = new Function(...names, `return ${hoisted.code};`)(...names.map((n) => scope[n]));
  const value = await cell(runtime);
  return { value, globals, declared };
}

/** Every anchor [out, in, length] must cover identical text in the output and the input. */
function expectAnchorsExact(js: string, hoisted: HoistedCell): void {
  expect(hoisted.anchors.length).toBeGreaterThan(0);
  for (const [out, input, length] of hoisted.anchors) {
    expect(hoisted.code.slice(out, out + length)).toBe(js.slice(input, input + length));
  }
}

/** Each line of the cell keeps its number: the closing `})` only adds a line after the last one. */
function expectLinesKept(js: string, hoisted: HoistedCell): void {
  const input = js.split("\n");
  const output = hoisted.code.split("\n");
  expect(output).toHaveLength(input.length + 1);
  expect(output.at(-1)).toBe("})");
  input.forEach((line, i) => {
    // Imports become namespace reads on the same line; other statements stay as written.
    if (line.trim() && !line.startsWith("import ")) expect(output[i]).toContain(line.replace(/;$/, ""));
  });
}

describe("hoistCell", () => {
  it("shares top-level let/const bindings, returns the final expression and keeps the line count", async () => {
    const js = "const x = await f();\nlet y = 2, z;\nx + y;\n";
    const hoisted = hoistCell(js);
    expect(hoisted.code.startsWith(`(async function (${RUNTIME_PARAMETER}) {`)).toBe(true);
    expect(hoisted.sharedNames).toEqual(["x", "y", "z"]);
    expect(hoisted.imports).toEqual([]);
    expectLinesKept(js, hoisted);
    expectAnchorsExact(js, hoisted);
    const { value, globals } = await runHoisted(hoisted, { f: async () => 40 });
    expect(value).toBe(42);
    expect(globals.get("x")?.()).toBe(40);
    expect(globals.get("z")?.()).toBeUndefined();
  });

  it("shares every name of a destructuring pattern", async () => {
    const js = "const { p, q: [r], ...rest } = o;\n";
    const hoisted = hoistCell(js);
    expect(hoisted.sharedNames).toEqual(["p", "r", "rest"]);
    const { globals, value } = await runHoisted(hoisted, { o: { p: 1, q: [2], s: 3 } });
    expect(value).toBeUndefined();
    expect(globals.get("r")?.()).toBe(2);
    expect(globals.get("rest")?.()).toEqual({ s: 3 });
  });

  it("turns imports into reads from a namespace: 'tristim' from the library, others by their import number", async () => {
    const js =
      'import { a } from "./m.ts";\nimport t from "tristim";\nfunction g() { return a; }\nclass K {}\n';
    const hoisted = hoistCell(js);
    expect(hoisted.imports).toEqual([{ specifier: "./m.ts", start: 0, end: 27 }]);
    expect(hoisted.sharedNames).toEqual(["a", "t", "g", "K"]);
    expectLinesKept(js, hoisted);
    expectAnchorsExact(js, hoisted);
    const { globals, declared } = await runHoisted(hoisted, {}, [{ a: "from m" }]);
    expect(declared).toEqual(["a", "t"]);
    expect(globals.get("a")?.()).toBe("from m");
    expect(globals.get("t")?.()).toBe("the library");
    expect(typeof globals.get("g")?.()).toBe("function");
  });

  it("does not return a final check(...) or checkCondition(...) call as the cell's value", async () => {
    for (const call of ['check("x", 1)', 'checkCondition("y", true)']) {
      const hoisted = hoistCell(`${call};\n`);
      const { value } = await runHoisted(hoisted, { check: () => true, checkCondition: () => true });
      expect(value).toBeUndefined();
    }
    const { value } = await runHoisted(hoistCell("other();\n"), { other: () => "shown" });
    expect(value).toBe("shown");
  });

  it("refuses an export that is not a declaration, naming the place", () => {
    const js = "const a = 1;\nexport { a };\n";
    try {
      hoistCell(js);
      expect.unreachable("hoistCell accepted `export { a }`");
    } catch (e) {
      expect(e).toBeInstanceOf(CellRewriteError);
      expect((e as CellRewriteError).message).toMatch(/cannot export/);
      expect((e as CellRewriteError).offset).toBe(js.indexOf("export"));
    }
  });

  it("maps every offset of unchanged text back to the same character of the input", () => {
    const js = "const x = await f();\nlet y = 2;\nx + y;\n";
    const hoisted = hoistCell(js);
    for (const [out, input, length] of hoisted.anchors) {
      for (let k = 0; k < length; k++) expect(toInputOffset(hoisted.anchors, out + k)).toBe(input + k);
    }
    // Inserted text (the function head before the first anchor) maps to the start of the input.
    expect(toInputOffset(hoisted.anchors, 0)).toBe(0);
  });
});
