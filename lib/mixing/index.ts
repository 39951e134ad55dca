/** Barrel for lib/mixing (re-exports only): additive mixing of lights, LED models, and subtractive mixing of dyes and paints. */
export * from "./mix-lights.ts";
export { nonNegativeLeastSquares } from "./nnls.ts";
export * from "./drive-levels.ts";
export * from "./spectral-peak.ts";
export * from "./led-spectrum.ts";
export * from "./transparent-layers.ts";
export * from "./kubelka-munk.ts";
export * from "./saunderson.ts";
export * from "./paint-mixing.ts";
export * from "./demo-paints.ts";
