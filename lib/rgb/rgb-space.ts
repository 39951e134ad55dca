/**
 * RGB colour spaces: primaries and white as chromaticities, the transfer function by name, and the RGB ↔ XYZ matrices
 * derived from them by the method of SMPTE RP 177-1993 (normalised primary matrix).
 */
import type { Chromaticity } from "../colorimetry/chromaticity.ts";
import {
  applyMatrix3,
  diagonalMatrix3,
  invertMatrix3,
  multiplyMatrix3,
  type Matrix3,
} from "../colorimetry/matrix3.ts";
import { transferFunction, type TransferName } from "./transfer-functions.ts";
import { XY_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkPrimaries } from "../arguments/option-sets.ts";
import { sharedTable } from "../data/shared-tables.ts";

export interface RgbPrimaries {
  readonly r: Chromaticity;
  readonly g: Chromaticity;
  readonly b: Chromaticity;
}

export interface RgbSpace {
  readonly kind: "rgb space";
  readonly name: string;
  readonly primaries: RgbPrimaries;
  readonly white: Chromaticity;
  /** Name of the transfer function (see transferFunction). */
  readonly transfer: TransferName;
  /** Linear RGB (0–1) → XYZ with Y = 1 for white: the normalised primary matrix (SMPTE RP 177-1993 §3.3). */
  readonly toXYZ: Matrix3;
  /** XYZ (Y = 1 for white) → linear RGB: the inverse of toXYZ. */
  readonly fromXYZ: Matrix3;
  /** Where the primaries and white come from, for the Methods section. */
  readonly source: string;
}

function requireChromaticity(what: string, c: Chromaticity, imaginary = false): void {
  if (imaginary && Number.isFinite(c?.x) && Number.isFinite(c?.y)) return;
  if (
    typeof c !== "object" ||
    c === null ||
    !Number.isFinite(c.x) ||
    !Number.isFinite(c.y) ||
    c.x < 0 ||
    c.y <= 0 ||
    c.x + c.y > 1
  ) {
    throw new Error(
      `${what}: chromaticity (${c?.x}, ${c?.y}) is not valid (need finite x ≥ 0, y > 0, x + y ≤ 1)`,
    );
  }
}

/**
 * The normalised primary matrix NPM = P·diag(P⁻¹·W): linear RGB → XYZ with Y = 1 for the white.
 *
 * @param primaries Chromaticities { r, g, b } of the primaries, each { x, y }.
 * @param white The white's chromaticity { x, y }.
 * @returns The 3 × 3 matrix as rows.
 * @source SMPTE RP 177-1993 §3.3.
 * @example normalisedPrimaryMatrix({ r: { x: 0.64, y: 0.33 }, g: { x: 0.3, y: 0.6 }, b: { x: 0.15, y: 0.06 } }, { x: 0.3127, y: 0.329 })
 */
export function normalisedPrimaryMatrix(primaries: RgbPrimaries, white: Chromaticity): Matrix3 {
  checkPrimaries("normalisedPrimaryMatrix", "primaries", primaries);
  checkFields("normalisedPrimaryMatrix", "white", white, {
    ...XY_FIELDS,
    what: "the white's chromaticity { x, y }",
  });
  return primaryMatrix(primaries, white, false);
}

/** The NPM; `imaginary` admits primaries outside the spectrum locus (AP0's blue has y < 0, AP1's red x + y > 1), never the white. */
function primaryMatrix(primaries: RgbPrimaries, white: Chromaticity, imaginary: boolean): Matrix3 {
  requireChromaticity("red primary", primaries.r, imaginary);
  requireChromaticity("green primary", primaries.g, imaginary);
  requireChromaticity("blue primary", primaries.b, imaginary);
  requireChromaticity("white point", white);
  const col = (c: Chromaticity) => [c.x, c.y, 1 - c.x - c.y] as const;
  const [r, g, b] = [col(primaries.r), col(primaries.g), col(primaries.b)];
  const P: Matrix3 = [
    [r[0], g[0], b[0]],
    [r[1], g[1], b[1]],
    [r[2], g[2], b[2]],
  ];
  const W = [white.x / white.y, 1, (1 - white.x - white.y) / white.y] as const;
  const C = applyMatrix3(
    invertMatrix3(P, "the matrix of the three primaries (are two of them the same, or all on one line?)"),
    W,
  );
  return multiplyMatrix3(P, diagonalMatrix3(C));
}

/**
 * An RGB space from measured or specified primaries and white, with a transfer function by name.
 *
 * @param primaries Chromaticities { r, g, b } of the primaries, each { x, y } (CIE 1931).
 * @param white The white's chromaticity { x, y }.
 * @param options.name The space's name; default "RGB from measured primaries".
 * @param options.transfer The transfer function's name (see `transferFunction`); default "linear".
 * @param options.source Where the primaries come from, for the Methods statement; default "primaries and white as given".
 * @returns An `RgbSpace` with matrices toXYZ and fromXYZ.
 * @source SMPTE RP 177-1993 (normalised primary matrix).
 * @example rgbSpaceFromPrimaries({ r: { x: 0.68, y: 0.31 }, g: { x: 0.26, y: 0.68 }, b: { x: 0.15, y: 0.05 } }, { x: 0.3127, y: 0.329 }, { name: "invented display", transfer: "gamma 2.2" })
 */
export function rgbSpaceFromPrimaries(
  primaries: RgbPrimaries,
  white: Chromaticity,
  options: { name?: string; transfer?: TransferName; source?: string } = {},
): RgbSpace {
  checkPrimaries("rgbSpaceFromPrimaries", "primaries", primaries);
  checkFields("rgbSpaceFromPrimaries", "white", white, {
    ...XY_FIELDS,
    what: "the white's chromaticity { x, y }",
  });
  checkOptions("rgbSpaceFromPrimaries", "options", options, ["name", "transfer", "source"]);
  return buildSpace(primaries, white, options, false);
}

function buildSpace(
  primaries: RgbPrimaries,
  white: Chromaticity,
  options: { name?: string; transfer?: TransferName; source?: string },
  imaginary: boolean,
): RgbSpace {
  const transfer = options.transfer ?? "linear";
  transferFunction(transfer); // checks the name
  const toXYZ = primaryMatrix(primaries, white, imaginary);
  return {
    kind: "rgb space",
    name: options.name ?? "RGB from measured primaries",
    primaries: { r: { ...primaries.r }, g: { ...primaries.g }, b: { ...primaries.b } },
    white: { ...white },
    transfer,
    toXYZ,
    fromXYZ: invertMatrix3(toXYZ, "the RGB-to-XYZ matrix"),
    source: options.source ?? "primaries and white as given",
  };
}

const D65: Chromaticity = { x: 0.3127, y: 0.329 };
const BT709_PRIMARIES: RgbPrimaries = {
  r: { x: 0.64, y: 0.33 },
  g: { x: 0.3, y: 0.6 },
  b: { x: 0.15, y: 0.06 },
};
const BT2020_PRIMARIES: RgbPrimaries = {
  r: { x: 0.708, y: 0.292 },
  g: { x: 0.17, y: 0.797 },
  b: { x: 0.131, y: 0.046 },
};
const P3_PRIMARIES: RgbPrimaries = {
  r: { x: 0.68, y: 0.32 },
  g: { x: 0.265, y: 0.69 },
  b: { x: 0.15, y: 0.06 },
};

// SMPTE RP 431-2:2011: the DCI white. ISO 22028-2:2013: the ROMM (D50) white. SMPTE ST 2065-1:2012: the ACES white.
const DCI_WHITE: Chromaticity = { x: 0.314, y: 0.351 };
const D50_ROMM: Chromaticity = { x: 0.3457, y: 0.3585 };
const ACES_WHITE: Chromaticity = { x: 0.32168, y: 0.33767 };
const OPRGB_PRIMARIES: RgbPrimaries = {
  r: { x: 0.64, y: 0.33 },
  g: { x: 0.21, y: 0.71 },
  b: { x: 0.15, y: 0.06 },
};
const ROMM_PRIMARIES: RgbPrimaries = {
  r: { x: 0.7347, y: 0.2653 },
  g: { x: 0.1596, y: 0.8404 },
  b: { x: 0.0366, y: 0.0001 },
};
const AP0_PRIMARIES: RgbPrimaries = {
  r: { x: 0.7347, y: 0.2653 },
  g: { x: 0.0, y: 1.0 },
  b: { x: 0.0001, y: -0.077 },
};
const AP1_PRIMARIES: RgbPrimaries = {
  r: { x: 0.713, y: 0.293 },
  g: { x: 0.165, y: 0.83 },
  b: { x: 0.128, y: 0.044 },
};

const DEFINITIONS: Record<
  string,
  {
    primaries: RgbPrimaries;
    white: Chromaticity;
    transfer: TransferName;
    source: string;
    /** Other names the space is asked for by (compared without case, spaces, "-" and "_"). */
    aliases?: readonly string[];
    /** Primaries outside the spectrum locus are allowed (ACES AP0). */
    imaginary?: boolean;
  }
> = {
  sRGB: {
    primaries: BT709_PRIMARIES,
    white: D65,
    transfer: "sRGB",
    source: "IEC 61966-2-1:1999 (ITU-R BT.709 primaries, D65 white)",
  },
  "Display P3": {
    primaries: P3_PRIMARIES,
    white: D65,
    transfer: "sRGB",
    source: "SMPTE EG 432-1:2010 P3 primaries with D65 white and the sRGB transfer function",
  },
  "BT.709": {
    primaries: BT709_PRIMARIES,
    white: D65,
    transfer: "BT.1886",
    source: "ITU-R BT.709-6 primaries and D65 white; display transfer ITU-R BT.1886",
  },
  "BT.2020": {
    primaries: BT2020_PRIMARIES,
    white: D65,
    transfer: "BT.1886",
    source: "ITU-R BT.2020-2 primaries and D65 white; display transfer ITU-R BT.1886",
  },
  "BT.2100 PQ": {
    primaries: BT2020_PRIMARIES,
    white: D65,
    transfer: "PQ",
    source: "ITU-R BT.2100-2 (BT.2020 primaries, D65, PQ of SMPTE ST 2084)",
  },
  "BT.2100 HLG": {
    primaries: BT2020_PRIMARIES,
    white: D65,
    transfer: "HLG",
    source: "ITU-R BT.2100-2 (BT.2020 primaries, D65, HLG)",
  },
  "DCI-P3": {
    primaries: P3_PRIMARIES,
    white: DCI_WHITE,
    transfer: "gamma 2.6",
    source: "SMPTE RP 431-2:2011 reference projector (P3 primaries, DCI white (0.314, 0.351), 2.6 power law)",
    aliases: ["P3-DCI", "DCI P3", "SMPTE RP 431-2"],
  },
  "P3-D65": {
    primaries: P3_PRIMARIES,
    white: D65,
    transfer: "gamma 2.6",
    source: "SMPTE EG 432-1:2010 P3D65 (P3 primaries of SMPTE RP 431-2 with the D65 white, 2.6 power law)",
    aliases: ["P3D65", "DCI-P3 D65"],
  },
  opRGB: {
    primaries: OPRGB_PRIMARIES,
    white: D65,
    transfer: "opRGB",
    source: "IEC 61966-2-5:2007 (opRGB primaries, D65 white, γ = 563/256)",
    aliases: ["IEC 61966-2-5"],
  },
  "ROMM RGB": {
    primaries: ROMM_PRIMARIES,
    white: D50_ROMM,
    transfer: "ROMM",
    source: "ISO 22028-2:2013 (ROMM RGB primaries, D50 white (0.3457, 0.3585), ROMM encoding)",
    aliases: ["ROMM", "ISO 22028-2"],
  },
  "ACES AP0": {
    primaries: AP0_PRIMARIES,
    white: ACES_WHITE,
    transfer: "linear",
    source: "SMPTE ST 2065-1:2012 (ACES2065-1: AP0 primaries, ACES white (0.32168, 0.33767), linear)",
    aliases: ["AP0", "ACES2065-1", "SMPTE ST 2065-1"],
    imaginary: true,
  },
  "ACES AP1": {
    primaries: AP1_PRIMARIES,
    white: ACES_WHITE,
    transfer: "linear",
    source:
      "the ACES AP1 primaries (Academy S-2014-004, ACEScg) with the ACES white of SMPTE ST 2065-1:2012, linear",
    aliases: ["AP1", "ACEScg"],
    imaginary: true,
  },
};

const cache = new Map<string, RgbSpace>();

/**
 * The names `rgbSpace()` knows.
 *
 * @returns The names: "sRGB", "Display P3", "BT.709", "BT.2020", "BT.2100 PQ", "BT.2100 HLG", "DCI-P3", "P3-D65", "opRGB", "ROMM RGB", "ACES AP0", "ACES AP1".
 * @source IEC 61966-2-1; SMPTE EG 432-1 (Display P3, P3D65); ITU-R BT.709-6, BT.2020-2, BT.2100-2; SMPTE RP 431-2; IEC 61966-2-5; ISO 22028-2; SMPTE ST 2065-1.
 * @example rgbSpaceNames()
 */
export function rgbSpaceNames(): string[] {
  return Object.keys(DEFINITIONS);
}

/**
 * A standard RGB space by name (case and spaces ignored), with matrices derived from its primaries and white.
 *
 * "DCI-P3" is the reference projector of SMPTE RP 431-2 (DCI white, 2.6 power law); "P3-D65" the same primaries with
 * D65 (SMPTE EG 432-1's P3D65); "Display P3" the P3 primaries with D65 and the sRGB curve. "ACES AP0" (also
 * "ACES2065-1") has a blue primary outside the spectrum locus; both ACES spaces are linear. "ROMM RGB" has a D50
 * white: pass XYZ relative to that white (adapt with `adaptXYZ`).
 *
 * @param name "sRGB", "Display P3", "BT.709", "BT.2020", "BT.2100 PQ", "BT.2100 HLG", "DCI-P3", "P3-D65", "opRGB", "ROMM RGB", "ACES AP0" or "ACES AP1" (aliases such as "ACEScg", "P3D65", "Rec2020").
 * @returns An `RgbSpace`: primaries, white, transfer function name, toXYZ and fromXYZ matrices, source.
 * @source IEC 61966-2-1:1999; SMPTE EG 432-1 (Display P3, P3D65); ITU-R BT.709-6, BT.2020-2, BT.2100-2; SMPTE RP 431-2:2011; IEC 61966-2-5:2007; ISO 22028-2:2013; SMPTE ST 2065-1:2012; matrices per SMPTE RP 177-1993.
 * @example rgbSpace("Display P3").white
 */
export function rgbSpace(name: string): RgbSpace {
  const key = typeof name === "string" ? spaceKey(name) : undefined;
  checkWith(
    "rgbSpace",
    "name",
    name,
    `an RGB space name, one of ${rgbSpaceNames().join(", ")}`,
    () => key !== undefined,
  );
  if (!key)
    throw new Error(
      `unknown RGB space "${name}"; known: ${rgbSpaceNames().join(", ")}, or build one with rgbSpaceFromPrimaries()`,
    );
  let space = cache.get(key);
  if (!space) {
    const d = DEFINITIONS[key]!;
    space = buildSpace(
      d.primaries,
      d.white,
      { name: key, transfer: d.transfer, source: d.source },
      d.imaginary ?? false,
    );
    cache.set(key, sharedTable(space));
  }
  return space;
}

const normName = (t: string) => t.replace(/[\s_-]+/g, "").toUpperCase();
const LOOKUP = new Map<string, string>();
for (const [key, d] of Object.entries(DEFINITIONS)) {
  LOOKUP.set(normName(key), key);
  for (const alias of d.aliases ?? []) LOOKUP.set(normName(alias), key);
}
LOOKUP.set("REC709", "BT.709");
LOOKUP.set("REC2020", "BT.2020");

function spaceKey(name: string): string | undefined {
  return LOOKUP.get(normName(name));
}
