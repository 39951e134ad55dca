/**
 * ASTM E2022 weighting factors at 10 and 20 nm and the ASTM E308 bandpass correction. References: the CIE 1 nm
 * tables in /work/shared/reference (illuminants D65 and A, CIE 1931 and 1964 observers), summed here independently of
 * the library; the ASTM E308 perfect-diffuser white points as listed in that folder's README (a secondary copy of
 * E308's white points, XYZ to 3 decimals); and a simulated triangular-bandpass instrument for the correction.
 * Stated tolerances: weight sums reproduce the 1 nm white within 1e-4 (Y = 100 within 1e-9); smooth spectra at 10 nm agree with 1 nm
 * summation within 0.005 in X, Y, Z (0.06 at 20 nm), tolerances of our own choosing, a few times the largest differences found.
 */
import { describe, expect, it } from "vitest";
import {
  astmWeightingFactors,
  bandpassCorrection,
  methodsUsed,
  objectColour,
  resetMethodLog,
  spectrumOnGrid,
  tristimulus,
} from "../../lib/index.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "./reference-data.ts";

const suite = HAVE_REFERENCE ? describe : describe.skip;
if (!HAVE_REFERENCE) console.warn(NO_REFERENCE);

type Cmf = { x: number[]; y: number[]; z: number[] };
function cie(observer: "2°" | "10°"): Cmf {
  const t = readReferenceCsv(observer === "2°" ? "cie_1931_2deg_xyz_1nm.csv" : "cie_1964_10deg_xyz_1nm.csv");
  const s = observer === "2°" ? "" : "_10";
  const z = (v: number[]) => v.map((x) => (Number.isNaN(x) ? 0 : x)); // blank cells are 0 (CIE table notes)
  return { x: z(t.column(`x_bar${s}`)), y: z(t.column(`y_bar${s}`)), z: z(t.column(`z_bar${s}`)) };
}
function illuminant1nm(name: "D65" | "A"): number[] {
  const t = readReferenceCsv(name === "D65" ? "cie_std_illum_d65_1nm.csv" : "cie_std_illum_a_1nm.csv");
  const wl = t.column("wavelength_nm"),
    v = t.column(name);
  return Array.from({ length: 471 }, (_, i) => v[wl.indexOf(360 + i)]!);
}
/** X, Y, Z of a reflectance function by plain 1 nm sums over 360–830 nm (the reference computation). */
function sum1nm(S: number[], c: Cmf, R: (l: number) => number) {
  let X = 0,
    Y = 0,
    Z = 0,
    N = 0;
  for (let i = 0; i < 471; i++) {
    const r = R(360 + i);
    X += S[i]! * c.x[i]! * r;
    Y += S[i]! * c.y[i]! * r;
    Z += S[i]! * c.z[i]! * r;
    N += S[i]! * c.y[i]!;
  }
  return { X: (100 * X) / N, Y: (100 * Y) / N, Z: (100 * Z) / N };
}
const on = (step: number, first: number, last: number, R: (l: number) => number) =>
  spectrumOnGrid(
    first,
    step,
    Array.from({ length: (last - first) / step + 1 }, (_, i) => R(first + step * i)),
    { quantity: "reflectance" },
  );

suite("ASTM E2022 weights reproduce the 1 nm white point", () => {
  for (const ill of ["D65", "A"] as const)
    for (const observer of ["2°", "10°"] as const)
      for (const interval of [10, 20] as const)
        for (const bandpass of ["none", "included"] as const)
          it(`${ill} ${observer}, ${interval} nm, bandpass ${bandpass}: Σ W = white of the 1 nm CIE tables within 1e-4`, () => {
            const ref = sum1nm(illuminant1nm(ill), cie(observer), () => 1);
            const w = astmWeightingFactors({
              interval,
              illuminant: ill,
              observer,
              bandpass,
              range: [380, 780],
            });
            expect(Math.abs(w.white.X - ref.X)).toBeLessThan(1e-4);
            expect(Math.abs(w.white.Y - 100)).toBeLessThan(1e-9);
            expect(Math.abs(w.white.Z - ref.Z)).toBeLessThan(1e-4);
          });

  it("and the ASTM E308 white points (README of the reference folder, secondary copy): D65 2° 95.047/108.883, A 10° 111.144/35.200", () => {
    const d65 = astmWeightingFactors({ interval: 10, illuminant: "D65" }).white;
    expect(d65.X).toBeCloseTo(95.047, 3);
    expect(d65.Z).toBeCloseTo(108.883, 3);
    const a10 = astmWeightingFactors({
      interval: 20,
      illuminant: "A",
      observer: "10°",
      range: [380, 780],
    }).white;
    expect(a10.X).toBeCloseTo(111.144, 3);
    expect(a10.Z).toBeCloseTo(35.2, 3);
  });
});

suite("smooth spectra: 10/20 nm weighted sums against 1 nm summation", () => {
  const smooth: [string, (l: number) => number][] = [
    ["orange edge", (l) => 0.05 + 0.8 / (1 + Math.exp(-(l - 580) / 20))],
    ["green band", (l) => 0.1 + 0.5 * Math.exp(-(((l - 530) / 50) ** 2))],
    ["blue slope", (l) => 0.7 - 0.6 / (1 + Math.exp(-(l - 480) / 30))],
  ];
  const S = illuminant1nm("D65"),
    c = cie("2°");
  for (const [name, R] of smooth)
    it(`${name}: 10 nm within 0.005, 20 nm within 0.06`, () => {
      const ref = sum1nm(S, c, R);
      const t10 = tristimulus(on(10, 380, 780, R));
      const t20 = tristimulus(on(20, 380, 780, R));
      for (const k of ["X", "Y", "Z"] as const) {
        expect(Math.abs(t10[k] - ref[k]), `10 nm ${k}`).toBeLessThan(0.005);
        expect(Math.abs(t20[k] - ref[k]), `20 nm ${k}`).toBeLessThan(0.06);
      }
    });
});

suite("bandpass: ASTM E308 Stearns–Stearns correction", () => {
  it("corrects a known short series by the formula (α = 0.083, recalled from memory)", () => {
    const r = bandpassCorrection(
      spectrumOnGrid(400, 10, [0.2, 0.4, 0.5], { quantity: "reflectance" }),
    ).values;
    expect(r[0]).toBeCloseTo(1.083 * 0.2 - 0.083 * 0.4, 12);
    expect(r[1]).toBeCloseTo(-0.083 * 0.2 + 1.166 * 0.4 - 0.083 * 0.5, 12);
    expect(r[2]).toBeCloseTo(1.083 * 0.5 - 0.083 * 0.4, 12);
  });

  it("a triangular-bandpass instrument (FWHM = interval): corrected data, or weights with the correction, come closer to the 1 nm truth", () => {
    const R = (l: number) => 0.1 + 0.7 * Math.exp(-(((l - 560) / 25) ** 2));
    // The instrument: each reading is R convolved with a triangle of FWHM 10 nm (0.01 nm steps).
    const measure = (l0: number) => {
      let acc = 0,
        norm = 0;
      for (let d = -10; d <= 10; d += 0.01) {
        const w = 1 - Math.abs(d) / 10;
        acc += w * R(l0 + d);
        norm += w;
      }
      return acc / norm;
    };
    const measured = on(10, 380, 780, measure);
    const ref = sum1nm(illuminant1nm("D65"), cie("2°"), R);
    const raw = tristimulus(measured);
    const corrected = tristimulus(bandpassCorrection(measured));
    const inWeights = tristimulus(measured, { bandpass: "included" });
    expect(Math.abs(inWeights.Y - corrected.Y)).toBeLessThan(1e-9); // Σ W′R = Σ W (C R)
    expect(Math.abs(corrected.Y - ref.Y)).toBeLessThan(Math.abs(raw.Y - ref.Y) / 3);
    expect(Math.abs(corrected.X - ref.X)).toBeLessThan(Math.abs(raw.X - ref.X) / 3);
  });
});

describe("tristimulus() chooses the weights for 10/20 nm data and says so", () => {
  const R = (l: number) => 0.3 + 0.002 * (l - 380);
  it("a 10 nm sample is summed with E2022 weights (stated in Methods, with the override); interval 5 overrides", () => {
    resetMethodLog();
    const c = objectColour(on(10, 400, 700, R));
    expect(c.interval).toBe(10);
    expect(c.range).toEqual([400, 700]);
    const text = methodsUsed()
      .map((m) => m.statement)
      .join("\n");
    expect(text).toMatch(/method of ASTM E2022/);
    expect(text).toMatch(/chosen because the samples were tabulated every 10 nm/);
    expect(objectColour(on(10, 400, 700, R), { interval: 5 }).interval).toBe(5);
  });
  it("5 nm and 1 nm samples are summed as before", () => {
    expect(objectColour(on(5, 380, 780, R)).interval).toBe(5);
    expect(objectColour(on(1, 360, 830, R), { illuminant: "D65" }).interval).toBe(1);
  });
  it("bandpass 'included' is refused for 1 and 5 nm summation", () => {
    expect(() => tristimulus(on(5, 380, 780, R), { bandpass: "included" })).toThrow(/10 and 20 nm/);
  });
});
