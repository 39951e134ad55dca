/**
 * Barrel for lib/files (re-exports only): reading and writing measurement files. The readers' building blocks
 * (line splitting, number scanning, preamble, encoding and table-start detection, argument checks, the unchecked
 * cores the public functions call after checking their arguments) stay internal: only their types are re-exported,
 * where the public readers' options and results name them.
 */
export { DataFileError, withFileName, parseDataFile } from "./data-file-error.ts";
export { decideValueScale, PERCENT_THRESHOLD, type ScaleDecision, type ValueScale } from "./value-scale.ts";
export * from "./spectral-csv-read.ts";
export * from "./spectral-csv-write.ts";
export {
  isNumericCgatsField,
  parseCgats,
  readCgats,
  type CgatsFile,
  type CgatsTable,
  type CgatsValue,
} from "./cgats-read.ts";
export * from "./cgats-fields.ts";
export * from "./cgats-write.ts";
export * from "./colour-readings-read.ts";
export type { FieldSeparator } from "./delimited-text.ts";
export type { TextEncoding } from "./text-encoding.ts";
