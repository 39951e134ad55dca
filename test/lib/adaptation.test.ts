/**
 * Chromatic adaptation (Bradford, CAT02, CAT16, von Kries), checked against colorjs.io's CAT definitions, culori's
 * D65 → D50 Bradford conversion, and the defining property that white maps to white.
 */
import { adapt as colorjsAdapt } from "colorjs.io/src/CATs.js";
import { converter } from "culori";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  adaptationMatrix,
  adaptXYZ,
  type AdaptationTransform,
} from "../../lib/adaptation/chromatic-adaptation.ts";
import { methodsUsed, resetMethodLog } from "../../lib/methods/method-log.ts";

const D65 = { X: 0.3127 / 0.329, Y: 1, Z: (1 - 0.3127 - 0.329) / 0.329 };
const D50 = { X: 0.3457 / 0.3585, Y: 1, Z: (1 - 0.3457 - 0.3585) / 0.3585 };
const A = { X: 1.0985, Y: 1, Z: 0.35585 }; // ASTM E308 illuminant A, 2° (see ../shared/reference white points)
const asArray = (w: { X: number; Y: number; Z: number }): [number, number, number] => [w.X, w.Y, w.Z];
const TRANSFORMS: [AdaptationTransform, string][] = [
  ["bradford", "Bradford"],
  ["cat02", "CAT02"],
  ["cat16", "CAT16"],
];

describe("chromatic adaptation", () => {
  it.each(TRANSFORMS)(
    "%s: the matrix equals colorjs.io's for D65 → D50, D50 → D65 and D65 → A",
    (ours, theirs) => {
      for (const [from, to] of [
        [D65, D50],
        [D50, D65],
        [D65, A],
      ] as const) {
        const m = adaptationMatrix(from, to, ours);
        const c = colorjsAdapt(asArray(from), asArray(to), theirs);
        for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(m[i]![j]!).toBeCloseTo(c[i]![j]!, 12);
      }
    },
  );

  it("von Kries: equals colorjs.io's 'von Kries' (whose HPE matrix is normalised to D65, which cancels out)", () => {
    const m = adaptationMatrix(D65, A, "von kries");
    const c = colorjsAdapt(asArray(D65), asArray(A), "von Kries");
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(m[i]![j]!).toBeCloseTo(c[i]![j]!, 4);
  });

  it("Bradford D65 → D50 equals culori's xyz65 → xyz50 conversion", () => {
    const toD50 = converter("xyz50");
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (x, y, z) => {
          const ours = adaptXYZ({ X: x, Y: y, Z: z }, D65, D50);
          const theirs = toD50({ mode: "xyz65", x, y, z });
          expect(ours.X).toBeCloseTo(theirs.x, 6);
          expect(ours.Y).toBeCloseTo(theirs.y, 6);
          expect(ours.Z).toBeCloseTo(theirs.z, 6);
        },
      ),
      { numRuns: 100 },
    );
  });

  it("the source white goes to the destination white, for every transform", () => {
    for (const t of ["bradford", "cat02", "cat16", "von kries"] as const) {
      const w = adaptXYZ({ X: D65.X * 80, Y: 80, Z: D65.Z * 80 }, D65, A, t);
      expect(w.X).toBeCloseTo(A.X * 80, 10);
      expect(w.Y).toBeCloseTo(80, 10);
      expect(w.Z).toBeCloseTo(A.Z * 80, 10);
    }
  });

  it("there and back is the identity (property, every transform, any degree of adaptation)", () => {
    fc.assert(
      fc.property(
        fc.record({
          X: fc.double({ min: 0, max: 120, noNaN: true }),
          Y: fc.double({ min: 0, max: 120, noNaN: true }),
          Z: fc.double({ min: 0, max: 120, noNaN: true }),
        }),
        fc.constantFrom<AdaptationTransform>("bradford", "cat02", "cat16", "von kries"),
        (xyz, t) => {
          const back = adaptXYZ(adaptXYZ(xyz, D65, A, t), A, D65, t);
          expect(back.X).toBeCloseTo(xyz.X, 9);
          expect(back.Y).toBeCloseTo(xyz.Y, 9);
          expect(back.Z).toBeCloseTo(xyz.Z, 9);
        },
      ),
      { numRuns: 200 },
    );
  });

  it("degree of adaptation 0 leaves the colour unchanged; 1 is complete", () => {
    const xyz = { X: 30, Y: 40, Z: 50 };
    const none = adaptXYZ(xyz, D65, A, "cat02", { degree: 0 });
    expect(none.X).toBeCloseTo(30, 12);
    expect(none.Z).toBeCloseTo(50, 12);
    const full = adaptXYZ(xyz, D65, A, "cat02", { degree: 1 });
    const def = adaptXYZ(xyz, D65, A, "cat02");
    expect(full).toEqual(def);
  });

  it("notes the transform for the Methods section", () => {
    resetMethodLog();
    adaptXYZ({ X: 30, Y: 40, Z: 50 }, D65, D50, "cat16");
    expect(methodsUsed().find((n) => n.topic === "chromatic adaptation")?.statement).toMatch(/CAT16/);
  });

  it("refuses bad input, naming the value", () => {
    expect(() => adaptXYZ({ X: NaN, Y: 1, Z: 1 }, D65, D50)).toThrow(/NaN/);
    expect(() => adaptXYZ({ X: 1, Y: 1, Z: 1 }, { X: 0, Y: 1, Z: 1 }, D50)).toThrow(
      /source white \(0, 1, 1\)/,
    );
    expect(() => adaptXYZ({ X: 1, Y: 1, Z: 1 }, D65, { X: 1, Y: Infinity, Z: 1 })).toThrow(/Infinity/);
    expect(() => adaptXYZ({ X: 1, Y: 1, Z: 1 }, D65, D50, "xyz scaling" as never)).toThrow(/xyz scaling/);
    expect(() => adaptXYZ({ X: 1, Y: 1, Z: 1 }, D65, D50, "cat02", { degree: 1.5 })).toThrow(/1.5/);
  });
});
