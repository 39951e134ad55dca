/**
 * esbuild, loaded on first use: `run` needs it only to build a bundle that is not cached yet and to compile a
 * cell that is not in the compile cache, and loading it (about 20 ms) sat on the path to the cell process's start.
 */
import { createRequire } from "node:module";
import type * as Esbuild from "esbuild";

const require = createRequire(import.meta.url);
let loaded: typeof Esbuild | undefined;

/** The esbuild module. */
export function esbuild(): typeof Esbuild {
  return (loaded ??= require("esbuild") as typeof Esbuild);
}

/** esbuild's version, from its package.json (without loading esbuild). */
export function esbuildVersion(): string {
  return (require("esbuild/package.json") as { version: string }).version;
}
