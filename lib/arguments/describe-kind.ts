/**
 * Describes a value by its kind for an error message: "a spectrum (\"D65\", relative power, 300–830 nm)", "an array
 * of 3 numbers", "a string (\"D65\")", "undefined", "null", "NaN", "an object with keys a, b"; never "[object Object]".
 */
export function describeKind(value: unknown): string {
  if (value === undefined) return "undefined";
  if (value === null) return "null";
  switch (typeof value) {
    case "number":
      if (Number.isNaN(value)) return "NaN";
      if (!Number.isFinite(value)) return value > 0 ? "Infinity" : "-Infinity";
      return `the number ${value}`;
    case "string":
      return value.length === 0 ? "an empty string" : `a string (${quote(value)})`;
    case "boolean":
      return `the boolean ${value}`;
    case "bigint":
      return `the bigint ${value}n`;
    case "symbol":
      return "a symbol";
    case "function":
      return value.name ? `a function (${value.name})` : "a function";
  }
  if (Array.isArray(value)) return describeArray(value);
  if (ArrayBuffer.isView(value)) {
    const n = (value as unknown as { length?: number }).length;
    return `a ${value.constructor.name}${typeof n === "number" ? ` of ${n} numbers` : ""}`;
  }
  const record = value as Record<string, unknown>;
  if (record.kind === "spectrum") return describeSpectrum(record);
  if (record.kind === "observer") return `an observer (${quote(String(record.name))})`;
  if (record.kind === "rgb space") return `an RGB space (${quote(String(record.name))})`;
  if (value instanceof Error) return `an error (${quote(value.message)})`;
  if (value instanceof Map) return `a Map of ${value.size} entries`;
  if (value instanceof Set) return `a Set of ${value.size} entries`;
  if (value instanceof Date) return "a Date";
  if (typeof (value as { then?: unknown }).then === "function") return "a promise (use await)";
  const keys = Object.keys(record);
  if (keys.length === 0) return "an empty object {}";
  const shown = keys.slice(0, 6).join(", ");
  return `an object with ${keys.length === 1 ? "key" : "keys"} ${shown}${keys.length > 6 ? ", ..." : ""}`;
}

function quote(text: string): string {
  return JSON.stringify(text.length > 40 ? `${text.slice(0, 40)}…` : text);
}

function describeSpectrum(s: Record<string, unknown>): string {
  const w = s.wavelengths;
  const range =
    Array.isArray(w) && w.length > 0 ? `, ${w[0]}–${w[w.length - 1]} nm` : ", without wavelengths";
  const quantity = typeof s.quantity === "string" ? `, ${s.quantity}` : "";
  return `a spectrum (${quote(String(s.name))}${quantity}${range})`;
}

function describeArray(items: readonly unknown[]): string {
  if (items.length === 0) return "an empty array";
  const kinds = new Set(items.map(itemKind));
  const n = items.length;
  // A short array of numbers shows its values: "an array of 2 items (numbers, non-finite numbers) [410, NaN]".
  const shown =
    n <= 4 && items.every((i) => typeof i === "number") ? ` [${items.map(String).join(", ")}]` : "";
  if (kinds.size === 1) {
    const [kind] = kinds;
    return `an array of ${n} ${n === 1 ? kind : plural(kind!)}${shown}`;
  }
  return `an array of ${n} items (${[...kinds].map(plural).join(", ")})${shown}`;
}

function itemKind(item: unknown): string {
  if (item === null) return "null";
  if (item === undefined) return "undefined";
  if (typeof item === "number") return Number.isFinite(item) ? "number" : "non-finite number";
  if (Array.isArray(item)) return `array of ${item.length}`;
  if (typeof item === "object" && (item as { kind?: unknown }).kind === "spectrum") return "spectrum";
  if (typeof item === "object") return "object";
  return typeof item;
}

function plural(kind: string): string {
  if (kind === "spectrum") return "spectra";
  if (kind === "null" || kind === "undefined") return `${kind} values`;
  if (kind.startsWith("array of ")) return kind.replace("array", "arrays");
  return `${kind}s`;
}
