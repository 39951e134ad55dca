/** Input checks shared by the colour-difference formulas. */
import type { Lab } from "../colorimetry/cielab.ts";

/** Throws a clear error when a CIELAB colour has a missing or non-finite coordinate. */
export function requireLab(what: string, which: string, c: Lab): void {
  if (
    typeof c !== "object" ||
    c === null ||
    !Number.isFinite(c.L) ||
    !Number.isFinite(c.a) ||
    !Number.isFinite(c.b)
  ) {
    throw new Error(
      `${what}: the ${which} colour (L* ${c?.L}, a* ${c?.a}, b* ${c?.b}) must have three finite CIELAB coordinates`,
    );
  }
}

/** Throws when a parametric factor is not a positive finite number. */
export function requireFactor(what: string, name: string, value: number): void {
  if (typeof value !== "number" || !Number.isFinite(value) || value <= 0) {
    throw new Error(`${what}: parametric factor ${name} = ${value} must be a positive finite number`);
  }
}
