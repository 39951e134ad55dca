/**
 * Spectra: construction, interpolation (linear, Sprague per CIE 167:2005, natural cubic spline), resampling,
 * arithmetic with explicit alignment, normalisation, sets, and bad input. Property tests use fast-check;
 * spectrum → XYZ is cross-checked against spdToXyz of the npm package spectral-color.
 */
import fc from "fast-check";
import { Shape, SpectralDistribution, illuminants, spdToXyz } from "spectral-color";
import { describe, expect, it } from "vitest";
import { tristimulus } from "../../lib/colorimetry/tristimulus.ts";
import {
  addSpectra,
  alignSpectra,
  divideSpectra,
  multiplySpectra,
  overlapGrid,
  scaleSpectrum,
} from "../../lib/spectrum/arithmetic.ts";
import { gridOf, gridWavelengths, regularStep, sameWavelengths } from "../../lib/spectrum/grid.ts";
import { linearInterpolator } from "../../lib/spectrum/interpolate-linear.ts";
import { cubicSplineInterpolator } from "../../lib/spectrum/interpolate-spline.ts";
import { spragueInterpolator } from "../../lib/spectrum/interpolate-sprague.ts";
import { normaliseAt, normaliseToPeak, trimSpectrum } from "../../lib/spectrum/normalise.ts";
import { resample, resampleAt } from "../../lib/spectrum/resample.ts";
import { resolveInterpolation, sampler, valueAt } from "../../lib/spectrum/sample.ts";
import { pickSpectrum, spectrumSet } from "../../lib/spectrum/spectrum-set.ts";
import { spectrum, spectrumFromPairs, spectrumOnGrid } from "../../lib/spectrum/spectrum.ts";
import { methodsUsed, resetMethodLog } from "../../lib/methods/method-log.ts";

const valuesArb = (n: number) =>
  fc.array(fc.double({ min: -5, max: 5, noNaN: true }), { minLength: n, maxLength: n });
const increasing = fc
  .array(fc.double({ min: 0.5, max: 20, noNaN: true }), { minLength: 3, maxLength: 30 })
  .map((gaps) => {
    let x = 380;
    return gaps.map((g) => (x += g));
  });

describe("interpolators pass through their samples (property)", () => {
  it("linear", () => {
    fc.assert(
      fc.property(
        increasing,
        fc.infiniteStream(fc.double({ min: -3, max: 3, noNaN: true })),
        (xs, stream) => {
          const ys = xs.map(() => stream.next().value);
          const f = linearInterpolator(xs, ys);
          xs.forEach((x, i) => expect(f(x)).toBeCloseTo(ys[i]!, 12));
        },
      ),
    );
  });
  it("natural cubic spline (uneven data)", () => {
    fc.assert(
      fc.property(
        increasing,
        fc.infiniteStream(fc.double({ min: -3, max: 3, noNaN: true })),
        (xs, stream) => {
          const ys = xs.map(() => stream.next().value);
          const f = cubicSplineInterpolator(xs, ys);
          xs.forEach((x, i) => expect(f(x)).toBeCloseTo(ys[i]!, 9));
        },
      ),
    );
  });
  it("Sprague (CIE 167:2005)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 6, max: 60 }).chain((n) => valuesArb(n)),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (ys, step) => {
          const f = spragueInterpolator(400, step, ys);
          ys.forEach((y, i) => expect(f(400 + i * step)).toBeCloseTo(y, 9));
        },
      ),
    );
  });
});

describe("interpolators reproduce what they should exactly", () => {
  it("Sprague reproduces quartic polynomials away from the ends (its 5-point derivative estimates are exact to degree 4), and all three reproduce straight lines (property)", () => {
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 5, maxLength: 5 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (c, t) => {
          const p = (x: number) => c.reduce((s, ci, k) => s + ci * (x / 10) ** k, 0);
          const ys = Array.from({ length: 12 }, (_, i) => p(i));
          const x = 3 + 4 * t; // intervals whose six neighbours are all real samples
          expect(spragueInterpolator(0, 1, ys)(x)).toBeCloseTo(p(x), 12);
          const line = (u: number) => c[0]! + c[1]! * u;
          const ls = Array.from({ length: 12 }, (_, i) => line(i));
          const xs = ls.map((_, i) => i);
          const u = 11 * t;
          expect(spragueInterpolator(0, 1, ls)(u)).toBeCloseTo(line(u), 9);
          expect(cubicSplineInterpolator(xs, ls)(u)).toBeCloseTo(line(u), 9);
          expect(linearInterpolator(xs, ls)(u)).toBeCloseTo(line(u), 12);
        },
      ),
    );
  });

  it("Sprague and linear agree on smooth data within the linear error bound h²·max|f″|/8, and Sprague has the smaller worst error (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 450, max: 650, noNaN: true }),
        fc.double({ min: 40, max: 120, noNaN: true }),
        fc.double({ min: 0.1, max: 1, noNaN: true }),
        (mu, sigma, amp) => {
          const f = (w: number) => 0.1 + amp * Math.exp(-(((w - mu) / sigma) ** 2) / 2);
          const s = spectrumOnGrid(
            380,
            5,
            Array.from({ length: 81 }, (_, i) => f(380 + 5 * i)),
            { quantity: "reflectance" },
          );
          const sprague = sampler(s, { interpolation: "sprague" });
          const linear = sampler(s, { interpolation: "linear" });
          const bound = (25 * amp) / (sigma * sigma) / 8; // max|f″| ≤ amp/σ² for a Gaussian
          let worstSprague = 0,
            worstLinear = 0;
          for (let w = 392.5; w < 770; w += 5) {
            expect(Math.abs(sprague(w) - linear(w))).toBeLessThanOrEqual(bound + 1e-12);
            worstSprague = Math.max(worstSprague, Math.abs(sprague(w) - f(w)));
            worstLinear = Math.max(worstLinear, Math.abs(linear(w) - f(w)));
          }
          // pointwise, near an inflection both errors vanish and either may be the smaller; over the spectrum Sprague wins
          expect(worstSprague).toBeLessThan(worstLinear);
        },
      ),
      { numRuns: 50 },
    );
  });
});

describe("sampling and resampling", () => {
  const s = spectrumOnGrid(400, 10, [0.1, 0.2, 0.4, 0.5, 0.45, 0.3, 0.2, 0.15], {
    quantity: "reflectance",
    name: "invented sample",
  });

  it("auto interpolation: Sprague for ≥ 6 even samples, spline for uneven, linear for 2 samples", () => {
    expect(resolveInterpolation(s)).toBe("sprague");
    expect(resolveInterpolation(spectrum([400, 410, 430, 460], [1, 2, 3, 4]))).toBe("spline");
    expect(resolveInterpolation(spectrum([400, 500], [1, 2]))).toBe("linear");
    expect(() =>
      resolveInterpolation(spectrum([400, 410, 430, 460, 470, 480], [1, 2, 3, 4, 5, 6]), "sprague"),
    ).toThrow(/evenly spaced/);
  });

  it("extrapolation: hold (CIE 015:2018 §7.2.2) by default, zero, or refuse with the range named", () => {
    expect(valueAt(s, 380)).toBe(0.1);
    expect(valueAt(s, 800)).toBe(0.15);
    expect(valueAt(s, 380, { extrapolation: "zero" })).toBe(0);
    expect(() => valueAt(s, 380, { extrapolation: "refuse" })).toThrow(/400–470 nm; 380 nm is outside/);
    resetMethodLog();
    valueAt(s, 800);
    expect(
      methodsUsed()
        .map((n) => n.statement)
        .join(" "),
    ).toMatch(/nearest measured value/);
  });

  it("resampling onto a finer grid and back gives the samples again; resampling onto the same grid is the identity", () => {
    const fine = resample(s, { start: 400, end: 470, step: 1 });
    expect(fine.wavelengths).toHaveLength(71);
    const back = resample(fine, { start: 400, end: 470, step: 10 });
    back.values.forEach((v, i) => expect(v).toBeCloseTo(s.values[i]!, 12));
    expect(resample(s, gridOf(s)!).values).toEqual(s.values);
    expect(resampleAt(s, [405, 415]).wavelengths).toEqual([405, 415]);
  });

  it("grids: checked, and the regular step is found", () => {
    expect(gridWavelengths({ start: 380, end: 780, step: 5 })).toHaveLength(81);
    expect(regularStep(s)).toBe(10);
    expect(regularStep(spectrum([1, 2, 4], [0, 0, 0]))).toBeUndefined();
    expect(() => gridWavelengths({ start: 380, end: 781, step: 5 })).toThrow(/whole number/);
    expect(() => gridWavelengths({ start: 780, end: 380, step: 5 })).toThrow(/not valid/);
    expect(() => gridWavelengths({ start: 380, end: 780, step: 0 })).toThrow(/not valid/);
  });
});

describe("arithmetic, normalisation, sets", () => {
  const a = spectrumOnGrid(400, 10, [1, 2, 3, 4, 5, 6], { name: "a", quantity: "relative power" });
  const b = spectrumOnGrid(400, 10, [2, 2, 2, 2, 2, 2], { name: "b", quantity: "transmittance" });

  it("product, sum, ratio, scale sample by sample; product × ratio gives back the spectrum (property)", () => {
    expect(multiplySpectra(a, b).values).toEqual([2, 4, 6, 8, 10, 12]);
    expect(addSpectra(a, b).values).toEqual([3, 4, 5, 6, 7, 8]);
    expect(divideSpectra(a, b).values).toEqual([0.5, 1, 1.5, 2, 2.5, 3]);
    expect(scaleSpectrum(a, 3).values).toEqual([3, 6, 9, 12, 15, 18]);
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: 0.1, max: 10, noNaN: true }), { minLength: 6, maxLength: 6 }),
        (vals) => {
          const c = spectrumOnGrid(400, 10, vals);
          divideSpectra(multiplySpectra(a, c), c).values.forEach((v, i) =>
            expect(v).toBeCloseTo(a.values[i]!, 12),
          );
        },
      ),
    );
  });

  it("spectra on different grids are never combined silently: an error until they are aligned", () => {
    const c = spectrumOnGrid(405, 5, [1, 1, 1, 1, 1, 1, 1, 1], { name: "c" });
    expect(() => multiplySpectra(a, c)).toThrow(/different wavelengths.*alignSpectra/);
    expect(overlapGrid(a, c)).toEqual({ start: 405, end: 440, step: 5 });
    const [a2, c2] = alignSpectra(a, c);
    expect(sameWavelengths(a2, c2)).toBe(true);
    expect(multiplySpectra(a2, c2).wavelengths[0]).toBe(405);
    expect(() => alignSpectra(a, spectrumOnGrid(600, 10, [1, 2, 3]))).toThrow(/share no wavelengths/);
  });

  it("normalisation to the peak, at a wavelength, trimming", () => {
    expect(Math.max(...normaliseToPeak(a).values)).toBe(1);
    expect(valueAt(normaliseAt(a, 420), 420)).toBeCloseTo(100, 12);
    expect(trimSpectrum(a, 410, 430).wavelengths).toEqual([410, 420, 430]);
    expect(() => normaliseToPeak(spectrumOnGrid(400, 10, [0, 0, 0]))).toThrow(/no positive value/);
    expect(() => normaliseAt(spectrumOnGrid(400, 10, [0, 0, 0, 0]), 410)).toThrow(/zero at 410 nm/);
    expect(() => trimSpectrum(a, 600, 700)).toThrow(/no samples in 600–700 nm/);
    expect(() => scaleSpectrum(a, NaN)).toThrow(/NaN/);
    expect(() => divideSpectra(a, spectrumOnGrid(400, 10, [1, 0, 1, 1, 1, 1], { name: "z" }))).toThrow(
      /"z" is zero at 410 nm/,
    );
  });

  it("a set of spectra works like an array, and picking an unknown name lists the names", () => {
    const set = spectrumSet(
      [400, 500, 600],
      { patch1: [0.1, 0.2, 0.3], patch2: [0.3, 0.2, 0.1] },
      { quantity: "reflectance" },
    );
    expect(set).toHaveLength(2);
    expect(set.map((s) => s.name)).toEqual(["patch1", "patch2"]);
    expect(pickSpectrum(set, "patch2").values).toEqual([0.3, 0.2, 0.1]);
    expect(() => pickSpectrum(set, "patch3")).toThrow(
      /pickSpectrum: name should be the name of a spectrum in the set: one of "patch1", "patch2", but got a string \("patch3"\)/,
    );
  });
});

describe("bad input gives a clear error naming the value, never a silent NaN", () => {
  it.each([
    [
      "NaN value",
      () => spectrum([400, 410], [1, NaN]),
      /spectrum: values\[1\] should be a finite number, but got NaN/,
    ],
    ["infinite value", () => spectrum([400, 410], [Infinity, 1]), /Infinity/],
    [
      "NaN wavelength",
      () => spectrum([400, NaN], [1, 1]),
      /spectrum: wavelengths\[1\] should be a finite number, but got NaN/,
    ],
    ["infinite wavelength", () => spectrum([400, Infinity], [1, 1]), /Infinity/],
    ["negative wavelength", () => spectrum([-400, 410], [1, 1]), /-400 nm/],
    ["zero wavelength", () => spectrum([0, 410], [1, 1]), /0 nm/],
    [
      "non-monotonic wavelengths",
      () => spectrum([400, 420, 410], [1, 1, 1]),
      /410 nm\) does not increase after 420 nm/,
    ],
    ["duplicate wavelengths", () => spectrum([400, 400], [1, 1]), /does not increase/],
    [
      "empty spectrum",
      () => spectrum([], []),
      /spectrum: wavelengths should be an array of at least 1 finite numbers \(nm\), but got an empty array/,
    ],
    [
      "mismatched lengths",
      () => spectrum([400, 410], [1]),
      /spectrum: values should be an array of 2 finite numbers \(one per wavelength\), but got an array of 1 number/,
    ],
    [
      "bad grid step",
      () => spectrumOnGrid(400, -5, [1, 2]),
      /spectrumOnGrid: step should be a finite number in nm greater than 0, but got -5 nm/,
    ],
    [
      "pairs with NaN",
      () =>
        spectrumFromPairs([
          [400, 1],
          [410, NaN],
        ]),
      /NaN/,
    ],
    [
      "reading at NaN nm",
      () => valueAt(spectrumOnGrid(400, 10, [1, 2, 3]), NaN),
      /valueAt: wavelength should be a finite number in nm, but got NaN/,
    ],
  ])("%s", (_what, make, message) => {
    expect(make).toThrow(message);
  });
});

describe("spectrum → XYZ against spectral-color's spdToXyz", () => {
  it("a 5 nm reflectance under D65 (2°): X, Y, Z agree to 1e-4 on the Y = 100 scale", () => {
    const wl = Array.from({ length: 95 }, (_, i) => 360 + 5 * i);
    for (const f of [
      (w: number) => 0.3 + 0.25 * Math.sin(w / 40),
      (w: number) => 0.05 + 0.9 / (1 + Math.exp(-(w - 580) / 15)),
    ]) {
      const r = wl.map(f);
      // spectral-color takes the stimulus (reflectance × D65) and normalises by Σ D65·ȳ; its D65 ends at 780 nm
      const theirs = spdToXyz(
        new SpectralDistribution({ shape: new Shape(360, 830, 5), samples: r }).multiply(illuminants.D65),
      ).map((v) => v * 100);
      const ours = tristimulus(spectrumOnGrid(360, 5, r, { quantity: "reflectance" }), {
        illuminant: "D65",
        interval: 5,
      });
      expect(Math.abs(ours.X - theirs[0]!)).toBeLessThan(1e-4);
      expect(Math.abs(ours.Y - theirs[1]!)).toBeLessThan(1e-4);
      expect(Math.abs(ours.Z - theirs[2]!)).toBeLessThan(1e-4);
    }
  });

  it("a 10 nm reflectance (both libraries interpolate it by Sprague to 5 nm): agreement to 1e-4", () => {
    const wl = Array.from({ length: 48 }, (_, i) => 360 + 10 * i);
    const r = wl.map((w) => 0.2 + 0.3 * Math.exp(-(((w - 520) / 60) ** 2)));
    // resample the reflectance (not the stimulus) to 5 nm first, as we do, then multiply by D65
    const r5 = new SpectralDistribution({ shape: new Shape(360, 830, 10), samples: r }).resample(
      new Shape(360, 830, 5),
    );
    const theirs = spdToXyz(r5.multiply(illuminants.D65)).map((v) => v * 100);
    const ours = tristimulus(spectrumOnGrid(360, 10, r, { quantity: "reflectance" }), {
      illuminant: "D65",
      interval: 5,
    });
    expect(Math.abs(ours.X - theirs[0]!)).toBeLessThan(1e-4);
    expect(Math.abs(ours.Y - theirs[1]!)).toBeLessThan(1e-4);
    expect(Math.abs(ours.Z - theirs[2]!)).toBeLessThan(1e-4);
  });
});
