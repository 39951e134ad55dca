/**
 * Geometry of the Planckian locus for drawing: blackbody chromaticities for either observer (Planck's law with
 * c2 = 1.4388e-2 m·K summed against the observer's 1 nm colour-matching functions, CIE 015:2018), and
 * isotemperature lines normal to the locus in the CIE 1960 UCS diagram (CCT and Duv are defined with the CIE 1931
 * observer in the (u, v) = (u′, 2/3 v′) diagram, Duv > 0 above the locus; points come from lib/temperature).
 */
import { planckExitance, C2_CIE } from "../illuminants/planckian-radiator.ts";
import { observerByName, type Observer, type ObserverName } from "../observers/standard-observer.ts";
import { chromaticityAtCct } from "../temperature/cct.ts";
import type { Chromaticity } from "../colorimetry/chromaticity.ts";

/** Blackbody chromaticity at T kelvin for an observer (Planck's law summed at the observer's 1 nm table, CIE 015:2018). */
export function blackbodyChromaticity(
  temperatureK: number,
  observer: ObserverName | Observer | 2 | 10 = "2°",
): Chromaticity {
  if (!(temperatureK >= 500 && temperatureK <= 1e7) || !Number.isFinite(temperatureK)) {
    throw new Error(
      `Planckian locus: temperature ${temperatureK} K is outside the drawn range 500 K – 10 000 000 K`,
    );
  }
  const obs = observerByName(observer);
  let X = 0,
    Y = 0,
    Z = 0;
  for (let i = 0; i < obs.wavelengths.length; i++) {
    const m = planckExitance(obs.wavelengths[i]!, temperatureK, C2_CIE);
    X += m * obs.xBar[i]!;
    Y += m * obs.yBar[i]!;
    Z += m * obs.zBar[i]!;
  }
  const s = X + Y + Z;
  return { x: X / s, y: Y / s };
}

/**
 * The chromaticity at CCT T and Duv (CIE 015:2018, via lib/temperature), or, where that point would leave the
 * range of real colours (near the spectral locus at low temperatures), the last real point on the way there
 * (found by bisection on Duv).
 */
export function chromaticityAtCctClipped(temperatureK: number, duv: number): Chromaticity {
  try {
    return chromaticityAtCct(temperatureK, duv);
  } catch (e) {
    if (!(e instanceof Error) || !/range of real colours/.test(e.message)) throw e;
    let lo = 0,
      hi = Math.abs(duv);
    for (let i = 0; i < 30; i++) {
      const mid = (lo + hi) / 2;
      try {
        chromaticityAtCct(temperatureK, Math.sign(duv) * mid);
        lo = mid;
      } catch {
        hi = mid;
      }
    }
    return chromaticityAtCct(temperatureK, Math.sign(duv) * lo);
  }
}

/** The isotemperature line of T from Duv = −extent to +extent, as two xy end points (CIE 1931 observer; CIE 015:2018), shortened where it would leave the real colours. */
export function isotemperatureLine(temperatureK: number, extent = 0.02): [Chromaticity, Chromaticity] {
  if (!(extent > 0 && extent <= 0.05))
    throw new Error(`isotemperature line: extent ${extent} must lie in (0, 0.05]`);
  return [chromaticityAtCctClipped(temperatureK, -extent), chromaticityAtCctClipped(temperatureK, extent)];
}

/** Temperatures spaced evenly in reciprocal temperature (mired) from `from` to `to` kelvin, `count` of them. */
export function temperaturesByMired(from: number, to: number, count: number): number[] {
  if (!(from > 0 && to > from) || !Number.isInteger(count) || count < 2)
    throw new Error(`temperatures: need 0 < ${from} K < ${to} K and a count ≥ 2 (got ${count})`);
  const m0 = 1e6 / from,
    m1 = 1e6 / to;
  return Array.from({ length: count }, (_, i) => 1e6 / (m0 + ((m1 - m0) * i) / (count - 1)));
}
