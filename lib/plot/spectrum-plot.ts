/**
 * Spectra against wavelength: one or many on one axis, the quantity and unit on the axis, a visible-spectrum colour
 * band under the wavelength axis, filled areas, tolerance envelopes, marks at chosen wavelengths, and a linear or
 * logarithmic value scale. Returns a plain Plotly figure record.
 */
import { isSpectrum, type SpectralQuantity, type Spectrum } from "../spectrum/spectrum.ts";
import { plotFigure, roundForDisplay, type PlotFigure, type PlotTrace } from "./figure.ts";
import {
  FIGURE_HEIGHTS,
  FONT_FAMILY,
  INK,
  MARGINS,
  houseAxis,
  houseConfig,
  houseLayout,
  seriesLook,
} from "./style.ts";
import { spectrumBandImage } from "./spectrum-band.ts";
import { escapeHover } from "./chromaticity-overlays.ts";
import { withoutMethodNotes } from "../methods/method-log.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkWith } from "../arguments/check-with.ts";

/** One curve: a spectrum with an optional legend label, fill under it, or a fixed colour. */
export interface SpectrumSeries {
  readonly spectrum: Spectrum;
  readonly label?: string;
  /** Fill the area between the curve and zero. */
  readonly fill?: boolean;
}

/** A vertical mark at a wavelength (a laser line, a peak, a filter edge). */
export interface WavelengthMark {
  readonly wavelength: number;
  readonly label?: string;
}

/** A shaded band between two spectra on the same quantity (tolerance limits, min/max of a lot). */
export interface SpectrumEnvelope {
  readonly lower: Spectrum;
  readonly upper: Spectrum;
  readonly label?: string;
}

export interface SpectrumPlotOptions {
  /** Title; default the one series' label or name, else the axis quantity. */
  title?: string;
  /** Your caption, default none; the figure adds what the axes show and that the colour band is approximate. */
  caption?: string;
  /** The axis quantity, e.g. "Spectral irradiance"; default from the spectra (they must then agree). */
  quantity?: string;
  /** The unit; default the spectra's unit. */
  unit?: string;
  /** Show transmittance and reflectance in percent (default true); values are stored as fractions. */
  percent?: boolean;
  /** "linear" (default) or "log" value axis (e.g. optical density or transmittance over decades). */
  scale?: "linear" | "log";
  /** Wavelength range (nm); default the spectra's range. */
  wavelengthRange?: readonly [number, number];
  /** Value range in axis units (for a log axis give the values, not their logarithms); default from the data. */
  valueRange?: readonly [number, number];
  /** Visible-spectrum colour band under the wavelength axis (default on). */
  band?: boolean;
  /** Vertical marks { wavelength (nm), label? } (laser lines, peaks, edges); default none. */
  marks?: readonly WavelengthMark[];
  /** Shaded bands { lower, upper, label? } between two spectra (tolerance limits, min/max); default none. */
  envelopes?: readonly SpectrumEnvelope[];
  /** Fill under every curve (each series can also ask for it); default false. */
  fill?: boolean;
  /** Height in CSS px; default `FIGURE_HEIGHTS.chart` (420). */
  height?: number;
}

const AXIS_WORDS: Record<SpectralQuantity, string> = {
  "relative power": "Relative spectral power",
  radiance: "Spectral radiance",
  irradiance: "Spectral irradiance",
  "radiant flux": "Spectral radiant flux",
  transmittance: "Transmittance",
  reflectance: "Reflectance",
  absorbance: "Absorbance",
  "optical density": "Optical density",
  "colour matching": "Colour-matching function",
  "luminous efficiency": "Luminous efficiency",
  other: "Value",
};

const BAND_PX = 9;

function asSeries(input: Spectrum | SpectrumSeries, i: number): SpectrumSeries {
  if (isSpectrum(input)) return { spectrum: input };
  if (input && typeof input === "object" && isSpectrum((input as SpectrumSeries).spectrum))
    return input as SpectrumSeries;
  throw new Error(
    `spectrumPlot: item ${i + 1} is neither a spectrum nor { spectrum, label? } (got ${JSON.stringify(input)?.slice(0, 80)})`,
  );
}

function isFraction(q: SpectralQuantity): boolean {
  return q === "transmittance" || q === "reflectance";
}

/** Linear interpolation of a spectrum's values at a wavelength (display readout only), or undefined outside it. */
function valueAt(s: Spectrum, w: number): number | undefined {
  const ws = s.wavelengths;
  if (w < ws[0]! || w > ws.at(-1)!) return undefined;
  let i = 0;
  while (i < ws.length - 2 && ws[i + 1]! < w) i++;
  const t = (w - ws[i]!) / (ws[i + 1]! - ws[i]! || 1);
  return s.values[i]! + t * (s.values[i + 1]! - s.values[i]!);
}

/**
 * A plot of spectra against wavelength in the house style, with the quantity and unit on the value axis (drawing notes nothing in the Methods log).
 *
 * @param spectra A spectrum, a series { spectrum, label?, fill? }, or a list of them (same quantity unless `quantity` is given).
 * @returns A `PlotFigure`.
 * @source none: the tristim house style (the colour band under the axis is approximate).
 * @example spectrumPlot([illuminant("A"), illuminant("D65")], { wavelengthRange: [380, 780], marks: [{ wavelength: 560, label: "560 nm" }] })
 */
export function spectrumPlot(
  spectra: Spectrum | SpectrumSeries | readonly (Spectrum | SpectrumSeries)[],
  options: SpectrumPlotOptions = {},
): PlotFigure {
  checkWith(
    "spectrumPlot",
    "spectra",
    spectra,
    "a spectrum, a series { spectrum, label? }, or an array of them",
    (v) => {
      const one = (x: unknown) =>
        isWellFormedSpectrum(x) ||
        (typeof x === "object" && x !== null && isWellFormedSpectrum((x as { spectrum?: unknown }).spectrum));
      return one(v) || (Array.isArray(v) && v.length > 0 && v.every(one));
    },
  );
  checkOptions("spectrumPlot", "options", options, [
    "title",
    "caption",
    "quantity",
    "unit",
    "percent",
    "scale",
    "wavelengthRange",
    "valueRange",
    "band",
    "marks",
    "envelopes",
    "fill",
    "height",
  ]);
  return withoutMethodNotes(() => drawSpectrumPlot(spectra, options));
}

function drawSpectrumPlot(
  spectra: Spectrum | SpectrumSeries | readonly (Spectrum | SpectrumSeries)[],
  options: SpectrumPlotOptions,
): PlotFigure {
  const list = (Array.isArray(spectra) ? spectra : [spectra]).map(asSeries);
  if (list.length === 0) throw new Error("spectrumPlot: no spectra given");
  const quantities = [...new Set(list.map((s) => s.spectrum.quantity))];
  if (quantities.length > 1 && !options.quantity) {
    throw new Error(
      `spectrumPlot: the spectra measure different quantities (${quantities.join(", ")}); plot them separately or name the axis with { quantity }`,
    );
  }
  const quantity = quantities[0]!;
  const units = [...new Set(list.map((s) => s.spectrum.unit))];
  if (units.length > 1 && options.unit === undefined) {
    throw new Error(
      `spectrumPlot: the spectra have different units (${units.map((u) => u || "none").join(", ")}); convert them or give { unit }`,
    );
  }
  const percent = isFraction(quantity) && quantities.length === 1 && (options.percent ?? true);
  const factor = percent ? 100 : 1;
  const unit = options.unit ?? (percent ? "%" : units[0]!);
  const axisQuantity = options.quantity ?? AXIS_WORDS[quantity];
  const yTitle = unit ? `${axisQuantity} (${unit})` : axisQuantity;
  const scale = options.scale ?? "linear";
  if (scale !== "linear" && scale !== "log")
    throw new Error(`spectrumPlot: scale "${scale}" must be "linear" or "log"`);

  const wMin = Math.min(...list.map((s) => s.spectrum.wavelengths[0]!));
  const wMax = Math.max(...list.map((s) => s.spectrum.wavelengths.at(-1)!));
  const xRange = options.wavelengthRange ?? [wMin, wMax];
  if (!(xRange[1] > xRange[0]) || !xRange.every(Number.isFinite))
    throw new Error(
      `spectrumPlot: wavelength range ${JSON.stringify(xRange)} must be two increasing numbers (nm)`,
    );

  const data: PlotTrace[] = [];
  (options.envelopes ?? []).forEach((e, i) => {
    if (!isSpectrum(e.lower) || !isSpectrum(e.upper))
      throw new Error(`spectrumPlot: envelope ${i + 1} needs lower and upper spectra`);
    const name = e.label ?? `Envelope ${i + 1}`;
    data.push(
      {
        type: "scatter",
        mode: "lines",
        x: [...e.lower.wavelengths],
        y: e.lower.values.map((v) => roundForDisplay(v * factor, 6)),
        line: { width: 0.6, color: INK.faint },
        name: escapeHover(name),
        legendgroup: `env${i}`,
        showlegend: false,
        hoverinfo: "skip",
      },
      {
        type: "scatter",
        mode: "lines",
        x: [...e.upper.wavelengths],
        y: e.upper.values.map((v) => roundForDisplay(v * factor, 6)),
        line: { width: 0.6, color: INK.faint },
        fill: "tonexty",
        fillcolor: "rgba(90,90,90,0.16)",
        name: escapeHover(name),
        legendgroup: `env${i}`,
        hoverinfo: "skip",
      },
    );
  });

  list.forEach((s, i) => {
    const look = seriesLook(i);
    const name = s.label ?? s.spectrum.name;
    const fill = s.fill ?? options.fill ?? false;
    const n = s.spectrum.wavelengths.length;
    // Markers only where the samples are sparse enough to see them; the dash carries the series in grey print.
    const markerStep = Math.max(1, Math.round(n / 16));
    data.push({
      type: "scatter",
      mode: n <= 120 ? "lines+markers" : "lines",
      name: escapeHover(name),
      x: [...s.spectrum.wavelengths],
      y: s.spectrum.values.map((v) => roundForDisplay(v * factor, 6)),
      line: { color: look.color, width: 1.8, dash: look.dash },
      marker: { symbol: look.symbol, size: 6, color: look.color, maxdisplayed: Math.ceil(n / markerStep) },
      ...(fill ? { fill: "tozeroy", fillcolor: hexWithAlpha(look.color, 0.14) } : {}),
      hovertemplate: `%{y:.4~g}${unit ? " " + escapeHover(unit) : ""}<extra>${escapeHover(name)}</extra>`,
    });
  });

  const marks = options.marks ?? [];
  const shapes: Record<string, unknown>[] = [];
  const annotations: Record<string, unknown>[] = [];
  if (marks.length > 0) {
    const mx: number[] = [],
      my: number[] = [],
      mt: string[] = [];
    for (const m of marks) {
      if (!Number.isFinite(m.wavelength) || m.wavelength < xRange[0] || m.wavelength > xRange[1]) {
        throw new Error(
          `spectrumPlot: mark at ${m.wavelength} nm is outside the plotted ${xRange[0]}–${xRange[1]} nm`,
        );
      }
      shapes.push({
        type: "line",
        xref: "x",
        yref: "paper",
        x0: m.wavelength,
        x1: m.wavelength,
        y0: 0,
        y1: 1,
        line: { color: INK.frame, width: 1, dash: "dot" },
        layer: "below",
      });
      annotations.push({
        x: m.wavelength,
        xref: "x",
        y: 1,
        yref: "paper",
        yanchor: "bottom",
        text: escapeHover(m.label ?? `${m.wavelength} nm`),
        showarrow: false,
        font: { family: FONT_FAMILY, size: 10, color: INK.text },
        textangle: 0,
      });
      for (const s of list) {
        const v = valueAt(s.spectrum, m.wavelength);
        if (v === undefined) continue;
        mx.push(m.wavelength);
        my.push(roundForDisplay(v * factor, 6));
        mt.push(escapeHover(s.label ?? s.spectrum.name));
      }
    }
    data.push({
      type: "scatter",
      mode: "markers",
      name: "Marked wavelengths",
      x: mx,
      y: my,
      text: mt,
      marker: { symbol: "circle-open", size: 10, color: INK.text, line: { width: 1.4 } },
      hovertemplate: `%{text}<br>λ = %{x} nm: %{y:.4~g}${unit ? " " + escapeHover(unit) : ""}<extra></extra>`,
      showlegend: false,
    });
  }

  const height = options.height ?? FIGURE_HEIGHTS.chart;
  const band = options.band ?? true;
  const images: Record<string, unknown>[] = [];
  const plotHeightPx = height - MARGINS.t - MARGINS.b;
  if (band) {
    const img = spectrumBandImage(xRange[0], xRange[1], 1);
    images.push({
      source: img.source,
      xref: "paper",
      yref: "paper",
      x: 0,
      y: 0,
      sizex: 1,
      sizey: BAND_PX / plotHeightPx,
      xanchor: "left",
      yanchor: "top",
      sizing: "stretch",
      layer: "above",
    });
  }

  const layout = houseLayout({
    title:
      options.title ?? (list.length === 1 ? (list[0]!.label ?? list[0]!.spectrum.name) : `${axisQuantity}`),
    height,
    xaxis: houseAxis("Wavelength λ (nm)", {
      range: [...xRange],
      ticks: "inside",
      ...(band ? { ticklabelstandoff: BAND_PX + 3 } : {}),
    }),
    yaxis: houseAxis(yTitle, {
      type: scale,
      ...(options.valueRange
        ? { range: scale === "log" ? options.valueRange.map((v) => Math.log10(v)) : [...options.valueRange] }
        : {}),
      ...(scale === "log"
        ? {
            dtick: 1,
            minor: { ticks: "inside", ticklen: 3, tickcolor: INK.frame, showgrid: false, dtick: "D2" },
          }
        : {}),
      rangemode: scale === "linear" && !options.valueRange ? "tozero" : undefined,
      exponentformat: "power",
    }),
    legend: list.length + (options.envelopes?.length ?? 0) > 1 ? "below" : "none",
  });
  layout.hovermode = "x unified";
  layout.images = images;
  layout.shapes = shapes;
  layout.annotations = annotations;
  if (marks.length > 0) (layout.margin as Record<string, number>).t = MARGINS.t + 14;

  const parts = [`${yTitle} against wavelength (nm)${scale === "log" ? " on a logarithmic value axis" : ""}`];
  if (band)
    parts.push(
      "the colour band under the wavelength axis shows approximate spectral colours (sRGB, for orientation only)",
    );
  if ((options.envelopes ?? []).length > 0)
    parts.push("shaded: the band between the lower and upper spectra");
  const auto = parts.join("; ") + ".";
  const caption = options.caption
    ? `${options.caption.trim()} ${auto[0]!.toUpperCase()}${auto.slice(1)}`
    : auto[0]!.toUpperCase() + auto.slice(1);
  return plotFigure(
    data,
    layout,
    houseConfig(String(layout.title && (layout.title as { text: string }).text)),
    caption,
  );
}

/** rgba() text of a #rrggbb colour with an alpha. */
export function hexWithAlpha(hex: string, alpha: number): string {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!m) throw new Error(`colour ${hex} is not #rrggbb`);
  return `rgba(${parseInt(m[1]!, 16)},${parseInt(m[2]!, 16)},${parseInt(m[3]!, 16)},${alpha})`;
}
