/**
 * The tristim standard library: what `import { ... } from "tristim"` gives a notebook cell, and what cells also see
 * as globals. Re-exports only; each concept lives in its own file.
 */
export * from "./methods/method-log.ts";

export * from "./spectrum/spectrum.ts";
export * from "./spectrum/grid.ts";
export * from "./spectrum/sample.ts";
export * from "./spectrum/resample.ts";
export * from "./spectrum/arithmetic.ts";
export * from "./spectrum/normalise.ts";
export * from "./spectrum/spectrum-set.ts";

export * from "./observers/standard-observer.ts";
export * from "./illuminants/planckian-radiator.ts";
export * from "./illuminants/illuminant-a.ts";
export * from "./illuminants/daylight.ts";
export * from "./illuminants/standard-illuminant.ts";

export * from "./colorimetry/chromaticity.ts";
export * from "./colorimetry/tristimulus.ts";
export * from "./colorimetry/astm-weights.ts";
export * from "./colorimetry/cielab.ts";

// Core colorimetry added by the colorimetry owner below this line.
export * from "./temperature/planckian-locus.ts";
export * from "./temperature/cct.ts";
export * from "./difference/delta-e-76.ts";
export * from "./difference/delta-e-94.ts";
export * from "./difference/delta-e-2000.ts";
export * from "./difference/delta-e-cmc.ts";
export * from "./colorimetry/matrix3.ts";
export * from "./rgb/transfer-functions.ts";
export * from "./rgb/rgb-space.ts";
export * from "./rgb/rgb-conversion.ts";
export * from "./adaptation/chromatic-adaptation.ts";
export * from "./colorimetry/cieluv.ts";
export * from "./colorimetry/cie-uvw.ts";
export * from "./colorimetry/dominant-wavelength.ts";
export * from "./photometry/luminous-efficiency.ts";
export * from "./photometry/photometric-quantities.ts";
export * from "./photometry/safety-caution.ts";
export * from "./gamut/gamut-area.ts";

// Figures and swatches (lib/plot), light through filters, mixing, halftone, colour rendering and measurement files.
export * from "./plot/index.ts";
export * from "./filters/index.ts";
export * from "./mixing/index.ts";
export * from "./halftone/index.ts";
export * from "./rendering/index.ts";
export * from "./files/index.ts";

// Measurement uncertainty (issue 13): input models, Monte Carlo (JCGM 101), first order (JCGM 100).
export * from "./uncertainty/index.ts";
// Display and HDR measurement (issue 14): ICtCp, ΔE ITP, Jzazbz, CAM16/CIECAM02 and CAM16-UCS (lib/appearance);
// Y′CbCr and integer code values (lib/video); the display QA calculations (lib/display). Figures are in lib/plot.
export * from "./appearance/index.ts";
export * from "./video/index.ts";
export * from "./display/index.ts";
// Cones, colour-vision deficiency, cameras and demo spectra (issue 15): one block, kept together.
export {
  CIE_2006_LMS_2_DEGREE,
  CIE_2006_LMS_10_DEGREE,
  coneFundamentals,
  coneFundamentalSpectra,
  type ConeFundamentals,
} from "./vision/cone-fundamentals.ts";
export * from "./vision/cie-2015-observer.ts";
export * from "./vision/cone-excitations.ts";
export * from "./plot/macleod-boynton-diagram.ts";
export * from "./vision/deficiency.ts";
export { deficiencySwatches, type DeficiencySwatchEntry } from "./plot/deficiency-swatches.ts";
export {
  cameraSensor,
  inventedCameraSensor,
  cameraSensorSpectra,
  type CameraSensor,
  type InventedSensorOptions,
} from "./camera/camera-sensor.ts";
export { cameraRgb, type CameraRgbOptions } from "./camera/camera-rgb.ts";
export * from "./camera/colour-correction.ts";
export * from "./camera/luther-ives.ts";
export * from "./camera/metamer-pairs.ts";
export * from "./synthesis/reflectance-from-srgb.ts";
export * from "./filters/notch-filter.ts";
export * from "./mixing/efficient-drive-levels.ts";

// Argument checking: the error every public function throws for a wrong argument.
export * from "./arguments/argument-error.ts";
