/**
 * Figures of display measurement: grey-scale tracking (Δu′v′ and CCT per level), the EOTF on logarithmic axes with
 * tick labels written as plain numbers or powers of ten (never SI prefixes such as "100μ"), and a map of a
 * uniformity grid. Legends sit below the plot area, off the data. Plain Plotly figure records.
 */
import { plotFigure, roundForDisplay, type PlotFigure, type PlotTrace } from "./figure.ts";
import {
  FIGURE_HEIGHTS,
  INK,
  SERIES_COLOURS,
  houseAxis,
  houseConfig,
  houseLayout,
  seriesLook,
} from "./style.ts";
import { escapeHover } from "./chromaticity-overlays.ts";
import { withoutMethodNotes } from "../methods/method-log.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkChoice, checkString } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";
import { pqDecode } from "../rgb/transfer-functions.ts";
import type { GreyscaleTracking } from "../display/greyscale-tracking.ts";
import type { EotfFit, ToneReading } from "../display/eotf-fit.ts";
import type { Uniformity } from "../display/uniformity.ts";
import { cctAndDuv } from "../temperature/cct.ts";

const SUPERSCRIPT: Record<string, string> = {
  "-": "⁻",
  "0": "⁰",
  "1": "¹",
  "2": "²",
  "3": "³",
  "4": "⁴",
  "5": "⁵",
  "6": "⁶",
  "7": "⁷",
  "8": "⁸",
  "9": "⁹",
};

/**
 * Tick values and labels for a logarithmic axis: one tick per decade from min to max, labelled as plain numbers
 * ("0.001", "1", "1000") from 10⁻³ to 10⁴ and as powers of ten ("10⁻⁵") beyond; Plotly's own labels would use SI
 * prefixes ("100μ").
 *
 * @param min The smallest value shown, above 0.
 * @param max The largest value shown, above min.
 * @returns { tickvals, ticktext } for a Plotly axis of type "log" (tick values in data units).
 * @source none: a tristim helper (plain numbers and powers of ten as in ISO 80000-1 §7), no published formula.
 * @example decadeTicks(0.0005, 1200)
 */
export function decadeTicks(min: number, max: number): { tickvals: number[]; ticktext: string[] } {
  checkNumber("decadeTicks", "min", min, { above: 0 });
  checkNumber("decadeTicks", "max", max, { above: min });
  const lo = Math.floor(Math.log10(min) + 1e-9),
    hi = Math.ceil(Math.log10(max) - 1e-9);
  const tickvals: number[] = [],
    ticktext: string[] = [];
  for (let e = lo; e <= hi; e++) {
    tickvals.push(Number(`1e${e}`));
    ticktext.push(
      e >= -3 && e <= 4
        ? e < 0
          ? `0.${"0".repeat(-e - 1)}1`
          : `1${"0".repeat(e)}`
        : `10${String(e)
            .split("")
            .map((c) => SUPERSCRIPT[c])
            .join("")}`,
    );
  }
  return { tickvals, ticktext };
}

function logAxis(title: string, min: number, max: number): Record<string, unknown> {
  const { tickvals, ticktext } = decadeTicks(min, max);
  return houseAxis(title, {
    type: "log",
    range: [Math.log10(min), Math.log10(max)],
    tickmode: "array",
    tickvals,
    ticktext,
    exponentformat: "power",
    minor: { ticks: "inside", ticklen: 3, tickcolor: INK.frame, showgrid: false, dtick: "D1" },
  });
}

const isRecord = (v: unknown) => typeof v === "object" && v !== null && !Array.isArray(v);

/** Options of `greyscaleTrackingPlot`. */
export interface GreyscaleTrackingPlotOptions {
  /** A QA limit on Δu′v′, drawn as a dashed line; default none. */
  limit?: number;
  /** The figure's title; default "Grey-scale tracking". */
  title?: string;
  /** The caption; default one that says what is plotted. */
  caption?: string;
}

/**
 * Grey-scale tracking: Δu′v′ from the target white (upper panel, with an optional limit line) and CCT (lower panel, with the target's CCT) against the signal level in %.
 *
 * @param tracking A result of `greyscaleTracking`.
 * @param options Limit, title and caption (see `GreyscaleTrackingPlotOptions`); default none of them.
 * @returns A figure record for `showFigure`.
 * @source none: a tristim figure of CIE 015:2018 quantities (u′v′, CCT).
 * @example greyscaleTrackingPlot(greyscaleTracking([0.25, 0.5, 1].map((s) => ({ signal: s, xyz: { X: 95 * s ** 2.2, Y: 100 * s ** 2.2, Z: 110 * s ** 2.2 } }))), { limit: 0.004 })
 */
export function greyscaleTrackingPlot(
  tracking: GreyscaleTracking,
  options: GreyscaleTrackingPlotOptions = {},
): PlotFigure {
  checkWith(
    "greyscaleTrackingPlot",
    "tracking",
    tracking,
    "a result of greyscaleTracking",
    (v) =>
      isRecord(v) &&
      Array.isArray((v as GreyscaleTracking).levels) &&
      isRecord((v as GreyscaleTracking).target),
  );
  checkOptions("greyscaleTrackingPlot", "options", options, ["limit", "title", "caption"]);
  checkNumber("greyscaleTrackingPlot", "options.limit", options.limit, { above: 0, optional: true });
  checkString("greyscaleTrackingPlot", "options.title", options.title, { optional: true });
  checkString("greyscaleTrackingPlot", "options.caption", options.caption, { optional: true });
  return withoutMethodNotes(() => {
    const levels = tracking.levels;
    const x = levels.map((l) => roundForDisplay(100 * l.signal, 3));
    const targetCct = cctAndDuv(tracking.target).cct;
    const blue = seriesLook(0),
      orange = seriesLook(1);
    const data: PlotTrace[] = [
      {
        type: "scatter",
        mode: "lines+markers",
        name: "Δu′v′ from the target white",
        x,
        xaxis: "x2",
        yaxis: "y",
        y: levels.map((l) => roundForDisplay(l.deltaUv, 6)),
        line: { color: blue.color, width: 1.6 },
        marker: { symbol: blue.symbol, size: 7, color: blue.color },
        hovertemplate: "level %{x} %<br>Δu′v′ = %{y:.4f}<extra></extra>",
      },
      {
        type: "scatter",
        mode: "lines+markers",
        name: "CCT",
        x,
        y: levels.map((l) => Math.round(l.cct)),
        xaxis: "x",
        yaxis: "y2",
        line: { color: orange.color, width: 1.6, dash: orange.dash },
        marker: { symbol: orange.symbol, size: 7, color: orange.color },
        hovertemplate: "level %{x} %<br>CCT = %{y} K<extra></extra>",
      },
      {
        type: "scatter",
        mode: "lines",
        name: `target white, ${Math.round(targetCct)} K`,
        x: [0, 100],
        y: [Math.round(targetCct), Math.round(targetCct)],
        yaxis: "y2",
        line: { color: INK.faint, width: 1, dash: "dot" },
        hoverinfo: "skip",
      },
    ];
    if (options.limit !== undefined)
      data.push({
        type: "scatter",
        mode: "lines",
        name: `QA limit Δu′v′ ≤ ${options.limit}`,
        x: [0, 100],
        xaxis: "x2",
        yaxis: "y",
        y: [options.limit, options.limit],
        line: { color: INK.frame, width: 1.2, dash: "dash" },
        hoverinfo: "skip",
      });
    const maxUv = Math.max(options.limit ?? 0, ...levels.map((l) => l.deltaUv));
    const layout = houseLayout({
      title: options.title ?? "Grey-scale tracking",
      subtitle: `target white x ${tracking.target.x.toFixed(4)}, y ${tracking.target.y.toFixed(4)}${tracking.blackSubtracted ? "; black level subtracted" : ""}`,
      height: FIGURE_HEIGHTS.square,
      xaxis: houseAxis("Signal level (%)", { range: [0, 102], anchor: "y2" }),
      yaxis: houseAxis("Δu′v′", {
        domain: [0.56, 1],
        range: [0, maxUv * 1.15 || 0.001],
        rangemode: "tozero",
        anchor: "x2",
      }),
      legend: "below",
    });
    layout.yaxis2 = houseAxis("CCT (K)", { domain: [0, 0.44], anchor: "x" });
    // The upper panel's own x axis: the same scale as the lower one, its labels left to the lower panel.
    layout.xaxis2 = houseAxis("", { matches: "x", anchor: "y", showticklabels: false });
    const caption =
      options.caption ??
      `Grey-scale tracking: the chromaticity difference Δu′v′ (CIE 1976 UCS) of each level from the target white, and each level's CCT (CIE 1960 UCS, Ohno 2014), against the signal level.`;
    return plotFigure(data, layout, houseConfig("greyscale-tracking"), caption);
  });
}

/** One measured ramp for `eotfPlot`. */
export interface EotfSeries {
  /** The legend label, e.g. "red" or "grey (measured)". */
  readonly label: string;
  readonly readings: readonly ToneReading[];
  /** A fit of these readings, drawn as a line; default none. */
  readonly fit?: EotfFit;
}

/** Options of `eotfPlot`. */
export interface EotfPlotOptions {
  /** A reference curve: "PQ" (SMPTE ST 2084, in cd/m²) or none; default none. */
  reference?: "PQ";
  /** The display's peak luminance in cd/m², where the PQ reference is clipped; default none. */
  peakLuminance?: number;
  /** The signal axis: "log" or "linear"; default "log". */
  signalAxis?: "log" | "linear";
  /** The figure's title; default "Tone response (EOTF)". */
  title?: string;
  /** The caption; default one that says what is plotted. */
  caption?: string;
}

/**
 * The EOTF on logarithmic axes: measured luminance against signal per series, with fitted curves and an optional PQ reference; tick labels are plain numbers or powers of ten.
 *
 * @param series The ramps [{ label, readings [{ signal, luminance }], fit? }]; readings at signal 0 or luminance 0 are left out of log axes.
 * @param options Reference, peak, signal axis, title and caption (see `EotfPlotOptions`); default log axes, no reference.
 * @returns A figure record for `showFigure`.
 * @source none: a tristim figure; the PQ reference is SMPTE ST 2084:2014 eq. 5.1.
 * @example eotfPlot([{ label: "grey", readings: [0.1, 0.25, 0.5, 1].map((s) => ({ signal: s, luminance: 200 * s ** 2.2 })) }])
 */
export function eotfPlot(series: readonly EotfSeries[], options: EotfPlotOptions = {}): PlotFigure {
  checkWith(
    "eotfPlot",
    "series",
    series,
    "ramps [{ label, readings [{ signal, luminance }], fit? }]",
    (v) =>
      Array.isArray(v) &&
      v.length > 0 &&
      v.every(
        (s) =>
          isRecord(s) &&
          typeof (s as EotfSeries).label === "string" &&
          Array.isArray((s as EotfSeries).readings) &&
          (s as EotfSeries).readings.every(
            (r) => isRecord(r) && Number.isFinite(r.signal) && Number.isFinite(r.luminance),
          ),
      ),
  );
  checkOptions("eotfPlot", "options", options, [
    "reference",
    "peakLuminance",
    "signalAxis",
    "title",
    "caption",
  ]);
  checkChoice("eotfPlot", "options.reference", options.reference, ["PQ"], { optional: true });
  checkNumber("eotfPlot", "options.peakLuminance", options.peakLuminance, {
    unit: "cd/m²",
    above: 0,
    optional: true,
  });
  checkChoice("eotfPlot", "options.signalAxis", options.signalAxis, ["log", "linear"], { optional: true });
  checkString("eotfPlot", "options.title", options.title, { optional: true });
  checkString("eotfPlot", "options.caption", options.caption, { optional: true });
  return withoutMethodNotes(() => {
    const logX = (options.signalAxis ?? "log") === "log";
    const shown = (r: ToneReading) => r.luminance > 0 && (!logX || r.signal > 0);
    const points = series.flatMap((s) => s.readings.filter(shown));
    checkWith(
      "eotfPlot",
      "series",
      series,
      "at least one reading above 0 to plot on log axes",
      () => points.length > 0,
    );
    const xs = points.map((r) => r.signal);
    let lMin = Math.min(...points.map((r) => r.luminance)),
      lMax = Math.max(...points.map((r) => r.luminance));
    const xMin = logX ? Math.min(...xs) : 0;
    const data: PlotTrace[] = [];
    const curveX = (n: number) =>
      Array.from({ length: n + 1 }, (_, i) => (logX ? xMin * (1 / xMin) ** (i / n) : i / n));
    if (options.reference === "PQ") {
      const cx = curveX(120);
      const cy = cx.map((v) => Math.min(pqDecode(v), options.peakLuminance ?? Infinity));
      lMin = Math.min(lMin, ...cy.filter((v) => v > 0));
      lMax = Math.max(lMax, ...cy);
      data.push({
        type: "scatter",
        mode: "lines",
        name: options.peakLuminance ? `PQ target (clipped at ${options.peakLuminance} cd/m²)` : "PQ target",
        x: cx.map((v) => roundForDisplay(v, 6)),
        y: cy.map((v) => roundForDisplay(v, 6)),
        line: { color: INK.faint, width: 2.2 },
        hoverinfo: "skip",
      });
    }
    series.forEach((s, i) => {
      const look = seriesLook(i);
      const r = s.readings.filter(shown);
      if (r.length > 0)
        data.push({
          type: "scatter",
          mode: "markers",
          name: `${s.label} (measured)`,
          x: r.map((p) => p.signal),
          y: r.map((p) => p.luminance),
          marker: {
            symbol: look.symbol,
            size: 7,
            color: look.color,
            line: { width: 1.2, color: look.color },
          },
          hovertemplate: `${escapeHover(s.label)}<br>V = %{x:.4f}<br>L = %{y:.4~g} cd/m²<extra></extra>`,
        });
      if (s.fit) {
        const f = s.fit;
        const cx = curveX(100);
        data.push({
          type: "scatter",
          mode: "lines",
          name: `${s.label}: ${f.model === "power" ? "power law" : "BT.1886 form"}, γ = ${f.gamma.toFixed(2)}`,
          x: cx.map((v) => roundForDisplay(v, 6)),
          y: cx.map((v) => roundForDisplay(f.a * Math.max(v + f.b, 0) ** f.gamma + f.offset, 6)),
          line: { color: look.color, width: 1.3, dash: look.dash === "solid" ? "dash" : look.dash },
          hoverinfo: "skip",
        });
      }
    });
    const layout = houseLayout({
      title: options.title ?? "Tone response (EOTF)",
      xaxis: logX
        ? logAxis("Signal V (fraction of full scale)", xMin / 1.3, 1.15)
        : houseAxis("Signal V (fraction of full scale)", { range: [0, 1.02] }),
      yaxis: logAxis("Luminance L (cd/m²)", lMin / 1.6, lMax * 1.6),
      legend: "below",
    });
    const caption =
      options.caption ??
      `Measured luminance against signal on ${logX ? "logarithmic axes" : "a logarithmic luminance axis"}${series.some((s) => s.fit) ? ", with the fitted EOTFs" : ""}${options.reference === "PQ" ? " and the PQ target of SMPTE ST 2084" : ""}.`;
    return plotFigure(data, layout, houseConfig("eotf"), caption);
  });
}

/** Options of `uniformityMap`. */
export interface UniformityMapOptions {
  /** The quantity coloured: "luminance" (% of the reference) or "deltaUv" (Δu′v′ from the reference); default "luminance". */
  show?: "luminance" | "deltaUv";
  /** The figure's title; default "Uniformity". */
  title?: string;
  /** The caption; default one that says what is plotted. */
  caption?: string;
}

/**
 * A map of a uniformity grid: each point a cell, shaded by its luminance relative to the reference (or its Δu′v′), with both values written in the cell.
 *
 * @param uniformity A result of `displayUniformity`.
 * @param options What is shaded, title and caption (see `UniformityMapOptions`); default luminance.
 * @returns A figure record for `showFigure`.
 * @source none: a tristim figure of the ICDM IDMS 1.03 uniformity quantities.
 * @example uniformityMap(displayUniformity([[{ X: 95, Y: 100, Z: 108 }, { X: 90, Y: 95, Z: 104 }, { X: 93, Y: 98, Z: 106 }]]))
 */
export function uniformityMap(uniformity: Uniformity, options: UniformityMapOptions = {}): PlotFigure {
  checkWith(
    "uniformityMap",
    "uniformity",
    uniformity,
    "a result of displayUniformity",
    (v) =>
      isRecord(v) &&
      Array.isArray((v as Uniformity).points) &&
      Number.isInteger((v as Uniformity).rows) &&
      Number.isInteger((v as Uniformity).columns),
  );
  checkOptions("uniformityMap", "options", options, ["show", "title", "caption"]);
  checkChoice("uniformityMap", "options.show", options.show, ["luminance", "deltaUv"], { optional: true });
  checkString("uniformityMap", "options.title", options.title, { optional: true });
  checkString("uniformityMap", "options.caption", options.caption, { optional: true });
  return withoutMethodNotes(() => {
    const u = uniformity;
    const show = options.show ?? "luminance";
    const grid = <T>(f: (p: Uniformity["points"][number]) => T): T[][] =>
      Array.from({ length: u.rows }, (_, i) =>
        Array.from({ length: u.columns }, (_, j) => f(u.points.find((p) => p.row === i && p.column === j)!)),
      );
    const z = grid((p) =>
      show === "luminance" ? roundForDisplay(100 * p.relativeLuminance, 2) : roundForDisplay(p.deltaUv, 5),
    );
    const text = grid((p) => `${(100 * p.relativeLuminance).toFixed(1)} %<br>Δu′v′ ${p.deltaUv.toFixed(4)}`);
    const cols = Array.from({ length: u.columns }, (_, j) => j + 1),
      rows = Array.from({ length: u.rows }, (_, i) => i + 1);
    const data: PlotTrace[] = [
      {
        type: "heatmap",
        x: cols,
        y: rows,
        z,
        text,
        texttemplate: "%{text}",
        textfont: { size: 11, color: INK.text },
        colorscale: [
          [0, "#f4efe4"],
          [1, SERIES_COLOURS[7]!],
        ],
        reversescale: show === "luminance",
        xgap: 2,
        ygap: 2,
        colorbar: {
          title: { text: show === "luminance" ? "L ÷ L<sub>ref</sub> (%)" : "Δu′v′", side: "right" },
          thickness: 12,
          outlinewidth: 0,
        },
        hovertemplate: "row %{y}, column %{x}<br>%{text}<extra></extra>",
        showscale: true,
      },
    ];
    const layout = houseLayout({
      title: options.title ?? "Uniformity",
      subtitle: `${u.rows} × ${u.columns} points; reference: ${u.reference === "centre" ? "centre point" : "mean of all points"}; non-uniformity ${(100 * u.nonUniformity).toFixed(1)} %, largest Δu′v′ ${u.maxDeltaUv.toFixed(4)}`,
      height: FIGURE_HEIGHTS.square,
      xaxis: houseAxis("Column (left to right)", { tickvals: cols, showgrid: false, constrain: "domain" }),
      yaxis: houseAxis("Row (top to bottom)", {
        tickvals: rows,
        autorange: "reversed",
        showgrid: false,
        scaleanchor: "x",
      }),
      legend: "none",
    });
    const caption =
      options.caption ??
      `Uniformity over a ${u.rows} × ${u.columns} grid as seen from the front: each cell gives the luminance as % of the ${u.reference === "centre" ? "centre" : "mean"} and the Δu′v′ from its chromaticity; the shading shows ${show === "luminance" ? "the luminance (darker: dimmer)" : "Δu′v′ (darker: larger)"}.`;
    return plotFigure(data, layout, houseConfig("uniformity"), caption);
  });
}
