/**
 * The run's record of colorimetric conditions (observer, illuminant, wavelength range and interval, interpolation,
 * normalisation, CCT method, ΔE formula, adaptation transform, ...). Library functions note what they used; the
 * runner reads the log after the last cell and writes the report's Methods section from it.
 * One instance per run: the worker loads the library once and every cell shares it.
 */
import { checkChoice, checkFunction, checkString } from "../arguments/check-text.ts";

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
  "uncertainty",
  "other",
] as const;
export type MethodTopic = (typeof METHOD_TOPICS)[number];

// Notes in first-use order, and per topic the statements already noted. Library functions call noteMethod in hot
// loops (ΔE for a million pairs), so a repeated note must cost no more than two hash lookups and allocate nothing.
const order: MethodNote[] = [];
const seen = new Map<string, Set<string>>();
// How many withoutMethodNotes calls are running: while above zero, noteMethod records nothing.
let silentDepth = 0;
// The last two distinct notes recorded or found recorded, newest first: a loop that notes the same one or two
// conditions on every call (sRGB → XYZ → CIELAB notes the RGB space, then CIELAB) answers with a few compares and no
// writes, in code small enough to inline into the loop. Behind them the last eight distinct notes, looked through
// out of line: a loop of three or more conditions costs a short scan, not the checks and two hash lookups. Each
// entry was checked when it came in, so a note equal to one is neither checked nor looked up.
let newestTopic: string | undefined;
let newestStatement: string | undefined;
let olderTopic: string | undefined;
let olderStatement: string | undefined;
const RECENT = 8;
const recentTopics: (string | undefined)[] = new Array<string | undefined>(RECENT).fill(undefined);
const recentStatements: (string | undefined)[] = new Array<string | undefined>(RECENT).fill(undefined);
let recentNext = 0;

/**
 * Notes that a computation used a condition, for the report's Methods section; repeated notes are kept once, in first-use order.
 *
 * Inside `withoutMethodNotes` nothing is recorded.
 *
 * @param topic One of `METHOD_TOPICS` ("observer", "illuminant", "colour difference", ...).
 * @param statement A full sentence as a lab report states it ("Colour differences were computed by ...").
 * @source none: the tristim Methods log.
 * @example noteMethod("other", "Invented samples were measured twice and averaged.")
 */
export function noteMethod(topic: MethodTopic, statement: string): void {
  if (silentDepth > 0) return;
  if (statement === newestStatement && topic === newestTopic) return;
  if (statement === olderStatement && topic === olderTopic) return;
  noteNotNewest(topic, statement);
}

/** A note that is neither of the newest two: found among the recent ones, or checked and recorded. */
function noteNotNewest(topic: MethodTopic, statement: string): void {
  let found = false;
  for (let i = 0; i < RECENT && !found; i++)
    found = recentStatements[i] === statement && recentTopics[i] === topic;
  if (!found) {
    checkChoice("noteMethod", "topic", topic, METHOD_TOPICS);
    checkString("noteMethod", "statement", statement, { what: "a sentence for the Methods section" });
    recentTopics[recentNext] = topic;
    recentStatements[recentNext] = statement;
    recentNext = (recentNext + 1) % RECENT;
  }
  olderTopic = newestTopic;
  olderStatement = newestStatement;
  newestTopic = topic;
  newestStatement = statement;
  if (found) return;
  let statements = seen.get(topic);
  if (statements === undefined) {
    statements = new Set();
    seen.set(topic, statements);
  }
  if (statements.has(statement)) return;
  statements.add(statement);
  order.push({ topic, statement });
}

/**
 * False while a `withoutMethodNotes` call is running (a caller that remembers "already noted" must not remember then).
 *
 * @returns true when notes are being recorded.
 * @source none: the tristim Methods log.
 * @example methodNotesActive()
 */
export function methodNotesActive(): boolean {
  return silentDepth === 0;
}

/**
 * Runs a synchronous computation without recording any method note, and returns its result.
 *
 * For decorative computations the report did not ask for (a figure's hover readouts, reference curves, colour fills,
 * display conversions of swatches), so the Methods section lists only what the notebook computed. A nested call is
 * fine; a computation that returns a promise is an error.
 *
 * @param compute A synchronous function with no arguments.
 * @returns What `compute` returns.
 * @source none: the tristim Methods log.
 * @example withoutMethodNotes(() => deltaE76({ L: 50, a: 0, b: 0 }, { L: 51, a: 1, b: 0 }))
 */
export function withoutMethodNotes<T>(compute: () => T): T {
  checkFunction("withoutMethodNotes", "compute", compute, { what: "a function taking no arguments" });
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

/**
 * Every condition noted since the last reset, in first-use order, as plain serializable records.
 *
 * @returns [{ topic, statement }, ...] copies.
 * @source none: the tristim Methods log.
 * @example methodsUsed().length
 */
export function methodsUsed(): MethodNote[] {
  return order.map((n) => ({ ...n }));
}

/**
 * Forgets every method note (the runner calls this at the start of a run; a cell rarely should, as the report's Methods section would lose the notes).
 *
 * @source none: the tristim Methods log.
 * @example resetMethodLog()
 */
export function resetMethodLog(): void {
  order.length = 0;
  seen.clear();
  newestTopic = newestStatement = olderTopic = olderStatement = undefined;
  recentTopics.fill(undefined);
  recentStatements.fill(undefined);
  recentNext = 0;
}
