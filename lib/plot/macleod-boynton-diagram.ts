/**
 * The MacLeod–Boynton chromaticity diagram of CIE 170-1:2006 §8: l_MB across, s_MB up, the spectrum locus of the
 * CIE 2006 cone fundamentals, and labelled points (from spectra or from cone excitations).
 */
import { withoutMethodNotes } from "../methods/method-log.ts";
import type { Spectrum } from "../spectrum/spectrum.ts";
import { isWellFormedSpectrum } from "../arguments/check-spectrum.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkWith } from "../arguments/check-with.ts";
import { checkList } from "../arguments/check-list.ts";
import {
  CONE_FUNDAMENTALS_CHOICE,
  coneFundamentals,
  isConeFundamentalsChoice,
  type ConeFundamentals,
} from "../vision/cone-fundamentals.ts";
import {
  coneExcitations,
  macLeodBoynton,
  macLeodBoyntonWeights,
  type ConeExcitations,
} from "../vision/cone-excitations.ts";
import { plotFigure, roundForDisplay, type PlotFigure, type PlotTrace } from "./figure.ts";
import { FIGURE_HEIGHTS, INK, houseAxis, houseConfig, houseLayout, seriesLook } from "./style.ts";
import { escapeHover } from "./chromaticity-overlays.ts";

/** A point on the diagram: a labelled spectrum (light, or sample under `illuminant`) or labelled cone excitations. */
export interface MacLeodBoyntonPoint {
  readonly label: string;
  readonly spectrum?: Spectrum;
  readonly lms?: ConeExcitations;
}

export interface MacLeodBoyntonOptions {
  /** The cone fundamentals: "2°" (default), "10°" or a `ConeFundamentals` object. */
  fundamentals?: "2°" | "10°" | 2 | 10 | ConeFundamentals;
  /** Labelled points { label, spectrum } or { label, lms }; default none. */
  points?: readonly MacLeodBoyntonPoint[];
  /** The illuminant for points given as reflectance or transmittance spectra; default "D65". */
  illuminant?: string | Spectrum;
  /** The s_MB axis: "linear" (default, 0 to 1) or "log". */
  sScale?: "linear" | "log";
  /** Title; default "MacLeod–Boynton chromaticity diagram". */
  title?: string;
  /** Your caption, default none; the figure adds what it shows. */
  caption?: string;
}

function isPoint(p: unknown): boolean {
  if (typeof p !== "object" || p === null) return false;
  const q = p as { label?: unknown; spectrum?: unknown; lms?: unknown };
  return typeof q.label === "string" && (isWellFormedSpectrum(q.spectrum) || typeof q.lms === "object");
}

/**
 * A MacLeod–Boynton chromaticity diagram (l_MB, s_MB) with the spectrum locus of the CIE 2006 cone fundamentals and labelled points.
 *
 * @param options.fundamentals The cone fundamentals; default "2°".
 * @param options.points Labelled points { label, spectrum } or { label, lms }; default none.
 * @param options.illuminant Illuminant for reflectance/transmittance points; default "D65".
 * @param options.sScale "linear" (default) or "log" s_MB axis.
 * @param options.title Title; default "MacLeod–Boynton chromaticity diagram".
 * @param options.caption Your caption; default none.
 * @returns A plain Plotly figure record for `showFigure`.
 * @source CIE 170-1:2006 §8; MacLeod & Boynton, J. Opt. Soc. Am. 69 (1979) 1183–1186.
 * @example macLeodBoyntonDiagram({ points: [{ label: "invented light", lms: { L: 0.7, M: 0.35, S: 0.03 } }] })
 */
export function macLeodBoyntonDiagram(options: MacLeodBoyntonOptions = {}): PlotFigure {
  checkOptions("macLeodBoyntonDiagram", "options", options, [
    "fundamentals",
    "points",
    "illuminant",
    "sScale",
    "title",
    "caption",
  ]);
  checkWith(
    "macLeodBoyntonDiagram",
    "options.fundamentals",
    options.fundamentals,
    CONE_FUNDAMENTALS_CHOICE,
    isConeFundamentalsChoice,
    { optional: true },
  );
  checkList(
    "macLeodBoyntonDiagram",
    "options.points",
    options.points,
    "points { label, spectrum } or { label, lms: { L, M, S } }",
    isPoint,
    { optional: true },
  );
  checkWith(
    "macLeodBoyntonDiagram",
    "options.sScale",
    options.sScale,
    '"linear" or "log"',
    (v) => v === "linear" || v === "log",
    { optional: true },
  );
  return withoutMethodNotes(() => {
    const f = coneFundamentals(options.fundamentals ?? "2°");
    const w = macLeodBoyntonWeights(f);
    const log = options.sScale === "log";
    const lx: number[] = [],
      sy: number[] = [],
      wl: number[] = [];
    for (let i = 0; i < f.wavelengths.length; i++) {
      const lum = w.l * f.l[i]! + w.m * f.m[i]!;
      const s = (w.s * f.s[i]!) / lum;
      if (f.wavelengths[i]! > 700 || (log && !(s > 0))) continue;
      lx.push(roundForDisplay((w.l * f.l[i]!) / lum));
      sy.push(roundForDisplay(s, 7));
      wl.push(f.wavelengths[i]!);
    }
    const data: PlotTrace[] = [
      {
        type: "scatter",
        mode: "lines",
        name: "spectrum locus",
        x: lx,
        y: sy,
        text: wl.map((v) => `${v} nm`),
        line: { color: INK.frame, width: 1.4 },
        hovertemplate: "%{text}: l = %{x:.4f}, s = %{y:.4f}<extra></extra>",
      },
    ];
    const marks = wl.map((v, i) => [v, i] as const).filter(([v]) => v % 20 === 0 && v >= 420 && v <= 660);
    data.push({
      type: "scatter",
      mode: "markers+text",
      name: "wavelength marks",
      showlegend: false,
      x: marks.map(([, i]) => lx[i]),
      y: marks.map(([, i]) => sy[i]),
      text: marks.map(([v]) => `${v}`),
      textposition: "middle right",
      textfont: { size: 10, color: INK.faint },
      marker: { size: 4, color: INK.frame },
      hoverinfo: "skip",
    });
    (options.points ?? []).forEach((p, i) => {
      const lms = p.spectrum
        ? coneExcitations(p.spectrum, {
            fundamentals: f,
            ...(options.illuminant !== undefined ? { illuminant: options.illuminant } : {}),
          })
        : p.lms!;
      const c = macLeodBoynton(lms, f);
      const look = seriesLook(i + 1);
      data.push({
        type: "scatter",
        mode: "markers",
        name: escapeHover(p.label),
        x: [roundForDisplay(c.l)],
        y: [roundForDisplay(c.s, 7)],
        marker: { size: 9, color: look.color, symbol: look.symbol, line: { width: 1, color: INK.frame } },
        hovertemplate: `${escapeHover(p.label)}<br>l = %{x:.4f}, s = %{y:.4f}<extra></extra>`,
      });
    });
    const layout = houseLayout({
      title: options.title ?? "MacLeod–Boynton chromaticity diagram",
      subtitle: `${f.fieldDegrees}° CIE 2006 cone fundamentals (CIE 170-1)`,
      height: FIGURE_HEIGHTS.square,
      xaxis: houseAxis("l<sub>MB</sub> = L/(L + M)", { range: [0.45, 1.0] }),
      yaxis: houseAxis(
        "s<sub>MB</sub> = S/(L + M)",
        log ? { type: "log", range: [-4, 0.1] } : { range: [0, 1.05] },
      ),
      legend: "below",
    });
    const caption = `${options.caption ? `${options.caption.trim()} ` : ""}MacLeod–Boynton chromaticities from the ${f.name}: L and M weighted ${w.l} and ${w.m} (their sum is the luminance, CIE 170-2), S scaled by ${w.s.toPrecision(6)} so that s_MB peaks at 1 on the spectrum locus (shown to 700 nm).`;
    return plotFigure(data, layout, houseConfig("macleod-boynton"), caption);
  });
}
