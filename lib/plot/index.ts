/** Barrel for lib/plot (re-exports only): figures as plain Plotly specs, colour-accurate swatches, the house style. */
export type { PlotFigure, PlotTrace, PlotLayout, PlotConfig } from "./figure.ts";
export {
  FONT_FAMILY,
  NUMERIC_FONT_FAMILY,
  INK,
  SERIES_COLOURS,
  SERIES_DASHES,
  SERIES_MARKERS,
  FIGURE_HEIGHTS,
  seriesLook,
  houseAxis,
  houseLayout,
  houseConfig,
} from "./style.ts";
export type { HouseLayoutOptions } from "./style.ts";

export { chromaticityDiagram, spectralLocusPoint } from "./chromaticity-diagram.ts";
export type { ChromaticityDiagramOptions, PlanckianOptions } from "./chromaticity-diagram.ts";
export type {
  LabelledChromaticity,
  GamutChoice,
  CustomGamut,
  ToleranceRegion,
  ChromaticityArrow,
} from "./chromaticity-overlays.ts";
export type { ChromaticityInput } from "./chromaticity-input.ts";
export type { DisplayGamut } from "./display-rgb.ts";

export { spectrumPlot } from "./spectrum-plot.ts";
export type {
  SpectrumPlotOptions,
  SpectrumSeries,
  SpectrumEnvelope,
  WavelengthMark,
} from "./spectrum-plot.ts";

export { labPlane, lightnessChromaPlot, labDisplayHex } from "./lab-plots.ts";
export type { LabPlotOptions, LabSample, LabPair } from "./lab-plots.ts";

export { swatch, swatchGrid, swatchPairs } from "./swatch.ts";
export type { Swatch, SwatchColour, SwatchOptions, SwatchEntry, SwatchPairEntry } from "./swatch.ts";

// Display measurement figures (issue 14).
export { decadeTicks, greyscaleTrackingPlot, eotfPlot, uniformityMap } from "./display-plots.ts";
export type {
  GreyscaleTrackingPlotOptions,
  EotfSeries,
  EotfPlotOptions,
  UniformityMapOptions,
} from "./display-plots.ts";
