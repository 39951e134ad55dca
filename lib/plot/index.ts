/** Barrel for lib/plot (re-exports only). */
export {};
