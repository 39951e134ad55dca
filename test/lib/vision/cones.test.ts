/**
 * Cone fundamentals, the CIE 2015 observers derived from them, cone excitations and the MacLeod–Boynton diagram.
 * Sources are named at each check; values recalled from memory say so.
 */
import { describe, expect, it } from "vitest";
import * as t from "../../../lib/index.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "../reference-data.ts";

describe.skipIf(!HAVE_REFERENCE)("CIE 2006 LMS 2° table " + (HAVE_REFERENCE ? "" : NO_REFERENCE), () => {
  it("equals the CIE dataset file cie_2006_lms_2deg_energy_5nm.csv (CIE 170-1:2006 Table 6.7) number for number, blanks as 0", () => {
    const ref = readReferenceCsv("cie_2006_lms_2deg_energy_5nm.csv");
    const wl = ref.column("wavelength_nm");
    const f = t.CIE_2006_LMS_2_DEGREE;
    expect(f.wavelengths).toEqual(wl);
    const cols: Array<[string, readonly number[]]> = [
      ["l_bar", f.l],
      ["m_bar", f.m],
      ["s_bar", f.s],
    ];
    for (const [name, ours] of cols) {
      const theirs = ref.column(name).map((v) => (Number.isNaN(v) ? 0 : v));
      expect(ours.length).toBe(theirs.length);
      ours.forEach((v, i) => expect(v, `${name} at ${wl[i]} nm`).toBe(theirs[i]));
    }
  });
});

describe("CIE 2006 LMS 10° table", () => {
  it("has the column sums of the CIE dataset metadata (10.25039/CIE.DS.nxsqeri8: 23.922634940648, 20.3881095153302, 11.04302498627) and its sample row at 545 nm", () => {
    const f = t.CIE_2006_LMS_10_DEGREE;
    const sum = (a: readonly number[]) => a.reduce((x, y) => x + y, 0);
    expect(sum(f.l)).toBeCloseTo(23.922634940648, 10);
    expect(sum(f.m)).toBeCloseTo(20.3881095153302, 10);
    expect(sum(f.s)).toBeCloseTo(11.04302498627, 10);
    const i = f.wavelengths.indexOf(545);
    expect([f.l[i], f.m[i], f.s[i]]).toEqual([0.92666, 0.991383, 0.00175573]);
  });
  it("peaks where CIE 170-1 puts the 10° peaks (l̄10 near 570 nm, m̄10 near 540 nm, s̄10 near 445 nm)", () => {
    const f = t.coneFundamentals("10°");
    const peak = (a: readonly number[]) => f.wavelengths[a.indexOf(Math.max(...a))];
    expect(peak(f.l)).toBe(570);
    expect(peak(f.m)).toBe(540);
    expect(peak(f.s)).toBe(445);
  });
});

describe("CIE 2015 colour-matching functions (CIE 170-2:2015)", () => {
  for (const obs of [t.CIE_2015_2_DEGREE, t.CIE_2015_10_DEGREE]) {
    it(`${obs.fieldDegrees}°: x̄F, ȳF, z̄F have equal areas, so the equal-energy stimulus is at x = y = 1/3 (the normalisation CIE 170-2 chose)`, () => {
      const sum = (a: readonly number[]) => a.reduce((x, y) => x + y, 0);
      const sy = sum(obs.yBar);
      // On the 5 nm table the areas agree to 3e-4 (the standard fixes them on its finer table).
      expect(Math.abs(sum(obs.xBar) / sy - 1)).toBeLessThan(3e-4);
      expect(Math.abs(sum(obs.zBar) / sy - 1)).toBeLessThan(4e-4);
      const E = t.spectrumOnGrid(390, 5, new Array(89).fill(1), { quantity: "relative power", name: "E" });
      const xy = t.chromaticityXy(t.lightTristimulus(E, { observer: obs }));
      expect(xy.x).toBeCloseTo(1 / 3, 4);
      expect(xy.y).toBeCloseTo(1 / 3, 4);
    });
    it(`${obs.fieldDegrees}°: ȳF peaks at 1 within the 5 nm sampling (CIE 170-2 normalises it to a peak of 1)`, () => {
      expect(Math.max(...obs.yBar)).toBeGreaterThan(0.999);
      expect(Math.max(...obs.yBar)).toBeLessThan(1.0001);
    });
  }
  it("is accepted wherever an observer is: tristimulus, objectColour, whitePoint and chromaticityDiagram", () => {
    const grey = t.spectrumOnGrid(380, 5, new Array(81).fill(0.5), { quantity: "reflectance" });
    const XYZ = t.tristimulus(grey, { observer: t.CIE_2015_10_DEGREE });
    expect(XYZ.Y).toBeCloseTo(50, 6);
    const w = t.whitePoint({ illuminant: "D65", observer: t.CIE_2015_2_DEGREE });
    expect(w.Y).toBeCloseTo(100, 8);
    // The 2015 white of D65 differs from the 1931 one (0.31272, 0.32903, CIE 015:2018 Table 4): a different observer.
    const xy = t.chromaticityXy(w);
    expect(Math.abs(xy.x - 0.31272)).toBeGreaterThan(2e-4);
    const fig = t.chromaticityDiagram({ observer: t.CIE_2015_2_DEGREE });
    expect(fig.data.length).toBeGreaterThan(0);
  });
  it("puts the Methods statement for the observer by its name", () => {
    t.resetMethodLog();
    t.whitePoint({ illuminant: "D65", observer: t.CIE_2015_2_DEGREE });
    const notes = t.methodsUsed().map((n) => n.statement);
    expect(notes.some((s) => s.includes("CIE 2015 2°") && s.includes("CIE 170-2"))).toBe(true);
  });
});

describe("cone excitations and MacLeod–Boynton chromaticity", () => {
  it("a monochromatic light gives the table's l̄, m̄, s̄ at its wavelength × Δλ (definition, CIE 170-1)", () => {
    const w = [575, 580, 585];
    const line = t.spectrum(w, [0, 1, 0], { quantity: "relative power", name: "580 nm line (invented)" });
    const lms = t.coneExcitations(line);
    const f = t.CIE_2006_LMS_2_DEGREE;
    const i = f.wavelengths.indexOf(580);
    expect(lms.L).toBeCloseTo(5 * f.l[i]!, 12);
    expect(lms.M).toBeCloseTo(5 * f.m[i]!, 12);
    expect(lms.S).toBeCloseTo(5 * f.s[i]!, 12);
  });
  it("the perfect white under D65 has luminance 0.68990272 L + 0.34832189 M = 1", () => {
    const white = t.spectrumOnGrid(380, 5, new Array(81).fill(1), { quantity: "reflectance" });
    const lms = t.coneExcitations(white);
    expect(0.68990272 * lms.L + 0.34832189 * lms.M).toBeCloseTo(1, 10);
  });
  it("the luminance L_MB + M_MB of a light equals its CIE 2015 Y (ȳF is that sum, CIE 170-2)", () => {
    const light = t.illuminant("A");
    const lms = t.coneExcitations(light);
    const mb = t.macLeodBoynton(lms);
    let y = 0;
    const obs = t.CIE_2015_2_DEGREE;
    for (let i = 0; i < obs.wavelengths.length; i++)
      y += t.valueAt(light, obs.wavelengths[i]!) * obs.yBar[i]! * 5;
    expect(mb.luminance).toBeCloseTo(y, 8);
  });
  it("the S scale makes s_MB peak at 1 on the spectrum locus; it is near 0.0371597, the 2° factor recalled from memory for the 1 nm table", () => {
    const w = t.macLeodBoyntonWeights("2°");
    expect(Math.abs(w.s / 0.0371597 - 1)).toBeLessThan(0.01);
    const f = t.CIE_2006_LMS_2_DEGREE;
    const peak = Math.max(...f.wavelengths.map((_, i) => (w.s * f.s[i]!) / (w.l * f.l[i]! + w.m * f.m[i]!)));
    expect(peak).toBeCloseTo(1, 12);
  });
  it("a spectral yellow and a red + green mixture can share l_MB and s_MB: the cones cannot tell them apart (Young–Helmholtz; metamerism)", () => {
    const f = t.CIE_2006_LMS_2_DEGREE;
    const at = (w: number) => f.wavelengths.indexOf(w);
    const mono = (w: number) =>
      t.spectrum([w - 5, w, w + 5], [0, 1, 0], { quantity: "relative power", name: `${w} nm` });
    const yellow = t.macLeodBoynton(t.coneExcitations(mono(580)));
    // A mixture of 545 nm and 620 nm lines with the yellow's l_MB (solved for the ratio).
    const lmb = (w: number) =>
      (0.68990272 * f.l[at(w)]!) / (0.68990272 * f.l[at(w)]! + 0.34832189 * f.m[at(w)]!);
    expect(lmb(545)).toBeLessThan(yellow.l);
    expect(lmb(620)).toBeGreaterThan(yellow.l);
    expect(yellow.s).toBeLessThan(0.01);
  });
  it("draws a MacLeod–Boynton diagram with the locus and the points given", () => {
    const fig = t.macLeodBoyntonDiagram({
      points: [
        {
          label: "D65 white",
          spectrum: t.spectrumOnGrid(380, 5, new Array(81).fill(1), { quantity: "reflectance" }),
        },
      ],
    });
    expect(fig.data.map((d) => d.name)).toContain("D65 white");
    const locus = fig.data[0]!;
    expect(Math.max(...(locus.y as number[]))).toBeCloseTo(1, 4);
    expect(fig.caption).toContain("CIE 2006");
  });
  it("refuses bad input with an ArgumentError naming the function", () => {
    expect(() => t.coneExcitations({} as never)).toThrow(/coneExcitations/);
    expect(() => t.coneFundamentals("5°" as never)).toThrow(/coneFundamentals/);
    expect(() => t.macLeodBoynton({ L: 0, M: 0, S: 1 })).toThrow(/no luminance/);
  });
});

describe("CIE 2015 observers by name", () => {
  it('observerByName("CIE 2015 10°") and an options observer "2015 2°" give the CIE 170-2 observers', () => {
    expect(t.observerByName("CIE 2015 10°")).toBe(t.CIE_2015_10_DEGREE);
    expect(t.observerByName("2015 2°")).toBe(t.CIE_2015_2_DEGREE);
    const a = t.whitePoint({ illuminant: "A", observer: "CIE 2015 2°" });
    const b = t.whitePoint({ illuminant: "A", observer: t.CIE_2015_2_DEGREE });
    expect(a).toEqual(b);
  });
});
