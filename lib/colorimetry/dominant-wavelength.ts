/**
 * Dominant (or complementary) wavelength and excitation purity of a chromaticity relative to a white
 * (CIE 015:2018 §9.1–9.2): the line from the white through the colour meets the spectrum locus, or, for purples,
 * the purple line, in which case the opposite direction gives the complementary wavelength.
 */
import { noteMethod } from "../methods/method-log.ts";
import { observerByName, type Observer, type ObserverName } from "../observers/standard-observer.ts";
import type { Chromaticity } from "./chromaticity.ts";
import { XY_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkObserver } from "../arguments/common-arguments.ts";

export interface DominantWavelength {
  /** The dominant wavelength in nm, or the complementary wavelength when `complementary` is true. */
  readonly wavelength: number;
  /** True for purples: the colour lies towards the purple line, so the wavelength given is the complementary one. */
  readonly complementary: boolean;
  /** Excitation purity pe = |white→colour| / |white→boundary| (CIE 015:2018 eq. 9.1); above 1 means outside the locus. */
  readonly purity: number;
}

interface LocusPoint {
  readonly wavelength: number;
  readonly x: number;
  readonly y: number;
}

const loci = new Map<string, LocusPoint[]>();

/**
 * The spectrum locus of an observer in CIE 1931 xy at its 1 nm wavelengths, up to where the locus stops turning at the long-wavelength end.
 *
 * The CIE 1931 locus stays at one point above about 700 nm; the 1964 one turns back. Cached per observer.
 *
 * @param observer "2°" or "10°" (see `observerByName`) or an `Observer`; default "2°".
 * @returns [{ wavelength (nm), x, y }, ...] from the shortest wavelength.
 * @source ISO/CIE 11664-1:2019 (colour-matching functions); the cut at the long-wavelength end is common practice with no source.
 * @example spectrumLocus("2°").length
 */
export function spectrumLocus(observer: ObserverName | Observer | 2 | 10 = "2°"): readonly LocusPoint[] {
  checkObserver("spectrumLocus", "observer", observer);
  const obs = observerByName(observer);
  let locus = loci.get(obs.name);
  if (!locus) {
    const all = obs.wavelengths.map((wavelength, i) => {
      const s = obs.xBar[i]! + obs.yBar[i]! + obs.zBar[i]!;
      return { wavelength, x: obs.xBar[i]! / s, y: obs.yBar[i]! / s };
    });
    // Keep the long-wavelength end only while the locus still moves clockwise round the equal-energy point.
    const angle = (p: LocusPoint) => Math.atan2(p.y - 1 / 3, p.x - 1 / 3);
    let end = all.length - 1;
    for (let i = all.findIndex((p) => p.wavelength >= 600); i > 0 && i < all.length; i++) {
      if (angle(all[i]!) >= angle(all[i - 1]!)) {
        end = i - 1;
        break;
      }
    }
    locus = all.slice(0, end + 1);
    loci.set(obs.name, locus);
  }
  return locus;
}

/** Where the ray from `w` in direction (dx, dy) meets segment a–b: ray parameter t (> 0) and position s along a–b (0–1). */
function raySegment(
  w: Chromaticity,
  dx: number,
  dy: number,
  a: LocusPoint,
  b: LocusPoint,
): { t: number; s: number } | undefined {
  const ex = b.x - a.x,
    ey = b.y - a.y;
  const den = dx * ey - dy * ex;
  if (den === 0) return undefined;
  const ax = a.x - w.x,
    ay = a.y - w.y;
  const t = (ax * ey - ay * ex) / den;
  const s = (ax * dy - ay * dx) / den;
  if (t <= 0 || s < -1e-12 || s > 1 + 1e-12) return undefined;
  return { t, s: Math.min(Math.max(s, 0), 1) };
}

function checkXy(what: string, c: Chromaticity): void {
  if (typeof c !== "object" || c === null || !Number.isFinite(c.x) || !Number.isFinite(c.y)) {
    throw new Error(`dominantWavelength: ${what} (${c?.x}, ${c?.y}) must be two finite numbers`);
  }
}

/**
 * Dominant (or, for purples, complementary) wavelength and excitation purity of a chromaticity relative to a white.
 *
 * The line from the white through the colour meets the spectrum locus, or, for purples, the purple line, in which case
 * the opposite direction gives the complementary wavelength.
 *
 * @param xy The colour's chromaticity { x, y } (CIE 1931).
 * @param white The white's chromaticity { x, y }, e.g. `chromaticityXy(whitePoint({ illuminant: "D65" }))`.
 * @param observer The observer whose spectrum locus is used: "2°" or "10°" or an `Observer`; default "2°".
 * @returns { wavelength (nm), complementary (true for purples: the wavelength is the complementary one), purity (excitation purity pe, fraction; above 1 outside the locus) }.
 * @source CIE 015:2018 §9.1–9.2 (eq. 9.1 for excitation purity).
 * @example dominantWavelength({ x: 0.45, y: 0.45 }, { x: 0.3127, y: 0.329 })
 */
export function dominantWavelength(
  xy: Chromaticity,
  white: Chromaticity,
  observer: ObserverName | Observer | 2 | 10 = "2°",
): DominantWavelength {
  checkFields("dominantWavelength", "xy", xy, XY_FIELDS);
  checkFields("dominantWavelength", "white", white, {
    ...XY_FIELDS,
    what: "the white's chromaticity { x, y }",
  });
  checkObserver("dominantWavelength", "observer", observer);
  checkXy("the colour", xy);
  checkXy("the white", white);
  const dx = xy.x - white.x,
    dy = xy.y - white.y;
  const dist = Math.hypot(dx, dy);
  if (dist < 1e-9)
    throw new Error(
      `dominantWavelength: the colour (${xy.x}, ${xy.y}) coincides with the white, so it has no dominant wavelength`,
    );
  const locus = spectrumLocus(observer);
  const obs = observerByName(observer);
  noteMethod(
    "colour space",
    `Dominant or complementary wavelengths and excitation purities were determined per CIE 015:2018 §9.1–9.2 on the spectrum locus of the ${obs.name} (1 nm, ${locus[0]!.wavelength}–${locus.at(-1)!.wavelength} nm), closed by the purple line.`,
  );
  const spectral = (ddx: number, ddy: number) => {
    let best: { t: number; wavelength: number } | undefined;
    for (let i = 0; i + 1 < locus.length; i++) {
      const hit = raySegment(white, ddx, ddy, locus[i]!, locus[i + 1]!);
      if (hit && (!best || hit.t < best.t))
        best = {
          t: hit.t,
          wavelength: locus[i]!.wavelength + hit.s * (locus[i + 1]!.wavelength - locus[i]!.wavelength),
        };
    }
    return best;
  };
  const purple = raySegment(white, dx, dy, locus[0]!, locus.at(-1)!);
  const forward = spectral(dx, dy);
  if (forward && (!purple || forward.t <= purple.t)) {
    return { wavelength: forward.wavelength, complementary: false, purity: 1 / forward.t };
  }
  if (!purple)
    throw new Error(`dominantWavelength: the white (${white.x}, ${white.y}) lies outside the spectrum locus`);
  const back = spectral(-dx, -dy);
  if (!back)
    throw new Error(
      `dominantWavelength: no complementary wavelength for (${xy.x}, ${xy.y}) relative to (${white.x}, ${white.y})`,
    );
  return { wavelength: back.wavelength, complementary: true, purity: 1 / purple.t };
}
