/**
 * The Planckian locus: chromaticity of a blackbody at temperature T, computed by summing Planck's law over the
 * CIE 1931 2° colour-matching functions at 1 nm from 360 to 830 nm with c2 = 1.4388e-2 m·K (CIE 015:2018 §9.5).
 */
import { CIE_1931_2_DEGREE } from "../observers/standard-observer.ts";
import { C2_CIE } from "../illuminants/planckian-radiator.ts";
import type { Chromaticity, Uv1960 } from "../colorimetry/chromaticity.ts";
import { checkNumber } from "../arguments/check-number.ts";

/** Lowest temperature (K) for which the locus is computed; below it Planck's law underflows in the visible. */
export const PLANCKIAN_MIN_K = 100;

// Wavelength factors for the summation, built once: λ (m), λ⁻⁴ (scaled) and the 1931 colour-matching functions.
const obs = CIE_1931_2_DEGREE;
const n = obs.wavelengths.length;
const lambdaM = new Float64Array(n);
const lambdaPow4 = new Float64Array(n);
for (let i = 0; i < n; i++) {
  const l = obs.wavelengths[i]! * 1e-9;
  lambdaM[i] = l;
  lambdaPow4[i] = (obs.wavelengths[i]! / 560) ** -4;
}
const xb = Float64Array.from(obs.xBar),
  yb = Float64Array.from(obs.yBar),
  zb = Float64Array.from(obs.zBar);

/** A point of the locus in CIE 1960 uv and its rate of change with reciprocal temperature s = 1/T (per K⁻¹). */
export interface LocusPoint {
  readonly u: number;
  readonly v: number;
  readonly duds: number;
  readonly dvds: number;
}

/**
 * The Planckian locus in CIE 1960 uv at reciprocal temperature s = 1/T, with its derivative; s = 0 is the limit T → ∞.
 *
 * Planck's law is written as λ⁻⁴·g(x), g(x) = x ÷ (eˣ − 1), x = c2·s ÷ λ, which is finite at s = 0; summed over the
 * CIE 1931 2° colour-matching functions at 1 nm, 360–830 nm.
 *
 * @param s The reciprocal temperature 1/T, in K⁻¹ (0 or positive).
 * @param c2 The second radiation constant, in m·K; default `C2_CIE` = 1.4388e-2.
 * @returns { u, v, duds, dvds }: the CIE 1960 uv point and its rates of change with s (per K⁻¹).
 * @source CIE 015:2018 §9.5 (the Planckian locus, c2 = 1.4388e-2 m·K).
 * @example planckianLocusAtReciprocal(1 / 6500)
 */
export function planckianLocusAtReciprocal(s: number, c2 = C2_CIE): LocusPoint {
  checkNumber("planckianLocusAtReciprocal", "s", s, {
    unit: "1/K (reciprocal temperature)",
    min: 0,
    max: 1 / PLANCKIAN_MIN_K,
  });
  checkNumber("planckianLocusAtReciprocal", "c2", c2, { unit: "m·K", above: 0 });
  let X = 0,
    Y = 0,
    Z = 0,
    dX = 0,
    dY = 0,
    dZ = 0;
  for (let i = 0; i < n; i++) {
    const a = c2 / lambdaM[i]!;
    const x = a * s;
    let g: number, dg: number;
    if (x < 1e-4) {
      // Series of x/(eˣ − 1) = 1 − x/2 + x²/12 − …, and its derivative −1/2 + x/6 − …
      g = 1 - x / 2 + (x * x) / 12;
      dg = -0.5 + x / 6;
    } else {
      const em1 = Math.expm1(x);
      if (!Number.isFinite(em1)) {
        g = 0;
        dg = 0;
      } else {
        g = x / em1;
        dg = (em1 - x * (em1 + 1)) / (em1 * em1);
      }
    }
    const m = lambdaPow4[i]! * g;
    const dm = lambdaPow4[i]! * dg * a;
    X += m * xb[i]!;
    Y += m * yb[i]!;
    Z += m * zb[i]!;
    dX += dm * xb[i]!;
    dY += dm * yb[i]!;
    dZ += dm * zb[i]!;
  }
  const d = X + 15 * Y + 3 * Z;
  const dd = dX + 15 * dY + 3 * dZ;
  if (!(d > 0)) throw new Error(`Planckian locus: no visible radiation at ${s > 0 ? 1 / s : Infinity} K`);
  const u = (4 * X) / d;
  const v = (6 * Y) / d;
  return { u, v, duds: (4 * (dX * d - X * dd)) / (d * d), dvds: (6 * (dY * d - Y * dd)) / (d * d) };
}

function checkTemperature(what: string, t: number): void {
  if (typeof t !== "number" || !Number.isFinite(t) || t < PLANCKIAN_MIN_K) {
    throw new Error(
      `${what}: temperature ${t} K is not valid; give a finite temperature of at least ${PLANCKIAN_MIN_K} K`,
    );
  }
}

/**
 * CIE 1960 (u, v) of a Planckian radiator, summed at 1 nm over 360–830 nm with c2 = 1.4388e-2 m·K.
 *
 * @param temperatureK The temperature, in K (at least 100).
 * @returns { u, v } of the CIE 1960 UCS.
 * @source CIE 015:2018 §9.5.
 * @example planckianUv(2856)
 */
export function planckianUv(temperatureK: number): Uv1960 {
  checkNumber("planckianUv", "temperatureK", temperatureK, { unit: "K", min: PLANCKIAN_MIN_K });
  checkTemperature("planckianUv", temperatureK);
  const p = planckianLocusAtReciprocal(1 / temperatureK);
  return { u: p.u, v: p.v };
}

/**
 * CIE 1931 (x, y) of a Planckian radiator, summed at 1 nm over 360–830 nm with c2 = 1.4388e-2 m·K.
 *
 * @param temperatureK The temperature, in K (at least 100).
 * @returns { x, y }.
 * @source CIE 015:2018 §9.5.
 * @example planckianChromaticity(2856)
 */
export function planckianChromaticity(temperatureK: number): Chromaticity {
  checkNumber("planckianChromaticity", "temperatureK", temperatureK, { unit: "K", min: PLANCKIAN_MIN_K });
  checkTemperature("planckianChromaticity", temperatureK);
  const { u, v } = planckianLocusAtReciprocal(1 / temperatureK);
  const d = 2 * u - 8 * v + 4;
  return { x: (3 * u) / d, y: (2 * v) / d };
}

/**
 * The Planckian locus point at T and its unit normal pointing to positive Duv (above the locus, towards green), in CIE 1960 uv.
 *
 * @param temperatureK The temperature, in K (at least 100).
 * @returns { u, v, nu, nv }: the locus point and the unit normal.
 * @source CIE 015:2018 §9.5 (Duv as the distance from the locus in the CIE 1960 UCS); Ohno 2014, LEUKOS 10:47–55.
 * @example planckianNormal(4000)
 */
export function planckianNormal(temperatureK: number): { u: number; v: number; nu: number; nv: number } {
  checkNumber("planckianNormal", "temperatureK", temperatureK, { unit: "K", min: PLANCKIAN_MIN_K });
  checkTemperature("planckianNormal", temperatureK);
  const p = planckianLocusAtReciprocal(1 / temperatureK);
  // Tangent along increasing T is −(du/ds, dv/ds); the normal (tv, −tu) has a positive v component since u falls with T.
  const tu = -p.duds,
    tv = -p.dvds;
  const len = Math.hypot(tu, tv);
  return { u: p.u, v: p.v, nu: tv / len, nv: -tu / len };
}
