/** Conversions between CIE XYZ and the RGB values of an RGB space, and the gamut test on RGB values. */
import type { Tristimulus } from "../colorimetry/chromaticity.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { RgbSpace } from "./rgb-space.ts";
import { PQ_PEAK_LUMINANCE, transferFunction } from "./transfer-functions.ts";

export interface Rgb {
  readonly r: number;
  readonly g: number;
  readonly b: number;
}

/** The XYZ value that maps to linear RGB 1: Y = 100 (relative), except PQ spaces, which take absolute XYZ in cd/m². */
function xyzScale(space: RgbSpace): number {
  return space.transfer === "PQ" ? PQ_PEAK_LUMINANCE : 100;
}

function spaceStatement(space: RgbSpace, encoded: boolean): string {
  const w = space.white;
  return `Conversions between XYZ and ${space.name} RGB (${space.source}) used the primaries R (${space.primaries.r.x}, ${space.primaries.r.y}), G (${space.primaries.g.x}, ${space.primaries.g.y}), B (${space.primaries.b.x}, ${space.primaries.b.y}) and white (${w.x}, ${w.y}), with RGB–XYZ matrices derived per SMPTE RP 177-1993${encoded ? ` and ${transferFunction(space.transfer).description}` : "; the RGB values are linear (no transfer function was applied)"}.`;
}

// The statement per space and per encoded/linear, built once: the conversions run in loops over many colours, and
// building the sentence cost more than the conversion. The log itself keeps each statement once (noteMethod).
const statements = new WeakMap<RgbSpace, { encoded?: string; linear?: string }>();

// The default options, shared (an object literal as default would be allocated on every call).
const NO_OPTIONS: { readonly encode?: boolean; readonly decode?: boolean } = Object.freeze({});

let lastSpace: RgbSpace | undefined;
let lastStatements: { encoded?: string; linear?: string } = {};

function noteSpace(space: RgbSpace, encoded: boolean): void {
  let cached = space === lastSpace ? lastStatements : statements.get(space);
  if (cached === undefined) statements.set(space, (cached = {}));
  lastSpace = space;
  lastStatements = cached;
  const statement = encoded
    ? (cached.encoded ??= spaceStatement(space, true))
    : (cached.linear ??= spaceStatement(space, false));
  noteMethod("rgb encoding", statement);
}

/**
 * RGB of a colour in an RGB space: linear RGB = M⁻¹·XYZ (SMPTE RP 177-1993), then encoded by the space's transfer
 * function unless `encode: false`. XYZ on the Y = 100 scale (white Y = 100), except PQ spaces: absolute XYZ in cd/m².
 * XYZ must be relative to the space's white; adapt it first (adaptXYZ) if it is not. Values may fall outside 0–1.
 */
export function rgbFromXYZ(
  xyz: Tristimulus,
  space: RgbSpace,
  options: { encode?: boolean } = NO_OPTIONS,
): Rgb {
  if (
    typeof xyz !== "object" ||
    xyz === null ||
    !(Number.isFinite(xyz.X) && Number.isFinite(xyz.Y) && Number.isFinite(xyz.Z))
  ) {
    throw new Error(
      `rgbFromXYZ: tristimulus values (${xyz?.X}, ${xyz?.Y}, ${xyz?.Z}) must be finite numbers`,
    );
  }
  const s = xyzScale(space);
  const m = space.fromXYZ;
  const X = xyz.X / s,
    Y = xyz.Y / s,
    Z = xyz.Z / s;
  const r = m[0][0] * X + m[0][1] * Y + m[0][2] * Z,
    g = m[1][0] * X + m[1][1] * Y + m[1][2] * Z,
    b = m[2][0] * X + m[2][1] * Y + m[2][2] * Z;
  const encode = options.encode ?? true;
  noteSpace(space, encode);
  if (!encode) return { r, g, b };
  const t = transferFunction(space.transfer);
  return { r: t.encode(r), g: t.encode(g), b: t.encode(b) };
}

/** XYZ (Y = 100 scale; cd/m² for PQ spaces) of RGB values in a space: decoded by its transfer function unless `decode: false`, then M·RGB (SMPTE RP 177-1993). */
export function xyzFromRgb(
  rgb: Rgb,
  space: RgbSpace,
  options: { decode?: boolean } = NO_OPTIONS,
): Tristimulus {
  if (
    typeof rgb !== "object" ||
    rgb === null ||
    !(Number.isFinite(rgb.r) && Number.isFinite(rgb.g) && Number.isFinite(rgb.b))
  ) {
    throw new Error(`xyzFromRgb: RGB values (${rgb?.r}, ${rgb?.g}, ${rgb?.b}) must be finite numbers`);
  }
  const decode = options.decode ?? true;
  noteSpace(space, decode);
  let r = rgb.r,
    g = rgb.g,
    b = rgb.b;
  if (decode) {
    const t = transferFunction(space.transfer);
    r = t.decode(r);
    g = t.decode(g);
    b = t.decode(b);
  }
  const m = space.toXYZ;
  const s = xyzScale(space);
  return {
    X: (m[0][0] * r + m[0][1] * g + m[0][2] * b) * s,
    Y: (m[1][0] * r + m[1][1] * g + m[1][2] * b) * s,
    Z: (m[2][0] * r + m[2][1] * g + m[2][2] * b) * s,
  };
}

/**
 * True when every channel lies in 0–1 within the tolerance (default 1e-6, to absorb rounding in measured data);
 * works on linear or encoded values alike, since the transfer functions keep 0 and 1 fixed and preserve order.
 */
export function isInGamut(rgb: Rgb, tolerance = 1e-6): boolean {
  if (
    typeof rgb !== "object" ||
    rgb === null ||
    !(Number.isFinite(rgb.r) && Number.isFinite(rgb.g) && Number.isFinite(rgb.b))
  ) {
    throw new Error(`isInGamut: RGB values (${rgb?.r}, ${rgb?.g}, ${rgb?.b}) must be finite numbers`);
  }
  if (!(Number.isFinite(tolerance) && tolerance >= 0))
    throw new Error(`isInGamut: tolerance ${tolerance} must be a non-negative number`);
  return [rgb.r, rgb.g, rgb.b].every((v) => v >= -tolerance && v <= 1 + tolerance);
}
