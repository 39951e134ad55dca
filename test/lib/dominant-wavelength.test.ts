/**
 * Dominant/complementary wavelength and excitation purity (CIE 015:2018 §9.1–9.2), checked with the CIE 1931 and
 * 1964 spectrum loci themselves (CIE tables, ../shared/reference): a spectral colour has its own wavelength and
 * purity 1; points part-way to the locus have proportional purity.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { dominantWavelength, spectrumLocus } from "../../lib/colorimetry/dominant-wavelength.ts";
import { spectrum } from "../../lib/spectrum/spectrum.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "./reference-data.ts";

const D65 = { x: 0.3127, y: 0.329 };
const E = { x: 1 / 3, y: 1 / 3 };

describe.skipIf(!HAVE_REFERENCE)(
  "dominant wavelength against the CIE colour-matching tables " + (HAVE_REFERENCE ? "" : NO_REFERENCE),
  () => {
    const table = HAVE_REFERENCE ? readReferenceCsv("cie_1931_2deg_xyz_1nm.csv") : undefined;
    const locusXy = (nm: number) => {
      const i = table!.column("wavelength_nm").indexOf(nm);
      const [x, y, z] = [table!.column("x_bar")[i]!, table!.column("y_bar")[i]!, table!.column("z_bar")[i]!];
      return { x: x / (x + y + z), y: y / (x + y + z) };
    };

    it.each([420, 450, 470, 490, 500, 520, 540, 560, 580, 600, 620, 650, 680])(
      "a spectral colour at %i nm (CIE 1931 table) has that dominant wavelength and purity 1",
      (nm) => {
        const r = dominantWavelength(locusXy(nm), D65);
        expect(r.complementary).toBe(false);
        expect(Math.abs(r.wavelength - nm)).toBeLessThan(1e-6);
        expect(r.purity).toBeCloseTo(1, 9);
      },
    );

    it("purity is the fraction of the way from white to the locus (CIE 015:2018 eq. 9.1), for any fraction (property)", () => {
      fc.assert(
        fc.property(
          fc.integer({ min: 430, max: 690 }),
          fc.double({ min: 0.02, max: 1, noNaN: true }),
          (nm, f) => {
            const p = locusXy(nm);
            const r = dominantWavelength({ x: E.x + f * (p.x - E.x), y: E.y + f * (p.y - E.y) }, E);
            expect(r.wavelength).toBeCloseTo(nm, 6);
            expect(r.purity).toBeCloseTo(f, 9);
          },
        ),
        { numRuns: 100 },
      );
    });

    it("purples get a complementary wavelength: white lies between the colour and the locus point at λc", () => {
      // the purple line joins the two ends of the locus (360 nm and where the 1931 locus stops turning, ≈ 699 nm)
      const locus = spectrumLocus("2°");
      const red = locusXy(locus.at(-1)!.wavelength),
        violet = locusXy(locus[0]!.wavelength);
      const purple = { x: (red.x + violet.x) / 2, y: (red.y + violet.y) / 2 };
      const sample = { x: D65.x + 0.6 * (purple.x - D65.x), y: D65.y + 0.6 * (purple.y - D65.y) };
      const r = dominantWavelength(sample, D65);
      expect(r.complementary).toBe(true);
      expect(r.wavelength).toBeGreaterThan(490);
      expect(r.wavelength).toBeLessThan(570);
      const c = locusXy(Math.round(r.wavelength));
      // collinear within the 1 nm rounding of λc: the cross product of (c − white) and (sample − white) is small
      const cross = (c.x - D65.x) * (sample.y - D65.y) - (c.y - D65.y) * (sample.x - D65.x);
      expect(Math.abs(cross)).toBeLessThan(2e-3);
      expect((c.x - D65.x) * (sample.x - D65.x) + (c.y - D65.y) * (sample.y - D65.y)).toBeLessThan(0); // opposite sides of white
      expect(r.purity).toBeCloseTo(0.6, 9); // 60 % of the way to the purple line
    });
  },
);

describe("spectrum locus and dominant wavelength: general", () => {
  it("the locus stops where it stops turning: about 700 nm for both observers", () => {
    expect(spectrumLocus("2°").at(-1)!.wavelength).toBeGreaterThanOrEqual(690);
    expect(spectrumLocus("2°").at(-1)!.wavelength).toBeLessThanOrEqual(780);
    expect(spectrumLocus("10°").at(-1)!.wavelength).toBeGreaterThanOrEqual(690);
    expect(spectrumLocus("2°")[0]!.wavelength).toBe(360);
  });

  it("works with the 10° observer (a narrow-band 10° colour has its own wavelength)", () => {
    const loc = spectrumLocus("10°").find((p) => p.wavelength === 550)!;
    expect(dominantWavelength(loc, D65, "10°").wavelength).toBeCloseTo(550, 6);
  });

  it("refuses the white itself, non-finite input and unknown observers, naming the value", () => {
    expect(() => dominantWavelength(D65, D65)).toThrow(/coincides/);
    expect(() => dominantWavelength({ x: NaN, y: 0.3 }, D65)).toThrow(/NaN/);
    expect(() => dominantWavelength({ x: 0.3, y: 0.3 }, { x: 0.3, y: Infinity })).toThrow(/Infinity/);
    expect(() => dominantWavelength({ x: 0.3, y: 0.3 }, D65, "5°" as never)).toThrow(/5°/);
    expect(spectrum).toBeTypeOf("function");
  });
});
