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
// How many withoutMethodNotes calls are running: while above zero, noteMethod records nothing.
let silentDepth = 0;
// The last two notes recorded or found recorded: a loop that notes the same one or two conditions on every call
// (sRGB → XYZ → CIELAB notes the RGB space, then CIELAB) costs a few compares.
let lastTopic: string | undefined;
let lastStatement: string | undefined;
let previousTopic: string | undefined;
let previousStatement: string | undefined;

/**
 * Notes that a computation used a condition; repeated notes are kept once, in first-use order. Inside
 * withoutMethodNotes nothing is recorded.
 */
export function noteMethod(topic: MethodTopic, statement: string): void {
  if (silentDepth > 0 || (statement === lastStatement && topic === lastTopic)) return;
  if (statement === previousStatement && topic === previousTopic) {
    previousTopic = lastTopic;
    previousStatement = lastStatement;
    lastTopic = topic;
    lastStatement = statement;
    return;
  }
  previousTopic = lastTopic;
  previousStatement = lastStatement;
  lastTopic = topic;
  lastStatement = statement;
  let statements = seen.get(topic);
  if (statements === undefined) {
    statements = new Set();
    seen.set(topic, statements);
  }
  if (statements.has(statement)) return;
  statements.add(statement);
  order.push({ topic, statement });
}

/** False while a withoutMethodNotes call is running (a caller that remembers "already noted" must not remember then). */
export function methodNotesActive(): boolean {
  return silentDepth === 0;
}

/**
 * Runs `compute` without recording any method note, and returns its result. For decorative computations the report
 * did not ask for (a figure's hover readouts, reference curves, colour fills, display conversions of swatches), so the
 * Methods section lists only what the notebook computed. `compute` must be synchronous; a nested call is fine.
 */
export function withoutMethodNotes<T>(compute: () => T): T {
  if (typeof compute !== "function")
    throw new Error(`withoutMethodNotes: expected a function, got ${String(compute)}`);
  silentDepth++;
  let result: T;
  try {
    result = compute();
  } finally {
    silentDepth--;
  }
  if (
    result !== null &&
    typeof result === "object" &&
    typeof (result as { then?: unknown }).then === "function"
  ) {
    throw new Error(
      "withoutMethodNotes: the computation returned a promise; only synchronous computations can run without method notes",
    );
  }
  return result;
}

/** Every condition noted since the last reset, as plain serializable records. */
export function methodsUsed(): MethodNote[] {
  return order.map((n) => ({ ...n }));
}

/** Forgets every note (the runner calls this at the start of a run). */
export function resetMethodLog(): void {
  order.length = 0;
  seen.clear();
  lastTopic = lastStatement = previousTopic = previousStatement = undefined;
}
