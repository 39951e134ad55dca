/**
 * What a cell gets from `import { ... } from "tristim"`: the standard library, the display functions and the run's
 * inputs, from the one instance loaded in the cell process. The runner bundles this file once per run; every cell
 * and every file a cell imports resolves "tristim" to that bundle, so state kept by the library (the method log)
 * is shared by all cells. The same names are also set as globals before the first cell.
 */
export * from "../lib/index.ts";
export { show, showTable, showFigure, showSwatches, showMarkdown, showHtml, showCaution } from "./display.ts";
export type { TableColumn, TableOptions, FigureInput, TrustOptions } from "./display.ts";
export { check, checkCondition, acceptanceDecision } from "./checks.ts";
export type { CheckOptions, UncertainValue } from "./checks.ts";
export type { SwatchRecord, PlotSpec } from "./records.ts";
export { inputs } from "./inputs.ts";
export type { InputValue } from "./inputs.ts";
