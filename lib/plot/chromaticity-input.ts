/** Chromaticities as figures accept them: {x, y}, {u, v} (CIE 1976 u′, v′) or tristimulus {X, Y, Z}. */
import {
  chromaticityXy,
  xyFromUvPrime,
  type Chromaticity,
  type Tristimulus,
  type UvPrime,
} from "../colorimetry/chromaticity.ts";

export type ChromaticityInput = Chromaticity | UvPrime | Tristimulus;

/** The xy chromaticity of an input; an object with none of x/y, u/v, X/Y/Z, or with non-finite numbers, is an error. */
export function toXy(p: ChromaticityInput, what = "point"): Chromaticity {
  if (p === null || typeof p !== "object")
    throw new Error(`${what}: ${String(p)} is not a chromaticity; give {x, y}, {u, v} or {X, Y, Z}`);
  const o = p as unknown as Record<string, unknown>;
  const num = (k: string) => {
    const v = o[k];
    if (typeof v !== "number" || !Number.isFinite(v))
      throw new Error(`${what}: ${k} = ${String(v)} is not a finite number`);
    return v;
  };
  if ("X" in o || "Z" in o) return chromaticityXy({ X: num("X"), Y: num("Y"), Z: num("Z") });
  if ("x" in o) {
    const xy = { x: num("x"), y: num("y") };
    if (xy.x < 0 || xy.y <= 0 || xy.x + xy.y > 1.0001)
      throw new Error(`${what}: (x, y) = (${xy.x}, ${xy.y}) is not a possible chromaticity`);
    return xy;
  }
  if ("u" in o) return xyFromUvPrime({ u: num("u"), v: num("v") });
  throw new Error(`${what}: ${JSON.stringify(p)} has none of {x, y}, {u, v}, {X, Y, Z}`);
}
