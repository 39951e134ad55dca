/** Barrel for lib/files (re-exports only). */
export {};
