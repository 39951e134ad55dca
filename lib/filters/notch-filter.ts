/** A parametric band-stop (notch) filter for demonstrations: passes everywhere except a band around a centre. */
import { noteMethod } from "../methods/method-log.ts";
import { spectrum, type Spectrum } from "../spectrum/spectrum.ts";
import { gridWavelengths } from "../spectrum/grid.ts";
import { checkNumber } from "../arguments/check-number.ts";
import { checkOptions } from "../arguments/check-options.ts";
import { checkString } from "../arguments/check-text.ts";
import { checkFields, GRID_FIELDS } from "../arguments/check-fields.ts";
import { logisticEdge, PARAMETRIC_GRID, type EdgeShape } from "./parametric-filters.ts";

/**
 * A parametric band-stop (notch) filter (modelled, not measured): transmittance `peak` outside the band, `floor` inside it, with logistic edges.
 *
 * T(λ) = peak − (peak − floor)·e(λ − lo)·e(hi − λ), with lo, hi = centre ∓ width/2 (the 50 % points of the stop band)
 * and e the logistic edge of `logisticEdge`.
 *
 * @param centre The centre of the stop band, in nm.
 * @param width The full width of the stop band between its 50 % points, in nm.
 * @param options.peak Transmittance outside the band, a fraction; default 1.
 * @param options.floor Transmittance at the bottom of the notch, a fraction; default 0.
 * @param options.edgeWidth 10–90 % width of each edge in nm; default 0 (sharp).
 * @param options.grid Wavelengths { start, end, step } in nm; default 360–830 nm every 1 nm.
 * @param options.name The spectrum's name; default "notch <centre>/<width> nm".
 * @returns A "transmittance" `Spectrum`.
 * @source none: logistic edges, common practice with no source.
 * @example notchFilter(589, 20, { edgeWidth: 6, floor: 0.01 })
 */
export function notchFilter(centre: number, width: number, options: EdgeShape = {}): Spectrum {
  checkNumber("notchFilter", "centre", centre, { unit: "nm", above: 0 });
  checkNumber("notchFilter", "width", width, { unit: "nm", above: 0 });
  checkOptions("notchFilter", "options", options, ["peak", "floor", "edgeWidth", "grid", "name"]);
  checkNumber("notchFilter", "options.peak", options.peak, { optional: true, min: 0, max: 1 });
  checkNumber("notchFilter", "options.floor", options.floor, { optional: true, min: 0, max: 1 });
  checkNumber("notchFilter", "options.edgeWidth", options.edgeWidth, { optional: true, unit: "nm", min: 0 });
  checkFields("notchFilter", "options.grid", options.grid, GRID_FIELDS, { optional: true });
  checkString("notchFilter", "options.name", options.name, { optional: true, what: "a name for the filter" });
  const peak = options.peak ?? 1;
  const floor = options.floor ?? 0;
  if (floor > peak)
    throw new Error(`notchFilter: the notch floor ${floor} is above the pass-band transmittance ${peak}`);
  const ew = options.edgeWidth ?? 0;
  const lo = centre - width / 2;
  const hi = centre + width / 2;
  const wl = gridWavelengths(options.grid ?? PARAMETRIC_GRID);
  noteMethod(
    "optics",
    "Parametric (modelled, not measured) band-stop filters were used; their edges are logistic with the stated 10–90 % edge width.",
  );
  return spectrum(
    wl,
    wl.map((w) => peak - (peak - floor) * logisticEdge(w - lo, ew) * logisticEdge(hi - w, ew)),
    { name: options.name ?? `notch ${centre}/${width} nm`, quantity: "transmittance" },
  );
}
