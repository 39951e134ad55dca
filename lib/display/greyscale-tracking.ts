/** Grey-scale tracking: the chromaticity, CCT, Duv and Δu′v′ from a target white of every level of a grey ramp. */
import type { Chromaticity, Tristimulus } from "../colorimetry/chromaticity.ts";
import { XYZ_FIELDS, XY_FIELDS, checkFields, hasNumberFields } from "../arguments/check-fields.ts";
import { checkList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { cctAndDuv } from "../temperature/cct.ts";
import { noteMethod } from "../methods/method-log.ts";
import { uvOf } from "./colour-input.ts";

/** One level of a grey ramp: its signal (0–1) and the reading { X, Y, Z } (cd/m²). */
export interface GreyReading {
  readonly signal: number;
  readonly xyz: Tristimulus;
}

/** Options of `greyscaleTracking`. */
export interface GreyscaleTrackingOptions {
  /** The target white's chromaticity; default D65 { x: 0.3127, y: 0.329 } (the value of ITU-R BT.709 and BT.2020). */
  target?: Chromaticity;
  /** A black reading to subtract from every level first; default none (readings used as measured). */
  black?: Tristimulus;
}

/** One level's result. */
export interface GreyLevel {
  readonly signal: number;
  /** Luminance Y of the level (after black subtraction when a black was given), cd/m². */
  readonly luminance: number;
  readonly x: number;
  readonly y: number;
  readonly u: number;
  readonly v: number;
  /** CCT in K and Duv (CIE 1960 UCS) by `cctAndDuv`. */
  readonly cct: number;
  readonly duv: number;
  /** Δu′v′ from the target white. */
  readonly deltaUv: number;
}

/** The tracking of a whole ramp. */
export interface GreyscaleTracking {
  readonly target: Chromaticity;
  readonly blackSubtracted: boolean;
  readonly levels: readonly GreyLevel[];
  /** The largest Δu′v′ of any level, and the signal where it occurs. */
  readonly maxDeltaUv: number;
  readonly worstSignal: number;
}

const isGreyReading = (v: unknown) =>
  typeof v === "object" &&
  v !== null &&
  Number.isFinite((v as GreyReading).signal) &&
  hasNumberFields((v as GreyReading).xyz, XYZ_FIELDS);

/**
 * Grey-scale tracking of a ramp: per level x, y, u′, v′, CCT, Duv and Δu′v′ to the target white; the worst level.
 *
 * Levels whose reading (less the black) has X + Y + Z ≤ 0 cannot have a chromaticity and are refused.
 *
 * @param levels The ramp [{ signal 0–1, xyz { X, Y, Z } }].
 * @param options Target white and optional black to subtract (see `GreyscaleTrackingOptions`); default D65, no black.
 * @returns A `GreyscaleTracking`: levels and the largest Δu′v′.
 * @source CIE 015:2018 §8.1 (u′v′) and §9.5 (CCT, Duv); Y. Ohno, LEUKOS 10:47 (2014).
 * @example greyscaleTracking([0.25, 0.5, 1].map((s) => ({ signal: s, xyz: { X: 95 * s ** 2.2, Y: 100 * s ** 2.2, Z: 108 * s ** 2.2 } })))
 */
export function greyscaleTracking(
  levels: readonly GreyReading[],
  options: GreyscaleTrackingOptions = {},
): GreyscaleTracking {
  const fn = "greyscaleTracking";
  checkList(fn, "levels", levels, "grey levels { signal, xyz { X, Y, Z } }", isGreyReading, { minLength: 1 });
  checkOptions(fn, "options", options, ["target", "black"]);
  checkFields(fn, "options.target", options.target, XY_FIELDS, { optional: true });
  checkFields(fn, "options.black", options.black, XYZ_FIELDS, { optional: true });
  const target = options.target ?? { x: 0.3127, y: 0.329 };
  const tUv = uvOf(target);
  const k = options.black;
  noteMethod(
    "colour difference",
    "Grey-scale tracking was computed as each level's Δu′v′ from the target white in the CIE 1976 UCS diagram (CIE 015:2018 §8.1), with CCT and Duv per level.",
  );
  if (k)
    noteMethod(
      "other",
      "The black-level reading was subtracted from the display readings before their chromaticities were computed.",
    );
  const out = levels.map((l, i) => {
    const X = l.xyz.X - (k?.X ?? 0),
      Y = l.xyz.Y - (k?.Y ?? 0),
      Z = l.xyz.Z - (k?.Z ?? 0);
    const s = X + Y + Z;
    checkWith(
      fn,
      `levels[${i}].xyz`,
      l.xyz,
      "a reading whose X + Y + Z (less the black) is above 0",
      () => s > 0,
    );
    const xy = { x: X / s, y: Y / s };
    const uv = uvOf(xy);
    const t = cctAndDuv(xy);
    return {
      signal: l.signal,
      luminance: Y,
      x: xy.x,
      y: xy.y,
      u: uv.u,
      v: uv.v,
      cct: t.cct,
      duv: t.duv,
      deltaUv: Math.hypot(uv.u - tUv.u, uv.v - tUv.v),
    };
  });
  const worst = out.reduce((w, l) => (l.deltaUv > w.deltaUv ? l : w), out[0]!);
  return {
    target: { ...target },
    blackSubtracted: k !== undefined,
    levels: out,
    maxDeltaUv: worst.deltaUv,
    worstSignal: worst.signal,
  };
}
