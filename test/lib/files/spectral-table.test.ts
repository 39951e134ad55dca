/**
 * The spectral-table reader against a corpus of invented instrument files (test/lib/files/corpus, see its README).
 * Each good file is checked for the sample names, grid and values it must give; the values are checked against
 * csv-parse (an outside, general-purpose CSV parser) reading the same cells, and the text encodings against Node's
 * own WHATWG TextDecoder. Each bad file is checked for the place (line, sample, wavelength) its error must name.
 */
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import {
  DataFileError,
  isArgumentError,
  methodsUsed,
  parseSpectralTable,
  readSpectralTable,
  resetMethodLog,
  valueAt,
} from "../../../lib/index.ts";
import { scanNumber, scanNumberRow } from "../../../lib/files/number-scan.ts";

const corpus = (name: string) => fileURLToPath(new URL(`./corpus/${name}`, import.meta.url));

/** The cells of a file as csv-parse reads them (the outside reference), from the row whose first cell is `first`. */
function referenceCells(name: string, encoding: string, delimiter: string, first: string): string[][] {
  const text = new TextDecoder(encoding).decode(readFileSync(corpus(name)));
  const rows = parse(text, {
    delimiter,
    bom: true,
    skip_empty_lines: true,
    comment: "#",
    trim: true,
    relax_column_count: true,
    relax_quotes: true,
  }) as string[][];
  const at = rows.findIndex((r) => r[0] === first);
  expect(at, `csv-parse finds the header row starting "${first}"`).toBeGreaterThanOrEqual(0);
  return rows.slice(at);
}

function refusal(f: () => unknown): DataFileError {
  try {
    f();
  } catch (e) {
    expect(e).toBeInstanceOf(DataFileError);
    return e as DataFileError;
  }
  throw new Error("the file was expected to be refused");
}

describe("spectral tables read with only the quantity stated", () => {
  it("a preamble without comment marks, a descending scan and percent stated in the metadata", () => {
    const r = readSpectralTable(corpus("descending-preamble.csv"), { quantity: "transmittance" });
    expect(r.spectra.map((s) => s.name)).toEqual(["Plate 1", "Plate 2"]);
    expect(r.spectra[0]!.wavelengths).toEqual([400, 450, 500, 550, 600, 650, 700]);
    expect(r.order).toBe("descending");
    expect(r.step).toBe(50);
    expect(r.headerLine).toBe(6);
    expect(r.metadata).toMatchObject({
      Instrument: "Bench spectrometer SX-1 (invented)",
      Operator: "A. Nobody",
    });
    expect(r.notes).toEqual(["Invented file for tristim tests"]);
    expect(r.scale).toBe("percent");
    expect(r.inferred.join(" ")).toMatch(
      /descending order and were sorted ascending.*as the file says on line 3/,
    );
    // Reference: csv-parse reads the cells from line 6; the reader's values are the same cells / 100, re-sorted.
    const ref = referenceCells("descending-preamble.csv", "utf-8", ",", "nm").slice(1);
    for (const row of ref) {
      const wl = Number(row[0]);
      expect(valueAt(r.spectra[0]!, wl)).toBeCloseTo(Number(row[1]) / 100, 15);
      expect(valueAt(r.spectra[1]!, wl)).toBeCloseTo(Number(row[2]) / 100, 15);
    }
  });

  it("Windows-1252 bytes with semicolons, decimal commas and %T in the metadata", () => {
    const r = readSpectralTable(corpus("latin1-semicolon.csv"), { quantity: "transmittance" });
    expect(r.encoding).toBe("windows-1252");
    expect(r.delimiter).toBe(";");
    expect(r.decimal).toBe(",");
    expect(r.spectra.map((s) => s.name)).toEqual(["Échantillon 1", "Échantillon 2"]);
    expect(r.metadata["Opérateur"]).toBe("Mélanie Testé");
    expect(r.scale).toBe("percent");
    expect(r.inferred.join(" ")).toMatch(
      /Windows-1252.*not valid UTF-8.*decimal mark \(comma\).*line 2 \("Mesure;%T"\)/,
    );
    // Reference: Node's TextDecoder("windows-1252") and csv-parse, with the decimal comma turned into a point.
    const ref = referenceCells("latin1-semicolon.csv", "windows-1252", ";", "Longueur d'onde (nm)");
    expect(ref[0]!.slice(1)).toEqual(r.spectra.map((s) => s.name));
    for (const row of ref.slice(1)) {
      expect(valueAt(r.spectra[1]!, Number(row[0]))).toBeCloseTo(Number(row[2]!.replace(",", ".")) / 100, 15);
    }
    expect(r.spectra[0]!.wavelengths).toHaveLength(16);
    expect(valueAt(r.spectra[0]!, 500)).toBeCloseTo(0.275, 15);
  });

  it("UTF-16 LE with byte-order mark, tabs, µm named in the heading", () => {
    const r = readSpectralTable(corpus("utf16le-bom.txt"), { quantity: "reflectance" });
    expect(r.encoding).toBe("utf-16le");
    expect(r.wavelengthUnit).toBe("µm");
    expect(r.spectra[0]!.name).toBe("Tile");
    expect(r.spectra[0]!.wavelengths[0]).toBe(400);
    expect(r.spectra[0]!.wavelengths.at(-1)).toBe(700);
    expect(r.step).toBe(10);
    expect(valueAt(r.spectra[0]!, 550)).toBeCloseTo(0.25, 15);
    const ref = referenceCells("utf16le-bom.txt", "utf-16le", "\t", "Wavelength (µm)").slice(1);
    ref.forEach((row, i) => expect(r.spectra[0]!.values[i]).toBe(Number(row[1])));
  });

  it("UTF-16 BE with byte-order mark, runs of spaces, µm inferred from the values", () => {
    const r = readSpectralTable(corpus("utf16be-spaces.txt"), { quantity: "reflectance" });
    expect(r.encoding).toBe("utf-16be");
    expect(r.delimiter).toBe(" ");
    expect(r.spectra.map((s) => s.name)).toEqual(["sA", "sB"]);
    expect(r.spectra[0]!.wavelengths).toHaveLength(81);
    expect(r.spectra[0]!.wavelengths[1]).toBe(385);
    expect(valueAt(r.spectra[0]!, 780)).toBeCloseTo(0.66, 15);
    expect(r.inferred.join(" ")).toMatch(/wavelength unit \(µm\) was inferred from the values/);
  });

  it("UTF-8 with byte-order mark, one sample per row, text columns kept as attributes", () => {
    const r = readSpectralTable(corpus("utf8-bom-across.csv"), { quantity: "transmittance" });
    expect(r.wavelengthsIn).toBe("header row");
    expect(r.spectra.map((s) => s.name)).toEqual(["T-01", "T-02", "T-03"]);
    expect(r.attributes[1]).toEqual({ ID: "T-02", Date: "2026-03-02", Operator: "invented op 2" });
    expect(r.spectra[2]!.wavelengths).toHaveLength(41);
    // Reference: csv-parse, row T-03, column of 500 nm.
    const ref = referenceCells("utf8-bom-across.csv", "utf-8", ",", "ID");
    const col = ref[0]!.indexOf("500");
    expect(valueAt(r.spectra[2]!, 500)).toBe(Number(ref[3]![col]));
  });

  it("one sample per row, tab-separated, wavelengths with nm in the header, descending", () => {
    const r = readSpectralTable(corpus("across-descending.tsv"), { quantity: "transmittance" });
    expect(r.spectra.map((s) => s.name)).toEqual(["filter red (invented)", "filter grey (invented)"]);
    expect(r.spectra[0]!.wavelengths).toEqual([
      400, 425, 450, 475, 500, 525, 550, 575, 600, 625, 650, 675, 700,
    ]);
    expect(r.order).toBe("descending");
    expect(valueAt(r.spectra[0]!, 700)).toBeCloseTo(1, 15);
    expect(valueAt(r.spectra[1]!, 425)).toBeCloseTo(0.3, 15);
  });

  it("sample names that end in a number are names, not wavelengths; percent is divided by 100", () => {
    // Invented table; 41.5 / 100 is the double nearest 0.415 (IEEE 754 division is correctly rounded).
    const r = parseSpectralTable(
      "Instrument: invented\nMesure;%T\nLongueur d'onde (nm);Tile 1;Tile 2\n700;41,5;80,25\n650;38,0;79,5\n",
      {
        quantity: "transmittance",
      },
    );
    expect(r.wavelengthsIn).toBe("first column");
    expect(r.spectra.map((s) => s.name)).toEqual(["Tile 1", "Tile 2"]);
    expect(r.spectra[0]!.values).toEqual([0.38, 0.415]);
    const ids = parseSpectralTable("ID,400,410\n1,0.5,0.6\n2,0.5,0.7\n", { quantity: "reflectance" });
    expect(ids.wavelengthsIn).toBe("header row");
    expect(ids.spectra[1]!.values).toEqual([0.5, 0.7]);
    const numbered = parseSpectralTable("nm,1,2\n400,0.5,0.6\n410,0.5,0.6\n", { quantity: "reflectance" });
    expect(numbered.wavelengthsIn).toBe("first column");
  });

  it("a separator at the end of every line and CR LF line ends; UTF-16 without byte-order mark", () => {
    // Invented table; the UTF-16 bytes are made by Node's Buffer (an outside encoder).
    const text = "nm;a;b;\r\n400;0,1;0,2;\r\n410;0,3;0,4;\r\n";
    const r = parseSpectralTable(text, { quantity: "reflectance" });
    expect(r.spectra.map((s) => s.name)).toEqual(["a", "b"]);
    expect(r.spectra[1]!.values).toEqual([0.2, 0.4]);
    const le = parseSpectralTable(Buffer.from(text, "utf16le"), { quantity: "reflectance" });
    expect(le.encoding).toBe("utf-16le");
    expect(le.spectra[1]!.values).toEqual([0.2, 0.4]);
    const be = Buffer.from(text, "utf16le").swap16();
    expect(parseSpectralTable(be, { quantity: "reflectance" }).encoding).toBe("utf-16be");
  });

  it("reports every inference in Methods, and a stated option replaces its inference", () => {
    resetMethodLog();
    readSpectralTable(corpus("latin1-semicolon.csv"), { quantity: "transmittance" });
    const notes = methodsUsed()
      .filter((n) => n.topic === "data files")
      .map((n) => n.statement)
      .join(" ");
    expect(notes).toMatch(/Windows-1252/);
    expect(notes).toMatch(/semicolon/);
    const r = readSpectralTable(corpus("latin1-semicolon.csv"), {
      quantity: "transmittance",
      encoding: "windows-1252",
      delimiter: ";",
      decimal: ",",
      headerLine: 4,
      wavelengthsIn: "first column",
      wavelengthUnit: "nm",
      order: "ascending",
      scale: "fraction",
    });
    expect(r.inferred).toEqual([]);
    expect(valueAt(r.spectra[0]!, 400)).toBe(20);
  });

  it("refuses an unknown option, listing the valid ones", () => {
    // Wrong options are the caller's, not the file's: an ArgumentError naming the reader and the option, in the
    // library's words ("valid options are", "should be one of"; these replaced the reader's own wording).
    expect(() =>
      parseSpectralTable("nm,a\n400,0.5\n", { quantity: "reflectance", skipLines: 8 } as never),
    ).toThrow(
      /^parseSpectralTable: options should be .*unknown option "skipLines"; valid options are quantity, encoding, delimiter, decimal, headerLine/,
    );
    expect(() =>
      parseSpectralTable("nm,a\n400,0.5\n", { quantity: "reflectance", order: "up" } as never),
    ).toThrow(
      /^parseSpectralTable: options.order should be one of "ascending", "descending", "auto", but got a string \("up"\)/,
    );
    expect(() =>
      parseSpectralTable("nm,a\n400,0.5\n", { quantity: "reflectance", encoding: "utf-8" }),
    ).toThrow(/^parseSpectralTable: options.encoding should be .*an encoding applies to a file's bytes/);
    expect(() =>
      readSpectralTable(corpus("descending-preamble.csv"), { quantity: "reflectence" } as never),
    ).toThrow(/^readSpectralTable: options.quantity should be what the columns hold: one of .*"reflectance"/);
    expect(() =>
      readSpectralTable(corpus("descending-preamble.csv"), { quantity: "reflectance", headerLine: 0 }),
    ).toThrow(
      /options.headerLine should be the line number of the header row \(a whole number from 1\) or "auto"/,
    );
    let e: unknown;
    try {
      parseSpectralTable("nm,a\n400,0.5\n", {} as never);
    } catch (x) {
      e = x;
    }
    expect(isArgumentError(e)).toBe(true);
    expect((e as Error).message).toMatch(
      /options.quantity .*The quantity is never assumed: state what the columns hold/,
    );
  });
});

describe("spectral tables refused with the place of the fault", () => {
  const cases: [string, number, string | undefined, number | undefined, RegExp][] = [
    ["bad-blank.csv", 4, "b", 410, /no value \(blank\)/],
    ["bad-text.csv", 4, "a", 410, /"n\/a", which is not a number/],
    ["bad-repeat.csv", 5, undefined, 410, /410 nm is repeated \(line 4 and line 5\)/],
    ["bad-uneven.csv", 6, undefined, 420, /grid is uneven: 420 nm follows 410 nm/],
    ["bad-lengths-across.csv", 4, "B", 420, /sample "B" has 2 values but the header names 4 wavelengths/],
    ["bad-order.csv", 5, undefined, 410, /410 nm breaks the ascending order after 420 nm/],
  ];
  it.each(cases)("%s: line %i, sample %s, wavelength %s", (file, line, sample, wavelength, pattern) => {
    const e = refusal(() => readSpectralTable(corpus(file), { quantity: "reflectance" }));
    expect(e.file).toBe(corpus(file));
    expect(e.line).toBe(line);
    expect(e.sample).toBe(sample);
    expect(e.wavelength).toBe(wavelength);
    expect(e.message).toMatch(pattern);
    expect(e.message.startsWith(`${corpus(file)}, line ${line}: `)).toBe(true);
  });

  it("reads an uneven grid when the option accepts it, and says so", () => {
    const r = readSpectralTable(corpus("bad-uneven.csv"), { quantity: "reflectance", unevenGrid: "accept" });
    expect(r.step).toBeUndefined();
    expect(r.spectra[0]!.wavelengths).toEqual([400, 405, 410, 420, 425]);
    expect(r.inferred.join(" ")).toMatch(/grid is uneven.*accepted as stated/);
  });
});

describe("numbers read in place", () => {
  it("agree with the engine's Number() for every double written with 17 or fewer digits", () => {
    // Reference: ECMA-262 Number() conversion (correctly rounded), on random doubles in several notations.
    let seed = 7;
    const next = () => (seed = (seed * 48271) % 2147483647) / 2147483647;
    for (let k = 0; k < 20000; k++) {
      const v = (next() - 0.2) * 10 ** Math.floor(next() * 30 - 15);
      for (const s of [String(v), v.toPrecision(6), v.toExponential(4), v.toFixed(3)]) {
        expect(scanNumber(s, 0, s.length, 46)).toBe(Number(s));
      }
    }
    for (const bad of ["", "-", ".", "1e", "1.2.3", "abc", "1,5", "0x10", "Infinity"])
      expect(scanNumber(bad, 0, bad.length, 46)).toBeNaN();
    expect(scanNumber("1,5", 0, 3, 44)).toBe(1.5);
  });

  it("a whole row read in one pass agrees with Number() per cell, and gives up on anything but numbers", () => {
    // Reference: ECMA-262 Number() on each cell as String.prototype.split cuts it out.
    const out = new Float64Array(8);
    let seed = 11;
    const next = () => (seed = (seed * 48271) % 2147483647) / 2147483647;
    for (let k = 0; k < 5000; k++) {
      const cells = Array.from({ length: 1 + Math.floor(next() * 8) }, () => {
        const v = (next() - 0.5) * 10 ** Math.floor(next() * 40 - 20);
        return [String(v), v.toPrecision(3), v.toExponential(2), ` ${v.toFixed(4)} `][k % 4]!;
      });
      expect(scanNumberRow(cells.join(";"), 59, 46, out)).toBe(cells.length);
      cells.forEach((c, i) => expect(out[i]).toBe(Number(c)));
    }
    for (const bad of ['1;"2"', "1;;3", "1;x", "1;2e", "1;2;3;4;5;6;7;8;9", "1,5;2"])
      expect(scanNumberRow(bad, 59, 46, out)).toBe(-1);
    expect(scanNumberRow("1,5;2,25", 59, 44, out)).toBe(2);
    expect([out[0], out[1]]).toEqual([1.5, 2.25]);
  });
});
