/**
 * Gamut mapping for display (drawing only: nothing here writes to the methods log). A colour a display cannot show is
 * brought inside its gamut the way CSS Color Module Level 4 §13.2 specifies for browsers ("binary search gamut mapping
 * with local MINDE"): keep OKLab lightness and hue, reduce OKLCh chroma by bisection until the colour, clipped to the
 * display's RGB cube, lies within ΔEOK = 0.02 (one just-noticeable difference) of the unclipped one; lightness at or
 * above white gives white, at or below black gives black. OKLab is Ottosson's (2020) space with the XYZ (D65) → LMS
 * and LMS → OKLab matrices of CSS Color 4 §9. Unlike clipping each RGB channel, this keeps a dark saturated light
 * dark: a blue LED at 3 % of the white's luminance no longer shows as a bright blue.
 */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { linearRgb, xyzFromLinearRgb, type DisplayGamut } from "./display-rgb.ts";

type Vec3 = [number, number, number];

// CSS Color 4 §9 (OKLab), XYZ relative to D65 on the Y = 1 scale.
const XYZ_TO_LMS: readonly Vec3[] = [
  [0.819022437996703, 0.3619062600528904, -0.1288737815209879],
  [0.0329836539323885, 0.9292868615863434, 0.0361446663506424],
  [0.0481771893596242, 0.2642395317527308, 0.6335478284694309],
];
const LMS_TO_XYZ: readonly Vec3[] = [
  [1.2268798758459243, -0.5578149944602171, 0.2813910456659647],
  [-0.0405757452148008, 1.112286803280317, -0.0717110580655164],
  [-0.0763729366746601, -0.4214933324022432, 1.5869240198367816],
];
const LMS_TO_OKLAB: readonly Vec3[] = [
  [0.210454268309314, 0.7936177747023054, -0.0040720430116193],
  [1.9779985324311684, -2.42859224204858, 0.450593709617411],
  [0.0259040424655478, 0.7827717124575296, -0.8086757549230774],
];
const OKLAB_TO_LMS: readonly Vec3[] = [
  [1, 0.3963377773761749, 0.2158037573099136],
  [1, -0.1055613458156586, -0.0638541728258133],
  [1, -0.0894841775298119, -1.2914855480194092],
];

function times(m: readonly Vec3[], v: readonly number[]): Vec3 {
  return [
    m[0]![0] * v[0]! + m[0]![1] * v[1]! + m[0]![2] * v[2]!,
    m[1]![0] * v[0]! + m[1]![1] * v[1]! + m[1]![2] * v[2]!,
    m[2]![0] * v[0]! + m[2]![1] * v[1]! + m[2]![2] * v[2]!,
  ];
}

/** OKLab L, a, b of XYZ relative to D65 on the Y = 1 scale (Ottosson 2020; CSS Color 4 §9). */
export function oklabFromXyz(xyz: Tristimulus): Vec3 {
  const lms = times(XYZ_TO_LMS, [xyz.X, xyz.Y, xyz.Z]);
  return times(LMS_TO_OKLAB, lms.map(Math.cbrt));
}

/** XYZ (D65, Y = 1 scale) of OKLab L, a, b: the inverse of oklabFromXyz. */
export function xyzFromOklab(lab: readonly number[]): Tristimulus {
  const lms = times(OKLAB_TO_LMS, lab).map((v) => v * v * v);
  const [X, Y, Z] = times(LMS_TO_XYZ, lms);
  return { X, Y, Z };
}

/** How a colour was brought inside the display's gamut. */
export type GamutMapping = "inside" | "chroma reduced" | "white" | "black";

export interface MappedColour {
  /** Linear RGB of the display, every channel in 0–1. */
  readonly linear: Vec3;
  readonly how: GamutMapping;
}

const JND = 0.02; // ΔEOK, CSS Color 4 §13.2
const EPSILON = 0.0001; // chroma resolution of the search, CSS Color 4 §13.2
const INSIDE = 1e-4; // the tolerance insideCube() uses for rounding

const clamp01 = (v: number) => Math.min(1, Math.max(0, v));

/**
 * The colour as a display of the given gamut shows it after CSS Color 4 gamut mapping (see the file header). `xyz` is
 * relative to the D65 display white, on the Y = 1 scale (white Y = 1).
 */
export function mapToDisplayGamut(xyz: Tristimulus, gamut: DisplayGamut): MappedColour {
  if (![xyz.X, xyz.Y, xyz.Z].every(Number.isFinite))
    throw new Error(`gamut mapping: XYZ (${xyz.X}, ${xyz.Y}, ${xyz.Z}) must be finite`);
  const rgb = linearRgb(xyz, gamut);
  if (rgb.every((v) => v >= -INSIDE && v <= 1 + INSIDE))
    return { linear: rgb.map(clamp01) as Vec3, how: "inside" };
  const [L, a, b] = oklabFromXyz(xyz);
  if (L >= 1) return { linear: [1, 1, 1], how: "white" };
  if (L <= 0) return { linear: [0, 0, 0], how: "black" };
  const hue = Math.atan2(b, a);
  const cosH = Math.cos(hue),
    sinH = Math.sin(hue);
  const atChroma = (c: number): Vec3 => [L, c * cosH, c * sinH];
  const clipOf = (lab: Vec3): { linear: Vec3; deltaE: number } => {
    const linear = linearRgb(xyzFromOklab(lab), gamut).map(clamp01) as Vec3;
    // The clipped colour back in OKLab, through the display's own RGB → XYZ matrix.
    const back = oklabFromXyz(xyzFromLinearRgb(linear, gamut));
    return { linear, deltaE: Math.hypot(back[0] - lab[0], back[1] - lab[1], back[2] - lab[2]) };
  };
  const inside = (lab: Vec3) => linearRgb(xyzFromOklab(lab), gamut).every((v) => v >= 0 && v <= 1);
  let clipped = clipOf([L, a, b]);
  if (clipped.deltaE < JND) return { linear: clipped.linear, how: "chroma reduced" };
  let min = 0,
    max = Math.hypot(a, b),
    minInside = true;
  while (max - min > EPSILON) {
    const chroma = (min + max) / 2;
    const current = atChroma(chroma);
    if (minInside && inside(current)) {
      min = chroma;
      continue;
    }
    clipped = clipOf(current);
    if (clipped.deltaE < JND) {
      if (JND - clipped.deltaE < EPSILON) break;
      minInside = false;
      min = chroma;
    } else {
      max = chroma;
    }
  }
  return { linear: clipped.linear, how: "chroma reduced" };
}
