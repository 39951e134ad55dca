/**
 * CIEDE2000 colour difference ΔE00 (CIE 142-2001; ISO/CIE 11664-6:2014), implemented as in G. Sharma, W. Wu and
 * E. N. Dalal, "The CIEDE2000 color-difference formula: implementation notes, supplementary test data, and
 * mathematical observations", Color Res. Appl. 30(1):21–30, 2005 (eqs. 1–22).
 */
import type { Lab } from "../colorimetry/cielab.ts";
import { noteMethod } from "../methods/method-log.ts";
import { requireFactor, requireLab } from "./check-lab.ts";
import { LAB_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";

export interface DeltaE2000Options {
  /** Parametric factor for lightness, dimensionless (default 1, the reference conditions of CIE 142-2001). */
  kL?: number;
  /** Parametric factor for chroma, dimensionless (default 1). */
  kC?: number;
  /** Parametric factor for hue, dimensionless (default 1). */
  kH?: number;
}

/** Every intermediate value of the CIEDE2000 formula, as Sharma, Wu and Dalal (2005) tabulate them (angles in degrees). */
export interface Ciede2000Terms {
  readonly aPrime1: number;
  readonly cPrime1: number;
  readonly hPrime1: number;
  readonly aPrime2: number;
  readonly cPrime2: number;
  readonly hPrime2: number;
  readonly hBarPrime: number;
  readonly G: number;
  readonly T: number;
  readonly SL: number;
  readonly SC: number;
  readonly SH: number;
  readonly RT: number;
  readonly deltaLPrime: number;
  readonly deltaCPrime: number;
  readonly deltaHPrime: number;
  readonly deltaE: number;
}

const DEG = Math.PI / 180;
const TWENTY_FIVE_7 = 6103515625; // 25⁷
const TWO_PI = 2 * Math.PI;

/**
 * The CIEDE2000 formula with every intermediate value (a′, C′, h′, h̄′, G, T, SL, SC, SH, RT, ΔL′, ΔC′, ΔH′, ΔE00).
 *
 * @param first The first colour, CIELAB { L, a, b }.
 * @param second The second colour, CIELAB { L, a, b }.
 * @returns The terms as Sharma, Wu and Dalal tabulate them: hue angles h′ and h̄′ in degrees, ΔE00 in `deltaE`.
 * @source G. Sharma, W. Wu, E. N. Dalal, Color Res. Appl. 30(1):21–30, 2005, eqs. 1–22; CIE 142-2001.
 * @example ciede2000Terms({ L: 50, a: 2.6772, b: -79.7751 }, { L: 50, a: 0, b: -82.7485 }).deltaE
 */
export function ciede2000Terms(first: Lab, second: Lab, options: DeltaE2000Options = {}): Ciede2000Terms {
  checkFields("ciede2000Terms", "first", first, LAB_FIELDS);
  checkFields("ciede2000Terms", "second", second, LAB_FIELDS);
  checkOptions("ciede2000Terms", "options", options, ["kL", "kC", "kH"]);
  requireLab("deltaE2000", "first", first);
  requireLab("deltaE2000", "second", second);
  const kL = options.kL ?? 1,
    kC = options.kC ?? 1,
    kH = options.kH ?? 1;
  requireFactor("deltaE2000", "kL", kL);
  requireFactor("deltaE2000", "kC", kC);
  requireFactor("deltaE2000", "kH", kH);
  noteDe2000(kL, kC, kH);
  return compute(first.L, first.a, first.b, second.L, second.a, second.b, kL, kC, kH);
}

/**
 * CIEDE2000 colour difference ΔE00 between two CIELAB colours.
 *
 * @param first The first colour, CIELAB { L, a, b }.
 * @param second The second colour, CIELAB { L, a, b }.
 * @returns ΔE00 (dimensionless); symmetric in the two colours.
 * @source CIE 142-2001 (ISO/CIE 11664-6:2014), implemented as in Sharma, Wu and Dalal, Color Res. Appl. 30(1):21–30, 2005.
 * @example deltaE2000({ L: 50, a: 2.6772, b: -79.7751 }, { L: 50, a: 0, b: -82.7485 })
 */
export function deltaE2000(first: Lab, second: Lab, options?: DeltaE2000Options): number {
  checkFields("deltaE2000", "first", first, LAB_FIELDS);
  checkFields("deltaE2000", "second", second, LAB_FIELDS);
  checkOptions("deltaE2000", "options", options, ["kL", "kC", "kH"]);
  if (first == null || second == null) {
    requireLab("deltaE2000", "first", first);
    requireLab("deltaE2000", "second", second);
  }
  const L1 = first.L,
    a1 = first.a,
    b1 = first.b,
    L2 = second.L,
    a2 = second.a,
    b2 = second.b;
  // One test catches NaN, ±Infinity and missing coordinates (x − x is NaN for all of them).
  if (Number.isNaN(L1 - L1 + a1 - a1 + b1 - b1 + L2 - L2 + a2 - a2 + b2 - b2)) {
    requireLab("deltaE2000", "first", first);
    requireLab("deltaE2000", "second", second);
  }
  if (options === undefined) {
    noteMethod("colour difference", DEFAULT_NOTE);
    return fastDeltaE2000(L1, a1, b1, L2, a2, b2, 1, 1, 1);
  }
  const kL = options.kL ?? 1,
    kC = options.kC ?? 1,
    kH = options.kH ?? 1;
  requireFactor("deltaE2000", "kL", kL);
  requireFactor("deltaE2000", "kC", kC);
  requireFactor("deltaE2000", "kH", kH);
  noteDe2000(kL, kC, kH);
  return fastDeltaE2000(L1, a1, b1, L2, a2, b2, kL, kC, kH);
}

const DEFAULT_NOTE =
  "Colour differences ΔE00 were computed by the CIEDE2000 formula (CIE 142-2001; ISO/CIE 11664-6) with kL = kC = kH = 1.";
const COS_30 = Math.cos(30 * DEG),
  SIN_30 = Math.sin(30 * DEG);
const COS_6 = Math.cos(6 * DEG),
  SIN_6 = Math.sin(6 * DEG);
const COS_63 = Math.cos(63 * DEG),
  SIN_63 = Math.sin(63 * DEG);

/**
 * The same formula as `compute` below, arranged for speed: powers by multiplication, and the four cosines of T from
 * one cosine and one sine of h̄′ by the multiple-angle identities. Both are checked against Sharma et al. (2005).
 */
function fastDeltaE2000(
  L1: number,
  a1: number,
  b1: number,
  L2: number,
  a2: number,
  b2: number,
  kL: number,
  kC: number,
  kH: number,
): number {
  const cBar = (Math.sqrt(a1 * a1 + b1 * b1) + Math.sqrt(a2 * a2 + b2 * b2)) * 0.5;
  const cb2 = cBar * cBar;
  const cBar7 = cb2 * cb2 * cb2 * cBar;
  const g1 = 1.5 - 0.5 * Math.sqrt(cBar7 / (cBar7 + TWENTY_FIVE_7)); // 1 + G
  const ap1 = g1 * a1,
    ap2 = g1 * a2;
  const cp1 = Math.sqrt(ap1 * ap1 + b1 * b1),
    cp2 = Math.sqrt(ap2 * ap2 + b2 * b2);
  let hp1 = ap1 === 0 && b1 === 0 ? 0 : Math.atan2(b1, ap1);
  if (hp1 < 0) hp1 += TWO_PI;
  let hp2 = ap2 === 0 && b2 === 0 ? 0 : Math.atan2(b2, ap2);
  if (hp2 < 0) hp2 += TWO_PI;
  const cpProduct = cp1 * cp2;
  let dhp = 0;
  let hpBar = hp1 + hp2;
  if (cpProduct !== 0) {
    dhp = hp2 - hp1;
    if (dhp > Math.PI) dhp -= TWO_PI;
    else if (dhp < -Math.PI) dhp += TWO_PI;
    if (Math.abs(hp1 - hp2) <= Math.PI) hpBar *= 0.5;
    else if (hpBar < TWO_PI) hpBar = (hpBar + TWO_PI) * 0.5;
    else hpBar = (hpBar - TWO_PI) * 0.5;
  }
  const dLp = L2 - L1;
  const dCp = cp2 - cp1;
  const dHp = 2 * Math.sqrt(cpProduct) * Math.sin(dhp * 0.5);
  const c1h = Math.cos(hpBar),
    s1h = Math.sin(hpBar);
  const c2h = 2 * c1h * c1h - 1,
    s2h = 2 * s1h * c1h;
  const c3h = c1h * c2h - s1h * s2h,
    s3h = s1h * c2h + c1h * s2h;
  const c4h = 2 * c2h * c2h - 1,
    s4h = 2 * s2h * c2h;
  const T =
    1 -
    0.17 * (c1h * COS_30 + s1h * SIN_30) +
    0.24 * c2h +
    0.32 * (c3h * COS_6 - s3h * SIN_6) -
    0.2 * (c4h * COS_63 + s4h * SIN_63);
  const hd = (hpBar * (180 / Math.PI) - 275) * 0.04;
  const dTheta = 60 * DEG * Math.exp(-hd * hd); // 2Δθ
  const cpBar = (cp1 + cp2) * 0.5;
  const cq2 = cpBar * cpBar;
  const cpBar7 = cq2 * cq2 * cq2 * cpBar;
  const RC = 2 * Math.sqrt(cpBar7 / (cpBar7 + TWENTY_FIVE_7));
  const lBar50 = (L1 + L2) * 0.5 - 50;
  const l50 = lBar50 * lBar50;
  const SL = 1 + (0.015 * l50) / Math.sqrt(20 + l50);
  const SC = 1 + 0.045 * cpBar;
  const SH = 1 + 0.015 * cpBar * T;
  const RT = -Math.sin(dTheta) * RC;
  const tL = dLp / (kL * SL),
    tC = dCp / (kC * SC),
    tH = dHp / (kH * SH);
  return Math.sqrt(tL * tL + tC * tC + tH * tH + RT * tC * tH);
}

function noteDe2000(kL: number, kC: number, kH: number): void {
  if (kL === 1 && kC === 1 && kH === 1) {
    noteMethod("colour difference", DEFAULT_NOTE);
  } else {
    noteMethod(
      "colour difference",
      `Colour differences ΔE00 were computed by the CIEDE2000 formula (CIE 142-2001; ISO/CIE 11664-6) with kL = ${kL}, kC = ${kC}, kH = ${kH}.`,
    );
  }
}

/** The formula step by step as Sharma et al. (2005) write it, keeping every intermediate value. */
function compute(
  L1: number,
  a1: number,
  b1: number,
  L2: number,
  a2: number,
  b2: number,
  kL: number,
  kC: number,
  kH: number,
): Ciede2000Terms {
  // Eqs. 2–7: a′, C′, h′.
  const cBar = (Math.sqrt(a1 * a1 + b1 * b1) + Math.sqrt(a2 * a2 + b2 * b2)) / 2;
  const cBar7 = cBar ** 7;
  const G = 0.5 * (1 - Math.sqrt(cBar7 / (cBar7 + TWENTY_FIVE_7)));
  const ap1 = (1 + G) * a1,
    ap2 = (1 + G) * a2;
  const cp1 = Math.sqrt(ap1 * ap1 + b1 * b1),
    cp2 = Math.sqrt(ap2 * ap2 + b2 * b2);
  let hp1 = ap1 === 0 && b1 === 0 ? 0 : Math.atan2(b1, ap1);
  if (hp1 < 0) hp1 += TWO_PI;
  let hp2 = ap2 === 0 && b2 === 0 ? 0 : Math.atan2(b2, ap2);
  if (hp2 < 0) hp2 += TWO_PI;
  // Eqs. 8–11: ΔL′, ΔC′, Δh′, ΔH′.
  const dLp = L2 - L1;
  const dCp = cp2 - cp1;
  const cpProduct = cp1 * cp2;
  let dhp = 0;
  if (cpProduct !== 0) {
    dhp = hp2 - hp1;
    if (dhp > Math.PI) dhp -= TWO_PI;
    else if (dhp < -Math.PI) dhp += TWO_PI;
  }
  const dHp = 2 * Math.sqrt(cpProduct) * Math.sin(dhp / 2);
  // Eqs. 12–14: means L̄′, C̄′, h̄′.
  const lBar = (L1 + L2) / 2;
  const cpBar = (cp1 + cp2) / 2;
  let hpBar = hp1 + hp2;
  if (cpProduct !== 0) {
    if (Math.abs(hp1 - hp2) <= Math.PI) hpBar /= 2;
    else if (hpBar < TWO_PI) hpBar = (hpBar + TWO_PI) / 2;
    else hpBar = (hpBar - TWO_PI) / 2;
  }
  // Eqs. 15–22: weighting functions and the rotation term.
  const T =
    1 -
    0.17 * Math.cos(hpBar - 30 * DEG) +
    0.24 * Math.cos(2 * hpBar) +
    0.32 * Math.cos(3 * hpBar + 6 * DEG) -
    0.2 * Math.cos(4 * hpBar - 63 * DEG);
  const hd = (hpBar / DEG - 275) / 25;
  const dTheta = 30 * DEG * Math.exp(-hd * hd);
  const cpBar7 = cpBar ** 7;
  const RC = 2 * Math.sqrt(cpBar7 / (cpBar7 + TWENTY_FIVE_7));
  const l50 = (lBar - 50) * (lBar - 50);
  const SL = 1 + (0.015 * l50) / Math.sqrt(20 + l50);
  const SC = 1 + 0.045 * cpBar;
  const SH = 1 + 0.015 * cpBar * T;
  const RT = -Math.sin(2 * dTheta) * RC;
  const tL = dLp / (kL * SL),
    tC = dCp / (kC * SC),
    tH = dHp / (kH * SH);
  const deltaE = Math.sqrt(tL * tL + tC * tC + tH * tH + RT * tC * tH);
  return {
    aPrime1: ap1,
    cPrime1: cp1,
    hPrime1: hp1 / DEG,
    aPrime2: ap2,
    cPrime2: cp2,
    hPrime2: hp2 / DEG,
    hBarPrime: hpBar / DEG,
    G,
    T,
    SL,
    SC,
    SH,
    RT,
    deltaLPrime: dLp,
    deltaCPrime: dCp,
    deltaHPrime: dHp,
    deltaE,
  };
}
