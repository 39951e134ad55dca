/**
 * Makes a table the library keeps and hands out again (a constant, or a cached result such as illuminant("D65"))
 * read-only, with everything it holds: a cell that writes into it gets a TypeError instead of quietly changing the
 * data for every later caller (and for the next run of a cell process that serves several runs). Typed arrays
 * cannot be frozen and are left as they are; functions are not entered.
 */
export function readOnly<T>(value: T): T {
  freezeDeep(value, new Set());
  return value;
}

function freezeDeep(value: unknown, seen: Set<object>): void {
  if (typeof value !== "object" || value === null || seen.has(value) || ArrayBuffer.isView(value)) return;
  seen.add(value);
  for (const key of Reflect.ownKeys(value)) {
    const d = Reflect.getOwnPropertyDescriptor(value, key);
    if (d && "value" in d) freezeDeep(d.value, seen);
  }
  Object.freeze(value);
}
