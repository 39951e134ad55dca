/** Barrel for lib/mixing (re-exports only). */
export {};
