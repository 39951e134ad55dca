/**
 * The camera model: camera RGB, colour correction (3 × 3 and root-polynomial), the Luther–Ives measure and metamer
 * pairs. Sources at each check.
 */
import { describe, expect, it } from "vitest";
import * as t from "../../../lib/index.ts";

const grid = { start: 380, end: 780, step: 5 };
const wl = t.gridWavelengths(grid);

/** Sensitivities that are an exact linear transform of the CIE 1931 colour-matching functions (a Luther–Ives camera). */
function lutherCamera(A: number[][]): t.CameraSensor {
  const obs = t.observerByName("2°");
  const ch = (row: number[]) =>
    t.spectrum(
      wl,
      wl.map((w) => {
        const c = t.colourMatchingAt(obs, w);
        return row[0]! * c[0] + row[1]! * c[1] + row[2]! * c[2];
      }),
      { quantity: "other", name: "channel" },
    );
  return t.cameraSensor(ch(A[0]!), ch(A[1]!), ch(A[2]!), { name: "CMF-transform camera (constructed)" });
}

/** 24 smooth invented reflectances (logistic edges and bumps), within 0.05–0.95. */
function chart(): t.Spectrum[] {
  const out: t.Spectrum[] = [];
  for (let i = 0; i < 24; i++) {
    const c = 420 + 13 * i;
    const vals = wl.map((w) => {
      const edge = 1 / (1 + Math.exp(-(w - c) / (12 + (i % 5) * 6)));
      const bump = Math.exp(-0.5 * ((w - (700 - 11 * i)) / 30) ** 2);
      const v = i % 2 ? 0.1 + 0.6 * edge + 0.2 * bump : 0.8 - 0.6 * edge + 0.1 * bump;
      return Math.min(0.95, Math.max(0.05, v));
    });
    out.push(t.spectrum(wl, vals, { quantity: "reflectance", name: `patch ${i + 1} (invented)` }));
  }
  return out;
}

/** XYZ by direct summation on the same 5 nm grid (CIE 015:2018 eq. 7.1 with k = 100/Σ S ȳ), independent of the library's tables. */
function directXYZ(r: t.Spectrum): t.Tristimulus {
  const obs = t.observerByName("2°");
  const d65 = t.illuminant("D65");
  let X = 0,
    Y = 0,
    Z = 0,
    k = 0;
  wl.forEach((w, i) => {
    const e = t.valueAt(d65, w);
    const c = t.colourMatchingAt(obs, w);
    X += r.values[i]! * e * c[0];
    Y += r.values[i]! * e * c[1];
    Z += r.values[i]! * e * c[2];
    k += e * c[1];
  });
  return { X: (100 * X) / k, Y: (100 * Y) / k, Z: (100 * Z) / k };
}

describe("Luther–Ives", () => {
  const A = [
    [0.9, 0.3, -0.05],
    [-0.2, 1.1, 0.05],
    [0.02, -0.1, 1.2],
  ];
  it("a sensor that is an exact linear transform of the colour-matching functions meets the Luther–Ives condition: ν = 1 and no residual (Vora & Trussell 1993)", () => {
    const m = t.lutherIvesMeasure(lutherCamera(A));
    expect(m.qualityFactor).toBeCloseTo(1, 12);
    expect(m.relativeResidual).toBeLessThan(1e-10);
    expect(m.meetsLutherIves).toBe(true);
    // The fitted matrix is the inverse of A.
    const inv = t.invertMatrix3(A as unknown as t.Matrix3);
    for (let r = 0; r < 3; r++)
      for (let c = 0; c < 3; c++) expect(m.matrix[r]![c]!).toBeCloseTo(inv[r]![c]!, 9);
  });
  it("…and its 3 × 3 correction fitted on a chart reproduces every patch's XYZ with zero error", () => {
    const cam = lutherCamera(A);
    const patches = chart();
    const rgb = patches.map((p) => t.cameraRgb(p, cam, { illuminant: "D65" }));
    const xyz = patches.map(directXYZ);
    const ccm = t.fitColourCorrection(rgb, xyz);
    expect(ccm.rmsResidual).toBeLessThan(1e-9);
    const test = t.spectrum(
      wl,
      wl.map((w) => 0.3 + 0.2 * Math.sin(w / 40)),
      { quantity: "reflectance", name: "held-out patch (invented)" },
    );
    const got = t.applyColourCorrection(ccm, t.cameraRgb(test, cam));
    const want = directXYZ(test);
    expect(got.X).toBeCloseTo(want.X, 8);
    expect(got.Y).toBeCloseTo(want.Y, 8);
    expect(got.Z).toBeCloseTo(want.Z, 8);
  });
  it("the invented Gaussian sensor falls short of Luther–Ives (ν < 1) and its correction leaves errors", () => {
    const cam = t.inventedCameraSensor();
    expect(cam.invented).toBe(true);
    expect(cam.name).toContain("invented");
    const m = t.lutherIvesMeasure(cam);
    expect(m.qualityFactor).toBeLessThan(0.999);
    expect(m.qualityFactor).toBeGreaterThan(0.5);
    expect(m.meetsLutherIves).toBe(false);
    const patches = chart();
    const ccm = t.fitColourCorrection(
      patches.map((p) => t.cameraRgb(p, cam)),
      patches.map(directXYZ),
    );
    expect(ccm.rmsResidual).toBeGreaterThan(1e-3);
  });
  it("a sensor with three equal channels cannot be fitted, and says so", () => {
    const obs = t.observerByName("2°");
    const x = wl.map((w) => t.colourMatchingAt(obs, w)[1]);
    // Three channels all equal to ȳ: the span is one-dimensional and lies inside the CMFs' span.
    const y = t.spectrum(wl, x, { quantity: "other", name: "ȳ" });
    // Rank-deficient sensors cannot be fitted; the quality factor is still defined.
    expect(() => t.lutherIvesMeasure(t.cameraSensor(y, y, y))).toThrow(/linearly dependent/);
  });
});

describe("root-polynomial colour correction (Finlayson, Mackiewicz & Hurlbert 2015)", () => {
  it("has 6 terms at degree 2 and 13 at degree 3 (the paper's Table 1) and fits a chart at least as well as the 3 × 3 matrix", () => {
    const cam = t.inventedCameraSensor();
    const patches = chart();
    const rgb = patches.map((p) => t.cameraRgb(p, cam));
    const xyz = patches.map(directXYZ);
    const lin = t.fitColourCorrection(rgb, xyz);
    const rp2 = t.fitColourCorrection(rgb, xyz, { model: "root-polynomial", degree: 2 });
    const rp3 = t.fitColourCorrection(rgb, xyz, { model: "root-polynomial", degree: 3 });
    expect(rp2.terms.length).toBe(6);
    expect(rp3.terms.length).toBe(13);
    expect(rp2.rmsResidual).toBeLessThanOrEqual(lin.rmsResidual + 1e-12);
    expect(rp3.rmsResidual).toBeLessThanOrEqual(rp2.rmsResidual + 1e-12);
  });
  it("is exposure invariant: doubling the RGB doubles the XYZ (Finlayson et al. 2015 §3), which an ordinary polynomial is not", () => {
    const cam = t.inventedCameraSensor();
    const patches = chart();
    const rp = t.fitColourCorrection(
      patches.map((p) => t.cameraRgb(p, cam)),
      patches.map(directXYZ),
      { model: "root-polynomial", degree: 3 },
    );
    const c = { r: 0.31, g: 0.42, b: 0.27 };
    const a = t.applyColourCorrection(rp, c);
    const b = t.applyColourCorrection(rp, { r: 2 * c.r, g: 2 * c.g, b: 2 * c.b });
    expect(b.X).toBeCloseTo(2 * a.X, 10);
    expect(b.Z).toBeCloseTo(2 * a.Z, 10);
  });
});

describe("metamer pairs", () => {
  const base = t.spectrum(
    wl,
    wl.map((w) => 0.45 + 0.1 * Math.sin(w / 50)),
    { quantity: "reflectance", name: "grey-ish (invented)" },
  );
  it("a pair the eye matches (ΔE00 < 0.01) but the invented camera does not", () => {
    const p = t.metamerPair(base, t.inventedCameraSensor());
    expect(p.eyeDeltaE00).toBeLessThan(0.01);
    expect(p.cameraDifference).toBeGreaterThan(0.01);
    for (const s of [p.a, p.b]) for (const v of s.values) expect(v >= 0 && v <= 1).toBe(true);
  });
  it("and the reverse: a pair the camera matches but the eye does not", () => {
    const p = t.metamerPair(base, t.inventedCameraSensor(), { matchFor: "camera" });
    expect(p.cameraDifference).toBeLessThan(1e-6);
    expect(p.eyeDeltaE00).toBeGreaterThan(1);
  });
  it("a Luther–Ives camera has no pair of the first kind: what the eye matches, it matches too", () => {
    const identity = [
      [1, 0, 0],
      [0, 1, 0],
      [0, 0, 1],
    ];
    expect(() => t.metamerPair(base, lutherCamera(identity))).toThrow(/no such pair/);
  });
});
