/**
 * Which table cells keep their text on one line. A short code, ID or number with its unit ("HG-114-01",
 * "#1a2b3c", "249.6 cd/m²", "≤ 0.004") reads wrongly when split ("HG-" / "114-01"), while prose may wrap so that a
 * table still fits an A4 page. Numeric columns never wrap (their cells are formatted numbers).
 */

/** Longest text without spaces that is still an ID or code (longer runs, e.g. hashes and paths, may break). */
export const ONE_LINE_TOKEN_MAX = 24;
/** Longest text starting with a number (a value with its unit, a short comparison) kept on one line. */
export const ONE_LINE_VALUE_MAX = 16;

const STARTS_WITH_NUMBER = /^[<>≤≥±≈~+\-−]?\s?[0-9]/;

/** True when a table cell's text is short and reads as one unit: no spaces, or a number with its unit. */
export function keepsOnOneLine(text: string): boolean {
  const t = text.trim();
  if (t === "") return false;
  if (!/\s/.test(t)) return t.length <= ONE_LINE_TOKEN_MAX;
  return t.length <= ONE_LINE_VALUE_MAX && STARTS_WITH_NUMBER.test(t);
}
