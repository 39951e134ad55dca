/**
 * Every statement the library writes to the methods log reads as a sentence of a lab report's Methods section: it
 * starts with a capital letter (the report no longer changes a statement's case, so "sRGB …" would stay lower-case),
 * has a finite verb ("… were computed …", not a bare noun phrase such as "CIE 1931 2° standard colorimetric
 * observer."), ends with a full stop, and states what was done, not a caution (cautions travel with results as a
 * `caution` field; notes/rules.md). The conventions are those of scientific report writing (common practice, no
 * source); the calls below reach every noteMethod call site in lib/ (the last test checks that by file).
 */
import { readdirSync, readFileSync, statSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import * as t from "../../lib/index.ts";
import { methodsUsed, resetMethodLog, type MethodNote } from "../../lib/methods/method-log.ts";

const grid5 = { start: 380, end: 780, step: 5 };
const on5 = (f: (w: number) => number, quantity: t.SpectralQuantity, name: string) => {
  const w = t.gridWavelengths(grid5);
  return t.spectrum(w, w.map(f), { quantity, name: `${name} (invented)` });
};

/** Calls every library function that notes a method (invented inputs), and returns what was noted, per file. */
function exercise(): Map<string, MethodNote[]> {
  const byFile = new Map<string, MethodNote[]>();
  const run = (file: string, f: () => unknown) => {
    resetMethodLog();
    f();
    byFile.set(file, [...(byFile.get(file) ?? []), ...methodsUsed()]);
  };
  const refl = on5((w) => 0.2 + 0.6 / (1 + Math.exp(-(w - 560) / 20)), "reflectance", "orange tile");
  const trans = on5((w) => 0.1 + 0.8 / (1 + Math.exp(-(w - 500) / 15)), "transmittance", "yellow glass");
  const lamp = on5((w) => 50 + 0.1 * (w - 380), "relative power", "lamp");
  const radiance = on5((w) => 0.01 * Math.exp(-(((w - 555) / 60) ** 2)), "radiance", "panel");
  const uneven = t.spectrum([380, 400, 450, 520, 600, 700, 780], [0.1, 0.2, 0.3, 0.5, 0.6, 0.6, 0.6], {
    quantity: "reflectance",
    name: "uneven (invented)",
  });

  run("colorimetry/tristimulus.ts", () => {
    t.objectColour(refl);
    t.whitePoint({ illuminant: "D50", range: t.CIE_015_TABLE_RANGE, interval: 5 });
    t.whitePoint({ illuminant: "FL2", range: [400, 700], interval: 5 });
    t.tristimulus(refl, { illuminant: "D50", interval: 1 }); // the illuminant interpolated to 1 nm
    t.lightTristimulus(lamp);
    t.lightTristimulus(lamp, { scale: "absolute" });
  });
  run("spectrum/sample.ts", () => {
    t.tristimulus(uneven, { interval: 1 });
    t.valueAt(refl, 300, { extrapolation: "zero" });
  });
  run("colorimetry/cielab.ts", () => t.labFromXYZ({ X: 40, Y: 40, Z: 40 }, t.whitePoint()));
  run("colorimetry/cieluv.ts", () => t.luvFromXYZ({ X: 40, Y: 40, Z: 40 }, t.whitePoint()));
  run("colorimetry/cie-uvw.ts", () => t.uvwFromXYZ({ X: 40, Y: 40, Z: 40 }, t.whitePoint()));
  run("colorimetry/dominant-wavelength.ts", () =>
    t.dominantWavelength({ x: 0.5, y: 0.4 }, { x: 0.3127, y: 0.329 }),
  );
  run("temperature/cct.ts", () => {
    t.cctAndDuv({ x: 0.4476, y: 0.4074 });
    t.cctAndDuv({ x: 0.4476, y: 0.4074 }, { method: "robertson" });
  });
  run("illuminants/planckian-radiator.ts", () => t.planckianSpectrum(3000));
  run("difference", () => {
    const a = { L: 50, a: 2.6772, b: -79.7751 },
      b = { L: 50, a: 0, b: -82.7485 };
    t.deltaE76(a, b);
    t.deltaE94(a, b);
    t.deltaE2000(a, b);
    t.deltaE2000(a, b, { kL: 2 });
    t.deltaECMC(a, b);
  });
  run("rgb/rgb-conversion.ts", () => {
    t.rgbFromXYZ({ X: 41.24, Y: 21.26, Z: 1.93 }, t.rgbSpace("sRGB"));
    t.rgbFromXYZ({ X: 41.24, Y: 21.26, Z: 1.93 }, t.rgbSpace("Display P3"), { encode: false });
  });
  run("adaptation/chromatic-adaptation.ts", () => {
    t.adaptXYZ({ X: 40, Y: 40, Z: 30 }, t.whitePoint({ illuminant: "A" }), t.whitePoint());
    t.adaptXYZ({ X: 40, Y: 40, Z: 30 }, t.whitePoint({ illuminant: "A" }), t.whitePoint(), "cat16", {
      degree: 0.8,
    });
  });
  run("gamut/gamut-area.ts", () => {
    t.gamutArea(t.rgbSpace("sRGB"), "xy");
    t.gamutCoverage(t.rgbSpace("sRGB"), t.rgbSpace("Display P3"), "u′v′");
  });
  run("photometry/photometric-quantities.ts", () => {
    t.luminance(radiance);
    t.luminance(radiance, { vision: "scotopic" });
    t.luminousEfficacyOfRadiation(radiance);
    t.scotopicPhotopicRatio(radiance);
    t.normaliseToLuminance(radiance, 100);
    t.luminousTransmittance(trans);
    t.luminousReflectance(refl);
  });
  run("rendering", () => {
    t.colourRenderingIndex(t.illuminant("FL2"));
    t.metamerismIndex(
      refl,
      on5((w) => 0.21 + 0.59 / (1 + Math.exp(-(w - 561) / 21)), "reflectance", "other tile"),
    );
    t.metamerismIndex(refl, refl, { correction: "additive", formula: "ΔE00" });
  });
  run("filters", () => {
    t.surfaceReflectanceAt(1.5, [500, 600]);
    t.externalTransmittance(trans, { refractiveIndex: 1.52 });
    t.scaleInternalTransmittance(trans, 2);
    t.opticalDensitySpectrum(trans);
    t.transmittanceFromDensitySpectrum(t.opticalDensitySpectrum(trans));
    t.longPassFilter(500);
    t.neutralDensityFilter(0.3);
    t.dyeFilter(
      on5((w) => Math.exp(-(((w - 600) / 40) ** 2)), "other", "absorbance"),
      { amount: 0.5 },
    );
    for (const join of [
      "no surface losses",
      "cemented",
      "air gaps",
      "air gaps with interreflection",
    ] as const) {
      t.stackTransmittance(
        [
          t.filterElement(trans, { refractiveIndex: 1.5, name: "A" }),
          t.filterElement(trans, { refractiveIndex: 1.52, name: "B" }),
        ],
        { join },
      );
    }
    t.sunglassCategory(0.25);
  });
  run("mixing", () => {
    t.ledSpectrum({ peak: 450, fwhm: 20 });
    t.ledSpectrum({ peak: 630, fwhm: 18, shape: "gaussian" });
    t.phosphorWhite({ blue: { peak: 450, fwhm: 20 }, phosphor: { peak: 560, fwhm: 110 }, phosphorToBlue: 3 });
    t.mixLights([
      { light: lamp, level: 0.5 },
      { light: lamp, level: 0.2 },
    ]);
    t.layeredTransmittance([trans, trans]);
    t.dyeMixture([
      { absorbance: on5((w) => Math.exp(-(((w - 600) / 40) ** 2)), "other", "dye"), concentration: 1 },
    ]);
    t.solveDriveLevels(
      [
        t.ledSpectrum({ peak: 630, fwhm: 18 }),
        t.ledSpectrum({ peak: 530, fwhm: 30 }),
        t.ledSpectrum({ peak: 455, fwhm: 20 }),
      ],
      { x: 0.3127, y: 0.329, Y: 1 },
    );
    const white = on5(() => 0.85, "reflectance", "white");
    const mass = on5((w) => 0.05 + 0.4 / (1 + Math.exp(-(w - 600) / 15)), "reflectance", "masstone");
    const tint = on5((w) => 0.3 + 0.5 / (1 + Math.exp(-(w - 600) / 15)), "reflectance", "tint");
    const { colourant, white: w2 } = t.colourantFromTint({ masstone: mass, tint, white, tintFraction: 0.1 });
    t.mixPaint([
      { colourant, amount: 1 },
      { colourant: w2, amount: 3 },
    ]);
    t.mixPaint([{ colourant, amount: 1 }], { layer: { thickness: 0.5, background: 0.8 } });
    t.mixPaint([{ colourant: t.singleConstantColourant(on5(() => 0.3, "other", "K/S")), amount: 1 }], {
      surface: "none",
    });
  });
  run("halftone", () => {
    const paper = on5(() => 0.9, "reflectance", "paper"),
      cyan = on5((w) => (w < 550 ? 0.6 : 0.1), "reflectance", "cyan");
    t.murrayDavies(0.4, cyan, paper);
    t.toneValueFromDensity(0.5, 1.4);
    t.yuleNielsen(0.4, cyan, paper, 1.7);
    t.effectiveCoverage(t.yuleNielsen(0.4, cyan, paper, 1.7), cyan, paper, 1.7);
    t.neugebauerReflectance({ c: 0.4 }, { paper, c: cyan });
    t.neugebauerReflectance({ c: 0.4 }, { paper, c: cyan }, { n: 1.7 });
  });
  run("files", () => {
    t.parseSpectraCsv("nm,a,b\n400,10.5,20\n410,12.25,22\n", { quantity: "transmittance" });
    t.parseSpectraCsv("nm;a\n400;0,5\n410;0,6\n", { quantity: "reflectance" });
    t.parseSpectraCsv("nm\ta\n400\t1\n410\t2\n", { quantity: "transmittance", scale: "percent" });
    t.formatSpectraCsv([refl], { scale: "percent" });
    const text = t.formatCgats({ spectra: [refl], keywords: { DESCRIPTOR: "invented" }, scale: "percent" });
    t.cgatsSpectra(t.parseCgats(text), { quantity: "reflectance" });
    // Measurement-file readers (invented tables): preamble, µm, descending, across, Windows-1252, uneven grid, readings.
    t.parseSpectralTable(Buffer.from("Operator: x\nwl;a\n0,41;50\n0,40;60\n", "latin1"), {
      quantity: "reflectance",
    });
    t.parseSpectralTable("ID,Lot,400,410,430\nA,1,0.1,0.2,0.3\n", {
      quantity: "reflectance",
      unevenGrid: "accept",
    });
    t.parseColourReadings("Bench: x\nname;L*;a*;b*\nA;50,5;1;2\n", { units: { Lab: "" } });
    t.parseColourReadings(text);
  });
  run("colorimetry/astm-weights.ts", () => {
    const tenNm = t.spectrumOnGrid(400, 10, new Array(31).fill(0.5), { quantity: "reflectance" });
    t.astmWeightingFactors({ interval: 20, illuminant: "D50", bandpass: "included" });
    t.bandpassCorrection(tenNm);
    t.objectColour(tenNm);
    t.whitePoint({ interval: 10 });
  });
  run("uncertainty", () => {
    const blank = on5(() => 0.6, "transmittance", "blank");
    const inputs = {
      s: t.spectralInput(blank, {
        scale: 0.002,
        bandNoise: 0.001,
        correlatedNoise: { u: 0.001, length: 30 },
        wavelengthShift: 0.2,
        bandwidthError: { bandwidth: 5, u: 0.2 },
      }),
      k: t.normalInput(1, 0.01),
      r: t.rectangularInput(0, 0.01, "nm"),
      q: t.triangularInput(0, 0.01),
    };
    const model = (v: Record<string, unknown>) => (v.k as number) * (v.s as { values: number[] }).values[3]!;
    t.monteCarloUncertainty(model, inputs, { trials: 200 });
    t.monteCarloUncertainty(
      (v) => Math.exp(10 * (v.k as number)),
      { k: t.normalInput(1, 0.3) },
      { trials: 500 },
    );
    t.firstOrderUncertainty(model, inputs);
  });
  // Display and HDR measurement (issue 14), invented readings.
  run("display and HDR", () => {
    const a = t.ictcpFromXYZ({ X: 95, Y: 100, Z: 108 });
    t.ictcpFromLinearRgb({ r: 0.5, g: 0.4, b: 0.3 }, { transfer: "HLG" });
    t.deltaEItp(a, t.ictcpFromXYZ({ X: 40, Y: 30, Z: 10 }));
    t.deltaEz(t.jzazbzFromXYZ({ X: 95, Y: 100, Z: 108 }), t.jzazbzFromXYZ({ X: 40, Y: 30, Z: 10 }));
    const white = { X: 95.05, Y: 100, Z: 108.88 };
    for (const model of ["CAM16", "CIECAM02"] as const) {
      const v = t.viewingConditions({ white, adaptingLuminance: 64, model });
      t.deltaECam16Ucs(t.cam16Ucs(t.colourAppearance({ X: 40, Y: 30, Z: 10 }, v)), { J: 50, a: 0, b: 0 });
    }
    t.ycbcrCodeValues(t.ycbcrFromRgbSignal({ r: 1, g: 0, b: 0 }, "BT.709"), { bits: 8, range: "narrow" });
    t.codeValueSignal(512, { bits: 10, range: "full" });
    t.deltaUvPrime({ x: 0.3127, y: 0.329 }, { X: 95, Y: 100, Z: 100 });
    t.subtractBlack({ X: 20, Y: 21, Z: 22 }, { X: 0.1, Y: 0.1, Z: 0.1 });
    t.sequentialContrast(250, 0.2);
    t.checkerboardContrast([180, 181], [0.4, 0.41]);
    const ramp = [0, 0.25, 0.5, 0.75, 1].map((s) => ({ signal: s, luminance: 0.1 + 200 * s ** 2.2 }));
    t.fitEotf(ramp);
    t.fitEotf(ramp, { model: "BT.1886" });
    t.greyscaleTracking([{ signal: 1, xyz: white }], { black: { X: 0.1, Y: 0.1, Z: 0.1 } });
    t.pqTracking([{ code: 520, luminance: 100 }], {
      format: { bits: 10, range: "full" },
      tolerance: 0.05,
      peakLuminance: 1000,
    });
    t.displayUniformity([[white, white, white]]);
    t.primariesAgainstTarget({ red: white, green: white, blue: white, white }, "DCI-P3");
  });
  // Cones, colour-vision deficiency, cameras and demo spectra (issue 15).
  run("vision/cone-excitations.ts", () => {
    t.coneExcitations(lamp);
    t.coneExcitations(refl, { fundamentals: "10°" });
  });
  run("vision/deficiency.ts", () => {
    for (const method of ["Brettel 1997", "Viénot 1999", "Machado 2009"] as const)
      t.simulateDeficiencyRgb({ r: 0.7, g: 0.3, b: 0.2 }, "deutan", { method });
  });
  run("camera/camera-rgb.ts", () => {
    t.cameraRgb(refl, t.inventedCameraSensor());
    t.cameraRgb(lamp, t.inventedCameraSensor());
  });
  run("camera/colour-correction.ts", () => {
    const rgb = [0, 1, 2, 3, 4, 5, 6].map((i) => ({
      r: 0.1 + 0.1 * i,
      g: 0.5 - 0.05 * i,
      b: 0.2 + 0.03 * i * i,
    }));
    const xyz = rgb.map((c) => ({ X: 40 * c.r + 30 * c.g + 10 * c.b, Y: 20 * c.r + 70 * c.g, Z: 90 * c.b }));
    t.fitColourCorrection(rgb, xyz);
    t.fitColourCorrection(rgb, xyz, { model: "root-polynomial" });
  });
  run("camera/luther-ives.ts", () => t.lutherIvesMeasure(t.inventedCameraSensor(), { illuminant: "D65" }));
  run("camera/metamer-pairs.ts", () =>
    t.metamerPair(
      on5(() => 0.5, "reflectance", "grey"),
      t.inventedCameraSensor(),
    ),
  );
  run("synthesis/reflectance-from-srgb.ts", () => t.reflectanceFromSrgb({ r: 0.7, g: 0.4, b: 0.3 }));
  run("filters/notch-filter.ts", () => t.notchFilter(589, 20));
  run("mixing/efficient-drive-levels.ts", () =>
    t.mostEfficientDriveLevels(
      [450, 530, 590, 630].map((peak) => t.ledSpectrum({ peak, fwhm: 25 })),
      { x: 0.3127, y: 0.329, Y: 100 },
    ),
  );
  return byFile;
}

const notes = exercise();
const all = [...notes.values()].flat();

describe("Methods statements are full sentences", () => {
  it("the exercise produced statements under every topic the library uses", () => {
    const topics = new Set(all.map((n) => n.topic));
    for (const topic of [
      "observer",
      "illuminant",
      "interpolation",
      "extrapolation",
      "integration",
      "colour space",
      "colour temperature",
      "colour difference",
      "chromatic adaptation",
      "photometry",
      "normalisation",
      "rgb encoding",
      "gamut",
      "optics",
      "mixing",
      "halftone",
      "colour rendering",
      "data files",
      "uncertainty",
    ]) {
      expect(topics, topic).toContain(topic);
    }
    expect(new Set(all.map((n) => n.statement)).size).toBeGreaterThan(60);
  });

  it.each([...new Set(all.map((n) => n.statement))])("%s", (statement) => {
    expect(statement).toMatch(/^\p{Lu}/u); // capitalised: never "sRGB …" or "values …" first
    expect(statement).toMatch(/[.]$/); // ends as a sentence
    expect(statement).toMatch(/\b(was|were|is|are|follow|used)\b/); // has a finite verb, so it is not a bare noun phrase
    expect(statement).not.toMatch(/[Cc]aution|informative only/); // cautions go with results, not into Methods
    expect(statement).not.toMatch(
      /\b[A-Z]{5,}\b(?<!CIELAB|CIELUV|CIEDE|SMPTE|LEUKOS|ASTM|CGATS|IUPAC|DELIMITER)/,
    ); // no shouting
  });

  it("every file of lib/ that calls noteMethod was reached by the exercise", () => {
    const libDir = fileURLToPath(new URL("../../lib/", import.meta.url));
    const files: string[] = [];
    const walk = (dir: string) => {
      for (const name of readdirSync(dir)) {
        const p = dir + name;
        if (statSync(p).isDirectory()) walk(p + "/");
        else if (
          p.endsWith(".ts") &&
          !p.includes("/methods/") &&
          /\bnoteMethod\(/.test(readFileSync(p, "utf8"))
        )
          files.push(p.slice(libDir.length));
      }
    };
    walk(libDir);
    // Each such file has a distinctive phrase of its statements; the exercise must have produced it.
    const phrase: Record<string, RegExp> = {
      "colorimetry/tristimulus.ts":
        /Tristimulus values of object colours|Tristimulus values of light sources/,
      "spectrum/sample.ts": /interpolated by|beyond the measured range/,
      "colorimetry/cielab.ts": /CIELAB/,
      "colorimetry/cieluv.ts": /CIELUV/,
      "colorimetry/cie-uvw.ts": /U\*V\*W\* coordinates/,
      "colorimetry/dominant-wavelength.ts": /Dominant or complementary/,
      "temperature/cct.ts": /Ohno's combined/,
      "illuminants/planckian-radiator.ts": /Planckian radiators were computed/,
      "difference/delta-e-76.ts": /ΔE\*ab were computed/,
      "difference/delta-e-94.ts": /ΔE\*94/,
      "difference/delta-e-2000.ts": /CIEDE2000/,
      "difference/delta-e-cmc.ts": /CMC/,
      "rgb/rgb-conversion.ts": /Conversions between XYZ and sRGB RGB/,
      "adaptation/chromatic-adaptation.ts": /adapted between reference whites/,
      "gamut/gamut-area.ts": /Gamut coverage was computed/,
      "photometry/photometric-quantities.ts": /Luminous transmittance τv/,
      "rendering/colour-rendering-index.ts": /CIE 13\.3-1995/,
      "rendering/metamerism-index.ts": /metamerism indices/,
      "filters/fresnel.ts": /Fresnel/,
      "filters/plate.ts": /plate relation/,
      "filters/beer-lambert.ts": /scaled to other thicknesses/,
      "filters/optical-density.ts": /Optical densities/,
      "filters/parametric-filters.ts": /Parametric/,
      "filters/filter-stack.ts": /Filter stacks were computed/,
      "filters/sunglass-category.ts": /Sunglass-type/,
      "mixing/led-spectrum.ts": /LED spectra were modelled/,
      "mixing/saunderson.ts": /Saunderson/,
      "mixing/mix-lights.ts": /mixed additively/,
      "mixing/transparent-layers.ts": /Transparent layers/,
      "mixing/drive-levels.ts": /Drive levels/,
      "mixing/paint-mixing.ts": /Two-constant K and S were derived/,
      "halftone/murray-davies.ts": /Murray–Davies/,
      "halftone/yule-nielsen.ts": /Effective dot coverages/,
      "halftone/neugebauer.ts": /Neugebauer/,
      "files/spectral-csv-read.ts": /A spectral table of/,
      "files/spectral-csv-write.ts": /Spectral tables were written/,
      "files/cgats-read.ts": /A CGATS\.17 file/,
      "files/cgats-fields.ts": /were taken from CGATS spectral fields/,
      "files/cgats-write.ts": /CGATS\.17 text was written/,
      "files/colour-readings-read.ts": /A table of colorimetric readings/,
      "colorimetry/astm-weights.ts": /method of ASTM E2022|Stearns–Stearns method/,
      "uncertainty/monte-carlo.ts": /Monte Carlo method of JCGM 101/,
      "uncertainty/first-order.ts": /law of propagation of uncertainty to first order/,
      "uncertainty/method-statements.ts": /was modelled as a normal distribution/,
      // Display and HDR measurement (issue 14).
      "appearance/ictcp.ts": /ICtCp was computed per ITU-R BT\.2100-2 .*HLG/,
      "appearance/delta-e-itp.ts": /ΔE ITP were computed/,
      "appearance/jzazbz.ts": /ΔEz were computed/,
      "appearance/cam16.ts": /CIECAM02 viewing conditions were/,
      "appearance/cam16-ucs.ts": /CAM16-UCS/,
      "video/code-values.ts": /8-bit narrow-range integer code values/,
      "display/delta-uv.ts": /Chromaticity differences Δu′v′/,
      "display/black-and-contrast.ts": /Checkerboard contrast was computed/,
      "display/eotf-fit.ts": /BT\.1886-form EOTFs/,
      "display/greyscale-tracking.ts": /Grey-scale tracking was computed/,
      "display/pq-tracking.ts": /clipped at the display peak/,
      "display/uniformity.ts": /Uniformity was computed over a 1 × 3 grid/,
      "display/primaries-check.ts": /compared with those of DCI-P3/,
      "vision/cone-excitations.ts": /Cone excitations were summed/,
      "vision/deficiency.ts": /simulated by the (method|single-plane matrix|matrices)/,
      "camera/camera-rgb.ts": /Camera RGB values/,
      "camera/colour-correction.ts": /colour-correction matrix|root-polynomial colour correction/,
      "camera/luther-ives.ts": /Luther–Ives condition was measured/,
      "camera/metamer-pairs.ts": /Metameric pairs were made/,
      "synthesis/reflectance-from-srgb.ts": /least-slope-squared/,
      "filters/notch-filter.ts": /band-stop filters/,
      "mixing/efficient-drive-levels.ts": /highest luminous efficacy/,
    };
    const text = all.map((n) => n.statement).join("\n");
    for (const f of files) {
      expect(phrase[f], `no phrase listed for ${f}: add its statements to the exercise`).toBeDefined();
      expect(text, f).toMatch(phrase[f]!);
    }
  });
});
