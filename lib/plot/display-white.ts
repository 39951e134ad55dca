/** The D65 white the display standards use: x = 0.3127, y = 0.3290 (IEC 61966-2-1:1999; ITU-R BT.709-6), on the Y = 100 scale. */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";

export const D65_WHITE_Y100: Tristimulus = { X: (0.3127 / 0.329) * 100, Y: 100, Z: ((1 - 0.3127 - 0.329) / 0.329) * 100 };
