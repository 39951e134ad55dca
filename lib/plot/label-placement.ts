/** Keeps labels readable: drops candidates closer than a minimum distance to a label already kept, by priority. */

export interface LabelCandidate<T> {
  readonly at: readonly [number, number];
  /** Lower numbers are placed first. */
  readonly priority: number;
  readonly item: T;
}

/**
 * The candidates to label, in input order, after greedy thinning: in priority order each is kept unless it lies
 * within `minDistance` of a kept one. Distances are measured after dividing by the axis spans (a fraction of the plot).
 */
export function thinLabels<T>(
  candidates: readonly LabelCandidate<T>[],
  spans: readonly [number, number],
  minDistance: number,
): T[] {
  const order = candidates.map((c, i) => ({ c, i })).sort((a, b) => a.c.priority - b.c.priority || a.i - b.i);
  const kept: { c: LabelCandidate<T>; i: number }[] = [];
  for (const o of order) {
    const far = kept.every(
      (k) =>
        Math.hypot((k.c.at[0] - o.c.at[0]) / spans[0], (k.c.at[1] - o.c.at[1]) / spans[1]) >= minDistance,
    );
    if (far) kept.push(o);
  }
  return kept.sort((a, b) => a.i - b.i).map((k) => k.c.item);
}
