/** Measured primaries and white against the primaries and white of a named RGB space, with their errors. */
import type { Chromaticity } from "../colorimetry/chromaticity.ts";
import { checkWith } from "../arguments/check-with.ts";
import { isRgbSpace } from "../arguments/common-arguments.ts";
import { noteMethod } from "../methods/method-log.ts";
import { refuse } from "../arguments/refuse.ts";
import { rgbSpace, rgbSpaceNames, type RgbSpace } from "../rgb/rgb-space.ts";
import { readingXy, uvOf, type ColourReading } from "./colour-input.ts";

/** Measured full-screen red, green, blue and white, as XYZ or chromaticities. */
export interface MeasuredPrimaries {
  readonly red: ColourReading;
  readonly green: ColourReading;
  readonly blue: ColourReading;
  readonly white: ColourReading;
}

/** One primary (or the white) against its target. */
export interface PrimaryError {
  readonly name: "red" | "green" | "blue" | "white";
  readonly measured: Chromaticity;
  readonly target: Chromaticity;
  /** measured − target in CIE 1931 x and y. */
  readonly dx: number;
  readonly dy: number;
  /** Δu′v′ from the target. */
  readonly deltaUv: number;
}

/** The comparison with a target space. */
export interface PrimariesCheck {
  readonly target: string;
  readonly rows: readonly PrimaryError[];
  /** The largest Δu′v′ of the three primaries, and the white's Δu′v′. */
  readonly maxPrimaryDeltaUv: number;
  readonly whiteDeltaUv: number;
}

/**
 * Measured primaries and white against a target RGB space: per colour x, y of both, Δx, Δy and Δu′v′.
 *
 * @param measured { red, green, blue, white }, each { X, Y, Z } or { x, y } (black-subtracted if the black is not negligible).
 * @param target An RGB space or its name for `rgbSpace` (e.g. "BT.709", "DCI-P3", "BT.2020").
 * @returns A `PrimariesCheck` with the rows and the largest errors.
 * @source CIE 015:2018 §8.1 (u′v′); the target's primaries from its standard (see `rgbSpace`).
 * @example primariesAgainstTarget({ red: { x: 0.639, y: 0.331 }, green: { x: 0.301, y: 0.598 }, blue: { x: 0.151, y: 0.061 }, white: { x: 0.3134, y: 0.3297 } }, "BT.709")
 */
export function primariesAgainstTarget(
  measured: MeasuredPrimaries,
  target: RgbSpace | string,
): PrimariesCheck {
  const fn = "primariesAgainstTarget";
  checkWith(
    fn,
    "measured",
    measured,
    "measured colours { red, green, blue, white }",
    (m) => typeof m === "object" && m !== null && !Array.isArray(m),
  );
  checkWith(
    fn,
    "target",
    target,
    'an RGB space or its name (e.g. "BT.709")',
    (t) => typeof t === "string" || isRgbSpace(t),
  );
  let space: RgbSpace;
  try {
    space = typeof target === "string" ? rgbSpace(target) : target;
  } catch {
    refuse(fn, "target", `an RGB space name, one of ${rgbSpaceNames().join(", ")}`, target);
  }
  const want = {
    red: space.primaries.r,
    green: space.primaries.g,
    blue: space.primaries.b,
    white: space.white,
  };
  noteMethod(
    "gamut",
    `Measured primaries and white were compared with those of ${space.name} (${space.source}) in CIE 1931 x, y and as Δu′v′ in the CIE 1976 UCS diagram.`,
  );
  const rows = (["red", "green", "blue", "white"] as const).map((name) => {
    const m = readingXy(fn, `measured.${name}`, measured[name]);
    const t = want[name];
    const a = uvOf(m),
      b = uvOf(t);
    return {
      name,
      measured: m,
      target: { x: t.x, y: t.y },
      dx: m.x - t.x,
      dy: m.y - t.y,
      deltaUv: Math.hypot(a.u - b.u, a.v - b.v),
    };
  });
  return {
    target: space.name,
    rows,
    maxPrimaryDeltaUv: Math.max(rows[0]!.deltaUv, rows[1]!.deltaUv, rows[2]!.deltaUv),
    whiteDeltaUv: rows[3]!.deltaUv,
  };
}
