/** Lets CommonJS packages call require() from an ESM bundle (the first line of every bundle esbuild writes for us). */
export const BANNER =
  'import { createRequire as __tristimRequire } from "node:module"; const require = __tristimRequire(import.meta.url);';
