/**
 * The spectral locus: chromaticities of monochromatic stimuli, x = x̄/(x̄+ȳ+z̄), y = ȳ/(x̄+ȳ+z̄) from the observer's
 * colour-matching functions (CIE 015:2018 §7.3 applied to a single wavelength), and the purple line joining its ends.
 */
import { observerByName, type Observer, type ObserverName } from "../observers/standard-observer.ts";
import type { Chromaticity } from "../colorimetry/chromaticity.ts";
import { diagramPoint, type DiagramSpace } from "./chromaticity-space.ts";

export interface LocusPoint {
  readonly wavelength: number;
  readonly xy: Chromaticity;
  /** Diagram coordinates [horizontal, vertical]. */
  readonly at: [number, number];
}

/** Points of the spectral locus at the observer's 1 nm table wavelengths between `from` and `to` nm (default 380–780 nm). */
export function spectralLocus(
  observer: ObserverName | Observer | 2 | 10 = "2°",
  space: DiagramSpace = "xy",
  from = 380,
  to = 780,
): LocusPoint[] {
  const obs = observerByName(observer);
  if (!(from < to)) throw new Error(`spectral locus: range ${from}–${to} nm must increase`);
  if (from < obs.wavelengths[0]! || to > obs.wavelengths.at(-1)!) {
    throw new Error(
      `spectral locus: ${from}–${to} nm is outside the observer's table (${obs.wavelengths[0]}–${obs.wavelengths.at(-1)} nm)`,
    );
  }
  const out: LocusPoint[] = [];
  for (let i = 0; i < obs.wavelengths.length; i++) {
    const w = obs.wavelengths[i]!;
    if (w < from || w > to) continue;
    const s = obs.xBar[i]! + obs.yBar[i]! + obs.zBar[i]!;
    if (!(s > 0)) continue;
    const xy = { x: obs.xBar[i]! / s, y: obs.yBar[i]! / s };
    out.push({ wavelength: w, xy, at: diagramPoint(xy, space) });
  }
  return out;
}

/** The locus point at a wavelength (nm), from the observer's colour-matching functions read at that wavelength. */
export function locusPointAt(observer: Observer, wavelength: number, space: DiagramSpace): LocusPoint {
  const i = Math.round((wavelength - observer.start) / observer.step);
  if (i < 0 || i >= observer.wavelengths.length || Math.abs(observer.wavelengths[i]! - wavelength) > 1e-9) {
    throw new Error(`spectral locus: ${wavelength} nm is not a tabulated wavelength of the ${observer.name}`);
  }
  const s = observer.xBar[i]! + observer.yBar[i]! + observer.zBar[i]!;
  const xy = { x: observer.xBar[i]! / s, y: observer.yBar[i]! / s };
  return { wavelength, xy, at: diagramPoint(xy, space) };
}
