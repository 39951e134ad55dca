/** Δu′v′: the distance of two chromaticities in the CIE 1976 UCS diagram. */
import { noteMethod } from "../methods/method-log.ts";
import { readingXy, uvOf, type ColourReading } from "./colour-input.ts";

const STATEMENT =
  "Chromaticity differences Δu′v′ were computed as distances in the CIE 1976 UCS diagram (CIE 015:2018 §8.1).";

/**
 * Δu′v′ = √(Δu′² + Δv′²) between two colours given as XYZ or as CIE 1931 chromaticities.
 *
 * @param reference The reference: { X, Y, Z } or { x, y }.
 * @param sample The sample: { X, Y, Z } or { x, y }.
 * @returns Δu′v′ (dimensionless).
 * @source CIE 015:2018 §8.1, eqs. 8.1–8.2 (u′, v′).
 * @example deltaUvPrime({ x: 0.3127, y: 0.329 }, { X: 95, Y: 100, Z: 105 })
 */
export function deltaUvPrime(reference: ColourReading, sample: ColourReading): number {
  const a = uvOf(readingXy("deltaUvPrime", "reference", reference));
  const b = uvOf(readingXy("deltaUvPrime", "sample", sample));
  noteMethod("colour difference", STATEMENT);
  return Math.hypot(a.u - b.u, a.v - b.v);
}
