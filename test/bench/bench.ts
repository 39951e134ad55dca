/**
 * The contract of a benchmark module: `test/bench/<name>.bench.ts` default-exports a Bench. `npm run bench` runs
 * every such module (or those whose file name contains the words given: `npm run bench -- runner`).
 */

/** One measured quantity. */
export interface BenchResult {
  readonly name: string;
  readonly value: number;
  readonly unit: string;
  /** The target as text, e.g. "≤ 1.5", and whether the value met it. */
  readonly target?: string;
  readonly met?: boolean;
  readonly note?: string;
}

/** A benchmark module's default export. */
export interface Bench {
  readonly name: string;
  run(): Promise<BenchResult[]>;
}

/** Median of a list of numbers. */
export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 ? sorted[mid]! : (sorted[mid - 1]! + sorted[mid]!) / 2;
}
