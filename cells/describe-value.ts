/** A short description of a value for error messages ("an array of 3", "null", a clipped inspection). */
import { inspect } from "node:util";

/** Describes what a display function was given instead of what it expects, in a few words. */
export function describeValue(value: unknown): string {
  if (value === null) return "null";
  if (Array.isArray(value)) return `an array of ${value.length}`;
  if (typeof value === "string") return JSON.stringify(value.length > 60 ? `${value.slice(0, 60)}…` : value);
  if (typeof value === "object") return inspect(value, { depth: 0, breakLength: Infinity }).slice(0, 80);
  return `${typeof value} ${String(value)}`;
}
