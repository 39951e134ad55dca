/**
 * The CIE tables transcribed in lib/data equal the CIE dataset files in ../shared/reference (read in place, never
 * copied); illuminant A from its formula matches the CIE 1 nm table; D65 follows from S0, S1, S2; and the tables
 * agree with those bundled in the npm package spectral-color.
 */
import { cmfs, illuminants, spragueInterpolator as theirSprague } from "spectral-color";
import { describe, expect, it } from "vitest";
import { CIE_DAYLIGHT_COMPONENTS_TABLE } from "../../lib/data/cie-daylight-components.ts";
import { CIE_D65_TABLE } from "../../lib/data/cie-d65.ts";
import { CIE_FLUORESCENT_TABLE } from "../../lib/data/cie-fluorescent.ts";
import { CIE_LED_TABLE } from "../../lib/data/cie-led.ts";
import { CIE_SCOTOPIC_TABLE } from "../../lib/data/cie-scotopic.ts";
import { CIE_TEST_COLOUR_SAMPLES_TABLE } from "../../lib/data/cie-test-colour-samples.ts";
import { CIE1931_2DEG_TABLE } from "../../lib/data/cie1931-observer.ts";
import { CIE1964_10DEG_TABLE } from "../../lib/data/cie1964-observer.ts";
import type { TabulatedData } from "../../lib/data/tabulated-data.ts";
import { daylightChromaticity, daylightFactors, daylightSpectrum } from "../../lib/illuminants/daylight.ts";
import { illuminantA, illuminantAValue } from "../../lib/illuminants/illuminant-a.ts";
import { illuminant, illuminantNames } from "../../lib/illuminants/standard-illuminant.ts";
import {
  CIE_1931_2_DEGREE,
  CIE_1964_10_DEGREE,
  observerByName,
} from "../../lib/observers/standard-observer.ts";
import { spragueInterpolator } from "../../lib/spectrum/interpolate-sprague.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "./reference-data.ts";

/** Every column of a transcribed table equals the CSV column by value (NaN, a blank in the CIE table, as 0). */
function expectTableEqualsCsv(table: TabulatedData, file: string, columns: Record<string, string>): void {
  const csv = readReferenceCsv(file);
  const wl = csv.column("wavelength_nm");
  expect(table.start).toBe(wl[0]);
  expect(table.end).toBe(wl.at(-1));
  expect(wl.every((w, i) => w === table.start + i * table.step)).toBe(true);
  expect(Object.keys(table.columns).sort()).toEqual(Object.keys(columns).sort());
  for (const [ours, theirs] of Object.entries(columns)) {
    const expected = csv.column(theirs).map((v) => (Number.isNaN(v) ? 0 : v));
    expect(table.columns[ours], `${file} column ${theirs}`).toEqual(expected);
  }
}

const same = (names: string[]) => Object.fromEntries(names.map((n) => [n, n]));

describe.skipIf(!HAVE_REFERENCE)(
  "transcribed CIE tables equal the CIE dataset files " + (HAVE_REFERENCE ? "" : NO_REFERENCE),
  () => {
    it("CIE 1931 2° observer (DOI 10.25039/CIE.DS.xvudnb9b), and its column sums equal the CIE metadata", () => {
      expectTableEqualsCsv(CIE1931_2DEG_TABLE, "cie_1931_2deg_xyz_1nm.csv", {
        x: "x_bar",
        y: "y_bar",
        z: "z_bar",
      });
      const sum = (a: readonly number[]) => a.reduce((s, v) => s + v, 0);
      // CIE metadata sumOfColumns, quoted in ../shared/reference/README.md §1
      expect(sum(CIE_1931_2_DEGREE.xBar)).toBeCloseTo(106.865469489595, 9);
      expect(sum(CIE_1931_2_DEGREE.yBar)).toBeCloseTo(106.8569171011719, 9);
      expect(sum(CIE_1931_2_DEGREE.zBar)).toBeCloseTo(106.892251278636, 9);
    });
    it("CIE 1964 10° observer (DOI 10.25039/CIE.DS.sqksu2n5; z̄10 blanks above 559 nm as 0)", () => {
      expectTableEqualsCsv(CIE1964_10DEG_TABLE, "cie_1964_10deg_xyz_1nm.csv", {
        x: "x_bar_10",
        y: "y_bar_10",
        z: "z_bar_10",
      });
    });
    it("D65 (DOI 10.25039/CIE.DS.hjfjmt59)", () =>
      expectTableEqualsCsv(CIE_D65_TABLE, "cie_std_illum_d65_1nm.csv", { D65: "D65" }));
    it("daylight components S0, S1, S2 (DOI 10.25039/CIE.DS.w7zunnny)", () =>
      expectTableEqualsCsv(
        CIE_DAYLIGHT_COMPONENTS_TABLE,
        "cie_daylight_components_5nm.csv",
        same(["S0", "S1", "S2"]),
      ));
    it("FL1–FL12, FL3.1–FL3.15 (DOI 10.25039/CIE.DS.ukaymjdn)", () =>
      expectTableEqualsCsv(
        CIE_FLUORESCENT_TABLE,
        "cie_illum_fl_5nm.csv",
        same(readReferenceCsv("cie_illum_fl_5nm.csv").header.slice(1)),
      ));
    it("LED series (DOI 10.25039/CIE.DS.vgssnyfg)", () =>
      expectTableEqualsCsv(
        CIE_LED_TABLE,
        "cie_illum_led_5nm.csv",
        same(readReferenceCsv("cie_illum_led_5nm.csv").header.slice(1)),
      ));
    it("scotopic V′(λ) (DOI 10.25039/CIE.DS.gr6w4b5g)", () =>
      expectTableEqualsCsv(CIE_SCOTOPIC_TABLE, "cie_sle_scotopic_1nm.csv", { "V'": "V_prime" }));
    it("CIE 13.3 test colour samples (DOI 10.25039/CIE.DS.wuiuu9cz)", () =>
      expectTableEqualsCsv(
        CIE_TEST_COLOUR_SAMPLES_TABLE,
        "cie_13_3_tcs_5nm.csv",
        same(readReferenceCsv("cie_13_3_tcs_5nm.csv").header.slice(1)),
      ));

    it("illuminant A from its defining formula (CIE 015:2018 eq. 4.1) matches the CIE 1 nm table to its 6 significant figures", () => {
      const csv = readReferenceCsv("cie_std_illum_a_1nm.csv");
      const wl = csv.column("wavelength_nm");
      const a = csv.column("A");
      const ours = illuminantA();
      expect(ours.wavelengths).toEqual(wl);
      // README §4: the largest relative difference between the table and the formula is 4.8e-6
      ours.values.forEach((v, i) => expect(Math.abs(v / a[i]! - 1), `${wl[i]} nm`).toBeLessThan(5e-6));
      expect(illuminantAValue(560)).toBe(100);
    });

    it("D65 = S0 − 0.295·S1 − 0.689·S2 within 0.00086 at every 5 nm (README §3 states 0.0008; the largest deviation, 0.00085, is at 545 nm)", () => {
      const comp = readReferenceCsv("cie_daylight_components_5nm.csv");
      const d65 = readReferenceCsv("cie_std_illum_d65_1nm.csv");
      const d65At = new Map(d65.column("wavelength_nm").map((w, i) => [w, d65.column("D65")[i]!]));
      const wl = comp.column("wavelength_nm");
      const s0 = comp.column("S0"),
        s1 = comp.column("S1"),
        s2 = comp.column("S2");
      wl.forEach((w, i) =>
        expect(Math.abs(s0[i]! - 0.295 * s1[i]! - 0.689 * s2[i]! - d65At.get(w)!), `${w} nm`).toBeLessThan(
          0.00086,
        ),
      );
      // and our daylight at the D65 CCT (6500 K × 1.4388/1.4380) with factors rounded to 3 decimals does the same
      const ours = daylightSpectrum((6500 * 1.4388) / 1.438, { roundFactors: true });
      ours.wavelengths.forEach((w, i) =>
        expect(Math.abs(ours.values[i]! - d65At.get(w)!), `${w} nm`).toBeLessThan(0.00086),
      );
    });
  },
);

describe("daylight and illuminants", () => {
  it("the daylight factors of D65 are M1 = −0.295, M2 = −0.689 (CIE 015:2018 §4.1.2; as used in ../shared/reference/README.md §3)", () => {
    expect(daylightFactors(daylightChromaticity((6500 * 1.4388) / 1.438), true)).toEqual([-0.295, -0.689]);
  });

  it("the daylight locus gives y = −3x² + 2.87x − 0.275 (CIE 015:2018 eq. 4.6)", () => {
    for (const t of [4000, 5003, 6504, 10000, 25000]) {
      const c = daylightChromaticity(t);
      expect(c.y).toBeCloseTo(-3 * c.x * c.x + 2.87 * c.x - 0.275, 14);
    }
  });

  it("refuses daylight outside 4000–25000 K and unknown illuminants and observers, naming the value", () => {
    expect(() => daylightChromaticity(3000)).toThrow(/3000 K/);
    expect(() => daylightChromaticity(NaN)).toThrow(/NaN/);
    expect(() => illuminant("D93")).toThrow(
      /illuminant: name should be an illuminant name, one of .*D65.*but got a string \("D93"\)/,
    );
    expect(() => illuminant("FL13")).toThrow(/FL13/);
    expect(() => observerByName("5°" as never)).toThrow(/5°/);
    expect(illuminantNames()).toEqual(
      expect.arrayContaining([
        "A",
        "D50",
        "D55",
        "D65",
        "D75",
        "E",
        "FL1",
        "FL12",
        "FL3.15",
        "LED-B1",
        "LED-V2",
      ]),
    );
    expect(illuminant(" d 65 ")).toBe(illuminant("D65"));
  });
});

describe("cross-check with the npm package spectral-color", () => {
  it("its CIE 1931 table (5 nm, 360–830 nm) equals ours at every 5 nm", () => {
    const theirs = cmfs.CIE_1931_2DEG;
    expect(theirs.shape.start).toBe(360);
    expect(theirs.shape.interval).toBe(5);
    const wl = theirs.shape.wavelengths();
    wl.forEach((w, i) => {
      const j = w - 360;
      const [x, y, z] = theirs.samples[i] as [number, number, number];
      expect(x).toBeCloseTo(CIE_1931_2_DEGREE.xBar[j]!, 9);
      expect(y).toBeCloseTo(CIE_1931_2_DEGREE.yBar[j]!, 9);
      expect(z).toBeCloseTo(CIE_1931_2_DEGREE.zBar[j]!, 9);
    });
    expect(CIE_1964_10_DEGREE.wavelengths).toHaveLength(471);
  });

  it("its D65 (5 nm, 300–780 nm) equals the CIE D65 table at every 5 nm", () => {
    const theirs = illuminants.D65;
    const d65 = illuminant("D65");
    theirs.shape
      .wavelengths()
      .forEach((w, i) => expect(theirs.samples[i]).toBeCloseTo(d65.values[w - 300]!, 9));
  });

  it("its Sprague interpolator (CIE 167 boundary coefficients) agrees with ours", () => {
    const ys = Array.from({ length: 20 }, (_, i) => Math.sin(i / 3) + 0.1 * i * i);
    const ours = spragueInterpolator(0, 1, ys);
    for (let x = 0; x < 19; x += 0.137) expect(ours(x)).toBeCloseTo(theirSprague(x, ys), 10);
  });
});
