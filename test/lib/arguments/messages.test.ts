/**
 * What an argument error says (issue 11): the function, the argument, what was expected with its unit, what came
 * described by its kind, and the function the caller probably meant. The wording is the house style (no external
 * source); each check fails if the message loses one of those parts.
 */
import { describe, expect, it } from "vitest";
import { ArgumentError, isArgumentError } from "../../../lib/arguments/argument-error.ts";
import { describeKind } from "../../../lib/arguments/describe-kind.ts";
import * as lib from "../../../lib/index.ts";

const filter = lib.spectrumOnGrid(380, 5, new Array(81).fill(0.4), {
  name: "grey glass (invented)",
  quantity: "transmittance",
});

describe("describeKind names a value by its kind, never [object Object]", () => {
  it.each([
    [filter, 'a spectrum ("grey glass (invented)", transmittance, 380–780 nm)'],
    [[1, 2, 3], "an array of 3 numbers [1, 2, 3]"],
    ["D65", 'a string ("D65")'],
    [undefined, "undefined"],
    [null, "null"],
    [NaN, "NaN"],
    [{ a: 1, b: 2 }, "an object with keys a, b"],
    [{}, "an empty object {}"],
    [[filter, filter], "an array of 2 spectra"],
    [5, "the number 5"],
  ])("%j", (value, words) => {
    expect(describeKind(value)).toBe(words);
    expect(describeKind(value)).not.toContain("[object");
  });
});

describe("errors name the function and the argument, what was expected and what came", () => {
  const messageOf = (f: () => unknown): string => {
    try {
      f();
    } catch (e) {
      expect(isArgumentError(e)).toBe(true);
      expect(e).toBeInstanceOf(ArgumentError);
      return (e as Error).message;
    }
    throw new Error("expected an ArgumentError");
  };

  it("opticalDensity given a spectrum points to opticalDensitySpectrum", () => {
    const m = messageOf(() => lib.opticalDensity(filter as never));
    expect(m).toMatch(/^opticalDensity: transmittance should be a fraction from 0 to 1/);
    expect(m).toContain('but got a spectrum ("grey glass (invented)"');
    expect(m).toContain("For a spectrum use opticalDensitySpectrum.");
  });

  it("a number out of range is shown with its unit", () => {
    expect(messageOf(() => lib.daylightSpectrum(3000))).toBe(
      "daylightSpectrum: cct should be a finite number in K from 4000 to 25000, but got 3000 K.",
    );
  });

  it("an unknown option is refused with the list of valid ones", () => {
    const m = messageOf(() => lib.lightTristimulus(filter, { scaling: "absolute" } as never));
    expect(m).toContain('unknown option "scaling"; valid options are observer, scale');
  });

  it("a bad field of a record is named with its value", () => {
    expect(messageOf(() => lib.labFromXYZ({ X: 1, Y: NaN, Z: 1 }, { X: 95, Y: 100, Z: 108 }))).toMatch(
      /^labFromXYZ: t\.Y should be a finite number .*, but got NaN\.$/,
    );
  });

  it("phosphorWhite without options says what it needs instead of failing on a property", () => {
    expect(messageOf(() => (lib.phosphorWhite as (o?: unknown) => unknown)())).toMatch(
      /^phosphorWhite: options should be options \{ blue: \{ peak, fwhm \}, phosphor: .*phosphorToBlue.*, but got undefined\.$/,
    );
  });
});
