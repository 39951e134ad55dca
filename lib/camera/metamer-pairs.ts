/**
 * Pairs of reflectances that the eye matches and the camera does not, or the reverse: a smooth perturbation of a
 * base reflectance in the null space of one system's weighting functions (a metameric black of that system,
 * Wyszecki 1958) that the other system sees as much as possible.
 */
import { withoutMethodNotes, noteMethod } from "../methods/method-log.ts";
import {
  colourMatchingAt,
  observerByName,
  type Observer,
  type ObserverName,
} from "../observers/standard-observer.ts";
import { illuminant as illuminantByName } from "../illuminants/standard-illuminant.ts";
import { sampler } from "../spectrum/sample.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { objectColour } from "../colorimetry/tristimulus.ts";
import { labFromXYZ } from "../colorimetry/cielab.ts";
import { deltaE2000 } from "../difference/delta-e-2000.ts";
import type { Rgb } from "../rgb/rgb-conversion.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkIlluminantChoice, checkObserver } from "../arguments/common-arguments.ts";
import { checkCameraSensor, type CameraSensor } from "./camera-sensor.ts";
import { cameraRgb } from "./camera-rgb.ts";
import { orthonormalBasis } from "./linear-algebra.ts";

export interface MetamerPairOptions {
  /** Which system sees the pair as a match: "eye" (default: the camera tells them apart) or "camera" (the eye does). */
  matchFor?: "eye" | "camera";
  /** The observer; default "2°". */
  observer?: ObserverName | Observer | 2 | 10;
  /** The illuminant; default "D65". */
  illuminant?: string;
}

/** A pair of reflectances and how the eye and the camera see them. */
export interface MetamerPair {
  readonly a: Spectrum;
  readonly b: Spectrum;
  /** CIEDE2000 between a and b for the observer under the illuminant. */
  readonly eyeDeltaE00: number;
  readonly cameraRgbA: Rgb;
  readonly cameraRgbB: Rgb;
  /** The largest channel difference |ρa − ρb| of the white-balanced camera RGB. */
  readonly cameraDifference: number;
}

/** The unit vector v in span(null(C)) that maximises ‖D v‖ (power iteration on P DᵀD P). */
function bestInNullSpace(C: number[][], D: number[][]): number[] {
  const k = C[0]!.length;
  const q = orthonormalBasis(C);
  // Two passes: a vector that lies almost wholly in the row space (as DᵀDv does when D sees what C sees) leaves,
  // after one pass, a rounding residue that points anywhere; the second pass removes its row-space part.
  const project = (v: number[]) => {
    const u = [...v];
    for (let pass = 0; pass < 2; pass++)
      for (const b of q) {
        const d = u.reduce((s, x, i) => s + x * b[i]!, 0);
        for (let i = 0; i < k; i++) u[i]! -= d * b[i]!;
      }
    return u;
  };
  const mulDtD = (v: number[]) => {
    const dv = D.map((row) => row.reduce((s, x, i) => s + x * v[i]!, 0));
    return Array.from({ length: k }, (_, i) => D.reduce((s, row, r) => s + row[i]! * dv[r]!, 0));
  };
  let v = project(Array.from({ length: k }, (_, i) => Math.sin(1 + i * 1.7)));
  for (let it = 0; it < 300; it++) {
    const w = project(mulDtD(v));
    const n = Math.hypot(...w);
    if (!(n > 0)) break;
    v = w.map((x) => x / n);
  }
  const u = project(v);
  const n = Math.hypot(...u);
  return u.map((x) => x / n);
}

/**
 * A pair of smooth reflectances that the eye sees as a match and the camera does not (or, with matchFor "camera", the reverse), made from a base reflectance.
 *
 * The two are base ± t·d, with d a combination of 16 smooth Gaussian bumps (400–700 nm) that the matching system
 * does not see (a metameric black) and the other sees as strongly as possible; t is 90 % of the largest step that
 * keeps both within 0–1.
 *
 * @param base A reflectance spectrum (fractions 0–1), preferably away from 0 and 1.
 * @param sensor The `CameraSensor`.
 * @param options.matchFor "eye" (default) or "camera".
 * @param options.observer The observer; default "2°".
 * @param options.illuminant The illuminant name; default "D65".
 * @returns { a, b, eyeDeltaE00, cameraRgbA, cameraRgbB, cameraDifference }.
 * @source Wyszecki, J. Opt. Soc. Am. 48 (1958) 451–454 (metameric blacks); Cohen & Kappauf, Am. J. Psychol. 95 (1982) 537–564 (null-space decomposition).
 * @example metamerPair(spectrumOnGrid(380, 5, new Array(81).fill(0.5), { quantity: "reflectance" }), inventedCameraSensor()).eyeDeltaE00
 */
export function metamerPair(
  base: Spectrum,
  sensor: CameraSensor,
  options: MetamerPairOptions = {},
): MetamerPair {
  checkSpectrum("metamerPair", "base", base, { what: "a reflectance spectrum (fractions 0–1)" });
  checkCameraSensor("metamerPair", sensor);
  checkOptions("metamerPair", "options", options, ["matchFor", "observer", "illuminant"]);
  checkChoice("metamerPair", "options.matchFor", options.matchFor, ["eye", "camera"], { optional: true });
  checkObserver("metamerPair", "options.observer", options.observer);
  checkIlluminantChoice("metamerPair", "options.illuminant", options.illuminant);
  const matchFor = options.matchFor ?? "eye";
  const obs = observerByName(options.observer ?? "2°");
  const illName = options.illuminant ?? "D65";
  const ill = illuminantByName(illName);
  const readIll = sampler(ill, { extrapolation: "zero" });
  const readBase = sampler(base);
  const wl = sensor.wavelengths;
  const e = wl.map((w) => readIll(w));
  const eye = [0, 1, 2].map((c) => wl.map((w, i) => e[i]! * colourMatchingAt(obs, w)[c]!));
  const cam = [sensor.r, sensor.g, sensor.b].map((ch) => ch.map((v, i) => v * e[i]!));
  const bumps = Array.from({ length: 16 }, (_, j) => 400 + (300 * j) / 15).map((c) =>
    wl.map((w) => Math.exp(-0.5 * ((w - c) / 12) ** 2)),
  );
  const restrict = (rows: number[][]) =>
    rows.map((row) => bumps.map((bp) => bp.reduce((s, x, i) => s + x * row[i]!, 0)));
  const [keep, see] = matchFor === "eye" ? [eye, cam] : [cam, eye];
  const seen = restrict(see);
  const v = bestInNullSpace(restrict(keep), seen);
  const seenNorm = Math.hypot(...seen.flat());
  const seenOfV = Math.hypot(...seen.map((row) => row.reduce((s, x, i) => s + x * v[i]!, 0)));
  if (!(seenOfV > 1e-9 * seenNorm))
    throw new Error(
      `metamerPair: every smooth metameric black of the ${matchFor === "eye" ? "eye" : "camera"} is one of the ${matchFor === "eye" ? "camera" : "eye"}'s too (the camera meets the Luther–Ives condition), so no such pair exists`,
    );
  const d = wl.map((_, i) => bumps.reduce((s, bp, j) => s + v[j]! * bp[i]!, 0));
  const r0 = wl.map((w) => readBase(w));
  if (r0.some((x) => x < 0 || x > 1))
    throw new Error(`metamerPair: "${base.name}" must be a reflectance within 0–1 (fractions, not percent)`);
  let tMax = Infinity;
  for (let i = 0; i < wl.length; i++) {
    const di = Math.abs(d[i]!);
    if (di < 1e-15) continue;
    tMax = Math.min(tMax, Math.min(r0[i]!, 1 - r0[i]!) / di);
  }
  const t = 0.9 * tMax;
  if (!(t > 0) || !Number.isFinite(t))
    throw new Error(
      `metamerPair: "${base.name}" touches 0 or 1 where the pair must differ; use a base away from 0 and 1`,
    );
  const a = spectrum(
    wl,
    r0.map((x, i) => x + t * d[i]!),
    { name: `${base.name} + metameric black`, quantity: "reflectance" },
  );
  const b = spectrum(
    wl,
    r0.map((x, i) => x - t * d[i]!),
    { name: `${base.name} − metameric black`, quantity: "reflectance" },
  );
  const { eyeDeltaE00, ra, rb } = withoutMethodNotes(() => {
    const ca = objectColour(a, { illuminant: illName, observer: obs, interval: 5 });
    const cb = objectColour(b, { illuminant: illName, observer: obs, interval: 5 });
    return {
      eyeDeltaE00: deltaE2000(labFromXYZ(ca.XYZ, ca.white), labFromXYZ(cb.XYZ, cb.white)),
      ra: cameraRgb(a, sensor, { illuminant: illName }),
      rb: cameraRgb(b, sensor, { illuminant: illName }),
    };
  });
  noteMethod(
    "other",
    `Metameric pairs were made from "${base.name}" by adding and subtracting a smooth metameric black of the ${matchFor === "eye" ? obs.name : sensor.name} under ${ill.name} (16 Gaussian bumps of 12 nm standard deviation, 400–700 nm).`,
  );
  return {
    a,
    b,
    eyeDeltaE00,
    cameraRgbA: ra,
    cameraRgbB: rb,
    cameraDifference: Math.max(Math.abs(ra.r - rb.r), Math.abs(ra.g - rb.g), Math.abs(ra.b - rb.b)),
  };
}
