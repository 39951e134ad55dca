/**
 * RGB spaces and transfer functions, checked against IEC 61966-2-1 (sRGB matrices and curve), ITU-R BT.709-6,
 * BT.2020-2 and BT.2100-2 (luma coefficients, HLG constants), SMPTE ST 2084 and ITU-R BT.2408 (PQ/HLG code values),
 * and the libraries colorjs.io and culori.
 */
import { M as P3_M } from "colorjs.io/src/spaces/p3-linear.js";
import { M as REC2020_M } from "colorjs.io/src/spaces/rec2020-linear.js";
import { M as SRGB_M } from "colorjs.io/src/spaces/srgb-linear.js";
import { converter } from "culori";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { invertMatrix3, type Matrix3 } from "../../lib/colorimetry/matrix3.ts";
import { methodsUsed, resetMethodLog } from "../../lib/methods/method-log.ts";
import { isInGamut, rgbFromXYZ, xyzFromRgb } from "../../lib/rgb/rgb-conversion.ts";
import { rgbSpace, rgbSpaceFromPrimaries, rgbSpaceNames } from "../../lib/rgb/rgb-space.ts";
import {
  bt1886Eotf,
  bt1886InverseEotf,
  bt709Decode,
  bt709Encode,
  gammaDecode,
  gammaEncode,
  hlgDecode,
  hlgDisplayLight,
  hlgEncode,
  pqDecode,
  pqEncode,
  srgbDecode,
  srgbEncode,
  transferFunction,
} from "../../lib/rgb/transfer-functions.ts";

const round4 = (m: Matrix3) => m.map((row) => row.map((v) => Math.round(v * 1e4) / 1e4));
function expectMatrixClose(ours: Matrix3, theirs: readonly (readonly number[])[], tol: number): void {
  for (let i = 0; i < 3; i++)
    for (let j = 0; j < 3; j++)
      expect(Math.abs(ours[i]![j]! - theirs[i]![j]!), `[${i}][${j}]`).toBeLessThanOrEqual(tol);
}

describe("RGB spaces", () => {
  // IEC 61966-2-1:1999 §5.2 and §5.3 print the matrices to 4 decimals (recalled from memory).
  const IEC_FORWARD = [
    [0.4124, 0.3576, 0.1805],
    [0.2126, 0.7152, 0.0722],
    [0.0193, 0.1192, 0.9505],
  ] as const;
  const IEC_INVERSE = [
    [3.2406, -1.5372, -0.4986],
    [-0.9689, 1.8758, 0.0415],
    [0.0557, -0.204, 1.057],
  ] as const;

  it("sRGB: the derived RGB → XYZ matrix rounds to the IEC 61966-2-1 matrix", () => {
    expect(round4(rgbSpace("sRGB").toXYZ)).toEqual(IEC_FORWARD.map((r) => [...r]));
  });

  it("sRGB: the XYZ → RGB matrix agrees with IEC 61966-2-1 within 4e-4 (the IEC prints the inverse of its rounded forward matrix)", () => {
    expectMatrixClose(rgbSpace("sRGB").fromXYZ, IEC_INVERSE, 4e-4);
    // that is why: inverting the IEC's own 4-decimal forward matrix gives its inverse to 4 decimals
    expectMatrixClose(invertMatrix3(IEC_FORWARD), IEC_INVERSE, 5.1e-5);
  });

  it("luminance rows equal the luma coefficients of ITU-R BT.709-6 (0.2126, 0.7152, 0.0722) and BT.2020-2 (0.2627, 0.6780, 0.0593)", () => {
    expect(rgbSpace("BT.709").toXYZ[1].map((v) => Math.round(v * 1e4) / 1e4)).toEqual([
      0.2126, 0.7152, 0.0722,
    ]);
    expect(rgbSpace("BT.2020").toXYZ[1].map((v) => Math.round(v * 1e4) / 1e4)).toEqual([
      0.2627, 0.678, 0.0593,
    ]);
  });

  it("matrices equal colorjs.io's for sRGB, Display P3 and BT.2020 (colorjs.io spaces srgb-linear, p3-linear, rec2020-linear)", () => {
    expectMatrixClose(rgbSpace("sRGB").toXYZ, SRGB_M.toXYZ!, 1e-9);
    expectMatrixClose(rgbSpace("Display P3").toXYZ, P3_M.toXYZ!, 1e-9);
    expectMatrixClose(rgbSpace("BT.2020").toXYZ, REC2020_M.toXYZ!, 1e-9);
    // colorjs.io takes its BT.2020 inverse from ITU-R BT.2124-0 Annex 2, printed to 15 digits
    expectMatrixClose(rgbSpace("BT.2020").fromXYZ, REC2020_M.fromXYZ!, 1e-9);
  });

  it("white (1, 1, 1) maps to the white chromaticity with Y = 100, and each primary to its chromaticity", () => {
    for (const name of rgbSpaceNames().filter((n) => !n.includes("PQ"))) {
      const s = rgbSpace(name);
      const w = xyzFromRgb({ r: 1, g: 1, b: 1 }, s);
      expect(w.Y).toBeCloseTo(100, 5); // HLG's constants are printed to 8 digits, so its curve reaches 1 to within 3e-8
      expect(w.X / (w.X + w.Y + w.Z)).toBeCloseTo(s.white.x, 12);
      expect(w.Y / (w.X + w.Y + w.Z)).toBeCloseTo(s.white.y, 12);
      const red = xyzFromRgb({ r: 1, g: 0, b: 0 }, s);
      expect(red.X / (red.X + red.Y + red.Z)).toBeCloseTo(s.primaries.r.x, 12);
    }
  });

  it("agrees with culori's sRGB, Display P3 and BT.2020 conversions from XYZ (D65)", () => {
    const xyzArb = fc.record({
      X: fc.double({ min: 1, max: 95, noNaN: true }),
      Y: fc.double({ min: 1, max: 100, noNaN: true }),
      Z: fc.double({ min: 1, max: 108, noNaN: true }),
    });
    const toRgb = converter("rgb"),
      toP3 = converter("p3"),
      toRec2020 = converter("rec2020");
    fc.assert(
      fc.property(xyzArb, (xyz) => {
        const c = { mode: "xyz65" as const, x: xyz.X / 100, y: xyz.Y / 100, z: xyz.Z / 100 };
        const srgb = rgbFromXYZ(xyz, rgbSpace("sRGB"));
        const theirs = toRgb(c);
        expect(srgb.r).toBeCloseTo(theirs.r, 4);
        expect(srgb.g).toBeCloseTo(theirs.g, 4);
        expect(srgb.b).toBeCloseTo(theirs.b, 4);
        const p3 = rgbFromXYZ(xyz, rgbSpace("Display P3"));
        const theirsP3 = toP3(c);
        expect(p3.r).toBeCloseTo(theirsP3.r, 4);
        expect(p3.g).toBeCloseTo(theirsP3.g, 4);
        // culori's rec2020 uses the BT.2020 camera OETF, so compare linear values through it
        const lin = rgbFromXYZ(xyz, rgbSpace("BT.2020"), { encode: false });
        const t = toRec2020(c);
        expect(bt709Encode(lin.g)).toBeCloseTo(t.g, 3);
      }),
      { numRuns: 100 },
    );
  });

  it("round trip XYZ → RGB → XYZ in every space, encoded and linear (property)", () => {
    const xyzArb = fc.record({
      X: fc.double({ min: 0.5, max: 120, noNaN: true }),
      Y: fc.double({ min: 0.5, max: 120, noNaN: true }),
      Z: fc.double({ min: 0.5, max: 120, noNaN: true }),
    });
    fc.assert(
      fc.property(xyzArb, fc.constantFrom(...rgbSpaceNames()), fc.boolean(), (xyz, name, encode) => {
        const s = rgbSpace(name);
        const back = xyzFromRgb(rgbFromXYZ(xyz, s, { encode }), s, { decode: encode });
        // PQ loses a few digits near black; 1e-7 relative is far below any measurement
        for (const k of ["X", "Y", "Z"] as const)
          expect(Math.abs(back[k] - xyz[k])).toBeLessThanOrEqual(1e-7 * Math.max(1, xyz[k]));
      }),
      { numRuns: 300 },
    );
  });

  it("a space from measured primaries reproduces the standard one when given the standard primaries", () => {
    const s = rgbSpaceFromPrimaries(
      { r: { x: 0.64, y: 0.33 }, g: { x: 0.3, y: 0.6 }, b: { x: 0.15, y: 0.06 } },
      { x: 0.3127, y: 0.329 },
      { name: "test display", transfer: "gamma 2.2" },
    );
    expectMatrixClose(s.toXYZ, rgbSpace("sRGB").toXYZ, 1e-15);
    expect(s.transfer).toBe("gamma 2.2");
  });

  it("detects out-of-gamut colours: spectral green is outside sRGB, D65 white is inside", () => {
    // 520 nm on the CIE 1931 spectrum locus: x = 0.0743, y = 0.8338 (CIE 1931 table, rounded)
    const green = { X: (0.0743 / 0.8338) * 50, Y: 50, Z: ((1 - 0.0743 - 0.8338) / 0.8338) * 50 };
    expect(isInGamut(rgbFromXYZ(green, rgbSpace("sRGB")))).toBe(false);
    expect(isInGamut(rgbFromXYZ(green, rgbSpace("BT.2020"), { encode: false }))).toBe(false);
    const white = xyzFromRgb({ r: 1, g: 1, b: 1 }, rgbSpace("sRGB"));
    expect(isInGamut(rgbFromXYZ(white, rgbSpace("sRGB")))).toBe(true);
    expect(isInGamut({ r: 1.0000001, g: 0.5, b: -0.0000001 })).toBe(true);
    expect(isInGamut({ r: 1.01, g: 0.5, b: 0 })).toBe(false);
    expect(isInGamut({ r: 1.01, g: 0.5, b: 0 }, 0.02)).toBe(true);
  });

  it("notes the space, matrices and encoding for the Methods section", () => {
    resetMethodLog();
    rgbFromXYZ({ X: 20, Y: 20, Z: 20 }, rgbSpace("Display P3"));
    const text = methodsUsed()
      .filter((n) => n.topic === "rgb encoding")
      .map((n) => n.statement)
      .join("\n");
    expect(text).toMatch(/Display P3/);
    expect(text).toMatch(/SMPTE RP 177/);
    expect(text).toMatch(/IEC 61966-2-1/);
  });

  it("refuses bad input, naming the value", () => {
    expect(() => rgbSpace("Adobe")).toThrow(/Adobe/);
    expect(() => rgbFromXYZ({ X: NaN, Y: 1, Z: 1 }, rgbSpace("sRGB"))).toThrow(/NaN/);
    expect(() => xyzFromRgb({ r: 0, g: Infinity, b: 0 }, rgbSpace("sRGB"))).toThrow(/Infinity/);
    expect(() => isInGamut({ r: 0, g: NaN, b: 0 })).toThrow(/NaN/);
    expect(() =>
      rgbSpaceFromPrimaries(
        { r: { x: 0.3, y: 0.3 }, g: { x: 0.4, y: 0.4 }, b: { x: 0.5, y: 0.5 } },
        { x: 0.3127, y: 0.329 },
      ),
    ).toThrow(/singular/);
    expect(() =>
      rgbSpaceFromPrimaries(
        { r: { x: 0.64, y: 0.33 }, g: { x: 0.3, y: 0.6 }, b: { x: 0.15, y: -0.06 } },
        { x: 0.3127, y: 0.329 },
      ),
    ).toThrow(/-0.06/);
    expect(() =>
      rgbSpaceFromPrimaries(
        { r: { x: 0.64, y: 0.33 }, g: { x: 0.3, y: 0.6 }, b: { x: 0.15, y: 0.06 } },
        { x: 0.3127, y: 0.329 },
        { transfer: "gamma 9" as never },
      ),
    ).toThrow(/gamma 9/);
    expect(() => transferFunction("log")).toThrow(/log/);
  });
});

describe("transfer functions", () => {
  it("sRGB: the two pieces meet at 0.0031308 ↔ 0.04045 (IEC 61966-2-1:1999 §5.2–5.3) and decode inverts encode", () => {
    expect(srgbEncode(0.0031308)).toBeCloseTo(0.04045, 6);
    expect(1.055 * 0.0031308 ** (1 / 2.4) - 0.055).toBeCloseTo(0.04045, 5);
    expect(srgbDecode(0.04045)).toBeCloseTo(0.0031308, 7);
    expect(srgbEncode(1)).toBeCloseTo(1, 12);
    expect(srgbEncode(0)).toBe(0);
    fc.assert(
      fc.property(fc.double({ min: -2, max: 2, noNaN: true }), (v) => {
        expect(srgbDecode(srgbEncode(v))).toBeCloseTo(v, 12);
      }),
    );
  });

  it("sRGB: the curves written with roots, exp and log stay within 8 ε (relative) of culori's Math.pow curves", () => {
    // culori computes IEC 61966-2-1 §5.2–5.3 with Math.pow; ours uses ∛(L·⁴√L) and T²·e^(0.4 ln T) for speed. Both
    // pieces, the breakpoints, negatives (sign kept) and very large values (where ours falls back to **) are swept;
    // the largest difference in 0–1.5, near the breakpoint, is about 4.6 ε (measured over 3 million points). Far
    // above 1 the doubles 1/2.4, 2.4 and 0.4 miss 5/12, 12/5 and 2/5 by up to 9e-17, which moves either form's power
    // by that times ln x (relative), so the allowance there grows by ln x · ε.
    const toLrgb = converter("lrgb"),
      toRgb = converter("rgb");
    const eps = 2 ** -52;
    const within = (x: number, ours: number, theirs: number) => {
      if (!Number.isFinite(theirs)) return expect(ours).toBe(theirs);
      const allowance = (8 + Math.max(0, Math.log(Math.abs(x)))) * eps * Math.abs(theirs);
      expect(Math.abs(ours - theirs)).toBeLessThanOrEqual(allowance);
    };
    const check = (x: number) => {
      within(x, srgbEncode(x), toRgb({ mode: "lrgb", r: x, g: 0, b: 0 }).r);
      within(x, srgbDecode(x), toLrgb({ mode: "rgb", r: x, g: 0, b: 0 }).r);
    };
    const values: number[] = [0.0031308, 0.04045, 1, 1e99, 1e101, 1e200];
    for (let i = 0; i <= 20000; i++) values.push((i / 20000) * 1.5);
    for (const v of values) {
      check(v);
      check(-v);
    }
    fc.assert(fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), check));
  });

  it("sRGB agrees with culori's curve (culori rgb ↔ lrgb)", () => {
    const toLrgb = converter("lrgb");
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (v) => {
        expect(srgbDecode(v)).toBeCloseTo(toLrgb({ mode: "rgb", r: v, g: v, b: v }).r, 12);
      }),
    );
  });

  it("BT.709 OETF: 4.5·L below 0.018, 1.099·L^0.45 − 0.099 above, continuous (ITU-R BT.709-6 item 1.2)", () => {
    expect(bt709Encode(0.018)).toBeCloseTo(0.081, 3);
    expect(bt709Encode(0.01)).toBeCloseTo(0.045, 12);
    expect(bt709Encode(1)).toBeCloseTo(1, 12);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (v) => {
        expect(bt709Decode(bt709Encode(v))).toBeCloseTo(v, 12);
      }),
    );
  });

  it("BT.1886: V = 0 gives the black level and V = 1 the white level (ITU-R BT.1886 Annex 1)", () => {
    const d = { whiteLuminance: 120, blackLuminance: 0.1 };
    expect(bt1886Eotf(0, d)).toBeCloseTo(0.1, 12);
    expect(bt1886Eotf(1, d)).toBeCloseTo(120, 10);
    expect(bt1886Eotf(0.5)).toBeCloseTo(100 * 0.5 ** 2.4, 10); // Lb = 0: a pure 2.4 power law
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (v) => {
        expect(bt1886InverseEotf(bt1886Eotf(v, d), d)).toBeCloseTo(v, 10);
      }),
    );
    expect(() => bt1886Eotf(0.5, { whiteLuminance: 100, blackLuminance: 200 })).toThrow(/200/);
  });

  it("pure gamma round trip and sign handling", () => {
    expect(gammaEncode(0.5, 2.2)).toBeCloseTo(0.5 ** (1 / 2.2), 14);
    expect(gammaDecode(-0.5, 2.2)).toBeCloseTo(-(0.5 ** 2.2), 14);
    expect(() => gammaEncode(0.5, 0)).toThrow(
      /gammaEncode: gamma should be a finite number greater than 0, but got the number 0/,
    );
  });

  it("PQ: SMPTE ST 2084 end points and the code values of ITU-R BT.2408 (recalled from memory)", () => {
    expect(pqEncode(10000)).toBeCloseTo(1, 12);
    expect(pqEncode(0)).toBeCloseTo((3424 / 4096) ** ((2523 / 4096) * 128), 15); // c1^m2 ≈ 7.3e-7
    // ITU-R BT.2408: 100 cd/m² → 50.8 % (full-range 10-bit 520); reference white 203 cd/m² → 58 %; 1000 cd/m² → 75.2 % (769)
    expect(pqEncode(100)).toBeCloseTo(0.508, 3);
    expect(Math.round(1023 * pqEncode(100))).toBe(520);
    expect(pqEncode(203)).toBeCloseTo(0.58, 2);
    expect(pqEncode(1000)).toBeCloseTo(0.752, 3);
    expect(Math.round(1023 * pqEncode(1000))).toBe(769);
  });

  it("PQ round trip over 0–10 000 cd/m² (property) and agreement with colorjs.io's rec2100-pq curve", async () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 10000, noNaN: true }), (l) => {
        expect(pqDecode(pqEncode(l))).toBeCloseTo(l, 7);
      }),
    );
    const { default: Color } = await import("colorjs.io");
    for (const l of [0.5, 10, 100, 203, 1000, 4000]) {
      // colorjs.io's rec2100-pq places media white (linear 1) at 203 cd/m²
      const pq = new Color("rec2100-linear", [l / 203, l / 203, l / 203]).to("rec2100pq").coords[0]!;
      expect(pqEncode(l)).toBeCloseTo(pq, 10);
    }
  });

  it("HLG: E = 1/12 → 0.5 and E = 1 → 1 (ITU-R BT.2100-2 Table 5 constants); 75 % signal is 203 cd/m² on a 1000 cd/m² display (BT.2408, recalled from memory)", () => {
    expect(hlgEncode(1 / 12)).toBeCloseTo(0.5, 12);
    expect(hlgEncode(1)).toBeCloseTo(1, 7);
    expect(hlgDecode(0.5)).toBeCloseTo(1 / 12, 12);
    const e = hlgDecode(0.75);
    const display = hlgDisplayLight({ r: e, g: e, b: e }, 1000);
    expect(Math.round(display.g)).toBe(203);
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (v) => {
        expect(hlgDecode(hlgEncode(v))).toBeCloseTo(v, 12);
      }),
    );
  });

  it("transfer functions refuse non-finite values, naming them", () => {
    for (const f of [srgbEncode, srgbDecode, bt709Encode, pqEncode, pqDecode, hlgEncode, hlgDecode]) {
      expect(() => f(NaN)).toThrow(/NaN/);
      expect(() => f(Infinity)).toThrow(/Infinity/);
    }
  });
});
