/**
 * The declaration of what every cell sees without importing it: the values and types that `import ... from
 * "tristim"` gives (standard library, display functions, checks), and `inputs` typed from the front matter. The type
 * check and `tristim editor-types` write it with this one function.
 */
import path from "node:path";
import type { Program } from "typescript";
import ts from "./typescript.ts";
import { PACKAGE_ROOT } from "../shared/package-root.ts";

/** The module a cell's `import ... from "tristim"` gives (cells/tristim-entry.ts). */
export const CELL_ENTRY = path.join(PACKAGE_ROOT, "cells", "tristim-entry.ts");

/** The names exported by the cell entry (or its declaration `entry`), read with the checker of a program that holds it. */
export function entryExportNames(program: Program, entry = CELL_ENTRY): string[] {
  const checker = program.getTypeChecker();
  const source = program.getSourceFile(entry);
  const symbol = source && checker.getSymbolAtLocation(source);
  if (!symbol) throw new Error(`internal: the type checker did not load ${entry}`);
  return checker
    .getExportsOfModule(symbol)
    .map((s) => s.name)
    .filter((n) => n !== "default")
    .sort();
}

/**
 * Text of a declaration file that makes the entry's exports global (every meaning: value, type, namespace) and
 * `inputs` of type `inputsType`; `moduleSpecifier` is how the file imports the entry.
 */
export function cellGlobalsDeclaration(
  names: readonly string[],
  moduleSpecifier: string,
  inputsType: string,
): string {
  const lines = names.filter((n) => n !== "inputs").map((n) => `  export import ${n} = __tristim.${n};`);
  return [
    `import * as __tristim from ${JSON.stringify(moduleSpecifier)};`,
    "declare global {",
    ...lines,
    `  /** The notebook's inputs: front-matter defaults, overridden by --input name=value. */`,
    `  const inputs: ${inputsType};`,
    "}",
    "export {};",
    "",
  ].join("\n");
}
