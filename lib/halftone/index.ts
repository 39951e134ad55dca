/** Barrel for lib/halftone (re-exports only). */
export {};
