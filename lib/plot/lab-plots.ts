/**
 * CIELAB views (CIE 015:2018 §8.2.1): the a*b* plane with chroma circles, and L* against C*ab, for sets of samples,
 * with reference → sample difference vectors labelled by ΔE00 (CIEDE2000, CIE 142-2001, via lib/difference).
 * Marker fills show each sample's approximate colour (see labDisplayHex); the caption says so.
 */
import { lchFromLab, xyzFromLab, type Lab } from "../colorimetry/cielab.ts";
import { deltaE2000 } from "../difference/delta-e-2000.ts";
import { encodeRgb, hexFromEncoded } from "./display-rgb.ts";
import { mapToDisplayGamut } from "./gamut-mapping.ts";
import { escapeHover } from "./chromaticity-overlays.ts";
import { withoutMethodNotes } from "../methods/method-log.ts";
import { D65_WHITE_Y100 } from "./display-white.ts";
import { plotFigure, roundForDisplay, type PlotFigure, type PlotTrace } from "./figure.ts";
import {
  FIGURE_HEIGHTS,
  FONT_FAMILY,
  INK,
  SERIES_MARKERS,
  houseAxis,
  houseConfig,
  houseLayout,
} from "./style.ts";
import { LAB_FIELDS, checkFields } from "../arguments/check-fields.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";

/** A sample in CIELAB; `group` collects samples under one legend entry and marker shape. */
export interface LabSample {
  readonly label: string;
  readonly lab: Lab;
  readonly group?: string;
}

/** A reference and a sample: drawn as an arrow from reference to sample, with ΔE00 in the hover box. */
export interface LabPair {
  readonly label: string;
  readonly reference: Lab;
  readonly sample: Lab;
}

export interface LabPlotOptions {
  /** Points to plot: { label, lab, group? } (a shared `group` shares a marker); default none. */
  samples?: readonly LabSample[];
  /** Reference → sample pairs { label, reference, sample }, drawn as arrows with ΔE00 on hover; default none. */
  pairs?: readonly LabPair[];
  /** Title; default "CIELAB a*, b* plane" or "CIELAB lightness against chroma". */
  title?: string;
  /** Your caption, default none; the figure adds what the markers and arrows mean. */
  caption?: string;
  /** Half-width of the a* and b* axes (labPlane) or the largest C*ab shown (lightnessChromaPlot); default from the data. */
  extent?: number;
  /** Label every point with its name (default: when there are at most 30 points). */
  labels?: boolean;
  /** Height in CSS px; default 600 (labPlane) or 420 (lightnessChromaPlot). */
  height?: number;
}

/**
 * An approximate sRGB #rrggbb for a CIELAB colour, for marker fills only (not a colorimetric conversion).
 *
 * L*a*b* is read as if relative to the D65 display white (no chromatic adaptation is modelled); a colour outside sRGB
 * is gamut-mapped into it (chroma reduced at constant OKLab lightness and hue).
 *
 * @param lab CIELAB { L, a, b }.
 * @returns "#rrggbb".
 * @source CSS Color Module Level 4 §13.2 (gamut mapping); IEC 61966-2-1:1999 (sRGB).
 * @example labDisplayHex({ L: 60, a: 30, b: 20 })
 */
export function labDisplayHex(lab: Lab): string {
  checkFields("labDisplayHex", "lab", lab, LAB_FIELDS);
  const xyz = xyzFromLab(lab, D65_WHITE_Y100);
  return hexFromEncoded(
    encodeRgb(mapToDisplayGamut({ X: xyz.X / 100, Y: xyz.Y / 100, Z: xyz.Z / 100 }, "sRGB").linear, "sRGB"),
  );
}

function checkLab(lab: Lab, what: string): Lab {
  if (
    !lab ||
    typeof lab !== "object" ||
    ![lab.L, lab.a, lab.b].every((v) => typeof v === "number" && Number.isFinite(v))
  ) {
    throw new Error(`${what}: L*a*b* = ${JSON.stringify(lab)} must be three finite numbers {L, a, b}`);
  }
  return lab;
}

type View = "ab" | "LC";

function coords(lab: Lab, view: View): [number, number] {
  return view === "ab" ? [lab.a, lab.b] : [lchFromLab(lab).C, lab.L];
}

const HOVER =
  "<b>%{text}</b><br>L* = %{customdata[0]}<br>a* = %{customdata[1]}, b* = %{customdata[2]}<br>C*ab = %{customdata[3]}, hab = %{customdata[4]}°";

function labCustom(lab: Lab): string[] {
  const lch = lchFromLab(lab);
  return [lab.L.toFixed(2), lab.a.toFixed(2), lab.b.toFixed(2), lch.C.toFixed(2), lch.h.toFixed(1)];
}

function labTraces(
  o: LabPlotOptions,
  view: View,
): { traces: PlotTrace[]; vectors: [[number, number], [number, number]][]; all: [number, number][] } {
  const samples = o.samples ?? [];
  const pairs = o.pairs ?? [];
  if (samples.length + pairs.length === 0)
    throw new Error("CIELAB plot: give samples or pairs (none were given)");
  const showLabels = o.labels ?? samples.length + pairs.length <= 30;
  const traces: PlotTrace[] = [];
  const all: [number, number][] = [];
  const groups = new Map<string, LabSample[]>();
  samples.forEach((s, i) => {
    checkLab(s.lab, `sample ${i + 1} ("${s.label}")`);
    const g = s.group ?? "Samples";
    if (!groups.has(g)) groups.set(g, []);
    groups.get(g)!.push(s);
  });
  let gi = 0;
  for (const [group, list] of groups) {
    const pts = list.map((s) => coords(s.lab, view));
    all.push(...pts);
    traces.push({
      type: "scatter",
      mode: showLabels ? "markers+text" : "markers",
      name: escapeHover(group),
      x: pts.map((p) => roundForDisplay(p[0], 3)),
      y: pts.map((p) => roundForDisplay(p[1], 3)),
      text: list.map((s) => escapeHover(s.label)),
      textposition: "top right",
      textfont: { family: FONT_FAMILY, size: 10, color: INK.text },
      customdata: list.map((s) => labCustom(s.lab)),
      marker: {
        symbol: SERIES_MARKERS[gi % SERIES_MARKERS.length]!.replace(/-open$/, ""),
        size: 11,
        color: list.map((s) => labDisplayHex(s.lab)),
        line: { color: INK.text, width: 1 },
      },
      hovertemplate: HOVER + `<extra>${escapeHover(group)}</extra>`,
      cliponaxis: false,
    });
    gi++;
  }
  const vectors: [[number, number], [number, number]][] = [];
  if (pairs.length > 0) {
    const refs = pairs.map((p, i) =>
      coords(checkLab(p.reference, `pair ${i + 1} ("${p.label}") reference`), view),
    );
    const smps = pairs.map((p, i) => coords(checkLab(p.sample, `pair ${i + 1} ("${p.label}") sample`), view));
    all.push(...refs, ...smps);
    const diff = pairs.map((p) => {
      const r = lchFromLab(p.reference),
        s = lchFromLab(p.sample);
      return [
        deltaE2000(p.reference, p.sample).toFixed(2),
        (p.sample.L - p.reference.L).toFixed(2),
        (s.C - r.C).toFixed(2),
      ];
    });
    traces.push({
      type: "scatter",
      mode: "markers",
      name: "Reference",
      x: refs.map((p) => roundForDisplay(p[0], 3)),
      y: refs.map((p) => roundForDisplay(p[1], 3)),
      text: pairs.map((p) => escapeHover(p.label)),
      customdata: pairs.map((p) => labCustom(p.reference)),
      marker: { symbol: "circle-open", size: 12, color: INK.text, line: { width: 1.6 } },
      hovertemplate: HOVER + "<extra>reference</extra>",
    });
    traces.push({
      type: "scatter",
      mode: showLabels ? "markers+text" : "markers",
      name: "Sample",
      x: smps.map((p) => roundForDisplay(p[0], 3)),
      y: smps.map((p) => roundForDisplay(p[1], 3)),
      text: pairs.map((p) => escapeHover(p.label)),
      textposition: "top right",
      textfont: { family: FONT_FAMILY, size: 10, color: INK.text },
      customdata: pairs.map((p, i) => [...labCustom(p.sample), ...diff[i]!]),
      marker: {
        symbol: "diamond",
        size: 10,
        color: pairs.map((p) => labDisplayHex(p.sample)),
        line: { color: INK.text, width: 1 },
      },
      hovertemplate:
        HOVER +
        "<br>ΔE00 = %{customdata[5]} (ΔL* %{customdata[6]}, ΔC*ab %{customdata[7]})<extra>sample</extra>",
      cliponaxis: false,
    });
    // The vector itself is a line (visible however short); an arrowhead annotation marks its direction.
    const vx: (number | null)[] = [],
      vy: (number | null)[] = [];
    pairs.forEach((_, i) => {
      const [a, b] = [refs[i]!, smps[i]!];
      vx.push(roundForDisplay(a[0], 3), roundForDisplay(b[0], 3), null);
      vy.push(roundForDisplay(a[1], 3), roundForDisplay(b[1], 3), null);
      vectors.push([a, b]);
    });
    traces.splice(traces.length - 2, 0, {
      type: "scatter",
      mode: "lines",
      name: "Reference → sample",
      x: vx,
      y: vy,
      line: { color: INK.text, width: 1.2 },
      hoverinfo: "skip",
      showlegend: false,
    });
  }
  return { traces, vectors, all };
}

/**
 * Arrowheads for the vectors long enough to carry one: at least 24 px at the figure's usual drawn size (plot area
 * about `widthPx` × `heightPx`); shorter vectors keep only their line, the markers telling reference from sample.
 */
function arrowheads(
  vectors: readonly [[number, number], [number, number]][],
  xSpan: number,
  ySpan: number,
  widthPx: number,
  heightPx: number,
): Record<string, unknown>[] {
  return vectors
    .filter(
      ([a, b]) => Math.hypot(((b[0] - a[0]) / xSpan) * widthPx, ((b[1] - a[1]) / ySpan) * heightPx) >= 24,
    )
    .map(([a, b]) => ({
      x: b[0],
      y: b[1],
      ax: a[0],
      ay: a[1],
      xref: "x",
      yref: "y",
      axref: "x",
      ayref: "y",
      showarrow: true,
      arrowhead: 2,
      arrowsize: 1,
      arrowwidth: 1.2,
      arrowcolor: INK.text,
      standoff: 6,
      startstandoff: 7,
      text: "",
    }));
}

function niceStep(span: number): number {
  const raw = span / 5;
  const p = 10 ** Math.floor(Math.log10(raw));
  const m = raw / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}

function captionFor(o: LabPlotOptions, view: View): string {
  const parts = [
    view === "ab"
      ? "CIELAB a*, b* plane (CIE 015:2018); faint circles are lines of constant chroma C*ab"
      : "CIELAB lightness L* against chroma C*ab (CIE 015:2018)",
  ];
  if ((o.samples ?? []).length > 0)
    parts.push(
      "marker fills show approximate colours (L*a*b* read against a D65 display white, gamut-mapped into sRGB)",
    );
  if ((o.pairs ?? []).length > 0)
    parts.push(
      "lines join each reference (open circle) to its sample (diamond), with an arrowhead where there is room; hover shows ΔE00 (CIEDE2000, CIE 142-2001)",
    );
  const auto = parts.join("; ") + ".";
  return o.caption ? `${o.caption.trim()} ${auto}` : auto;
}

/**
 * The CIELAB a*b* plane with samples, chroma circles and reference → sample arrows, as a figure record (hover ΔE00 is not noted in the Methods log).
 *
 * @param options Samples, pairs, title, caption, extent, labels, height.
 * @returns A `PlotFigure`.
 * @source CIE 015:2018 §8.2.1 (CIELAB); CIE 142-2001 (ΔE00 on hover); the drawing is the tristim house style.
 * @example labPlane({ samples: [{ label: "invented A", lab: { L: 50, a: 20, b: 10 } }], pairs: [{ label: "invented B", reference: { L: 60, a: -10, b: 30 }, sample: { L: 61, a: -8, b: 28 } }] })
 */
export function labPlane(options: LabPlotOptions): PlotFigure {
  checkLabPlotOptions("labPlane", options);
  return withoutMethodNotes(() => drawLabPlane(options));
}

function drawLabPlane(options: LabPlotOptions): PlotFigure {
  const { traces, vectors, all } = labTraces(options, "ab");
  if (options.extent !== undefined && !(options.extent > 0))
    throw new Error(`labPlane: extent ${options.extent} must be a positive number`);
  const extent =
    options.extent ?? Math.max(10, ...all.map((p) => Math.max(Math.abs(p[0]), Math.abs(p[1])))) * 1.15;
  const step = niceStep(2 * extent);
  const R = Math.ceil(extent / step) * step;
  const shapes: Record<string, unknown>[] = [];
  for (let c = step; c <= R * Math.SQRT2; c += step) {
    shapes.push({
      type: "circle",
      xref: "x",
      yref: "y",
      x0: -c,
      y0: -c,
      x1: c,
      y1: c,
      line: { color: INK.grid, width: 1 },
      layer: "below",
    });
  }
  const ends = [
    { x: R, y: 0, text: "+a* (red)", xanchor: "right", yanchor: "bottom" },
    { x: -R, y: 0, text: "−a* (green)", xanchor: "left", yanchor: "bottom" },
    { x: 0, y: R, text: "+b* (yellow)", xanchor: "left", yanchor: "top" },
    { x: 0, y: -R, text: "−b* (blue)", xanchor: "left", yanchor: "bottom" },
  ].map((e) => ({
    ...e,
    xref: "x",
    yref: "y",
    showarrow: false,
    font: { family: FONT_FAMILY, size: 10, color: "#555555" },
  }));
  const layout = houseLayout({
    title: options.title ?? "CIELAB a*, b* plane",
    height: options.height ?? FIGURE_HEIGHTS.square,
    xaxis: houseAxis("a*", {
      range: [-R, R],
      dtick: step,
      zeroline: true,
      zerolinecolor: INK.frame,
      zerolinewidth: 1,
      showgrid: false,
      constrain: "domain",
    }),
    yaxis: houseAxis("b*", {
      range: [-R, R],
      dtick: step,
      zeroline: true,
      zerolinecolor: INK.frame,
      zerolinewidth: 1,
      showgrid: false,
      scaleanchor: "x",
      scaleratio: 1,
      constrain: "domain",
    }),
    legend: "below",
  });
  layout.shapes = shapes;
  layout.annotations = [...ends, ...arrowheads(vectors, 2 * R, 2 * R, 460, 460)];
  return plotFigure(
    traces,
    layout,
    houseConfig(options.title ?? "cielab-ab-plane"),
    captionFor(options, "ab"),
  );
}

/**
 * CIELAB lightness L* against chroma C*ab for samples, with reference → sample arrows, as a figure record (hover ΔE00 is not noted in the Methods log).
 *
 * @param options Samples, pairs, title, caption, extent, labels, height.
 * @returns A `PlotFigure`.
 * @source CIE 015:2018 §8.2.1 (CIELAB, C*ab); the drawing is the tristim house style.
 * @example lightnessChromaPlot({ samples: [{ label: "invented A", lab: { L: 50, a: 20, b: 10 } }, { label: "invented B", lab: { L: 70, a: 5, b: 40 } }] })
 */
export function lightnessChromaPlot(options: LabPlotOptions): PlotFigure {
  checkLabPlotOptions("lightnessChromaPlot", options);
  return withoutMethodNotes(() => drawLightnessChromaPlot(options));
}

function drawLightnessChromaPlot(options: LabPlotOptions): PlotFigure {
  const { traces, vectors, all } = labTraces(options, "LC");
  if (options.extent !== undefined && !(options.extent > 0))
    throw new Error(`lightnessChromaPlot: extent ${options.extent} must be a positive number`);
  const cMax = options.extent ?? Math.max(10, ...all.map((p) => p[0])) * 1.1;
  const step = niceStep(cMax);
  const layout = houseLayout({
    title: options.title ?? "CIELAB lightness against chroma",
    height: options.height ?? FIGURE_HEIGHTS.chart,
    xaxis: houseAxis("Chroma C*ab", { range: [0, Math.ceil(cMax / step) * step], dtick: step }),
    yaxis: houseAxis("Lightness L*", { range: [0, 100], dtick: 10 }),
    legend: "below",
  });
  const cTop = Math.ceil(cMax / step) * step;
  layout.annotations = arrowheads(vectors, cTop, 100, 620, 290);
  return plotFigure(
    traces,
    layout,
    houseConfig(options.title ?? "cielab-lightness-chroma"),
    captionFor(options, "LC"),
  );
}

/** The argument check both CIELAB plots share: known option names, and samples or pairs to draw. */
function checkLabPlotOptions(fn: string, options: LabPlotOptions): void {
  checkOptions(fn, "options", options, [
    "samples",
    "pairs",
    "title",
    "caption",
    "extent",
    "labels",
    "height",
  ]);
  checkWith(
    fn,
    "options",
    options,
    "options with samples [{ label, lab }] or pairs [{ label, reference, sample }]",
    (o) =>
      typeof o === "object" &&
      o !== null &&
      (Array.isArray((o as { samples?: unknown }).samples) ||
        Array.isArray((o as { pairs?: unknown }).pairs)),
  );
}
