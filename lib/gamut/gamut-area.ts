/**
 * Gamut area and coverage in the CIE 1931 xy or CIE 1976 u′v′ chromaticity diagram: polygon area by the shoelace
 * formula and the overlap of two gamuts by clipping one convex polygon with the other (Sutherland & Hodgman,
 * "Reentrant polygon clipping", Comm. ACM 17(1):32–42, 1974).
 */
import { uvPrimeFromXy, type Chromaticity } from "../colorimetry/chromaticity.ts";
import { noteMethod } from "../methods/method-log.ts";
import type { RgbSpace } from "../rgb/rgb-space.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkGamut } from "../arguments/common-arguments.ts";

export type ChromaticityDiagram = "xy" | "u′v′";

/** A gamut: the chromaticities of its primaries in order round the polygon, or an RGB space (its three primaries). */
export type Gamut = readonly Chromaticity[] | RgbSpace;

type Point = readonly [number, number];

function verticesOf(g: Gamut, what: string): Chromaticity[] {
  const list = Array.isArray(g)
    ? (g as readonly Chromaticity[])
    : (g as RgbSpace).kind === "rgb space"
      ? [(g as RgbSpace).primaries.r, (g as RgbSpace).primaries.g, (g as RgbSpace).primaries.b]
      : undefined;
  if (!list) throw new Error(`${what}: give a list of chromaticities or an RGB space`);
  if (list.length < 3) throw new Error(`${what}: a gamut needs at least 3 primaries, got ${list.length}`);
  list.forEach((c, i) => {
    if (typeof c !== "object" || c === null || !Number.isFinite(c.x) || !Number.isFinite(c.y)) {
      throw new Error(`${what}: primary #${i + 1} (${c?.x}, ${c?.y}) is not a finite chromaticity`);
    }
  });
  return [...list];
}

function toDiagram(list: Chromaticity[], diagram: ChromaticityDiagram): Point[] {
  if (diagram === "xy") return list.map((c) => [c.x, c.y] as const);
  if (diagram === "u′v′" || (diagram as string) === "u'v'") {
    return list.map((c) => {
      const p = uvPrimeFromXy(c);
      return [p.u, p.v] as const;
    });
  }
  throw new Error(`unknown chromaticity diagram "${String(diagram)}"; use "xy" or "u′v′"`);
}

function signedArea(p: readonly Point[]): number {
  let a = 0;
  for (let i = 0; i < p.length; i++) {
    const [x1, y1] = p[i]!;
    const [x2, y2] = p[(i + 1) % p.length]!;
    a += x1 * y2 - x2 * y1;
  }
  return a / 2;
}

function isConvex(p: readonly Point[]): boolean {
  let sign = 0;
  for (let i = 0; i < p.length; i++) {
    const [ax, ay] = p[i]!,
      [bx, by] = p[(i + 1) % p.length]!,
      [cx, cy] = p[(i + 2) % p.length]!;
    const cross = (bx - ax) * (cy - by) - (by - ay) * (cx - bx);
    if (Math.abs(cross) < 1e-15) continue;
    if (sign === 0) sign = Math.sign(cross);
    else if (Math.sign(cross) !== sign) return false;
  }
  return true;
}

/** Clips polygon `subject` by the convex polygon `clip` (counter-clockwise) — Sutherland & Hodgman (1974). */
function clipPolygon(subject: readonly Point[], clip: readonly Point[]): Point[] {
  let output: Point[] = [...subject];
  for (let i = 0; i < clip.length && output.length > 0; i++) {
    const [ax, ay] = clip[i]!;
    const [bx, by] = clip[(i + 1) % clip.length]!;
    const inside = (p: Point) => (bx - ax) * (p[1] - ay) - (by - ay) * (p[0] - ax) >= 0;
    const intersect = (p: Point, q: Point): Point => {
      const dx = q[0] - p[0],
        dy = q[1] - p[1];
      const den = (bx - ax) * dy - (by - ay) * dx;
      const t = ((ax - p[0]) * (by - ay) - (ay - p[1]) * (bx - ax)) / -den;
      return [p[0] + t * dx, p[1] + t * dy];
    };
    const input = output;
    output = [];
    for (let j = 0; j < input.length; j++) {
      const cur = input[j]!;
      const prev = input[(j + input.length - 1) % input.length]!;
      if (inside(cur)) {
        if (!inside(prev)) output.push(intersect(prev, cur));
        output.push(cur);
      } else if (inside(prev)) output.push(intersect(prev, cur));
    }
  }
  return output;
}

function ccw(p: Point[]): Point[] {
  return signedArea(p) < 0 ? [...p].reverse() : p;
}

/**
 * Area of a gamut polygon in the CIE 1931 xy or CIE 1976 u′v′ diagram (shoelace formula).
 *
 * @param gamut The primaries' chromaticities { x, y } in order round the polygon (3 or more), or an `RgbSpace`.
 * @param diagram "xy" or "u′v′" (also "u'v'"); default "xy".
 * @returns The area in the diagram's units (dimensionless).
 * @source none: the shoelace formula for a polygon's area, no colour-science source.
 * @example gamutArea(rgbSpace("sRGB"))
 */
export function gamutArea(gamut: Gamut, diagram: ChromaticityDiagram = "xy"): number {
  checkGamut("gamutArea", "gamut", gamut);
  checkChoice("gamutArea", "diagram", diagram, ["xy", "u′v′"]);
  const p = toDiagram(verticesOf(gamut, "gamutArea"), diagram);
  noteMethod(
    "gamut",
    `Gamut areas were computed as polygon areas in the CIE ${diagram === "xy" ? "1931 xy" : "1976 u′v′"} chromaticity diagram.`,
  );
  return Math.abs(signedArea(p));
}

/**
 * Area of the overlap of two gamut polygons in the xy or u′v′ diagram; at least one of them must be convex.
 *
 * @param a A gamut: chromaticities { x, y } in order round the polygon, or an `RgbSpace`.
 * @param b Another gamut.
 * @param diagram "xy" or "u′v′"; default "xy".
 * @returns The overlap's area (dimensionless), 0 when they do not overlap.
 * @source I. E. Sutherland, G. W. Hodgman, "Reentrant polygon clipping", Comm. ACM 17(1):32–42, 1974.
 * @example gamutIntersectionArea(rgbSpace("sRGB"), rgbSpace("Display P3"), "u′v′")
 */
export function gamutIntersectionArea(a: Gamut, b: Gamut, diagram: ChromaticityDiagram = "xy"): number {
  checkGamut("gamutIntersectionArea", "a", a);
  checkGamut("gamutIntersectionArea", "b", b);
  checkChoice("gamutIntersectionArea", "diagram", diagram, ["xy", "u′v′"]);
  const pa = ccw(toDiagram(verticesOf(a, "gamut intersection (first gamut)"), diagram));
  const pb = ccw(toDiagram(verticesOf(b, "gamut intersection (second gamut)"), diagram));
  let clipped: Point[];
  if (isConvex(pb)) clipped = clipPolygon(pa, pb);
  else if (isConvex(pa)) clipped = clipPolygon(pb, pa);
  else
    throw new Error(
      "gamut intersection: neither gamut polygon is convex; list the primaries in order round the polygon",
    );
  return clipped.length < 3 ? 0 : Math.abs(signedArea(clipped));
}

/**
 * Coverage of a reference gamut by a device gamut, as a fraction: area(device ∩ reference) ÷ area(reference).
 *
 * @param device The device's gamut: chromaticities in order round the polygon, or an `RgbSpace`.
 * @param reference The reference gamut (with a positive area).
 * @param diagram "xy" or "u′v′"; default "xy".
 * @returns The coverage as a fraction, 0–1 (multiply by 100 for percent).
 * @source Sutherland & Hodgman, Comm. ACM 17(1):32–42, 1974 (polygon clipping); the ratio itself is common practice with no source.
 * @example gamutCoverage(rgbSpace("sRGB"), rgbSpace("BT.2020"))
 */
export function gamutCoverage(device: Gamut, reference: Gamut, diagram: ChromaticityDiagram = "xy"): number {
  checkGamut("gamutCoverage", "device", device);
  checkGamut("gamutCoverage", "reference", reference);
  checkChoice("gamutCoverage", "diagram", diagram, ["xy", "u′v′"]);
  const ref = Math.abs(signedArea(toDiagram(verticesOf(reference, "gamutCoverage (reference)"), diagram)));
  if (!(ref > 0)) throw new Error("gamutCoverage: the reference gamut has no area");
  noteMethod(
    "gamut",
    `Gamut coverage was computed as the fraction area(device ∩ reference) / area(reference) in the CIE ${diagram === "xy" ? "1931 xy" : "1976 u′v′"} chromaticity diagram (polygon clipping, Sutherland & Hodgman 1974).`,
  );
  return gamutIntersectionArea(device, reference, diagram) / ref;
}

/**
 * Area of a device gamut relative to a reference gamut, as a fraction (which may exceed 1).
 *
 * @param device The device's gamut: chromaticities in order round the polygon, or an `RgbSpace`.
 * @param reference The reference gamut (with a positive area).
 * @param diagram "xy" or "u′v′"; default "xy".
 * @returns area(device) ÷ area(reference), a fraction (multiply by 100 for percent).
 * @source none: a ratio of polygon areas (shoelace formula), common practice with no source.
 * @example gamutAreaRatio(rgbSpace("Display P3"), rgbSpace("sRGB"))
 */
export function gamutAreaRatio(device: Gamut, reference: Gamut, diagram: ChromaticityDiagram = "xy"): number {
  checkGamut("gamutAreaRatio", "device", device);
  checkGamut("gamutAreaRatio", "reference", reference);
  checkChoice("gamutAreaRatio", "diagram", diagram, ["xy", "u′v′"]);
  const ref = gamutArea(reference, diagram);
  if (!(ref > 0)) throw new Error("gamutAreaRatio: the reference gamut has no area");
  noteMethod(
    "gamut",
    `Gamut area ratios were computed as the fraction area(device) / area(reference) in the CIE ${diagram === "xy" ? "1931 xy" : "1976 u′v′"} chromaticity diagram.`,
  );
  return gamutArea(device, diagram) / ref;
}
