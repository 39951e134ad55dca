/** Barrel for lib/rendering (re-exports only). */
export {};
