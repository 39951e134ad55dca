/**
 * Drive levels of four or more primaries that reach a target chromaticity and luminance with the highest luminous
 * efficacy of radiation: a linear programme (least radiant power at fixed X, Y, Z, levels within 0–maxLevel),
 * solved exactly by visiting its vertices.
 */
import { fromXyY, type ChromaticityLuminance, type Tristimulus } from "../colorimetry/chromaticity.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { requireSameGrid } from "../filters/checks.ts";
import { checkFields, XYY_FIELDS } from "../arguments/check-fields.ts";
import { checkSpectrumList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkObserver } from "../arguments/common-arguments.ts";
import { lightXYZ, type DriveOptions } from "./drive-levels.ts";
import { solveSquare } from "../camera/linear-algebra.ts";

/** The objective this solver uses, as reports state it. */
export const EFFICACY_OBJECTIVE =
  "the highest luminous efficacy of radiation (least radiant power) at the target chromaticity and luminance";

/** The result of `mostEfficientDriveLevels`. */
export interface EfficientDriveSolution {
  /** False when no levels within 0–maxLevel reach the target. */
  readonly reachable: boolean;
  /** One level per primary, in order (all 0 when unreachable). */
  readonly levels: readonly number[];
  readonly primaries: readonly string[];
  readonly target: Tristimulus;
  readonly achieved: Tristimulus;
  /** Σ levelᵢ · ∫ Sᵢ(λ) dλ, in the primaries' radiometric unit (trapezoidal integration). */
  readonly radiantPower: number;
  /** Y / radiant power: lm/W when the primaries are in W/nm. */
  readonly luminousEfficacy: number;
  /** The objective that was optimised, in words. */
  readonly objective: string;
}

function integral(s: Spectrum): number {
  let a = 0;
  for (let i = 1; i < s.wavelengths.length; i++)
    a += 0.5 * (s.values[i]! + s.values[i - 1]!) * (s.wavelengths[i]! - s.wavelengths[i - 1]!);
  return a;
}

/**
 * Drive levels that reach a target chromaticity and luminance with the highest luminous efficacy of radiation, within 0 ≤ level ≤ maxLevel (an objective beyond least squares).
 *
 * With X, Y, Z fixed, the highest efficacy is the least radiant power Σ levelᵢ Pᵢ: a linear programme whose optimum
 * is at a vertex where at most three levels lie strictly between their bounds. Every vertex is visited (up to 10
 * primaries), so the optimum is exact.
 *
 * @param primaries The primaries' spectra (radiometric, e.g. W/nm), on the same wavelengths.
 * @param target { x, y, Y }: CIE 1931 chromaticity and luminance in the units `lightXYZ` gives the primaries.
 * @param options.observer The observer; default the CIE 1931 2° observer.
 * @param options.maxLevel The highest level of a primary; default no upper limit.
 * @returns { reachable, levels, primaries, target, achieved, radiantPower, luminousEfficacy, objective }.
 * @source Linear programming (Dantzig 1963: an optimum lies at a basic feasible solution); Grassmann additivity (CIE 015:2018 §7); luminous efficacy of radiation (CIE S 017:2020 17-21-080).
 * @example mostEfficientDriveLevels([450, 530, 590, 630].map((peak) => ledSpectrum({ peak, fwhm: 25 })), { x: 0.3127, y: 0.329, Y: 100 }).luminousEfficacy
 */
export function mostEfficientDriveLevels(
  primaries: readonly Spectrum[],
  target: ChromaticityLuminance,
  options: DriveOptions = {},
): EfficientDriveSolution {
  checkSpectrumList("mostEfficientDriveLevels", "primaries", primaries, { minLength: 3 });
  checkFields("mostEfficientDriveLevels", "target", target, {
    ...XYY_FIELDS,
    what: "a target { x, y, Y } (Y in the primaries' units)",
  });
  checkOptions("mostEfficientDriveLevels", "options", options, ["observer", "maxLevel"]);
  checkObserver("mostEfficientDriveLevels", "options.observer", options.observer);
  checkNumber("mostEfficientDriveLevels", "options.maxLevel", options.maxLevel, { optional: true, above: 0 });
  if (primaries.length > 10)
    throw new Error(
      `mostEfficientDriveLevels: ${primaries.length} primaries; at most 10 are searched exactly`,
    );
  requireSameGrid(primaries, "mostEfficientDriveLevels");
  if (!(target.y > 0) || target.x < 0 || target.x + target.y > 1 || !(target.Y > 0))
    throw new Error(
      `mostEfficientDriveLevels: (x, y, Y) = (${target.x}, ${target.y}, ${target.Y}) is not a reachable physical target`,
    );
  const max = options.maxLevel ?? Infinity;
  const xyz = primaries.map((p) => lightXYZ(p, options.observer));
  const power = primaries.map(integral);
  const goal = fromXyY(target);
  const b = [goal.X, goal.Y, goal.Z];
  const A = [0, 1, 2].map((r) => xyz.map((t) => (r === 0 ? t.X : r === 1 ? t.Y : t.Z)));
  const n = primaries.length;
  let best: number[] | undefined;
  let bestCost = Infinity;
  const tol = 1e-9 * Math.max(1, ...b.map(Math.abs));
  // Basic sets of three primaries; the others at 0 or (when bounded) at maxLevel.
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++)
      for (let k = j + 1; k < n; k++) {
        const basic = [i, j, k];
        const others = [...Array(n).keys()].filter((q) => !basic.includes(q));
        const patterns = Number.isFinite(max) ? 1 << others.length : 1;
        for (let mask = 0; mask < patterns; mask++) {
          const levels = new Array<number>(n).fill(0);
          others.forEach((q, bit) => (levels[q] = mask & (1 << bit) ? max : 0));
          const rhs = b.map((v, r) => v - others.reduce((s, q) => s + A[r]![q]! * levels[q]!, 0));
          const x = solveSquare(
            [0, 1, 2].map((r) => basic.map((q) => A[r]![q]!)),
            rhs,
          );
          if (!x) continue;
          if (x.some((v) => v < -1e-12 * Math.max(1, max === Infinity ? 1 : max) || v > max * (1 + 1e-12)))
            continue;
          basic.forEach((q, a) => (levels[q] = Math.min(max, Math.max(0, x[a]!))));
          const cost = levels.reduce((s, v, q) => s + v * power[q]!, 0);
          if (cost < bestCost) {
            bestCost = cost;
            best = levels;
          }
        }
      }
  noteMethod(
    "mixing",
    `Drive levels were chosen for ${EFFICACY_OBJECTIVE}, within 0 ≤ level ≤ ${Number.isFinite(max) ? max : "∞"}, by visiting every vertex of the linear programme (radiant power by trapezoidal integration).`,
  );
  const levels = best ?? new Array<number>(n).fill(0);
  const achieved = {
    X: levels.reduce((s, v, q) => s + v * xyz[q]!.X, 0),
    Y: levels.reduce((s, v, q) => s + v * xyz[q]!.Y, 0),
    Z: levels.reduce((s, v, q) => s + v * xyz[q]!.Z, 0),
  };
  const reachable =
    best !== undefined &&
    Math.abs(achieved.X - goal.X) + Math.abs(achieved.Y - goal.Y) + Math.abs(achieved.Z - goal.Z) <
      3 * tol + 1e-9 * goal.Y;
  return {
    reachable,
    levels,
    primaries: primaries.map((p) => p.name),
    target: goal,
    achieved,
    radiantPower: best ? bestCost : 0,
    luminousEfficacy: best && bestCost > 0 ? achieved.Y / bestCost : 0,
    objective: EFFICACY_OBJECTIVE,
  };
}
