/** The two chromaticity diagrams tristim draws: CIE 1931 (x, y) and CIE 1976 UCS (u′, v′) (CIE 015:2018 §7.3, §8.1). */
import { uvPrimeFromXy, xyFromUvPrime, type Chromaticity } from "../colorimetry/chromaticity.ts";

/** Which diagram: "xy" (CIE 1931) or "u'v'" (CIE 1976 UCS). */
export type DiagramSpace = "xy" | "u'v'";

/** Accepts "xy", "1931", "u'v'", "u′v′", "uv", "1976" (case and spaces ignored); anything else is an error. */
export function diagramSpace(name: string | undefined): DiagramSpace {
  if (name === undefined) return "xy";
  const k = String(name).toLowerCase().replace(/\s+/g, "").replace(/[′’]/g, "'").replace(/^cie/, "");
  if (k === "xy" || k === "1931") return "xy";
  if (k === "u'v'" || k === "uv" || k === "1976" || k === "ucs") return "u'v'";
  throw new Error(`unknown chromaticity diagram "${name}": use "xy" (CIE 1931) or "u'v'" (CIE 1976 UCS)`);
}

/** Diagram coordinates [horizontal, vertical] of an xy chromaticity: (x, y) or (u′, v′) by CIE 015:2018 eq. 8.2. */
export function diagramPoint(xy: Chromaticity, space: DiagramSpace): [number, number] {
  if (space === "xy") return [xy.x, xy.y];
  const p = uvPrimeFromXy(xy);
  return [p.u, p.v];
}

/** xy of a point given in diagram coordinates (inverse of diagramPoint). */
export function xyFromDiagram(a: number, b: number, space: DiagramSpace): Chromaticity {
  return space === "xy" ? { x: a, y: b } : xyFromUvPrime({ u: a, v: b });
}

/** Axis titles of a diagram. */
export function diagramAxisTitles(space: DiagramSpace): [string, string] {
  return space === "xy" ? ["x", "y"] : ["u′", "v′"];
}

/** The coordinate names used in hover text. */
export function diagramName(space: DiagramSpace): string {
  return space === "xy" ? "CIE 1931 x, y" : "CIE 1976 u′, v′";
}
