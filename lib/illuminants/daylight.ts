/** CIE daylight illuminants from the components S0, S1, S2 (CIE 015:2018 §4.1.2, eqs. 4.3–4.7). */
import { CIE_DAYLIGHT_COMPONENTS_TABLE } from "../data/cie-daylight-components.ts";
import { spectrumOnGrid, type Spectrum } from "../spectrum/spectrum.ts";
import type { Chromaticity } from "../colorimetry/chromaticity.ts";
import { XY_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkBoolean } from "../arguments/check-text.ts";

/**
 * Chromaticity (x_D, y_D) of CIE daylight at a correlated colour temperature of 4000–25000 K.
 *
 * @param cct The correlated colour temperature, in K (4000–25000).
 * @returns { x, y } in CIE 1931 xy.
 * @source CIE 015:2018 eqs. 4.5–4.6.
 * @example daylightChromaticity(6504)
 */
export function daylightChromaticity(cct: number): Chromaticity {
  checkNumber("daylightChromaticity", "cct", cct, { unit: "K", min: 4000, max: 25000 });
  if (!Number.isFinite(cct) || cct < 4000 || cct > 25000) {
    throw new Error(
      `daylight chromaticity: CIE 015 defines daylight from 4000 K to 25000 K; ${cct} K is outside that range`,
    );
  }
  const t = cct;
  const x =
    t <= 7000
      ? -4.607e9 / t ** 3 + 2.9678e6 / t ** 2 + 0.09911e3 / t + 0.244063
      : -2.0064e9 / t ** 3 + 1.9018e6 / t ** 2 + 0.24748e3 / t + 0.23704;
  const y = -3.0 * x * x + 2.87 * x - 0.275;
  return { x, y };
}

/**
 * The factors M1 and M2 of the daylight components S1 and S2 for a daylight chromaticity.
 *
 * @param xy The daylight chromaticity { x, y } (CIE 1931).
 * @param roundToThreeDecimals Round M1 and M2 to 3 decimals as the CIE tables of D50, D55, D75 do; default false.
 * @returns [M1, M2], dimensionless.
 * @source CIE 015:2018 eq. 4.7.
 * @example daylightFactors(daylightChromaticity(6504))
 */
export function daylightFactors(xy: Chromaticity, roundToThreeDecimals = false): [number, number] {
  checkFields("daylightFactors", "xy", xy, XY_FIELDS);
  checkBoolean("daylightFactors", "roundToThreeDecimals", roundToThreeDecimals);
  const m = 0.0241 + 0.2562 * xy.x - 0.7341 * xy.y;
  let m1 = (-1.3515 - 1.7703 * xy.x + 5.9114 * xy.y) / m;
  let m2 = (0.03 - 31.4424 * xy.x + 30.0717 * xy.y) / m;
  if (roundToThreeDecimals) {
    m1 = Math.round(m1 * 1000) / 1000;
    m2 = Math.round(m2 * 1000) / 1000;
  }
  return [m1, m2];
}

/**
 * Relative spectral power of CIE daylight at a correlated colour temperature, S(λ) = S0 + M1·S1 + M2·S2, 300–830 nm at 5 nm.
 *
 * @param cct The correlated colour temperature, in K (4000–25000).
 * @param options.roundFactors Round M1 and M2 to 3 decimals, as CIE 015:2018 does for the tabulated D50, D55, D75; default false.
 * @param options.name The spectrum's name; default "CIE daylight <cct> K".
 * @returns A "relative power" `Spectrum`, 300–830 nm every 5 nm.
 * @source CIE 015:2018 §4.1.2, eqs. 4.3–4.7.
 * @example daylightSpectrum(5003, { roundFactors: true })
 */
export function daylightSpectrum(
  cct: number,
  options: { roundFactors?: boolean; name?: string } = {},
): Spectrum {
  checkNumber("daylightSpectrum", "cct", cct, { unit: "K", min: 4000, max: 25000 });
  checkOptions("daylightSpectrum", "options", options, ["roundFactors", "name"]);
  const [m1, m2] = daylightFactors(daylightChromaticity(cct), options.roundFactors ?? false);
  const t = CIE_DAYLIGHT_COMPONENTS_TABLE;
  const s0 = t.columns.S0!,
    s1 = t.columns.S1!,
    s2 = t.columns.S2!;
  return spectrumOnGrid(
    t.start,
    t.step,
    s0.map((v, i) => v + m1 * s1[i]! + m2 * s2[i]!),
    { name: options.name ?? `CIE daylight ${cct} K`, quantity: "relative power" },
  );
}
