/**
 * Which error a reader or writer of lib/files gives (issue 11, "errors that say what was expected"): a wrong kind of
 * argument is an ArgumentError naming the function and saying what was expected; a well-typed argument whose
 * content is wrong (no such file, text that is no table) stays a DataFileError with the file and line, as README
 * "Reading measurement files" documents. The split and the wording are house style (no external source); the data
 * are the invented corpus of test/lib/files/corpus/ and invented spectra.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, it } from "vitest";
import {
  cgatsSpectra,
  cgatsTristimulus,
  DataFileError,
  decideValueScale,
  formatCgats,
  formatSpectraCsv,
  isArgumentError,
  parseCgats,
  readCgats,
  readCgatsSpectra,
  readSpectralTable,
  spectrumOnGrid,
  writeSpectraCsv,
} from "../../../lib/index.ts";

const corpus = (name: string) => fileURLToPath(new URL(`./corpus/${name}`, import.meta.url));
const OUT = mkdtempSync(join(tmpdir(), "tristim-files-arguments-"));
afterAll(() => rmSync(OUT, { recursive: true, force: true }));

function thrown(f: () => unknown): Error {
  try {
    f();
  } catch (e) {
    return e as Error;
  }
  throw new Error("an error was expected");
}

const tile = (name: string, value: number) =>
  spectrumOnGrid(400, 100, [value, value, value], { name: `${name} (invented)`, quantity: "reflectance" });

describe("a wrong kind of argument is an ArgumentError, a wrong file a DataFileError", () => {
  it("a path that is no string is the caller's; a path to no file is the file's, named with it", () => {
    const wrong = thrown(() => readSpectralTable(42 as never, { quantity: "reflectance" }));
    expect(isArgumentError(wrong)).toBe(true);
    expect(wrong.message).toBe(
      "readSpectralTable: path should be a file path (a non-empty string, relative to the notebook's folder), but got the number 42.",
    );
    const missing = join(OUT, "no-such-file.csv");
    const absent = thrown(() => readSpectralTable(missing, { quantity: "reflectance" }));
    expect(absent).toBeInstanceOf(DataFileError);
    expect((absent as DataFileError).file).toBe(missing);
  });

  it("the options are checked before the file is read, so a missing quantity is named even for a missing file", () => {
    const e = thrown(() => readCgatsSpectra(join(OUT, "no-such-file.txt"), {} as never));
    expect(isArgumentError(e)).toBe(true);
    expect(e.message).toMatch(/^readCgatsSpectra: options.quantity should be what the spectral fields hold/);
    expect(e.message).toMatch(/The quantity is never assumed: state what the spectral fields hold/);
  });

  it("a parsed file where a table is wanted, and a table where the file is wanted, say which to pass", () => {
    const file = readCgats(corpus("readings-two-sets.cgats.txt"));
    expect(thrown(() => cgatsTristimulus(file as never)).message).toMatch(
      /^cgatsTristimulus: table should be a table of a parsed CGATS file .*For a parsed file pass one of its tables, e\.g\. file\.tables\[0\]\./,
    );
    expect(thrown(() => cgatsSpectra(file.tables[0] as never, { quantity: "reflectance" })).message).toMatch(
      /^cgatsSpectra: file should be a parsed CGATS file .*choose the table with options\.table/,
    );
    // A set cut short by hand is named, rather than read as missing values.
    const table = file.tables[0]!;
    const cut = { ...table, sets: [table.sets[0]!, table.sets[1]!.slice(0, 3)] };
    expect(thrown(() => cgatsTristimulus(cut)).message).toMatch(
      /^cgatsTristimulus: table\.sets\[1\] should be an array of 11 values, one per field/,
    );
    // What the file holds stays the file's fault: no Lab in the second table.
    expect(() => cgatsTristimulus(file.tables[1]!)).toThrow(DataFileError);
  });

  it("text that is no CGATS is a DataFileError with its line; no text at all is an ArgumentError", () => {
    const e = thrown(() => parseCgats("not a CGATS file\n"));
    expect(e).toBeInstanceOf(DataFileError);
    expect((e as DataFileError).line).toBe(1);
    expect(isArgumentError(thrown(() => parseCgats(new Uint8Array(4) as never)))).toBe(true);
  });
});

describe("the writers refuse what they cannot write, naming the argument", () => {
  it("two spectra of one name, a comma decimal with comma fields, percent of a lamp", () => {
    expect(thrown(() => formatSpectraCsv([tile("A", 0.2), tile("A", 0.3)])).message).toMatch(
      /^formatSpectraCsv: spectra\[1\] should be a spectrum with a name of its own .*spectra\[0\] has the same/,
    );
    const comma = thrown(() => formatSpectraCsv([tile("A", 0.2)], { decimal: "," }));
    expect(isArgumentError(comma)).toBe(true);
    expect(comma.message).toMatch(/options\.decimal .*a decimal comma needs ";" or tab as the separator/);
    const lamp = spectrumOnGrid(400, 100, [1, 2, 3], { name: "lamp (invented)", quantity: "relative power" });
    expect(thrown(() => formatCgats({ spectra: [lamp], scale: "percent" })).message).toMatch(
      /^formatCgats: input\.scale should be "fraction" for spectra\[0\], a relative power spectrum/,
    );
  });

  it("lists of different lengths, a text CGATS cannot quote, an identifier used twice", () => {
    expect(thrown(() => formatCgats({ Lab: [{ L: 50, a: 1, b: 2 }], sampleIds: ["a", "b"] })).message).toBe(
      "formatCgats: input should be lists with one entry per sample, but got 1 Lab, 2 sampleIds.",
    );
    expect(
      thrown(() => formatCgats({ Lab: [{ L: 50, a: 1, b: 2 }], sampleNames: ['say "hi"'] })).message,
    ).toBe(
      'formatCgats: input.sampleNames[0] should be text without a double quote or line break (CGATS text cannot hold them), but got a string ("say \\"hi\\"").',
    );
    const twice = thrown(() =>
      formatCgats({
        XYZ: [
          { X: 1, Y: 1, Z: 1 },
          { X: 2, Y: 2, Z: 2 },
        ],
        sampleIds: [7, "7"],
      }),
    );
    expect(twice.message).toMatch(/^formatCgats: input\.sampleIds\[1\] should be an identifier of its own/);
    expect(thrown(() => formatCgats({ XYZ: [{ X: 1, Y: "2", Z: 3 }] } as never)).message).toMatch(
      /^formatCgats: input\.XYZ\[0\]\.Y should be a finite number/,
    );
  });

  it("a file that cannot be written is a DataFileError naming it", () => {
    const path = join(OUT, "no-such-folder", "out.csv");
    const e = thrown(() => writeSpectraCsv(path, [tile("A", 0.2)]));
    expect(e).toBeInstanceOf(DataFileError);
    expect((e as DataFileError).file).toBe(path);
    expect(e.message).toMatch(/cannot write the file/);
  });
});

describe("decideValueScale", () => {
  it("takes any iterable of numbers, refuses a string and names a value that is not a finite number", () => {
    // The 1.5 threshold is common practice (no source): 88 is read as percent.
    expect(decideValueScale(new Set([12, 45, 88]), undefined, "transmittance").scale).toBe("percent");
    expect(isArgumentError(thrown(() => decideValueScale("88" as never, "auto", "transmittance")))).toBe(
      true,
    );
    expect(thrown(() => decideValueScale([0.2, NaN], "auto", "transmittance")).message).toBe(
      "decideValueScale: values[1] should be a finite number, but got NaN.",
    );
    expect(thrown(() => decideValueScale([0.2], "percentage" as never, "transmittance")).message).toMatch(
      /^decideValueScale: stated should be the scale: one of "fraction", "percent", "auto"/,
    );
  });
});
