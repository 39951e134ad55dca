import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  demichelAreas,
  effectiveCoverage,
  murrayDavies,
  murrayDaviesValue,
  neugebauerReflectance,
  primaryKey,
  spectrum,
  toneValueFromDensity,
  yuleNielsen,
  yuleNielsenValue,
  type NeugebauerPrimaries,
} from "../../../lib/index.ts";

const w = [450, 550, 650];
// Invented demo reflectances (not measurements) for paper, the inks and their overprints.
const paper = spectrum(w, [0.85, 0.88, 0.9], { name: "invented paper", quantity: "reflectance" });
const inv = (name: string, v: number[]) =>
  spectrum(w, v, { name: `invented ${name}`, quantity: "reflectance" });
const frac = fc.double({ min: 0, max: 1, noNaN: true });

describe("Murray–Davies and Yule–Nielsen", () => {
  it("Yule–Nielsen reduces to Murray–Davies at n = 1", () => {
    // Source: Yule & Nielsen (1951), TAGA Proc. 65: with n = 1 the n-factor equation is the Murray–Davies equation.
    fc.assert(
      fc.property(frac, frac, frac, (a, s, p) => {
        expect(yuleNielsenValue(a, s, p, 1)).toBeCloseTo(murrayDaviesValue(a, s, p), 14);
      }),
    );
    const cyan = inv("cyan solid", [0.6, 0.25, 0.05]);
    const md = murrayDavies(0.4, cyan, paper);
    yuleNielsen(0.4, cyan, paper, 1).values.forEach((v, i) => expect(v).toBeCloseTo(md.values[i]!, 14));
  });

  it("darkens halftones for n > 1 and tends to the geometric mean as n grows", () => {
    // Source: Yule & Nielsen (1951): lateral light scattering (n > 1) lowers the reflectance of a tint below the
    // Murray–Davies value (R^(1/n) is concave); for n → ∞ the model becomes R = R_s^a·R_p^(1−a) (the limit of the
    // power mean, a standard result of analysis).
    fc.assert(
      fc.property(
        fc.double({ min: 0.05, max: 0.95, noNaN: true }),
        fc.double({ min: 0.01, max: 0.5, noNaN: true }),
        fc.double({ min: 0.6, max: 1, noNaN: true }),
        fc.double({ min: 1.2, max: 8, noNaN: true }),
        (a, s, p, n) => {
          expect(yuleNielsenValue(a, s, p, n)).toBeLessThan(murrayDaviesValue(a, s, p));
        },
      ),
    );
    expect(yuleNielsenValue(0.3, 0.1, 0.9, 1e7)).toBeCloseTo(0.1 ** 0.3 * 0.9 ** 0.7, 5);
  });

  it("gives tone value from densities, recovering the coverage of a Murray–Davies tint", () => {
    // Source: Murray (1936); ISO 12647-1 tone value a = (1 − 10^(−D_t))/(1 − 10^(−D_s)) with densities relative to
    // paper; applied to a tint made by Murray–Davies it must return the coverage used.
    fc.assert(
      fc.property(
        frac,
        fc.double({ min: 0.01, max: 0.5, noNaN: true }),
        fc.double({ min: 0.6, max: 1, noNaN: true }),
        (a, s, p) => {
          const r = murrayDaviesValue(a, s, p);
          expect(toneValueFromDensity(-Math.log10(r / p), -Math.log10(s / p))).toBeCloseTo(a, 9);
        },
      ),
    );
    expect(() => toneValueFromDensity(1.6, 1.5)).toThrow(/outside paper/);
  });

  it("fits the effective coverage of a measured tint", () => {
    // Source: Yule–Nielsen (1951) solved for a in least squares; a tint built with coverage a and factor n must give a back.
    const cyan = inv("cyan solid", [0.6, 0.25, 0.05]);
    fc.assert(
      fc.property(frac, fc.double({ min: 1, max: 4, noNaN: true }), (a, n) => {
        expect(effectiveCoverage(yuleNielsen(a, cyan, paper, n), cyan, paper, n)).toBeCloseTo(a, 9);
      }),
    );
    expect(() => effectiveCoverage(paper, paper, paper)).toThrow(/same reflectance/);
  });
});

describe("spectral Neugebauer with Demichel areas", () => {
  it("gives Demichel's areas, which sum to one", () => {
    // Source: Demichel (1924): for independent dots, the area of each overprint is Π cᵢ over inks present × Π (1 − cᵢ) over the rest.
    const a = demichelAreas({ c: 0.3, m: 0.6 });
    expect(a).toEqual({ paper: 0.7 * 0.4, c: 0.3 * 0.4, m: 0.7 * 0.6, cm: 0.3 * 0.6 });
    fc.assert(
      fc.property(frac, frac, frac, frac, (c, m, y, k) => {
        const areas = demichelAreas({ c, m, y, k });
        expect(Object.keys(areas)).toHaveLength(16);
        expect(Object.values(areas).reduce((s, v) => s + v, 0)).toBeCloseTo(1, 12);
        expect(areas.cmyk).toBeCloseTo(c * m * y * k, 14);
      }),
    );
    expect(primaryKey(["y", "c"])).toBe("cy");
    expect(() => demichelAreas({})).toThrow(/at least one ink/);
    expect(() => demichelAreas({ c: 1.2 })).toThrow(
      /demichelAreas: coverages.c should be a fraction from 0 to 1.*but got the number 1.2/,
    );
    expect(() => demichelAreas({ c: 0.2, r: 0.1 } as never)).toThrow(
      /demichelAreas: coverages should be an options object with any of c, m, y, k, but got an object with keys c, r \(unknown option "r"/,
    );
  });

  const primaries: NeugebauerPrimaries = {
    paper,
    c: inv("C", [0.6, 0.25, 0.05]),
    m: inv("M", [0.45, 0.08, 0.75]),
    y: inv("Y", [0.06, 0.8, 0.85]),
    k: inv("K", [0.03, 0.03, 0.03]),
    cm: inv("CM", [0.3, 0.03, 0.04]),
    cy: inv("CY", [0.05, 0.22, 0.05]),
    my: inv("MY", [0.04, 0.07, 0.7]),
    cmy: inv("CMY", [0.03, 0.02, 0.03]),
  };
  const withK: Record<string, ReturnType<typeof spectrum>> = { ...primaries };
  for (const key of ["ck", "mk", "yk", "cmk", "cyk", "myk", "cmyk"])
    withK[key] = inv(key.toUpperCase(), [0.02, 0.02, 0.02]);

  it("reduces to Murray–Davies for one ink and reproduces its primaries at solid or zero coverage", () => {
    // Source: Neugebauer (1937) with Demichel areas: one ink leaves two primaries with areas 1 − c and c, i.e.
    // Murray–Davies; with all coverages 0 or 1 only one primary has area 1.
    const one = neugebauerReflectance({ c: 0.35 }, primaries);
    murrayDavies(0.35, primaries.c!, paper).values.forEach((v, i) =>
      expect(one.values[i]).toBeCloseTo(v, 14),
    );
    const yn = neugebauerReflectance({ c: 0.35 }, primaries, { n: 2 });
    yuleNielsen(0.35, primaries.c!, paper, 2).values.forEach((v, i) =>
      expect(yn.values[i]).toBeCloseTo(v, 14),
    );
    expect(neugebauerReflectance({ c: 1, m: 0, y: 1 }, primaries).values).toEqual(primaries.cy!.values);
    expect(neugebauerReflectance({ c: 0, m: 0, y: 0, k: 0 }, withK).values).toEqual(paper.values);
    expect(neugebauerReflectance({ c: 1, m: 1, y: 1, k: 1 }, withK).values).toEqual(withK.cmyk!.values);
  });

  it("is the Demichel-weighted sum for CMYK and refuses incomplete primaries", () => {
    // Source: Neugebauer (1937): R = Σ aᵢRᵢ with Demichel's areas aᵢ (Demichel 1924).
    const cov = { c: 0.2, m: 0.5, y: 0.7, k: 0.1 };
    const areas = demichelAreas(cov);
    const r = neugebauerReflectance(cov, withK);
    r.values.forEach((v, i) =>
      expect(v).toBeCloseTo(
        Object.entries(areas).reduce((s, [k, a]) => s + a * withK[k]!.values[i]!, 0),
        14,
      ),
    );
    expect(() => neugebauerReflectance(cov, primaries)).toThrow(/missing primaries "ck", "mk"/);
  });
});
