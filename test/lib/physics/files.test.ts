import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  cgatsLab,
  cgatsSpectra,
  cgatsSpectralFields,
  cgatsTristimulus,
  DataFileError,
  formatCgats,
  formatSpectraCsv,
  parseCgats,
  parseCgatsSpectra,
  parseSpectraCsv,
  readCgatsSpectra,
  readSpectraCsv,
  spectrum,
  writeSpectraCsv,
  type CsvDelimiter,
} from "../../../lib/index.ts";

/** Expects a DataFileError on the given line whose message matches. */
function expectLineError(f: () => unknown, line: number, pattern: RegExp): void {
  let caught: unknown;
  try {
    f();
  } catch (e) {
    caught = e;
  }
  expect(caught, "an error was expected").toBeInstanceOf(DataFileError);
  expect((caught as DataFileError).line).toBe(line);
  expect((caught as Error).message).toMatch(pattern);
}

// Invented example tables (not measurements).
const commaCsv = [
  "# invented example, transmittance in percent",
  "wavelength_nm,Filter A,Filter B",
  "400,10.5,80",
  "410,12.25,81.5",
  "420,15,82",
].join("\n");

describe("spectral CSV/TSV", () => {
  it("reads a comma table with comments, and reports the inferred separator, decimal mark and percent", () => {
    // Source: RFC 4180 comma-separated layout; the numbers are those written in the text above.
    const r = parseSpectraCsv(commaCsv, { quantity: "transmittance" });
    expect(r.spectra.map((s) => s.name)).toEqual(["Filter A", "Filter B"]);
    expect(r.spectra[0]!.wavelengths).toEqual([400, 410, 420]);
    expect(r.spectra[0]!.values).toEqual([0.105, 0.1225, 0.15]);
    expect(r.spectra[1]!.quantity).toBe("transmittance");
    expect(r.scale).toBe("percent");
    // The comment line says "in percent", so the scale is taken from the file's own text (and said so).
    expect(r.inferred.join(" ")).toMatch(
      /separator \(comma\) was inferred.*decimal mark was taken to be a point.*read as percent and divided by 100, as the file says on line 1/,
    );
    const unmarked = parseSpectraCsv(commaCsv.replace(", transmittance in percent", ""), {
      quantity: "transmittance",
    });
    expect(unmarked.inferred.join(" ")).toMatch(/as inferred from the values \(the largest is 82/);
    expect(r.comments).toEqual(["invented example, transmittance in percent"]);
  });

  it("reads the same numbers from semicolons with decimal commas and from tabs", () => {
    // Source: the common European spreadsheet export (semicolon fields, decimal comma) and TSV carry the same table.
    const semi = commaCsv.replace(/,/g, ";").replace(/(\d)\.(\d)/g, "$1,$2");
    const tabs = commaCsv.replace(/,/g, "\t");
    const ref = parseSpectraCsv(commaCsv, { quantity: "transmittance" }).spectra;
    for (const [text, d, dec] of [
      [semi, ";", ","],
      [tabs, "\t", "."],
    ] as const) {
      const r = parseSpectraCsv(text, { quantity: "transmittance" });
      expect(r.delimiter).toBe(d);
      expect(r.decimal).toBe(dec);
      r.spectra.forEach((s, i) => expect(s.values).toEqual(ref[i]!.values));
    }
  });

  it("honours RFC 4180 quoting in sample names", () => {
    // Source: RFC 4180 §2.6–2.7: fields with separators or quotes are enclosed in quotes, inner quotes doubled.
    const text = 'nm,"Tile 3, glossy","Tile ""B"""\n500,0.5,0.25\n510,0.55,0.3\n';
    const r = parseSpectraCsv(text, { quantity: "reflectance", scale: "fraction" });
    expect(r.spectra.map((s) => s.name)).toEqual(["Tile 3, glossy", 'Tile "B"']);
    expect(r.inferred.some((s) => /read as fractions/.test(s))).toBe(false);
    const out = formatSpectraCsv(r.spectra);
    expect(out.split("\n")[0]).toBe('wavelength_nm,"Tile 3, glossy","Tile ""B"""');
  });

  it("says when fractions were inferred, and keeps other quantities as written", () => {
    // Source: the library's rule that a unit inferred from values is reported (issue requirement); values as written above.
    const r = parseSpectraCsv("nm,s\n500,0.5\n510,0.6\n", { quantity: "reflectance" });
    expect(r.scale).toBe("fraction");
    expect(r.inferred.join(" ")).toMatch(/read as fractions, as inferred from the values/);
    const p = parseSpectraCsv("nm,lamp\n500,55\n510,60\n", { quantity: "relative power" });
    expect(p.scale).toBe("as written");
    expect(p.spectra[0]!.values).toEqual([55, 60]);
  });

  it("gives errors with line numbers for malformed tables", () => {
    // Source: issue requirement — a malformed file gives an error with its line number (lines counted from 1, comments included).
    expectLineError(
      () => parseSpectraCsv("# c\nnm,a\n400,0.5\n410,abc\n", { quantity: "reflectance" }),
      4,
      /sample "a" at 410 nm: "abc", which is not a number/,
    );
    expectLineError(
      () => parseSpectraCsv("nm,a,b\n400,0.5,0.5\n410,0.5\n", { quantity: "reflectance" }),
      3,
      /sample "b" has no value at 410 nm: the row has 2 fields but the header has 3/,
    );
    expectLineError(
      () => parseSpectraCsv("nm,a\n400,0.5\n400,0.6\n", { quantity: "reflectance" }),
      3,
      /wavelength 400 nm is repeated \(line 2 and line 3\)/,
    );
    expectLineError(
      () => parseSpectraCsv("nm;a\n400;0,5\n410;0.6\n", { quantity: "reflectance" }),
      3,
      /"0.6", which is not a number \(it has a decimal point but the file uses decimal commas/,
    );
    expectLineError(
      () => parseSpectraCsv("nm;a\n400;0,5\n410;\n", { quantity: "reflectance" }),
      3,
      /at 410 nm: no value \(blank\)/,
    );
    expectLineError(
      () => parseSpectraCsv("nm,a,a\n400,0.5,0.5\n", { quantity: "reflectance" }),
      1,
      /"a" appears twice/,
    );
    expect(() => parseSpectraCsv("patch,X\nred,98.6\n", { quantity: "reflectance" })).toThrow(
      /no spectral table found/,
    );
    expectLineError(
      () => parseSpectraCsv("nm,a\n50,0.5\n60,0.5\n", { quantity: "reflectance" }),
      2,
      /wavelength 50 nm is not plausible/,
    );
    // Small values without a unit in the heading are micrometres (stated).
    const um = parseSpectraCsv("wl,a\n0.4,0.5\n0.5,0.5\n", { quantity: "reflectance" });
    expect(um.spectra[0]!.wavelengths).toEqual([400, 500]);
    expect(um.inferred.join(" ")).toMatch(/unit \(µm\) was inferred from the values/);
    expectLineError(
      () => parseSpectraCsv('nm,a\n400,"0.5\n', { quantity: "reflectance" }),
      2,
      /quoted field opened at column 5 is not closed on this line/,
    );
    expect(() => parseSpectraCsv(commaCsv, {} as never)).toThrow(/state what the columns hold/);
    expect(() =>
      parseSpectraCsv("nm,a\n400,0.5\n", { quantity: "reflectance", delimiter: ",", decimal: "," }),
    ).toThrow(/decimal comma cannot be used with comma-separated/);
    expect(() => parseSpectraCsv("just one column\n400\n", { quantity: "reflectance" })).toThrow(
      /no spectral table found/,
    );
  });

  it("round-trips through the writer for every separator and decimal mark", () => {
    // Source: RFC 4180 layout; with 17 significant digits every double is written exactly (IEEE 754 round trip).
    const layouts: Array<[CsvDelimiter, "." | ","]> = [
      [",", "."],
      [";", ","],
      [";", "."],
      ["\t", ","],
      ["\t", "."],
    ];
    fc.assert(
      fc.property(
        fc.array(fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 4, maxLength: 4 }), {
          minLength: 1,
          maxLength: 4,
        }),
        fc.constantFrom(...layouts),
        (cols, [delimiter, decimal]) => {
          const spectra = cols.map((v, i) =>
            spectrum([400, 450.5, 500, 700], v, { name: `s${i}`, quantity: "reflectance" }),
          );
          const text = formatSpectraCsv(spectra, { delimiter, decimal, digits: 17 });
          const back = parseSpectraCsv(text, {
            quantity: "reflectance",
            scale: "fraction",
            delimiter,
            decimal,
            unevenGrid: "accept", // 400, 450.5, 500, 700 nm on purpose
          });
          back.spectra.forEach((s, i) => {
            expect(s.wavelengths).toEqual(spectra[i]!.wavelengths);
            s.values.forEach((v, k) => expect(v).toBe(spectra[i]!.values[k]));
          });
        },
      ),
    );
    expect(() =>
      formatSpectraCsv([spectrum([1, 2], [1, 2], { name: "lamp", quantity: "relative power" })], {
        scale: "percent",
      }),
    ).toThrow(/only reflectance and transmittance/);
    expect(() => formatSpectraCsv([spectrum([400], [0.1], { name: "x" })], { decimal: "," })).toThrow(
      /decimal comma needs/,
    );
  });

  it("reads and writes files by path, naming the file in errors", () => {
    // Source: issue requirement — file readers take a path; errors carry the file and line.
    const dir = mkdtempSync(join(tmpdir(), "tristim-files-"));
    const good = join(dir, "good.csv");
    writeSpectraCsv(good, [spectrum([400, 500], [0.1, 0.2], { name: "x", quantity: "reflectance" })], {
      scale: "percent",
      comments: ["invented"],
    });
    const r = readSpectraCsv(good, { quantity: "reflectance", scale: "percent" });
    expect(r.spectra[0]!.values[1]).toBeCloseTo(0.2, 15);
    expect(r.comments).toEqual(["invented"]);
    const bad = join(dir, "bad.csv");
    writeFileSync(bad, "nm,a\n400,0.1\n500,x\n");
    expect(() => readSpectraCsv(bad, { quantity: "reflectance" })).toThrow(
      new RegExp(`${bad.replace(/[.*+?^${}()|[\]\\/]/g, "\\$&")}, line 3: sample "a"`),
    );
    expect(() => readSpectraCsv(join(dir, "missing.csv"), { quantity: "reflectance" })).toThrow(
      /missing\.csv: cannot read the file/,
    );
  });
});

// An invented CGATS.17 example (not a measurement): two patches with spectral, XYZ and Lab fields.
const cgatsText = [
  "CGATS.17",
  'ORIGINATOR "invented example"',
  'DESCRIPTOR "two invented patches"  # a trailing comment',
  'KEYWORD "PATCH_SIZE"',
  "PATCH_SIZE 6",
  "NUMBER_OF_FIELDS 9",
  "BEGIN_DATA_FORMAT",
  "SAMPLE_ID SAMPLE_NAME SPECTRAL_NM400 SPECTRAL_NM500",
  "SPECTRAL_NM600 XYZ_X XYZ_Y XYZ_Z LAB_L",
  "END_DATA_FORMAT",
  "NUMBER_OF_SETS 2",
  "BEGIN_DATA",
  '1 "pale blue" 62.5 55.1 40.2 48.1 50.2 70.4 76.2',
  '2 "warm grey" 30.0 31.5 33.9 30.2 31.0 27.8 62.5',
  "END_DATA",
].join("\n");

describe("CGATS.17 text", () => {
  it("reads keywords, fields, sample identifiers and spectral and XYZ values", () => {
    // Source: the CGATS.17 layout (identifier, keywords, BEGIN_DATA_FORMAT/END_DATA_FORMAT, BEGIN_DATA/END_DATA);
    // the numbers are those written in the invented text above.
    const file = parseCgats(cgatsText);
    expect(file.identifier).toBe("CGATS.17");
    const t = file.tables[0]!;
    expect(t.keywords.DESCRIPTOR).toBe("two invented patches");
    expect(t.declared).toEqual(["PATCH_SIZE"]);
    expect(t.fields).toHaveLength(9);
    expect(file.comments).toEqual(["a trailing comment"]);
    expect(cgatsSpectralFields(t).map((f) => f.wavelength)).toEqual([400, 500, 600]);
    const s = cgatsSpectra(file, { quantity: "reflectance" });
    expect(s.spectra.map((x) => x.name)).toEqual(["pale blue", "warm grey"]);
    expect(s.spectra[0]!.values).toEqual([0.625, 0.551, 0.402]);
    expect(s.inferred.join(" ")).toMatch(/read as percent and divided by 100, as inferred/);
    expect(cgatsTristimulus(t)[1]).toEqual({ id: "warm grey", XYZ: { X: 30.2, Y: 31.0, Z: 27.8 } });
    expect(() => cgatsLab(t)).toThrow(/missing LAB_A, LAB_B/);
  });

  it("round-trips spectra, XYZ and Lab through the writer", () => {
    // Source: CGATS.17 layout; 17 significant digits write every double exactly (IEEE 754 round trip).
    fc.assert(
      fc.property(
        fc.array(
          fc.tuple(
            fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 3, maxLength: 3 }),
            fc.double({ min: 0, max: 100, noNaN: true }),
          ),
          { minLength: 1, maxLength: 5 },
        ),
        (rows) => {
          const spectra = rows.map(([v], i) =>
            spectrum([380, 385.5, 390], v, { name: `p${i}`, quantity: "reflectance" }),
          );
          const XYZ = rows.map(([, y]) => ({ X: y * 0.95, Y: y, Z: y * 1.09 }));
          const Lab = rows.map(([, y]) => ({ L: y, a: 0 - y / 7 + 0, b: y / 3 })); // + 0 turns −0 into 0, which text cannot tell apart
          const text = formatCgats({
            spectra,
            XYZ,
            Lab,
            sampleIds: spectra.map((s) => s.name),
            keywords: { ORIGINATOR: "tristim test", CREATED: "2026-12-01", LOT: "invented 7" },
            digits: 17,
          });
          const file = parseCgats(text);
          const back = cgatsSpectra(file, { quantity: "reflectance", scale: "fraction" }).spectra;
          back.forEach((s, i) => {
            expect(s.name).toBe(`p${i}`);
            expect(s.wavelengths).toEqual([380, 385.5, 390]);
            s.values.forEach((v, k) => expect(v).toBe(spectra[i]!.values[k]));
          });
          expect(cgatsTristimulus(file.tables[0]!).map((r) => r.XYZ)).toEqual(XYZ);
          expect(cgatsLab(file.tables[0]!).map((r) => r.Lab)).toEqual(Lab);
          expect(file.tables[0]!.declared).toEqual(["LOT"]);
        },
      ),
      { numRuns: 50 },
    );
    expect(() => formatCgats({ XYZ: [{ X: 1, Y: 1, Z: 1 }], sampleIds: ["a", "b"] })).toThrow(
      /one entry per sample/,
    );
    expect(() => formatCgats({ XYZ: [{ X: 1, Y: 1, Z: 1 }], keywords: { DESCRIPTOR: 'say "hi"' } })).toThrow(
      /double quote/,
    );
  });

  it("gives errors with line numbers for malformed files", () => {
    // Source: issue requirement — a malformed file gives an error with its line number; the CGATS.17 structure rules.
    const lines = cgatsText.split("\n");
    const edit = (i: number, text: string | null) =>
      lines.flatMap((l, k) => (k === i ? (text === null ? [] : [text]) : [l])).join("\n");
    expectLineError(
      () => parseCgats(edit(5, "NUMBER_OF_FIELDS 8")),
      6,
      /NUMBER_OF_FIELDS says 8 but the data format names 9/,
    );
    expectLineError(
      () => parseCgats(edit(10, "NUMBER_OF_SETS 3")),
      11,
      /NUMBER_OF_SETS says 3 but the data block has 2/,
    );
    expectLineError(
      () => parseCgats(edit(13, '2 "warm grey" 30.0 31.5 33.9 30.2 31.0 27.8')),
      14,
      /has 8 values but the data format names 9/,
    );
    expectLineError(
      () => parseCgats(edit(13, '2 "warm grey" 30,0 31.5 33.9 30.2 31.0 27.8 62.5')),
      14,
      /SPECTRAL_NM400 must be a number.*decimal point/,
    );
    expectLineError(
      () => parseCgats(edit(13, '2 "warm grey" "n/a" 31.5 33.9 30.2 31.0 27.8 62.5')),
      14,
      /SPECTRAL_NM400 must be a number, found the text/,
    );
    expectLineError(() => parseCgats(edit(14, null)), 14, /BEGIN_DATA on line 12 is never closed/);
    expectLineError(() => parseCgats(edit(2, 'DESCRIPTOR "unclosed')), 3, /not closed/);
    expectLineError(() => parseCgats(edit(0, 'ORIGINATOR "x"')), 1, /first line must be the file identifier/);
    expectLineError(
      () =>
        cgatsSpectra(parseCgats(edit(13, '1 "pale blue" 30.0 31.5 33.9 30.2 31.0 27.8 62.5')), {
          quantity: "reflectance",
        }),
      14,
      /"pale blue" appears twice \(lines 13 and 14\)/,
    );
    expect(() => parseCgatsSpectra(cgatsText, {} as never)).toThrow(/state what the spectral fields hold/);
  });

  const reference = new URL("../../../notebooks/data/blue-cut-plates.cgats.txt", import.meta.url);
  it("reads the project's demo CGATS file by path", () => {
    // Source: the values as written in notebooks/data/blue-cut-plates.cgats.txt (invented demo data; checked only
    // for faithful reading, not as a reference for any computation).
    const r = readCgatsSpectra(reference.pathname, { quantity: "transmittance" });
    expect(r.spectra.map((s) => s.name)).toEqual(["BC-07-A", "BC-07-B"]);
    expect(r.spectra[0]!.wavelengths[0]).toBe(380);
    expect(r.spectra[0]!.wavelengths.at(-1)).toBe(780);
    expect(r.spectra[0]!.values[0]).toBeCloseTo(0.3515, 15);
    expect(r.keywords.DESCRIPTOR).toMatch(/INVENTED DEMO DATA/);
  });
});
