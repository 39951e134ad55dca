/**
 * Y′CbCr and integer code values (issue 14). Outside references: the code-value ranges documented in ITU-R
 * BT.709-6 Part 2 §4.6, BT.2020-2 Table 5 and BT.2100-2 Table 9 (8-bit narrow black 16, white 235, chroma 16–240;
 * 10-bit 64, 940, 64–960; 12-bit 256, 3760, 256–3840; full range 0 to 2ⁿ − 1); the luma coefficients of BT.709 and
 * BT.2020 and their Cb, Cr divisors 1.8556, 1.5748, 1.8814, 1.4746 as printed in those standards; the commonly
 * quoted 8-bit BT.709 code values of 100 % red, (63, 102, 240) (recalled from memory); colorjs.io's rec2100pq for
 * the PQ level of a code value.
 */
import Color from "colorjs.io";
import { describe, expect, it } from "vitest";
import * as t from "../../lib/index.ts";

const FORMATS = [8, 10, 12].flatMap((bits) =>
  (["narrow", "full"] as const).map((range) => ({ bits, range })),
);

describe("documented code-value ranges", () => {
  it.each([
    [8, 16, 235, 16, 128, 240, 1, 254],
    [10, 64, 940, 64, 512, 960, 4, 1019],
    [12, 256, 3760, 256, 2048, 3840, 16, 4079],
  ])("%i-bit narrow range: black %i, white %i, chroma %i–%i–%i, permitted %i–%i", (bits, ...want) => {
    const r = t.codeValueRange({ bits, range: "narrow" });
    expect([r.black, r.white, r.chromaMin, r.chromaZero, r.chromaMax, r.lowest, r.highest]).toEqual(want);
    expect(t.signalCodeValue(0, { bits, range: "narrow" })).toBe(want[0]);
    expect(t.signalCodeValue(1, { bits, range: "narrow" })).toBe(want[1]);
  });

  it.each([8, 10, 12])("%i-bit full range: 0 to 2ⁿ − 1, chroma zero at 2ⁿ⁻¹ (BT.2100-2 Table 9)", (bits) => {
    const r = t.codeValueRange({ bits, range: "full" });
    expect([r.black, r.white, r.chromaZero, r.lowest, r.highest]).toEqual([
      0,
      2 ** bits - 1,
      2 ** (bits - 1),
      0,
      2 ** bits - 1,
    ]);
  });

  it("10-bit narrow Y′CbCr of white is (940, 512, 512) and of black (64, 512, 512)", () => {
    const f = { bits: 10, range: "narrow" as const };
    for (const std of ["BT.709", "BT.2020", "BT.2100"] as const) {
      expect(t.ycbcrCodeValues(t.ycbcrFromRgbSignal({ r: 1, g: 1, b: 1 }, std), f)).toEqual({
        Y: 940,
        Cb: 512,
        Cr: 512,
      });
      expect(t.ycbcrCodeValues(t.ycbcrFromRgbSignal({ r: 0, g: 0, b: 0 }, std), f)).toEqual({
        Y: 64,
        Cb: 512,
        Cr: 512,
      });
    }
  });

  it("codes beyond the permitted range are kept inside it (timing references 0 and 255 at 8 bits)", () => {
    expect(t.signalCodeValue(-1, { bits: 8, range: "narrow" })).toBe(1);
    expect(t.signalCodeValue(2, { bits: 8, range: "narrow" })).toBe(254);
    expect(t.signalCodeValue(1.05, { bits: 10, range: "narrow" })).toBe(Math.round((219 * 1.05 + 16) * 4));
    expect(() => t.codeValueSignal(1023, { bits: 10, range: "narrow" })).toThrow(/codeValueSignal: code/);
    expect(() => t.codeValueSignal(64.5, { bits: 10, range: "narrow" })).toThrow(/whole number/);
  });
});

describe("Y′CbCr", () => {
  it("BT.709 and BT.2020 divisors as printed: Cb = (B′ − Y′)/1.8556 | 1.8814, Cr = (R′ − Y′)/1.5748 | 1.4746", () => {
    const rgb = { r: 0.8, g: 0.3, b: 0.1 };
    const y709 = 0.2126 * 0.8 + 0.7152 * 0.3 + 0.0722 * 0.1;
    const a = t.ycbcrFromRgbSignal(rgb, "BT.709");
    expect(a.Y).toBeCloseTo(y709, 12);
    expect(a.Cb).toBeCloseTo((0.1 - y709) / 1.8556, 12);
    expect(a.Cr).toBeCloseTo((0.8 - y709) / 1.5748, 12);
    const y2020 = 0.2627 * 0.8 + 0.678 * 0.3 + 0.0593 * 0.1;
    const b = t.ycbcrFromRgbSignal(rgb, "BT.2020");
    expect(b.Y).toBeCloseTo(y2020, 12);
    expect(b.Cb).toBeCloseTo((0.1 - y2020) / 1.8814, 12);
    expect(b.Cr).toBeCloseTo((0.8 - y2020) / 1.4746, 12);
    expect(t.ycbcrFromRgbSignal(rgb, "BT.2100")).toEqual(b);
  });

  it("8-bit narrow BT.709 100 % red is (63, 102, 240) (commonly quoted, recalled from memory)", () => {
    expect(
      t.ycbcrCodeValues(t.ycbcrFromRgbSignal({ r: 1, g: 0, b: 0 }, "BT.709"), { bits: 8, range: "narrow" }),
    ).toEqual({
      Y: 63,
      Cb: 102,
      Cr: 240,
    });
  });

  it("R′G′B′ → Y′CbCr → R′G′B′ returns the signal", () => {
    for (const std of ["BT.709", "BT.2020"] as const)
      for (const rgb of [
        { r: 0.1, g: 0.9, b: 0.4 },
        { r: 1, g: 0, b: 0.5 },
      ]) {
        const back = t.rgbSignalFromYcbcr(t.ycbcrFromRgbSignal(rgb, std), std);
        expect(back.r).toBeCloseTo(rgb.r, 12);
        expect(back.g).toBeCloseTo(rgb.g, 12);
        expect(back.b).toBeCloseTo(rgb.b, 12);
      }
  });
});

describe("round trips code value → signal → code value are exact", () => {
  it.each(FORMATS)("$bits-bit $range range: every permitted luma, R′G′B′ and chroma code", (f) => {
    const r = t.codeValueRange(f);
    const misses: number[] = [];
    for (let d = r.lowest; d <= r.highest; d++) {
      if (t.signalCodeValue(t.codeValueSignal(d, f), f) !== d) misses.push(d);
      const c = t.ycbcrCodeValues(t.ycbcrFromCodeValues({ Y: d, Cb: d, Cr: d }, f), f);
      if (c.Y !== d || c.Cb !== d || c.Cr !== d) misses.push(-d);
      const g = t.rgbCodeValues(t.rgbSignalFromCodeValues({ r: d, g: d, b: d }, f), f);
      if (g.r !== d || g.g !== d || g.b !== d) misses.push(-d);
    }
    expect(misses).toEqual([]);
  });

  it("signal → code → signal is within half a code step", () => {
    const f = { bits: 10, range: "narrow" as const };
    for (let i = 0; i <= 1000; i++) {
      const s = i / 1000;
      expect(Math.abs(t.codeValueSignal(t.signalCodeValue(s, f), f) - s)).toBeLessThanOrEqual(
        0.5 / (219 * 4) + 1e-12,
      );
    }
  });
});

describe("PQ code values", () => {
  it("the PQ luminance of a 10-bit full-range code agrees with colorjs.io's rec2100pq (code 520 ≈ 100 cd/m², recalled)", () => {
    const f = { bits: 10, range: "full" as const };
    for (const code of [0, 100, 300, 520, 769, 1023]) {
      const s = t.codeValueSignal(code, f);
      const theirs = new Color("rec2100pq", [s, s, s]).to("xyz-abs-d65").coords[1]!;
      expect(t.pqDecode(s)).toBeCloseTo(theirs, 6);
    }
    expect(t.pqDecode(t.codeValueSignal(520, f))).toBeGreaterThan(99);
    expect(t.pqDecode(t.codeValueSignal(520, f))).toBeLessThan(101);
  });
});
