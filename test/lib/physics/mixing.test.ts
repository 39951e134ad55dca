import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  chromaticityXy,
  colourantFromMasstone,
  colourantFromTint,
  demoPaints,
  dyeMixture,
  fullWidthHalfMax,
  gridWavelengths,
  ksFromReflectance,
  layeredTransmittance,
  layerOptics,
  lchFromLab,
  ledSpectrum,
  lightXYZ,
  methodsUsed,
  resetMethodLog,
  mixLights,
  mixPaint,
  nonNegativeLeastSquares,
  ohnoLedShape,
  opaqueReflectance,
  phosphorWhite,
  recipeColour,
  reflectanceFromKs,
  saundersonInternal,
  saundersonMeasured,
  singleConstantColourant,
  solveDriveLevels,
  spectralPeak,
  spectrum,
  toXyY,
  twoConstantColourant,
} from "../../../lib/index.ts";

const grid = { start: 380, end: 780, step: 5 };
const red = ledSpectrum({ peak: 630, fwhm: 18, grid, name: "red LED (model)" });
const green = ledSpectrum({ peak: 530, fwhm: 30, grid, name: "green LED (model)" });
const blue = ledSpectrum({ peak: 455, fwhm: 20, grid, name: "blue LED (model)" });
const amber = ledSpectrum({ peak: 590, fwhm: 15, grid, name: "amber LED (model)" });
const cyan = ledSpectrum({ peak: 500, fwhm: 25, grid, name: "cyan LED (model)" });

describe("additive mixing of lights", () => {
  it("adds spectra with drive levels, and the tristimulus values add likewise", () => {
    // Source: Grassmann's laws / linearity of the tristimulus integral (CIE 015:2018 §7): XYZ(aS₁ + bS₂) = a·XYZ(S₁) + b·XYZ(S₂).
    const mix = mixLights([
      { light: red, level: 0.7 },
      { light: green, level: 0.2 },
      { light: blue, level: 1.3 },
    ]);
    const parts = [lightXYZ(red), lightXYZ(green), lightXYZ(blue)];
    const expected = [0.7, 0.2, 1.3].reduce(
      (s, l, i) => ({ X: s.X + l * parts[i]!.X, Y: s.Y + l * parts[i]!.Y, Z: s.Z + l * parts[i]!.Z }),
      { X: 0, Y: 0, Z: 0 },
    );
    const got = lightXYZ(mix);
    expect(got.X).toBeCloseTo(expected.X, 8);
    expect(got.Y).toBeCloseTo(expected.Y, 8);
    expect(got.Z).toBeCloseTo(expected.Z, 8);
    expect(() => mixLights([{ light: red, level: -1 }])).toThrow(/drive level of "red LED \(model\)" is -1/);
    expect(() =>
      mixLights([
        {
          light: spectrum([500, 600], [0.5, 0.5], { name: "a filter", quantity: "transmittance" }),
          level: 1,
        },
      ]),
    ).toThrow(/filters multiply/);
    expect(() =>
      mixLights([
        { light: red, level: 1 },
        { light: ledSpectrum({ peak: 500, fwhm: 20 }), level: 1 },
      ]),
    ).toThrow(/different wavelengths/);
  });

  it("solves three primaries exactly: the solution reproduces its target", () => {
    // Source: Grassmann additivity (CIE 015:2018 §7): a mixture of known levels has XYZ = M·levels, so solving for
    // that XYZ must give the levels back and the target chromaticity and luminance.
    fc.assert(
      fc.property(
        fc.tuple(
          fc.double({ min: 0.01, max: 2, noNaN: true }),
          fc.double({ min: 0.01, max: 2, noNaN: true }),
          fc.double({ min: 0.01, max: 2, noNaN: true }),
        ),
        (lv) => {
          const target = toXyY(
            lightXYZ(
              mixLights([
                { light: red, level: lv[0] },
                { light: green, level: lv[1] },
                { light: blue, level: lv[2] },
              ]),
            ),
          );
          const sol = solveDriveLevels([red, green, blue], target);
          expect(sol.reachable).toBe(true);
          sol.levels.forEach((l, i) => expect(l).toBeCloseTo(lv[i]!, 6));
          expect(sol.achievedXyY!.x).toBeCloseTo(target.x, 9);
          expect(sol.achievedXyY!.y).toBeCloseTo(target.y, 9);
          expect(sol.achievedXyY!.Y / target.Y).toBeCloseTo(1, 9);
        },
      ),
      { numRuns: 40 },
    );
  });

  it("says clearly when a target is outside the primaries' gamut or too bright", () => {
    // Source: a chromaticity outside the triangle of three primaries needs a negative amount of one (Grassmann; CIE 015 §7).
    const spectralCyan = toXyY(lightXYZ(ledSpectrum({ peak: 495, fwhm: 4, grid })));
    const out = solveDriveLevels([red, green, blue], { ...spectralCyan, Y: 10 });
    expect(out.reachable).toBe(false);
    expect(out.message).toMatch(/Out of reach: .* outside the chromaticity gamut/);
    expect(Math.min(...out.levels)).toBeLessThan(0);
    const white = { x: 0.3127, y: 0.329, Y: 1e9 };
    const bright = solveDriveLevels([red, green, blue], white, { maxLevel: 1 });
    expect(bright.reachable).toBe(false);
    expect(bright.message).toMatch(/above the maximum 1/);
    expect(() => solveDriveLevels([red, green, blue], { x: 0.7, y: 0.5, Y: 1 })).toThrow(
      /not a physical chromaticity/,
    );
    expect(() => solveDriveLevels([red, red, blue], white)).toThrow(/linearly dependent/);
  });

  it("solves more than three primaries by non-negative least squares, reproducing reachable targets", () => {
    // Source: Grassmann additivity (CIE 015:2018 §7); the NNLS optimum satisfies the Kuhn–Tucker conditions of
    // Lawson & Hanson (1974, Theorem 23.4), so a target made from non-negative levels is matched exactly.
    const five = [red, amber, green, cyan, blue];
    fc.assert(
      fc.property(
        fc
          .array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 5, maxLength: 5 })
          .filter((a) => a.some((v) => v > 0.05)),
        (lv) => {
          const target = toXyY(lightXYZ(mixLights(five.map((light, i) => ({ light, level: lv[i]! })))));
          const sol = solveDriveLevels(five, target);
          expect(sol.reachable).toBe(true);
          expect(sol.method).toBe("non-negative least squares");
          sol.levels.forEach((l) => expect(l).toBeGreaterThanOrEqual(0));
          expect(sol.relativeError).toBeLessThan(1e-8);
        },
      ),
      { numRuns: 30 },
    );
    const far = solveDriveLevels(five, { x: 0.05, y: 0.75, Y: 5 }); // near the spectrum locus at 515 nm (CIE 015 locus), outside five LED bands
    expect(far.reachable).toBe(false);
    expect(far.message).toMatch(/closest non-negative mixture/);
  });

  it("finds a bounded mixture of four primaries when the least-squares one exceeds the maximum", () => {
    // Source: linear programming — a non-empty set {Mx = t, 0 ≤ x ≤ u} has a basic feasible solution; here one
    // exists by construction (levels 0.9, 0.9, 0.9, 0.9), so the solver must report the target reachable within 1.
    const four = [red, amber, green, blue];
    const target = toXyY(lightXYZ(mixLights(four.map((light) => ({ light, level: 0.9 })))));
    const sol = solveDriveLevels(four, target, { maxLevel: 1 });
    expect(sol.reachable).toBe(true);
    sol.levels.forEach((l) => expect(l).toBeLessThanOrEqual(1 + 1e-9));
    expect(sol.relativeError).toBeLessThan(1e-8);
  });

  it("meets the Kuhn–Tucker conditions of non-negative least squares", () => {
    // Source: Lawson & Hanson, Solving Least Squares Problems (1974), Theorem 23.4: at the solution x ≥ 0,
    // w = Aᵀ(b − Ax) has w_j = 0 where x_j > 0 and w_j ≤ 0 where x_j = 0.
    fc.assert(
      fc.property(
        fc.array(fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: 4, maxLength: 4 }), {
          minLength: 3,
          maxLength: 6,
        }),
        fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: 6, maxLength: 6 }),
        (A, bAll) => {
          const b = bAll.slice(0, A.length);
          const x = nonNegativeLeastSquares(A, b);
          const r = b.map((bi, i) => bi - A[i]!.reduce((s, a, j) => s + a * x[j]!, 0));
          const w = [0, 1, 2, 3].map((j) => A.reduce((s, row, i) => s + row[j]! * r[i]!, 0));
          x.forEach((xj, j) => {
            expect(xj).toBeGreaterThanOrEqual(0);
            if (xj > 1e-9) expect(Math.abs(w[j]!)).toBeLessThan(1e-6);
            else expect(w[j]!).toBeLessThan(1e-6);
          });
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe("LED spectra", () => {
  it("have the requested peak and FWHM for the Ohno and Gaussian shapes, with or without asymmetry", () => {
    // Source: CIE 127:2007 definitions of peak wavelength and FWHM (spectral bandwidth at half intensity); Ohno,
    // Opt. Eng. 44, 111302 (2005) shape [g + 2g⁵]/3 (recalled from memory), which peaks at 1 at λ₀.
    expect(ohnoLedShape(0)).toBe(1);
    for (const shape of ["ohno 2005", "gaussian"] as const) {
      for (const asymmetry of [0, 0.3]) {
        const led = ledSpectrum({
          peak: 540.5,
          fwhm: 27,
          shape,
          asymmetry,
          grid: { start: 360, end: 830, step: 0.5 },
        });
        expect(spectralPeak(led).wavelength).toBe(540.5);
        expect(fullWidthHalfMax(led).width).toBeCloseTo(27, 2);
      }
    }
    // Source: for a Gaussian exp(−(Δλ/w)²) the FWHM is 2√(ln 2)·w (a standard property of the Gaussian).
    const g = ledSpectrum({ peak: 600, fwhm: 2 * Math.sqrt(Math.LN2) * 10, shape: "gaussian" });
    expect(g.values[g.wavelengths.indexOf(610)]).toBeCloseTo(Math.exp(-1), 10);
    expect(() => ledSpectrum({ peak: 500, fwhm: 0 })).toThrow(/FWHM \(nm\) is 0/);
    expect(() => ledSpectrum({ peak: 500, fwhm: 20, asymmetry: 1 })).toThrow(/asymmetry 1/);
  });

  it("makes phosphor-converted white on the line between the pump and the phosphor band", () => {
    // Source: Grassmann's laws (CIE 015:2018 §7): a mixture of two lights lies on the straight line joining
    // their chromaticities in xy; the phosphor-to-blue radiant power ratio is as requested.
    const w = phosphorWhite({
      blue: { peak: 450, fwhm: 20 },
      phosphor: { peak: 565, fwhm: 110, asymmetry: 0.2 },
      phosphorToBlue: 2.5,
    });
    const pump = chromaticityXy(lightXYZ(ledSpectrum({ peak: 450, fwhm: 20 })));
    const band = chromaticityXy(
      lightXYZ(ledSpectrum({ peak: 565, fwhm: 110, asymmetry: 0.2, shape: "gaussian" })),
    );
    const mix = chromaticityXy(lightXYZ(w));
    const cross = (band.x - pump.x) * (mix.y - pump.y) - (band.y - pump.y) * (mix.x - pump.x);
    expect(Math.abs(cross)).toBeLessThan(1e-12);
    expect(mix.x).toBeGreaterThan(pump.x);
    expect(mix.x).toBeLessThan(band.x);
    const blueOnly = ledSpectrum({ peak: 450, fwhm: 20 });
    const sum = (a: readonly number[]) => a.reduce((s, v) => s + v, 0);
    expect((sum(w.values) - sum(blueOnly.values)) / sum(blueOnly.values)).toBeCloseTo(2.5, 10);
  });

  it("states one LED model in Methods for a phosphor white: the pump's shape, the phosphor band with the white", () => {
    // Issue 17: Methods listed "modelled as Gaussians" beside Ohno's shape when only the pump was an LED model.
    resetMethodLog();
    phosphorWhite({ blue: { peak: 450, fwhm: 20 }, phosphor: { peak: 565, fwhm: 110 }, phosphorToBlue: 2.5 });
    const statements = methodsUsed().map((m) => m.statement);
    expect(statements.filter((t) => t.startsWith("LED spectra were modelled"))).toEqual([
      expect.stringMatching(/Ohno's shape/),
    ]);
    expect(statements.some((t) => /Gaussian phosphor band/.test(t))).toBe(true);
    resetMethodLog();
  });
});

describe("transparent layers and dyes", () => {
  it("multiplies layers, and dyes in one layer equal separate layers of each dye", () => {
    // Source: Beer–Lambert law (IUPAC Gold Book): absorbances of dyes in one path add, so 10^(−Σ cA) = Π 10^(−cA).
    const w = [450, 550, 650];
    const a1 = spectrum(w, [0.9, 0.1, 0.02], { name: "invented yellow dye", quantity: "absorbance" });
    const a2 = spectrum(w, [0.05, 0.3, 1.2], { name: "invented cyan dye", quantity: "absorbance" });
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 3, noNaN: true }),
        fc.double({ min: 0, max: 3, noNaN: true }),
        fc.double({ min: 0.1, max: 5, noNaN: true }),
        (c1, c2, d) => {
          const together = dyeMixture(
            [
              { absorbance: a1, concentration: c1 },
              { absorbance: a2, concentration: c2 },
            ],
            { path: d },
          );
          const apart = layeredTransmittance([
            dyeMixture([{ absorbance: a1, concentration: c1 }], { path: d }),
            dyeMixture([{ absorbance: a2, concentration: c2 }], { path: d }),
          ]);
          together.values.forEach((v, i) => expect(v).toBeCloseTo(apart.values[i]!, 12));
        },
      ),
    );
    expect(() => layeredTransmittance([spectrum(w, [0.5, 40, 0.5], { name: "percent layer" })])).toThrow(
      /"percent layer" is 40 at 550 nm/,
    );
  });
});

/** RK4 integration of the Kubelka–Munk differential equations, an independent check of the closed-form solutions. */
function integrateTwoFlux(K: number, S: number, X: number, Rg: number): { R: number; T: number } {
  // Kubelka & Munk (1931): di/dx = −(K + S)i + S·j, dj/dx = (K + S)j − S·i, x from the lit face (0) to the background (X).
  const steps = 4000;
  const h = X / steps;
  const f = ([i, j]: number[]) => [-(K + S) * i! + S * j!, (K + S) * j! - S * i!];
  const run = (start: number[]) => {
    let y = start;
    for (let n = 0; n < steps; n++) {
      const k1 = f(y);
      const k2 = f(y.map((v, q) => v + (h / 2) * k1[q]!));
      const k3 = f(y.map((v, q) => v + (h / 2) * k2[q]!));
      const k4 = f(y.map((v, q) => v + h * k3[q]!));
      y = y.map((v, q) => v + (h / 6) * (k1[q]! + 2 * k2[q]! + 2 * k3[q]! + k4[q]!));
    }
    return y;
  };
  // Linear system: start with i(0) = 1 and unknown j(0) = R; require j(X) = Rg·i(X).
  const p = run([1, 0]);
  const q = run([0, 1]);
  const R = (Rg * p[0]! - p[1]!) / (q[1]! - Rg * q[0]!);
  return { R, T: p[0]! + R * q[0]! };
}

describe("Kubelka–Munk theory", () => {
  it("relates K/S and the reflectance of an opaque layer both ways", () => {
    // Source: Kubelka & Munk (1931): K/S = (1 − R∞)²/(2R∞); R∞ = 0.5 gives K/S = 0.25; the inverse is
    // R∞ = 1 + K/S − √((K/S)² + 2K/S) (Kubelka 1948, J. Opt. Soc. Am. 38, 448).
    expect(ksFromReflectance(0.5)).toBeCloseTo(0.25, 14);
    fc.assert(
      fc.property(fc.double({ min: 1e-6, max: 1, noNaN: true }), (r) => {
        expect(reflectanceFromKs(ksFromReflectance(r))).toBeCloseTo(r, 10);
      }),
    );
    expect(() => ksFromReflectance(0)).toThrow(/K\/S = ∞/);
    expect(() => ksFromReflectance(50)).toThrow(/percent/);
  });

  it("matches a direct integration of the two-flux equations for finite layers", () => {
    // Source: the Kubelka–Munk differential equations (Kubelka & Munk 1931), integrated numerically (RK4), against
    // the hyperbolic closed form of Kubelka (1948).
    for (const [K, S, X, Rg] of [
      [0.5, 3, 0.4, 0.8],
      [2, 0.5, 1.2, 0.1],
      [0.05, 10, 0.2, 0],
      [1, 1, 2, 0.5],
    ] as const) {
      const ref = integrateTwoFlux(K, S, X, Rg);
      const got = layerOptics(K, S, X, Rg);
      expect(got.reflectance).toBeCloseTo(ref.R, 9);
      if (Rg === 0) expect(got.transmittance).toBeCloseTo(ref.T, 9);
    }
  });

  it("satisfies the limiting cases and Kubelka's relation between R₀, T and R∞", () => {
    // Source: Kubelka (1948): a = (S + K)/S = (1 + R₀² − T²)/(2R₀) = (1 + R∞²)/(2R∞); a layer over a background
    // equal to R∞ reflects R∞ at any thickness; X → ∞ gives R∞; X = 0 gives R_g; S = 0 gives Bouguer's T = e^(−KX).
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        fc.double({ min: 0.01, max: 3, noNaN: true }),
        (K, S, X) => {
          const { reflectanceOverBlack: r0, transmittance: t } = layerOptics(K, S, X, 0);
          expect((1 + r0 * r0 - t * t) / (2 * r0)).toBeCloseTo(1 + K / S, 6);
          const rInf = opaqueReflectance(K, S);
          expect((1 + rInf * rInf) / (2 * rInf)).toBeCloseTo(1 + K / S, 9);
          expect(layerOptics(K, S, X, rInf).reflectance).toBeCloseTo(rInf, 12);
        },
      ),
    );
    expect(layerOptics(1, 2, 1000, 0.9).reflectance).toBeCloseTo(opaqueReflectance(1, 2), 12);
    expect(layerOptics(1, 2, 0, 0.37).reflectance).toBeCloseTo(0.37, 14);
    expect(layerOptics(0.7, 0, 2, 0).transmittance).toBeCloseTo(Math.exp(-1.4), 14);
    expect(() => layerOptics(-1, 1, 1, 0)).toThrow(
      /layerOptics: k should be a finite number in absorption coefficient of at least 0, but got the number -1/,
    );
  });

  it("applies the Saunderson correction consistently", () => {
    // Source: Saunderson (1942), J. Opt. Soc. Am. 32, 727: R_m = k₁ + (1 − k₁)(1 − k₂)R_i/(1 − k₂R_i). A black
    // interior (R_i = 0) shows only k₁; a perfectly white interior (R_i = 1) returns all light (R_m = 1).
    expect(saundersonMeasured(0, { k1: 0.04, k2: 0.6 })).toBeCloseTo(0.04, 14);
    expect(saundersonMeasured(1, { k1: 0.04, k2: 0.6 })).toBeCloseTo(1, 14);
    expect(saundersonMeasured(0, { specular: "excluded" })).toBe(0);
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 0.1, noNaN: true }),
        fc.double({ min: 0, max: 0.7, noNaN: true }),
        (ri, k1, k2) => {
          for (const specular of ["included", "excluded"] as const) {
            expect(
              saundersonInternal(saundersonMeasured(ri, { k1, k2, specular }), { k1, k2, specular }),
            ).toBeCloseTo(ri, 10);
          }
        },
      ),
    );
    expect(() => saundersonInternal(0.02, { k1: 0.04 })).toThrow(/below the surface reflection/);
  });

  it("mixes by Duncan's additivity, and recovers K and S from masstone and tint", () => {
    // Source: Duncan (1940), Proc. Phys. Soc. 52, 390: K = ΣcK, S = ΣcS. Making a masstone and a tint from known
    // K and S, then characterising them, must give the K and S back relative to the white's S.
    const p = demoPaints();
    const tintFraction = 0.2;
    const masstone = mixPaint([{ colourant: p.blue, amount: 1 }]);
    const tint = mixPaint([
      { colourant: p.blue, amount: tintFraction },
      { colourant: p.white, amount: 1 - tintFraction },
    ]);
    const white = mixPaint([{ colourant: p.white, amount: 1 }]);
    const { colourant } = colourantFromTint({ masstone, tint, white, tintFraction });
    colourant.k.values.forEach((k, i) => {
      const sw = p.white.s.values[i]!;
      expect(colourant.s.values[i]).toBeCloseTo(p.blue.s.values[i]! / sw, 6);
      expect(k).toBeCloseTo(p.blue.k.values[i]! / sw, 6);
    });
    // Single-constant: the mixture's K/S is the fraction-weighted mean of the components' K/S.
    const w = [450, 550, 650];
    const a = singleConstantColourant(spectrum(w, [0.1, 1, 4], { name: "invented a" }));
    const b = singleConstantColourant(spectrum(w, [3, 0.5, 0.2], { name: "invented b" }));
    const mixed = mixPaint(
      [
        { colourant: a, amount: 1 },
        { colourant: b, amount: 3 },
      ],
      { surface: "none" },
    );
    mixed.values.forEach((r, i) =>
      expect(r).toBeCloseTo(reflectanceFromKs(0.25 * a.ks.values[i]! + 0.75 * b.ks.values[i]!), 12),
    );
    const back = colourantFromMasstone(mixPaint([{ colourant: a, amount: 1 }]));
    back.ks.values.forEach((v, i) => expect(v).toBeCloseTo(a.ks.values[i]!, 9));
    expect(() =>
      mixPaint([
        { colourant: a, amount: 1 },
        { colourant: p.red, amount: 1 },
      ]),
    ).toThrow(/single-constant and two-constant/);
    expect(() => mixPaint([{ colourant: a, amount: 0 }])).toThrow(/total amount of the recipe is 0/);
    expect(() =>
      twoConstantColourant(spectrum(w, [1, 1, 1]), spectrum(w, [1, -1, 1], { name: "bad S" })),
    ).toThrow(/"bad S" is -1 at 550 nm/);
  });

  it("shows that red, green and blue paint mix to a dark, nearly neutral colour", () => {
    // Source: Kubelka–Munk with Duncan additivity: absorptions add, so a mixture of colourants that each absorb
    // two thirds of the spectrum absorbs nearly all of it (the textbook contrast of additive and subtractive
    // mixing, e.g. Berns, Billmeyer and Saltzman's Principles of Color Technology, recalled from memory).
    // The paints are invented demo data; what is checked is the qualitative result the theory predicts.
    const p = demoPaints();
    const parts = [p.red, p.green, p.blue];
    const each = parts.map((c) => lchFromLab(recipeColour([{ colourant: c, amount: 1 }]).Lab));
    const mix = lchFromLab(recipeColour(parts.map((colourant) => ({ colourant, amount: 1 }))).Lab);
    each.forEach((c) => expect(mix.L).toBeLessThan(c.L));
    expect(mix.L).toBeLessThan(35);
    expect(mix.C).toBeLessThan(10);
    // The same three hues as lights add up to a bright white-ish light (Grassmann): Y of the sum exceeds each part.
    const lights = [red, green, blue];
    const sumY = lightXYZ(mixLights(lights.map((light) => ({ light, level: 1 })))).Y;
    lights.forEach((l) => expect(sumY).toBeGreaterThan(lightXYZ(l).Y));
    expect(gridWavelengths({ start: 360, end: 830, step: 5 })).toEqual(p.red.k.wavelengths);
  });
});
