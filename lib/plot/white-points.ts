/**
 * Chromaticities of standard illuminants for marking white points on a diagram: the illuminant's relative spectral
 * power summed against the observer's colour-matching functions at the illuminant's own samples (CIE 015:2018 §7.1,
 * eq. 7.1 with the normalising constant dropped, as it cancels in x and y). Private: drawing only; it writes nothing
 * to the run's methods log.
 */
import { illuminant } from "../illuminants/standard-illuminant.ts";
import {
  colourMatchingAt,
  observerByName,
  type Observer,
  type ObserverName,
} from "../observers/standard-observer.ts";
import type { Chromaticity } from "../colorimetry/chromaticity.ts";

/** The white points a diagram marks when asked for "all standard" ones. */
export const STANDARD_WHITE_POINTS: readonly string[] = ["A", "D50", "D55", "D65", "D75", "E"];

/** xy of a CIE illuminant by name (any name `illuminant()` accepts) for an observer. */
export function illuminantChromaticity(
  name: string,
  observer: ObserverName | Observer | 2 | 10 = "2°",
): Chromaticity {
  const s = illuminant(name);
  const obs = observerByName(observer);
  let X = 0,
    Y = 0,
    Z = 0;
  for (let i = 0; i < s.wavelengths.length; i++) {
    const w = s.wavelengths[i]!;
    if (w < obs.wavelengths[0]! || w > obs.wavelengths.at(-1)!) continue;
    const [xb, yb, zb] = colourMatchingAt(obs, w);
    X += s.values[i]! * xb;
    Y += s.values[i]! * yb;
    Z += s.values[i]! * zb;
  }
  const sum = X + Y + Z;
  return { x: X / sum, y: Y / sum };
}
