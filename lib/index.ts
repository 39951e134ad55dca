/**
 * The tristim standard library: what `import { ... } from "tristim"` gives a notebook cell, and what cells also see
 * as globals. Re-exports only; each concept lives in its own file.
 */
export * from "./methods/method-log.ts";
