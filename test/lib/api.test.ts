/**
 * The public names of the colorimetry library are part of the interface (issue 3, "Names"): they must stay
 * reachable from the library's entry point lib/index.ts ("tristim" in cells).
 */
import { describe, expect, it } from "vitest";
import * as tristim from "../../lib/index.ts";

const FUNCTIONS = [
  // spectra
  "spectrum",
  "spectrumOnGrid",
  "spectrumFromPairs",
  "withValues",
  "valueAt",
  "sampler",
  "resample",
  "resampleAt",
  "multiplySpectra",
  "addSpectra",
  "divideSpectra",
  "scaleSpectrum",
  "alignSpectra",
  "overlapGrid",
  "normaliseToPeak",
  "normaliseAt",
  "trimSpectrum",
  "spectrumSet",
  "pickSpectrum",
  "gridWavelengths",
  // observers and illuminants
  "observerByName",
  "colourMatchingAt",
  "illuminant",
  "illuminantNames",
  "illuminantA",
  "daylightSpectrum",
  "daylightChromaticity",
  "planckianSpectrum",
  "planckExitance",
  // colorimetry
  "tristimulus",
  "whitePoint",
  "objectColour",
  "commonSummationInterval",
  "weightingTable",
  "lightTristimulus",
  "chromaticityXy",
  "toXyY",
  "fromXyY",
  "uvPrimeFromXYZ",
  "uvPrimeFromXy",
  "xyFromUvPrime",
  "uv1960FromXy",
  "xyFromUv1960",
  "labFromXYZ",
  "xyzFromLab",
  "lchFromLab",
  "labFromLch",
  "luvFromXYZ",
  "xyzFromLuv",
  "lchFromLuv",
  "luvFromLch",
  "saturationUv",
  "uvwFromXYZ",
  "dominantWavelength",
  "spectrumLocus",
  // colour temperature
  "cctAndDuv",
  "cctFromSpectrum",
  "chromaticityAtCct",
  "planckianChromaticity",
  "planckianUv",
  // differences
  "deltaE76",
  "deltaE94",
  "deltaE2000",
  "deltaECMC",
  "ciede2000Terms",
  // RGB, adaptation, gamut
  "rgbSpace",
  "rgbSpaceFromPrimaries",
  "rgbSpaceNames",
  "rgbFromXYZ",
  "xyzFromRgb",
  "isInGamut",
  "transferFunction",
  "srgbEncode",
  "srgbDecode",
  "gammaEncode",
  "gammaDecode",
  "bt709Encode",
  "bt709Decode",
  "bt1886Eotf",
  "bt1886InverseEotf",
  "pqEncode",
  "pqDecode",
  "hlgEncode",
  "hlgDecode",
  "hlgDisplayLight",
  "adaptXYZ",
  "adaptationMatrix",
  "gamutArea",
  "gamutCoverage",
  "gamutIntersectionArea",
  "gamutAreaRatio",
  // photometry
  "luminousEfficiency",
  "luminousFlux",
  "luminance",
  "illuminance",
  "luminousIntensity",
  "luminousEfficacyOfRadiation",
  "scotopicPhotopicRatio",
  "normaliseToLuminance",
  "luminousTransmittance",
  "luminousReflectance",
  // method log
  "noteMethod",
  "methodsUsed",
  "resetMethodLog",
  "withoutMethodNotes",
  "methodNotesActive",
  // measurement uncertainty (issue 13)
  "normalInput",
  "rectangularInput",
  "triangularInput",
  "spectralInput",
  "monteCarloUncertainty",
  "firstOrderUncertainty",
  "uncertaintyText",
];

describe("public API of the colorimetry library", () => {
  it.each(FUNCTIONS)("%s is exported as a function", (name) => {
    expect(typeof (tristim as Record<string, unknown>)[name]).toBe("function");
  });
  it("constants: Km = 683 lm/W, K′m = 1700 lm/W, c2 = 1.4388e-2 m·K, the CIE 015 table range", () => {
    expect(tristim.KM).toBe(683);
    expect(tristim.KM_SCOTOPIC).toBe(1700);
    expect(tristim.C2_CIE).toBe(1.4388e-2);
    expect(tristim.CIE_015_TABLE_RANGE).toEqual([380, 780]);
  });
});
