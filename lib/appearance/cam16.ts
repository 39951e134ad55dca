/**
 * CAM16 (C. Li, Z. Li, Z. Wang, Y. Xu, M. R. Luo, G. Cui, M. Melgosa, M. H. Brill and M. Pointer, "Comprehensive
 * color solutions: CAM16, CAT16, and CAM16-UCS", Color Res. Appl. 42:703–718, 2017) and, through the same steps with
 * CAT02 and the Hunt–Pointer–Estévez cone space, CIECAM02 (CIE 159:2004): viewing conditions, the forward model
 * (J, C, h, Q, M, s, H) and its inverse.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { applyMatrix3, invertMatrix3, multiplyMatrix3, type Matrix3 } from "../colorimetry/matrix3.ts";
import { ADAPTATION_MATRICES } from "../adaptation/chromatic-adaptation.ts";
import { XYZ_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";

/** The surround of the viewing field: average (reflection prints), dim (television), dark (projection). */
export type Surround = "average" | "dim" | "dark";

/** Viewing conditions as given by the caller. */
export interface ViewingConditionsInput {
  /** The adopted white, XYZ on the sample's scale (Y = 100 for a relative white; required). */
  white: Tristimulus;
  /** LA, the luminance of the adapting field in cd/m² (often 20 % of the white's luminance; required). */
  adaptingLuminance: number;
  /** Yb, the relative luminance of the background on the white's scale; default 20. */
  backgroundLuminance?: number;
  /** The surround; default "average". */
  surround?: Surround;
  /** D, the degree of adaptation 0–1; default computed from F and LA (the model's own formula). */
  degreeOfAdaptation?: number;
  /** "CAM16" (Li et al. 2017) or "CIECAM02" (CIE 159:2004); default "CAM16". */
  model?: "CAM16" | "CIECAM02";
}

/** Viewing conditions with every constant the model derives from them (plain data, reusable for many colours). */
export interface ViewingConditions {
  readonly kind: "viewing conditions";
  readonly model: "CAM16" | "CIECAM02";
  readonly white: Tristimulus;
  readonly adaptingLuminance: number;
  readonly backgroundLuminance: number;
  readonly surround: Surround;
  /** F, c, Nc of the surround. */
  readonly F: number;
  readonly c: number;
  readonly Nc: number;
  /** Degree of adaptation D, luminance adaptation factor FL, n = Yb/Yw, z, Nbb = Ncb. */
  readonly D: number;
  readonly FL: number;
  readonly n: number;
  readonly z: number;
  readonly Nbb: number;
  /** The per-channel adaptation factors D_R, D_G, D_B and the white's achromatic response Aw. */
  readonly adaptation: readonly [number, number, number];
  readonly Aw: number;
}

/** The appearance correlates of a colour. */
export interface ColourAppearance {
  /** Lightness J (0–100 for white). */
  readonly J: number;
  /** Chroma C. */
  readonly C: number;
  /** Hue angle h in degrees, 0–360. */
  readonly h: number;
  /** Brightness Q. */
  readonly Q: number;
  /** Colourfulness M. */
  readonly M: number;
  /** Saturation s. */
  readonly s: number;
  /** Hue quadrature H, 0–400 (0 red, 100 yellow, 200 green, 300 blue). */
  readonly H: number;
}

// Li et al. 2017 Table 1 / CIE 159:2004 Table 1: F, c, Nc per surround.
const SURROUNDS: Record<Surround, readonly [number, number, number]> = {
  average: [1.0, 0.69, 1.0],
  dim: [0.9, 0.59, 0.9],
  dark: [0.8, 0.525, 0.8],
};
// Hunt–Pointer–Estévez cone space of CIECAM02 (CIE 159:2004 eq. 12).
const M_HPE: Matrix3 = [
  [0.38971, 0.68898, -0.07868],
  [-0.22981, 1.1834, 0.04641],
  [0, 0, 1],
];
const M16 = ADAPTATION_MATRICES.cat16.matrix;
const M02 = ADAPTATION_MATRICES.cat02.matrix;
const MODELS = {
  CAM16: { cat: M16, catInverse: invertMatrix3(M16, "M16"), post: undefined, postInverse: undefined },
  CIECAM02: {
    cat: M02,
    catInverse: invertMatrix3(M02, "M_CAT02"),
    post: multiplyMatrix3(M_HPE, invertMatrix3(M02, "M_CAT02")),
    postInverse: multiplyMatrix3(M02, invertMatrix3(M_HPE, "M_HPE")),
  },
} as const;
// Unique hues for hue quadrature (Li et al. 2017 Table 2; CIE 159:2004 Table 2).
const HUE_H = [20.14, 90.0, 164.25, 237.53, 380.14];
const HUE_E = [0.8, 0.7, 1.0, 1.2, 0.8];
const HUE_Q = [0, 100, 200, 300, 400];

const STATEMENT = {
  CAM16: "Colour appearance correlates were computed with CAM16 (Li et al., Color Res. Appl. 42:703, 2017).",
  CIECAM02: "Colour appearance correlates were computed with CIECAM02 (CIE 159:2004).",
} as const;

function conditionStatement(v: ViewingConditions): string {
  const w = v.white;
  return `The ${v.model} viewing conditions were: adopted white X ${w.X.toPrecision(6)}, Y ${w.Y.toPrecision(6)}, Z ${w.Z.toPrecision(6)}; adapting luminance LA ${v.adaptingLuminance} cd/m²; background Yb ${v.backgroundLuminance}; ${v.surround} surround (F ${v.F}, c ${v.c}, Nc ${v.Nc}); degree of adaptation D ${v.D.toFixed(4)}.`;
}

const compress = (x: number, FL: number): number => {
  const t = (FL * Math.abs(x)) / 100;
  const p = t ** 0.42;
  return (Math.sign(x) * 400 * p) / (p + 27.13) + 0.1;
};
const expand = (a: number, FL: number): number => {
  const x = a - 0.1;
  const ax = Math.min(Math.abs(x), 399.999999);
  return Math.sign(x) * (100 / FL) * ((27.13 * ax) / (400 - ax)) ** (1 / 0.42);
};

function adaptedResponses(xyz: Tristimulus, v: ViewingConditions): [number, number, number] {
  const m = MODELS[v.model];
  const rgb = applyMatrix3(m.cat, [xyz.X, xyz.Y, xyz.Z]);
  let c: readonly [number, number, number] = [
    rgb[0] * v.adaptation[0],
    rgb[1] * v.adaptation[1],
    rgb[2] * v.adaptation[2],
  ];
  if (m.post) c = applyMatrix3(m.post, c);
  return [compress(c[0], v.FL), compress(c[1], v.FL), compress(c[2], v.FL)];
}

/**
 * Viewing conditions for CAM16 or CIECAM02: the surround's F, c, Nc, and D, FL, n, z, Nbb, Ncb and Aw derived from the white, LA and Yb.
 *
 * D = F·(1 − (1/3.6)·exp((−LA − 42)/92)) unless given; FL = 0.2k⁴(5LA) + 0.1(1 − k⁴)²(5LA)^(1/3) with k = 1/(5LA + 1);
 * n = Yb/Yw, z = 1.48 + √n, Nbb = Ncb = 0.725·n^−0.2.
 *
 * @param input The white, adapting luminance, and optional background, surround, D and model (see `ViewingConditionsInput`).
 * @returns `ViewingConditions` for `colourAppearance` and `xyzFromAppearance`.
 * @source Li et al., Color Res. Appl. 42:703–718 (2017), Part 1 (CAM16); CIE 159:2004 §3 (CIECAM02).
 * @example viewingConditions({ white: { X: 95.05, Y: 100, Z: 108.88 }, adaptingLuminance: 64, surround: "dim" })
 */
export function viewingConditions(input: ViewingConditionsInput): ViewingConditions {
  const fn = "viewingConditions";
  checkWith(
    fn,
    "input",
    input,
    "viewing conditions { white, adaptingLuminance, backgroundLuminance?, surround?, degreeOfAdaptation?, model? }",
    (v) => typeof v === "object" && v !== null && !Array.isArray(v),
  );
  checkOptions(fn, "input", input, [
    "white",
    "adaptingLuminance",
    "backgroundLuminance",
    "surround",
    "degreeOfAdaptation",
    "model",
  ]);
  checkFields(fn, "input.white", input.white, XYZ_FIELDS);
  checkNumber(fn, "input.adaptingLuminance", input.adaptingLuminance, { unit: "cd/m²", above: 0 });
  checkNumber(fn, "input.backgroundLuminance", input.backgroundLuminance, { above: 0, optional: true });
  checkChoice(fn, "input.surround", input.surround, ["average", "dim", "dark"], { optional: true });
  checkNumber(fn, "input.degreeOfAdaptation", input.degreeOfAdaptation, {
    unit: "fraction",
    optional: true,
  });
  checkChoice(fn, "input.model", input.model, ["CAM16", "CIECAM02"], { optional: true });
  const w = input.white;
  checkWith(fn, "input.white", w, "a white with positive X, Y, Z", () => w.X > 0 && w.Y > 0 && w.Z > 0);
  const model = input.model ?? "CAM16";
  const surround = input.surround ?? "average";
  const [F, c, Nc] = SURROUNDS[surround];
  const LA = input.adaptingLuminance;
  const Yb = input.backgroundLuminance ?? 20;
  const D =
    input.degreeOfAdaptation ?? Math.min(1, Math.max(0, F * (1 - (1 / 3.6) * Math.exp((-LA - 42) / 92))));
  const k = 1 / (5 * LA + 1);
  const k4 = k ** 4;
  const FL = 0.2 * k4 * (5 * LA) + 0.1 * (1 - k4) ** 2 * Math.cbrt(5 * LA);
  const n = Yb / w.Y;
  const z = 1.48 + Math.sqrt(n);
  const Nbb = 0.725 * n ** -0.2;
  const rgbW = applyMatrix3(MODELS[model].cat, [w.X, w.Y, w.Z]);
  const adaptation = rgbW.map((v) => (D * w.Y) / v + 1 - D) as unknown as [number, number, number];
  const partial = {
    kind: "viewing conditions" as const,
    model,
    white: { X: w.X, Y: w.Y, Z: w.Z },
    adaptingLuminance: LA,
    backgroundLuminance: Yb,
    surround,
    F,
    c,
    Nc,
    D,
    FL,
    n,
    z,
    Nbb,
    adaptation,
    Aw: 0,
  };
  const [ra, ga, ba] = adaptedResponses(w, partial);
  return { ...partial, Aw: (2 * ra + ga + ba / 20 - 0.305) * Nbb };
}

function checkConditions(fn: string, conditions: unknown): asserts conditions is ViewingConditions {
  checkWith(
    fn,
    "conditions",
    conditions,
    "viewing conditions from viewingConditions({ white, adaptingLuminance, ... })",
    (v) =>
      typeof v === "object" &&
      v !== null &&
      (v as { kind?: unknown }).kind === "viewing conditions" &&
      ((v as { model?: unknown }).model === "CAM16" || (v as { model?: unknown }).model === "CIECAM02"),
  );
}

function hueQuadrature(h: number): number {
  const hp = h < HUE_H[0]! ? h + 360 : h;
  let i = 0;
  while (i < 3 && hp >= HUE_H[i + 1]!) i++;
  const a = (hp - HUE_H[i]!) / HUE_E[i]!,
    b = (HUE_H[i + 1]! - hp) / HUE_E[i + 1]!;
  return HUE_Q[i]! + (100 * a) / (a + b);
}

const eccentricity = (h: number): number => 0.25 * (Math.cos((h * Math.PI) / 180 + 2) + 3.8);

/**
 * Colour appearance correlates J, C, h, Q, M, s and H of a colour under viewing conditions (CAM16 or CIECAM02).
 *
 * The models are defined for real colours; far outside the spectrum locus the achromatic response A can fall to
 * zero or below, and J, C, Q, M and s are then returned as 0.
 *
 * @param xyz Tristimulus values { X, Y, Z } on the scale of the conditions' white (Y = 100 for a relative white).
 * @param conditions Viewing conditions from `viewingConditions`.
 * @returns { J, C, h, Q, M, s, H }.
 * @source Li et al., Color Res. Appl. 42:703–718 (2017), CAM16 forward model, steps 1–11; CIE 159:2004 for CIECAM02.
 * @example colourAppearance({ X: 19.01, Y: 20, Z: 21.78 }, viewingConditions({ white: { X: 95.05, Y: 100, Z: 108.88 }, adaptingLuminance: 318.31 }))
 */
export function colourAppearance(xyz: Tristimulus, conditions: ViewingConditions): ColourAppearance {
  checkFields("colourAppearance", "xyz", xyz, XYZ_FIELDS);
  checkConditions("colourAppearance", conditions);
  const v = conditions;
  noteMethod("colour space", STATEMENT[v.model]);
  noteMethod("colour space", conditionStatement(v));
  const [ra, ga, ba] = adaptedResponses(xyz, v);
  const a = ra - (12 * ga) / 11 + ba / 11;
  const b = (ra + ga - 2 * ba) / 9;
  let h = (Math.atan2(b, a) * 180) / Math.PI;
  if (h < 0) h += 360;
  const A = (2 * ra + ga + ba / 20 - 0.305) * v.Nbb;
  const J = A > 0 ? 100 * (A / v.Aw) ** (v.c * v.z) : 0;
  const Q = (4 / v.c) * Math.sqrt(J / 100) * (v.Aw + 4) * v.FL ** 0.25;
  const t = ((50000 / 13) * v.Nc * v.Nbb * eccentricity(h) * Math.hypot(a, b)) / (ra + ga + (21 * ba) / 20);
  const C = Math.max(t, 0) ** 0.9 * Math.sqrt(J / 100) * (1.64 - 0.29 ** v.n) ** 0.73;
  const M = C * v.FL ** 0.25;
  const s = Q > 0 ? 100 * Math.sqrt(M / Q) : 0;
  return { J, C, h, Q, M, s, H: hueQuadrature(h) };
}

/**
 * Tristimulus values of a colour given by its lightness J, chroma C (or colourfulness M) and hue angle h: the inverse model.
 *
 * @param appearance { J, h } with C or M (C is used when both are given).
 * @param conditions Viewing conditions from `viewingConditions`.
 * @returns { X, Y, Z } on the scale of the conditions' white.
 * @source Li et al., Color Res. Appl. 42:703–718 (2017), CAM16 inverse model; CIE 159:2004 §4 for CIECAM02.
 * @example xyzFromAppearance({ J: 41.73, C: 0.1, h: 217 }, viewingConditions({ white: { X: 95.05, Y: 100, Z: 108.88 }, adaptingLuminance: 318.31 }))
 */
export function xyzFromAppearance(
  appearance: { J: number; h: number; C?: number; M?: number },
  conditions: ViewingConditions,
): Tristimulus {
  const fn = "xyzFromAppearance";
  checkWith(
    fn,
    "appearance",
    appearance,
    "appearance correlates { J, h } with C or M",
    (v) => typeof v === "object" && v !== null && !Array.isArray(v),
  );
  checkNumber(fn, "appearance.J", appearance.J, { min: 0 });
  checkNumber(fn, "appearance.h", appearance.h, { unit: "degrees" });
  checkNumber(fn, "appearance.C", appearance.C, { min: 0, optional: true });
  checkNumber(fn, "appearance.M", appearance.M, { min: 0, optional: true });
  checkWith(
    fn,
    "appearance",
    appearance,
    "appearance correlates with a chroma C or a colourfulness M",
    (v) => (v as { C?: number }).C !== undefined || (v as { M?: number }).M !== undefined,
  );
  checkConditions(fn, conditions);
  const v = conditions;
  noteMethod("colour space", STATEMENT[v.model]);
  noteMethod("colour space", conditionStatement(v));
  const { J, h } = appearance;
  const C = appearance.C ?? appearance.M! / v.FL ** 0.25;
  const t = J > 0 ? (C / (Math.sqrt(J / 100) * (1.64 - 0.29 ** v.n) ** 0.73)) ** (1 / 0.9) : 0;
  const A = v.Aw * (J / 100) ** (1 / (v.c * v.z));
  const p2 = A / v.Nbb + 0.305;
  const hr = (h * Math.PI) / 180,
    sin = Math.sin(hr),
    cos = Math.cos(hr);
  let a = 0,
    b = 0;
  if (t > 0) {
    const p1 = ((50000 / 13) * v.Nc * v.Nbb * eccentricity(h)) / t;
    const p3 = 21 / 20;
    if (Math.abs(sin) >= Math.abs(cos)) {
      const p4 = p1 / sin;
      b =
        (p2 * (2 + p3) * (460 / 1403)) /
        (p4 + (2 + p3) * (220 / 1403) * (cos / sin) - 27 / 1403 + p3 * (6300 / 1403));
      a = (b * cos) / sin;
    } else {
      const p5 = p1 / cos;
      a =
        (p2 * (2 + p3) * (460 / 1403)) /
        (p5 + (2 + p3) * (220 / 1403) - (27 / 1403 - p3 * (6300 / 1403)) * (sin / cos));
      b = (a * sin) / cos;
    }
  }
  const ra = (460 * p2 + 451 * a + 288 * b) / 1403;
  const ga = (460 * p2 - 891 * a - 261 * b) / 1403;
  const ba = (460 * p2 - 220 * a - 6300 * b) / 1403;
  let c: readonly [number, number, number] = [expand(ra, v.FL), expand(ga, v.FL), expand(ba, v.FL)];
  const m = MODELS[v.model];
  if (m.postInverse) c = applyMatrix3(m.postInverse, c);
  const [X, Y, Z] = applyMatrix3(m.catInverse, [
    c[0] / v.adaptation[0],
    c[1] / v.adaptation[1],
    c[2] / v.adaptation[2],
  ]);
  return { X, Y, Z };
}
