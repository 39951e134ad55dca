/**
 * The conversions test their arguments' common case inline (a plain object of finite numbers, a positive white, an
 * RGB space) and hand anything else to the shared checks. Those quick tests must accept nothing the shared checks
 * refuse: for values that are nearly right (an array carrying the fields, a numeric string, Infinity, a zero or
 * negative white, an object posing as a space without its kind) each conversion must throw the very message that
 * the shared check gives. The wording is the house style (no external source); each check fails if a quick test
 * lets such a value through or answers with another message.
 */
import { describe, expect, it } from "vitest";
import { checkFields, LAB_FIELDS, RGB_FIELDS, XYZ_FIELDS } from "../../../lib/arguments/check-fields.ts";
import { checkRgbSpace } from "../../../lib/arguments/common-arguments.ts";
import {
  labFromXYZ,
  lchFromLab,
  luvFromXYZ,
  rgbFromXYZ,
  rgbSpace,
  xyzFromLab,
  xyzFromRgb,
} from "../../../lib/index.ts";

const messageOf = (f: () => unknown): string => {
  try {
    f();
  } catch (e) {
    return (e as Error).message;
  }
  throw new Error("expected a refusal, but the call returned");
};

const srgb = rgbSpace("sRGB");
const white = { X: 95.047, Y: 100, Z: 108.883 };
const nearlyXyz: unknown[] = [
  Object.assign([40, 50, 30], { X: 40, Y: 50, Z: 30 }),
  { X: 40, Y: "50", Z: 30 },
  { X: 40, Y: 50, Z: Infinity },
  { X: 40, Y: 50 },
  null,
];
const nearlyLab: unknown[] = [
  Object.assign([50, 10, -10], { L: 50, a: 10, b: -10 }),
  { L: 50, a: 10, b: NaN },
  { L: "50", a: 10, b: -10 },
];
const nearlyRgb: unknown[] = [
  Object.assign([0.5, 0.4, 0.3], { r: 0.5, g: 0.4, b: 0.3 }),
  { r: 0.5, g: -Infinity, b: 0.3 },
  { r: 0.5, g: 0.4 },
];
const nonPositiveWhites = [
  { X: 95.047, Y: 0, Z: 108.883 },
  { X: -95.047, Y: 100, Z: 108.883 },
];

describe("the conversions' quick argument tests let through nothing the shared checks refuse", () => {
  it("XYZ arguments (labFromXYZ, luvFromXYZ, rgbFromXYZ)", () => {
    for (const bad of nearlyXyz) {
      expect(messageOf(() => labFromXYZ(bad as never, white))).toBe(
        messageOf(() => checkFields("labFromXYZ", "t", bad, XYZ_FIELDS)),
      );
      expect(messageOf(() => luvFromXYZ(bad as never, white))).toBe(
        messageOf(() => checkFields("luvFromXYZ", "t", bad, XYZ_FIELDS)),
      );
      expect(messageOf(() => rgbFromXYZ(bad as never, srgb))).toBe(
        messageOf(() => checkFields("rgbFromXYZ", "xyz", bad, XYZ_FIELDS)),
      );
      expect(messageOf(() => labFromXYZ({ X: 1, Y: 2, Z: 3 }, bad as never))).toMatch(/^labFromXYZ: white/);
      expect(messageOf(() => xyzFromLab({ L: 50, a: 1, b: 2 }, bad as never))).toBe(
        messageOf(() => checkFields("xyzFromLab", "white", bad, XYZ_FIELDS)),
      );
    }
  });

  it("a reference white that is not positive", () => {
    for (const w of nonPositiveWhites) {
      expect(messageOf(() => labFromXYZ({ X: 1, Y: 2, Z: 3 }, w))).toMatch(
        /labFromXYZ: the reference white .* positive/,
      );
      expect(messageOf(() => xyzFromLab({ L: 50, a: 1, b: 2 }, w))).toMatch(
        /xyzFromLab: the reference white .* positive/,
      );
      expect(messageOf(() => luvFromXYZ({ X: 1, Y: 2, Z: 3 }, w))).toMatch(
        /luvFromXYZ: the reference white .* positive/,
      );
    }
  });

  it("CIELAB arguments (xyzFromLab, lchFromLab)", () => {
    for (const bad of nearlyLab) {
      expect(messageOf(() => xyzFromLab(bad as never, white))).toBe(
        messageOf(() => checkFields("xyzFromLab", "lab", bad, LAB_FIELDS)),
      );
      expect(messageOf(() => lchFromLab(bad as never))).toBe(
        messageOf(() => checkFields("lchFromLab", "lab", bad, LAB_FIELDS)),
      );
    }
  });

  it("RGB values and RGB spaces (xyzFromRgb, rgbFromXYZ)", () => {
    for (const bad of nearlyRgb) {
      expect(messageOf(() => xyzFromRgb(bad as never, srgb))).toBe(
        messageOf(() => checkFields("xyzFromRgb", "rgb", bad, RGB_FIELDS)),
      );
    }
    const { kind: _kind, ...withoutKind } = srgb;
    for (const bad of [withoutKind, { ...srgb, kind: "RGB space" }, "sRGB", null]) {
      expect(messageOf(() => xyzFromRgb({ r: 0.5, g: 0.4, b: 0.3 }, bad as never))).toBe(
        messageOf(() => checkRgbSpace("xyzFromRgb", "space", bad)),
      );
      expect(messageOf(() => rgbFromXYZ({ X: 40, Y: 50, Z: 30 }, bad as never))).toBe(
        messageOf(() => checkRgbSpace("rgbFromXYZ", "space", bad)),
      );
    }
  });
});
