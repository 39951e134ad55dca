/**
 * Colour temperature: CCT and Duv (Ohno 2014, Robertson 1968), the Planckian locus and its inverse, checked against
 * CIE 015, Robertson's published isotemperature table and the definition of CCT as the nearest locus point.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { chromaticityXy, uv1960FromXy } from "../../lib/colorimetry/chromaticity.ts";
import { lightTristimulus } from "../../lib/colorimetry/tristimulus.ts";
import { illuminantA } from "../../lib/illuminants/illuminant-a.ts";
import { illuminant } from "../../lib/illuminants/standard-illuminant.ts";
import { planckianSpectrum } from "../../lib/illuminants/planckian-radiator.ts";
import { methodsUsed, resetMethodLog } from "../../lib/methods/method-log.ts";
import { spectrum } from "../../lib/spectrum/spectrum.ts";
import { cctAndDuv, cctFromSpectrum, chromaticityAtCct } from "../../lib/temperature/cct.ts";
import { robertsonLines } from "../../lib/temperature/cct-robertson.ts";
import { tabulatedLocusUv } from "../../lib/temperature/cct-ohno.ts";
import {
  planckianChromaticity,
  planckianLocusAtReciprocal,
  planckianUv,
} from "../../lib/temperature/planckian-locus.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "./reference-data.ts";

/** CCT by the definition of CIE 015:2018 §9.5: the temperature of the nearest locus point in CIE 1960 uv (golden-section search). */
function cctByDefinition(xy: { x: number; y: number }): number {
  const { u, v } = uv1960FromXy(xy);
  const dist = (s: number) => {
    const p = planckianLocusAtReciprocal(s);
    return Math.hypot(u - p.u, v - p.v);
  };
  let best = 0,
    bestD = Infinity;
  for (let i = 1; i <= 4000; i++) {
    const s = i * 2.5e-7; // 1/T from 2.5e-7 to 1e-3 K⁻¹
    const d = dist(s);
    if (d < bestD) [best, bestD] = [s, d];
  }
  let a = best - 2.5e-7,
    b = best + 2.5e-7;
  for (let k = 0; k < 80; k++) {
    const m1 = a + (b - a) * 0.381966,
      m2 = a + (b - a) * 0.618034;
    if (dist(m1) < dist(m2)) b = m2;
    else a = m1;
  }
  return 2 / (a + b);
}

describe("Planckian locus", () => {
  it("reproduces Robertson's isotemperature table (Robertson 1968, JOSA 58:1528, Table 1; recalled from memory)", () => {
    // mired, u, v, slope t — 31 rows as printed by Robertson (1968) and reprinted in Wyszecki & Stiles (1982) Table 1(3.11).
    const printed = [
      [0, 0.18006, 0.26352, -0.24341],
      [10, 0.18066, 0.26589, -0.25479],
      [20, 0.18133, 0.26846, -0.26876],
      [30, 0.18208, 0.27119, -0.28539],
      [40, 0.18293, 0.27407, -0.3047],
      [50, 0.18388, 0.27709, -0.32675],
      [60, 0.18494, 0.28021, -0.35156],
      [70, 0.18611, 0.28342, -0.37915],
      [80, 0.1874, 0.28668, -0.40955],
      [90, 0.1888, 0.28997, -0.44278],
      [100, 0.19032, 0.29326, -0.47888],
      [125, 0.19462, 0.30141, -0.58204],
      [150, 0.19962, 0.30921, -0.70471],
      [175, 0.20525, 0.31647, -0.84901],
      [200, 0.21142, 0.32312, -1.0182],
      [225, 0.21807, 0.32909, -1.2168],
      [250, 0.22511, 0.33439, -1.4512],
      [275, 0.23247, 0.33904, -1.7298],
      [300, 0.2401, 0.34308, -2.0637],
      [325, 0.24792, 0.34655, -2.4681],
      [350, 0.25591, 0.34951, -2.9641],
      [375, 0.264, 0.352, -3.5814],
      [400, 0.27218, 0.35407, -4.3633],
      [425, 0.28039, 0.35577, -5.3762],
      [450, 0.28863, 0.35714, -6.7262],
      [475, 0.29685, 0.35823, -8.5955],
      [500, 0.30505, 0.35907, -11.324],
      [525, 0.3132, 0.35968, -15.628],
      [550, 0.32129, 0.36011, -23.325],
      [575, 0.32931, 0.36038, -40.77],
      [600, 0.33724, 0.36051, -116.45],
    ];
    const lines = robertsonLines();
    expect(lines).toHaveLength(printed.length);
    printed.forEach(([mired, u, v, t], i) => {
      const line = lines[i]!;
      expect(line.mired).toBe(mired);
      expect(Math.abs(line.u - u!)).toBeLessThan(6e-6); // printed to 5 decimals
      expect(Math.abs(line.v - v!)).toBeLessThan(6e-6);
      // slopes are printed to 5 significant figures; compare the line directions (angle, radians)
      expect(Math.abs(Math.atan(line.slope) - Math.atan(t!))).toBeLessThan(3e-5);
    });
  });

  it("puts illuminant A on the locus at 2848 K × 1.4388/1.435 (CIE 015:2018 §4.1.1: A is a Planckian radiator at 2848 K with c2 = 1.435e-2 m·K)", () => {
    const t = (2848 * 1.4388) / 1.435;
    const a = chromaticityXy(lightTristimulus(illuminantA({ start: 360, end: 830, step: 1 })));
    const p = planckianChromaticity(t);
    expect(Math.abs(p.x - a.x)).toBeLessThan(2e-7);
    expect(Math.abs(p.y - a.y)).toBeLessThan(2e-7);
  });

  it.skipIf(!HAVE_REFERENCE)(
    "matches the chromaticity of the CIE illuminant A table at 1 nm (CIE dataset 10.25039/CIE.DS.8jsxjrsn) " +
      (HAVE_REFERENCE ? "" : NO_REFERENCE),
    () => {
      const csv = readReferenceCsv("cie_std_illum_a_1nm.csv");
      const a = chromaticityXy(
        lightTristimulus(
          spectrum(csv.column("wavelength_nm"), csv.column("A"), { quantity: "relative power" }),
        ),
      );
      const p = planckianChromaticity((2848 * 1.4388) / 1.435);
      // the table has 6 significant figures (README: largest relative deviation from the formula 4.8e-6)
      expect(Math.abs(p.x - a.x)).toBeLessThan(2e-6);
      expect(Math.abs(p.y - a.y)).toBeLessThan(2e-6);
    },
  );

  it("agrees with a Planckian spectrum summed by the colorimetry code", () => {
    for (const t of [1500, 3000, 6500, 15000]) {
      const viaSpectrum = chromaticityXy(lightTristimulus(planckianSpectrum(t)));
      const p = planckianChromaticity(t);
      expect(p.x).toBeCloseTo(viaSpectrum.x, 10);
      expect(p.y).toBeCloseTo(viaSpectrum.y, 10);
    }
  });

  it("Ohno's fine table (cubic between exact points 1 % apart) matches the locus summed by Planck's law (property, 1000–100000 K)", () => {
    fc.assert(
      fc.property(fc.double({ min: Math.log(1000), max: Math.log(100000), noNaN: true }), (lnT) => {
        const t = Math.exp(lnT);
        const tab = tabulatedLocusUv(t)!;
        const exact = planckianUv(t);
        expect(Math.abs(tab.u - exact.u)).toBeLessThan(5e-11);
        expect(Math.abs(tab.v - exact.v)).toBeLessThan(5e-11);
      }),
      { numRuns: 200 },
    );
    expect(tabulatedLocusUv(500)).toBeUndefined();
  });

  it("refuses temperatures that are not finite or below 100 K, naming the value", () => {
    for (const bad of [NaN, Infinity, -5, 0, 50])
      expect(() => planckianChromaticity(bad)).toThrow(String(bad));
    expect(() => planckianUv(NaN)).toThrow(/NaN/);
  });
});

describe("CCT and Duv", () => {
  it("gives illuminant A a CCT of 2856 K (CIE 015:2018 §4.1.1: 2848 K on the c2 = 1.435e-2 scale, ≈ 2856 K with c2 = 1.4388e-2)", () => {
    const r = cctFromSpectrum(illuminant("A"));
    expect(Math.round(r.cct)).toBe(2856);
    expect(Math.abs(r.cct - (2848 * 1.4388) / 1.435)).toBeLessThan(0.01);
    expect(Math.abs(r.duv)).toBeLessThan(1e-6);
    const rob = cctFromSpectrum(illuminant("A"), { method: "robertson" });
    expect(Math.round(rob.cct)).toBe(2856);
  });

  it("gives D65 a CCT of about 6504 K (CIE 015:2018 §4.1.2: nominal 6500 K × 1.4388/1.4380 ≈ 6504 K)", () => {
    const r = cctFromSpectrum(illuminant("D65"));
    expect(Math.abs(r.cct - 6504)).toBeLessThan(2);
    // D65 lies above the Planckian locus: Duv ≈ +0.0032 (common practice, no source)
    expect(r.duv).toBeGreaterThan(0.003);
    expect(r.duv).toBeLessThan(0.0035);
  });

  // CIE 015:2004 Table T.8.1 (colorimetric data of the fluorescent illuminants; also CIE 015:2018 Table 10.4):
  // x, y to 4 decimals and CCT in K as tabulated (recalled from memory). The table gives CCTs to 10 K.
  const FL_TABLE: [string, number, number, number][] = [
    ["FL1", 0.3131, 0.3371, 6430],
    ["FL2", 0.3721, 0.3751, 4230],
    ["FL3", 0.4091, 0.3941, 3450],
    ["FL4", 0.4402, 0.4031, 2940],
    ["FL5", 0.3138, 0.3452, 6350],
    ["FL6", 0.3779, 0.3882, 4150],
    ["FL7", 0.3129, 0.3292, 6500],
    ["FL8", 0.3458, 0.3586, 5000],
    ["FL9", 0.3741, 0.3727, 4150],
    ["FL10", 0.3458, 0.3588, 5000],
    ["FL11", 0.3805, 0.3769, 4000],
    ["FL12", 0.437, 0.4042, 3000],
  ];
  it.each(FL_TABLE)(
    "%s: chromaticity and CCT as tabulated in CIE 015 (recalled from memory)",
    (name, x, y, cct) => {
      const xy = chromaticityXy(lightTristimulus(illuminant(name)));
      expect(Math.abs(xy.x - x)).toBeLessThanOrEqual(0.00006);
      expect(Math.abs(xy.y - y)).toBeLessThanOrEqual(0.00006);
      const r = cctFromSpectrum(illuminant(name));
      expect(Math.abs(r.cct - cct)).toBeLessThanOrEqual(10);
      const rob = cctFromSpectrum(illuminant(name), { method: "robertson" });
      expect(Math.abs(rob.cct - cct)).toBeLessThanOrEqual(10);
    },
  );

  it("Ohno's result equals the nearest locus point by direct search (the definition, CIE 015:2018 §9.5)", () => {
    for (const xy of [
      { x: 0.3127, y: 0.329 },
      { x: 0.44757, y: 0.40745 },
      { x: 0.38, y: 0.36 },
      { x: 0.29, y: 0.31 },
      { x: 0.5, y: 0.41 },
    ]) {
      const r = cctAndDuv(xy);
      const t = cctByDefinition(xy);
      expect(Math.abs(r.cct - t) / t).toBeLessThan(2e-7);
      const { u, v } = uv1960FromXy(xy);
      const p = planckianUv(t);
      expect(Math.abs(Math.abs(r.duv) - Math.hypot(u - p.u, v - p.v))).toBeLessThan(1e-9);
    }
  });

  it("round trip: chromaticityAtCct then cctAndDuv gives back T and Duv (property, 1000–50000 K, |Duv| ≤ 0.03)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1000, max: 50000, noNaN: true }),
        fc.double({ min: -0.03, max: 0.03, noNaN: true }),
        (t, duv) => {
          let xy;
          try {
            xy = chromaticityAtCct(t, duv);
          } catch {
            return; // the offset point falls outside the spectrum locus at low T (physical limit)
          }
          const r = cctAndDuv(xy);
          expect(Math.abs(r.cct - t) / t).toBeLessThan(5e-7);
          expect(Math.abs(r.duv - duv)).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 60 },
    );
  });

  it("Robertson agrees with Ohno to within its interpolation error (< 0.07 %, e.g. 5 K at 9000 K, from 2200 K to 20000 K)", () => {
    for (const t of [2200, 2500, 3300, 4500, 6504, 9000, 14000, 20000]) {
      for (const duv of [-0.01, 0, 0.01]) {
        const xy = chromaticityAtCct(t, duv);
        const a = cctAndDuv(xy);
        const b = cctAndDuv(xy, { method: "robertson" });
        expect(Math.abs(a.cct - b.cct) / a.cct).toBeLessThan(7e-4);
        expect(Math.abs(a.duv - b.duv)).toBeLessThan(3e-5);
      }
    }
  });

  it("the sign of Duv: positive above the locus (towards green), negative below (Ohno 2014)", () => {
    expect(cctAndDuv(chromaticityAtCct(4000, 0.01)).duv).toBeGreaterThan(0);
    expect(cctAndDuv(chromaticityAtCct(4000, -0.01)).duv).toBeLessThan(0);
    const above = chromaticityAtCct(4000, 0.01);
    expect(above.y).toBeGreaterThan(planckianChromaticity(4000).y);
  });

  it("notes the method for the report", () => {
    resetMethodLog();
    cctAndDuv({ x: 0.3127, y: 0.329 });
    cctAndDuv({ x: 0.3127, y: 0.329 }, { method: "robertson" });
    const notes = methodsUsed().filter((n) => n.topic === "colour temperature");
    expect(notes.map((n) => n.statement).join(" ")).toMatch(/Ohno/);
    expect(notes.map((n) => n.statement).join(" ")).toMatch(/Robertson/);
  });

  it("refuses chromaticities out of each method's range or far from the locus, naming the values", () => {
    expect(() => cctAndDuv({ x: 0.3127, y: 0.45 })).toThrow(/Duv/); // far above the locus
    expect(() => cctAndDuv({ x: 0.7, y: 0.29 })).toThrow(/1000/); // deep red: nearest locus point below 1000 K
    expect(() => cctAndDuv(chromaticityAtCct(1200, 0), { method: "robertson" })).toThrow(/1667 K/);
    expect(() => cctAndDuv({ x: NaN, y: 0.3 })).toThrow(/NaN/);
    expect(() => cctAndDuv({ x: 0.3, y: Infinity })).toThrow(/Infinity/);
    expect(() => cctAndDuv({ x: 0.6, y: 0.5 })).toThrow(/not a physical chromaticity/);
    expect(() => cctAndDuv({ x: 0.3, y: 0.3 }, { method: "mccamy" as never })).toThrow(/mccamy/);
    expect(() => chromaticityAtCct(500, 0)).toThrow(/500 K/);
    expect(() => chromaticityAtCct(4000, 0.2)).toThrow(/0.2/);
  });
});
