/**
 * Turns the JavaScript of one cell (types already removed by esbuild) into a function expression that the cell
 * process can run after the cells before it:
 *
 *   - top-level `const` / `let` / `var` / `function` / `class` stay as they are, local to the cell's function (so
 *     code in the cell runs as fast as in a plain module), and each is linked to a global accessor of the cell
 *     process that reads and writes that binding, so later cells see it; a later cell that declares the same name
 *     links the global to its own binding (closures of earlier cells keep theirs, as in a REPL);
 *   - `import` declarations become reads from namespaces the runner bundled beforehand ("tristim" reads the one
 *     loaded library);
 *   - the body runs inside an async function, so top-level `await` works;
 *   - the value of a final expression statement is returned, so the report can show it (except a call of `check` or
 *     `checkCondition`, whose true/false the check record already shows);
 *
 * Every edit keeps the line count, and the returned anchors map any offset in the result back to the input, so error
 * positions can be traced to the notebook through esbuild's source map.
 */
import { parse, type Node } from "acorn";

/** The name of the one parameter of a compiled cell; its fields are described by CellRuntime (cells/protocol.ts). */
export const RUNTIME_PARAMETER = "__tristimCell";

/** An import of the cell, other than "tristim", bundled by the runner before the cell runs. */
export interface CellImport {
  readonly specifier: string;
  /** Offsets of the import statement in the input JavaScript. */
  readonly start: number;
  readonly end: number;
}

/** The rewritten cell. */
export interface HoistedCell {
  /** Source of `(async function (__tristimCell) { ... })`. */
  readonly code: string;
  /** Names the cell shares with later cells. */
  readonly sharedNames: readonly string[];
  readonly imports: readonly CellImport[];
  /** Triples [outputStart, inputStart, length] of unchanged spans, sorted by outputStart. */
  readonly anchors: readonly (readonly [number, number, number])[];
}

/** A construct a cell may not use, at an offset of the input JavaScript. */
export class CellRewriteError extends Error {
  override readonly name = "CellRewriteError";
  constructor(
    message: string,
    readonly offset: number,
  ) {
    super(message);
  }
}

interface Edit {
  readonly start: number;
  readonly end: number;
  readonly text: string;
}

type AnyNode = Node & Record<string, unknown>;

/** Rewrites a cell's JavaScript (ES module syntax) as described above. */
export function hoistCell(js: string): HoistedCell {
  const program = parse(js, {
    ecmaVersion: "latest",
    sourceType: "module",
    allowAwaitOutsideFunction: true,
    allowHashBang: true,
  }) as unknown as { body: AnyNode[] };
  const edits: Edit[] = [];
  const shared = new Set<string>();
  const linked = new Set<string>();
  const constants = new Set<string>();
  const imports: CellImport[] = [];
  const R = RUNTIME_PARAMETER;
  const body = program.body;

  body.forEach((statement, i) => {
    let node = statement;
    if (node.type === "ExportNamedDeclaration" && node.declaration) {
      // `export const x = ...` in a cell: the export keyword is dropped, the declaration is shared as usual.
      edits.push({ start: node.start, end: (node.declaration as AnyNode).start, text: "" });
      node = node.declaration as AnyNode;
    } else if (node.type.startsWith("Export")) {
      throw new CellRewriteError(
        "a cell cannot export; its top-level declarations are shared with later cells already",
        node.start,
      );
    }
    switch (node.type) {
      case "ImportDeclaration":
        edits.push({ start: node.start, end: node.end, text: rewriteImport(node, imports, js) });
        for (const s of node.specifiers as AnyNode[]) shared.add((s.local as AnyNode).name as string);
        break;
      case "VariableDeclaration":
        for (const d of node.declarations as AnyNode[])
          for (const name of patternNames(d.id as AnyNode)) {
            linked.add(name);
            if (node.kind === "const") constants.add(name);
            else constants.delete(name);
          }
        break;
      case "FunctionDeclaration":
      case "ClassDeclaration":
        linked.add((node.id as AnyNode).name as string);
        constants.delete((node.id as AnyNode).name as string);
        break;
      case "ExpressionStatement":
        if (i === body.length - 1 && !isCheckCall(node.expression as AnyNode)) {
          // Wrap the whole statement, not the expression node: acorn leaves enclosing parentheses outside the
          // node, so `({ a: 1 })` must become `return (({ a: 1 }))`, not `(return ({ a: 1 }))`.
          const end = js[node.end - 1] === ";" ? node.end - 1 : node.end;
          edits.push({ start: node.start, end: node.start, text: "return (" });
          edits.push({ start: end, end, text: ")" });
        }
        break;
    }
  });

  visit(program as unknown as AnyNode, (n) => {
    if (n.type === "ImportExpression")
      edits.push({ start: n.start, end: n.start + "import".length, text: `${R}.dynamicImport` });
    if (n.type === "MetaProperty" && (n.meta as AnyNode).name === "import")
      edits.push({ start: n.start, end: n.end, text: `${R}.meta` });
  });

  for (const name of linked) shared.delete(name);
  // A `const` is marked (1): once the cell has finished, its value can never change, so the cell process turns its
  // global into a plain read-only value, which later cells read at the speed of a module-level constant.
  const links = [...linked].map(
    (n) => `[${JSON.stringify(n)}, () => ${n}, (v) => { ${n} = v; }${constants.has(n) ? ", 1" : ""}]`,
  );
  const prologue =
    `(async function (${R}) { "use strict"; ` +
    (shared.size ? `${R}.declare(${JSON.stringify([...shared])}); ` : "") +
    (links.length ? `${R}.link([${links.join(", ")}]); ` : "");
  const names = [...shared, ...linked];
  const { text, anchors } = applyEdits(js, edits, prologue.length);
  return { code: `${prologue}${text}\n})`, sharedNames: names, imports, anchors };
}

/** `import ... from "x"` → assignments from the namespace; keeps the statement's line count. */
function rewriteImport(node: AnyNode, imports: CellImport[], js: string): string {
  const R = RUNTIME_PARAMETER;
  const specifier = (node.source as AnyNode).value as string;
  let namespace: string;
  if (specifier === "tristim") namespace = `${R}.lib`;
  else {
    namespace = `${R}.imported(${imports.length})`;
    imports.push({ specifier, start: node.start, end: node.end });
  }
  const from = JSON.stringify(specifier);
  const parts = (node.specifiers as AnyNode[]).map((s) => {
    const local = (s.local as AnyNode).name as string;
    if (s.type === "ImportNamespaceSpecifier") return `${local} = ${namespace};`;
    const imported = s.type === "ImportDefaultSpecifier" ? "default" : importedName(s.imported as AnyNode);
    return `${R}.bindImport(${JSON.stringify(local)}, ${namespace}, ${JSON.stringify(imported)}, ${from});`;
  });
  if (parts.length === 0) parts.push(`${namespace};`);
  const newlines = js.slice(node.start, node.end).split("\n").length - 1;
  return `;${parts.join(" ")}${"\n".repeat(newlines)}`;
}

function importedName(node: AnyNode): string {
  return node.type === "Identifier" ? (node.name as string) : String(node.value);
}

/** Every name bound by a declaration pattern (`a`, `{ b, c: d }`, `[e, ...f]`, `{ g = 1 }`). */
export function patternNames(pattern: AnyNode): string[] {
  switch (pattern.type) {
    case "Identifier":
      return [pattern.name as string];
    case "ObjectPattern":
      return (pattern.properties as AnyNode[]).flatMap((p) =>
        p.type === "RestElement" ? patternNames(p.argument as AnyNode) : patternNames(p.value as AnyNode),
      );
    case "ArrayPattern":
      return (pattern.elements as (AnyNode | null)[]).flatMap((e) => (e ? patternNames(e) : []));
    case "RestElement":
      return patternNames(pattern.argument as AnyNode);
    case "AssignmentPattern":
      return patternNames(pattern.left as AnyNode);
    default:
      return [];
  }
}

function visit(node: AnyNode, fn: (n: AnyNode) => void): void {
  fn(node);
  for (const key of Object.keys(node)) {
    if (key === "loc" || key === "range") continue;
    const value = node[key];
    if (Array.isArray(value)) {
      for (const v of value)
        if (v && typeof v === "object" && typeof (v as AnyNode).type === "string") visit(v as AnyNode, fn);
    } else if (value && typeof value === "object" && typeof (value as AnyNode).type === "string") {
      visit(value as AnyNode, fn);
    }
  }
}

/** The display functions that return a value the report shows already (acceptance checks return pass/fail). */
const SHOWN_ALREADY = new Set(["check", "checkCondition"]);

/** `check(...)` or `checkCondition(...)` as a plain call (an `await`ed one too). */
function isCheckCall(expression: AnyNode): boolean {
  const call = expression.type === "AwaitExpression" ? (expression.argument as AnyNode) : expression;
  if (call.type !== "CallExpression") return false;
  const callee = call.callee as AnyNode;
  return callee.type === "Identifier" && SHOWN_ALREADY.has(callee.name as string);
}

/** Applies non-overlapping edits; returns the text and the anchors of unchanged spans (offsets shifted by `base`). */
function applyEdits(
  js: string,
  edits: Edit[],
  base: number,
): { text: string; anchors: [number, number, number][] } {
  const sorted = [...edits].sort((a, b) => a.start - b.start || a.end - a.start - (b.end - b.start));
  const anchors: [number, number, number][] = [];
  let out = "";
  let at = 0;
  for (const edit of sorted) {
    if (edit.start < at) throw new Error(`internal: overlapping cell edits at ${edit.start}`);
    if (edit.start > at) anchors.push([base + out.length, at, edit.start - at]);
    out += js.slice(at, edit.start) + edit.text;
    at = edit.end;
  }
  if (at < js.length) anchors.push([base + out.length, at, js.length - at]);
  out += js.slice(at);
  return { text: out, anchors };
}

/** Maps an offset of the hoisted code back to the input JavaScript (inserted text maps to where it was inserted). */
export function toInputOffset(anchors: HoistedCell["anchors"], offset: number): number {
  let best = 0;
  for (const [outStart, inStart, length] of anchors) {
    if (offset < outStart) break;
    best = offset < outStart + length ? inStart + (offset - outStart) : inStart + length;
  }
  return best;
}
