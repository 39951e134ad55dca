/**
 * The visible-spectrum colour band drawn along a wavelength axis: for each wavelength the CIE 1931 colour-matching
 * functions turned into linear sRGB (IEC 61966-2-1 matrix from its primaries), negative channels clipped, scaled to
 * the brightest channel and faded towards the ends of the visible range. The colours are approximate by nature
 * (no display shows spectral colours); captions say so. Returned as a one-pixel-high PNG for a layout image.
 */
import { CIE_1931_2_DEGREE, colourMatchingAt } from "../observers/standard-observer.ts";
import { encodeRgb, linearRgb } from "./display-rgb.ts";
import { pngDataUri } from "./png-image.ts";

/** Approximate encoded sRGB (0–1) of monochromatic light at a wavelength (nm), for drawing only (see file comment). */
export function spectralDisplayColour(wavelength: number): [number, number, number] {
  if (!(wavelength >= 360 && wavelength <= 830)) return [0, 0, 0];
  const [X, Y, Z] = colourMatchingAt(CIE_1931_2_DEGREE, wavelength);
  const rgb = linearRgb({ X, Y, Z }, "sRGB").map((v) => Math.max(0, v)) as [number, number, number];
  const hi = Math.max(...rgb);
  if (!(hi > 0)) return [0, 0, 0];
  // Fade over 380–430 nm and 650–780 nm, where the eye's sensitivity falls (common practice, no source).
  const fade =
    wavelength < 430
      ? Math.max(0, (wavelength - 370) / 60)
      : wavelength > 650
        ? Math.max(0, (790 - wavelength) / 140)
        : 1;
  const k = (0.15 + 0.85 * fade) / hi;
  return encodeRgb([rgb[0] * k, rgb[1] * k, rgb[2] * k], "sRGB").map((v) => Math.min(1, Math.max(0, v))) as [
    number,
    number,
    number,
  ];
}

/** A band image covering `from`–`to` nm, one pixel per `step` nm, as a PNG data URI; outside 380–780 nm it is transparent. */
export function spectrumBandImage(from: number, to: number, step = 1): { source: string; widthPx: number } {
  if (!(to > from) || !(step > 0))
    throw new Error(`spectrum band: ${from}–${to} nm every ${step} nm is not a valid range`);
  const n = Math.max(2, Math.min(2000, Math.round((to - from) / step)));
  const rgba = new Uint8Array(n * 4);
  for (let i = 0; i < n; i++) {
    const w = from + ((i + 0.5) * (to - from)) / n;
    if (w < 380 || w > 780) continue;
    const c = spectralDisplayColour(w);
    rgba[i * 4] = Math.round(c[0] * 255);
    rgba[i * 4 + 1] = Math.round(c[1] * 255);
    rgba[i * 4 + 2] = Math.round(c[2] * 255);
    rgba[i * 4 + 3] = 255;
  }
  return { source: pngDataUri(n, 1, rgba), widthPx: n };
}
