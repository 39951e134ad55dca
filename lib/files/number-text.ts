/** Strict reading of numbers written in measurement files, with a stated decimal mark (never guessed per cell). */

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** The number a cell holds, or undefined when it is not a plain decimal number (no thousands separators, no units). */
export function readNumber(text: string, decimal: "." | ","): number | undefined {
  let t = text.trim();
  if (decimal === ",") {
    if (t.includes(".")) return undefined;
    t = t.replace(",", ".");
  }
  if (!NUMBER.test(t)) return undefined;
  const v = Number(t);
  return Number.isFinite(v) ? v : undefined;
}

/** True when the text looks like a number with a decimal comma (e.g. "0,512"). */
export function hasDecimalComma(text: string): boolean {
  return /^\s*[+-]?\d*,\d+([eE][+-]?\d+)?\s*$/.test(text);
}

/** True when the text looks like a number with a decimal point (e.g. "0.512"). */
export function hasDecimalPoint(text: string): boolean {
  return /^\s*[+-]?\d*\.\d+([eE][+-]?\d+)?\s*$/.test(text) || /^\s*[+-]?\d+\.\s*$/.test(text);
}

/**
 * A number written with a given decimal mark and at most `digits` significant digits, without exponent noise; with
 * `maxDecimals`, also at most that many decimals (no exponent ever; what rounds to zero is written as 0).
 */
export function writeNumber(value: number, decimal: "." | ",", digits: number, maxDecimals?: number): string {
  if (!Number.isFinite(value)) throw new Error(`cannot write ${value} to a data file`);
  let s = String(Number(value.toPrecision(digits)));
  if (maxDecimals !== undefined) {
    s = Number(s).toFixed(maxDecimals);
    if (s.includes(".")) s = s.replace(/\.?0+$/, "");
    if (/^-0$/.test(s)) s = "0";
  } else if (/e-/i.test(s)) {
    // Small values are written out in full (0.0000001234) while that needs at most 20 decimals; tinier ones keep the exponent.
    const decimals = digits - Math.floor(Math.log10(Math.abs(value))) - 1;
    if (decimals <= 20) {
      s = value.toFixed(decimals);
      if (s.includes(".")) s = s.replace(/\.?0+$/, "");
    }
  }
  return decimal === "," ? s.replace(".", ",") : s;
}
