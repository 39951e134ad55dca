/** Small formatting helpers for the report. */

/** "850 ms", "2.4 s", "3 min 12 s". */
export function formatDuration(ms: number): string {
  if (ms < 1) return "< 1 ms";
  if (ms < 1000) return `${Math.round(ms)} ms`;
  if (ms < 60_000)
    return ms % 1000 === 0 ? `${ms / 1000} s` : `${(ms / 1000).toFixed(ms < 10_000 ? 2 : 1)} s`;
  const minutes = Math.floor(ms / 60_000);
  return `${minutes} min ${Math.round((ms - minutes * 60_000) / 1000)} s`;
}
