/** The CIE standard colorimetric observers: colour-matching functions x̄(λ), ȳ(λ), z̄(λ) (ISO/CIE 11664-1:2019). */
import { CIE1931_2DEG_TABLE } from "../data/cie1931-observer.ts";
import { CIE1964_10DEG_TABLE } from "../data/cie1964-observer.ts";
import type { TabulatedData } from "../data/tabulated-data.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkObserver } from "../arguments/common-arguments.ts";
import { CIE_2015_10_DEGREE, CIE_2015_2_DEGREE } from "../vision/cie-2015-observer.ts";

export interface Observer {
  readonly kind: "observer";
  /** Full name as a Methods section states it. */
  readonly name: string;
  /** Field size in degrees: 2 for the CIE 1931 observer, 10 for the CIE 1964 observer. */
  readonly fieldDegrees: 2 | 10;
  readonly start: number;
  readonly step: number;
  readonly wavelengths: readonly number[];
  readonly xBar: readonly number[];
  readonly yBar: readonly number[];
  readonly zBar: readonly number[];
}

function fromTable(name: string, fieldDegrees: 2 | 10, t: TabulatedData): Observer {
  const xBar = t.columns.x!;
  return {
    kind: "observer",
    name,
    fieldDegrees,
    start: t.start,
    step: t.step,
    wavelengths: xBar.map((_, i) => t.start + i * t.step),
    xBar,
    yBar: t.columns.y!,
    zBar: t.columns.z!,
  };
}

/** CIE 1931 2° standard colorimetric observer, 360–830 nm at 1 nm (CIE 018:2019 Table 6). */
export const CIE_1931_2_DEGREE: Observer = fromTable(
  "CIE 1931 2° standard colorimetric observer",
  2,
  CIE1931_2DEG_TABLE,
);
/** CIE 1964 10° supplementary standard colorimetric observer, 360–830 nm at 1 nm (ISO/CIE 11664-1:2019 Table 2). */
export const CIE_1964_10_DEGREE: Observer = fromTable(
  "CIE 1964 10° supplementary standard colorimetric observer",
  10,
  CIE1964_10DEG_TABLE,
);

/** Names accepted wherever an observer is asked for. */
export type ObserverName =
  | "2°"
  | "10°"
  | "2"
  | "10"
  | "1931"
  | "1964"
  | "CIE 1931"
  | "CIE 1964"
  | "2015 2°"
  | "2015 10°"
  | "CIE 2015 2°"
  | "CIE 2015 10°";

/**
 * A CIE standard colorimetric observer by name ("2°"/"1931" or "10°"/"1964"), or the observer itself; an unknown name is an error.
 *
 * @param which "2°", "2", "1931", "CIE 1931", 2 for the CIE 1931 2° observer; "10°", "10", "1964", "CIE 1964", 10 for the CIE 1964 10° observer; "CIE 2015 2°" or "CIE 2015 10°" ("2015 2°", "2015 10°") for the CIE 170-2 cone-fundamental-based observers; or an `Observer`, returned as it is. Default "2°".
 * @returns The `Observer`: x̄, ȳ, z̄ tabulated 360–830 nm at 1 nm.
 * @source CIE 018:2019 Table 6 (1931 2°); ISO/CIE 11664-1:2019 Table 2 (1964 10°).
 * @example observerByName("10°").name
 */
export function observerByName(which: ObserverName | Observer | 2 | 10 = "2°"): Observer {
  checkObserver("observerByName", "which", which);
  if (typeof which === "object") return which;
  const key = String(which)
    .replace(/^CIE\s*/i, "")
    .replace("°", "")
    .trim();
  if (key === "2" || key === "1931") return CIE_1931_2_DEGREE;
  if (key === "10" || key === "1964") return CIE_1964_10_DEGREE;
  if (key === "2015 2") return CIE_2015_2_DEGREE;
  if (key === "2015 10") return CIE_2015_10_DEGREE;
  throw new Error(`unknown observer "${which}": use "2°" (CIE 1931) or "10°" (CIE 1964)`);
}

/**
 * The colour-matching functions x̄, ȳ, z̄ at one wavelength, linearly interpolated between the 1 nm table values; zero outside 360–830 nm.
 *
 * @param obs An `Observer` (e.g. `CIE_1931_2_DEGREE`).
 * @param wavelength The wavelength, in nm.
 * @returns [x̄, ȳ, z̄] (dimensionless; ȳ is V(λ) for the 2° observer).
 * @source ISO/CIE 11664-1:2019 (the tables); linear interpolation between 1 nm values is common practice with no source.
 * @example colourMatchingAt(CIE_1931_2_DEGREE, 555.5)
 */
export function colourMatchingAt(obs: Observer, wavelength: number): [number, number, number] {
  checkWith(
    "colourMatchingAt",
    "obs",
    obs,
    "an observer object (from observerByName)",
    (o) => typeof o === "object" && o !== null && (o as { kind?: unknown }).kind === "observer",
    { instead: { string: 'for an observer by name use colourMatchingAt(observerByName("2°"), wavelength)' } },
  );
  checkNumber("colourMatchingAt", "wavelength", wavelength, { unit: "nm" });
  const u = (wavelength - obs.start) / obs.step;
  const n = obs.xBar.length;
  if (u < 0 || u > n - 1) return [0, 0, 0];
  const i = Math.min(Math.floor(u), n - 2);
  const t = u - i;
  if (t === 0) return [obs.xBar[i]!, obs.yBar[i]!, obs.zBar[i]!];
  const lerp = (a: readonly number[]) => a[i]! + t * (a[i + 1]! - a[i]!);
  return [lerp(obs.xBar), lerp(obs.yBar), lerp(obs.zBar)];
}
