/**
 * CCT and Duv for hover readouts on chromaticity diagrams, by the definition of CIE 015:2018 §9.4: the temperature
 * of the closest point of the Planckian locus in the CIE 1960 (u, v) diagram (CIE 1931 observer), and the signed
 * distance to it, positive above the locus. Searched in mired (coarse scan, then golden-section refinement).
 * Reported only where the definition applies: |Duv| ≤ 0.05 (CIE 015:2018 §9.4) and 1000 K ≤ CCT ≤ 100 000 K.
 */
import { uv1960FromXy, type Chromaticity } from "../colorimetry/chromaticity.ts";
import { blackbodyChromaticity } from "./planckian-locus.ts";

const MIRED_MIN = 10, MIRED_MAX = 1000; // 100 000 K … 1000 K

function distance2(mired: number, u: number, v: number): number {
  const p = uv1960FromXy(blackbodyChromaticity(1e6 / mired, "2°"));
  return (p.u - u) ** 2 + (p.v - v) ** 2;
}

/** CCT (K) and Duv of an xy chromaticity, or undefined where CIE 015 does not define them. */
export function cctDuvForHover(xy: Chromaticity): { cct: number; duv: number } | undefined {
  const { u, v } = uv1960FromXy(xy);
  let best = MIRED_MIN, bestD = Infinity;
  for (let m = MIRED_MIN; m <= MIRED_MAX; m += 10) {
    const d = distance2(m, u, v);
    if (d < bestD) [best, bestD] = [m, d];
  }
  let a = Math.max(MIRED_MIN, best - 10), b = Math.min(MIRED_MAX, best + 10);
  const g = (Math.sqrt(5) - 1) / 2;
  let c = b - g * (b - a), d = a + g * (b - a);
  let fc = distance2(c, u, v), fd = distance2(d, u, v);
  for (let i = 0; i < 60; i++) {
    if (fc < fd) {
      b = d;
      d = c;
      fd = fc;
      c = b - g * (b - a);
      fc = distance2(c, u, v);
    } else {
      a = c;
      c = d;
      fc = fd;
      d = a + g * (b - a);
      fd = distance2(d, u, v);
    }
  }
  const mired = (a + b) / 2;
  if (mired <= MIRED_MIN + 1e-6 || mired >= MIRED_MAX - 1e-6) return undefined;
  const p = uv1960FromXy(blackbodyChromaticity(1e6 / mired, "2°"));
  const duv = Math.sign(v - p.v || 1) * Math.hypot(u - p.u, v - p.v);
  if (Math.abs(duv) > 0.05) return undefined;
  return { cct: 1e6 / mired, duv };
}
