/**
 * The figure record every plot function returns: a plain, serializable Plotly specification (data, layout, config)
 * with the caption the report prints under it. No functions, no DOM: the report's browser draws it.
 */

/** One Plotly trace: plain JSON (type, x, y, line, marker, hovertemplate, ...). */
export type PlotTrace = Record<string, unknown>;
/** Plotly layout: plain JSON. */
export type PlotLayout = Record<string, unknown>;
/** Plotly config: plain JSON. */
export type PlotConfig = Record<string, unknown>;

export interface PlotFigure {
  readonly data: PlotTrace[];
  readonly layout: PlotLayout;
  readonly config: PlotConfig;
  /** The sentence(s) printed under the figure; says what is approximate and which observer/illuminant applies. */
  readonly caption: string;
}

/** A figure record from its parts (the layout must already carry the title). */
export function plotFigure(
  data: PlotTrace[],
  layout: PlotLayout,
  config: PlotConfig,
  caption: string,
): PlotFigure {
  return { data, layout, config, caption };
}

/** Rounds a coordinate to a fixed number of decimals so a figure's JSON stays small (display only, never for results). */
export function roundForDisplay(v: number, decimals = 5): number {
  const f = 10 ** decimals;
  return Math.round(v * f) / f;
}
