/**
 * The writers are the mirror of the readers: random tables (fast-check) written in every layout, separator and
 * decimal mark, then read back with only the quantity (and the scale) stated, give back identical names,
 * wavelengths, values, metadata and attributes. 17 significant digits write every IEEE 754 double exactly
 * (IEEE 754-2019 §5.12.2), so the values must come back bit for bit.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  formatCgats,
  formatSpectraCsv,
  parseColourReadings,
  parseSpectralTable,
  roundWavelength,
  spectrum,
  type FieldSeparator,
} from "../../../lib/index.ts";

const word = fc.stringMatching(/^[A-Za-z][A-Za-z0-9 ._-]{0,10}[A-Za-z0-9]$/);
const layouts: [FieldSeparator, "." | ","][] = [
  [",", "."],
  [";", ","],
  [";", "."],
  ["\t", ","],
  ["\t", "."],
  [" ", "."],
  [" ", ","],
];

const table = fc
  .record({
    start: fc.integer({ min: 300, max: 600 }),
    step: fc.constantFrom(0.5, 1, 2.5, 5, 10),
    count: fc.integer({ min: 2, max: 25 }),
    names: fc.uniqueArray(word, { minLength: 1, maxLength: 4 }),
    layout: fc.constantFrom(...layouts),
    across: fc.boolean(),
    metadata: fc.dictionary(
      fc.stringMatching(/^[A-Za-z][A-Za-z0-9 ]{0,8}[A-Za-z0-9]$/),
      fc.stringMatching(/^[A-Za-z0-9][A-Za-z0-9 ./-]{0,12}[A-Za-z0-9]$/),
      { maxKeys: 4 },
    ),
    lot: fc.stringMatching(/^[A-Za-z0-9-]{1,8}$/),
  })
  .chain((t) =>
    fc.record({
      t: fc.constant(t),
      values: fc.array(
        fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: t.count, maxLength: t.count }),
        {
          minLength: t.names.length,
          maxLength: t.names.length,
        },
      ),
    }),
  );

describe("spectral table writer and reader mirror each other", () => {
  it("random tables come back identical in every layout", () => {
    fc.assert(
      fc.property(table, ({ t, values }) => {
        const wavelengths = Array.from({ length: t.count }, (_, i) => roundWavelength(t.start + i * t.step));
        const spectra = t.names.map((name, k) =>
          spectrum(wavelengths, values[k]!, { name, quantity: "reflectance" }),
        );
        const [delimiter, decimal] = t.layout;
        const attributes = t.across
          ? t.names.map((name, k) => ({ sample: name, lot: `${t.lot}-${k}` }))
          : undefined;
        const text = formatSpectraCsv(spectra, {
          delimiter,
          decimal,
          digits: 17,
          metadata: t.metadata,
          wavelengthsIn: t.across ? "header row" : "first column",
          ...(attributes ? { attributes } : {}),
        });
        const back = parseSpectralTable(text, { quantity: "reflectance", scale: "fraction" });
        expect(back.delimiter).toBe(delimiter);
        expect(back.wavelengthsIn).toBe(t.across ? "header row" : "first column");
        expect(back.metadata).toEqual(t.metadata);
        expect(back.spectra.map((s) => s.name)).toEqual(t.names);
        back.spectra.forEach((s, k) => {
          expect(s.wavelengths).toEqual(wavelengths);
          s.values.forEach((v, i) => expect(Object.is(v, values[k]![i]! + 0)).toBe(true));
        });
        if (attributes) expect(back.attributes).toEqual(attributes);
      }),
      { numRuns: 150 },
    );
  });

  it("with decimals, writes no exponent and at most that many decimals, and reads back rounded to them", () => {
    // The rule (issue 17): 6 significant digits, at most 6 decimals; what rounds to 0 there is written as 0.
    // Reference: Number.prototype.toFixed (ECMA-262 §21.1.3.3) of each value, compared after reading back.
    const values = [6.3929e-75, 0.1234567, 0.0000004, 0.0000006, -0.0000001, 0.5];
    const s = spectrum([400, 410, 420, 430, 440, 450], values, {
      name: "invented",
      quantity: "relative power",
    });
    const text = formatSpectraCsv([s], { digits: 6, decimals: 6 });
    expect(text).not.toMatch(/e-?\d/i);
    expect(
      text
        .trim()
        .split("\n")
        .slice(1)
        .map((l) => l.split(",")[1]),
    ).toEqual(["0", "0.123457", "0", "0.000001", "0", "0.5"]);
    const back = parseSpectralTable(text, { quantity: "relative power" }).spectra[0]!.values;
    back.forEach((v, i) => expect(v).toBeCloseTo(Number(values[i]!.toFixed(6)), 12));
    expect(() => formatSpectraCsv([s], { decimals: 21 })).toThrow(
      /formatSpectraCsv: options\.decimals should be a whole number from 0 to 20, but got the number 21/,
    );
  });

  it("CGATS written by formatCgats reads back as readings with every field", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.double({ min: 0, max: 200, noNaN: true }),
            fc.double({ min: -100, max: 100, noNaN: true }),
          ),
          {
            minLength: 1,
            maxLength: 6,
          },
        ),
        (rows) => {
          const XYZ = rows.map(([y]) => ({ X: y * 0.9 + 0, Y: y + 0, Z: y * 1.1 + 0 }));
          const Lab = rows.map(([y, a]) => ({ L: y / 2 + 0, a: a + 0, b: -a + 0 }));
          const names = rows.map((_, i) => `patch ${i + 1}`);
          const text = formatCgats({
            XYZ,
            Lab,
            sampleNames: names,
            keywords: { ORIGINATOR: "tristim test" },
            digits: 17,
          });
          const r = parseColourReadings(text);
          expect(r.format).toBe("CGATS");
          expect(r.tables[0]!.keywords.ORIGINATOR).toBe("tristim test");
          expect(r.records.map((x) => x.name)).toEqual(names);
          expect(r.records.map((x) => x.XYZ)).toEqual(XYZ);
          expect(r.records.map((x) => x.Lab)).toEqual(Lab);
        },
      ),
      { numRuns: 50 },
    );
  });
});
