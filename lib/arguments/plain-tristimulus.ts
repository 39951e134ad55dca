/**
 * The common case of the tristimulus argument checks, small enough to inline into a cell's loop: checkFields sees
 * every shape the library checks, and there its field reads and the call of the shape's test are slow polymorphic
 * operations that cost more than a conversion. Each test accepts exactly what checkFields (and a positive white)
 * accept; a caller sends anything else to the full check, which throws naming what is wrong.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";

/** True for a plain object with finite X, Y and Z (not an array). */
export function isPlainXyz(v: Tristimulus): boolean {
  return (
    typeof v === "object" &&
    v !== null &&
    Number.isFinite(v.X) &&
    Number.isFinite(v.Y) &&
    Number.isFinite(v.Z) &&
    !Array.isArray(v)
  );
}

/** True for a plain XYZ whose X, Y and Z are all positive (a reference white). */
export function isPlainWhite(v: Tristimulus): boolean {
  return isPlainXyz(v) && v.X > 0 && v.Y > 0 && v.Z > 0;
}
