/** Barrel for lib/rendering (re-exports only): colour rendering and metamerism. */
export * from "./colour-rendering-index.ts";
export * from "./metamerism-index.ts";
