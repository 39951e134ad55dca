/**
 * Photometry: Km = 683 lm/W and K′m = 1700 lm/W (CIE 018:2019), V(λ) equal to ȳ(λ) (CIE 018 / ../shared/reference),
 * scotopic/photopic ratio of equal energy from the published table sums, luminous transmittance as Y/100.
 */
import { describe, expect, it } from "vitest";
import { tristimulus } from "../../lib/colorimetry/tristimulus.ts";
import { illuminant } from "../../lib/illuminants/standard-illuminant.ts";
import { methodsUsed, resetMethodLog } from "../../lib/methods/method-log.ts";
import { KM, KM_SCOTOPIC, luminousEfficiency } from "../../lib/photometry/luminous-efficiency.ts";
import {
  illuminance,
  luminance,
  luminousEfficacyOfRadiation,
  luminousFlux,
  luminousIntensity,
  luminousReflectance,
  luminousTransmittance,
  normaliseToLuminance,
  scotopicPhotopicRatio,
} from "../../lib/photometry/photometric-quantities.ts";
import { SAFETY_DECISION_CAUTION } from "../../lib/photometry/safety-caution.ts";
import { transmittedLight } from "../../lib/filters/transmitted-light.ts";
import { spectrum, spectrumOnGrid } from "../../lib/spectrum/spectrum.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "./reference-data.ts";

const line = (
  nm: number,
  watts: number,
  quantity: "radiant flux" | "radiance" | "irradiance" | "other" = "radiant flux",
) => spectrum([nm - 1, nm, nm + 1], [0, watts, 0], { quantity, name: `${nm} nm line` });

describe("photometric quantities", () => {
  it("1 W at 555 nm is 683 lm; the constants are Km = 683 lm/W and K′m = 1700 lm/W (CIE 018:2019)", () => {
    expect(KM).toBe(683);
    expect(KM_SCOTOPIC).toBe(1700);
    expect(luminousFlux(line(555, 1))).toBeCloseTo(683, 9); // V(555 nm) = 1 (CIE 018:2019 Table 1)
    expect(luminance(line(555, 2, "radiance"))).toBeCloseTo(1366, 9);
    expect(illuminance(line(555, 0.5, "irradiance"))).toBeCloseTo(341.5, 9);
    expect(luminousIntensity(line(555, 1, "other"))).toBeCloseTo(683, 9);
    // 1 W at 507 nm seen scotopically: V′(507 nm) = 1 (CIE 018:2019 Table 2) → 1700 lm
    expect(luminousFlux(line(507, 1), { vision: "scotopic" })).toBeCloseTo(1700, 9);
  });

  it.skipIf(!HAVE_REFERENCE)(
    "V(λ) is the CIE photopic table, identical to ȳ(λ) (cie_sle_photopic_1nm.csv) " +
      (HAVE_REFERENCE ? "" : NO_REFERENCE),
    () => {
      const t = readReferenceCsv("cie_sle_photopic_1nm.csv");
      const v = luminousEfficiency("photopic");
      expect(v.wavelengths).toEqual(t.column("wavelength_nm"));
      expect(v.values).toEqual(t.column("V"));
      const s = readReferenceCsv("cie_sle_scotopic_1nm.csv");
      expect(luminousEfficiency("scotopic").values).toEqual(s.column("V_prime"));
    },
  );

  it("S/P ratio of equal energy equals 1700·ΣV′/(683·ΣV) from the table sums in ../shared/reference/README.md (97.0713166 and 106.856917)", () => {
    const e = spectrumOnGrid(360, 1, new Array(471).fill(1), { quantity: "relative power" });
    expect(scotopicPhotopicRatio(e)).toBeCloseTo((1700 * 97.0713166) / (683 * 106.856917), 6);
  });

  it("S/P ratio of illuminant A is 1.41 (commonly quoted for incandescent light; recalled from memory)", () => {
    expect(scotopicPhotopicRatio(illuminant("A"))).toBeCloseTo(1.41, 2);
  });

  it("luminous efficacy of radiation of equal energy over 360–830 nm is 683·ΣV/470 nm (from the table sum 106.856917)", () => {
    const e = spectrumOnGrid(360, 1, new Array(471).fill(1), { quantity: "relative power" });
    // Σ S Δλ over 471 samples at 1 nm is 471
    expect(luminousEfficacyOfRadiation(e)).toBeCloseTo((683 * 106.856917) / 471, 6);
  });

  it("normaliseToLuminance scales a radiance to the requested luminance", () => {
    const s = normaliseToLuminance(spectrum([500, 550, 600], [1, 2, 1], { quantity: "radiance" }), 250);
    expect(luminance(s)).toBeCloseTo(250, 9);
  });

  it("luminous transmittance is Y/100 under D65 by default, A when asked; a neutral filter keeps its value", () => {
    const neutral = spectrumOnGrid(360, 5, new Array(95).fill(0.37), { quantity: "transmittance" });
    expect(luminousTransmittance(neutral)).toBeCloseTo(0.37, 12);
    const yellow = spectrumOnGrid(
      380,
      10,
      [
        0.05, 0.05, 0.06, 0.08, 0.1, 0.2, 0.4, 0.6, 0.75, 0.8, 0.85, 0.87, 0.88, 0.88, 0.89, 0.9, 0.9, 0.9,
        0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9, 0.9,
        0.9, 0.9, 0.9,
      ],
      { quantity: "transmittance", name: "invented yellow filter" },
    );
    expect(luminousTransmittance(yellow)).toBeCloseTo(tristimulus(yellow, { illuminant: "D65" }).Y / 100, 12);
    expect(luminousTransmittance(yellow, { illuminant: "A" })).toBeCloseTo(
      tristimulus(yellow, { illuminant: "A" }).Y / 100,
      12,
    );
    const refl = spectrumOnGrid(360, 5, new Array(95).fill(0.5), { quantity: "reflectance" });
    expect(luminousReflectance(refl)).toBeCloseTo(0.5, 12);
  });

  it("keeps the Methods statement factual: the safety caution travels with results, not in Methods", () => {
    // The rule (notes/rules.md): a result that could feed a safety decision shows a caution beside it; the Methods
    // section records what was computed. transmittedLight's result carries the caution as a field the report shows.
    resetMethodLog();
    const filter = spectrumOnGrid(360, 5, new Array(95).fill(0.2), { quantity: "transmittance" });
    luminousTransmittance(filter);
    const text = methodsUsed()
      .map((n) => n.statement)
      .join(" ");
    expect(text).toMatch(/Luminous transmittance τv was computed/);
    expect(text).not.toMatch(/[Cc]aution|informative only/);
    const light = transmittedLight(filter);
    expect(light.luminousTransmittance).toBeCloseTo(0.2, 12);
    expect(light.caution).toBe(SAFETY_DECISION_CAUTION);
    expect(light.caution).toMatch(/eye protection, signal lights/);
    expect(light.caution).toMatch(/accredited/);
  });

  it("refuses mismatched quantities and bad targets, naming them", () => {
    expect(() => illuminance(line(555, 1, "radiance"))).toThrow(/radiance spectrum/);
    expect(() =>
      luminousTransmittance(
        spectrumOnGrid(380, 5, [0.1, 0.2, 0.3, 0.4, 0.5, 0.6], { quantity: "reflectance" }),
      ),
    ).toThrow(/reflectance spectrum/);
    expect(() => normaliseToLuminance(line(555, 1, "radiance"), NaN)).toThrow(/NaN/);
    expect(() =>
      luminousFlux(spectrum([900, 950], [1, 1], { quantity: "radiant flux", name: "infrared" })),
    ).toThrow(/infrared/);
    expect(() => luminousEfficiency("mesopic" as never)).toThrow(/mesopic/);
  });
});
