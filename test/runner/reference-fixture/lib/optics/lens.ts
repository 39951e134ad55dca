/** Invented functions for the reference extractor's test; the formulas are placeholders, not optics. */

export interface LensOptions {
  /** Focal length in mm; default 50. */
  focalLength?: number;
  /** Whether the lens is coated; default false. */
  coated?: boolean;
}

/**
 * Power of an invented lens.
 *
 * A second paragraph <with markup> that the page must escape.
 *
 * @param aperture The f-number, dimensionless.
 * @param options Lens options.
 * @returns Power in dioptres (1/m).
 * @source Invented for this test.
 * @example lensPower(2, { focalLength: 100 })
 */
export function lensPower(aperture: number, options: LensOptions = {}): number {
  return 1000 / (options.focalLength ?? 50) / aperture;
}

/**
 * Thickness of an invented plate.
 * @param width Width in mm.
 * @param options.material Plate material; default "glass".
 * @source Invented for this test.
 * @example plateThickness(3)
 */
export function plateThickness(width: number, options: { material?: string } = {}): number {
  return width * (options.material === "glass" ? 2 : 1);
}

export function undocumented(x: number): number {
  return x;
}

/**
 * Corners of an invented frame.
 * @param size { width, height } in mm.
 * @returns { x, y } of the first corner, in mm.
 * @source Invented for this test.
 * @example frameCorner({ width: 2, height: 3 })
 */
export function frameCorner(size: { width: number; height: number }): { x: number; y: number } {
  return { x: size.width / 2, y: size.height / 2 };
}
