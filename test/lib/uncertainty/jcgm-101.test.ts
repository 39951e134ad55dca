/**
 * Monte Carlo propagation (JCGM 101:2008) and the law of propagation (JCGM 100:2008) against the worked examples of
 * JCGM 101 §9 and against closed-form results for linear models. The printed values of JCGM 101 below are RECALLED
 * FROM MEMORY (Tables 2, 3, 4 and 7 of JCGM 101:2008); the closed forms are computed in the tests themselves.
 */
import { describe, expect, it } from "vitest";
import {
  firstOrderUncertainty,
  monteCarloUncertainty,
  normalInput,
  rectangularInput,
  spectralInput,
  spectrumOnGrid,
  triangularInput,
  uncertaintyText,
  type Spectrum,
} from "../../../lib/index.ts";

const sum = (v: Record<string, number | Spectrum>) =>
  Object.values(v).reduce<number>((s, x) => s + (x as number), 0);

describe("JCGM 101:2008 §9.2, additive model Y = X1 + X2 + X3 + X4", () => {
  it("§9.2.2 (Table 2, recalled from memory): normal inputs, u(y) = 2.00, interval [−3.92, 3.92] by both methods", () => {
    const x = normalInput(0, 1);
    const r = monteCarloUncertainty(sum, { x1: x, x2: x, x3: x, x4: x }, { trials: 200_000, seed: 7 });
    const y = r.outputs.y!;
    expect(y.estimate).toBeCloseTo(0, 1);
    expect(y.standardUncertainty).toBeCloseTo(2.0, 1);
    expect(y.interval.low).toBeCloseTo(-3.92, 1);
    expect(y.interval.high).toBeCloseTo(3.92, 1);
    expect(r.firstOrder!.outputs.y!.standardUncertainty).toBeCloseTo(2, 10);
    expect(r.firstOrder!.outputs.y!.interval.high).toBeCloseTo(3.92, 2);
    expect(r.agreement!.y!.agrees).toBe(true);
    expect(r.warning).toBeUndefined();
  });

  it("§9.2.3 (Table 3, recalled from memory): rectangular inputs of u = 1 give MCM [−3.88, 3.88] against GUF [−3.92, 3.92]", () => {
    const x = rectangularInput(0, Math.sqrt(3));
    const r = monteCarloUncertainty(sum, { x1: x, x2: x, x3: x, x4: x }, { trials: 400_000, seed: 3 });
    const y = r.outputs.y!;
    expect(y.standardUncertainty).toBeCloseTo(2.0, 2);
    expect(y.interval.low).toBeCloseTo(-3.88, 1);
    expect(y.interval.high).toBeCloseTo(3.88, 1);
    expect(Math.abs(y.interval.high - 3.88)).toBeLessThan(0.015);
    expect(r.firstOrder!.outputs.y!.interval.high).toBeCloseTo(3.92, 2);
  });

  it("§9.2.4 (Table 4, recalled from memory): a dominant rectangular X4 (u = 10) gives MCM [−17.0, 17.0] against GUF [−19.9, 19.9], and a warning", () => {
    const n = normalInput(0, 1);
    const r = monteCarloUncertainty(
      sum,
      { x1: n, x2: n, x3: n, x4: rectangularInput(0, 10 * Math.sqrt(3)) },
      { trials: 200_000, seed: 11, interval: "shortest" },
    );
    const y = r.outputs.y!;
    expect(y.standardUncertainty).toBeCloseTo(Math.sqrt(103), 1);
    expect(y.interval.low).toBeGreaterThan(-17.05 - 0.1);
    expect(y.interval.high).toBeLessThan(17.05 + 0.1);
    expect(y.interval.high).toBeGreaterThan(16.95 - 0.1);
    expect(r.firstOrder!.outputs.y!.interval.high).toBeCloseTo(19.9, 1);
    expect(r.agreement!.y!.agrees).toBe(false);
    expect(r.warning).toMatch(/does not agree/);
  });

  it("the §9.2.4 interval end agrees with a numerical convolution of N(0, 3) with the rectangular distribution (independent check)", () => {
    // P(|Y| ≤ t) for Y = N(0, √3) + R(−a, a): integrate the normal CDF over the rectangle (Simpson, 2000 panels).
    const a = 10 * Math.sqrt(3),
      s = Math.sqrt(3);
    const phi = (z: number) => 0.5 * (1 + erf(z / Math.SQRT2));
    const inside = (t: number) => {
      const N = 2000;
      let acc = 0;
      for (let i = 0; i <= N; i++) {
        const x = -a + (2 * a * i) / N;
        const w = i === 0 || i === N ? 1 : i % 2 ? 4 : 2;
        acc += w * (phi((t - x) / s) - phi((-t - x) / s));
      }
      return (acc * (2 * a)) / N / 3 / (2 * a);
    };
    let lo = 10,
      hi = 25;
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (inside(mid) < 0.95) lo = mid;
      else hi = mid;
    }
    const r = monteCarloUncertainty(
      sum,
      { x1: normalInput(0, 1), x2: normalInput(0, 1), x3: normalInput(0, 1), x4: rectangularInput(0, a) },
      { trials: 200_000, seed: 5 },
    );
    expect(r.outputs.y!.interval.high).toBeCloseTo(lo, 1);
    expect(lo).toBeCloseTo(17.0, 1); // and the recalled Table 4 value
  });
});

describe("JCGM 101:2008 §9.3, mass calibration (Table 7, recalled from memory)", () => {
  // δm = (m_Rc + δm_Rc)·[1 + (ρa − ρa0)(1/ρW − 1/ρR)] − m_nom, masses in mg, densities in kg/m³.
  const inputs = {
    mRc: normalInput(100_000, 0.05, "mg"),
    dmRc: normalInput(1.234, 0.02, "mg"),
    rhoA: rectangularInput(1.2, 0.1, "kg/m³"),
    rhoW: rectangularInput(8000, 1000, "kg/m³"),
    rhoR: rectangularInput(8000, 50, "kg/m³"),
  };
  const model = (v: Record<string, number | Spectrum>) => {
    const { mRc, dmRc, rhoA, rhoW, rhoR } = v as Record<string, number>;
    return (mRc! + dmRc!) * (1 + (rhoA! - 1.2) * (1 / rhoW! - 1 / rhoR!)) - 100_000;
  };

  it("first order: δm = 1.2340 mg, u = 0.0539 mg, interval [1.1285, 1.3395] mg", () => {
    const r = firstOrderUncertainty(model, inputs);
    expect(r.outputs.y!.estimate).toBeCloseTo(1.234, 4);
    expect(r.outputs.y!.standardUncertainty).toBeCloseTo(0.0539, 4);
    expect(r.outputs.y!.interval.low).toBeCloseTo(1.1285, 3);
    expect(r.outputs.y!.interval.high).toBeCloseTo(1.3395, 3);
  });

  it("Monte Carlo: δm = 1.2341 mg, u = 0.0754 mg, interval [1.0834, 1.3825] mg; and the first-order result is flagged", () => {
    const r = monteCarloUncertainty(model, inputs, { trials: 400_000, seed: 2 });
    const y = r.outputs.y!;
    expect(y.estimate).toBeCloseTo(1.2341, 3);
    expect(y.standardUncertainty).toBeCloseTo(0.0754, 3);
    expect(y.interval.low).toBeCloseTo(1.0834, 2);
    expect(y.interval.high).toBeCloseTo(1.3825, 2);
    expect(r.agreement!.y!.agrees).toBe(false);
    expect(r.warning).toMatch(/first order/);
  });

  it("the adaptive procedure (§7.9) settles and agrees with a fixed large run within its own tolerance", () => {
    const r = monteCarloUncertainty(model, inputs, { seed: 9 });
    expect(r.adaptive).toBe(true);
    expect(r.trials).toBeGreaterThanOrEqual(20_000);
    expect(r.trials! % 10_000).toBe(0);
    expect(Math.abs(r.outputs.y!.standardUncertainty - 0.0754)).toBeLessThan(0.0015);
  });
});

describe("linear models: Monte Carlo agrees with the JCGM 100 formula u² = Σ cᵢ² u²(xᵢ)", () => {
  it("Y = 3 X1 − 2 X2 + X3 with normal, rectangular and triangular inputs", () => {
    const inputs = { a: normalInput(1, 0.2), b: rectangularInput(2, 0.5), c: triangularInput(-1, 0.6) };
    const model = (v: Record<string, number | Spectrum>) =>
      3 * (v.a as number) - 2 * (v.b as number) + (v.c as number);
    const expected = Math.sqrt(9 * 0.04 + 4 * (0.25 / 3) + 0.36 / 6); // JCGM 100 eq. 10, by hand
    const fo = firstOrderUncertainty(model, inputs).outputs.y!;
    expect(fo.standardUncertainty).toBeCloseTo(expected, 8);
    const mc = monteCarloUncertainty(model, inputs, { trials: 200_000, seed: 4 });
    expect(mc.outputs.y!.estimate).toBeCloseTo(3 - 4 - 1, 2);
    expect(Math.abs(mc.outputs.y!.standardUncertainty / expected - 1)).toBeLessThan(0.01);
  });

  it("a weighted band sum with independent and with exponentially correlated noise (closed forms)", () => {
    const wl = Array.from({ length: 31 }, (_, i) => 400 + 10 * i);
    const w = wl.map((l) => Math.exp(-(((l - 550) / 60) ** 2)));
    const s = spectrumOnGrid(400, 10, new Array(31).fill(0.5), { quantity: "transmittance" });
    const model = (v: Record<string, number | Spectrum>) =>
      (v.s as Spectrum).values.reduce((acc, x, i) => acc + w[i]! * x, 0);
    const L = 40,
      uc = 0.003,
      un = 0.002;
    let varC = 0;
    for (let i = 0; i < 31; i++)
      for (let j = 0; j < 31; j++) varC += w[i]! * w[j]! * Math.exp(-Math.abs(wl[i]! - wl[j]!) / L);
    const expected = Math.sqrt(un * un * w.reduce((a, x) => a + x * x, 0) + uc * uc * varC);
    const input = { s: spectralInput(s, { bandNoise: un, correlatedNoise: { u: uc, length: L } }) };
    expect(firstOrderUncertainty(model, input).outputs.y!.standardUncertainty).toBeCloseTo(expected, 8);
    const mc = monteCarloUncertainty(model, input, { trials: 100_000, seed: 8 });
    expect(Math.abs(mc.outputs.y!.standardUncertainty / expected - 1)).toBeLessThan(0.015);
    expect(mc.agreement!.y!.agrees).toBe(true);
  });

  it("a photometric-scale error is fully correlated: u(Σ wᵢ τᵢ) = u_rel · Σ wᵢ τᵢ; and outputs correlate as expected", () => {
    const s = spectrumOnGrid(400, 10, [0.2, 0.4, 0.6, 0.8], { quantity: "transmittance" });
    const model = (v: Record<string, number | Spectrum>) => {
      const t = (v.s as Spectrum).values;
      return { first: t[0]!, last: t[3]! };
    };
    const r = monteCarloUncertainty(model, { s: spectralInput(s, { scale: 0.01 }) }, { trials: 20_000 });
    expect(Math.abs(r.outputs.last!.standardUncertainty / 0.008 - 1)).toBeLessThan(0.02); // 20 000 trials: ≈ 0.5 % sd
    expect(r.correlations.first!.last).toBeCloseTo(1, 6);
  });
});

describe("shortest and symmetric intervals (JCGM 101 §7.7)", () => {
  it("Y = X², X ~ N(0, 1): χ²(1) quantiles (standard tables, recalled from memory): symmetric [0.00098, 5.02], shortest [0, 3.84]", () => {
    const model = (v: Record<string, number | Spectrum>) => (v.x as number) ** 2;
    const x = { x: normalInput(0, 1) };
    const sym = monteCarloUncertainty(model, x, { trials: 200_000, seed: 21, compare: false }).outputs.y!;
    const short = monteCarloUncertainty(model, x, {
      trials: 200_000,
      seed: 21,
      interval: "shortest",
      compare: false,
    }).outputs.y!;
    expect(sym.interval.low).toBeCloseTo(0.00098, 3);
    expect(sym.interval.high).toBeCloseTo(5.024, 1);
    expect(short.interval.low).toBeLessThan(1e-4);
    expect(short.interval.high).toBeCloseTo(3.841, 1);
    expect(Math.abs(sym.standardUncertainty - Math.SQRT2)).toBeLessThan(0.02); // var χ²(1) = 2; 3σ of s at 2·10⁵ trials
    // First order sees no sensitivity at x = 0 (∂y/∂x = 0): the comparison must flag it.
    const compared = monteCarloUncertainty(model, x, { trials: 20_000, seed: 3 });
    expect(compared.firstOrder!.outputs.y!.standardUncertainty).toBeLessThan(1e-3);
    expect(compared.warning).toMatch(/not linear enough/);
  });
});

describe("spectral effects against their closed forms", () => {
  it("a wavelength shift δ moves a linear spectrum S = a + bλ by b·δ: u = |b|·u(δ)", () => {
    const s = spectrumOnGrid(
      400,
      5,
      Array.from({ length: 41 }, (_, i) => 0.2 + 0.002 * 5 * i),
      {
        quantity: "transmittance",
      },
    );
    const model = (v: Record<string, number | Spectrum>) => (v.s as Spectrum).values[20]!;
    const input = { s: spectralInput(s, { wavelengthShift: 0.3 }) };
    expect(firstOrderUncertainty(model, input).outputs.y!.standardUncertainty).toBeCloseTo(0.002 * 0.3, 9);
    const mc = monteCarloUncertainty(model, input, { trials: 50_000, seed: 12 });
    expect(Math.abs(mc.outputs.y!.standardUncertainty / (0.002 * 0.3) - 1)).toBeLessThan(0.02);
  });

  it("a bandwidth error on S = cλ² changes a band by S″·((b + δ)² − b²)/12 = c(2bδ + δ²)/6: u ≈ c·b·u(δ)/3", () => {
    const c = 1e-6;
    const s = spectrumOnGrid(
      400,
      5,
      Array.from({ length: 41 }, (_, i) => c * (400 + 5 * i) ** 2),
      {
        quantity: "other",
      },
    );
    const model = (v: Record<string, number | Spectrum>) => (v.s as Spectrum).values[20]!;
    const input = { s: spectralInput(s, { bandwidthError: { bandwidth: 5, u: 0.5 } }) };
    const expected = (c * 5 * 0.5) / 3;
    expect(firstOrderUncertainty(model, input).outputs.y!.standardUncertainty / expected).toBeCloseTo(1, 6);
    const mc = monteCarloUncertainty(model, input, { trials: 50_000, seed: 13 });
    // The δ² term adds c·u²/6 to the mean (second order): the Monte Carlo estimate shows it.
    expect(mc.outputs.y!.estimate - s.values[20]!).toBeCloseTo((c * 0.25) / 6, 8);
  });
});

describe("coverage by seeded repetition", () => {
  it("about 95 % of 400 seeded repeats contain the true value of Y = X1 + 2 X2 (binomial 3σ band)", () => {
    const truth = { a: 1, b: 0.5 };
    const ua = 0.1,
      ub = 0.05;
    const trueY = truth.a + 2 * truth.b;
    // "Measured" estimates drawn around the truth with a simple generator of the test's own (Park–Miller + Box–Muller).
    let state = 12345;
    const uni = () => (state = (state * 48271) % 2147483647) / 2147483647;
    const gauss = () => Math.sqrt(-2 * Math.log(uni())) * Math.cos(2 * Math.PI * uni());
    let inside = 0;
    const repeats = 400;
    for (let i = 0; i < repeats; i++) {
      const a = truth.a + ua * gauss(),
        b = truth.b + ub * gauss();
      const r = monteCarloUncertainty(
        (v) => (v.a as number) + 2 * (v.b as number),
        { a: normalInput(a, ua), b: normalInput(b, ub) },
        { trials: 2000, seed: i + 1, compare: false },
      );
      if (r.outputs.y!.interval.low <= trueY && trueY <= r.outputs.y!.interval.high) inside++;
    }
    const sd = Math.sqrt((0.95 * 0.05) / repeats);
    expect(inside / repeats).toBeGreaterThan(0.95 - 3 * sd);
    expect(inside / repeats).toBeLessThan(0.95 + 3 * sd);
  });
});

describe("reproducibility, text and bad input", () => {
  it("the same seed gives the same result, another seed another", () => {
    const run = (seed: number) =>
      monteCarloUncertainty((v) => (v.a as number) ** 2, { a: normalInput(1, 0.1) }, { trials: 1000, seed })
        .outputs.y!.standardUncertainty;
    expect(run(5)).toBe(run(5));
    expect(run(5)).not.toBe(run(6));
  });

  it('writes "value ± U (k = 2)" with U to two significant digits (JCGM 100 §7.2.6)', () => {
    expect(uncertaintyText({ estimate: 0.642134, expandedUncertainty: 0.008381 })).toBe(
      "0.6421 ± 0.0084 (k = 2)",
    );
    expect(uncertaintyText({ estimate: -12.345, expandedUncertainty: 1.26 }, "K")).toBe(
      "−12.3 K ± 1.3 K (k = 2)",
    );
  });

  it("refuses a model that gives no number and an input that is not a model", () => {
    expect(() => monteCarloUncertainty(() => NaN, { a: normalInput(1, 1) })).toThrow(/finite number/);
    expect(() => monteCarloUncertainty((v) => v.a as number, { a: 3 as never })).toThrow(/uncertain inputs/);
  });
});

function erf(x: number): number {
  // Abramowitz & Stegun 7.1.26 is too coarse here; use the series / continued fraction split.
  const z = Math.abs(x);
  let r: number;
  if (z < 3) {
    let term = z,
      s = z;
    for (let n = 1; n < 100; n++) {
      term *= (-z * z) / n;
      s += term / (2 * n + 1);
    }
    r = (2 / Math.sqrt(Math.PI)) * s;
  } else {
    let f = 0;
    for (let n = 60; n >= 1; n--) f = n / 2 / (z + f);
    r = 1 - Math.exp(-z * z) / Math.sqrt(Math.PI) / (z + f);
  }
  return x < 0 ? -r : r;
}
