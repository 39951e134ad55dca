/** Barrel for lib/filters (re-exports only). */
export {};
