/** Internal: a value and its expanded uncertainty rounded together (JCGM 100:2008 §7.2.6). */

/** The value and U as text, U to two significant digits, the value to U's last decimal. */
export function roundedPair(value: number, U: number): [string, string] {
  if (!(U > 0)) return [String(Number(value.toPrecision(6))), "0"];
  const place = Math.floor(Math.log10(U)) - 1;
  const decimals = Math.max(0, -place);
  if (decimals > 0) return [value.toFixed(decimals), U.toFixed(decimals)];
  const step = 10 ** place;
  return [String(Math.round(value / step) * step), String(Math.round(U / step) * step)];
}
