/**
 * Gamut mapping of swatches (CSS Color Module Level 4 §13.2; OKLab, Ottosson 2020), checked against colorjs.io's
 * implementation of the same specification ("css" method of toGamut, an independent library from the npm registry).
 * Reviewers found a blue LED at 3 % of the white's luminance drawn as a bright blue, because each sRGB channel was
 * clipped; mapping keeps OKLab lightness and hue and reduces chroma.
 */
import Color from "colorjs.io";
import { describe, expect, it } from "vitest";
import { lightTristimulus } from "../../../lib/colorimetry/tristimulus.ts";
import { ledSpectrum } from "../../../lib/mixing/led-spectrum.ts";
import { swatch } from "../../../lib/plot/index.ts";
import { linearRgb, xyzFromLinearRgb, type DisplayGamut } from "../../../lib/plot/display-rgb.ts";
import { mapToDisplayGamut, oklabFromXyz, xyzFromOklab } from "../../../lib/plot/gamut-mapping.ts";

const COLORJS_LINEAR: Record<DisplayGamut, string> = {
  sRGB: "srgb-linear",
  "Display P3": "p3-linear",
  "BT.2020": "rec2020-linear",
};
const decode = (c: number) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4); // IEC 61966-2-1 eq. (2)
const hexLinear = (hex: string) =>
  [1, 3, 5].map((i) => decode(parseInt(hex.slice(i, i + 2), 16) / 255)) as [number, number, number];

// Out-of-gamut colours, XYZ relative to D65 on the Y = 1 scale (invented, except the spectral colour).
const COLOURS: [string, { X: number; Y: number; Z: number }][] = [
  // x̄, ȳ, z̄ of the CIE 1931 observer at 520 nm, 0.06327, 0.71000, 0.07825 (CIE 018:2019 Table 6, recalled from memory), at Y = 0.5.
  ["520 nm at Y = 0.5", { X: 0.06327 * (0.5 / 0.71), Y: 0.5, Z: 0.07825 * (0.5 / 0.71) }],
  ["deep red", { X: 0.3, Y: 0.12, Z: 0.005 }],
  ["violet", { X: 0.15, Y: 0.04, Z: 0.9 }],
  ["cyan", { X: 0.2, Y: 0.45, Z: 0.7 }],
];

describe("OKLab (CSS Color 4 §9)", () => {
  it("matches colorjs.io's OKLab and inverts exactly", () => {
    for (const [, xyz] of COLOURS) {
      const ours = oklabFromXyz(xyz);
      const ref = new Color("xyz-d65", [xyz.X, xyz.Y, xyz.Z]).to("oklab").coords as number[];
      ours.forEach((v, i) => expect(v).toBeCloseTo(ref[i]!, 10));
      const back = xyzFromOklab(ours);
      expect(back.X).toBeCloseTo(xyz.X, 12);
      expect(back.Y).toBeCloseTo(xyz.Y, 12);
      expect(back.Z).toBeCloseTo(xyz.Z, 12);
    }
    // The D65 white has L = 1, a = b = 0 (Ottosson 2020: the space is normalised so).
    const w = oklabFromXyz(xyzFromLinearRgb([1, 1, 1], "sRGB"));
    expect(w[0]).toBeCloseTo(1, 4);
    expect(Math.hypot(w[1], w[2])).toBeLessThan(1e-4);
  });
});

describe("mapToDisplayGamut", () => {
  it.each(
    COLOURS.flatMap(([name, xyz]) =>
      (["sRGB", "Display P3", "BT.2020"] as const).map((g) => [name, g, xyz] as const),
    ),
  )(
    "%s into %s: inside the cube, and the colour colorjs.io's CSS gamut mapping gives",
    (_name, gamut, xyz) => {
      const m = mapToDisplayGamut(xyz, gamut);
      m.linear.forEach((v) => expect(v >= 0 && v <= 1).toBe(true));
      const ref = new Color("xyz-d65", [xyz.X, xyz.Y, xyz.Z])
        .toGamut({ space: COLORJS_LINEAR[gamut], method: "css" })
        .to(COLORJS_LINEAR[gamut]).coords as number[];
      m.linear.forEach((v, i) => expect(Math.abs(v - Math.min(1, Math.max(0, ref[i]!)))).toBeLessThan(2e-3));
    },
  );

  it("stays within one JND (ΔEOK 0.02) of the original's OKLab lightness and hue, with less chroma", () => {
    // CSS Color 4 §13.2: the result is the clip of a colour with the original L and hue whose ΔEOK from it is below
    // 0.02, so its distance from the ray of constant L and hue through the original is below 0.02 too.
    for (const [, xyz] of COLOURS) {
      const m = mapToDisplayGamut(xyz, "sRGB");
      if (m.how === "inside") continue;
      const orig = oklabFromXyz(xyz),
        shown = oklabFromXyz(xyzFromLinearRgb(m.linear, "sRGB"));
      const h = Math.atan2(orig[2], orig[1]);
      const along = Math.max(0, shown[1] * Math.cos(h) + shown[2] * Math.sin(h));
      const fromRay = Math.hypot(
        shown[0] - orig[0],
        shown[1] - along * Math.cos(h),
        shown[2] - along * Math.sin(h),
      );
      expect(fromRay).toBeLessThan(0.02);
      expect(Math.hypot(shown[1], shown[2])).toBeLessThan(Math.hypot(orig[1], orig[2])); // chroma reduced, never increased
    }
  });

  it("leaves colours inside the gamut as they are, and gives white for a colour brighter than white", () => {
    const inside = { X: 0.2, Y: 0.2, Z: 0.2 };
    const m = mapToDisplayGamut(inside, "sRGB");
    expect(m.how).toBe("inside");
    m.linear.forEach((v, i) => expect(v).toBeCloseTo(linearRgb(inside, "sRGB")[i]!, 12));
    const bright = mapToDisplayGamut({ X: 1.9, Y: 2, Z: 1.2 }, "sRGB");
    expect(bright).toEqual({ linear: [1, 1, 1], how: "white" });
    expect(() => mapToDisplayGamut({ X: NaN, Y: 0, Z: 0 }, "sRGB")).toThrow(/NaN/);
  });
});

describe("a blue LED at 3 % of the white's luminance", () => {
  // An invented royal-blue LED (Ohno 2005 shape, 450 nm, 20 nm FWHM), scaled to Y = 3 against a D65 white of Y = 100.
  const t = lightTristimulus(ledSpectrum({ peak: 450, fwhm: 20, name: "royal blue LED (invented)" }));
  const XYZ = { X: (3 * t.X) / t.Y, Y: 3, Z: (3 * t.Z) / t.Y };
  const rel = { X: XYZ.X / 100, Y: XYZ.Y / 100, Z: XYZ.Z / 100 };
  const s = swatch("royal blue at 3 %", { XYZ });

  it("is marked as outside sRGB by its fields (the report draws the mark and calls the patch an approximation)", () => {
    expect(s.outOfGamut).toBe(true);
    expect(s.display).toBe("sRGB");
    expect(s.outOfDisplayGamut).toBe(true);
    expect(s.note).toBeUndefined();
  });

  it("is drawn as colorjs.io's CSS Color 4 mapping draws it, not as the channel clip", () => {
    const ref = new Color("xyz-d65", [rel.X, rel.Y, rel.Z])
      .toGamut({ space: "srgb", method: "css" })
      .to("srgb").coords as number[];
    const refHex =
      "#" +
      ref
        .map((v) =>
          Math.round(Math.min(1, Math.max(0, v)) * 255)
            .toString(16)
            .padStart(2, "0"),
        )
        .join("");
    [1, 3, 5].forEach((i) =>
      expect(
        Math.abs(parseInt(s.hex.slice(i, i + 2), 16) - parseInt(refHex.slice(i, i + 2), 16)),
      ).toBeLessThanOrEqual(1),
    );
    const clip = linearRgb(rel, "sRGB").map((v) => Math.min(1, Math.max(0, v)));
    expect(clip[2]).toBe(1); // the old way: the blue channel at full output, a bright blue
    expect(hexLinear(s.hex)[2]).toBeLessThan(0.8);
  });

  it("keeps the light's OKLab lightness within 0.02 and shows less luminance than the clip did", () => {
    const shownXyz = xyzFromLinearRgb(hexLinear(s.hex), "sRGB");
    const clipXyz = xyzFromLinearRgb(
      linearRgb(rel, "sRGB").map((v) => Math.min(1, Math.max(0, v))) as [number, number, number],
      "sRGB",
    );
    const L = oklabFromXyz(rel)[0];
    expect(Math.abs(oklabFromXyz(shownXyz)[0] - L)).toBeLessThanOrEqual(0.02 + 2e-3); // + 8-bit rounding of the hex
    expect(Math.abs(oklabFromXyz(clipXyz)[0] - L)).toBeGreaterThan(0.05);
    expect(shownXyz.Y).toBeLessThan(clipXyz.Y);
  });
});
