/**
 * Geometry of the Planckian locus for drawing: blackbody chromaticities for either observer (Planck's law with
 * c2 = 1.4388e-2 m·K summed against the observer's 1 nm colour-matching functions, CIE 015:2018 §9.1), isotemperature
 * lines normal to the locus in the CIE 1960 UCS diagram and lines of constant Duv (CIE 015:2018 §9.4: CCT and Duv
 * are defined with the CIE 1931 observer in the (u, v) = (u′, 2/3 v′) diagram; Duv > 0 above the locus).
 */
import { planckExitance, C2_CIE } from "../illuminants/planckian-radiator.ts";
import { observerByName, type Observer, type ObserverName } from "../observers/standard-observer.ts";
import { uv1960FromXy, xyFromUv1960, type Chromaticity, type Uv1960 } from "../colorimetry/chromaticity.ts";

/** Blackbody chromaticity at T kelvin for an observer (Planck's law summed at the observer's 1 nm table, CIE 015:2018 §9.1). */
export function blackbodyChromaticity(temperatureK: number, observer: ObserverName | Observer | 2 | 10 = "2°"): Chromaticity {
  if (!(temperatureK >= 500 && temperatureK <= 1e7) || !Number.isFinite(temperatureK)) {
    throw new Error(`Planckian locus: temperature ${temperatureK} K is outside the drawn range 500 K – 10 000 000 K`);
  }
  const obs = observerByName(observer);
  let X = 0, Y = 0, Z = 0;
  for (let i = 0; i < obs.wavelengths.length; i++) {
    const m = planckExitance(obs.wavelengths[i]!, temperatureK, C2_CIE);
    X += m * obs.xBar[i]!;
    Y += m * obs.yBar[i]!;
    Z += m * obs.zBar[i]!;
  }
  const s = X + Y + Z;
  return { x: X / s, y: Y / s };
}

/** Unit normal to the Planckian locus at T in the CIE 1960 (u, v) diagram, pointing to positive Duv (towards +v). */
export function locusNormalUv(temperatureK: number): Uv1960 {
  const h = 1e-3; // relative step in reciprocal temperature
  const mired = 1e6 / temperatureK;
  const a = uv1960FromXy(blackbodyChromaticity(1e6 / (mired * (1 + h)), "2°"));
  const b = uv1960FromXy(blackbodyChromaticity(1e6 / (mired * (1 - h)), "2°"));
  const tu = a.u - b.u, tv = a.v - b.v;
  const len = Math.hypot(tu, tv);
  let n = { u: -tv / len, v: tu / len };
  if (n.v < 0) n = { u: -n.u, v: -n.v };
  return n;
}

/** The chromaticity at CCT T and distance Duv from the locus, along the isotemperature line (CIE 015:2018 §9.4). */
export function chromaticityAtCctDuv(temperatureK: number, duv: number): Chromaticity {
  if (!Number.isFinite(duv) || Math.abs(duv) > 0.1) throw new Error(`Duv ${duv} must be a finite number within ±0.1`);
  const p = uv1960FromXy(blackbodyChromaticity(temperatureK, "2°"));
  const n = locusNormalUv(temperatureK);
  return xyFromUv1960({ u: p.u + duv * n.u, v: p.v + duv * n.v });
}

/** The isotemperature line of T from Duv = −extent to +extent, as two xy end points (CIE 1931 observer). */
export function isotemperatureLine(temperatureK: number, extent = 0.02): [Chromaticity, Chromaticity] {
  if (!(extent > 0 && extent <= 0.1)) throw new Error(`isotemperature line: extent ${extent} must lie in (0, 0.1]`);
  return [chromaticityAtCctDuv(temperatureK, -extent), chromaticityAtCctDuv(temperatureK, extent)];
}

/** Temperatures spaced evenly in reciprocal temperature (mired) from `from` to `to` kelvin, `count` of them. */
export function temperaturesByMired(from: number, to: number, count: number): number[] {
  if (!(from > 0 && to > from) || !Number.isInteger(count) || count < 2) throw new Error(`temperatures: need 0 < ${from} K < ${to} K and a count ≥ 2 (got ${count})`);
  const m0 = 1e6 / from, m1 = 1e6 / to;
  return Array.from({ length: count }, (_, i) => 1e6 / (m0 + ((m1 - m0) * i) / (count - 1)));
}
