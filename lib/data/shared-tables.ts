/**
 * The tables the library keeps and hands out again (its exported constants, and cached results such as
 * illuminant("D65") or rgbSpace("sRGB")), registered so that a cell process serving several runs can tell whether a
 * run wrote into one: a changed table would change every later result, so such a process is not handed on.
 * (Freezing them instead would turn their arrays of doubles into arrays of boxed numbers, which made the RGB
 * conversions about 1.6× slower.)
 */
/** Each registered table with the fingerprint it had when the library made it. */
const tables: { readonly table: object; readonly sum: number }[] = [];

/** Registers a table the library will hand out again (as the library made it); returns it. */
export function sharedTable<T extends object>(table: T): T {
  tables.push({ table, sum: weightedSum(table, new Set()) });
  return table;
}

/** A fingerprint of the numbers in each of `values` (e.g. the library's exported constants): one weighted sum each. */
export function tablesFingerprint(values: readonly unknown[]): number[] {
  return values.map((t) => weightedSum(t, new Set()));
}

/** True when a registered table differs from what it was when the library made it. */
export function sharedTableChanged(): boolean {
  return tables.some(({ table, sum }) => !Object.is(weightedSum(table, new Set()), sum));
}

/** True when two fingerprints are equal (NaN equal to NaN). */
export function sameFingerprint(a: readonly number[], b: readonly number[]): boolean {
  return a.length === b.length && a.every((x, i) => Object.is(x, b[i]));
}

function weightedSum(value: unknown, seen: Set<object>): number {
  if (typeof value === "number") return value;
  if (typeof value !== "object" || value === null || seen.has(value)) return 0;
  seen.add(value);
  let sum = 0;
  if (Array.isArray(value) || ArrayBuffer.isView(value)) {
    const items = value as ArrayLike<unknown>;
    for (let i = 0; i < items.length; i++) sum += (i + 1) * weightedSum(items[i], seen);
    return sum + items.length;
  }
  let k = 1;
  for (const key of Object.keys(value))
    sum += k++ * weightedSum((value as Record<string, unknown>)[key], seen);
  return sum;
}
