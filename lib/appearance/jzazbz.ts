/**
 * Jzazbz of Safdar, Cui, Kim and Luo, "Perceptually uniform color space for image signals including high dynamic
 * range and wide gamut", Optics Express 25(13), 15131–15151 (2017): absolute XYZ (D65, cd/m²) → Jz, az, bz; and
 * the colour difference ΔEz of the same paper.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { applyMatrix3, invertMatrix3, type Matrix3 } from "../colorimetry/matrix3.ts";
import { checkFields } from "../arguments/check-fields.ts";
import { noteMethod } from "../methods/method-log.ts";
import { ABSOLUTE_XYZ_FIELDS, JZAZBZ_FIELDS } from "./check-values.ts";

/** Jzazbz values: lightness Jz (about 0–0.2 for 0–1000 cd/m²) and the opponent coordinates az, bz. */
export interface Jzazbz {
  readonly Jz: number;
  readonly az: number;
  readonly bz: number;
}

// Safdar et al. 2017, eqs. 8–13 (the constants as published).
const B = 1.15;
const G = 0.66;
const C1 = 3424 / 4096;
const C2 = 2413 / 128;
const C3 = 2392 / 128;
const N = 2610 / 16384;
const P = (1.7 * 2523) / 32;
const D = -0.56;
const D0 = 1.6295499532821566e-11;
const XYZ_TO_LMS: Matrix3 = [
  [0.41478972, 0.579999, 0.014648],
  [-0.20151, 1.120649, 0.0531008],
  [-0.0166008, 0.2648, 0.6684799],
];
const LMS_TO_IAB: Matrix3 = [
  [0.5, 0.5, 0],
  [3.524, -4.066708, 0.542708],
  [0.199076, 1.096799, -1.295875],
];
const LMS_TO_XYZ = invertMatrix3(XYZ_TO_LMS, "the Jzazbz LMS matrix");
const IAB_TO_LMS = invertMatrix3(LMS_TO_IAB, "the Jzazbz Iz az bz matrix");

const STATEMENT =
  "Jzazbz was computed per Safdar et al., Optics Express 25, 15131 (2017), from absolute XYZ in cd/m² relative to D65.";
const DIFFERENCE_STATEMENT =
  "Colour differences ΔEz were computed in Jzazbz per Safdar et al. (2017) eq. 15, with ΔHz = 2·√(Cz1·Cz2)·sin(Δhz/2).";

const pqLike = (v: number): number => {
  const t = (Math.abs(v) / 10000) ** N;
  const r = ((C1 + C2 * t) / (1 + C3 * t)) ** P;
  return v < 0 ? -r : r;
};
const pqLikeInverse = (v: number): number => {
  const t = Math.abs(v) ** (1 / P);
  const r = 10000 * Math.max((C1 - t) / (C3 * t - C2), 0) ** (1 / N);
  return v < 0 ? -r : r;
};

/**
 * Jzazbz of absolute XYZ: X′ = bX − (b − 1)Z, Y′ = gY − (g − 1)X, LMS, a PQ-like curve with p = 1.7·2523/2⁵, then Iz, az, bz and Jz = (1 + d)Iz ÷ (1 + d·Iz) − d0.
 *
 * @param xyz Absolute tristimulus values { X, Y, Z } in cd/m², relative to a D65 white.
 * @returns { Jz, az, bz }.
 * @source Safdar et al., Optics Express 25(13), 15131 (2017), eqs. 8–13.
 * @example jzazbzFromXYZ({ X: 95.047, Y: 100, Z: 108.883 })
 */
export function jzazbzFromXYZ(xyz: Tristimulus): Jzazbz {
  checkFields("jzazbzFromXYZ", "xyz", xyz, ABSOLUTE_XYZ_FIELDS);
  noteMethod("colour space", STATEMENT);
  const xp = B * xyz.X - (B - 1) * xyz.Z;
  const yp = G * xyz.Y - (G - 1) * xyz.X;
  const lms = applyMatrix3(XYZ_TO_LMS, [xp, yp, xyz.Z]);
  const [iz, az, bz] = applyMatrix3(LMS_TO_IAB, [pqLike(lms[0]), pqLike(lms[1]), pqLike(lms[2])]);
  return { Jz: ((1 + D) * iz) / (1 + D * iz) - D0, az, bz };
}

/**
 * Absolute XYZ (cd/m², D65-relative) from Jzazbz: the inverse of `jzazbzFromXYZ`.
 *
 * @param jab { Jz, az, bz }.
 * @returns Absolute tristimulus values { X, Y, Z } in cd/m².
 * @source Safdar et al., Optics Express 25(13), 15131 (2017), eqs. 8–13 inverted.
 * @example xyzFromJzazbz({ Jz: 0.0886, az: 0, bz: 0 })
 */
export function xyzFromJzazbz(jab: Jzazbz): Tristimulus {
  checkFields("xyzFromJzazbz", "jab", jab, JZAZBZ_FIELDS);
  noteMethod("colour space", STATEMENT);
  const j = jab.Jz + D0;
  const iz = j / (1 + D - D * j);
  const lmsp = applyMatrix3(IAB_TO_LMS, [iz, jab.az, jab.bz]);
  const [xp, yp, Z] = applyMatrix3(LMS_TO_XYZ, [
    pqLikeInverse(lmsp[0]),
    pqLikeInverse(lmsp[1]),
    pqLikeInverse(lmsp[2]),
  ]);
  const X = (xp + (B - 1) * Z) / B;
  return { X, Y: (yp + (G - 1) * X) / G, Z };
}

/**
 * The colour difference ΔEz of two colours in Jzazbz: √(ΔJz² + ΔCz² + ΔHz²), ΔHz = 2·√(Cz1·Cz2)·sin(Δhz ÷ 2).
 *
 * @param reference The reference colour, Jzazbz { Jz, az, bz }.
 * @param sample The sample colour, Jzazbz { Jz, az, bz }.
 * @returns ΔEz (dimensionless, Jzazbz units).
 * @source Safdar et al., Optics Express 25(13), 15131 (2017), eqs. 14–15.
 * @example deltaEz(jzazbzFromXYZ({ X: 95, Y: 100, Z: 109 }), jzazbzFromXYZ({ X: 40, Y: 42, Z: 30 }))
 */
export function deltaEz(reference: Jzazbz, sample: Jzazbz): number {
  checkFields("deltaEz", "reference", reference, JZAZBZ_FIELDS);
  checkFields("deltaEz", "sample", sample, JZAZBZ_FIELDS);
  noteMethod("colour difference", DIFFERENCE_STATEMENT);
  const c1 = Math.hypot(reference.az, reference.bz),
    c2 = Math.hypot(sample.az, sample.bz);
  const dh = Math.atan2(sample.bz, sample.az) - Math.atan2(reference.bz, reference.az);
  const dH = 2 * Math.sqrt(c1 * c2) * Math.sin(dh / 2);
  return Math.sqrt((reference.Jz - sample.Jz) ** 2 + (c1 - c2) ** 2 + dH * dH);
}
