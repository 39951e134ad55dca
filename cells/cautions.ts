/**
 * Cautions carried by results: a library function whose result could feed a safety decision (a sunglass category,
 * a signal-light colour, an optical radiation figure) returns it with a `caution` text. Whenever a cell shows such a
 * result, the display functions find those texts and put each distinct one in the report beside it, so a notebook
 * author cannot forget it.
 */
import { emitRecord } from "./emit.ts";
import type { CautionRecord } from "./records.ts";

/** The property name a result uses to carry its caution. */
export const CAUTION_KEY = "caution";

/** How deep and how many objects the search looks at (a table of thousands of rows stays quick). */
const MAX_DEPTH = 6;
const MAX_NODES = 50_000;

/** The distinct non-empty `caution` strings found in a value's plain objects and arrays, in order of appearance. */
export function findCautions(value: unknown): string[] {
  const found = new Set<string>();
  const seen = new Set<object>();
  let nodes = 0;
  const visit = (v: unknown, depth: number): void => {
    if (typeof v !== "object" || v === null || depth > MAX_DEPTH || nodes >= MAX_NODES || seen.has(v)) return;
    if (ArrayBuffer.isView(v)) return;
    seen.add(v);
    nodes++;
    if (Array.isArray(v)) {
      for (const item of v) visit(item, depth + 1);
      return;
    }
    const proto = Object.getPrototypeOf(v);
    if (proto !== Object.prototype && proto !== null) return;
    for (const [key, child] of Object.entries(v as Record<string, unknown>)) {
      if (key === CAUTION_KEY && typeof child === "string" && child.trim() !== "") found.add(child.trim());
      else visit(child, depth + 1);
    }
  };
  visit(value, 0);
  return [...found];
}

/** Shows each distinct caution a shown value carries, right after it; `about` says what it belongs to. */
export function emitCautionsOf(value: unknown, about: NonNullable<CautionRecord["about"]>): void {
  for (const text of findCautions(value)) emitRecord({ kind: "caution", title: "Caution", text, about });
}
