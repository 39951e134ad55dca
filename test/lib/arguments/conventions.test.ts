/**
 * The library's conventions (issue 11, "One set of conventions"), each a trap met in a trial: the white follows the
 * sample's summation; lights and objects are summed over one kind of range; gamut results are fractions; luminous
 * factors refuse an observer; labels are kept; Methods statements say exactly what was done.
 * References: CIE 015:2018 eqs. 7.1–7.2 (a spectrally flat sample has the chromaticity of the white summed on the same
 * weighting table; with a factor of 0.5, a power of two, the sums are exactly halved), CIE 018:2019 (luminous
 * efficacy of radiation), the CIE 1931 colour-matching functions of /work/shared/reference when present.
 */
import { describe, expect, it } from "vitest";
import * as lib from "../../../lib/index.ts";
import { isArgumentError } from "../../../lib/arguments/argument-error.ts";

const flat5 = (value: number, quantity: "transmittance" | "reflectance") =>
  lib.spectrumOnGrid(380, 5, new Array(81).fill(value), {
    name: `flat ${100 * value} % (invented)`,
    quantity,
  });

describe("whitePoint follows the sample's interval and range", () => {
  it("a flat 50 % filter read at 5 nm has exactly the white's chromaticity, and passes a neutrality check without interval: 5", () => {
    const f = flat5(0.5, "transmittance");
    const XYZ = lib.tristimulus(f, { illuminant: "D65" });
    const white = lib.whitePoint({ illuminant: "D65", sample: f });
    expect(lib.chromaticityXy(XYZ)).toEqual(lib.chromaticityXy(white));
    expect(XYZ.Y).toBe(white.Y / 2);
    const lab = lib.labFromXYZ(XYZ, white);
    expect(Math.abs(lab.a) + Math.abs(lab.b)).toBeLessThan(1e-12);
    // It is the white objectColour returns, from the same table.
    expect(white).toEqual(lib.objectColour(f, { illuminant: "D65" }).white);
  });

  it("without a sample the white keeps the illuminant's own interval (D65 at 1 nm), which a 5 nm sample does not use", () => {
    const f = flat5(0.5, "transmittance");
    const alone = lib.chromaticityXy(lib.whitePoint({ illuminant: "D65" }));
    const sampleXy = lib.chromaticityXy(lib.tristimulus(f, { illuminant: "D65" }));
    expect(Math.abs(alone.x - sampleXy.x)).toBeGreaterThan(1e-6);
  });

  it("an explicit interval or range still wins", () => {
    const f = flat5(0.5, "transmittance");
    const w = lib.whitePoint({ illuminant: "D65", sample: f, interval: 1, range: [360, 830] });
    expect(w).toEqual(lib.whitePoint({ illuminant: "D65", interval: 1, range: [360, 830] }));
  });
});

describe("one summation range for lights and objects: the measured range within 360–830 nm", () => {
  it("the perfect diffuser under E measured 380–780 nm equals the light E over 380–780 nm", () => {
    const perfect = flat5(1, "reflectance");
    const e = lib.resample(lib.illuminant("E"), { start: 380, end: 780, step: 5 });
    const object = lib.objectColour(perfect, { illuminant: "E" });
    const light = lib.lightTristimulus(e);
    expect(object.range).toEqual([380, 780]);
    expect(object.XYZ.X).toBeCloseTo(light.X, 10);
    expect(object.XYZ.Z).toBeCloseTo(light.Z, 10);
  });

  it("the Methods statements of both name 380–780 nm and say that nothing was extrapolated", () => {
    lib.resetMethodLog();
    lib.objectColour(flat5(0.3, "reflectance"));
    lib.lightTristimulus(lib.resample(lib.illuminant("D65"), { start: 380, end: 780, step: 5 }));
    const integration = lib.methodsUsed().filter((n) => n.topic === "integration");
    expect(integration).toHaveLength(2);
    for (const n of integration) expect(n.statement).toContain("380–780 nm");
    expect(integration[0]!.statement).toContain("without extrapolation");
  });
});

describe("fractions everywhere", () => {
  it("gamutCoverage and gamutAreaRatio return fractions (sRGB inside Display P3: coverage 1)", () => {
    // Areas from the primaries of IEC 61966-2-1 and SMPTE EG 432-1 by the shoelace formula (see gamut.test.ts).
    expect(lib.gamutCoverage(lib.rgbSpace("Display P3"), lib.rgbSpace("sRGB"))).toBeCloseTo(1, 12);
    expect(lib.gamutAreaRatio(lib.rgbSpace("sRGB"), lib.rgbSpace("Display P3"))).toBeCloseTo(
      0.11205 / 0.152,
      12,
    );
  });
});

describe("luminous factors and observers", () => {
  it("luminousTransmittance refuses an observer and says that V(λ) is used", () => {
    try {
      lib.luminousTransmittance(flat5(0.5, "transmittance"), { observer: "10°" } as never);
      throw new Error("no error");
    } catch (e) {
      expect(isArgumentError(e)).toBe(true);
      expect((e as Error).message).toMatch(/^luminousTransmittance: options\.observer .*V\(λ\)/);
    }
  });
});

describe("labels and statements", () => {
  it("spectrumOnGrid keeps the label it is given, and a string as the name", () => {
    const s = lib.spectrumOnGrid(400, 10, [1, 2, 3], {
      name: "lamp (invented)",
      quantity: "radiance",
      unit: "W/(sr·m²·nm)",
    });
    expect([s.name, s.quantity, s.unit]).toEqual(["lamp (invented)", "radiance", "W/(sr·m²·nm)"]);
    expect(lib.spectrumOnGrid(400, 10, [1, 2, 3], "probe (invented)").name).toBe("probe (invented)");
  });

  it("luminousEfficacyOfRadiation says over which ranges the luminous sum and the radiant power were taken", () => {
    lib.resetMethodLog();
    // A source measured 300–830 nm: V(λ) covers only 360–830 nm, the radiant power is taken over all of it.
    const s = lib.spectrumOnGrid(300, 5, new Array(107).fill(1), {
      name: "flat (invented)",
      quantity: "radiance",
    });
    lib.luminousEfficacyOfRadiation(s);
    const note = lib.methodsUsed().find((n) => n.statement.startsWith("Luminous efficacy of radiation"))!;
    expect(note.statement).toContain("360–830 nm where the spectrum and V(λ) overlap");
    expect(note.statement).toContain("whole measured range, 300–830 nm");
  });

  it("a white used only for dominant wavelength is not reported as object colours under E", () => {
    lib.resetMethodLog();
    const white = lib.chromaticityXy(lib.whitePoint({ illuminant: "E" }));
    lib.dominantWavelength({ x: 0.6, y: 0.35 }, white);
    const text = lib
      .methodsUsed()
      .map((n) => n.statement)
      .join(" ");
    expect(text).not.toMatch(/object colours/i);
    expect(text).toContain("Reference whites were the perfect reflecting diffuser under CIE illuminant E");
  });

  it("a report of emitted light (light tristimulus, CCT, a D65 target white) says nothing of object colours", () => {
    lib.resetMethodLog();
    const lamp = lib.resample(lib.illuminant("A"), { start: 380, end: 780, step: 5 });
    lib.cctAndDuv(lib.chromaticityXy(lib.lightTristimulus(lamp)));
    lib.whitePoint({ illuminant: "D65" });
    expect(
      lib
        .methodsUsed()
        .map((n) => n.statement)
        .join(" "),
    ).not.toMatch(/object colours/i);
  });
});
