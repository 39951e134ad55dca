/**
 * The optional colour fill of a chromaticity diagram: each pixel inside the spectral locus painted with the brightest
 * sRGB colour of its chromaticity after a desaturating clip (display-rgb.ts). The colours are approximate by nature
 * (no display shows the spectral colours); the figure's caption says so. Drawn as one PNG layout image.
 */
import { brightDisplayColour } from "./display-rgb.ts";
import { xyFromDiagram, type DiagramSpace } from "./chromaticity-space.ts";
import { pngDataUri } from "./png-image.ts";

export interface FillImage {
  /** data:image/png;base64,... */
  readonly source: string;
  /** Left, top corner in diagram coordinates and the size of the image in diagram units. */
  readonly x: number;
  readonly y: number;
  readonly sizex: number;
  readonly sizey: number;
  readonly widthPx: number;
  readonly heightPx: number;
}

export interface FillOptions {
  /** Pixels across the horizontal range (default 360: a smooth fill at the usual report size, about 60–120 kB). */
  resolution?: number;
  /** Share of white mixed in so lines and labels stay legible on top (0–1, default 0.12; common practice, no source). */
  veil?: number;
}

/** Rasterises the approximate colours inside a closed locus polygon (diagram coordinates) over the given axis ranges. */
export function chromaticityFill(
  locusPolygon: readonly (readonly [number, number])[],
  space: DiagramSpace,
  xRange: readonly [number, number],
  yRange: readonly [number, number],
  options: FillOptions = {},
): FillImage {
  const resolution = options.resolution ?? 360;
  const veil = options.veil ?? 0.12;
  if (!Number.isInteger(resolution) || resolution < 16 || resolution > 2000)
    throw new Error(`chromaticity fill: resolution ${resolution} px must be a whole number from 16 to 2000`);
  if (!(veil >= 0 && veil <= 1)) throw new Error(`chromaticity fill: veil ${veil} must lie in 0–1`);
  const [x0, x1] = xRange,
    [y0, y1] = yRange;
  if (!(x1 > x0 && y1 > y0))
    throw new Error(`chromaticity fill: axis ranges [${x0}, ${x1}] × [${y0}, ${y1}] must increase`);
  // The same fill is drawn once per run: a report's diagrams share observer, diagram and size.
  const key = fillKey(locusPolygon, space, xRange, yRange, resolution, veil);
  let image = cache.get(key);
  if (image === undefined) {
    image = Object.freeze(drawFill(locusPolygon, space, xRange, yRange, resolution, veil));
    if (cache.size >= CACHE_SIZE) cache.delete(cache.keys().next().value!);
    cache.set(key, image);
  }
  return image;
}

/** Fills drawn so far, by everything they depend on; the oldest is dropped beyond CACHE_SIZE. */
const cache = new Map<string, FillImage>();
const CACHE_SIZE = 16;

function fillKey(
  polygon: readonly (readonly [number, number])[],
  space: DiagramSpace,
  xRange: readonly [number, number],
  yRange: readonly [number, number],
  resolution: number,
  veil: number,
): string {
  // Numbers as JavaScript prints them round-trip exactly, so equal keys mean equal inputs.
  return `${space}|${xRange[0]},${xRange[1]}|${yRange[0]},${yRange[1]}|${resolution}|${veil}|${polygon.join(";")}`;
}

function drawFill(
  locusPolygon: readonly (readonly [number, number])[],
  space: DiagramSpace,
  xRange: readonly [number, number],
  yRange: readonly [number, number],
  resolution: number,
  veil: number,
): FillImage {
  const [x0, x1] = xRange,
    [y0, y1] = yRange;
  const w = resolution;
  const h = Math.max(16, Math.round((resolution * (y1 - y0)) / (x1 - x0)));
  const dx = (x1 - x0) / w,
    dy = (y1 - y0) / h;
  // Scanline fill (even–odd rule): per pixel row, the crossings of the polygon's edges, then the spans between them.
  const inside = new Uint8Array(w * h);
  const n = locusPolygon.length;
  for (let j = 0; j < h; j++) {
    const b = y1 - (j + 0.5) * dy;
    const crossings: number[] = [];
    for (let k = 0, l = n - 1; k < n; l = k++) {
      const [xk, yk] = locusPolygon[k]!,
        [xl, yl] = locusPolygon[l]!;
      if (yk > b !== yl > b) crossings.push(((xl - xk) * (b - yk)) / (yl - yk) + xk);
    }
    crossings.sort((p, q) => p - q);
    for (let c = 0; c + 1 < crossings.length; c += 2) {
      const from = Math.max(0, Math.ceil((crossings[c]! - x0) / dx - 0.5));
      const to = Math.min(w - 1, Math.floor((crossings[c + 1]! - x0) / dx - 0.5));
      for (let i = from; i <= to; i++) inside[j * w + i] = 1;
    }
  }
  const rgba = new Uint8Array(w * h * 4);
  for (let j = 0; j < h; j++) {
    const b = y1 - (j + 0.5) * dy;
    for (let i = 0; i < w; i++) {
      // Paint the pixels inside and their neighbours, so no white seam shows under the locus line.
      let near = 0;
      for (let dj = -1; dj <= 1 && !near; dj++)
        for (let di = -1; di <= 1 && !near; di++) {
          const jj = j + dj,
            ii = i + di;
          if (jj >= 0 && jj < h && ii >= 0 && ii < w && inside[jj * w + ii]) near = 1;
        }
      if (!near) continue;
      const xy = xyFromDiagramSafe(x0 + (i + 0.5) * dx, b, space);
      if (!xy || !(xy.y > 1e-4)) continue;
      const c = brightDisplayColour({ X: xy.x / xy.y, Y: 1, Z: (1 - xy.x - xy.y) / xy.y });
      const k = (j * w + i) * 4;
      for (let n = 0; n < 3; n++) rgba[k + n] = Math.round((c[n]! * (1 - veil) + veil) * 255);
      rgba[k + 3] = 255;
    }
  }
  return {
    source: pngDataUri(w, h, rgba),
    x: x0,
    y: y1,
    sizex: x1 - x0,
    sizey: y1 - y0,
    widthPx: w,
    heightPx: h,
  };
}

function xyFromDiagramSafe(a: number, b: number, space: DiagramSpace) {
  try {
    return xyFromDiagram(a, b, space);
  } catch {
    return undefined;
  }
}
