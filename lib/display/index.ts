/** Barrel for lib/display (re-exports only): the calculations of display measurement and QA. */
export * from "./delta-uv.ts";
export * from "./black-and-contrast.ts";
export * from "./eotf-fit.ts";
export * from "./greyscale-tracking.ts";
export * from "./pq-tracking.ts";
export * from "./uniformity.ts";
export * from "./primaries-check.ts";
export type { ColourReading as DisplayReading } from "./colour-input.ts";
