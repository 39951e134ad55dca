/** Barrel for lib/files (re-exports only): reading and writing measurement files. */
export * from "./data-file-error.ts";
export * from "./value-scale.ts";
export * from "./spectral-csv-read.ts";
export * from "./spectral-csv-write.ts";
export * from "./cgats-read.ts";
export * from "./cgats-fields.ts";
export * from "./cgats-write.ts";
