/**
 * Drive levels of primaries (lights) that reproduce a target chromaticity and luminance. By Grassmann additivity the
 * mixture's X, Y, Z are Σ levelᵢ·(Xᵢ, Yᵢ, Zᵢ) (CIE 015:2018 §7), so three primaries give one exact linear solution
 * and more primaries are solved by non-negative least squares (Lawson & Hanson 1974). A target is out of reach
 * when it needs a negative level (outside the primaries' chromaticity gamut) or a level above `maxLevel`.
 */
import {
  chromaticityXy,
  fromXyY,
  type ChromaticityLuminance,
  type Tristimulus,
} from "../colorimetry/chromaticity.ts";
import { lightTristimulus } from "../colorimetry/tristimulus.ts";
import { requireFinite, requirePositive, requireSameGrid } from "../filters/checks.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Observer, ObserverName } from "../observers/standard-observer.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { nonNegativeLeastSquares, solveAugmented } from "./nnls.ts";
import { XYY_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkSpectrumList } from "../arguments/check-list.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkObserver } from "../arguments/common-arguments.ts";

export interface DriveOptions {
  /** Observer for the primaries' tristimulus values: "2°" or "10°" or an `Observer`; default the CIE 1931 2° observer. */
  observer?: ObserverName | Observer | 2 | 10;
  /** The highest drive level a primary can take (e.g. 1 for full output); default: no upper limit. */
  maxLevel?: number;
}

export interface DriveSolution {
  /** True when the levels reproduce the target within 1e-6 (relative) and respect 0 ≤ level ≤ maxLevel. */
  readonly reachable: boolean;
  /** One level per primary, in the order given. For three primaries and an unreachable target these are the exact (possibly negative or too high) levels. */
  readonly levels: readonly number[];
  readonly primaries: readonly string[];
  /** The target and what the levels actually give, as X, Y, Z and x, y, Y. */
  readonly target: Tristimulus;
  readonly achieved: Tristimulus;
  readonly achievedXyY: ChromaticityLuminance | null;
  /** ‖achieved − target‖ / ‖target‖ in X, Y, Z. */
  readonly relativeError: number;
  /** A sentence saying whether and why the target can or cannot be reached. */
  readonly message: string;
  readonly method: "exact (3 primaries)" | "non-negative least squares";
}

/**
 * Absolute X, Y, Z of a light with k = Km = 683 lm/W: a radiance in W/(sr·m²·nm) gives Y in cd/m²; relative spectra give Y in the same relative units.
 *
 * @param light A light's spectral distribution.
 * @param observer "2°" or "10°" or an `Observer`; default (absent) the CIE 1931 2° observer.
 * @returns { X, Y, Z } in the photometric unit of the spectrum's radiometric unit.
 * @source CIE 015:2018 eq. 7.5.
 * @example lightXYZ(ledSpectrum({ peak: 530, fwhm: 30 }))
 */
export function lightXYZ(light: Spectrum, observer?: DriveOptions["observer"]): Tristimulus {
  checkSpectrum("lightXYZ", "light", light, { what: "a spectrum of a light" });
  checkObserver("lightXYZ", "observer", observer);
  return lightTristimulus(light, { scale: "absolute", observer });
}

/**
 * Drive levels of primaries (lights) that reproduce a target chromaticity and luminance.
 *
 * By Grassmann additivity the mixture's X, Y, Z are Σ levelᵢ·(Xᵢ, Yᵢ, Zᵢ), so three primaries give one exact linear
 * solution and more primaries are solved by non-negative least squares. A target is out of reach when it needs a
 * negative level (outside the primaries' gamut) or a level above `maxLevel`.
 *
 * @param primaries The primaries' spectra, on the same wavelengths (each with luminance).
 * @param target { x, y, Y }: CIE 1931 chromaticity and luminance Y in the units `lightXYZ` gives the primaries.
 * @returns { reachable, levels (one per primary, in order), primaries (names), target, achieved, achievedXyY, relativeError, message, method }.
 * @source CIE 015:2018 §7 (additivity); Lawson & Hanson 1974, ch. 23 (NNLS).
 * @example solveDriveLevels([ledSpectrum({ peak: 630, fwhm: 20 }), ledSpectrum({ peak: 530, fwhm: 30 }), ledSpectrum({ peak: 460, fwhm: 20 })], { x: 0.3127, y: 0.329, Y: 50 }).levels
 */
export function solveDriveLevels(
  primaries: readonly Spectrum[],
  target: ChromaticityLuminance,
  options: DriveOptions = {},
): DriveSolution {
  checkSpectrumList("solveDriveLevels", "primaries", primaries, { minLength: 1 });
  checkFields("solveDriveLevels", "target", target, {
    ...XYY_FIELDS,
    what: "a target { x, y, Y } (Y in the primaries' units)",
  });
  checkOptions("solveDriveLevels", "options", options, ["observer", "maxLevel"]);
  if (!Array.isArray(primaries) || primaries.length === 0)
    throw new Error("solveDriveLevels: no primaries given");
  requireSameGrid(primaries, "solveDriveLevels");
  requireFinite(target?.x, "solveDriveLevels: target x");
  requireFinite(target?.y, "solveDriveLevels: target y");
  requirePositive(target.Y, "solveDriveLevels: target luminance Y");
  if (!(target.y > 0) || target.x < 0 || target.x + target.y > 1) {
    throw new Error(`solveDriveLevels: (x, y) = (${target.x}, ${target.y}) is not a physical chromaticity`);
  }
  const maxLevel =
    options.maxLevel === undefined
      ? Infinity
      : requirePositive(options.maxLevel, "solveDriveLevels: maxLevel");
  const t = fromXyY(target);
  const P = primaries.map((p) => lightXYZ(p, options.observer));
  P.forEach((p, i) => {
    if (!(p.Y > 0))
      throw new Error(`solveDriveLevels: primary "${primaries[i]!.name}" has no luminance (Y = ${p.Y})`);
  });
  const A = [P.map((p) => p.X), P.map((p) => p.Y), P.map((p) => p.Z)];
  const b = [t.X, t.Y, t.Z];
  const names = primaries.map((p) => p.name);
  let levels: number[];
  let method: DriveSolution["method"];
  if (primaries.length === 3) {
    method = "exact (3 primaries)";
    const solved = solveAugmented(A.map((row, i) => [...row, b[i]!]));
    if (!solved) {
      throw new Error(
        `solveDriveLevels: the primaries ${names.map((n) => `"${n}"`).join(", ")} are linearly dependent (their chromaticities lie on one line), so they span no gamut`,
      );
    }
    levels = solved;
  } else {
    method = "non-negative least squares";
    // Columns scaled to unit length so the active-set steps are well conditioned.
    const norms = P.map((p) => Math.hypot(p.X, p.Y, p.Z));
    const scaled = A.map((row) => row.map((v, j) => v / norms[j]!));
    levels = nonNegativeLeastSquares(scaled, b).map((v, j) => v / norms[j]!);
  }
  if (
    method === "non-negative least squares" &&
    Number.isFinite(maxLevel) &&
    levels.some((l) => l > maxLevel * (1 + 1e-9))
  ) {
    const bounded = boundedVertexSolution(A, b, maxLevel);
    if (bounded) levels = bounded;
  }
  const achieved: Tristimulus = {
    X: levels.reduce((s, l, j) => s + l * P[j]!.X, 0),
    Y: levels.reduce((s, l, j) => s + l * P[j]!.Y, 0),
    Z: levels.reduce((s, l, j) => s + l * P[j]!.Z, 0),
  };
  const relativeError =
    Math.hypot(achieved.X - t.X, achieved.Y - t.Y, achieved.Z - t.Z) / Math.hypot(t.X, t.Y, t.Z);
  const negative = levels.some((l) => l < -1e-9 * Math.max(...levels.map(Math.abs)));
  const tooHigh = levels.filter((l) => l > maxLevel * (1 + 1e-9));
  const matched = relativeError <= 1e-6 && !negative;
  const reachable = matched && tooHigh.length === 0;
  const where = `(x, y) = (${target.x.toFixed(4)}, ${target.y.toFixed(4)}), Y = ${+target.Y.toPrecision(6)}`;
  let message: string;
  if (!matched) {
    message = `Out of reach: ${where} lies outside the chromaticity gamut of ${names.join(", ")}; it would need a negative amount of at least one primary.`;
    if (method === "non-negative least squares")
      message += " The levels given are the closest non-negative mixture.";
  } else if (tooHigh.length > 0) {
    message = `Out of reach: ${where} is inside the gamut but needs a drive level of ${Math.max(...tooHigh).toPrecision(4)}, above the maximum ${maxLevel}; a lower luminance would be reachable.`;
  } else {
    message = `Reachable: ${where} is made with levels ${levels.map((l, j) => `${names[j]} ${l.toPrecision(4)}`).join(", ")}.`;
  }
  noteMethod(
    "mixing",
    `Drive levels of primaries were solved from the primaries' absolute tristimulus values (Km = 683 lm/W) by ${method === "exact (3 primaries)" ? "the exact 3×3 linear solution" : "non-negative least squares (Lawson & Hanson 1974)"}.`,
  );
  return {
    reachable,
    levels: levels.map((l) => (Math.abs(l) < 1e-15 ? 0 : l)),
    primaries: names,
    target: t,
    achieved,
    achievedXyY:
      achieved.X + achieved.Y + achieved.Z > 0 ? { ...chromaticityXy(achieved), Y: achieved.Y } : null,
    relativeError,
    message,
    method,
  };
}

/**
 * With more than three primaries and an upper limit, NNLS may exceed the limit although another mixture would not.
 * The set {Ax = b, 0 ≤ x ≤ u} is a polytope; if it is not empty it has a vertex with at most three levels strictly
 * between the bounds (linear programming, basic feasible solutions). This tries every such vertex (up to 12 primaries)
 * and returns the feasible one with the lowest total drive, or undefined when there is none.
 */
function boundedVertexSolution(
  A: readonly (readonly number[])[],
  b: readonly number[],
  upper: number,
): number[] | undefined {
  const n = A[0]!.length;
  if (n > 12) return undefined;
  let best: number[] | undefined;
  let bestSum = Infinity;
  const scale = Math.max(...b.map(Math.abs));
  for (let i = 0; i < n; i++)
    for (let j = i + 1; j < n; j++)
      for (let k = j + 1; k < n; k++) {
        const free = [i, j, k];
        const fixed = [...Array(n).keys()].filter((c) => !free.includes(c));
        for (let mask = 0; mask < 1 << fixed.length; mask++) {
          const x = new Array<number>(n).fill(0);
          fixed.forEach((c, q) => (x[c] = mask & (1 << q) ? upper : 0));
          const rhs = b.map((bi, r) => bi - fixed.reduce((s, c) => s + A[r]![c]! * x[c]!, 0));
          const z = solveAugmented(A.map((row, r) => [row[i]!, row[j]!, row[k]!, rhs[r]!]));
          if (!z || z.some((v) => v < -1e-9 * upper || v > upper * (1 + 1e-9))) continue;
          free.forEach((c, q) => (x[c] = Math.min(upper, Math.max(0, z[q]!))));
          const err = Math.hypot(...b.map((bi, r) => A[r]!.reduce((s, a, c) => s + a * x[c]!, 0) - bi));
          const sum = x.reduce((s, v) => s + v, 0);
          if (err <= 1e-9 * scale && sum < bestSum) {
            best = x;
            bestSum = sum;
          }
        }
      }
  return best;
}
