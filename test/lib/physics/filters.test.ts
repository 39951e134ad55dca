import { existsSync, readFileSync } from "node:fs";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  bandPassFilter,
  clearPlateTransmittance,
  dyeFilter,
  EYE_PROTECTION_CAUTION,
  externalFromInternal,
  externalTransmittance,
  filterSunglassCategory,
  transmittedLight,
  filterElement,
  filterElementFromMeasurement,
  internalFromExternal,
  internalTransmittance,
  longPassFilter,
  neutralDensityFilter,
  opticalDensity,
  opticalDensitySpectrum,
  pathRatio,
  plateReflectanceValue,
  scaleFilterTransmittance,
  scaleInternalTransmittance,
  scaleInternalValue,
  shortPassFilter,
  spectrum,
  stackTransmittance,
  sunglassCategory,
  surfaceReflectance,
  transmittanceFromDensity,
  valueAt,
  type StackJoin,
} from "../../../lib/index.ts";

const grid3 = [450, 550, 650];
const flat = (v: number, name = "flat") => spectrum(grid3, [v, v, v], { name, quantity: "transmittance" });

describe("Fresnel reflection and the plate relation", () => {
  it("gives 4 % per surface for n = 1.5 in air", () => {
    // Source: Hecht, Optics (5th ed.) §4.6.2 — R = ((n − 1)/(n + 1))² = 0.04 for glass of n = 1.5 at normal incidence.
    expect(surfaceReflectance(1.5)).toBeCloseTo(0.04, 12);
  });

  it("gives about 92 % external transmittance for a clear plate of n = 1.5", () => {
    // Source: Hecht, Optics §4.6 — a clear glass plate loses about 4 % at each face, leaving about 92 %; with the
    // multiple reflections summed the exact value is 2n/(n² + 1) = 0.923 (the geometric series of the plate).
    const T = externalFromInternal(1, surfaceReflectance(1.5));
    expect(T).toBeCloseTo(0.92, 2);
    expect(T).toBeCloseTo((2 * 1.5) / (1.5 ** 2 + 1), 12);
    expect(clearPlateTransmittance(0.04)).toBeCloseTo(T, 12);
    // Single-pass approximation (1 − ρ)² = 0.9216 is slightly lower: interreflections return light (Hecht §4.6).
    expect(T).toBeGreaterThan(0.96 * 0.96);
  });

  it("conserves energy for a non-absorbing plate: T + R = 1", () => {
    // Source: conservation of energy (Hecht, Optics §4.6: R + T = 1 for a lossless dielectric interface and plate).
    fc.assert(
      fc.property(fc.double({ min: 1, max: 3, noNaN: true }), (n) => {
        const rho = surfaceReflectance(n);
        expect(externalFromInternal(1, rho) + plateReflectanceValue(1, rho)).toBeCloseTo(1, 12);
      }),
    );
  });

  it("recovers internal transmittance from external transmittance (round trip)", () => {
    // Source: the plate relation T = (1 − ρ)²τ/(1 − ρ²τ²) (Hecht §4.6) solved exactly for τ; the round trip must be exact.
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 1.3, max: 2.2, noNaN: true }),
        (tau, n) => {
          const rho = surfaceReflectance(n);
          expect(internalFromExternal(externalFromInternal(tau, rho), rho)).toBeCloseTo(tau, 10);
        },
      ),
    );
  });

  it("works on spectra, with a dispersion curve for n", () => {
    // Source: plate relation (Hecht §4.6), applied wavelength by wavelength with each wavelength's own index.
    const n = spectrum([400, 500, 600, 700], [1.53, 1.52, 1.515, 1.512], {
      name: "crown glass n(λ), invented",
    });
    const ext = externalTransmittance(flat(0.5), { refractiveIndex: n });
    grid3.forEach((w, i) => {
      const rho = surfaceReflectance(valueAt(n, w));
      expect(ext.values[i]).toBeCloseTo(((1 - rho) ** 2 * 0.5) / (1 - rho * rho * 0.25), 12);
    });
    const back = internalTransmittance(ext, { refractiveIndex: n });
    back.values.forEach((v) => expect(v).toBeCloseTo(0.5, 12));
  });

  it("rejects bad input with clear errors", () => {
    expect(() => surfaceReflectance(Number.NaN)).toThrow(
      /surfaceReflectance: index should be a finite number in refractive index of at least 1, but got NaN/,
    );
    expect(() => externalTransmittance(flat(0.5), {} as never)).toThrow(/refractiveIndex/);
    expect(() =>
      externalTransmittance(spectrum(grid3, [50, 60, 70], { name: "percent data" }), {
        refractiveIndex: 1.5,
      }),
    ).toThrow(/percent/);
    // A measured 95 % is more than any plate of n = 1.5 can pass (2n/(n²+1) = 92.3 %, Hecht §4.6).
    expect(() => internalTransmittance(flat(0.95, "too clear"), { refractiveIndex: 1.5 })).toThrow(
      /at 450 nm.*above 0\.92308/,
    );
    expect(
      internalTransmittance(flat(0.95), { refractiveIndex: 1.5, aboveClearPlate: "clip" }).values,
    ).toEqual([1, 1, 1]);
  });
});

describe("optical density and Beer–Lambert scaling", () => {
  it("relates density and transmittance decadically", () => {
    // Source: ISO 5-1 — transmission density D = −log₁₀ T; D = 1 ↔ T = 10 %, D = 2 ↔ T = 1 %.
    expect(opticalDensity(0.1)).toBeCloseTo(1, 12);
    expect(transmittanceFromDensity(2)).toBeCloseTo(0.01, 14);
    expect(neutralDensityFilter(0.3).values[0]).toBeCloseTo(0.501187, 6);
    expect(() => opticalDensity(0)).toThrow(/infinite/);
    expect(() => opticalDensitySpectrum(spectrum(grid3, [0.5, 0, 0.5], { name: "blocked" }))).toThrow(
      /"blocked" at 550 nm/,
    );
  });

  it("doubles the absorbance when the thickness doubles", () => {
    // Source: Beer–Lambert law (IUPAC Gold Book): absorbance ∝ path length, so τ(2d) = τ(d)².
    const twice = scaleInternalTransmittance(flat(0.6), { thickness: [2, 4] });
    twice.values.forEach((v) => expect(v).toBeCloseTo(0.36, 12));
    expect(pathRatio({ thickness: [2, 3], concentration: [1, 2] })).toBeCloseTo(3, 12);
    expect(() => pathRatio({ thickness: [0, 3] })).toThrow(/thickness \(from\) is 0/);
    expect(() => pathRatio({})).toThrow(/pathRatio: change should be a path change \{ thickness\?/);
  });

  it("composes: scaling by a then b equals scaling by a·b", () => {
    // Source: Beer–Lambert law (IUPAC Gold Book): absorbances add, so path ratios multiply.
    fc.assert(
      fc.property(
        fc.double({ min: 0.001, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        (tau, a, b) => {
          expect(scaleInternalValue(scaleInternalValue(tau, a), b)).toBeCloseTo(
            scaleInternalValue(tau, a * b),
            12,
          );
        },
      ),
    );
  });

  it("rescales a measured filter through its internal transmittance, leaving the surfaces unchanged", () => {
    // Source: plate relation (Hecht §4.6) + Beer–Lambert (IUPAC): zero thickness leaves only the two surfaces (a clear plate).
    const measured = spectrum(grid3, [0.2, 0.5, 0.8], { name: "invented filter", quantity: "transmittance" });
    const same = scaleFilterTransmittance(measured, { thickness: [2, 2] }, { refractiveIndex: 1.5 });
    same.values.forEach((v, i) => expect(v).toBeCloseTo(measured.values[i]!, 12));
    const none = scaleFilterTransmittance(measured, { thickness: [2, 0] }, { refractiveIndex: 1.5 });
    none.values.forEach((v) => expect(v).toBeCloseTo(3 / 3.25, 12));
  });

  it("makes a dye layer from its absorbance curve", () => {
    // Source: Beer–Lambert law (IUPAC Gold Book): τ = 10^(−A), and twice the amount squares τ.
    const a = spectrum(grid3, [0, 1, 0.5], { name: "invented dye absorbance", quantity: "absorbance" });
    const one = dyeFilter(a);
    expect(one.values[1]).toBeCloseTo(0.1, 14);
    const two = dyeFilter(a, { amount: 2 });
    expect(two.values[2]).toBeCloseTo(one.values[2]! ** 2, 14);
    expect(() => dyeFilter(spectrum(grid3, [0, -0.1, 0], { name: "bad" }))).toThrow(/at 550 nm.*negative/);
  });
});

describe("filter stacks", () => {
  it("matches the pile-of-plates result for clear plates with interreflection", () => {
    // Source: Stokes (1862), "On the intensity of the light reflected from or transmitted through a pile of plates",
    // Proc. R. Soc. 11: for N non-absorbing plates T = (1 − ρ)/(1 + (2N − 1)ρ); with light between plates lost,
    // T = ((1 − ρ)/(1 + ρ))^N.
    const rho = surfaceReflectance(1.5);
    for (const N of [1, 2, 3, 5]) {
      const plates = Array.from({ length: N }, (_, k) =>
        filterElement(flat(1, `clear ${k}`), { refractiveIndex: 1.5 }),
      );
      const withIr = stackTransmittance(plates, { join: "air gaps with interreflection" });
      expect(withIr.values[0]).toBeCloseTo((1 - rho) / (1 + (2 * N - 1) * rho), 12);
      const lost = stackTransmittance(plates, { join: "air gaps" });
      expect(lost.values[0]).toBeCloseTo(((1 - rho) / (1 + rho)) ** N, 12);
      const cemented = stackTransmittance(plates, { join: "cemented" });
      expect(cemented.values[0]).toBeCloseTo((1 - rho) / (1 + rho), 12);
    }
  });

  const fractionTriple = fc.tuple(
    fc.double({ min: 0, max: 1, noNaN: true }),
    fc.double({ min: 0, max: 1, noNaN: true }),
    fc.double({ min: 0, max: 1, noNaN: true }),
  );

  it("does not depend on the order of elements when no light returns between them", () => {
    // Source: products commute; for "cemented" the outer faces are the same glass (Beer–Lambert + plate relation).
    fc.assert(
      fc.property(fc.array(fractionTriple, { minLength: 1, maxLength: 5 }), (taus) => {
        const els = taus.map((t, k) =>
          filterElement(spectrum(grid3, t, { name: `f${k}` }), { refractiveIndex: 1.52 }),
        );
        const reversed = [...els].reverse();
        const rotated = [...els.slice(1), els[0]!];
        for (const join of ["no surface losses", "cemented", "air gaps"] as StackJoin[]) {
          const a = stackTransmittance(els, { join }).values;
          for (const other of [reversed, rotated]) {
            stackTransmittance(other, { join }).values.forEach((v, i) => expect(v).toBeCloseTo(a[i]!, 12));
          }
        }
      }),
    );
  });

  it("with interreflection: reversing the stack does not change T, but reordering absorbers can", () => {
    // Source: reciprocity of incoherent layered media (Stokes 1862 relations; Kubelka 1954 part II): T is the same
    // from either side. A permutation that moves an absorber between two reflectors changes T.
    fc.assert(
      fc.property(
        fc.array(fractionTriple, { minLength: 2, maxLength: 5 }),
        fc.array(fc.double({ min: 1.3, max: 2.4, noNaN: true }), { minLength: 5, maxLength: 5 }),
        (taus, ns) => {
          const els = taus.map((t, k) =>
            filterElement(spectrum(grid3, t, { name: `f${k}` }), { refractiveIndex: ns[k]! }),
          );
          const a = stackTransmittance(els, { join: "air gaps with interreflection" }).values;
          stackTransmittance([...els].reverse(), { join: "air gaps with interreflection" }).values.forEach(
            (v, i) => expect(v).toBeCloseTo(a[i]!, 12),
          );
        },
      ),
    );
    const clearHigh = filterElement(flat(1, "clear n=2.4"), { refractiveIndex: 2.4 });
    const absorber = filterElement(flat(0.3, "absorber"), { refractiveIndex: 1.0001 });
    const apart = stackTransmittance([clearHigh, absorber, clearHigh], {
      join: "air gaps with interreflection",
    }).values[0]!;
    const together = stackTransmittance([clearHigh, clearHigh, absorber], {
      join: "air gaps with interreflection",
    }).values[0]!;
    expect(Math.abs(apart - together)).toBeGreaterThan(1e-3);
  });

  it("builds elements from measured transmittance and refuses mismatched grids", () => {
    // Source: plate relation (Hecht §4.6): one measured plate alone, re-stacked with "air gaps", gives its measurement back.
    const measured = spectrum(grid3, [0.1, 0.4, 0.85], {
      name: "invented green glass",
      quantity: "transmittance",
    });
    const el = filterElementFromMeasurement(measured, { refractiveIndex: 1.52 });
    stackTransmittance([el], { join: "air gaps" }).values.forEach((v, i) =>
      expect(v).toBeCloseTo(measured.values[i]!, 12),
    );
    const other = filterElement(spectrum([450, 560, 650], [1, 1, 1], { name: "other grid" }), {
      refractiveIndex: 1.5,
    });
    expect(() => stackTransmittance([el, other], { join: "air gaps" })).toThrow(/different wavelengths/);
    expect(() => stackTransmittance([], { join: "air gaps" })).toThrow(
      /stackTransmittance: elements should be an array of at least 1 filter elements .*, but got an empty array/,
    );
    expect(() => stackTransmittance([el], { join: "glued" as StackJoin })).toThrow(
      /options.join should be how the elements are joined: one of .*"air gaps".*but got a string \("glued"\)/,
    );
  });
});

describe("parametric filters", () => {
  it("makes ideal edges and band-passes", () => {
    // Source: definition of an ideal (rectangular) band-pass: peak inside the 50 % points, floor outside (common practice, no source).
    const bp = bandPassFilter(550, 40, { peak: 0.9, floor: 0.01 });
    const at = (w: number) => bp.values[bp.wavelengths.indexOf(w)]!;
    expect(at(550)).toBe(0.9);
    expect(at(529)).toBe(0.01);
    expect(at(571)).toBe(0.01);
    expect(longPassFilter(500).values[longPassFilter(500).wavelengths.indexOf(499)]).toBe(0);
    expect(shortPassFilter(500).values[shortPassFilter(500).wavelengths.indexOf(499)]).toBe(1);
  });

  it("gives a smoothed edge the stated 10 %–90 % width", () => {
    // Source: definition of the 10–90 % edge width used by the parametric model (common practice, no source).
    const lp = longPassFilter(600, { edgeWidth: 20 });
    const at = (w: number) => lp.values[lp.wavelengths.indexOf(w)]!;
    expect(at(590)).toBeCloseTo(0.1, 12);
    expect(at(600)).toBeCloseTo(0.5, 12);
    expect(at(610)).toBeCloseTo(0.9, 12);
    expect(() => longPassFilter(600, { peak: 90 })).toThrow(/percent/);
    expect(() => bandPassFilter(550, -3)).toThrow(
      /bandPassFilter: width should be a finite number in nm greater than 0, but got -3 nm/,
    );
  });
});

describe("sunglass filter category", () => {
  it("follows the ISO 12312-1 category limits and always carries the caution", () => {
    // Source: ISO 12312-1:2013 Table 1 (recalled from memory): cat 0 > 80–100 %, 1 > 43–80 %, 2 > 18–43 %,
    // 3 > 8–18 %, 4 > 3–8 %; each range excludes its lower limit.
    const cases: Array<[number, number | null]> = [
      [1, 0],
      [0.8001, 0],
      [0.8, 1],
      [0.4301, 1],
      [0.43, 2],
      [0.1801, 2],
      [0.18, 3],
      [0.0801, 3],
      [0.08, 4],
      [0.0301, 4],
      [0.03, null],
      [0.01, null],
    ];
    for (const [tv, cat] of cases) {
      const r = sunglassCategory(tv);
      expect(r.category, `τv = ${tv}`).toBe(cat);
      expect(r.caution).toBe(EYE_PROTECTION_CAUTION);
      expect(r.caution).toMatch(/does not certify eye protection/);
    }
    // The use notes as recalled from memory (ISO 12312-1:2013, Table 1 and the road-use requirements); what a
    // customer's report prints cites the standard and its table, never "recalled from memory" (issue 17).
    expect(sunglassCategory(0.05).notes.join(" ")).toMatch(/not suitable for driving/);
    expect(sunglassCategory(0.05).notes.join(" ")).not.toMatch(/memory/);
    expect(() => sunglassCategory(35)).toThrow(/percent/);
    expect(() => sunglassCategory(Number.NaN)).toThrow(/NaN/);
  });
});

describe("light transmitted by a filter", () => {
  it("keeps the source's chromaticity through a neutral filter, with τv = 10^−D", () => {
    // Source: CIE 015:2018 §7.1 — a spectrally flat transmittance scales X, Y, Z alike, so xy is the illuminant's
    // white and Y/100 = τv; ISO 5-1: D = 0.5 ↔ T = 10^−0.5.
    const r = transmittedLight(neutralDensityFilter(0.5), { illuminant: "D65" });
    expect(r.luminousTransmittance).toBeCloseTo(10 ** -0.5, 10);
    expect(r.xy.x).toBeCloseTo(r.white.x, 10);
    expect(r.xy.y).toBeCloseTo(r.white.y, 10);
    expect(r.dominantWavelength).toBeNull();
    expect(r.notes.join(" ")).toMatch(/no dominant wavelength/);
    expect(filterSunglassCategory(neutralDensityFilter(0.5)).category).toBe(2);
    expect(filterSunglassCategory(neutralDensityFilter(0.5)).caution).toBe(EYE_PROTECTION_CAUTION);
  });

  it("gives a narrow band-pass its centre as dominant wavelength, with high purity", () => {
    // Source: CIE 015:2018 §9.1–9.2 — light of a narrow band lies near the spectrum locus at that wavelength, so its
    // dominant wavelength is the band's centre and its excitation purity is close to 1. A blue-green-cut filter
    // (magenta) is a purple: it has a complementary wavelength instead.
    const narrow = transmittedLight(bandPassFilter(580, 4, { grid: { start: 360, end: 830, step: 0.5 } }));
    expect(narrow.dominantWavelength!).toBeCloseTo(580, 0);
    expect(narrow.complementary).toBe(false);
    expect(narrow.purity).toBeGreaterThan(0.95);
    const band = bandPassFilter(540, 80, { edgeWidth: 10 });
    const magenta = transmittedLight(
      spectrum(
        band.wavelengths,
        band.values.map((v) => 0.9 - 0.85 * v),
        { name: "invented notch", quantity: "transmittance" },
      ),
    );
    expect(magenta.complementary).toBe(true);
    expect(magenta.dominantWavelength!).toBeGreaterThan(500);
    expect(magenta.dominantWavelength!).toBeLessThan(570);
    expect(() =>
      transmittedLight(spectrum([400, 700], [0.5, 0.5], { name: "a tile", quantity: "reflectance" })),
    ).toThrow(/not a transmittance/);
  });

  const ref = new URL("../../../../shared/reference/", import.meta.url);
  const d65File = new URL("cie_std_illum_d65_1nm.csv", ref);
  const vFile = new URL("cie_sle_photopic_1nm.csv", ref);
  it.skipIf(!existsSync(d65File) || !existsSync(vFile))(
    "matches τv summed directly from the CIE D65 and V(λ) dataset files",
    () => {
      // Source: CIE D65 (DOI 10.25039/CIE.DS.hjfjmt59) and V(λ) (DOI 10.25039/CIE.DS.dktna2s3) 1 nm files in
      // /work/shared/reference; τv = Σ S(λ)τ(λ)V(λ) / Σ S(λ)V(λ) (ISO/CIE 11664-3; ISO 12312-1's τv definition).
      const table = (file: URL) =>
        new Map(
          readFileSync(file, "utf8")
            .trim()
            .split("\n")
            .slice(1)
            .map((l) => l.split(",").map(Number) as [number, number]),
        );
      const S = table(d65File);
      const V = table(vFile);
      const filter = longPassFilter(520, { edgeWidth: 40, peak: 0.45, floor: 0.02 });
      let num = 0;
      let den = 0;
      filter.wavelengths.forEach((w, i) => {
        const s = S.get(w)! * V.get(w)!;
        num += s * filter.values[i]!;
        den += s;
      });
      const r = transmittedLight(filter);
      expect(r.luminousTransmittance).toBeCloseTo(num / den, 6);
      expect(filterSunglassCategory(filter).category).toBe(sunglassCategory(num / den).category);
    },
  );
});
