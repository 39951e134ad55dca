/** CIE illuminants by name: A, D50, D55, D65, D75, E, FL1–FL12, FL3.1–FL3.15 and the LED series (CIE 015:2018). */
import { CIE_D65_TABLE } from "../data/cie-d65.ts";
import { CIE_FLUORESCENT_TABLE } from "../data/cie-fluorescent.ts";
import { CIE_LED_TABLE } from "../data/cie-led.ts";
import { tableColumn } from "../data/table-to-spectrum.ts";
import { spectrumOnGrid, type Spectrum } from "../spectrum/spectrum.ts";
import { daylightSpectrum } from "./daylight.ts";
import { illuminantA } from "./illuminant-a.ts";
import { checkWith } from "../arguments/check-with.ts";
import { sharedTable } from "../data/shared-tables.ts";

/**
 * The nominal CCTs of D50, D55, D75 corrected for the change of c2 from 1.4380e-2 to 1.4388e-2 m·K
 * (T = nominal × 1.4388/1.4380, CIE 015:2018 §4.1.2), with M1, M2 rounded to 3 decimals as the CIE tables are.
 */
function cieDaylight(nominal: number, name: string): Spectrum {
  return daylightSpectrum((nominal * 1.4388) / 1.438, { roundFactors: true, name });
}

const BUILDERS: Record<string, () => Spectrum> = {
  A: () => illuminantA(),
  D50: () => cieDaylight(5000, "CIE illuminant D50"),
  D55: () => cieDaylight(5500, "CIE illuminant D55"),
  D65: () =>
    tableColumn(CIE_D65_TABLE, "D65", { name: "CIE standard illuminant D65", quantity: "relative power" }),
  D75: () => cieDaylight(7500, "CIE illuminant D75"),
  E: () =>
    spectrumOnGrid(300, 1, new Array<number>(531).fill(100), {
      name: "CIE illuminant E (equal energy)",
      quantity: "relative power",
    }),
};
for (const name of Object.keys(CIE_FLUORESCENT_TABLE.columns)) {
  BUILDERS[name] = () =>
    tableColumn(CIE_FLUORESCENT_TABLE, name, { name: `CIE illuminant ${name}`, quantity: "relative power" });
}
for (const name of Object.keys(CIE_LED_TABLE.columns)) {
  BUILDERS[name] = () =>
    tableColumn(CIE_LED_TABLE, name, { name: `CIE illuminant ${name}`, quantity: "relative power" });
}

const cache = new Map<string, Spectrum>();

/**
 * The names `illuminant()` accepts: A, D50, D55, D65, D75, E, FL1–FL12, FL3.1–FL3.15 and the LED series.
 *
 * @returns The names, as `illuminant()` spells them.
 * @source CIE 015:2018 (the tabulated illuminants).
 * @example illuminantNames().length
 */
export function illuminantNames(): string[] {
  return Object.keys(BUILDERS);
}

/**
 * A CIE illuminant's relative spectral power by name ("A", "D65", "FL2", "LED-B3", ...); case and spaces are ignored.
 *
 * D50, D55 and D75 are computed from the daylight components at the nominal CCT × 1.4388 ÷ 1.4380 with M1, M2
 * rounded to 3 decimals (as the CIE tables are); A from its formula (300–830 nm at 1 nm); D65 and the fluorescent and
 * LED illuminants from the CIE tables; E is 100 everywhere, 300–830 nm at 1 nm.
 *
 * @param name The illuminant's name (see `illuminantNames()`); an unknown name is an error listing the known ones.
 * @returns A "relative power" `Spectrum`.
 * @source CIE 015:2018 §4 and its tables of illuminants.
 * @example illuminant("D65").values.length
 */
export function illuminant(name: string): Spectrum {
  checkWith(
    "illuminant",
    "name",
    name,
    `an illuminant name, one of ${Object.keys(BUILDERS).join(", ")} (case and spaces are ignored)`,
    (n) =>
      typeof n === "string" &&
      Object.keys(BUILDERS).some((k) => k.toUpperCase() === n.replace(/\s+/g, "").toUpperCase()),
    { instead: { spectrum: "a spectrum is already an illuminant: pass it directly" } },
  );
  const key = Object.keys(BUILDERS).find(
    (k) => k.toUpperCase() === String(name).replace(/\s+/g, "").toUpperCase(),
  );
  if (!key) throw new Error(`unknown illuminant "${name}"; known names: ${illuminantNames().join(", ")}`);
  let s = cache.get(key);
  if (!s) {
    s = sharedTable(BUILDERS[key]!());
    cache.set(key, s);
  }
  return s;
}
