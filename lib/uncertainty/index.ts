/** Measurement uncertainty: input models, Monte Carlo propagation (JCGM 101), the law of propagation (JCGM 100). */
export * from "./input-models.ts";
export * from "./uncertainty-result.ts";
export * from "./first-order.ts";
export * from "./monte-carlo.ts";
export * from "./uncertainty-text.ts";
export type { MeasurementModel, ModelValues } from "./model-evaluation.ts";
