/** Hue angle of a pair of opponent coordinates, as CIE 015:2018 eqs. 8.13 and 8.23 define it. */

/** h = atan2(second, first) in degrees, 0 ≤ h < 360 (e.g. hab from a*, b*; huv from u*, v*). */
export function hueAngleDegrees(first: number, second: number): number {
  const h = (Math.atan2(second, first) * 180) / Math.PI;
  return h < 0 ? h + 360 : h;
}
