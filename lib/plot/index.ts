/** Barrel for lib/plot (re-exports only). */
export * from "./figure.ts";
export * from "./style.ts";
export * from "./chromaticity-diagram.ts";
export type { LabelledChromaticity, GamutChoice, CustomGamut, ToleranceRegion, ChromaticityArrow } from "./chromaticity-overlays.ts";
export type { ChromaticityInput } from "./chromaticity-input.ts";
export type { DisplayGamut } from "./display-rgb.ts";
export * from "./spectrum-plot.ts";
export * from "./lab-plots.ts";
export * from "./swatch.ts";
