/**
 * The sRGB curves of IEC 61966-2-1:1999 (§5.2 decoding, §5.3 encoding) for values already known to be finite: the
 * RGB conversions' hot path, whose inputs were checked where they entered. Not part of the public library (the
 * checked forms are srgbEncode and srgbDecode); checking each channel again cost a fifth of a conversion.
 *
 * The powers are written with roots, exp and log instead of `**`, which costs about twice as much: L^(1/2.4) =
 * ∛(L·⁴√L) and T^2.4 = T²·e^(0.4 ln T). The curves stay within 5 ε (relative, ε = 2⁻⁵²; at most 2 ulp of 1 in
 * 0–1) of their `**` form, most of it from 1.055·P − 0.055 near the breakpoint, where either form loses digits
 * (test/lib/rgb.test.ts compares them with culori's curves); beyond 1e100 (no real signal) `**` is used as before.
 */

/** V = 12.92·L for L ≤ 0.0031308, else 1.055·L^(1/2.4) − 0.055; negative values keep their sign (IEC 61966-2-1 §5.3). */
export function srgbEncodeChecked(linear: number): number {
  const l = linear < 0 ? -linear : linear;
  const e =
    l <= 0.0031308
      ? 12.92 * l
      : 1.055 * (l < 1e100 ? Math.cbrt(l * Math.sqrt(Math.sqrt(l))) : l ** (1 / 2.4)) - 0.055;
  return linear < 0 ? -e : e;
}

/** L = V ÷ 12.92 for V ≤ 0.04045, else ((V + 0.055) ÷ 1.055)^2.4; negative values keep their sign (IEC 61966-2-1 §5.2). */
export function srgbDecodeChecked(signal: number): number {
  const v = signal < 0 ? -signal : signal;
  let l: number;
  if (v <= 0.04045) l = v / 12.92;
  else {
    const t = (v + 0.055) / 1.055;
    l = t < 1e100 ? t * t * Math.exp(0.4 * Math.log(t)) : t ** 2.4;
  }
  return signal < 0 ? -l : l;
}
