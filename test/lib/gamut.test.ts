/**
 * Gamut area and coverage: areas of the sRGB, Display P3 and BT.2020 triangles from their published primaries
 * (IEC 61966-2-1, SMPTE EG 432-1, ITU-R BT.2020) worked by hand with the shoelace formula, and the intersection area
 * checked against an independent point-counting estimate.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { uvPrimeFromXy } from "../../lib/colorimetry/chromaticity.ts";
import {
  gamutArea,
  gamutAreaRatio,
  gamutCoverage,
  gamutIntersectionArea,
} from "../../lib/gamut/gamut-area.ts";
import { rgbSpace } from "../../lib/rgb/rgb-space.ts";

describe("gamut area and coverage", () => {
  it("areas of the standard triangles in xy, by hand: ½|Σ x_i(y_{i+1} − y_{i−1})|", () => {
    // sRGB: ½|0.64(0.60 − 0.06) + 0.30(0.06 − 0.33) + 0.15(0.33 − 0.60)| = ½ · 0.2241
    expect(gamutArea(rgbSpace("sRGB"))).toBeCloseTo(0.11205, 12);
    // Display P3: ½|0.68(0.69 − 0.06) + 0.265(0.06 − 0.32) + 0.15(0.32 − 0.69)| = ½ · 0.304
    expect(gamutArea(rgbSpace("Display P3"))).toBeCloseTo(0.152, 12);
    // BT.2020: ½|0.708(0.797 − 0.046) + 0.170(0.046 − 0.292) + 0.131(0.292 − 0.797)| = ½ · 0.423733
    expect(gamutArea(rgbSpace("BT.2020"))).toBeCloseTo(0.2118665, 12);
  });

  it("sRGB lies inside Display P3 and BT.2020: full coverage, and its share of BT.2020 is the area ratio", () => {
    expect(gamutCoverage(rgbSpace("Display P3"), rgbSpace("sRGB"))).toBeCloseTo(1, 11);
    expect(gamutCoverage(rgbSpace("sRGB"), rgbSpace("BT.2020"))).toBeCloseTo(0.11205 / 0.2118665, 11);
    expect(gamutAreaRatio(rgbSpace("Display P3"), rgbSpace("sRGB"))).toBeCloseTo(0.152 / 0.11205, 11);
  });

  it("u′v′ areas use the transformed primaries", () => {
    const tri = [
      rgbSpace("sRGB").primaries.r,
      rgbSpace("sRGB").primaries.g,
      rgbSpace("sRGB").primaries.b,
    ].map(uvPrimeFromXy);
    const hand = Math.abs(
      (tri[0]!.u * (tri[1]!.v - tri[2]!.v) +
        tri[1]!.u * (tri[2]!.v - tri[0]!.v) +
        tri[2]!.u * (tri[0]!.v - tri[1]!.v)) /
        2,
    );
    expect(gamutArea(rgbSpace("sRGB"), "u′v′")).toBeCloseTo(hand, 14);
  });

  it("partial overlap of two squares offset by half a side: coverage 50 % (hand computation)", () => {
    const a = [
      { x: 0.1, y: 0.1 },
      { x: 0.3, y: 0.1 },
      { x: 0.3, y: 0.3 },
      { x: 0.1, y: 0.3 },
    ];
    const b = a.map((p) => ({ x: p.x + 0.1, y: p.y }));
    expect(gamutIntersectionArea(a, b)).toBeCloseTo(0.02, 12);
    expect(gamutCoverage(a, b)).toBeCloseTo(0.5, 11);
    // vertex order (clockwise or not) does not matter
    expect(gamutCoverage([...a].reverse(), b)).toBeCloseTo(0.5, 11);
  });

  it("intersection area agrees with counting grid points inside both triangles (independent estimate, property)", () => {
    const pt = fc.record({
      x: fc.double({ min: 0.05, max: 0.7, noNaN: true }),
      y: fc.double({ min: 0.05, max: 0.8, noNaN: true }),
    });
    const inside = (p: { x: number; y: number }, t: { x: number; y: number }[]) => {
      const s = (a: { x: number; y: number }, b: { x: number; y: number }) =>
        (b.x - a.x) * (p.y - a.y) - (b.y - a.y) * (p.x - a.x);
      const d = [s(t[0]!, t[1]!), s(t[1]!, t[2]!), s(t[2]!, t[0]!)];
      return d.every((v) => v >= 0) || d.every((v) => v <= 0);
    };
    fc.assert(
      fc.property(fc.tuple(pt, pt, pt), fc.tuple(pt, pt, pt), (t1, t2) => {
        const area = (t: { x: number; y: number }[]) =>
          Math.abs(
            (t[0]!.x * (t[1]!.y - t[2]!.y) + t[1]!.x * (t[2]!.y - t[0]!.y) + t[2]!.x * (t[0]!.y - t[1]!.y)) /
              2,
          );
        if (area(t1) < 1e-3 || area(t2) < 1e-3) return;
        const n = 300;
        let count = 0;
        for (let i = 0; i < n; i++)
          for (let j = 0; j < n; j++) {
            const p = { x: 0.05 + (0.65 * (i + 0.5)) / n, y: 0.05 + (0.75 * (j + 0.5)) / n };
            if (inside(p, t1) && inside(p, t2)) count++;
          }
        const estimate = (count * 0.65 * 0.75) / (n * n);
        expect(Math.abs(gamutIntersectionArea(t1, t2) - estimate)).toBeLessThan(0.004);
      }),
      { numRuns: 25 },
    );
  });

  it("refuses degenerate or non-convex input, naming it", () => {
    expect(() =>
      gamutArea([
        { x: 0.1, y: 0.1 },
        { x: 0.2, y: 0.2 },
      ]),
    ).toThrow(/at least 3/);
    expect(() =>
      gamutArea([
        { x: 0.1, y: 0.1 },
        { x: NaN, y: 0.2 },
        { x: 0.3, y: 0.1 },
      ]),
    ).toThrow(/NaN/);
    const star = [
      { x: 0.3, y: 0.1 },
      { x: 0.35, y: 0.3 },
      { x: 0.5, y: 0.35 },
      { x: 0.35, y: 0.4 },
      { x: 0.3, y: 0.6 },
      { x: 0.25, y: 0.4 },
      { x: 0.1, y: 0.35 },
      { x: 0.25, y: 0.3 },
    ];
    expect(() => gamutCoverage(star, star)).toThrow(/convex/);
    expect(() => gamutArea(rgbSpace("sRGB"), "Lab" as never)).toThrow(/Lab/);
    expect(() =>
      gamutCoverage(rgbSpace("sRGB"), [
        { x: 0.1, y: 0.1 },
        { x: 0.2, y: 0.2 },
        { x: 0.3, y: 0.3 },
      ]),
    ).toThrow(/no area/);
  });
});
