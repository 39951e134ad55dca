/** Number formatting for tables shown in reports (plain ASCII digits and minus, so values paste into spreadsheets). */

/** Formats a number with a fixed count of decimals, or with up to 6 significant digits when `digits` is undefined. */
export function formatNumber(value: number, digits?: number): string {
  if (Number.isNaN(value)) return "NaN";
  if (!Number.isFinite(value)) return value > 0 ? "Infinity" : "-Infinity";
  if (digits !== undefined) return value.toFixed(digits);
  if (Number.isInteger(value) && Math.abs(value) < 1e15) return String(value);
  const abs = Math.abs(value);
  if (abs !== 0 && (abs < 1e-4 || abs >= 1e15)) return value.toExponential(5).replace(/\.?0+e/, "e");
  return String(Number(value.toPrecision(6)));
}

/** Checks a `digits` option: an integer from 0 to 20, as Number.prototype.toFixed accepts. */
export function checkDigits(digits: unknown, where: string): number | undefined {
  if (digits === undefined) return undefined;
  if (typeof digits !== "number" || !Number.isInteger(digits) || digits < 0 || digits > 20) {
    throw new RangeError(`${where}: digits must be a whole number from 0 to 20, got ${String(digits)}`);
  }
  return digits;
}
