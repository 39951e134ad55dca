/**
 * Chromaticity diagrams, CIE 1931 (x, y) or CIE 1976 UCS (u′, v′), for either standard observer: the spectral locus
 * with wavelength ticks and labels, the purple line, an optional approximate colour fill, the Planckian locus with
 * isotemperature lines and a Duv band, the CIE daylight locus, standard white points, and overlays (labelled points,
 * gamut outlines, tolerance circles and ellipses, arrows). Returns a plain Plotly figure record.
 */
import { observerByName, type ObserverName, type Observer } from "../observers/standard-observer.ts";
import { daylightChromaticity } from "../illuminants/daylight.ts";
import { uvPrimeFromXy } from "../colorimetry/chromaticity.ts";
import { diagramAxisTitles, diagramPoint, diagramSpace, type DiagramSpace } from "./chromaticity-space.ts";
import { spectralLocus, locusPointAt, type LocusPoint } from "./spectral-locus.ts";
import { chromaticityFill, type FillOptions } from "./chromaticity-fill.ts";
import {
  blackbodyChromaticity,
  chromaticityAtCctClipped,
  isotemperatureLine,
  temperaturesByMired,
} from "./planckian-locus.ts";
import { illuminantChromaticity, STANDARD_WHITE_POINTS } from "./white-points.ts";
import { thinLabels } from "./label-placement.ts";
import { placeLineLabels, squarePlotFrame, textSize, toPx, type PxBox } from "./line-labels.ts";
import { toXy } from "./chromaticity-input.ts";
import { houseAxis, houseConfig, houseLayout, INK, FIGURE_HEIGHTS, FONT_FAMILY } from "./style.ts";
import { plotFigure, roundForDisplay as r5, type PlotFigure, type PlotTrace } from "./figure.ts";
import { withoutMethodNotes } from "../methods/method-log.ts";
import {
  gamutTraces,
  pointTraces,
  toleranceTraces,
  arrowAnnotations,
  type GamutChoice,
  type LabelledChromaticity,
  type ToleranceRegion,
  type ChromaticityArrow,
} from "./chromaticity-overlays.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkChoice } from "../arguments/check-text.ts";
import { checkObserver } from "../arguments/common-arguments.ts";

export interface PlanckianOptions {
  /** Temperatures (K) that get an isotemperature line; default 1500, 2000, 3000, 4000, 6500, 10 000 K (more when zoomed). */
  isotemperature?: readonly number[] | false;
  /** Half-length of each isotemperature line in Duv (CIE 1960 uv units); default 0.02. */
  isotemperatureExtent?: number;
  /** Shade the band |Duv| ≤ this value along the locus (e.g. 0.006); default none. */
  duvBand?: number;
  /** Temperature range (K) of the drawn locus; default 1000–100 000 K. */
  range?: readonly [number, number];
}

export interface ChromaticityDiagramOptions {
  /** "xy" (CIE 1931, default) or "u'v'" (CIE 1976 UCS). */
  diagram?: "xy" | "u'v'" | string;
  /** Observer of the spectral locus, white points and blackbody locus; default the CIE 1931 2° observer. */
  observer?: ObserverName | Observer | 2 | 10;
  /** Title; default names the diagram. */
  title?: string;
  /** Your caption, default none; the figure adds a sentence on what is drawn and that the colours are approximate. */
  caption?: string;
  /** Approximate colour fill inside the locus (default on). */
  fill?: boolean | FillOptions;
  /** Wavelengths (nm) to label; default every 10 nm (5 nm where the locus is spread out), thinned so labels do not collide. */
  wavelengthLabels?: readonly number[] | false;
  /** Planckian locus (default on). Isotemperature lines and the Duv band need the CIE 1931 observer. */
  planckian?: boolean | PlanckianOptions;
  /** CIE daylight locus 4000–25 000 K (default on with the CIE 1931 observer, for which CIE 015 defines it). */
  daylight?: boolean;
  /** White points to mark: illuminant names, true for A, D50, D55, D65, D75, E; default ["D65"]. */
  whitePoints?: readonly string[] | boolean;
  /** Labelled points; points with the same `group` share a marker and a legend entry; default none. */
  points?: readonly LabelledChromaticity[];
  /** Gamut outlines: "sRGB", "BT.709", "Display P3", "BT.2020", or custom primaries; default none. */
  gamuts?: readonly GamutChoice[];
  /** Tolerance circles and ellipses; default none. */
  tolerances?: readonly ToleranceRegion[];
  /** Arrows from one chromaticity to another; default none. */
  arrows?: readonly ChromaticityArrow[];
  /** Axis ranges in diagram coordinates, or "white region" for the area around the Planckian locus; default the whole diagram. */
  range?: { x: readonly [number, number]; y: readonly [number, number] } | "white region";
  /** Height in px (default 600). */
  height?: number;
}

const WHOLE: Record<DiagramSpace, { x: [number, number]; y: [number, number] }> = {
  xy: { x: [-0.045, 0.8], y: [-0.045, 0.9] },
  "u'v'": { x: [-0.045, 0.67], y: [-0.045, 0.62] },
};
const WHITE_REGION: Record<DiagramSpace, { x: [number, number]; y: [number, number] }> = {
  xy: { x: [0.24, 0.56], y: [0.24, 0.46] },
  "u'v'": { x: [0.16, 0.3], y: [0.42, 0.56] },
};

/** Isotemperature lines drawn by default: a few on the whole diagram, more when zoomed on the white region. */
const DEFAULT_ISOTEMPERATURE_WHOLE = [1500, 2000, 3000, 4000, 6500, 10000];
const DEFAULT_ISOTEMPERATURE_ZOOMED = [2000, 2500, 3000, 3500, 4000, 4500, 5000, 5700, 6500, 8000, 10000];

function defaultWavelengthLabels(): number[] {
  const out: number[] = [];
  for (let w = 380; w <= 700; w += 10) out.push(w);
  for (let w = 475; w <= 515; w += 10) out.push(w);
  return out.sort((a, b) => a - b);
}

function labelPriority(w: number): number {
  if (w % 100 === 0) return 0;
  if (w % 20 === 0) return 1;
  if (w % 10 === 0) return 2;
  return 3;
}

function inRange(
  p: readonly [number, number],
  range: { x: readonly [number, number]; y: readonly [number, number] },
): boolean {
  return p[0] >= range.x[0] && p[0] <= range.x[1] && p[1] >= range.y[0] && p[1] <= range.y[1];
}

function checkRange(range: { x: readonly [number, number]; y: readonly [number, number] }): void {
  for (const k of ["x", "y"] as const) {
    const r = range[k];
    if (!Array.isArray(r) || r.length !== 2 || !r.every(Number.isFinite) || !(r[1] > r[0])) {
      throw new Error(
        `chromaticity diagram: range.${k} = ${JSON.stringify(r)} must be two increasing finite numbers`,
      );
    }
  }
}

/** Outward unit normal of the locus at index i (away from the equal-energy point), in diagram coordinates. */
function outwardNormal(
  locus: readonly LocusPoint[],
  i: number,
  centre: readonly [number, number],
): [number, number] {
  const a = locus[Math.max(0, i - 2)]!.at,
    b = locus[Math.min(locus.length - 1, i + 2)]!.at;
  let n: [number, number] = [-(b[1] - a[1]), b[0] - a[0]];
  const len = Math.hypot(n[0], n[1]);
  if (!(len > 1e-12)) {
    const p = locus[i]!.at;
    n = [p[0] - centre[0], p[1] - centre[1]];
  }
  const l2 = Math.hypot(n[0], n[1]);
  n = [n[0] / l2, n[1] / l2];
  const p = locus[i]!.at;
  if ((p[0] - centre[0]) * n[0] + (p[1] - centre[1]) * n[1] < 0) n = [-n[0], -n[1]];
  return n;
}

function textPositionFor(n: readonly [number, number]): string {
  const vertical = n[1] > 0.38 ? "top" : n[1] < -0.38 ? "bottom" : "middle";
  const horizontal = n[0] > 0.38 ? "right" : n[0] < -0.38 ? "left" : "center";
  return vertical === "middle" && horizontal === "center" ? "top center" : `${vertical} ${horizontal}`;
}

function locusTraces(
  obs: Observer,
  space: DiagramSpace,
  range: { x: readonly [number, number]; y: readonly [number, number] },
  labels: readonly number[] | false,
): PlotTrace[] {
  const locus = spectralLocus(obs, space, 380, 780);
  const first = locus[0]!,
    last = locus.at(-1)!;
  const traces: PlotTrace[] = [
    {
      type: "scatter",
      mode: "lines",
      name: "Spectral locus",
      x: locus.map((p) => r5(p.at[0])),
      y: locus.map((p) => r5(p.at[1])),
      customdata: locus.map((p) => p.wavelength),
      line: { color: INK.text, width: 1.6, shape: "linear" },
      hovertemplate: `λ = %{customdata} nm<br>${space === "xy" ? "x" : "u′"} = %{x:.4f}<br>${space === "xy" ? "y" : "v′"} = %{y:.4f}<extra>spectral locus</extra>`,
      showlegend: false,
    },
    {
      type: "scatter",
      mode: "lines",
      name: "Purple line",
      x: [r5(first.at[0]), r5(last.at[0])],
      y: [r5(first.at[1]), r5(last.at[1])],
      line: { color: INK.text, width: 1.2, dash: "4px,3px" },
      hovertemplate: `purple line ${first.wavelength}–${last.wavelength} nm<extra></extra>`,
      showlegend: false,
    },
  ];
  if (labels === false) return traces;
  const spans: [number, number] = [range.x[1] - range.x[0], range.y[1] - range.y[0]];
  const centre = diagramPoint({ x: 1 / 3, y: 1 / 3 }, space);
  // Only wavelengths on the locus: a table on a 5 nm grid, or one with no sensitivity at its ends, lacks some.
  const wanted = [...new Set(labels)].filter(
    (w) => w >= 380 && w <= 780 && Number.isInteger(w) && locus.some((p) => p.wavelength === w),
  );
  const candidates = wanted.map((w) => {
    const i = locus.findIndex((p) => p.wavelength === w);
    return { at: locus[i]!.at, priority: labelPriority(w), item: i };
  });
  const kept = thinLabels(
    candidates.filter((c) => inRange(c.at, range)),
    spans,
    0.038,
  );
  // Ticks: every labelled wavelength, and every 5 nm from 400 to 700 nm where the locus leaves room between ticks.
  const tickCandidates = [
    ...new Set([
      ...kept.map((i) => locus[i]!.wavelength),
      ...Array.from({ length: 61 }, (_, k) => 400 + 5 * k),
    ]),
  ]
    .map((w) => locus.findIndex((p) => p.wavelength === w))
    .filter((i) => i >= 0 && inRange(locus[i]!.at, range))
    .map((i) => ({
      at: locus[i]!.at,
      priority: kept.includes(i) ? -1 : labelPriority(locus[i]!.wavelength),
      item: i,
    }));
  const ticks = thinLabels(tickCandidates, spans, 0.011);
  const tickLen = 0.011 * Math.max(...spans),
    labelGap = 0.016 * Math.max(...spans);
  const tx: (number | null)[] = [],
    ty: (number | null)[] = [];
  for (const i of ticks) {
    const p = locus[i]!.at;
    const n = outwardNormal(locus, i, centre);
    tx.push(r5(p[0]), r5(p[0] + n[0] * tickLen), null);
    ty.push(r5(p[1]), r5(p[1] + n[1] * tickLen), null);
  }
  const lx: number[] = [],
    ly: number[] = [],
    lt: string[] = [],
    lpos: string[] = [];
  for (const i of kept) {
    const p = locus[i]!.at;
    const n = outwardNormal(locus, i, centre);
    lx.push(r5(p[0] + n[0] * labelGap));
    ly.push(r5(p[1] + n[1] * labelGap));
    lt.push(String(locus[i]!.wavelength));
    lpos.push(textPositionFor(n));
  }
  // Empty traces are left out: Plotly draws nothing for them and they would only weigh on the report.
  if (ticks.length > 0) {
    traces.push({
      type: "scatter",
      mode: "lines",
      name: "Wavelength ticks",
      x: tx,
      y: ty,
      line: { color: INK.text, width: 1 },
      hoverinfo: "skip",
      showlegend: false,
    });
  }
  if (kept.length > 0) {
    traces.push({
      type: "scatter",
      mode: "text",
      name: "Wavelengths (nm)",
      x: lx,
      y: ly,
      text: lt,
      textposition: lpos,
      textfont: { family: FONT_FAMILY, size: 10, color: INK.text },
      hoverinfo: "skip",
      showlegend: false,
      cliponaxis: false,
    });
  }
  return traces;
}

function resolvePlanckian(
  p: ChromaticityDiagramOptions["planckian"],
  zoomed: boolean,
): (Required<Omit<PlanckianOptions, "duvBand">> & { duvBand?: number }) | undefined {
  if (p === false) return undefined;
  const o: PlanckianOptions = p === true || p === undefined ? {} : p;
  const range = o.range ?? [1000, 100000];
  if (!(range[0] >= 500 && range[1] > range[0] && range[1] <= 1e7))
    throw new Error(
      `Planckian locus: range ${range[0]}–${range[1]} K must increase within 500 K – 10 000 000 K`,
    );
  const iso = o.isotemperature ?? (zoomed ? DEFAULT_ISOTEMPERATURE_ZOOMED : DEFAULT_ISOTEMPERATURE_WHOLE);
  if (iso !== false)
    for (const t of iso)
      if (!(t >= 1000 && t <= 100000))
        throw new Error(
          `isotemperature line at ${t} K: CIE 015 CCTs are drawn here from 1000 K to 100 000 K`,
        );
  const extent = o.isotemperatureExtent ?? 0.02;
  if (!(extent > 0 && extent <= 0.05))
    throw new Error(
      `isotemperature extent ${extent} must lie in (0, 0.05] (CIE 015:2018 defines CCT only for |Duv| ≤ 0.05)`,
    );
  if (o.duvBand !== undefined && !(o.duvBand > 0 && o.duvBand <= 0.05))
    throw new Error(`Duv band ${o.duvBand} must lie in (0, 0.05]`);
  return { isotemperature: iso, isotemperatureExtent: extent, range, duvBand: o.duvBand };
}

/** What the isotemperature labels must keep clear of: marker and text boxes, and the other curves drawn. */
interface LabelSurroundings {
  readonly heightPx: number;
  readonly reserved: readonly PxBox[];
  readonly curves: readonly (readonly ([number, number] | null)[])[];
}

function planckianTraces(
  obs: Observer,
  space: DiagramSpace,
  opts: NonNullable<ReturnType<typeof resolvePlanckian>>,
  range: { x: readonly [number, number]; y: readonly [number, number] },
  surroundings: LabelSurroundings,
  notes: string[],
): PlotTrace[] {
  const traces: PlotTrace[] = [];
  const temps = temperaturesByMired(opts.range[0], opts.range[1], 240);
  const pts = temps.map((t) => diagramPoint(blackbodyChromaticity(t, obs), space));
  const cieObserver = obs.fieldDegrees === 2;
  if (cieObserver && opts.duvBand !== undefined) {
    const bandTemps = temperaturesByMired(
      Math.max(1000, opts.range[0]),
      Math.min(100000, opts.range[1]),
      160,
    );
    const upper = bandTemps.map((t) => diagramPoint(chromaticityAtCctClipped(t, opts.duvBand!), space));
    const lower = bandTemps
      .map((t) => diagramPoint(chromaticityAtCctClipped(t, -opts.duvBand!), space))
      .reverse();
    const ring = [...upper, ...lower, upper[0]!];
    traces.push({
      type: "scatter",
      mode: "lines",
      name: `Duv band ±${opts.duvBand}`,
      x: ring.map((p) => r5(p[0])),
      y: ring.map((p) => r5(p[1])),
      fill: "toself",
      fillcolor: "rgba(60,60,60,0.16)",
      line: { color: "rgba(60,60,60,0.55)", width: 0.8 },
      hoverinfo: "skip",
    });
    notes.push(`the shaded band is |Duv| ≤ ${opts.duvBand}`);
  }
  traces.push({
    type: "scatter",
    mode: "lines",
    name: "Planckian locus",
    x: pts.map((p) => r5(p[0])),
    y: pts.map((p) => r5(p[1])),
    customdata: temps.map((t) => Math.round(t)),
    line: { color: INK.text, width: 1.3 },
    hovertemplate: `Planckian radiator<br>T = %{customdata} K<br>${space === "xy" ? "x" : "u′"} = %{x:.4f}, ${space === "xy" ? "y" : "v′"} = %{y:.4f}<extra></extra>`,
  });
  notes.push(
    `the Planckian locus (${opts.range[0]}–${opts.range[1]} K, c2 = 1.4388×10⁻² m·K${cieObserver ? "" : ", computed with this observer"})`,
  );
  if (opts.isotemperature !== false && opts.isotemperature.length > 0) {
    if (!cieObserver) {
      notes.push("no isotemperature lines, as CCT is defined with the CIE 1931 observer only (CIE 015:2018)");
    } else {
      const lx: (number | null)[] = [],
        ly: (number | null)[] = [];
      const segments: { start: [number, number]; end: [number, number]; t: number }[] = [];
      for (const t of opts.isotemperature) {
        const [a, b] = isotemperatureLine(t, opts.isotemperatureExtent);
        const pa = diagramPoint(a, space),
          pb = diagramPoint(b, space);
        lx.push(r5(pa[0]), r5(pb[0]), null);
        ly.push(r5(pa[1]), r5(pb[1]), null);
        segments.push({ start: pa, end: pb, t });
      }
      traces.push({
        type: "scatter",
        mode: "lines",
        name: `Isotemperature lines (Duv ±${opts.isotemperatureExtent})`,
        x: lx,
        y: ly,
        line: { color: INK.text, width: 0.9 },
        hoverinfo: "skip",
        showlegend: false,
      });
      // Every line with a visible part gets its label inside the plot area, beside or beyond that part (line-labels.ts).
      const frame = squarePlotFrame(range, surroundings.heightPx);
      const kept = placeLineLabels(
        segments.map((g) => ({
          start: g.start,
          end: g.end,
          text: `${g.t} K`,
          priority: [2000, 3000, 6500].includes(g.t) ? 0 : [4000, 10000].includes(g.t) ? 1 : 2,
          item: g.t,
        })),
        frame,
        {
          fontPx: ISOTEMPERATURE_LABEL_PX,
          reserved: surroundings.reserved,
          curves: [pts, ...surroundings.curves],
        },
      );
      if (kept.length > 0)
        traces.push({
          type: "scatter",
          mode: "text",
          name: "CCT labels",
          x: kept.map((e) => r5(e.at[0])),
          y: kept.map((e) => r5(e.at[1])),
          text: kept.map((e) => e.text),
          textposition: "middle center",
          textfont: { family: FONT_FAMILY, size: ISOTEMPERATURE_LABEL_PX, color: INK.text },
          hoverinfo: "skip",
          showlegend: false,
          cliponaxis: false,
        });
      notes.push(
        `isotemperature lines to Duv = ±${opts.isotemperatureExtent} (normal to the locus in the CIE 1960 UCS diagram, CIE 015:2018)`,
      );
    }
  }
  return traces;
}

const ISOTEMPERATURE_LABEL_PX = 9;

function daylightPoints(space: DiagramSpace): { temps: number[]; pts: [number, number][] } {
  const temps = temperaturesByMired(4000, 25000, 80);
  return { temps, pts: temps.map((t) => diagramPoint(daylightChromaticity(t), space)) };
}

/**
 * Boxes (frame pixels) of the labelled points and white points with their text, as Plotly draws them: a marker of
 * about 10 px, text at 11 px above right of a point (pointTraces) and at 10 px above left of a white point.
 */
function reservedBoxes(
  options: ChromaticityDiagramOptions,
  whiteNames: readonly string[],
  obs: Observer,
  space: DiagramSpace,
  frame: ReturnType<typeof squarePlotFrame>,
): PxBox[] {
  const boxes: PxBox[] = [];
  const add = (at: [number, number], label: string, fontPx: number, right: boolean) => {
    const [cx, cy] = toPx(frame, at);
    boxes.push({ x0: cx - 5, y0: cy - 5, x1: cx + 5, y1: cy + 5 });
    if (!label) return;
    const size = textSize(label, fontPx);
    boxes.push(
      right
        ? { x0: cx + 3, y0: cy + 3, x1: cx + 3 + size.w, y1: cy + 3 + size.h }
        : { x0: cx - 3 - size.w, y0: cy + 3, x1: cx - 3, y1: cy + 3 + size.h },
    );
  };
  for (const p of options.points ?? [])
    add(diagramPoint(toXy(p, `point "${p?.label}"`), space), String(p.label ?? ""), 11, true);
  for (const n of whiteNames) add(diagramPoint(illuminantChromaticity(n, obs), space), n, 10, false);
  return boxes;
}

function daylightTrace(space: DiagramSpace): PlotTrace {
  const { temps, pts } = daylightPoints(space);
  return {
    type: "scatter",
    mode: "lines",
    name: "Daylight locus",
    x: pts.map((p) => r5(p[0])),
    y: pts.map((p) => r5(p[1])),
    customdata: temps.map((t) => Math.round(t)),
    line: { color: INK.text, width: 1.3, dash: "dash" },
    hovertemplate: "CIE daylight<br>T<sub>cp</sub> = %{customdata} K<extra></extra>",
  };
}

function whitePointTrace(
  names: readonly string[],
  obs: Observer,
  space: DiagramSpace,
  range: { x: readonly [number, number]; y: readonly [number, number] },
): PlotTrace {
  const pts = names.map((n) => ({ n, xy: illuminantChromaticity(n, obs) }));
  // Label only the white points that leave room for their name; the others are named in their hover box.
  const spans: [number, number] = [range.x[1] - range.x[0], range.y[1] - range.y[0]];
  const labelled = new Set(
    thinLabels(
      pts.map((p, i) => ({ at: diagramPoint(p.xy, space), priority: p.n === "D65" ? 0 : 1, item: i })),
      spans,
      0.035,
    ),
  );
  return {
    type: "scatter",
    mode: "markers+text",
    name: "White points",
    x: pts.map((p) => r5(diagramPoint(p.xy, space)[0])),
    y: pts.map((p) => r5(diagramPoint(p.xy, space)[1])),
    text: pts.map((p, i) => (labelled.has(i) ? p.n : "")),
    hovertext: pts.map((p) => p.n),
    textposition: "top left",
    textfont: { family: FONT_FAMILY, size: 10, color: INK.text },
    customdata: pts.map((p) => {
      const uv = uvPrimeFromXy(p.xy);
      return [r5(p.xy.x), r5(p.xy.y), r5(uv.u), r5(uv.v)];
    }),
    marker: { symbol: "circle-open-dot", size: 8, color: INK.text, line: { width: 1.2 } },
    hovertemplate:
      "<b>%{hovertext}</b><br>x = %{customdata[0]:.5f}, y = %{customdata[1]:.5f}<br>u′ = %{customdata[2]:.5f}, v′ = %{customdata[3]:.5f}<extra>white point</extra>",
    cliponaxis: false,
  };
}

/**
 * A chromaticity diagram (CIE 1931 xy or CIE 1976 u′v′) with the overlays asked for, as a figure record for `showFigure`.
 *
 * Drawing notes nothing in the Methods log: the loci, white-point marks, fill and hover readouts (CCT, Duv) are
 * decorations, and the caption states what they are.
 *
 * @returns A `PlotFigure` (Plotly data, layout, config and caption).
 * @source CIE 015:2018 (spectral locus, Planckian and daylight loci, white points); the drawing is the tristim house style.
 * @example chromaticityDiagram({ diagram: "u'v'", points: [{ label: "invented lamp", x: 0.45, y: 0.41 }], gamuts: ["sRGB"] })
 */
export function chromaticityDiagram(options: ChromaticityDiagramOptions = {}): PlotFigure {
  checkOptions("chromaticityDiagram", "options", options, [
    "diagram",
    "observer",
    "title",
    "caption",
    "fill",
    "wavelengthLabels",
    "planckian",
    "daylight",
    "whitePoints",
    "points",
    "gamuts",
    "tolerances",
    "arrows",
    "range",
    "height",
  ]);
  return withoutMethodNotes(() => drawChromaticityDiagram(options));
}

function drawChromaticityDiagram(options: ChromaticityDiagramOptions): PlotFigure {
  const space = diagramSpace(options.diagram);
  const obs = observerByName(options.observer ?? "2°");
  const range =
    options.range === undefined
      ? WHOLE[space]
      : options.range === "white region"
        ? WHITE_REGION[space]
        : options.range;
  if (typeof range === "string")
    throw new Error(
      `chromaticity diagram: range "${range}" is not known; give {x: [min, max], y: [min, max]} or "white region"`,
    );
  checkRange(range);
  const height = options.height ?? FIGURE_HEIGHTS.square;
  const notes: string[] = [`the spectral locus (380–780 nm) and purple line of the ${obs.name}`];
  const data: PlotTrace[] = [];
  const layoutImages: Record<string, unknown>[] = [];

  if (options.fill !== false) {
    const fillOptions = typeof options.fill === "object" ? options.fill : {};
    const polygon = spectralLocus(obs, space, 380, 780).map((p) => p.at);
    const img = chromaticityFill(polygon, space, range.x, range.y, fillOptions);
    layoutImages.push({
      source: img.source,
      xref: "x",
      yref: "y",
      x: img.x,
      y: img.y,
      sizex: img.sizex,
      sizey: img.sizey,
      sizing: "stretch",
      xanchor: "left",
      yanchor: "top",
      layer: "below",
      opacity: 1,
    });
  }

  data.push(...locusTraces(obs, space, range, options.wavelengthLabels ?? defaultWavelengthLabels()));
  const wantDaylight = options.daylight ?? obs.fieldDegrees === 2;
  if (wantDaylight && obs.fieldDegrees !== 2)
    throw new Error(
      "chromaticity diagram: the CIE daylight locus is defined for the CIE 1931 2° observer (CIE 015:2018 §4.1.2); turn `daylight` off for the 10° observer",
    );
  const whiteNames =
    options.whitePoints === true
      ? STANDARD_WHITE_POINTS
      : options.whitePoints === false
        ? []
        : (options.whitePoints ?? ["D65"]);
  const planckian = resolvePlanckian(options.planckian, range !== WHOLE[space]);
  if (planckian) {
    const surroundings: LabelSurroundings = {
      heightPx: height,
      reserved: reservedBoxes(options, whiteNames, obs, space, squarePlotFrame(range, height)),
      curves: wantDaylight ? [daylightPoints(space).pts] : [],
    };
    data.push(...planckianTraces(obs, space, planckian, range, surroundings, notes));
  }
  if (wantDaylight) {
    data.push(daylightTrace(space));
    notes.push("the CIE daylight locus (4000–25 000 K, CIE 015:2018 eq. 4.6)");
  }
  if (whiteNames.length > 0) {
    data.push(whitePointTrace(whiteNames, obs, space, range));
    notes.push(`white points of ${whiteNames.join(", ")}`);
  }
  const gamuts = gamutTraces(options.gamuts ?? [], space);
  data.push(...gamuts.traces);
  if (gamuts.names.length > 0) notes.push(`gamut outlines: ${gamuts.names.join("; ")}`);
  data.push(...toleranceTraces(options.tolerances ?? [], space));
  if ((options.points ?? []).length > 0) {
    // Plotly's "closest" hover prefers a line vertex a few pixels away over a marker under the pointer, so with
    // labelled points on the diagram the reference curves stay silent and the points answer the pointer.
    for (const t of data) {
      if (["Spectral locus", "Purple line", "Planckian locus", "Daylight locus"].includes(String(t.name))) {
        delete t.hovertemplate;
        t.hoverinfo = "skip";
      }
    }
  }
  data.push(...pointTraces(options.points ?? [], space));
  const annotations = arrowAnnotations(options.arrows ?? [], space);

  const [xTitle, yTitle] = diagramAxisTitles(space);
  const defaultTitle =
    space === "xy" ? "CIE 1931 (x, y) chromaticity diagram" : "CIE 1976 UCS (u′, v′) chromaticity diagram";
  const layout = houseLayout({
    title: options.title ?? defaultTitle,
    subtitle: obs.name,
    height,
    xaxis: houseAxis(xTitle, {
      range: [...range.x],
      tick0: 0,
      dtick: space === "xy" && range === WHOLE.xy ? 0.1 : undefined,
      constrain: "domain",
    }),
    yaxis: houseAxis(yTitle, {
      range: [...range.y],
      tick0: 0,
      dtick: space === "xy" && range === WHOLE.xy ? 0.1 : undefined,
      scaleanchor: "x",
      scaleratio: 1,
      constrain: "domain",
    }),
    legend: "below",
  });
  layout.images = layoutImages;
  layout.annotations = annotations;
  const fillNote =
    options.fill === false
      ? ""
      : " The background colours are approximate (sRGB, moved toward white where a display cannot show them) and serve for orientation only.";
  const auto = `Shown: ${notes.join("; ")}.${fillNote}`;
  const caption = options.caption ? `${options.caption.trim()} ${auto}` : auto;
  return plotFigure(data, layout, houseConfig(options.title ?? defaultTitle), caption);
}

/**
 * The point of the spectral locus at a wavelength, in a diagram's coordinates (for annotations in cells).
 *
 * @param wavelength The wavelength, in nm.
 * @param diagram "xy" or "u'v'"; default "xy".
 * @param observer "2°" or "10°" or an `Observer`; default "2°".
 * @returns [x, y] (or [u′, v′]).
 * @source ISO/CIE 11664-1:2019 (colour-matching functions); CIE 015:2018 eqs. 7.3 and 8.2.
 * @example spectralLocusPoint(520)
 */
export function spectralLocusPoint(
  wavelength: number,
  diagram: "xy" | "u'v'" = "xy",
  observer: ObserverName | Observer | 2 | 10 = "2°",
): [number, number] {
  checkNumber("spectralLocusPoint", "wavelength", wavelength, {
    unit: "nm",
    integer: true,
    min: 360,
    max: 830,
  });
  checkChoice("spectralLocusPoint", "diagram", diagram, ["xy", "u'v'", "u′v′"], { optional: true });
  checkObserver("spectralLocusPoint", "observer", observer);
  return locusPointAt(observerByName(observer), wavelength, diagramSpace(diagram)).at;
}
