/** Barrel for lib/files (re-exports only): reading and writing measurement files. */
export * from "./data-file-error.ts";
export * from "./value-scale.ts";
export * from "./spectral-csv-read.ts";
export * from "./spectral-csv-write.ts";
export * from "./cgats-read.ts";
export * from "./cgats-fields.ts";
export * from "./cgats-write.ts";
export * from "./text-encoding.ts";
export * from "./delimited-text.ts";
export * from "./number-scan.ts";
export * from "./option-names.ts";
export * from "./preamble-metadata.ts";
export * from "./wavelength-text.ts";
export * from "./table-start.ts";
export * from "./reading-fields.ts";
export * from "./colour-readings-read.ts";
