/**
 * RGB spaces by their standards' names (issue 14): DCI-P3 (SMPTE RP 431-2), P3-D65 (SMPTE EG 432-1), opRGB
 * (IEC 61966-2-5), ROMM RGB (ISO 22028-2), ACES AP0 (SMPTE ST 2065-1) and AP1. Outside references: the ACES AP0
 * NPM as printed in SMPTE ST 2065-1 (recalled from memory), colorjs.io's ACEScg, p3 and a98rgb matrices, culori's
 * a98 (= opRGB), prophoto (= ROMM RGB) and p3 conversions, and the transfer functions as the standards define them.
 */
import { M as ACESCG } from "colorjs.io/src/spaces/acescg.js";
import { converter } from "culori";
import { describe, expect, it } from "vitest";
import * as t from "../../lib/index.ts";

const SAMPLES = [
  { r: 0.5, g: 0.2, b: 0.8 },
  { r: 1, g: 1, b: 1 },
  { r: 0.9, g: 0.05, b: 0.1 },
  { r: 0.02, g: 0.6, b: 0.3 },
];

describe("spaces by standard name", () => {
  it("are listed and found by their aliases", () => {
    for (const n of ["DCI-P3", "P3-D65", "opRGB", "ROMM RGB", "ACES AP0", "ACES AP1"])
      expect(t.rgbSpaceNames()).toContain(n);
    expect(t.rgbSpace("P3D65").name).toBe("P3-D65");
    expect(t.rgbSpace("ACES2065-1").name).toBe("ACES AP0");
    expect(t.rgbSpace("acescg").name).toBe("ACES AP1");
    expect(t.rgbSpace("romm").name).toBe("ROMM RGB");
    expect(() => t.rgbSpace("P3 cinema")).toThrow(/rgbSpace: name/);
  });

  it("DCI-P3 has the DCI white (0.314, 0.351) and a 2.6 power law (SMPTE RP 431-2); P3-D65 the D65 white", () => {
    const dci = t.rgbSpace("DCI-P3");
    expect(dci.white).toEqual({ x: 0.314, y: 0.351 });
    expect(dci.primaries.r).toEqual({ x: 0.68, y: 0.32 });
    expect(dci.transfer).toBe("gamma 2.6");
    expect(t.rgbSpace("P3-D65").white).toEqual({ x: 0.3127, y: 0.329 });
    const w = t.xyzFromRgb({ r: 1, g: 1, b: 1 }, dci);
    expect(w.X / (w.X + w.Y + w.Z)).toBeCloseTo(0.314, 12);
  });

  it("ACES AP0 matrix equals SMPTE ST 2065-1's NPM (recalled from memory, 10 decimals as printed)", () => {
    const m = t.rgbSpace("ACES AP0").toXYZ;
    const want = [
      [0.9525523959, 0.0, 0.0000936786],
      [0.3439664498, 0.7281660966, -0.0721325464],
      [0.0, 0.0, 1.0088251844],
    ];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(m[i]![j]).toBeCloseTo(want[i]![j]!, 9);
  });

  it("ACES AP1 matrix equals colorjs.io's ACEScg matrix", () => {
    const m = t.rgbSpace("ACES AP1").toXYZ;
    for (let i = 0; i < 3; i++)
      for (let j = 0; j < 3; j++) expect(m[i]![j]).toBeCloseTo(ACESCG.toXYZ![i]![j]!, 12);
  });

  it("opRGB agrees with culori's a98 (encoded RGB → XYZ D65)", () => {
    const toXyz = converter("xyz65");
    for (const s of SAMPLES) {
      const c = toXyz({ mode: "a98", ...s })!;
      const ours = t.xyzFromRgb(s, t.rgbSpace("opRGB"));
      expect(ours.X / 100).toBeCloseTo(c.x, 6);
      expect(ours.Y / 100).toBeCloseTo(c.y, 6);
      expect(ours.Z / 100).toBeCloseTo(c.z, 6);
    }
  });

  it("ROMM RGB agrees with culori's prophoto (encoded RGB → XYZ D50; culori's D50 white differs in the 5th decimal)", () => {
    const toXyz = converter("xyz50");
    for (const s of SAMPLES) {
      const c = toXyz({ mode: "prophoto", ...s })!;
      const ours = t.xyzFromRgb(s, t.rgbSpace("ROMM RGB"));
      expect(ours.X / 100).toBeCloseTo(c.x, 4);
      expect(ours.Y / 100).toBeCloseTo(c.y, 4);
      expect(ours.Z / 100).toBeCloseTo(c.z, 4);
    }
  });

  it("P3-D65 linear agrees with culori's p3 linear matrix", () => {
    const toXyz = converter("xyz65");
    for (const s of SAMPLES) {
      const c = toXyz({ mode: "p3", r: t.srgbEncode(s.r), g: t.srgbEncode(s.g), b: t.srgbEncode(s.b) })!;
      const ours = t.xyzFromRgb(s, t.rgbSpace("P3-D65"), { decode: false });
      expect(ours.X / 100).toBeCloseTo(c.x, 6);
      expect(ours.Y / 100).toBeCloseTo(c.y, 6);
      expect(ours.Z / 100).toBeCloseTo(c.z, 6);
    }
  });
});

describe("transfer functions of the new spaces", () => {
  it("ROMM: linear segment 16·C below 1/512, then C^(1/1.8); continuous at the joint (ISO 22028-2)", () => {
    expect(t.rommEncode(0.001)).toBeCloseTo(0.016, 12);
    expect(t.rommEncode(0.5)).toBeCloseTo(0.5 ** (1 / 1.8), 12);
    expect(t.rommEncode(1 / 512)).toBeCloseTo(16 / 512, 12);
    expect(t.rommEncode(1 / 512 - 1e-12)).toBeCloseTo(16 / 512, 9);
    for (const v of [0, 0.001, 0.02, 0.3, 1]) expect(t.rommDecode(t.rommEncode(v))).toBeCloseTo(v, 12);
  });

  it("opRGB: a pure power law with γ = 563/256 = 2.19921875 (IEC 61966-2-5)", () => {
    expect(t.OPRGB_GAMMA).toBe(2.19921875);
    expect(t.transferFunction("opRGB").decode(0.5)).toBeCloseTo(0.5 ** 2.19921875, 14);
  });

  it("ACES spaces are linear; the imaginary primaries are accepted there but still refused from measured primaries", () => {
    expect(t.rgbSpace("ACES AP0").transfer).toBe("linear");
    expect(t.rgbSpace("ACES AP0").primaries.b.y).toBe(-0.077);
    expect(() =>
      t.rgbSpaceFromPrimaries(t.rgbSpace("ACES AP0").primaries, { x: 0.32168, y: 0.33767 }),
    ).toThrow(/blue primary/);
  });

  it("round trips XYZ → RGB → XYZ in every new space", () => {
    for (const name of ["DCI-P3", "P3-D65", "opRGB", "ROMM RGB", "ACES AP0", "ACES AP1"]) {
      const s = t.rgbSpace(name);
      const xyz = { X: 30, Y: 25, Z: 20 };
      const back = t.xyzFromRgb(t.rgbFromXYZ(xyz, s), s);
      expect(back.X).toBeCloseTo(xyz.X, 9);
      expect(back.Y).toBeCloseTo(xyz.Y, 9);
      expect(back.Z).toBeCloseTo(xyz.Z, 9);
    }
  });
});
