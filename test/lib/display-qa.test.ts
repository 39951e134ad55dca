/**
 * The display QA calculations (issue 14). Outside references: colorjs.io's u′v′ chromaticity (for Δu′v′), the
 * BT.1886 EOTF written here from ITU-R BT.1886 Annex 1 and a pure power law (the fits must recover their γ),
 * colorjs.io's rec2100pq for the PQ targets, the primaries of ITU-R BT.709 and SMPTE RP 431-2, CIE 015's D65 CCT
 * (6504 K) and Duv (+0.0032, recalled from memory), and hand-computed contrast and uniformity figures (the
 * arithmetic is shown beside each). The readings are invented.
 */
import Color from "colorjs.io";
import { uv as colorjsUv } from "colorjs.io/src/chromaticity.js";
import { describe, expect, it } from "vitest";
import * as t from "../../lib/index.ts";

describe("Δu′v′", () => {
  it("agrees with colorjs.io's u′v′ of XYZ (D65)", () => {
    const a = { X: 95, Y: 100, Z: 105 },
      b = { X: 40, Y: 30, Z: 10 };
    const [ua, va] = colorjsUv(new Color("xyz-d65", [a.X / 100, a.Y / 100, a.Z / 100]));
    const [ub, vb] = colorjsUv(new Color("xyz-d65", [b.X / 100, b.Y / 100, b.Z / 100]));
    expect(t.deltaUvPrime(a, b)).toBeCloseTo(Math.hypot(ua! - ub!, va! - vb!), 12);
  });

  it("takes XYZ and xy alike, and is zero for the same chromaticity at another luminance", () => {
    expect(t.deltaUvPrime({ X: 95, Y: 100, Z: 105 }, { X: 9.5, Y: 10, Z: 10.5 })).toBeCloseTo(0, 14);
    expect(
      t.deltaUvPrime({ x: 0.3127, y: 0.329 }, t.chromaticityXy({ X: 95.04, Y: 100, Z: 108.9 })),
    ).toBeLessThan(1e-4);
    expect(() => t.deltaUvPrime({ X: 0, Y: 0, Z: 0 }, { x: 0.3, y: 0.3 })).toThrow(/deltaUvPrime: reference/);
  });
});

describe("black subtraction and contrast", () => {
  it("subtracts the black component by component", () => {
    expect(t.subtractBlack({ X: 19.4, Y: 20.3, Z: 22.1 }, { X: 0.1, Y: 0.3, Z: 0.1 })).toEqual({
      X: 19.4 - 0.1,
      Y: 20.3 - 0.3,
      Z: 22.1 - 0.1,
    });
  });

  it("sequential contrast 250/0.2 = 1250 (hand-computed); XYZ readings use Y", () => {
    expect(t.sequentialContrast(250, 0.2).ratio).toBeCloseTo(1250, 10);
    expect(t.sequentialContrast({ X: 238, Y: 250, Z: 270 }, { X: 0.19, Y: 0.2, Z: 0.22 }).ratio).toBeCloseTo(
      1250,
      10,
    );
    expect(() => t.sequentialContrast(250, 0)).toThrow(/sequentialContrast: black/);
  });

  it("checkerboard contrast is the ratio of the means: (8 × 180.5)/8 ÷ (8 × 0.41)/8 = 440.24 (hand-computed)", () => {
    const r = t.checkerboardContrast(Array(8).fill(180.5), Array(8).fill(0.41));
    expect(r.ratio).toBeCloseTo(180.5 / 0.41, 10);
    expect(t.checkerboardContrast([100, 200], [0.5, 1.5]).ratio).toBeCloseTo(150 / 1, 12);
  });
});

describe("EOTF fit", () => {
  const signals = Array.from({ length: 11 }, (_, i) => i / 10);

  it("recovers γ of a pure power law with a black offset (power model)", () => {
    const readings = signals.map((s) => ({ signal: s, luminance: 0.15 + 240 * s ** 2.35 }));
    const fit = t.fitEotf(readings, { channel: "red" });
    expect(fit.gamma).toBeCloseTo(2.35, 10);
    expect(fit.a).toBeCloseTo(240, 8);
    expect(fit.blackLuminance).toBe(0.15);
    expect(fit.rmsRelative).toBeLessThan(1e-12);
    expect(fit.channel).toBe("red");
  });

  it("recovers γ = 2.4 from the BT.1886 EOTF with Lw 120, Lb 0.1 (written from ITU-R BT.1886 Annex 1)", () => {
    const lw = 120,
      lb = 0.1,
      g = 2.4;
    const a = (lw ** (1 / g) - lb ** (1 / g)) ** g,
      b = lb ** (1 / g) / (lw ** (1 / g) - lb ** (1 / g));
    const readings = signals.map((s) => ({ signal: s, luminance: a * Math.max(s + b, 0) ** g }));
    const fit = t.fitEotf(readings, { model: "BT.1886" });
    expect(fit.gamma).toBeCloseTo(2.4, 6);
    expect(fit.b).toBeCloseTo(b, 6);
    expect(fit.worstRelative).toBeLessThan(1e-6);
    expect(t.eotfLuminance(fit, 0.5)).toBeCloseTo(
      t.bt1886Eotf(0.5, { whiteLuminance: lw, blackLuminance: lb }),
      5,
    );
  });

  it("residuals show a deviation at one level with its sign", () => {
    const readings = signals.map((s) => ({ signal: s, luminance: 200 * s ** 2.2 * (s === 0.5 ? 1.1 : 1) }));
    const fit = t.fitEotf(readings, { blackLuminance: 0 });
    const at = fit.residuals.find((r) => r.signal === 0.5)!;
    expect(at.relative).toBeGreaterThan(0.05);
    expect(fit.worstRelative).toBe(at.relative);
  });

  it("refuses too few levels", () => {
    expect(() =>
      t.fitEotf([
        { signal: 0, luminance: 0.1 },
        { signal: 1, luminance: 100 },
      ]),
    ).toThrow(/fitEotf: readings/);
  });
});

describe("grey-scale tracking", () => {
  it("D65 levels track D65 with Δu′v′ ≈ 0, CCT ≈ 6504 K and Duv ≈ +0.0032 (CIE 015; Duv recalled from memory)", () => {
    const d65 = { X: 95.047, Y: 100, Z: 108.883 };
    const levels = [0.1, 0.3, 0.5, 0.8, 1].map((s) => ({
      signal: s,
      xyz: { X: d65.X * s ** 2.4, Y: d65.Y * s ** 2.4, Z: d65.Z * s ** 2.4 },
    }));
    const r = t.greyscaleTracking(levels);
    expect(r.maxDeltaUv).toBeLessThan(1e-4);
    for (const l of r.levels) {
      expect(Math.abs(l.cct - 6504)).toBeLessThan(2);
      expect(l.duv).toBeCloseTo(0.0032, 4);
    }
  });

  it("black subtraction removes a bluish black that tints the dark levels", () => {
    const black = { X: 0.2, Y: 0.2, Z: 0.5 };
    const levels = [0.05, 0.5, 1].map((s) => ({
      signal: s,
      xyz: { X: 95.047 * s ** 2.2 + black.X, Y: 100 * s ** 2.2 + black.Y, Z: 108.883 * s ** 2.2 + black.Z },
    }));
    const raw = t.greyscaleTracking(levels);
    const net = t.greyscaleTracking(levels, { black });
    expect(raw.worstSignal).toBe(0.05);
    expect(raw.maxDeltaUv).toBeGreaterThan(0.01);
    expect(net.maxDeltaUv).toBeLessThan(1e-4);
    expect(net.blackSubtracted).toBe(true);
  });
});

describe("PQ tracking", () => {
  const f = { bits: 10, range: "narrow" as const };
  const pqTarget = (code: number) => {
    const s = (code / 4 - 16) / 219;
    return new Color("rec2100pq", [s, s, s]).to("xyz-abs-d65").coords[1]!;
  };

  it("targets agree with colorjs.io's rec2100pq and the tolerance decides each level", () => {
    const codes = [64, 200, 400, 520, 600, 700];
    const readings = codes.map((code, i) => ({ code, luminance: pqTarget(code) * (i === 4 ? 1.08 : 1.01) }));
    const r = t.pqTracking(readings, { format: f, tolerance: 0.05, absoluteTolerance: 0.005 });
    r.levels.forEach((l, i) => expect(l.target).toBeCloseTo(pqTarget(codes[i]!), 6));
    expect(r.levels.map((l) => l.withinTolerance)).toEqual([true, true, true, true, false, true]);
    expect(r.allWithinTolerance).toBe(false);
    expect(r.worstCode).toBe(600);
    expect(r.worstRelative).toBeCloseTo(0.08, 10);
  });

  it("targets above the display peak are clipped to the peak", () => {
    const r = t.pqTracking([{ code: 940, luminance: 1000 }], {
      format: f,
      tolerance: 0.05,
      peakLuminance: 1000,
    });
    expect(r.levels[0]!.target).toBe(1000);
    expect(r.allWithinTolerance).toBe(true);
  });
});

describe("uniformity", () => {
  const p = (Y: number, tint = 0) => ({ X: 0.95047 * Y + tint, Y, Z: 1.08883 * Y });

  it("3 × 3 grid against the centre: non-uniformity 1 − 180/220, worst deviation 10 % (hand-computed)", () => {
    const grid = [
      [p(190), p(195), p(180)],
      [p(196), p(200), p(198)],
      [p(185), p(197), p(220)],
    ];
    const u = t.displayUniformity(grid);
    expect(u.referenceLuminance).toBe(200);
    expect(u.nonUniformity).toBeCloseTo(1 - 180 / 220, 12);
    expect(u.maxLuminanceDeviation).toBeCloseTo(0.1, 12);
    expect(u.maxDeltaUv).toBeCloseTo(0, 12);
    expect(u.points).toHaveLength(9);
  });

  it("a tinted corner shows as its Δu′v′ (against the centre, and against the mean)", () => {
    const grid = [
      [p(200, 8), p(200)],
      [p(200), p(200)],
    ];
    expect(() => t.displayUniformity(grid)).toThrow(/displayUniformity: grid/);
    const u = t.displayUniformity(grid, { reference: "mean" });
    const expected = t.deltaUvPrime(p(200, 8), { X: (4 * 0.95047 * 200 + 8) / 4, Y: 200, Z: 1.08883 * 200 });
    expect(u.points[0]!.deltaUv).toBeCloseTo(expected, 12);
    expect(u.maxDeltaUv).toBe(u.points[0]!.deltaUv);
  });
});

describe("primaries against a named target", () => {
  it("BT.709 primaries against BT.709 have no error; against DCI-P3 the red and green errors match the standards' coordinates", () => {
    const m = {
      red: { x: 0.64, y: 0.33 },
      green: { x: 0.3, y: 0.6 },
      blue: { x: 0.15, y: 0.06 },
      white: { x: 0.3127, y: 0.329 },
    };
    const same = t.primariesAgainstTarget(m, "BT.709");
    expect(same.maxPrimaryDeltaUv).toBe(0);
    expect(same.whiteDeltaUv).toBe(0);
    const p3 = t.primariesAgainstTarget(m, "DCI-P3");
    expect(p3.rows[0]!.dx).toBeCloseTo(0.64 - 0.68, 12);
    expect(p3.rows[1]!.dy).toBeCloseTo(0.6 - 0.69, 12);
    expect(p3.rows[3]!.deltaUv).toBeCloseTo(
      t.deltaUvPrime({ x: 0.3127, y: 0.329 }, { x: 0.314, y: 0.351 }),
      12,
    );
    expect(p3.target).toBe("DCI-P3");
    expect(() => t.primariesAgainstTarget(m, "P3 cinema")).toThrow(/primariesAgainstTarget: target/);
  });
});
