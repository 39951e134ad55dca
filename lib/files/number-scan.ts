/**
 * Reading a decimal number straight from a span of a line, without cutting the span out first (the hot path of
 * large tables). Grammar: optional sign, digits with one decimal mark, optional exponent; anything else is NaN.
 * Up to 15 significant digits and powers of ten up to 10^22 are combined in one correctly rounded floating-point
 * operation (Clinger 1990, "How to read floating point numbers accurately", the fast path); longer numbers fall
 * back to the engine's own Number() conversion, which is correctly rounded (ECMA-262 §7.1.4.1.1).
 */

const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));

/** The number written in text[start, end) with the given decimal mark (46 "." or 44 ","), or NaN. */
export function scanNumber(text: string, start: number, end: number, decimalCode: number): number {
  let i = start;
  while (i < end && (text.charCodeAt(i) === 32 || text.charCodeAt(i) === 9)) i++;
  while (end > i && (text.charCodeAt(end - 1) === 32 || text.charCodeAt(end - 1) === 9)) end--;
  if (i >= end) return NaN;
  let negative = false;
  let c = text.charCodeAt(i);
  if (c === 45 || c === 43) {
    negative = c === 45;
    i++;
  }
  let mantissa = 0;
  let significant = 0;
  let digits = 0;
  let scale = 0; // power of ten to apply to the mantissa
  let seenMark = false;
  for (; i < end; i++) {
    c = text.charCodeAt(i);
    if (c >= 48 && c <= 57) {
      digits++;
      if (significant > 0 || c !== 48) {
        if (significant < 15) {
          mantissa = mantissa * 10 + (c - 48);
          significant++;
          if (seenMark) scale--;
        } else {
          significant++;
          if (!seenMark) scale++;
        }
      } else if (seenMark) scale--;
    } else if (c === decimalCode && !seenMark) {
      seenMark = true;
    } else break;
  }
  if (digits === 0) return NaN;
  if (i < end) {
    if (c !== 101 && c !== 69) return NaN; // e or E
    i++;
    let expNegative = false;
    c = text.charCodeAt(i);
    if (c === 45 || c === 43) {
      expNegative = c === 45;
      i++;
    }
    let exp = 0;
    let expDigits = 0;
    for (; i < end; i++) {
      c = text.charCodeAt(i);
      if (c < 48 || c > 57) return NaN;
      exp = exp * 10 + (c - 48);
      expDigits++;
      if (exp > 100000) exp = 100000;
    }
    if (expDigits === 0) return NaN;
    scale += expNegative ? -exp : exp;
  }
  let value: number;
  if (significant > 15 || scale > 22 || scale < -22) {
    let t = text.slice(start, end).trim();
    if (decimalCode === 44) t = t.replace(",", ".");
    value = Number(t);
    return Number.isFinite(value) ? value : NaN;
  }
  value = scale >= 0 ? mantissa * POW10[scale]! : mantissa / POW10[-scale]!;
  return negative ? -value : value;
}

/**
 * Reads a whole line of numbers separated by one character (`sepCode`, not a space) into `out` in one pass, and
 * returns how many it read; −1 when the line holds anything else (a quote, a blank or non-numeric cell, more cells
 * than `out` holds), so that the caller reads it again cell by cell to name the fault.
 */
export function scanNumberRow(line: string, sepCode: number, decimalCode: number, out: Float64Array): number {
  const n = line.length;
  let i = 0;
  let count = 0;
  for (;;) {
    if (count >= out.length) return -1;
    const cellStart = i;
    let c = i < n ? line.charCodeAt(i) : -1;
    while (c === 32 || c === 9) c = ++i < n ? line.charCodeAt(i) : -1;
    let negative = false;
    if (c === 45 || c === 43) {
      negative = c === 45;
      c = ++i < n ? line.charCodeAt(i) : -1;
    }
    let mantissa = 0;
    let significant = 0;
    let digits = 0;
    let scale = 0;
    let seenMark = false;
    for (;;) {
      if (c >= 48 && c <= 57) {
        digits++;
        if (significant > 0 || c !== 48) {
          if (significant < 15) {
            mantissa = mantissa * 10 + (c - 48);
            if (seenMark) scale--;
          } else if (!seenMark) scale++;
          significant++;
        } else if (seenMark) scale--;
      } else if (c === decimalCode && !seenMark) seenMark = true;
      else break;
      c = ++i < n ? line.charCodeAt(i) : -1;
    }
    if (digits === 0) return -1;
    if (c === 101 || c === 69) {
      c = ++i < n ? line.charCodeAt(i) : -1;
      let expNegative = false;
      if (c === 45 || c === 43) {
        expNegative = c === 45;
        c = ++i < n ? line.charCodeAt(i) : -1;
      }
      let exp = 0;
      let expDigits = 0;
      while (c >= 48 && c <= 57) {
        if (exp < 100000) exp = exp * 10 + (c - 48);
        expDigits++;
        c = ++i < n ? line.charCodeAt(i) : -1;
      }
      if (expDigits === 0) return -1;
      scale += expNegative ? -exp : exp;
    }
    const cellEnd = i;
    while (c === 32 || c === 9) c = ++i < n ? line.charCodeAt(i) : -1;
    if (c !== sepCode && c !== -1) return -1;
    let value: number;
    if (significant > 15 || scale > 22 || scale < -22) {
      value = scanNumber(line, cellStart, cellEnd, decimalCode);
      if (value !== value) return -1;
    } else {
      value = scale >= 0 ? mantissa * POW10[scale]! : mantissa / POW10[-scale]!;
      if (negative) value = -value;
    }
    out[count++] = value;
    if (c === -1) return count;
    i++; // past the separator
  }
}
