/**
 * The cells of a notebook as the type checker sees them: one virtual module per cell, in the notebook's folder (so
 * relative imports resolve as they do in a run). Each module starts with a one-line prelude that brings in, from the
 * cell that last declared it before this one, every top-level name of earlier cells that this cell does not declare
 * itself, and ends with an export of all of its own top-level names. A redeclared name is thus typed from the cell
 * that redeclares it on, as in a run (runner/compile/hoist-cell.ts), and top-level `await` is allowed (modules).
 */
import path from "node:path";
import type { SourceFile, BindingName } from "typescript";
import ts from "./typescript.ts";
import type { CellSource, NotebookDocument } from "../parse/notebook.ts";

/** How an earlier cell's name is brought into a later cell. */
type NameKind =
  /** `declare const x: typeof import("./cell").x` */
  | "const"
  /** `declare let x: ...` (let, var, function: a later cell may assign it) */
  | "let"
  /** `import { x } from "./cell"` (imports, classes, enums, interfaces, types, namespaces: type meanings too) */
  | "alias";

/** One cell's virtual module. */
export interface CellFile {
  readonly cell: CellSource;
  readonly fileName: string;
  readonly text: string;
}

/** File name of cell `index`'s module (0-based index). */
export function cellFileName(notebookPath: string, index: number): string {
  return path.join(path.dirname(notebookPath), `__tristim_cell_${index + 1}.ts`);
}

/** True for the file name of a cell module. */
export function isCellFileName(fileName: string): boolean {
  return /(^|[/\\])__tristim_cell_\d+\.ts$/.test(fileName);
}

/** The virtual modules of the cells that run (`no-run` cells are listings: they declare nothing). */
export function cellFiles(document: NotebookDocument): CellFile[] {
  /** For each name, the cell that declared it last so far and how. */
  const visible = new Map<string, { index: number; kind: NameKind }>();
  const files: CellFile[] = [];
  for (const cell of document.cells) {
    if (cell.options.noRun) continue;
    const declared = topLevelNames(cell.code);
    const fromCells = new Map<number, string[]>();
    const declarations: string[] = [];
    for (const [name, { index, kind }] of visible) {
      if (declared.has(name)) continue;
      const from = JSON.stringify(`./__tristim_cell_${index + 1}`);
      if (kind === "alias") fromCells.set(index, [...(fromCells.get(index) ?? []), name]);
      else declarations.push(`declare ${kind} ${name}: typeof import(${from}).${name};`);
    }
    const imports = [...fromCells].map(
      ([index, names]) => `import { ${names.join(", ")} } from "./__tristim_cell_${index + 1}";`,
    );
    const exported = [...declared].filter(([, d]) => !d.exported).map(([name]) => name);
    const prelude = [...imports, ...declarations].join(" ");
    const text = `${prelude}\n${cell.code}\n;export { ${exported.join(", ")} };\n`;
    files.push({ cell, fileName: cellFileName(document.path, cell.index), text });
    for (const [name, d] of declared) visible.set(name, { index: cell.index, kind: d.kind });
  }
  return files;
}

/** Notebook line and column (1-based) of an offset in a cell module; the prelude maps to the fence line. */
export function notebookPositionOf(file: CellFile, sourceFile: SourceFile, offset: number) {
  const { line, character } = sourceFile.getLineAndCharacterOfPosition(offset);
  const { cell } = file;
  if (line === 0) return { line: cell.fenceLine, column: 1 };
  const codeLine = Math.min(line, cell.lastLine - cell.firstLine + 1);
  const column = codeLine === line ? cell.columnOffset + character + 1 : 1;
  return { line: cell.firstLine + codeLine - 1, column };
}

/** The top-level names a cell declares, how later cells should see them, and whether the cell exports them itself. */
function topLevelNames(code: string): Map<string, { kind: NameKind; exported: boolean }> {
  const source = ts.createSourceFile("cell.ts", code, ts.ScriptTarget.ES2022, false, ts.ScriptKind.TS);
  const names = new Map<string, { kind: NameKind; exported: boolean }>();
  const add = (name: string, kind: NameKind, exported: boolean) => {
    const before = names.get(name);
    const merged: NameKind =
      before?.kind === "alias" || kind === "alias" ? "alias" : before?.kind === "let" ? "let" : kind;
    names.set(name, { kind: merged, exported: exported || before?.exported === true });
  };
  for (const statement of source.statements) {
    const exported =
      ts.canHaveModifiers(statement) &&
      (ts.getModifiers(statement) ?? []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);
    if (ts.isVariableStatement(statement)) {
      const kind = statement.declarationList.flags & ts.NodeFlags.Const ? "const" : "let";
      for (const d of statement.declarationList.declarations)
        for (const name of bindingNames(d.name)) add(name, kind, exported);
    } else if (ts.isFunctionDeclaration(statement)) {
      if (statement.name) add(statement.name.text, "let", exported);
    } else if (
      ts.isClassDeclaration(statement) ||
      ts.isInterfaceDeclaration(statement) ||
      ts.isTypeAliasDeclaration(statement) ||
      ts.isEnumDeclaration(statement)
    ) {
      if (statement.name) add(statement.name.text, "alias", exported);
    } else if (ts.isModuleDeclaration(statement) && ts.isIdentifier(statement.name)) {
      if (!(statement.flags & ts.NodeFlags.GlobalAugmentation)) add(statement.name.text, "alias", exported);
    } else if (ts.isImportDeclaration(statement)) {
      const clause = statement.importClause;
      if (clause?.name) add(clause.name.text, "alias", false);
      const bindings = clause?.namedBindings;
      if (bindings && ts.isNamespaceImport(bindings)) add(bindings.name.text, "alias", false);
      if (bindings && ts.isNamedImports(bindings))
        for (const element of bindings.elements) add(element.name.text, "alias", false);
    } else if (ts.isImportEqualsDeclaration(statement)) {
      add(statement.name.text, "alias", exported);
    }
  }
  return names;
}

function bindingNames(name: BindingName): string[] {
  if (ts.isIdentifier(name)) return [name.text];
  return name.elements.flatMap((e) => (ts.isOmittedExpression(e) ? [] : bindingNames(e.name)));
}
