/**
 * Integer code values of video signals, both ways, for n-bit narrow ("video", "limited") and full range: luma and
 * R′G′B′ D = round((219·E′ + 16)·2^(n−8)), colour difference D = round((224·E′ + 128)·2^(n−8)) in narrow range;
 * D = round((2ⁿ − 1)·E′) and round((2ⁿ − 1)·E′ + 2^(n−1)) in full range (ITU-R BT.709-6 Part 2 §4.6, BT.2020-2
 * Table 5, BT.2100-2 Table 9). Codes are kept inside the permitted range: narrow range excludes the codes reserved
 * for timing (0–2^(n−8)−1 and the top 2^(n−8)), full range spans 0 to 2ⁿ − 1.
 */
import { RGB_FIELDS, checkFields, type FieldShape } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { Rgb } from "../rgb/rgb-conversion.ts";
import { YCBCR_FIELDS, type Ycbcr } from "./ycbcr.ts";

/** How a signal is quantised: bit depth and range. */
export interface CodeValueFormat {
  /** Bit depth, a whole number from 8 to 16 (8, 10 and 12 are those of the standards; required). */
  bits: number;
  /** "narrow" (16–235 at 8 bits, 64–940 at 10 bits) or "full" (0–255, 0–1023); required. */
  range: "narrow" | "full";
}

/** The documented code values of a format. */
export interface CodeValueRange {
  readonly bits: number;
  readonly range: "narrow" | "full";
  /** Luma (and R′G′B′) code of signal 0 and of signal 1: 64 and 940 for 10-bit narrow range. */
  readonly black: number;
  readonly white: number;
  /** Colour-difference codes of −0.5, 0 and +0.5: 64, 512 and 960 for 10-bit narrow range. */
  readonly chromaMin: number;
  readonly chromaZero: number;
  readonly chromaMax: number;
  /** The lowest and highest permitted code (narrow range leaves out the codes reserved for timing). */
  readonly lowest: number;
  readonly highest: number;
}

/** Integer code values of Y′CbCr. */
export const YCBCR_CODE_FIELDS: FieldShape = {
  what: "Y′CbCr code values { Y, Cb, Cr } (whole numbers)",
  keys: ["Y", "Cb", "Cr"],
};

const statements = new Map<string, string>();
const STATEMENT = (f: CodeValueFormat): string => {
  const key = `${f.bits} ${f.range}`;
  let s = statements.get(key);
  if (s === undefined) statements.set(key, (s = statementOf(f)));
  return s;
};
const statementOf = (f: CodeValueFormat) =>
  `Signals were quantised to ${f.bits}-bit ${f.range}-range integer code values per ITU-R BT.709-6, BT.2020-2 and BT.2100-2 (${f.range === "narrow" ? "D = round((219·E′ + 16)·2^(n−8)) for luma and R′G′B′, round((224·E′ + 128)·2^(n−8)) for colour differences" : "D = round((2ⁿ − 1)·E′), round((2ⁿ − 1)·E′ + 2^(n−1)) for colour differences"}).`;

function checkFormat(fn: string, format: unknown): asserts format is CodeValueFormat {
  checkWith(
    fn,
    "format",
    format,
    'a code-value format { bits: 8 | 10 | 12, range: "narrow" | "full" }',
    (v) => typeof v === "object" && v !== null && !Array.isArray(v),
  );
  checkOptions(fn, "format", format, ["bits", "range"]);
  const f = format as CodeValueFormat;
  checkNumber(fn, "format.bits", f.bits, { integer: true, min: 8, max: 16, unit: "bits" });
  checkChoice(fn, "format.range", f.range, ["narrow", "full"]);
}

/**
 * The documented code values of a format: black and white luma codes, colour-difference codes of −0.5, 0, +0.5, and the permitted range.
 *
 * @param format { bits, range }: e.g. { bits: 10, range: "narrow" } gives black 64, white 940, chroma 64–512–960, codes 4–1019.
 * @returns A `CodeValueRange`.
 * @source ITU-R BT.709-6 Part 2 §4.6; ITU-R BT.2020-2 Table 5; ITU-R BT.2100-2 Table 9.
 * @example codeValueRange({ bits: 10, range: "narrow" })
 */
export function codeValueRange(format: CodeValueFormat): CodeValueRange {
  checkFormat("codeValueRange", format);
  const n = format.bits,
    s = 2 ** (n - 8),
    top = 2 ** n - 1;
  if (format.range === "narrow")
    return {
      bits: n,
      range: "narrow",
      black: 16 * s,
      white: 235 * s,
      chromaMin: 16 * s,
      chromaZero: 128 * s,
      chromaMax: 240 * s,
      lowest: s,
      highest: top - s,
    };
  return {
    bits: n,
    range: "full",
    black: 0,
    white: top,
    chromaMin: Math.round(-0.5 * top + 2 ** (n - 1)),
    chromaZero: 2 ** (n - 1),
    chromaMax: Math.round(0.5 * top + 2 ** (n - 1)),
    lowest: 0,
    highest: top,
  };
}

function clamp(code: number, f: CodeValueFormat): number {
  const s = f.range === "narrow" ? 2 ** (f.bits - 8) : 0;
  return Math.min(Math.max(code, s), 2 ** f.bits - 1 - s);
}

const lumaCode = (e: number, f: CodeValueFormat): number =>
  clamp(Math.round(f.range === "narrow" ? (219 * e + 16) * 2 ** (f.bits - 8) : (2 ** f.bits - 1) * e), f);
const chromaCode = (e: number, f: CodeValueFormat): number =>
  clamp(
    Math.round(
      f.range === "narrow" ? (224 * e + 128) * 2 ** (f.bits - 8) : (2 ** f.bits - 1) * e + 2 ** (f.bits - 1),
    ),
    f,
  );
const lumaValue = (d: number, f: CodeValueFormat): number =>
  f.range === "narrow" ? (d / 2 ** (f.bits - 8) - 16) / 219 : d / (2 ** f.bits - 1);
const chromaValue = (d: number, f: CodeValueFormat): number =>
  f.range === "narrow" ? (d / 2 ** (f.bits - 8) - 128) / 224 : (d - 2 ** (f.bits - 1)) / (2 ** f.bits - 1);

function checkCode(fn: string, arg: string, code: unknown, f: CodeValueFormat): void {
  const r = codeValueRange(f);
  checkNumber(fn, arg, code, {
    integer: true,
    min: r.lowest,
    max: r.highest,
    unit: `${f.bits}-bit ${f.range}-range code value`,
  });
}

/**
 * The code value of a luma or R′G′B′ signal (0–1), rounded and kept inside the permitted codes.
 *
 * @param signal The non-linear signal E′, 0–1 (values outside give codes below black or above white, down to the permitted limit).
 * @param format { bits, range }.
 * @returns The integer code value.
 * @source ITU-R BT.709-6 Part 2 §4.6; ITU-R BT.2020-2 Table 5; ITU-R BT.2100-2 Table 9.
 * @example signalCodeValue(0.5, { bits: 10, range: "narrow" })
 */
export function signalCodeValue(signal: number, format: CodeValueFormat): number {
  checkNumber("signalCodeValue", "signal", signal, { unit: "non-linear signal, 0–1" });
  checkFormat("signalCodeValue", format);
  noteMethod("rgb encoding", STATEMENT(format));
  return lumaCode(signal, format);
}

/**
 * The signal (0–1) of a luma or R′G′B′ code value: E′ = (D ÷ 2^(n−8) − 16) ÷ 219 (narrow) or D ÷ (2ⁿ − 1) (full).
 *
 * @param code The integer code value, within the permitted codes of the format.
 * @param format { bits, range }.
 * @returns The non-linear signal E′ (0 at black, 1 at white; outside 0–1 for codes beyond them).
 * @source ITU-R BT.709-6 Part 2 §4.6; ITU-R BT.2020-2 Table 5; ITU-R BT.2100-2 Table 9 (inverted).
 * @example codeValueSignal(940, { bits: 10, range: "narrow" })
 */
export function codeValueSignal(code: number, format: CodeValueFormat): number {
  checkFormat("codeValueSignal", format);
  checkCode("codeValueSignal", "code", code, format);
  noteMethod("rgb encoding", STATEMENT(format));
  return lumaValue(code, format);
}

/**
 * Integer code values of an R′G′B′ signal, channel by channel (as luma).
 *
 * @param rgb The non-linear signal { r, g, b }, each 0–1.
 * @param format { bits, range }.
 * @returns Code values { r, g, b }.
 * @source ITU-R BT.709-6 Part 2 §4.6; ITU-R BT.2020-2 Table 5; ITU-R BT.2100-2 Table 9.
 * @example rgbCodeValues({ r: 1, g: 0.5, b: 0 }, { bits: 8, range: "full" })
 */
export function rgbCodeValues(rgb: Rgb, format: CodeValueFormat): Rgb {
  checkFields("rgbCodeValues", "rgb", rgb, RGB_FIELDS);
  checkFormat("rgbCodeValues", format);
  noteMethod("rgb encoding", STATEMENT(format));
  return { r: lumaCode(rgb.r, format), g: lumaCode(rgb.g, format), b: lumaCode(rgb.b, format) };
}

/**
 * The R′G′B′ signal of integer code values: the inverse of `rgbCodeValues`.
 *
 * @param codes Code values { r, g, b }, whole numbers within the permitted codes.
 * @param format { bits, range }.
 * @returns The non-linear signal { r, g, b }.
 * @source ITU-R BT.709-6 Part 2 §4.6; ITU-R BT.2020-2 Table 5; ITU-R BT.2100-2 Table 9 (inverted).
 * @example rgbSignalFromCodeValues({ r: 940, g: 502, b: 64 }, { bits: 10, range: "narrow" })
 */
export function rgbSignalFromCodeValues(codes: Rgb, format: CodeValueFormat): Rgb {
  checkFields("rgbSignalFromCodeValues", "codes", codes, RGB_FIELDS);
  checkFormat("rgbSignalFromCodeValues", format);
  for (const k of ["r", "g", "b"] as const)
    checkCode("rgbSignalFromCodeValues", `codes.${k}`, codes[k], format);
  noteMethod("rgb encoding", STATEMENT(format));
  return { r: lumaValue(codes.r, format), g: lumaValue(codes.g, format), b: lumaValue(codes.b, format) };
}

/**
 * Integer code values of a Y′CbCr signal: luma as `signalCodeValue`, Cb and Cr with the colour-difference scaling.
 *
 * @param ycbcr { Y, Cb, Cr }: Y′ 0–1, Cb and Cr −0.5 to 0.5.
 * @param format { bits, range }.
 * @returns Code values { Y, Cb, Cr }.
 * @source ITU-R BT.709-6 Part 2 §4.6; ITU-R BT.2020-2 Table 5; ITU-R BT.2100-2 Table 9.
 * @example ycbcrCodeValues({ Y: 1, Cb: 0, Cr: 0 }, { bits: 10, range: "narrow" })
 */
export function ycbcrCodeValues(ycbcr: Ycbcr, format: CodeValueFormat): Ycbcr {
  checkFields("ycbcrCodeValues", "ycbcr", ycbcr, YCBCR_FIELDS);
  checkFormat("ycbcrCodeValues", format);
  noteMethod("rgb encoding", STATEMENT(format));
  return { Y: lumaCode(ycbcr.Y, format), Cb: chromaCode(ycbcr.Cb, format), Cr: chromaCode(ycbcr.Cr, format) };
}

/**
 * The Y′CbCr signal of integer code values: the inverse of `ycbcrCodeValues`.
 *
 * @param codes Code values { Y, Cb, Cr }, whole numbers within the permitted codes.
 * @param format { bits, range }.
 * @returns { Y, Cb, Cr }: Y′ 0–1, Cb and Cr −0.5 to 0.5.
 * @source ITU-R BT.709-6 Part 2 §4.6; ITU-R BT.2020-2 Table 5; ITU-R BT.2100-2 Table 9 (inverted).
 * @example ycbcrFromCodeValues({ Y: 940, Cb: 512, Cr: 512 }, { bits: 10, range: "narrow" })
 */
export function ycbcrFromCodeValues(codes: Ycbcr, format: CodeValueFormat): Ycbcr {
  checkFields("ycbcrFromCodeValues", "codes", codes, YCBCR_CODE_FIELDS);
  checkFormat("ycbcrFromCodeValues", format);
  for (const k of ["Y", "Cb", "Cr"] as const)
    checkCode("ycbcrFromCodeValues", `codes.${k}`, codes[k], format);
  noteMethod("rgb encoding", STATEMENT(format));
  return {
    Y: lumaValue(codes.Y, format),
    Cb: chromaValue(codes.Cb, format),
    Cr: chromaValue(codes.Cr, format),
  };
}
