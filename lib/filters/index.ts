/** Barrel for lib/filters (re-exports only): light through filters and plates. */
export * from "./fresnel.ts";
export * from "./plate.ts";
export * from "./optical-density.ts";
export * from "./beer-lambert.ts";
export * from "./filter-stack.ts";
export * from "./parametric-filters.ts";
export * from "./sunglass-category.ts";
export * from "./transmitted-light.ts";
