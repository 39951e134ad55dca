/**
 * Every exported function of the library answers a wrong argument with our own ArgumentError naming the function,
 * never with a raw engine error ("Cannot read properties of undefined", "is not iterable", "[object Object]", ...).
 * Each argument in turn is left out or given undefined, {}, a string, NaN, an array or null, while the others get a
 * plausible value for their declared type (issue 11, "Errors that say what was expected"). Whether a message is
 * helpful is a matter of house style (no external source); the check that it is ours and names the function is not.
 */
import { describe, expect, it } from "vitest";
import * as lib from "../../../lib/index.ts";
import { isArgumentError } from "../../../lib/index.ts";
import { publicFunctions, type PublicParameter } from "./public-signatures.ts";

/** lib/files/ is being rewritten by its owner; its readers report bad input as DataFileError with file and line. */
const NOT_HERE = (file: string) => file.startsWith("files/");

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

const MARKERS = [
  /\[object Object\]/,
  /Cannot read propert/,
  /is not iterable/,
  /Cannot use 'in' operator/,
  /is not a function/,
  /Cannot convert/,
  /undefined \(reading/,
];

const functions = publicFunctions().filter((f) => !NOT_HERE(f.file));

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
      const problems: string[] = [];
      f.parameters.forEach((p, i) => {
        for (const [label, bad] of BAD) {
          const args = f.parameters.map(plausible);
          if (bad === MISSING) args.length = i;
          else args[i] = bad;
          try {
            const result = call(...args);
            if (result instanceof Promise) result.catch(() => undefined);
          } catch (error) {
            const message = error instanceof Error ? error.message : String(error);
            const raw = MARKERS.some((m) => m.test(message));
            if (!isArgumentError(error) || raw || !message.includes(f.name)) {
              problems.push(
                `${p.name} ${label}: ${error instanceof Error ? error.constructor.name : typeof error}: ${message}`,
              );
            }
          }
        }
      });
      expect(problems).toEqual([]);
    });
  }
});
