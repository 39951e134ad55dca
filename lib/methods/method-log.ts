/**
 * The run's record of colorimetric conditions (observer, illuminant, wavelength range and interval, interpolation,
 * normalisation, CCT method, ΔE formula, adaptation transform, ...). Library functions note what they used; the
 * runner reads the log after the last cell and writes the report's Methods section from it.
 * One instance per run: the worker loads the library once and every cell shares it.
 */

/** One condition used during the run, e.g. { topic: "observer", statement: "CIE 1931 2° standard observer" }. */
export interface MethodNote {
  readonly topic: MethodTopic;
  readonly statement: string;
}

/** The topics a Methods section is organised by, in the order a reviewer reads them. */
export const METHOD_TOPICS = [
  "observer",
  "illuminant",
  "wavelength range",
  "interpolation",
  "extrapolation",
  "integration",
  "normalisation",
  "colour space",
  "colour temperature",
  "colour difference",
  "chromatic adaptation",
  "photometry",
  "rgb encoding",
  "gamut",
  "optics",
  "mixing",
  "halftone",
  "colour rendering",
  "data files",
  "other",
] as const;
export type MethodTopic = (typeof METHOD_TOPICS)[number];

// Notes in first-use order, and per topic the statements already noted. Library functions call noteMethod in hot
// loops (ΔE for a million pairs), so a repeated note must cost no more than two hash lookups and allocate nothing.
const order: MethodNote[] = [];
const seen = new Map<string, Set<string>>();

/** Notes that a computation used a condition; repeated notes are kept once, in first-use order. */
export function noteMethod(topic: MethodTopic, statement: string): void {
  let statements = seen.get(topic);
  if (statements === undefined) {
    statements = new Set();
    seen.set(topic, statements);
  }
  if (statements.has(statement)) return;
  statements.add(statement);
  order.push({ topic, statement });
}

/** Every condition noted since the last reset, as plain serializable records. */
export function methodsUsed(): MethodNote[] {
  return order.map((n) => ({ ...n }));
}

/** Forgets every note (the runner calls this at the start of a run). */
export function resetMethodLog(): void {
  order.length = 0;
  seen.clear();
}
