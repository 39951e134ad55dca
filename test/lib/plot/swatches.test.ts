/**
 * Swatches: sRGB hex and wide-gamut CSS colours checked against colorjs.io (an independent implementation of the
 * CSS Color 4 conversions and gamut mapping, from the npm registry), gamut marks, and ΔE00 of pairs against Sharma,
 * Wu & Dalal (2005).
 */
import Color from "colorjs.io";
import { differenceCiede2000 } from "culori";
import { describe, expect, it } from "vitest";
import type { SwatchRecord } from "../../../cells/records.ts";
import { swatchRecords } from "../../../cells/swatch-record.ts";
import { swatch, swatchGrid, swatchPairs } from "../../../lib/plot/index.ts";
import { GAMUT_TOLERANCE } from "../../../lib/plot/swatch.ts";
import { spectrum } from "../../../lib/spectrum/spectrum.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "../reference-data.ts";

const xyzOf = (space: string, coords: [number, number, number]) => {
  const [X, Y, Z] = new Color(space, coords).to("xyz-d65").coords as [number, number, number];
  return { X: X * 100, Y: Y * 100, Z: Z * 100 };
};
const hexOf = (rgb: number[]) =>
  "#" +
  rgb
    .map((v) =>
      Math.round(Math.min(1, Math.max(0, v)) * 255)
        .toString(16)
        .padStart(2, "0"),
    )
    .join("");
const cssNumbers = (css: string) =>
  css
    .replace(/^color\([a-z0-9-]+ /, "")
    .replace(")", "")
    .split(" ")
    .map(Number);
/** A swatch as the runner's check keeps it: `outOfGamut` only when true (false and absent mean the same there). */
const asRunnerKeepsIt = <T extends { outOfGamut?: boolean }>({ outOfGamut, ...rest }: T) =>
  outOfGamut ? { ...rest, outOfGamut } : rest;
const channelDistance = (a: string, b: string) =>
  Math.max(
    ...[1, 3, 5].map((i) => Math.abs(parseInt(a.slice(i, i + 2), 16) - parseInt(b.slice(i, i + 2), 16))),
  );

describe("colours inside sRGB", () => {
  it("a CIELAB (D65) colour gets the sRGB hex colorjs.io computes, no wide-gamut CSS and no mark", () => {
    const lab = { L: 52, a: 41.5, b: 27 };
    const s = swatch("terracotta (invented)", { lab });
    const ref = hexOf(new Color("lab-d65", [lab.L, lab.a, lab.b]).to("srgb").coords as number[]);
    expect(channelDistance(s.hex, ref)).toBeLessThanOrEqual(1);
    expect(s.css).toBeUndefined();
    expect(s.outOfGamut).toBe(false);
    expect(s.inGamut).toEqual({ sRGB: true, displayP3: true, bt2020: true });
    expect(s.outOfDisplayGamut).toBe(false);
  });

  it("an sRGB hex comes back as itself (IEC 61966-2-1 decoding and encoding are inverse)", () => {
    for (const hex of ["#8a4b2f", "#000000", "#ffffff", "#10e0a0"])
      expect(swatch("h", { hex }).hex).toBe(hex);
  });

  it("CIELAB relative to D50 is adapted to D65 by Bradford, as colorjs.io does for its D50 lab space", () => {
    const lab = { L: 60, a: 20, b: -30 };
    // colorjs.io's "lab" is relative to D50 with x = 0.3457, y = 0.3585 and adapts to D65 with the Bradford matrix.
    const white = { X: (0.3457 / 0.3585) * 100, Y: 100, Z: ((1 - 0.3457 - 0.3585) / 0.3585) * 100 };
    const s = swatch("d50", { lab, white });
    const ref = hexOf(new Color("lab", [lab.L, lab.a, lab.b]).to("srgb").coords as number[]);
    expect(channelDistance(s.hex, ref)).toBeLessThanOrEqual(1);
  });

  it("a flat 50 % reflectance under D65 is the mid grey with sRGB value 188 (IEC 61966-2-1 encoding of 0.5)", () => {
    const grey = spectrum([360, 400, 500, 600, 700, 830], [0.5, 0.5, 0.5, 0.5, 0.5, 0.5], {
      name: "grey (invented)",
      quantity: "reflectance",
    });
    const s = swatch("grey", grey);
    for (const i of [1, 3, 5])
      expect(Math.abs(parseInt(s.hex.slice(i, i + 2), 16) - 188)).toBeLessThanOrEqual(1);
  });
});

describe("wide-gamut colours", () => {
  it("a colour inside Display P3 but outside sRGB is written as color(display-p3 …) with colorjs.io's numbers", () => {
    const p3: [number, number, number] = [0.2, 0.8, 0.2];
    const s = swatch("P3 green", { XYZ: xyzOf("p3", p3) }, { display: "Display P3" });
    expect(s.inGamut).toEqual({ sRGB: false, displayP3: true, bt2020: true });
    expect(s.css).toMatch(/^color\(display-p3 [0-9.]+ [0-9.]+ [0-9.]+\)$/);
    cssNumbers(s.css!).forEach((v, i) => expect(v).toBeCloseTo(p3[i]!, 3));
    expect(s.outOfGamut).toBe(true);
    expect(s.outOfDisplayGamut).toBe(false);
    // The hex is the colour colorjs.io maps into sRGB by CSS Color 4 gamut mapping (its "css" method), not a clip.
    const mapped = hexOf(
      new Color("p3", p3).toGamut({ space: "srgb", method: "css" }).to("srgb").coords as number[],
    );
    expect(channelDistance(s.hex, mapped)).toBeLessThanOrEqual(1);
    const clipped = hexOf(new Color("p3", p3).to("srgb").coords as number[]);
    expect(channelDistance(s.hex, clipped)).toBeGreaterThan(1);
  });

  it("the same colour is marked when the chosen display is sRGB, by its fields; the note stays free for the user's text", () => {
    const s = swatch("P3 green", { XYZ: xyzOf("p3", [0.2, 0.8, 0.2]) }, { display: "sRGB" });
    expect(s.display).toBe("sRGB");
    expect(s.outOfDisplayGamut).toBe(true);
    // The report draws "◇ outside sRGB" and the legend calling the patch an approximation from these fields.
    expect(s.note).toBeUndefined();
    expect(
      swatch("P3 green", { XYZ: xyzOf("p3", [0.2, 0.8, 0.2]) }, { display: "sRGB", note: "invented" }).note,
    ).toBe("invented");
  });

  it("a colour outside Display P3 but inside BT.2020 is written as color(rec2020 …) with the BT.2020 OETF numbers", () => {
    // colorjs.io's "--rec2020-oetf" space encodes with ITU-R BT.2020-2 Table 4, which is what CSS `rec2020` meant when
    // Chromium implemented it (the browser test reads it back); colorjs.io's own "rec2020" follows a later draft
    // with a pure 2.4 gamma.
    const oetf: [number, number, number] = [0.15, 0.9, 0.1];
    const xyz = xyzOf("--rec2020-oetf", oetf);
    const s = swatch("BT.2020 green", { XYZ: xyz }, { display: "Display P3" });
    expect(s.inGamut).toEqual({ sRGB: false, displayP3: false, bt2020: true });
    expect(s.css).toMatch(/^color\(rec2020 /);
    cssNumbers(s.css!).forEach((v, i) => expect(v).toBeCloseTo(oetf[i]!, 3));
    expect(s.outOfDisplayGamut).toBe(true);
    expect(s.note).toBeUndefined();
    expect(swatch("BT.2020 green", { XYZ: xyz }, { display: "BT.2020" }).outOfDisplayGamut).toBe(false);
  });

  it("a spectral colour (520 nm) lies outside all three gamuts and is marked for every display", () => {
    // x̄, ȳ, z̄ at 520 nm of the CIE 1931 observer: 0.06327, 0.71000, 0.07825 (CIE 018:2019 Table 6, recalled from memory).
    const xyz = { X: 6.327, Y: 71.0, Z: 7.825 };
    for (const display of ["sRGB", "Display P3", "BT.2020"] as const) {
      const s = swatch("520 nm", { XYZ: xyz }, { display });
      expect(s.inGamut).toEqual({ sRGB: false, displayP3: false, bt2020: false });
      expect(s.outOfDisplayGamut).toBe(true);
      expect(s.css).toMatch(/^color\(rec2020 /);
      cssNumbers(s.css!).forEach((v) => expect(v >= 0 && v <= 1).toBe(true));
    }
  });

  it("swatches fit the runner's swatch record type and are plain JSON", () => {
    const records: SwatchRecord[] = swatchGrid([
      { label: "a", colour: { hex: "#336699" } },
      { label: "b", colour: { XYZ: xyzOf("p3", [0.9, 0.1, 0.1]) }, note: "invented" },
    ]);
    expect(JSON.parse(JSON.stringify(records))).toEqual(records);
    // The runner's own check of showSwatches input keeps every field as lib/plot wrote it.
    expect(swatchRecords(records)).toEqual(records.map(asRunnerKeepsIt));
    expect(records[1]!.note).toBe("invented");
    expect(records[1]!.inGamut?.sRGB).toBe(false);
  });

  it("a light brighter than the white is said to be that, not marked as outside a gamut, and shown as white as colorjs.io maps it", () => {
    // Invented: twice the white's luminance. CSS Color 4 §13.2 (colorjs.io's "css" method): OKLab L ≥ 1 gives white.
    // Its chromaticity is inside sRGB (every linear channel positive), so no gamut is wrong: only its level is.
    const xyz = { X: 190, Y: 200, Z: 120 };
    const ref = new Color("xyz-d65", [1.9, 2, 1.2]).toGamut({ space: "srgb", method: "css" }).to("srgb")
      .coords as number[];
    for (const display of ["sRGB", "BT.2020"] as const) {
      const s = swatch("flash", { XYZ: xyz }, { display });
      expect(s.hex).toBe(hexOf(ref));
      expect(s.outOfDisplayGamut).toBe(false);
      expect(s.outOfGamut).toBe(false);
      expect(s.note).toBe("brighter than the display's white, shown as white");
    }
  });

  it("marks nothing within the stated gamut tolerance: the RGB white at Y = 100.1 is white, not outside BT.2020", () => {
    // sRGB white = D65 (IEC 61966-2-1: x 0.3127, y 0.3290); 0.1 % above Y = 100 is within GAMUT_TOLERANCE (0.2 %).
    const white = { X: (0.3127 / 0.329) * 100.1, Y: 100.1, Z: ((1 - 0.3127 - 0.329) / 0.329) * 100.1 };
    const s = swatch("RGB white", { XYZ: white });
    expect(s.hex).toBe("#ffffff");
    expect(s.inGamut).toEqual({ sRGB: true, displayP3: true, bt2020: true });
    expect(s.outOfDisplayGamut).toBe(false);
    expect(s).not.toHaveProperty("note");
    expect(GAMUT_TOLERANCE).toBe(0.002);
    // Beyond the tolerance the words say what is wrong: brighter than white, still not a gamut error.
    const bright = swatch("RGB white", { XYZ: { X: white.X * 1.01, Y: 101.1, Z: white.Z * 1.01 } });
    expect(bright.outOfDisplayGamut).toBe(false);
    expect(bright.note).toMatch(/^brighter than the display's white/);
  });

  it("a colour that is not a colour is an error naming the swatch", () => {
    expect(() => swatch("x", { hex: "red" })).toThrow(/"red" is not an sRGB hex/);
    expect(() => swatch("y", { lab: { L: 50, a: Number.NaN, b: 0 } })).toThrow(
      /swatch: colour should be a colour: a spectrum, \{ XYZ, white\? \}, \{ lab, white\? \} or \{ hex \}, but got an object with key lab/,
    );
    expect(() => swatch("z", { XYZ: { X: 1, Y: 1, Z: 1 } }, { display: "Rec.709" as "sRGB" })).toThrow(
      /display "Rec.709"/,
    );
  });
});

describe.skipIf(!HAVE_REFERENCE)(
  `reference/sample pairs (${HAVE_REFERENCE ? "reference present" : NO_REFERENCE})`,
  () => {
    it("each sample's pair gives ΔE00 as Sharma, Wu & Dalal (2005) Table 1 does, for all 34 pairs", () => {
      const t = readReferenceCsv("sharma_ciede2000.csv");
      const [L1, a1, b1, L2, a2, b2, dE] = ["L1", "a1", "b1", "L2", "a2", "b2", "dE00"].map((c) =>
        t.column(c),
      );
      const pairs = L1!.map((_, i) => ({
        label: `pair ${i + 1}`,
        reference: { lab: { L: L1![i]!, a: a1![i]!, b: b1![i]! } },
        sample: { lab: { L: L2![i]!, a: a2![i]!, b: b2![i]! } },
      }));
      const out = swatchPairs(pairs);
      expect(out).toHaveLength(68);
      out.forEach((s, k) => {
        const n = Math.floor(k / 2) + 1;
        expect(s.note ?? "").not.toContain("ΔE00");
        if (k % 2 === 0) {
          expect(s.label).toBe(`pair ${n} reference`);
          return expect(s.pair).toEqual({ label: `pair ${n}`, role: "reference" });
        }
        expect(s.label).toBe(`pair ${n} sample`);
        expect(s.pair).toMatchObject({ label: `pair ${n}`, role: "sample" });
        // Unrounded: the table's 4 decimals, except pairs 21–24, whose second colour it prints rounded (see
        // test/lib/difference.test.ts).
        expect(Math.abs(s.pair!.deltaE00! - dE![n - 1]!)).toBeLessThanOrEqual(
          n >= 21 && n <= 24 ? 1.5e-3 : 5e-5,
        );
      });
    });

    it("pairs pass the runner's swatch check unchanged: explicit pairs, nothing left for its older note-based reading", () => {
      const out = swatchPairs([
        {
          label: "Chip 1",
          reference: { lab: { L: 52, a: 41.5, b: 27 } },
          sample: { lab: { L: 53.1, a: 39.8, b: 28.6 } },
        },
        {
          label: "Chip 2",
          reference: { lab: { L: 70, a: -30, b: 20 } },
          sample: { lab: { L: 69, a: -27.5, b: 21 } },
        },
      ]);
      expect(swatchRecords(out)).toEqual(out.map(asRunnerKeepsIt));
      // culori's CIEDE2000 (an independent implementation, npm registry) on the same CIELAB (D65) numbers. (colorjs.io's
      // deltaE2000 first converts to its D50 Lab, so it answers a different question here.)
      const ciede2000 = differenceCiede2000();
      const de = ([l1, a1, b1]: number[], [l2, a2, b2]: number[]) =>
        ciede2000({ mode: "lab65", l: l1!, a: a1!, b: b1! }, { mode: "lab65", l: l2!, a: a2!, b: b2! });
      expect(out[1]!.pair!.deltaE00).toBeCloseTo(de([52, 41.5, 27], [53.1, 39.8, 28.6]), 6);
      expect(out[3]!.pair!.deltaE00).toBeCloseTo(de([70, -30, 20], [69, -27.5, 21]), 6);
      expect(() =>
        swatchPairs([{ label: " ", reference: { hex: "#000000" }, sample: { hex: "#000000" } }]),
      ).toThrow(/pair 1 needs a label \(got " "\)/);
    });

    it("a pair whose members have different reference whites is refused", () => {
      expect(() =>
        swatchPairs([
          {
            label: "p",
            reference: { lab: { L: 50, a: 0, b: 0 } },
            sample: { lab: { L: 50, a: 0, b: 0 }, white: { X: 96.42, Y: 100, Z: 82.51 } },
          },
        ]),
      ).toThrow(/different reference whites/);
    });
  },
);
