/**
 * Demo spectra: reflectances from sRGB (Burns 2020), the notch filter, and drive levels for the highest luminous
 * efficacy. Sources at each check.
 */
import { describe, expect, it } from "vitest";
import * as t from "../../../lib/index.ts";
import { differenceCiede2000 } from "culori";

describe("reflectance from sRGB (Burns 2020, least slope squared bounded to 0–1)", () => {
  const colours: t.Rgb[] = [
    { r: 0.8, g: 0.4, b: 0.2 },
    { r: 0.2, g: 0.3, b: 0.7 },
    { r: 0.9, g: 0.9, b: 0.1 },
    { r: 0.1, g: 0.6, b: 0.3 },
    { r: 0.5, g: 0.5, b: 0.5 },
    { r: 1, g: 0, b: 0 },
    { r: 0, g: 0, b: 1 },
    { r: 0.95, g: 0.8, b: 0.7 },
  ];
  it.each(colours)("reproduces sRGB %o within ΔE00 0.05 under D65 and stays within 0–1", (c) => {
    const rec = t.reflectanceFromSrgb(c);
    for (const v of rec.reflectance.values) {
      expect(v).toBeGreaterThanOrEqual(0);
      expect(v).toBeLessThanOrEqual(1);
    }
    expect(rec.deltaE00).toBeLessThan(0.05);
    // Independently: the reflectance's colour through the library's sRGB encoding, compared by culori's ΔE00.
    const col = t.objectColour(rec.reflectance, { illuminant: "D65", interval: 5 });
    const back = t.rgbFromXYZ(col.XYZ, t.rgbSpace("sRGB"));
    const de = differenceCiede2000()(
      { mode: "rgb", r: c.r, g: c.g, b: c.b },
      { mode: "rgb", r: back.r, g: back.g, b: back.b },
    );
    expect(de).toBeLessThan(0.1);
    expect(rec.exact).toBe(true);
  });
  it("a grey gives a flat reflectance equal to the linear sRGB value (smoothest curve: zero slope)", () => {
    const rec = t.reflectanceFromSrgb({ r: 0.5, g: 0.5, b: 0.5 });
    const lin = t.transferFunction("sRGB").decode(0.5);
    for (const v of rec.reflectance.values) expect(v).toBeCloseTo(lin, 6);
  });
  it("has less slope than any other reflectance of the same colour: adding a metameric black of D65 and the 1931 observer (Wyszecki 1958) only adds slope (Burns 2020 eq. 4)", () => {
    const rec = t.reflectanceFromSrgb({ r: 0.8, g: 0.4, b: 0.2 });
    expect(rec.heldAtBounds).toBe(0);
    const slope = (v: readonly number[]) => v.slice(1).reduce((s, x, i) => s + (x - v[i]!) ** 2, 0);
    const sensor = t.inventedCameraSensor({ grid: { start: 380, end: 730, step: 10 } });
    const pair = t.metamerPair(rec.reflectance, sensor);
    expect(pair.eyeDeltaE00).toBeLessThan(0.05);
    expect(slope(pair.a.values)).toBeGreaterThan(slope(rec.reflectance.values));
    expect(slope(pair.b.values)).toBeGreaterThan(slope(rec.reflectance.values));
  });
});

describe("notch (band-stop) filter", () => {
  it("blocks at the centre, passes far away, and is 50 % of the step at the band's edges (logistic edges)", () => {
    const f = t.notchFilter(589, 20, { edgeWidth: 6, floor: 0.02, grid: { start: 380, end: 780, step: 1 } });
    // At the centre both edges are 10 nm away: T = 1 − 0.98·e(10)², e the logistic edge of 6 nm 10–90 % width.
    const e10 = 1 / (1 + 9 ** (-20 / 6));
    expect(t.valueAt(f, 589)).toBeCloseTo(1 - 0.98 * e10 * e10, 10);
    expect(t.valueAt(f, 589)).toBeLessThan(0.025);
    expect(t.valueAt(f, 450)).toBeCloseTo(1, 6);
    expect(t.valueAt(f, 579)).toBeCloseTo(0.51, 2);
    expect(t.valueAt(f, 599)).toBeCloseTo(0.51, 2);
    expect(f.quantity).toBe("transmittance");
  });
  it("refuses a floor above the peak", () => {
    expect(() => t.notchFilter(589, 20, { floor: 0.9, peak: 0.5 })).toThrow(/above/);
  });
});

describe("drive levels for the highest luminous efficacy", () => {
  const grid = { start: 380, end: 780, step: 1 };
  const leds = [450, 500, 560, 600, 630].map((peak) => t.ledSpectrum({ peak, fwhm: 25, grid }));
  const target = { x: 0.3127, y: 0.329, Y: 100 };
  it("reaches the target chromaticity and luminance exactly", () => {
    const s = t.mostEfficientDriveLevels(leds, target);
    expect(s.reachable).toBe(true);
    const xy = t.chromaticityXy(s.achieved);
    expect(xy.x).toBeCloseTo(0.3127, 8);
    expect(xy.y).toBeCloseTo(0.329, 8);
    expect(s.achieved.Y).toBeCloseTo(100, 6);
    expect(s.objective).toContain("luminous efficacy");
  });
  it("no feasible mixture found by random search has a higher efficacy, and least squares (NNLS) is not better (linear programming: the optimum is a vertex)", () => {
    const s = t.mostEfficientDriveLevels(leds, target);
    const nnls = t.solveDriveLevels(leds, target);
    const power = (levels: readonly number[]) =>
      levels.reduce(
        (a, v, i) =>
          a + v * leds[i]!.values.reduce((p, x, k) => p + (k ? 0.5 * (x + leds[i]!.values[k - 1]!) : 0), 0),
        0,
      );
    expect(s.radiantPower).toBeLessThanOrEqual(power(nnls.levels) * (1 + 1e-9));
    // Random feasible mixtures: fix two levels at random, solve the other three, keep those ≥ 0.
    const xyz = leds.map((l) => t.lightXYZ(l));
    const goal = t.fromXyY(target);
    let seed = 7;
    const rnd = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
    let found = 0;
    for (let trial = 0; trial < 3000; trial++) {
      const levels = [0, 0, 0, 0, 0];
      const fixedIdx = [0, 1, 2, 3, 4].sort(() => rnd() - 0.5).slice(0, 2);
      for (const i of fixedIdx) levels[i] = rnd() * 2 * Math.max(...s.levels);
      const freeIdx = [0, 1, 2, 3, 4].filter((i) => !fixedIdx.includes(i));
      const M: t.Matrix3 = [0, 1, 2].map((r) =>
        freeIdx.map((i) => (r === 0 ? xyz[i]!.X : r === 1 ? xyz[i]!.Y : xyz[i]!.Z)),
      ) as unknown as t.Matrix3;
      const rest = [goal.X, goal.Y, goal.Z].map(
        (v, r) =>
          v -
          fixedIdx.reduce(
            (a, i) => a + levels[i]! * (r === 0 ? xyz[i]!.X : r === 1 ? xyz[i]!.Y : xyz[i]!.Z),
            0,
          ),
      );
      let sol: number[];
      try {
        sol = t.applyMatrix3(t.invertMatrix3(M), rest as unknown as t.Vector3);
      } catch {
        continue;
      }
      if (sol.some((v) => v < 0)) continue;
      freeIdx.forEach((i, a) => (levels[i] = sol[a]!));
      found++;
      expect(power(levels)).toBeGreaterThanOrEqual(s.radiantPower * (1 - 1e-9));
    }
    expect(found).toBeGreaterThan(50);
  });
  it("respects maxLevel, and says when the target is out of reach", () => {
    const s = t.mostEfficientDriveLevels(leds, target);
    const capped = t.mostEfficientDriveLevels(leds, target, { maxLevel: Math.max(...s.levels) * 0.8 });
    for (const v of capped.levels) expect(v).toBeLessThanOrEqual(Math.max(...s.levels) * 0.8 * (1 + 1e-12));
    expect(capped.luminousEfficacy).toBeLessThanOrEqual(s.luminousEfficacy * (1 + 1e-12));
    const off = t.mostEfficientDriveLevels(leds, { x: 0.08, y: 0.8, Y: 100 });
    expect(off.reachable).toBe(false);
  });
});
