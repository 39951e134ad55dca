/**
 * Colour-vision deficiency simulation: Machado, Oliveira & Fernandes 2009 matrices, Brettel, Viénot & Mollon 1997
 * half-planes, Viénot, Brettel & Mollon 1999 single plane. Sources at each check; recalled values say so.
 */
import { describe, expect, it } from "vitest";
import * as t from "../../../lib/index.ts";
import { MACHADO_2009_MATRICES } from "../../../lib/data/machado-2009-cvd.ts";

const DEF = ["protan", "deutan", "tritan"] as const;

describe("Machado et al. 2009 matrices", () => {
  it("every tabulated row sums to 1 within the printed precision (the model keeps white white, Machado et al. 2009 §4)", () => {
    for (const d of DEF)
      for (const m of MACHADO_2009_MATRICES[d])
        for (const row of m) expect(Math.abs(row[0] + row[1] + row[2] - 1)).toBeLessThan(2e-6);
  });
  it("deficiencyMatrix gives the printed matrices at the tabulated severities, to 6 decimals (values recalled from memory of the paper's supplementary table)", () => {
    // Deuteranomaly 0.6, deuteranopia, protanopia and tritanopia (Machado et al. 2009, supplementary table; recalled).
    const cases: Array<[t.Deficiency, number, number[][]]> = [
      [
        "deutan",
        0.6,
        [
          [0.498864, 0.674741, -0.173604],
          [0.205199, 0.754872, 0.039929],
          [-0.011131, 0.030969, 0.980162],
        ],
      ],
      [
        "deutan",
        1,
        [
          [0.367322, 0.860646, -0.227968],
          [0.280085, 0.672501, 0.047413],
          [-0.01182, 0.04294, 0.968881],
        ],
      ],
      [
        "protan",
        1,
        [
          [0.152286, 1.052583, -0.204868],
          [0.114503, 0.786281, 0.099216],
          [-0.003882, -0.048116, 1.051998],
        ],
      ],
      [
        "tritan",
        1,
        [
          [1.255528, -0.076749, -0.178779],
          [-0.078411, 0.930809, 0.147602],
          [0.004733, 0.691367, 0.3039],
        ],
      ],
    ];
    for (const [d, s, want] of cases) {
      const m = t.deficiencyMatrix(d, { severity: s });
      for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) expect(m[r]![c]!).toBeCloseTo(want[r]![c]!, 6);
    }
  });
  it("severity 0 is the identity and a severity between the tabulated ones is their linear interpolation (as the authors advise)", () => {
    const id = t.deficiencyMatrix("protan", { severity: 0 });
    expect(id).toEqual([
      [1, 0, 0],
      [0, 1, 0],
      [0, 0, 1],
    ]);
    const a = t.deficiencyMatrix("deutan", { severity: 0.6 });
    const b = t.deficiencyMatrix("deutan", { severity: 0.7 });
    const mid = t.deficiencyMatrix("deutan", { severity: 0.65 });
    expect(mid[0]![1]!).toBeCloseTo((a[0]![1]! + b[0]![1]!) / 2, 12);
  });
  it("white stays white and grey stays grey in sRGB", () => {
    for (const d of DEF) {
      const w = t.simulateDeficiencyRgb({ r: 0.5, g: 0.5, b: 0.5 }, d, { severity: 0.6 });
      expect(w.r).toBeCloseTo(0.5, 5);
      expect(w.g).toBeCloseTo(0.5, 5);
      expect(w.b).toBeCloseTo(0.5, 5);
    }
  });
});

describe("Brettel 1997 and Viénot 1999 dichromat projections", () => {
  const lmsMatrices = () => {
    const srgb = t.rgbSpace("sRGB");
    const rgbToLms = t.multiplyMatrix3(t.xyzToLmsMatrix(), srgb.toXYZ);
    return { rgbToLms, lmsToRgb: t.invertMatrix3(rgbToLms) };
  };
  const samples: t.Rgb[] = [
    { r: 0.8, g: 0.3, b: 0.2 },
    { r: 0.3, g: 0.6, b: 0.3 },
    { r: 0.4, g: 0.4, b: 0.7 },
    { r: 0.7, g: 0.6, b: 0.2 },
  ];
  const toLin = (c: t.Rgb): t.Vector3 => {
    const tf = t.transferFunction("sRGB");
    return [tf.decode(c.r), tf.decode(c.g), tf.decode(c.b)];
  };
  const simLin = (lin: t.Vector3, d: t.Deficiency, method: t.DeficiencyMethod): t.Vector3 => {
    const xyz = t.applyMatrix3(t.rgbSpace("sRGB").toXYZ, lin);
    const s = t.simulateDeficiencyXYZ({ X: xyz[0] * 100, Y: xyz[1] * 100, Z: xyz[2] * 100 }, d, { method });
    return t.applyMatrix3(t.rgbSpace("sRGB").fromXYZ, [s.X / 100, s.Y / 100, s.Z / 100]);
  };
  for (const method of ["Brettel 1997", "Viénot 1999"] as const)
    for (const d of DEF) {
      const k = d === "protan" ? 0 : d === "deutan" ? 1 : 2;
      it(`${method}, ${d}: colours on one confusion line (differing only in the missing cone) are simulated alike, and the simulation is idempotent (Brettel et al. 1997 §2)`, () => {
        const { rgbToLms, lmsToRgb } = lmsMatrices();
        for (const c of samples) {
          const lin = toLin(c);
          const q = t.applyMatrix3(rgbToLms, lin);
          const q2 = [...q] as [number, number, number];
          q2[k] *= 1.08;
          const other = t.applyMatrix3(lmsToRgb, q2);
          const a = simLin(lin, d, method);
          const b = simLin(other, d, method);
          for (let i = 0; i < 3; i++) expect(a[i]!).toBeCloseTo(b[i]!, 9);
          const again = simLin(a, d, method);
          for (let i = 0; i < 3; i++) expect(again[i]!).toBeCloseTo(a[i]!, 9);
          // The kept cones are untouched.
          const qa = t.applyMatrix3(rgbToLms, a);
          for (let i = 0; i < 3; i++) if (i !== k) expect(qa[i]!).toBeCloseTo(q[i]!, 9);
        }
      });
    }
  it("Viénot 1999: the display's blue and yellow are seen unchanged by protan and deutan dichromats (the plane is chosen through them, Viénot et al. 1999 §2)", () => {
    for (const d of ["protan", "deutan"] as const)
      for (const c of [
        { r: 0, g: 0, b: 1 },
        { r: 1, g: 1, b: 0 },
      ]) {
        const s = t.simulateDeficiencyRgb(c, d, { method: "Viénot 1999" });
        expect(s.r).toBeCloseTo(c.r, 6);
        expect(s.g).toBeCloseTo(c.g, 6);
        expect(s.b).toBeCloseTo(c.b, 6);
      }
  });
  it("Brettel 1997 refuses a severity below 1, and has no single matrix", () => {
    expect(() =>
      t.simulateDeficiencyRgb({ r: 1, g: 0, b: 0 }, "deutan", { method: "Brettel 1997", severity: 0.5 }),
    ).toThrow(/Machado 2009/);
    expect(() => t.deficiencyMatrix("deutan", { method: "Brettel 1997" })).toThrow(/no single matrix/);
  });
  it("Machado's deuteranopia of a reddish colour is near Brettel's (ΔE00 between the two simulations < 6; the paper reports similar dichromat results, the bound is ours)", () => {
    const red = { r: 0.75, g: 0.35, b: 0.2 };
    const lab = (c: t.Rgb) => t.labFromXYZ(t.xyzFromRgb(c, t.rgbSpace("sRGB")), t.whitePoint());
    const a = t.simulateDeficiencyRgb(red, "deutan", { method: "Brettel 1997" });
    const b = t.simulateDeficiencyRgb(red, "deutan", { method: "Machado 2009" });
    expect(t.deltaE2000(lab(a), lab(b))).toBeLessThan(6);
  });
});

describe("spectra, XYZ and swatch sets", () => {
  it("a spectrum's simulated XYZ equals the simulation of its XYZ", () => {
    const refl = t.spectrumOnGrid(
      380,
      5,
      Array.from({ length: 81 }, (_, i) => 0.1 + 0.7 / (1 + Math.exp(-(i - 40) / 4))),
      { quantity: "reflectance", name: "invented orange" },
    );
    const a = t.simulateDeficiencySpectrum(refl, "protan", { severity: 0.6 });
    const b = t.simulateDeficiencyXYZ(t.tristimulus(refl, { illuminant: "D65" }), "protan", {
      severity: 0.6,
    });
    expect(a.X).toBeCloseTo(b.X, 10);
    expect(a.Z).toBeCloseTo(b.Z, 10);
  });
  it("swatches 'as seen with deuteranomaly, severity 0.6' carry that note and differ from the originals", () => {
    const sw = t.deficiencySwatches(
      [
        { label: "invented red", colour: { hex: "#c03030" } },
        { label: "invented green", colour: { hex: "#30a040" } },
      ],
      "deutan",
      { severity: 0.6 },
    );
    expect(sw[0]!.note).toContain("deuteranomaly, severity 0.6");
    expect(sw[0]!.hex).not.toBe("#c03030");
  });
});
