/**
 * Correlated colour temperature (CCT) and distance from the Planckian locus (Duv) in the CIE 1960 UCS
 * (CIE 015:2018 §9.5), and the inverse: the chromaticity at a given CCT and Duv.
 */
import { chromaticityXy, xyFromUv1960, type Chromaticity } from "../colorimetry/chromaticity.ts";
import { lightTristimulus } from "../colorimetry/tristimulus.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { cctOhno, OHNO_RANGE_K, tabulatedLocusUv } from "./cct-ohno.ts";
import { cctRobertson } from "./cct-robertson.ts";
import { planckianLocusAtReciprocal, planckianNormal } from "./planckian-locus.ts";
import { XY_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkSpectrum } from "../arguments/check-spectrum.ts";
import { checkCctOptions } from "../arguments/option-sets.ts";

export type CctMethod = "ohno" | "robertson";

export interface CctOptions {
  /** "ohno" (default): Ohno 2014 combined method; "robertson": Robertson 1968. */
  method?: CctMethod;
}

export interface CctResult {
  /** Correlated colour temperature in kelvin. */
  readonly cct: number;
  /** Signed distance from the Planckian locus in CIE 1960 uv; positive above the locus (towards green). */
  readonly duv: number;
}

/** |Duv| beyond which CIE 015:2018 §9.5 regards a correlated colour temperature as meaningless. */
export const DUV_LIMIT = 0.05;

const LOCUS_WORDS =
  "The Planckian locus was computed from Planck's law with c2 = 1.4388e-2 m·K and the CIE 1931 2° observer at 1 nm over 360–830 nm, and distances were taken in the CIE 1960 UCS (CIE 015:2018 §9.5).";

// The Methods statements, built once: cctAndDuv runs in loops over many chromaticities.
const OHNO_WORDS = `Correlated colour temperatures and Duv were computed by Ohno's combined triangular/parabolic method (Ohno 2014, LEUKOS 10:47–55) on a Planckian table in 0.01 % steps from ${OHNO_RANGE_K[0]} K to ${OHNO_RANGE_K[1]} K (cubic in ln T between exact locus points 1 % apart), refined around the nearest point to steps of 0.0001 % for the triangular and 0.001 % for the parabolic solution (so the 1 %-table correction factor 0.99991 was not applied). ${LOCUS_WORDS}`;
const ROBERTSON_WORDS = `Correlated colour temperatures were computed by Robertson's method (JOSA 58:1528, 1968) on his 31 isotemperature lines (0–600 MK⁻¹), recomputed from the Planckian locus, and Duv as the distance to the locus at that temperature. ${LOCUS_WORDS}`;

function checkXy(xy: Chromaticity, what: string): void {
  if (typeof xy !== "object" || xy === null || !Number.isFinite(xy.x) || !Number.isFinite(xy.y)) {
    throw new Error(`${what}: chromaticity (${xy?.x}, ${xy?.y}) must be two finite numbers`);
  }
  if (xy.x <= 0 || xy.y <= 0 || xy.x + xy.y >= 1) {
    throw new Error(
      `${what}: chromaticity (${xy.x}, ${xy.y}) is not a physical chromaticity (need x > 0, y > 0, x + y < 1)`,
    );
  }
}

/**
 * Duv of a 1960 (u, v) at a temperature: the distance to the locus point, signed by v − v_T (Ohno 2014); the locus
 * point from Ohno's fine table where it reaches, else summed.
 */
function duvAt(u: number, v: number, cct: number): number {
  const p = tabulatedLocusUv(cct) ?? planckianLocusAtReciprocal(1 / cct);
  return Math.hypot(u - p.u, v - p.v) * Math.sign(v - p.v);
}

// Built once: checked on every call, a hot path.
const CCT_XY_FIELDS = { ...XY_FIELDS, instead: { spectrum: "for a spectrum use cctFromSpectrum" } };

/**
 * Correlated colour temperature and Duv of a CIE 1931 chromaticity (Ohno's combined method by default, or Robertson's).
 *
 * An error when |Duv| > 0.05 (`DUV_LIMIT`) or when the CCT is outside the method's range (Ohno: 1000–100000 K,
 * `OHNO_RANGE_K`; Robertson: from about 1667 K up).
 *
 * @param xy A chromaticity { x, y } (CIE 1931, computed with the 2° observer).
 * @returns { cct in K, duv: signed distance from the Planckian locus in CIE 1960 uv, positive above (towards green) }.
 * @source CIE 015:2018 §9.5; Y. Ohno, LEUKOS 10:47–55, 2014; A. R. Robertson, JOSA 58:1528–1535, 1968.
 * @example cctAndDuv({ x: 0.3127, y: 0.329 })
 */
export function cctAndDuv(xy: Chromaticity, options?: CctOptions): CctResult {
  checkFields("cctAndDuv", "xy", xy, CCT_XY_FIELDS);
  // Checked only when given: the default costs nothing in a loop over a million chromaticities.
  if (options !== undefined) checkCctOptions("cctAndDuv", options);
  checkXy(xy, "cctAndDuv");
  const method = options?.method ?? "ohno";
  // CIE 1960 UCS u = 4x / (−2x + 12y + 3), v = 6y / (−2x + 12y + 3) (CIE 015:2018 §8.1), written out: checkXy has
  // checked xy, and the divisor exceeds 1 for every physical chromaticity.
  const d = -2 * xy.x + 12 * xy.y + 3;
  const uv = { u: (4 * xy.x) / d, v: (6 * xy.y) / d };
  let result: CctResult;
  if (method === "ohno") {
    result = cctOhno(uv);
    noteMethod("colour temperature", OHNO_WORDS);
  } else if (method === "robertson") {
    const cct = cctRobertson(uv);
    result = { cct, duv: duvAt(uv.u, uv.v, cct) };
    noteMethod("colour temperature", ROBERTSON_WORDS);
  } else {
    throw new Error(`cctAndDuv: unknown method "${String(method)}"; use "ohno" or "robertson"`);
  }
  if (Math.abs(result.duv) > DUV_LIMIT) {
    throw new Error(
      `cctAndDuv: chromaticity (${xy.x.toFixed(5)}, ${xy.y.toFixed(5)}) is ${Math.abs(result.duv).toFixed(4)} from the Planckian locus in uv (Duv = ${result.duv.toFixed(4)}); CIE 015:2018 regards a CCT as meaningless beyond |Duv| = ${DUV_LIMIT}`,
    );
  }
  return result;
}

/**
 * Correlated colour temperature and Duv of a light source from its spectral distribution (CIE 1931 2° observer).
 *
 * @param spd The light's spectral distribution (relative or absolute).
 * @returns { cct in K, duv } as `cctAndDuv` gives them.
 * @source CIE 015:2018 §9.5 (with eq. 7.5 for the tristimulus values).
 * @example cctFromSpectrum(illuminant("A"))
 */
export function cctFromSpectrum(spd: Spectrum, options?: CctOptions): CctResult {
  checkSpectrum("cctFromSpectrum", "spd", spd, {
    what: "a spectrum of a light source",
    instead: { object: "for a chromaticity { x, y } use cctAndDuv" },
  });
  checkCctOptions("cctFromSpectrum", options);
  const xyz = lightTristimulus(spd, { observer: "2°" });
  return cctAndDuv(chromaticityXy(xyz), options);
}

/**
 * The CIE 1931 chromaticity at a CCT and Duv: the Planckian point at T moved Duv along the normal to the locus in CIE 1960 uv.
 *
 * @param cct The correlated colour temperature, in K (1000–100000).
 * @param duv The signed distance from the locus in CIE 1960 uv, within ±0.05; default 0 (on the locus).
 * @returns { x, y }.
 * @source CIE 015:2018 §9.5 and Ohno 2014 (the definition of CCT and Duv, inverted).
 * @example chromaticityAtCct(4000, 0.002)
 */
export function chromaticityAtCct(cct: number, duv = 0): Chromaticity {
  checkNumber("chromaticityAtCct", "cct", cct, { unit: "K" });
  checkNumber("chromaticityAtCct", "duv", duv, { min: -DUV_LIMIT, max: DUV_LIMIT });
  if (typeof cct !== "number" || !Number.isFinite(cct) || cct < OHNO_RANGE_K[0] || cct > OHNO_RANGE_K[1]) {
    throw new Error(`chromaticityAtCct: CCT ${cct} K is outside ${OHNO_RANGE_K[0]}–${OHNO_RANGE_K[1]} K`);
  }
  if (typeof duv !== "number" || !Number.isFinite(duv) || Math.abs(duv) > DUV_LIMIT) {
    throw new Error(`chromaticityAtCct: Duv ${duv} is not a finite number within ±${DUV_LIMIT}`);
  }
  const p = planckianNormal(cct);
  const xy = xyFromUv1960({ u: p.u + duv * p.nu, v: p.v + duv * p.nv });
  if (!(xy.x > 0 && xy.y > 0 && xy.x + xy.y < 1)) {
    throw new Error(
      `chromaticityAtCct: ${cct} K with Duv ${duv} lies outside the range of real colours (x = ${xy.x.toFixed(4)}, y = ${xy.y.toFixed(4)})`,
    );
  }
  return xy;
}
