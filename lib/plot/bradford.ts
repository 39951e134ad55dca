/**
 * Chromatic adaptation for drawing swatches whose reference white is not D65: the linear Bradford transform
 * (Lam 1985; matrix as given in ICC.1:2010 Annex E), a von Kries scaling of sharpened cone-like
 * responses. Private to lib/plot until lib/adaptation offers one; used for display colours only, never for results.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { D65_WHITE_Y100 } from "./display-white.ts";

const M = [0.8951, 0.2664, -0.1614, -0.7502, 1.7135, 0.0367, 0.0389, -0.0685, 1.0296] as const;
const MI = (() => {
  const [a, b, c, d, e, f, g, h, i] = M;
  const det = a * (e * i - f * h) - b * (d * i - f * g) + c * (d * h - e * g);
  return [(e * i - f * h) / det, (c * h - b * i) / det, (b * f - c * e) / det, (f * g - d * i) / det, (a * i - c * g) / det, (c * d - a * f) / det, (d * h - e * g) / det, (b * g - a * h) / det, (a * e - b * d) / det] as const;
})();

function mul(m: readonly number[], t: Tristimulus): [number, number, number] {
  return [m[0]! * t.X + m[1]! * t.Y + m[2]! * t.Z, m[3]! * t.X + m[4]! * t.Y + m[5]! * t.Z, m[6]! * t.X + m[7]! * t.Y + m[8]! * t.Z];
}

/** XYZ seen under `white` carried to the D65 display white by linear Bradford (keeps the white's Y scale). */
export function adaptToD65(xyz: Tristimulus, white: Tristimulus): Tristimulus {
  const target = { X: (D65_WHITE_Y100.X * white.Y) / 100, Y: white.Y, Z: (D65_WHITE_Y100.Z * white.Y) / 100 };
  if (Math.abs(white.X - target.X) < 1e-9 * white.Y && Math.abs(white.Z - target.Z) < 1e-9 * white.Y) return xyz;
  const src = mul(M, white), dst = mul(M, target), c = mul(M, xyz);
  const scaled = { X: (c[0] * dst[0]) / src[0], Y: (c[1] * dst[1]) / src[1], Z: (c[2] * dst[2]) / src[2] };
  const [X, Y, Z] = mul(MI, scaled);
  return { X, Y, Z };
}
