/** Barrel for lib/halftone (re-exports only): halftone print models. */
export * from "./murray-davies.ts";
export * from "./yule-nielsen.ts";
export * from "./neugebauer.ts";
