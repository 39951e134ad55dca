/**
 * Transfer functions between linear light and encoded signal: sRGB (IEC 61966-2-1:1999), pure gamma, ITU-R BT.709
 * camera OETF, ITU-R BT.1886 display EOTF, PQ (SMPTE ST 2084:2014; ITU-R BT.2100) and HLG (ARIB STD-B67; BT.2100).
 * Linear values below zero (out-of-gamut colours) are encoded with the sign carried through, so that they stay
 * visible as out of gamut instead of turning into NaN.
 */
import { RGB_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { srgbDecodeChecked, srgbEncodeChecked } from "./srgb-curve.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";

// Argument rules built once: the transfer functions run per channel of every conversion, a hot path.
const LINEAR_FOR_SRGB = { unit: "linear light, 0–1 for in-gamut colours" };
const ENCODED_SIGNAL = { unit: "encoded signal, 0–1" };
const LINEAR_LIGHT = { unit: "linear light, 0–1" };
const POSITIVE = { above: 0 };
const LUMINANCE = { unit: "cd/m²" };
const SCENE_LINEAR = { unit: "scene linear light, 0–1" };
const POSITIVE_LUMINANCE = { unit: "cd/m²", above: 0 };

function requireFinite(what: string, value: number): void {
  if (typeof value !== "number" || !Number.isFinite(value))
    throw new Error(`${what}: the value ${value} is not a finite number`);
}

function odd(f: (x: number) => number): (x: number) => number {
  return (x) => (x < 0 ? -f(-x) : f(x));
}

/**
 * sRGB encoding of a linear value: V = 12.92·L for L ≤ 0.0031308, else 1.055·L^(1/2.4) − 0.055 (negative values keep their sign).
 *
 * @param linear Linear light, relative 0–1 (values outside are encoded too).
 * @returns The encoded signal, 0–1 for linear 0–1.
 * @source IEC 61966-2-1:1999 §5.3.
 * @example srgbEncode(0.18)
 */
export function srgbEncode(linear: number): number {
  checkNumber("srgbEncode", "linear", linear, LINEAR_FOR_SRGB);
  return srgbEncodeChecked(linear);
}

/**
 * sRGB decoding of a signal: L = V ÷ 12.92 for V ≤ 0.04045, else ((V + 0.055) ÷ 1.055)^2.4 (negative values keep their sign).
 *
 * @param signal The encoded signal, 0–1.
 * @returns Linear light, relative 0–1.
 * @source IEC 61966-2-1:1999 §5.2.
 * @example srgbDecode(0.5)
 */
export function srgbDecode(signal: number): number {
  checkNumber("srgbDecode", "signal", signal, ENCODED_SIGNAL);
  return srgbDecodeChecked(signal);
}

function requireGamma(what: string, gamma: number): void {
  if (typeof gamma !== "number" || !Number.isFinite(gamma) || gamma <= 0)
    throw new Error(`${what}: gamma ${gamma} must be a positive finite number`);
}

/**
 * Pure power-law encoding V = L^(1/γ) (negative values keep their sign).
 *
 * @param linear Linear light, relative 0–1.
 * @param gamma The exponent γ, positive (e.g. 2.2).
 * @returns The encoded signal.
 * @source none: a pure power law, no published formula.
 * @example gammaEncode(0.18, 2.2)
 */
export function gammaEncode(linear: number, gamma: number): number {
  checkNumber("gammaEncode", "linear", linear, LINEAR_LIGHT);
  checkNumber("gammaEncode", "gamma", gamma, POSITIVE);
  requireGamma("gammaEncode", gamma);
  const e = (linear < 0 ? -linear : linear) ** (1 / gamma);
  return linear < 0 ? -e : e;
}

/**
 * Pure power-law decoding L = V^γ (negative values keep their sign).
 *
 * @param signal The encoded signal, 0–1.
 * @param gamma The exponent γ, positive (e.g. 2.2).
 * @returns Linear light, relative 0–1.
 * @source none: a pure power law, no published formula.
 * @example gammaDecode(0.5, 2.2)
 */
export function gammaDecode(signal: number, gamma: number): number {
  checkNumber("gammaDecode", "signal", signal, ENCODED_SIGNAL);
  checkNumber("gammaDecode", "gamma", gamma, POSITIVE);
  requireGamma("gammaDecode", gamma);
  const l = (signal < 0 ? -signal : signal) ** gamma;
  return signal < 0 ? -l : l;
}

/**
 * ITU-R BT.709 camera OETF: V = 4.500·L for L < 0.018, else 1.099·L^0.45 − 0.099.
 *
 * @param linear Scene linear light, relative 0–1.
 * @returns The encoded signal, 0–1.
 * @source ITU-R BT.709-6 (opto-electronic transfer characteristic).
 * @example bt709Encode(0.18)
 */
export function bt709Encode(linear: number): number {
  checkNumber("bt709Encode", "linear", linear, LINEAR_LIGHT);
  const l = linear < 0 ? -linear : linear;
  const e = l < 0.018 ? 4.5 * l : 1.099 * l ** 0.45 - 0.099;
  return linear < 0 ? -e : e;
}

/**
 * Inverse of the ITU-R BT.709 OETF: L = V ÷ 4.5 for V < 0.081, else ((V + 0.099) ÷ 1.099)^(1/0.45).
 *
 * @param signal The encoded signal, 0–1.
 * @returns Scene linear light, relative 0–1.
 * @source ITU-R BT.709-6 (the OETF, inverted).
 * @example bt709Decode(0.409)
 */
export function bt709Decode(signal: number): number {
  checkNumber("bt709Decode", "signal", signal, ENCODED_SIGNAL);
  const v = signal < 0 ? -signal : signal;
  const l = v < 0.081 ? v / 4.5 : ((v + 0.099) / 1.099) ** (1 / 0.45);
  return signal < 0 ? -l : l;
}

/** Screen white and black luminance for the BT.1886 EOTF, in cd/m². */
export interface DisplayLuminance {
  /** Lw, default 100 cd/m². */
  whiteLuminance?: number;
  /** Lb, default 0 (the EOTF is then a pure 2.4 power). */
  blackLuminance?: number;
}

function bt1886Constants(what: string, d: DisplayLuminance): { a: number; b: number; lw: number } {
  const lw = d.whiteLuminance ?? 100;
  const lb = d.blackLuminance ?? 0;
  if (!(Number.isFinite(lw) && Number.isFinite(lb) && lw > 0 && lb >= 0 && lb < lw)) {
    throw new Error(`${what}: white ${lw} cd/m² and black ${lb} cd/m² must satisfy 0 ≤ Lb < Lw`);
  }
  const root = lw ** (1 / 2.4) - lb ** (1 / 2.4);
  return { a: root ** 2.4, b: lb ** (1 / 2.4) / root, lw };
}

/**
 * ITU-R BT.1886 reference display EOTF: L = a·max(V + b, 0)^2.4, with a and b from the screen's white and black luminance.
 *
 * a = (Lw^(1/2.4) − Lb^(1/2.4))^2.4, b = Lb^(1/2.4) ÷ (Lw^(1/2.4) − Lb^(1/2.4)).
 *
 * @param signal The video signal V, 0–1.
 * @param display { whiteLuminance Lw in cd/m², default 100; blackLuminance Lb in cd/m², default 0 } (0 ≤ Lb < Lw).
 * @returns The screen luminance L, in cd/m².
 * @source ITU-R BT.1886 (03/2011), reference EOTF.
 * @example bt1886Eotf(0.5, { whiteLuminance: 120, blackLuminance: 0.1 })
 */
export function bt1886Eotf(signal: number, display: DisplayLuminance = {}): number {
  checkNumber("bt1886Eotf", "signal", signal, ENCODED_SIGNAL);
  checkOptions("bt1886Eotf", "display", display, ["whiteLuminance", "blackLuminance"]);
  const { a, b } = bt1886Constants("bt1886Eotf", display);
  return a * Math.max(signal + b, 0) ** 2.4;
}

/**
 * Inverse of the ITU-R BT.1886 EOTF: V = (L ÷ a)^(1/2.4) − b.
 *
 * @param luminance The screen luminance L, in cd/m².
 * @param display { whiteLuminance Lw in cd/m², default 100; blackLuminance Lb in cd/m², default 0 }.
 * @returns The video signal V, 0–1 for Lb ≤ L ≤ Lw.
 * @source ITU-R BT.1886 (03/2011), reference EOTF, inverted.
 * @example bt1886InverseEotf(20)
 */
export function bt1886InverseEotf(luminance: number, display: DisplayLuminance = {}): number {
  checkNumber("bt1886InverseEotf", "luminance", luminance, LUMINANCE);
  checkOptions("bt1886InverseEotf", "display", display, ["whiteLuminance", "blackLuminance"]);
  const { a, b } = bt1886Constants("bt1886InverseEotf", display);
  return odd((l) => (l / a) ** (1 / 2.4))(luminance) - b;
}

// SMPTE ST 2084:2014 constants.
const PQ_M1 = 2610 / 16384;
const PQ_M2 = (2523 / 4096) * 128;
const PQ_C1 = 3424 / 4096;
const PQ_C2 = (2413 / 4096) * 32;
const PQ_C3 = (2392 / 4096) * 32;

/** PQ peak luminance: signal 1 is 10 000 cd/m² (SMPTE ST 2084:2014). */
export const PQ_PEAK_LUMINANCE = 10000;

/**
 * PQ inverse EOTF: N = ((c1 + c2·Y^m1) ÷ (1 + c3·Y^m1))^m2 with Y = L ÷ 10000.
 *
 * @param luminance The display luminance L, in cd/m² (0–10000).
 * @returns The PQ signal N, 0–1.
 * @source SMPTE ST 2084:2014 eq. 5.2; ITU-R BT.2100-2.
 * @example pqEncode(100)
 */
export function pqEncode(luminance: number): number {
  checkNumber("pqEncode", "luminance", luminance, LUMINANCE);
  return odd((l) => {
    const ym = (l / PQ_PEAK_LUMINANCE) ** PQ_M1;
    return ((PQ_C1 + PQ_C2 * ym) / (1 + PQ_C3 * ym)) ** PQ_M2;
  })(luminance);
}

/**
 * PQ EOTF: L = 10000·(max(N^(1/m2) − c1, 0) ÷ (c2 − c3·N^(1/m2)))^(1/m1).
 *
 * @param signal The PQ signal N, 0–1.
 * @returns The display luminance L, in cd/m².
 * @source SMPTE ST 2084:2014 eq. 5.1; ITU-R BT.2100-2.
 * @example pqDecode(0.5)
 */
export function pqDecode(signal: number): number {
  checkNumber("pqDecode", "signal", signal, ENCODED_SIGNAL);
  return odd((n) => {
    const np = n ** (1 / PQ_M2);
    const den = PQ_C2 - PQ_C3 * np;
    if (!(den > 0)) throw new Error(`pqDecode: signal ${signal} is beyond the range of the PQ curve`);
    return PQ_PEAK_LUMINANCE * (Math.max(np - PQ_C1, 0) / den) ** (1 / PQ_M1);
  })(signal);
}

// ITU-R BT.2100-2 Table 5 (HLG) constants.
const HLG_A = 0.17883277;
const HLG_B = 1 - 4 * HLG_A;
const HLG_C = 0.5 - HLG_A * Math.log(4 * HLG_A);

/**
 * HLG OETF: E′ = √(3E) for E ≤ 1/12, else a·ln(12E − b) + c.
 *
 * @param sceneLinear Normalised scene light E, 0–1.
 * @returns The HLG signal E′, 0–1.
 * @source ITU-R BT.2100-2 Table 5.
 * @example hlgEncode(0.18)
 */
export function hlgEncode(sceneLinear: number): number {
  checkNumber("hlgEncode", "sceneLinear", sceneLinear, SCENE_LINEAR);
  return odd((e) => (e <= 1 / 12 ? Math.sqrt(3 * e) : HLG_A * Math.log(12 * e - HLG_B) + HLG_C))(sceneLinear);
}

/**
 * HLG inverse OETF: E = E′² ÷ 3 for E′ ≤ 1/2, else (exp((E′ − c) ÷ a) + b) ÷ 12.
 *
 * @param signal The HLG signal E′, 0–1.
 * @returns Normalised scene light E, 0–1.
 * @source ITU-R BT.2100-2 Table 5.
 * @example hlgDecode(0.5)
 */
export function hlgDecode(signal: number): number {
  checkNumber("hlgDecode", "signal", signal, ENCODED_SIGNAL);
  return odd((v) => (v <= 0.5 ? (v * v) / 3 : (Math.exp((v - HLG_C) / HLG_A) + HLG_B) / 12))(signal);
}

/**
 * HLG OOTF with zero black level: display light F_D = Lw·Ys^(γ − 1)·E per channel, Ys = 0.2627R + 0.6780G + 0.0593B, γ = 1.2 + 0.42·log10(Lw ÷ 1000).
 *
 * @param sceneLinear Normalised scene light { r, g, b }, each 0–1.
 * @param peakLuminance The display's nominal peak luminance Lw, in cd/m²; default 1000.
 * @returns Display light { r, g, b } in cd/m².
 * @source ITU-R BT.2100-2 Table 5 (OOTF, Lb = 0).
 * @example hlgDisplayLight({ r: 0.5, g: 0.5, b: 0.5 }, 1000)
 */
export function hlgDisplayLight(
  sceneLinear: { r: number; g: number; b: number },
  peakLuminance = 1000,
): { r: number; g: number; b: number } {
  checkFields("hlgDisplayLight", "sceneLinear", sceneLinear, RGB_FIELDS);
  checkNumber("hlgDisplayLight", "peakLuminance", peakLuminance, POSITIVE_LUMINANCE);
  for (const k of ["r", "g", "b"] as const) requireFinite(`hlgDisplayLight (${k})`, sceneLinear[k]);
  if (!(Number.isFinite(peakLuminance) && peakLuminance > 0))
    throw new Error(`hlgDisplayLight: peak luminance ${peakLuminance} cd/m² must be positive`);
  const gamma = 1.2 + 0.42 * Math.log10(peakLuminance / 1000);
  const ys = 0.2627 * sceneLinear.r + 0.678 * sceneLinear.g + 0.0593 * sceneLinear.b;
  const k = ys > 0 ? peakLuminance * ys ** (gamma - 1) : 0;
  return { r: k * sceneLinear.r, g: k * sceneLinear.g, b: k * sceneLinear.b };
}

// ISO 22028-2:2013 (ROMM RGB): Et = 16^(1.8 / (1 − 1.8)) = 1/512, the end of the linear segment.
const ROMM_ET = 1 / 512;

/**
 * ROMM RGB encoding: C′ = 16·C for C < Et = 1/512, else C^(1/1.8) (negative values keep their sign).
 *
 * @param linear Linear light, relative 0–1.
 * @returns The encoded signal, 0–1.
 * @source ISO 22028-2:2013 (ROMM RGB), the non-linear encoding.
 * @example rommEncode(0.18)
 */
export function rommEncode(linear: number): number {
  checkNumber("rommEncode", "linear", linear, LINEAR_LIGHT);
  return odd((c) => (c < ROMM_ET ? 16 * c : c ** (1 / 1.8)))(linear);
}

/**
 * ROMM RGB decoding: C = C′ ÷ 16 for C′ < 16·Et = 1/32, else C′^1.8 (negative values keep their sign).
 *
 * @param signal The encoded signal, 0–1.
 * @returns Linear light, relative 0–1.
 * @source ISO 22028-2:2013 (ROMM RGB), the encoding inverted.
 * @example rommDecode(0.5)
 */
export function rommDecode(signal: number): number {
  checkNumber("rommDecode", "signal", signal, ENCODED_SIGNAL);
  return odd((v) => (v < 16 * ROMM_ET ? v / 16 : v ** 1.8))(signal);
}

/** The opRGB exponent 563/256 = 2.19921875 (IEC 61966-2-5:2007). */
export const OPRGB_GAMMA = 563 / 256;

/** The transfer functions an RGB space can name. */
export type TransferName =
  | "sRGB"
  | "linear"
  | "gamma 2.2"
  | "gamma 2.4"
  | "gamma 2.6"
  | "BT.709"
  | "BT.1886"
  | "PQ"
  | "HLG"
  | "opRGB"
  | "ROMM";

/** A transfer function by name: encode (linear → signal) and decode (signal → linear), and what it is for the Methods section. */
export interface TransferFunction {
  readonly name: TransferName;
  readonly description: string;
  encode(linear: number): number;
  decode(signal: number): number;
}

const TRANSFERS: Record<TransferName, TransferFunction> = {
  sRGB: {
    name: "sRGB",
    description: "the sRGB transfer function of IEC 61966-2-1:1999",
    encode: srgbEncode,
    decode: srgbDecode,
  },
  linear: {
    name: "linear",
    description: "no transfer function (linear values)",
    encode: (v) => (requireFinite("linear", v), v),
    decode: (v) => (requireFinite("linear", v), v),
  },
  "gamma 2.2": {
    name: "gamma 2.2",
    description: "a pure power law with γ = 2.2",
    encode: (v) => gammaEncode(v, 2.2),
    decode: (v) => gammaDecode(v, 2.2),
  },
  "gamma 2.4": {
    name: "gamma 2.4",
    description: "a pure power law with γ = 2.4",
    encode: (v) => gammaEncode(v, 2.4),
    decode: (v) => gammaDecode(v, 2.4),
  },
  "gamma 2.6": {
    name: "gamma 2.6",
    description: "a pure power law with γ = 2.6",
    encode: (v) => gammaEncode(v, 2.6),
    decode: (v) => gammaDecode(v, 2.6),
  },
  "BT.709": {
    name: "BT.709",
    description: "the ITU-R BT.709-6 camera OETF and its inverse",
    encode: bt709Encode,
    decode: bt709Decode,
  },
  "BT.1886": {
    name: "BT.1886",
    description:
      "the ITU-R BT.1886 reference display EOTF with zero black level, i.e. a 2.4 power law, values relative to white",
    encode: (v) => gammaEncode(v, 2.4),
    decode: (v) => gammaDecode(v, 2.4),
  },
  PQ: {
    name: "PQ",
    description: "the PQ curve of SMPTE ST 2084:2014 (ITU-R BT.2100), linear 1 = 10 000 cd/m²",
    encode: (v) => pqEncode(v * PQ_PEAK_LUMINANCE),
    decode: (v) => pqDecode(v) / PQ_PEAK_LUMINANCE,
  },
  HLG: {
    name: "HLG",
    description: "the HLG OETF of ITU-R BT.2100-2 (scene light, linear 1 = nominal peak)",
    encode: hlgEncode,
    decode: hlgDecode,
  },
  opRGB: {
    name: "opRGB",
    description: "the opRGB power law of IEC 61966-2-5:2007 (γ = 563/256)",
    encode: (v) => gammaEncode(v, OPRGB_GAMMA),
    decode: (v) => gammaDecode(v, OPRGB_GAMMA),
  },
  ROMM: {
    name: "ROMM",
    description: "the ROMM RGB encoding of ISO 22028-2:2013 (1/1.8 power with a linear segment below 1/512)",
    encode: rommEncode,
    decode: rommDecode,
  },
};

/**
 * The transfer function with this name ("sRGB", "linear", "gamma 2.2", "gamma 2.4", "gamma 2.6", "BT.709", "BT.1886", "PQ", "HLG", "opRGB", "ROMM"); an unknown name is an error listing the known ones.
 *
 * "PQ" here takes linear 1 = 10000 cd/m²; "BT.1886" is the EOTF with zero black level (a 2.4 power law).
 *
 * @param name The transfer function's name.
 * @returns { name, description, encode(linear), decode(signal) }.
 * @source IEC 61966-2-1:1999; ITU-R BT.709-6; ITU-R BT.1886; SMPTE ST 2084:2014; ITU-R BT.2100-2; IEC 61966-2-5:2007; ISO 22028-2:2013.
 * @example transferFunction("sRGB").encode(0.5)
 */
export function transferFunction(name: TransferName | string): TransferFunction {
  // Known names return at once: the conversions ask on every call, and the refusal's message lists every name.
  if (typeof name === "string" && Object.hasOwn(TRANSFERS, name)) return TRANSFERS[name as TransferName];
  checkWith(
    "transferFunction",
    "name",
    name,
    `a transfer function name, one of ${Object.keys(TRANSFERS).join(", ")}`,
    (n) => typeof n === "string" && Object.hasOwn(TRANSFERS, n),
  );
  const t = TRANSFERS[name as TransferName];
  if (!t) throw new Error(`unknown transfer function "${name}"; known: ${Object.keys(TRANSFERS).join(", ")}`);
  return t;
}
