/**
 * Labels for short straight lines on a figure (the isotemperature lines of a chromaticity diagram): every line with a
 * visible part inside the plotted range gets its label, placed inside the plot area beside or beyond the visible
 * part, nearer its own line than any other, without overlapping another label, a reserved box (markers and their
 * text) or, where room allows, another drawn curve. Geometry is done in estimated screen pixels: the diagram is drawn with equal scales on both axes
 * (scaleanchor), so one pixels-per-unit factor maps diagram units to the screen. Text sizes are estimates (0.6 em per
 * character, 1.3 em per line; common practice, no source), padded so small errors do not make labels touch.
 */
import { MARGINS } from "./style.ts";

/** A point in pixels, y upward, origin at the lower-left corner of the plot area. */
export type Px = readonly [number, number];

/** An axis-aligned box in pixels (y upward). */
export interface PxBox {
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

/** How diagram coordinates map to the estimated plot area. */
export interface PlotFrame {
  readonly x: readonly [number, number];
  readonly y: readonly [number, number];
  /** Pixels per diagram unit (the same on both axes). */
  readonly pxPerUnit: number;
  /** Plot-area size in pixels. */
  readonly width: number;
  readonly height: number;
}

/**
 * The plot frame of a square-scaled figure of the given height: the narrowest report column (a 160 mm print column,
 * 605 px, see style.ts) minus the house margins, and the height minus the top margin and the bottom margin with a
 * legend below. The narrowest column gives the largest text relative to the data, so placements hold on screen too.
 */
export function squarePlotFrame(
  range: { x: readonly [number, number]; y: readonly [number, number] },
  heightPx: number,
  legendBelow = true,
): PlotFrame {
  const availableW = 605 - MARGINS.l - MARGINS.r;
  const availableH = heightPx - MARGINS.t - MARGINS.b - (legendBelow ? 34 : 0);
  const spanX = range.x[1] - range.x[0],
    spanY = range.y[1] - range.y[0];
  const pxPerUnit = Math.min(availableW / spanX, availableH / spanY);
  return { x: range.x, y: range.y, pxPerUnit, width: spanX * pxPerUnit, height: spanY * pxPerUnit };
}

/** Diagram coordinates to frame pixels. */
export function toPx(frame: PlotFrame, p: readonly [number, number]): [number, number] {
  return [(p[0] - frame.x[0]) * frame.pxPerUnit, (p[1] - frame.y[0]) * frame.pxPerUnit];
}

/** Frame pixels to diagram coordinates. */
export function fromPx(frame: PlotFrame, p: Px): [number, number] {
  return [frame.x[0] + p[0] / frame.pxPerUnit, frame.y[0] + p[1] / frame.pxPerUnit];
}

/** Estimated size in pixels of one line of text at a font size (0.6 em per character, 1.3 em high). */
export function textSize(text: string, fontPx: number): { w: number; h: number } {
  return { w: 0.6 * fontPx * [...text].length, h: 1.3 * fontPx };
}

/** The box of a text of size (w, h) centred at c. */
export function boxAt(c: Px, size: { w: number; h: number }): PxBox {
  return { x0: c[0] - size.w / 2, y0: c[1] - size.h / 2, x1: c[0] + size.w / 2, y1: c[1] + size.h / 2 };
}

/** True when two boxes, each grown by `pad` px, overlap. */
export function boxesOverlap(a: PxBox, b: PxBox, pad = 0): boolean {
  return (
    a.x0 - pad < b.x1 + pad && b.x0 - pad < a.x1 + pad && a.y0 - pad < b.y1 + pad && b.y0 - pad < a.y1 + pad
  );
}

/**
 * The part of segment p–q inside the box, as parameters [t0, t1] along p→q (Liang–Barsky clipping, 1984), or
 * undefined when the segment misses the box.
 */
export function clipSegment(p: Px, q: Px, box: PxBox): [number, number] | undefined {
  let t0 = 0,
    t1 = 1;
  const dx = q[0] - p[0],
    dy = q[1] - p[1];
  const checks: [number, number][] = [
    [-dx, p[0] - box.x0],
    [dx, box.x1 - p[0]],
    [-dy, p[1] - box.y0],
    [dy, box.y1 - p[1]],
  ];
  for (const [den, num] of checks) {
    if (den === 0) {
      if (num < 0) return undefined;
      continue;
    }
    const t = num / den;
    if (den < 0) {
      if (t > t1) return undefined;
      if (t > t0) t0 = t;
    } else {
      if (t < t0) return undefined;
      if (t < t1) t1 = t;
    }
  }
  return t0 <= t1 ? [t0, t1] : undefined;
}

/** True when any segment of the polyline (null breaks it) crosses the box grown by `pad` px. */
export function polylineHitsBox(line: readonly (Px | null)[], box: PxBox, pad = 0): boolean {
  const grown = { x0: box.x0 - pad, y0: box.y0 - pad, x1: box.x1 + pad, y1: box.y1 + pad };
  for (let i = 0; i + 1 < line.length; i++) {
    const a = line[i],
      b = line[i + 1];
    if (a && b && clipSegment(a, b, grown)) return true;
  }
  return false;
}

/** Distance in pixels from point c to segment a–b. */
export function distanceToSegment(c: Px, a: Px, b: Px): number {
  const dx = b[0] - a[0],
    dy = b[1] - a[1];
  const len2 = dx * dx + dy * dy;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((c[0] - a[0]) * dx + (c[1] - a[1]) * dy) / len2)) : 0;
  return Math.hypot(c[0] - (a[0] + t * dx), c[1] - (a[1] + t * dy));
}

/** A straight line to label: from `start` (the end a label prefers, e.g. Duv < 0) to `end`, in diagram coordinates. */
export interface LabelledLine<T> {
  readonly start: readonly [number, number];
  readonly end: readonly [number, number];
  readonly text: string;
  /** Lower numbers are placed first. */
  readonly priority: number;
  readonly item: T;
}

export interface LineLabel<T> {
  readonly item: T;
  readonly text: string;
  /** Centre of the text in diagram coordinates (draw with textposition "middle center"). */
  readonly at: [number, number];
  /** The estimated text box in frame pixels. */
  readonly box: PxBox;
}

export interface LineLabelOptions {
  /** Font size of the labels in px. */
  readonly fontPx: number;
  /** Boxes no label may overlap (markers and their text), in frame pixels. */
  readonly reserved?: readonly PxBox[];
  /** Curves a label should not cross (loci), in diagram coordinates; null breaks a curve. Given up only when no place is free of them. */
  readonly curves?: readonly (readonly ([number, number] | null)[])[];
}

const GAP = 3; // px between a line and its label
const PAD = 1.5; // px of clearance around boxes and curves
const STEPS = 24; // positions tried along the visible part of a line

/**
 * Places one label for every line with a visible part inside the frame (lines wholly outside get none): beyond the
 * preferred end when it is visible, else beside the visible part, on either side, nearest that end first; inside the
 * plot area; not overlapping other labels or reserved boxes; crossing no other line or curve when any place allows.
 */
export function placeLineLabels<T>(
  lines: readonly LabelledLine<T>[],
  frame: PlotFrame,
  options: LineLabelOptions,
): LineLabel<T>[] {
  const area: PxBox = { x0: 0, y0: 0, x1: frame.width, y1: frame.height };
  const inner: PxBox = { x0: area.x0 + PAD, y0: area.y0 + PAD, x1: area.x1 - PAD, y1: area.y1 - PAD };
  const pxLines = lines.map((l) => ({ l, p: toPx(frame, l.start) as Px, q: toPx(frame, l.end) as Px }));
  const curves = (options.curves ?? []).map((c) => c.map((p) => (p ? (toPx(frame, p) as Px) : null)));
  const reserved = options.reserved ?? [];
  const placed: LineLabel<T>[] = [];
  const order = pxLines.map((x, i) => ({ ...x, i })).sort((a, b) => a.l.priority - b.l.priority || a.i - b.i);
  for (const { l, p, q, i } of order) {
    const visible = clipSegment(p, q, area);
    if (!visible) continue;
    const size = textSize(l.text, options.fontPx);
    const length = Math.hypot(q[0] - p[0], q[1] - p[1]);
    if (!(length > 0)) continue;
    const d: Px = [(q[0] - p[0]) / length, (q[1] - p[1]) / length];
    const n: Px = [-d[1], d[0]];
    const alongD = Math.abs(d[0]) * (size.w / 2) + Math.abs(d[1]) * (size.h / 2) + GAP;
    const alongN = Math.abs(n[0]) * (size.w / 2) + Math.abs(n[1]) * (size.h / 2) + GAP;
    const at = (t: number): Px => [p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])];
    const centres: Px[] = [];
    if (visible[0] === 0) centres.push([p[0] - d[0] * alongD, p[1] - d[1] * alongD]);
    // The side whose normal points right (then up) first, so neighbouring labels sit on the same side of their lines.
    const first = n[0] > 1e-9 || (Math.abs(n[0]) <= 1e-9 && n[1] > 0) ? 1 : -1;
    for (let k = 0; k <= STEPS; k++) {
      const c = at(visible[0] + ((visible[1] - visible[0]) * k) / STEPS);
      for (const side of [first, -first])
        centres.push([c[0] + side * n[0] * alongN, c[1] + side * n[1] * alongN]);
    }
    if (visible[1] === 1) centres.push([q[0] + d[0] * alongD, q[1] + d[1] * alongD]);
    // Short lines among close neighbours (a whole diagram): any direction around either visible end.
    for (const t of visible) {
      const e = at(t);
      for (let k = 0; k < 16; k++) {
        const u: Px = [Math.cos((k * Math.PI) / 8), Math.sin((k * Math.PI) / 8)];
        const reach = Math.abs(u[0]) * (size.w / 2) + Math.abs(u[1]) * (size.h / 2) + GAP;
        centres.push([e[0] + u[0] * reach, e[1] + u[1] * reach]);
      }
    }
    const others = pxLines.filter((_, j) => j !== i).map((o) => [o.p, o.q] as (Px | null)[]);
    // A label must sit nearer its own line than any other, or a reader may attach it to the wrong one.
    const ownNearest = (c: Px): boolean => {
      const own = distanceToSegment(c, p, q);
      return others.every((o) => distanceToSegment(c, o[0]!, o[1]!) > own + GAP);
    };
    const fits = (box: PxBox, strict: boolean): boolean =>
      ownNearest([(box.x0 + box.x1) / 2, (box.y0 + box.y1) / 2]) &&
      box.x0 >= inner.x0 &&
      box.x1 <= inner.x1 &&
      box.y0 >= inner.y0 &&
      box.y1 <= inner.y1 &&
      !polylineHitsBox([p, q], box, PAD / 2) &&
      placed.every((o) => !boxesOverlap(o.box, box, PAD)) &&
      reserved.every((r) => !boxesOverlap(r, box, PAD)) &&
      (!strict ||
        (others.every((o) => !polylineHitsBox(o, box, PAD)) &&
          curves.every((c) => !polylineHitsBox(c, box, PAD))));
    let chosen: PxBox | undefined;
    for (const strict of [true, false]) {
      for (const c of centres) {
        const box = boxAt(c, size);
        if (fits(box, strict)) {
          chosen = box;
          break;
        }
      }
      if (chosen) break;
    }
    if (!chosen) continue;
    placed.push({
      item: l.item,
      text: l.text,
      at: fromPx(frame, [(chosen.x0 + chosen.x1) / 2, (chosen.y0 + chosen.y1) / 2]),
      box: chosen,
    });
  }
  return placed;
}
