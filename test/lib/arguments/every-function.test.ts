/**
 * Every exported function of the library answers a wrong argument with our own ArgumentError naming the function,
 * never with a raw engine error ("Cannot read properties of undefined", "is not iterable", "[object Object]", ...).
 * Each argument in turn is left out or given undefined, {}, a string, NaN, an array or null, while the others get a
 * plausible value for their declared type (issue 11, "Errors that say what was expected"). Whether a message is
 * helpful is a matter of house style (no external source); the check that it is ours and names the function is not.
 * The readers and writers of lib/files get real files of the invented corpus in test/lib/files/corpus/ (and write
 * into a temporary folder), so that each check meets the argument replaced rather than an earlier failure.
 */
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { afterAll, describe, expect, it } from "vitest";
import * as lib from "../../../lib/index.ts";
import { isArgumentError } from "../../../lib/index.ts";
import { publicFunctions, type PublicFunction, type PublicParameter } from "./public-signatures.ts";

const BAD: ReadonlyArray<readonly [string, unknown]> = [
  ["missing", Symbol("missing")],
  ["undefined", undefined],
  ["{}", {}],
  ["a string", "not a value"],
  ["NaN", NaN],
  ["an array", [1, 2]],
  ["null", null],
];
const MISSING = BAD[0]![1];

const w5 = Array.from({ length: 81 }, (_, i) => 380 + 5 * i);
const flat = lib.spectrum(
  w5,
  w5.map(() => 0.5),
  { name: "flat 50 % (invented)", quantity: "other" },
);

const dark = lib.withValues(
  flat,
  w5.map(() => 0.1),
  { name: "flat 10 % (invented)" },
);

/** A value of the declared type that a careful caller might pass (it need not satisfy every range check). */
function plausible(p: PublicParameter): unknown {
  const t = p.type.replace(/\s+/g, " ");
  if (/^Spectrum$|^\(?Spectrum \|/.test(t)) return /solid/i.test(p.name) ? dark : flat;
  if (/Spectrum\[\]$|readonly Spectrum\[\]/.test(t)) return [flat, flat];
  if (t === "Tristimulus") return { X: 40, Y: 50, Z: 30 };
  if (t === "Lab") return { L: 50, a: 10, b: -10 };
  if (t === "LCh" || t === "LChUv") return { L: 50, C: 20, h: 120 };
  if (t === "Luv") return { L: 50, u: 10, v: -10 };
  if (t === "Chromaticity") return /white/i.test(p.name) ? { x: 0.3127, y: 0.329 } : { x: 0.45, y: 0.41 };
  if (t === "ChromaticityLuminance") return { x: 0.3127, y: 0.329, Y: 50 };
  if (t === "UvPrime" || t === "Uv1960") return { u: 0.2, v: 0.45 };
  if (t === "Rgb" || /^\{ r: number/.test(t)) return { r: 0.5, g: 0.4, b: 0.3 };
  if (t === "WavelengthGrid") return { start: 380, end: 780, step: 5 };
  if (t === "Matrix3")
    return [
      [1, 0, 0],
      [0, 1, 0],
      [0, 0, 1],
    ];
  if (t === "Vector3") return [1, 2, 3];
  if (t === "RgbSpace") return lib.rgbSpace("sRGB");
  if (t === "Observer") return lib.observerByName("2°");
  if (t === "boolean") return true;
  if (/number\[\]/.test(t)) return [400, 500, 600];
  if (t === "number") {
    if (/wavelength|edge|centre/i.test(p.name)) return 550;
    if (/temperature|cct/i.test(p.name)) return 5000;
    if (/reflectance/i.test(p.name)) return 0.04;
    return 0.5;
  }
  if (/^string|TransferName/.test(t)) return /name/i.test(p.name) ? "D65" : "sRGB";
  return undefined;
}

/**
 * Invented files: of the corpus (test/lib/files/corpus/README.md) a spectral table, readings and a CGATS file with
 * XYZ and Lab; the CGATS file with spectral fields is the demo's (notebooks/data, invented demo data).
 */
const corpus = (name: string) => fileURLToPath(new URL(`../files/corpus/${name}`, import.meta.url));
const SPECTRAL_FILE = corpus("descending-preamble.csv");
const READINGS_FILE = corpus("readings-cmyk-xyy.csv");
const CGATS_FILE = corpus("readings-two-sets.cgats.txt");
const CGATS_SPECTRA_FILE = fileURLToPath(
  new URL("../../../notebooks/data/blue-cut-plates.cgats.txt", import.meta.url),
);

/** The writers write here (and run here, so that a path such as "not a value" lands here too). */
const OUT = mkdtempSync(join(tmpdir(), "tristim-arguments-"));
afterAll(() => rmSync(OUT, { recursive: true, force: true }));

/** A realistic value for a parameter of a lib/files function: real files and their text, parsed tables, options. */
function plausibleFileArgument(f: PublicFunction, p: PublicParameter): unknown {
  const t = p.type.replace(/\s+/g, " ");
  const cgats = /cgats/i.test(f.name);
  const readings = /ColourReadings/.test(f.name);
  const file =
    cgats && /Spectra$/.test(f.name)
      ? CGATS_SPECTRA_FILE
      : cgats
        ? CGATS_FILE
        : readings
          ? READINGS_FILE
          : SPECTRAL_FILE;
  if (t === "string" && p.name === "path")
    return /^write/.test(f.name) ? join(OUT, cgats ? "out.cgats.txt" : "out.csv") : file;
  if (t === "string" && p.name === "text") return readFileSync(file, "utf8");
  if (t === "string | Uint8Array" && p.name === "input") return readFileSync(file, "utf8");
  if (t === "string" && p.name === "field") return "LAB_L";
  if (t === "string" && p.name === "what") return "transmittance";
  if (t === "CgatsTable") return lib.readCgats(file).tables[0];
  if (t === "CgatsFile") return lib.readCgats(file);
  if (t === "SpectralTableOptions") return { quantity: "transmittance" };
  if (t === "CgatsSpectraOptions") return { quantity: "transmittance", scale: "percent" };
  if (t === "ColourReadingsOptions") return { units: { xyY: "cd/m²" } };
  if (t === "SpectraCsvWriteOptions") return { delimiter: ";", decimal: ",", digits: 4 };
  if (t === "CgatsWriteInput")
    return { Lab: [{ L: 50, a: 20, b: -10 }], sampleIds: ["A-1"], keywords: { DESCRIPTOR: "invented" } };
  if (/Spectrum\[\]$/.test(t)) return [flat, dark]; // names of their own: they become column headings
  if (t === "Iterable<number>") return [12, 45, 88];
  if (/"auto"/.test(t)) return "auto";
  if (/^\(text: string\) =>/.test(t)) return (text: string) => text.length;
  if (t === "unknown" && p.name === "error") return new lib.DataFileError("invented fault", 3);
  return plausible(p);
}

/** True when the declared type is string or a union with string in it ("string | Uint8Array"). */
const declaresString = (type: string) => type.split("|").some((member) => member.trim() === "string");

const MARKERS = [
  /\[object Object\]/,
  /Cannot read propert/,
  /is not iterable/,
  /Cannot use 'in' operator/,
  /is not a function/,
  /Cannot convert/,
  /undefined \(reading/,
];

const functions = publicFunctions();

describe("every exported function checks its arguments", () => {
  it("finds the public functions through the module's exports", () => {
    // The count is a floor against the enumeration silently finding nothing (about 200 are public).
    expect(functions.length).toBeGreaterThan(180);
    for (const f of functions) expect(typeof (lib as Record<string, unknown>)[f.name]).toBe("function");
  });

  for (const f of functions) {
    if (f.parameters.length === 0) continue;
    it(`${f.name} (${f.file})`, () => {
      const call = (lib as unknown as Record<string, (...args: unknown[]) => unknown>)[f.name]!;
      const inFiles = f.file.startsWith("files/");
      const problems: string[] = [];
      if (inFiles) {
        // With every argument plausible the call succeeds, so that each refusal below is the replaced argument's.
        const here = process.cwd();
        process.chdir(OUT);
        try {
          expect(() => call(...f.parameters.map((q) => plausibleFileArgument(f, q)))).not.toThrow();
        } finally {
          process.chdir(here);
        }
      }
      f.parameters.forEach((p, i) => {
        for (const [label, bad] of BAD) {
          const args = f.parameters.map((q) => (inFiles ? plausibleFileArgument(f, q) : plausible(q)));
          if (bad === MISSING) args.length = i;
          else args[i] = bad;
          const here = process.cwd();
          if (inFiles) process.chdir(OUT);
          try {
            const result = call(...args);
            if (result instanceof Promise) result.catch(() => undefined);
          } catch (error) {
            const message = error instanceof Error ? error.message : String(error);
            const raw = MARKERS.some((m) => m.test(message));
            // lib/files only: a bad value of the declared type (the string "not a value" as a path or as a file's
            // text) is a well-typed argument whose content is wrong, a file that does not exist or text that is no
            // table. The readers' documented answer to that is a DataFileError naming the file and line (README,
            // "Reading measurement files"), not an ArgumentError; it must still be no raw engine error.
            const fileFault =
              inFiles &&
              typeof bad === "string" &&
              declaresString(p.type) &&
              error instanceof lib.DataFileError;
            if (fileFault && !raw) continue;
            if (!isArgumentError(error) || raw || !message.includes(f.name)) {
              problems.push(
                `${p.name} ${label}: ${error instanceof Error ? error.constructor.name : typeof error}: ${message}`,
              );
            }
          } finally {
            process.chdir(here);
            // A writer given the path "not a value" wrote it here; the readers' turn must not find it.
            rmSync(join(OUT, "not a value"), { force: true });
          }
        }
      });
      expect(problems).toEqual([]);
    });
  }
});
