/**
 * Turns a value that must travel as data (a Plotly spec, a swatch list) into plain JSON-safe data, or throws an
 * error that names the offending part. Typed arrays become arrays, Dates become ISO strings, non-finite numbers
 * become null (Plotly draws a gap for null).
 */

/** Error for a value that cannot be stored as data; the runner reports it as an "unserializable" failure. */
export class UnserializableError extends Error {
  override readonly name = "UnserializableError";
}

/** Copies `value` as plain data or throws UnserializableError naming the path of the first part that is not. */
export function toPlainData(value: unknown, what: string): unknown {
  return copy(value, what, new Set());
}

function copy(value: unknown, path: string, seen: Set<object>): unknown {
  if (value === null || typeof value === "string" || typeof value === "boolean") return value;
  if (typeof value === "number") return Number.isFinite(value) ? value : null;
  if (value === undefined) return undefined;
  if (typeof value === "bigint") {
    throw new UnserializableError(
      `${path} is a BigInt (${value}n), which cannot be stored as data; convert it with Number()`,
    );
  }
  if (typeof value === "function") {
    throw new UnserializableError(`${path} is a function, which cannot be stored as data`);
  }
  if (typeof value === "symbol") {
    throw new UnserializableError(`${path} is a symbol, which cannot be stored as data`);
  }
  const object = value as object;
  if (seen.has(object)) throw new UnserializableError(`${path} refers back to itself (a circular reference)`);
  if (value instanceof Date) {
    if (Number.isNaN(value.getTime())) throw new UnserializableError(`${path} is an invalid Date`);
    return value.toISOString();
  }
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) {
    return Array.from(value as unknown as ArrayLike<number | bigint>, (v, i) =>
      copy(v, `${path}[${i}]`, seen),
    );
  }
  seen.add(object);
  try {
    if (Array.isArray(value)) return value.map((v, i) => copy(v, `${path}[${i}]`, seen) ?? null);
    const proto = Object.getPrototypeOf(value);
    if (proto !== Object.prototype && proto !== null) {
      const name = (proto?.constructor?.name as string | undefined) ?? "an object with a custom prototype";
      throw new UnserializableError(
        `${path} is a ${name}, which cannot be stored as data; use plain objects and arrays`,
      );
    }
    const out: Record<string, unknown> = {};
    for (const [key, v] of Object.entries(value as Record<string, unknown>)) {
      const c = copy(
        v,
        /^[A-Za-z_$][\w$]*$/.test(key) ? `${path}.${key}` : `${path}[${JSON.stringify(key)}]`,
        seen,
      );
      if (c !== undefined) out[key] = c;
    }
    return out;
  } finally {
    seen.delete(object);
  }
}
