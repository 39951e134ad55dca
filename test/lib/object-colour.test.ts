/**
 * One weighting table for a sample and its white. CIE 015:2018 §7.1–7.2 normalises object colours with k = 100/Σ S ȳ Δλ
 * on the summation grid, so the reference white of CIELAB is the perfect reflecting diffuser summed on that same grid,
 * interval and range. Reviewers found `whitePoint()` (1 nm for D65 by default) paired with `tristimulus()` of 5 nm data
 * (5 nm) in swatches, so a spectrally flat grey came out with b* ≈ −0.007 and two summation conditions in Methods.
 *
 * The neutral checks rest on the definition itself (CIE 015:2018 eqs. 8.3–8.11): a sample with X/Xn = Y/Yn = Z/Zn has
 * a* = b* = 0 and L* = 116·(Y/Yn)^(1/3) − 16; for a spectrally flat sample that holds exactly on any one table.
 */
import { describe, expect, it } from "vitest";
import { chromaticityXy } from "../../lib/colorimetry/chromaticity.ts";
import { labFromXYZ } from "../../lib/colorimetry/cielab.ts";
import {
  commonSummationInterval,
  objectColour,
  tristimulus,
  whitePoint,
} from "../../lib/colorimetry/tristimulus.ts";
import { transmittedLight } from "../../lib/filters/transmitted-light.ts";
import { methodsUsed, resetMethodLog } from "../../lib/methods/method-log.ts";
import { recipeColour, singleConstantColourant } from "../../lib/mixing/index.ts";
import { swatch, swatchPairs } from "../../lib/plot/index.ts";
import { metamerismIndex } from "../../lib/rendering/metamerism-index.ts";
import { spectrumOnGrid, type Spectrum } from "../../lib/spectrum/spectrum.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "./reference-data.ts";

const flat = (
  value: number,
  step: 1 | 5,
  quantity: "reflectance" | "transmittance" = "reflectance",
): Spectrum =>
  spectrumOnGrid(380, step, new Array(400 / step + 1).fill(value), {
    quantity,
    name: `flat ${value} at ${step} nm (invented)`,
  });
const neutralL = (f: number) => 116 * Math.cbrt(f) - 16; // CIE 015:2018 eq. 8.3 for Y/Yn > (6/29)³

describe("objectColour: the sample and its white from one table", () => {
  it("a flat 50 % grey measured every 5 nm is exactly neutral in CIELAB against the white objectColour returns", () => {
    const c = objectColour(flat(0.5, 5));
    expect(c.interval).toBe(5);
    // The library's one convention (README, "Summation range"): the sample's measured range within 360–830 nm.
    expect(c.range).toEqual([380, 780]);
    const lab = labFromXYZ(c.XYZ, c.white);
    expect(Math.abs(lab.a)).toBeLessThan(1e-9);
    expect(Math.abs(lab.b)).toBeLessThan(1e-9);
    expect(lab.L).toBeCloseTo(neutralL(0.5), 9);
    // What the reviewers saw: the same grey against the default white (summed at 1 nm) is not neutral.
    const mixed = labFromXYZ(tristimulus(flat(0.5, 5)), whitePoint());
    expect(Math.abs(mixed.b)).toBeGreaterThan(1e-3);
  });

  it("its XYZ is tristimulus()'s and its white is whitePoint() with the same interval and range", () => {
    for (const [sample, options] of [
      [flat(0.3, 5), { illuminant: "D65" }],
      [flat(0.3, 1), { illuminant: "A" }],
      [flat(0.3, 5), { illuminant: "D50", observer: "10°" }],
      [flat(0.3, 1), { illuminant: "D65", interval: 5, range: [380, 780] }],
    ] as const) {
      const c = objectColour(sample, options);
      expect(c.XYZ).toEqual(tristimulus(sample, options));
      expect(c.white).toEqual(whitePoint({ ...options, interval: c.interval, range: c.range }));
    }
  });

  it("notes one summation condition for sample and white together", () => {
    resetMethodLog();
    objectColour(flat(0.5, 5));
    const integration = methodsUsed().filter((n) => n.topic === "integration");
    expect(integration).toHaveLength(1);
    expect(integration[0]!.statement).toMatch(
      /^Tristimulus values of object colours were summed at 5 nm intervals over 380–780 nm \(the measured range of the samples within the 360–830 nm of the colour-matching functions, without extrapolation\)/,
    );
  });

  it("refuses a light source (a relative power spectrum), naming it", () => {
    const lamp = spectrumOnGrid(380, 5, new Array(81).fill(1), {
      quantity: "relative power",
      name: "lamp (invented)",
    });
    expect(() => objectColour(lamp)).toThrow(/"lamp \(invented\)" is a relative power spectrum/);
  });

  it("commonSummationInterval: 1 nm only when every sample and illuminant is at 1 nm (CIE 015:2018 §7.2 practice)", () => {
    expect(commonSummationInterval([flat(0.5, 1)], ["D65"])).toBe(1);
    expect(commonSummationInterval([flat(0.5, 1), flat(0.5, 5)], ["D65"])).toBe(5);
    expect(commonSummationInterval([flat(0.5, 1)], ["D65", "D50"])).toBe(5); // D50 is built from the 5 nm S0, S1, S2
    expect(() => commonSummationInterval([])).toThrow(
      /commonSummationInterval: samples should be an array of at least 1 spectra/,
    );
  });
});

describe.skipIf(!HAVE_REFERENCE)(
  `the white on the sample's table, against the CIE files ${HAVE_REFERENCE ? "" : NO_REFERENCE}`,
  () => {
    it("D65 at 5 nm over 360–830 nm: the white objectColour returns equals Σ S·x̄, Σ S·ȳ, Σ S·z̄ of the CIE 1 nm tables taken every 5 nm", () => {
      // CIE D65 (CIE S 014-2/E:2006) and CIE 1931 2° colour-matching functions (CIE 018:2019), read from the CIE files.
      const d65 = readReferenceCsv("cie_std_illum_d65_1nm.csv");
      const cmf = readReferenceCsv("cie_1931_2deg_xyz_1nm.csv");
      const sAt = new Map(d65.column(d65.header[0]!).map((w, i) => [w, d65.column(d65.header[1]!)[i]!]));
      const wl = cmf.column(cmf.header[0]!);
      const [xb, yb, zb] = [1, 2, 3].map((k) => cmf.column(cmf.header[k]!)) as [number[], number[], number[]];
      let X = 0,
        Y = 0,
        Z = 0;
      wl.forEach((w, i) => {
        if (w % 5 !== 0 || w < 360 || w > 830) return;
        const s = sAt.get(w)!;
        X += s * xb[i]!;
        Y += s * yb[i]!;
        Z += s * zb[i]!;
      });
      const wide = spectrumOnGrid(360, 5, new Array(95).fill(0.5), {
        quantity: "reflectance",
        name: "flat 50 % over 360–830 nm (invented)",
      });
      const c = objectColour(wide, { illuminant: "D65" });
      expect(c.white.X).toBeCloseTo((100 * X) / Y, 9);
      expect(c.white.Y).toBeCloseTo(100, 12);
      expect(c.white.Z).toBeCloseTo((100 * Z) / Y, 9);
    });
  },
);

describe("everywhere the library pairs a sample with a white, both come from one table", () => {
  it("a swatch of a flat 5 nm grey is exactly neutral and Methods shows one summation condition", () => {
    resetMethodLog();
    const s = swatch("grey (invented)", flat(0.5, 5));
    const [r, g, b] = [1, 3, 5].map((i) => parseInt(s.hex.slice(i, i + 2), 16));
    expect(r).toBe(g);
    expect(g).toBe(b);
    expect(methodsUsed().filter((n) => n.topic === "integration")).toHaveLength(1);
  });

  it("swatch pairs of a 1 nm and a 5 nm spectrum share one white, so identical flat greys differ by ΔE00 = 0.00", () => {
    const out = swatchPairs([{ label: "grey", reference: flat(0.4, 1), sample: flat(0.4, 5) }]);
    expect(out[1]!.pair!.deltaE00!).toBeLessThan(0.005);
  });

  it("transmittedLight: a spectrally flat filter has exactly the source's chromaticity, so no dominant wavelength", () => {
    // CIE 015:2018 §9.1: a colour at the white has no dominant wavelength. With the white summed at 1 nm and the 5 nm
    // filter at 5 nm, the two chromaticities differed by 2e-5 and a 'dominant wavelength' was reported.
    const t = transmittedLight(flat(0.3, 5, "transmittance"));
    expect(t.dominantWavelength).toBeNull();
    expect(t.purity).toBe(0);
    expect(Math.hypot(t.xy.x - t.white.x, t.xy.y - t.white.y)).toBeLessThan(1e-12);
    expect(t.luminousTransmittance).toBeCloseTo(0.3, 12);
  });

  it("metamerismIndex: the same flat grey on a 1 nm and a 5 nm grid matches exactly under both illuminants", () => {
    const m = metamerismIndex(flat(0.5, 1), flat(0.5, 5), { reference: "D65", test: "A" });
    expect(m.mismatchUnderReference).toBeLessThan(1e-9);
    expect(m.index).toBeLessThan(1e-9);
    for (const lab of m.labUnderTest) {
      expect(Math.abs(lab.a) + Math.abs(lab.b)).toBeLessThan(1e-9);
      expect(lab.L).toBeCloseTo(neutralL(0.5), 9);
    }
  });

  it("recipeColour: a neutral single-constant colourant gives a neutral colour against the white it returns", () => {
    // K/S constant over wavelength gives a constant R∞ (Kubelka & Munk 1931), so the mixture is spectrally flat.
    const grey = singleConstantColourant(
      spectrumOnGrid(380, 5, new Array(81).fill(0.2), { name: "grey K/S (invented)" }),
      "grey (invented)",
    );
    const c = recipeColour([{ colourant: grey, amount: 1 }], { illuminant: "D50" });
    expect(Math.abs(c.Lab.a) + Math.abs(c.Lab.b)).toBeLessThan(1e-9);
    expect(chromaticityXy(c.white).x).toBeCloseTo(
      chromaticityXy(whitePoint({ illuminant: "D50", sample: c.reflectance })).x,
      12,
    );
  });
});
