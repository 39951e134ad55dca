/** Time limits as written on the command line and on fence lines: "30s", "2m", "500ms" or plain seconds. */
import { UsageError } from "./errors.ts";

/** The default time limit of one cell, in milliseconds. */
export const DEFAULT_TIME_LIMIT_MS = 30_000;

/** Parses "30s", "2m", "1.5m", "500ms", "45" (seconds) into milliseconds; throws UsageError naming the text. */
export function parseTimeLimit(text: string, where: string): number {
  const match = /^(\d+(?:\.\d+)?)\s*(ms|s|m|min)?$/.exec(text.trim());
  if (!match) {
    throw new UsageError(`${where}: "${text}" is not a time limit; write e.g. 30s, 2m or 500ms`);
  }
  const value = Number(match[1]);
  const unit = match[2] ?? "s";
  const ms = unit === "ms" ? value : unit === "s" ? value * 1000 : value * 60_000;
  if (!(ms >= 1) || ms > 24 * 3600_000) {
    throw new UsageError(`${where}: "${text}" is outside the range 1 ms to 24 hours`);
  }
  return Math.round(ms);
}

/** "30 s", "2 min", "500 ms" for messages. */
export function formatTimeLimit(ms: number): string {
  if (ms < 1000) return `${ms} ms`;
  if (ms % 60_000 === 0) return `${ms / 60_000} min`;
  return `${Number((ms / 1000).toFixed(3))} s`;
}
