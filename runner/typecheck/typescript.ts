/**
 * The TypeScript compiler, loaded with require when a type-check module is first imported. The CLI imports those
 * modules only for the commands that check, so `run` and `watch` without checking do not pay for loading it (the
 * bundled CLI keeps a static import of an npm package at the top of the bundle, a require here it does not).
 */
import { createRequire } from "node:module";
import type TypeScript from "typescript";

const ts = createRequire(import.meta.url)("typescript") as typeof TypeScript;
export default ts;
