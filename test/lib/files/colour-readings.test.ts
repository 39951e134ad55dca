/**
 * The reader of colorimetric readings against invented files of the corpus (test/lib/files/corpus): every record
 * with every field, typed and with its unit, the common header spellings, metadata and CGATS keywords and data
 * sets. Values are checked against csv-parse reading the same cells (an outside, general-purpose CSV parser).
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { DataFileError, parseColourReadings, readColourReadings } from "../../../lib/index.ts";
import { recogniseFields } from "../../../lib/files/reading-fields.ts";

const corpus = (name: string) => fileURLToPath(new URL(`./corpus/${name}`, import.meta.url));

describe("tables of colorimetric readings", () => {
  it("CIELAB and LCh with star and degree spellings, tab-separated, metadata kept", () => {
    const r = readColourReadings(corpus("readings-lab-lch.tsv"));
    expect(r.format).toBe("delimited");
    expect(r.metadata).toEqual({ Operator: "nobody (invented)" });
    expect(r.fields.map((f) => `${f.group}.${f.component}`)).toEqual([
      "sample name.name",
      "Lab.L",
      "Lab.a",
      "Lab.b",
      "LCh.C",
      "LCh.h",
    ]);
    expect(r.fields.find((f) => f.component === "h")!.unit).toBe("°");
    expect(r.records[0]).toMatchObject({
      name: "chip 1",
      line: 4,
      Lab: { L: 50.5, a: 10.25, b: -20.5 },
      LCh: { L: 50.5, C: 22.92, h: 296.6 },
    });
    expect(r.records[1]!.values["b*"]).toBe(15);
  });

  it("CGATS-style names in CSV: sample ID and name, CMYK, x y with Y and its unit, an unrecognised text column", () => {
    const r = readColourReadings(corpus("readings-cmyk-xyy.csv"));
    const ref = parse(readFileSync(corpus("readings-cmyk-xyy.csv"), "utf8"), {
      comment: "#",
      columns: true,
    }) as Record<string, string>[];
    expect(r.records).toHaveLength(ref.length);
    r.records.forEach((rec, i) => {
      for (const [k, v] of Object.entries(ref[i]!)) {
        const f = r.fields.find((x) => x.name === k)!;
        expect(rec.values[k]).toEqual(f.type === "number" ? Number(v) : v);
      }
    });
    expect(r.records[0]).toMatchObject({
      id: "1",
      name: "patch, cyan",
      CMYK: { C: 100, M: 0, Y: 0, K: 0 },
      xyY: { x: 0.1901, y: 0.2512, Y: 25.1 },
    });
    const Y = r.fields.find((f) => f.name === "Y (cd/m²)")!;
    expect([Y.group, Y.unit, Y.unitSource]).toEqual(["xyY", "cd/m²", "heading"]);
    expect(r.fields.find((f) => f.name === "gloss")!.type).toBe("text");
  });

  it("XYZ with spectral columns, semicolons and decimal commas below an unmarked preamble", () => {
    const r = readColourReadings(corpus("readings-spectral-semicolon.csv"), { units: { XYZ: "cd/m²" } });
    expect(r.metadata).toEqual({ Instrument: "invented bench" });
    expect(r.records[0]).toMatchObject({
      name: "A",
      XYZ: { X: 41.2, Y: 35.75, Z: 20.1 },
      spectral: { wavelengths: [400, 410, 420], values: [12.5, 13.25, 14] },
    });
    expect(r.fields.find((f) => f.name === "X")).toMatchObject({ unit: "cd/m²", unitSource: "option" });
    expect(r.inferred.join(" ")).toMatch(/semicolon.*decimal mark \(comma\)/);
  });

  it("CGATS with two data sets: every field, keywords per set, RGB kept", () => {
    const r = readColourReadings(corpus("readings-two-sets.cgats.txt"));
    expect(r.format).toBe("CGATS");
    expect(r.tables).toHaveLength(2);
    expect(r.tables[0]!.keywords).toMatchObject({ ORIGINATOR: "invented for tristim tests", BENCH: "B2" });
    expect(r.tables[1]!.keywords.DESCRIPTOR).toBe("second set, xyY and LCh");
    expect(r.records[0]).toMatchObject({
      id: "1",
      name: "red",
      RGB: { R: 255, G: 0, B: 0 },
      XYZ: { X: 41.24, Y: 21.26, Z: 1.93 },
      Lab: { L: 53.24, a: 80.09, b: 67.2 },
    });
    expect(r.tables[1]!.records[0]).toMatchObject({
      id: "g1",
      xyY: { x: 0.3, y: 0.6, Y: 71.5 },
      LCh: { L: 87.7, C: 119.8, h: 136 },
    });
  });

  it("recognises the common spellings of each quantity", () => {
    const groups = (names: string[]) => recogniseFields(names).map((f) => `${f.group}.${f.component}`);
    expect(groups(["XYZ_X", "XYZ_Y", "XYZ_Z"])).toEqual(["XYZ.X", "XYZ.Y", "XYZ.Z"]);
    expect(groups(["X", "Y", "Z", "x", "y"])).toEqual(["XYZ.X", "XYZ.Y", "XYZ.Z", "xyY.x", "xyY.y"]);
    expect(groups(["LAB_L", "LAB_A", "LAB_B"])).toEqual(["Lab.L", "Lab.a", "Lab.b"]);
    expect(groups(["CIE L*", "CIE a*", "CIE b*"])).toEqual(["Lab.L", "Lab.a", "Lab.b"]);
    expect(groups(["RGB_R", "RGB_G", "RGB_B"])).toEqual(["RGB.R", "RGB.G", "RGB.B"]);
    expect(groups(["C", "M", "Y", "K"])).toEqual(["CMYK.C", "CMYK.M", "CMYK.Y", "CMYK.K"]);
    expect(groups(["Sample ID", "Sample Name", "SPECTRAL_NM380", "SPECTRAL_NM390"])).toEqual([
      "sample id.id",
      "sample name.name",
      "spectral.380",
      "spectral.390",
    ]);
  });

  it("refuses a blank or non-numeric reading, naming file, line, sample and field; unknown options are refused", () => {
    let e: unknown;
    try {
      readColourReadings(corpus("readings-bad-value.csv"));
    } catch (x) {
      e = x;
    }
    expect(e).toBeInstanceOf(DataFileError);
    expect((e as DataFileError).line).toBe(4);
    expect((e as DataFileError).sample).toBe("B");
    expect((e as Error).message).toBe(
      `${corpus("readings-bad-value.csv")}, line 4: sample "B", field Y: no value (blank)`,
    );
    expect(() => parseColourReadings("name,X,Y,Z\na,1,2,x\n")).toThrow(
      /line 2: sample "a", field Z: "x" is not a number/,
    );
    // A misspelt option is the caller's fault: an ArgumentError naming the reader, in the library's words ("valid
    // options are", which replaced the reader's own "the options are").
    expect(() => parseColourReadings("X,Y,Z\n1,2,3\n", { unit: "cd" } as never)).toThrow(
      /^parseColourReadings: options should be .*unknown option "unit"; valid options are encoding, format/,
    );
    expect(() =>
      readColourReadings(corpus("readings-cmyk-xyy.csv"), { units: { xyz: "cd/m²" } } as never),
    ).toThrow(/^readColourReadings: options.units should be .*unknown option "xyz"; valid options are .*XYZ/);
    expect(() => parseColourReadings("X,Y,Z\n1,2,3\n", { format: "csv" } as never)).toThrow(
      /^parseColourReadings: options.format should be one of "CGATS", "delimited", "auto", but got a string \("csv"\)/,
    );
  });
});
