/**
 * The tristim house style for figures: one place for fonts, frame, grid, series colours, dash patterns, marker
 * shapes, margins and sizes. Designed for a printed lab report first: a closed frame with inward ticks, a quiet dotted
 * grid, dark ink-like series colours that stay distinct in grey, and a dash pattern plus a marker shape per series so
 * that a black-and-white copy still tells the series apart. (Our own design; common practice, no source.)
 */
import type { PlotConfig, PlotLayout } from "./figure.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkString } from "../arguments/check-text.ts";
import { checkWith } from "../arguments/check-with.ts";

/** Font stack: metric-compatible faces that Linux, macOS and Windows ship, so layout does not shift between them. */
export const FONT_FAMILY = '"Liberation Sans", Arial, Helvetica, "DejaVu Sans", sans-serif';
/** Monospaced stack for numeric readouts in hover boxes. */
export const NUMERIC_FONT_FAMILY = '"Liberation Mono", "DejaVu Sans Mono", Menlo, Consolas, monospace';

/** Ink colours. */
export const INK = {
  text: "#1c1c1c",
  frame: "#3a3a3a",
  grid: "#cfcfcf",
  faint: "#8a8a8a",
  paper: "#ffffff",
  highlight: "#fdf6e3",
} as const;

/** Series colours in the order series receive them: dark, well separated in hue and in lightness. */
export const SERIES_COLOURS: readonly string[] = [
  "#1f4e79", // ink blue
  "#b8481c", // burnt orange
  "#2e7d4f", // bottle green
  "#7a3b8f", // plum
  "#8c6d1f", // dark mustard
  "#3c3c3c", // graphite
  "#b03a6a", // raspberry
  "#2a8a9a", // slate teal
];

/** Dash patterns in series order (Plotly dash names or px lists), so black-and-white print stays legible. */
export const SERIES_DASHES: readonly string[] = [
  "solid",
  "dash",
  "dot",
  "dashdot",
  "longdash",
  "8px,3px,2px,3px,2px,3px",
  "longdashdot",
  "2px,4px",
];

/** Marker shapes in series order: filled and open shapes alternate. */
export const SERIES_MARKERS: readonly string[] = [
  "circle",
  "square-open",
  "diamond",
  "triangle-up-open",
  "cross-thin-open",
  "x-thin-open",
  "star-open",
  "triangle-down",
];

/**
 * The look of the i-th series in the house style: colour, dash and marker, cycling independently so pairs rarely repeat.
 *
 * @param i The series index, a whole number from 0.
 * @returns { color (CSS colour), dash (Plotly dash), symbol (Plotly marker) }.
 * @source none: the tristim house style.
 * @example seriesLook(3)
 */
export function seriesLook(i: number): { color: string; dash: string; symbol: string } {
  checkNumber("seriesLook", "i", i, { integer: true, min: 0, unit: "series index" });
  if (!Number.isInteger(i) || i < 0) throw new Error(`series index ${i} must be a whole number ≥ 0`);
  return {
    color: SERIES_COLOURS[i % SERIES_COLOURS.length]!,
    dash: SERIES_DASHES[i % SERIES_DASHES.length]!,
    symbol: SERIES_MARKERS[i % SERIES_MARKERS.length]!,
  };
}

/** Heights in CSS px (the width follows the report column); a 160 mm print column at 96 px/in is 605 px. */
export const FIGURE_HEIGHTS = {
  /** Line plots: spectra, L* against C*. */
  chart: 420,
  /** Square-ish plots with equal axis scales: chromaticity diagrams, the a*b* plane. */
  square: 600,
  /** Small multiples. */
  small: 300,
} as const;

/** Margins in px: room for axis titles on the left and bottom, the title on top. */
export const MARGINS = { l: 68, r: 24, t: 64, b: 60, pad: 0 } as const;

/**
 * A Plotly axis in the house style: closed frame, inward major and minor ticks, dotted grid, title with its unit.
 *
 * @param title The axis title with its unit, e.g. "Wavelength (nm)".
 * @param extra Further Plotly axis settings, overriding the house ones; default none ({}).
 * @returns A Plotly axis object.
 * @source none: the tristim house style.
 * @example houseAxis("Wavelength (nm)", { range: [380, 780] })
 */
export function houseAxis(title: string, extra: Record<string, unknown> = {}): Record<string, unknown> {
  checkString("houseAxis", "title", title, { what: "an axis title" });
  checkWith(
    "houseAxis",
    "extra",
    extra,
    "an object of extra axis settings",
    (e) => typeof e === "object" && e !== null && !Array.isArray(e),
    { optional: true },
  );
  return {
    title: { text: title, font: { size: 13, color: INK.text }, standoff: 8 },
    showline: true,
    linecolor: INK.frame,
    linewidth: 1,
    mirror: "ticks",
    ticks: "inside",
    ticklen: 6,
    tickwidth: 1,
    tickcolor: INK.frame,
    minor: { ticks: "inside", ticklen: 3, tickcolor: INK.frame, showgrid: false },
    showgrid: true,
    gridcolor: INK.grid,
    griddash: "dot",
    gridwidth: 1,
    zeroline: false,
    tickfont: { size: 11, color: INK.text },
    automargin: true,
    ...extra,
  };
}

export interface HouseLayoutOptions {
  /** The figure's title (required). */
  title: string;
  /** A second, smaller title line (observer, illuminant, conditions); default none. */
  subtitle?: string;
  /** Height in CSS px; default `FIGURE_HEIGHTS.chart` (420). */
  height?: number;
  /** The x axis, e.g. from `houseAxis` (required). */
  xaxis: Record<string, unknown>;
  /** The y axis, e.g. from `houseAxis` (required). */
  yaxis: Record<string, unknown>;
  /** Legend placement inside the frame, outside on the right, below, or "none"; default "inside top right". */
  legend?:
    | "inside top right"
    | "inside top left"
    | "inside bottom right"
    | "inside bottom left"
    | "right"
    | "below"
    | "none";
}

function legendAt(where: NonNullable<HouseLayoutOptions["legend"]>): Record<string, unknown> {
  const box = {
    bgcolor: "rgba(255,255,255,0.88)",
    bordercolor: INK.faint,
    borderwidth: 1,
    font: { size: 11, color: INK.text },
    tracegroupgap: 2,
    itemwidth: 36,
  };
  if (where === "right") return { ...box, x: 1.02, xanchor: "left", y: 1, yanchor: "top" };
  if (where === "below")
    return {
      ...box,
      orientation: "h",
      x: 0,
      xanchor: "left",
      y: 0,
      yanchor: "bottom",
      yref: "container",
      borderwidth: 0,
      bgcolor: "rgba(255,255,255,0)",
    };
  const top = where.includes("top"),
    right = where.includes("right");
  return {
    ...box,
    x: right ? 0.985 : 0.015,
    xanchor: right ? "right" : "left",
    y: top ? 0.985 : 0.015,
    yanchor: top ? "top" : "bottom",
  };
}

/**
 * The base Plotly layout every tristim figure starts from (title, fonts, margins, legend, hover style).
 *
 * @param o The title, axes and optional subtitle, height and legend placement.
 * @returns A Plotly layout object.
 * @source none: the tristim house style.
 * @example houseLayout({ title: "Invented spectra", xaxis: houseAxis("Wavelength (nm)"), yaxis: houseAxis("Reflectance (%)"), legend: "below" })
 */
export function houseLayout(o: HouseLayoutOptions): PlotLayout {
  checkWith(
    "houseLayout",
    "o",
    o,
    "layout options { title, xaxis, yaxis, subtitle?, height?, legend? }",
    (v) =>
      typeof v === "object" &&
      v !== null &&
      !Array.isArray(v) &&
      typeof (v as { title?: unknown }).title === "string" &&
      typeof (v as { xaxis?: unknown }).xaxis === "object" &&
      typeof (v as { yaxis?: unknown }).yaxis === "object",
  );
  const legend = o.legend ?? "inside top right";
  return {
    title: {
      text: o.title,
      x: 0,
      xref: "paper",
      xanchor: "left",
      y: 1,
      yref: "container",
      yanchor: "top",
      pad: { t: 14 },
      font: { family: FONT_FAMILY, size: 15, color: INK.text, weight: 600 },
      ...(o.subtitle ? { subtitle: { text: o.subtitle, font: { size: 12, color: "#4a4a4a" } } } : {}),
    },
    font: { family: FONT_FAMILY, size: 12, color: INK.text },
    paper_bgcolor: INK.paper,
    plot_bgcolor: INK.paper,
    height: o.height ?? FIGURE_HEIGHTS.chart,
    autosize: true,
    margin: legend === "below" ? { ...MARGINS, b: MARGINS.b + 34 } : { ...MARGINS },
    xaxis: o.xaxis,
    yaxis: o.yaxis,
    showlegend: legend !== "none",
    legend: legend === "none" ? undefined : legendAt(legend),
    hovermode: "closest",
    hoverlabel: {
      bgcolor: "#ffffff",
      bordercolor: INK.frame,
      font: { family: NUMERIC_FONT_FAMILY, size: 11, color: INK.text },
      align: "left",
    },
    colorway: [...SERIES_COLOURS],
  };
}

/**
 * Plotly configuration in the house style: no vendor logo, responsive width, PNG export at 3× the screen size.
 *
 * @param filename The PNG file name offered on export (characters outside A–Z, a–z, 0–9, ".", "_", "-" become "-").
 * @returns A Plotly config object.
 * @source none: the tristim house style.
 * @example houseConfig("invented-spectra")
 */
export function houseConfig(filename: string): PlotConfig {
  checkString("houseConfig", "filename", filename, { what: "a file name for the downloaded image" });
  return {
    displaylogo: false,
    responsive: true,
    scrollZoom: false,
    modeBarButtonsToRemove: ["select2d", "lasso2d", "autoScale2d", "toggleSpikelines"],
    toImageButtonOptions: {
      format: "png",
      filename: filename.replace(/[^A-Za-z0-9._-]+/g, "-").slice(0, 80) || "figure",
      scale: 3,
    },
  };
}
