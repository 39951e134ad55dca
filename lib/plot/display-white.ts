/**
 * The D65 white the display standards use, x = 0.3127, y = 0.3290 (IEC 61966-2-1:1999; ITU-R BT.709-6), on the
 * Y = 100 scale, and the adaptation of colours seen under another white to it for drawing (linearised Bradford via
 * lib/adaptation's adaptationMatrix; Lam 1985, ICC.1:2010 Annex E). Drawing only: nothing is noted in the methods log.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { applyMatrix3 } from "../colorimetry/matrix3.ts";
import { adaptationMatrix } from "../adaptation/chromatic-adaptation.ts";

export const D65_WHITE_Y100: Tristimulus = {
  X: (0.3127 / 0.329) * 100,
  Y: 100,
  Z: ((1 - 0.3127 - 0.329) / 0.329) * 100,
};

/** XYZ seen under `white` carried to the D65 display white by linear Bradford (keeps the white's Y scale). */
export function adaptToD65(xyz: Tristimulus, white: Tristimulus): Tristimulus {
  const same =
    Math.abs(white.X / white.Y - D65_WHITE_Y100.X / 100) < 1e-9 &&
    Math.abs(white.Z / white.Y - D65_WHITE_Y100.Z / 100) < 1e-9;
  if (same) return xyz;
  const [X, Y, Z] = applyMatrix3(adaptationMatrix(white, D65_WHITE_Y100, "bradford"), [xyz.X, xyz.Y, xyz.Z]);
  return { X, Y, Z };
}
