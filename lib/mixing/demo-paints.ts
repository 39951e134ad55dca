/**
 * INVENTED DEMO DATA — not measurements and not references. Smooth, made-up absorption (K) and scattering (S)
 * spectra for a white and six coloured paints, so notebooks can show Kubelka–Munk mixing (for example, why red,
 * green and blue paint mixed together give a dark, muddy colour). Built from logistic edges (common practice, no source).
 */
import { logisticEdge } from "../filters/parametric-filters.ts";
import { gridWavelengths } from "../spectrum/grid.ts";
import { spectrum } from "../spectrum/spectrum.ts";
import { twoConstantColourant, type TwoConstantColourant } from "./paint-mixing.ts";

const W = gridWavelengths({ start: 360, end: 830, step: 5 });

function paint(name: string, k: (w: number) => number, s: (w: number) => number): TwoConstantColourant {
  const full = `${name} (invented demo paint)`;
  return twoConstantColourant(
    spectrum(W, W.map(k), { name: `${full} K` }),
    spectrum(W, W.map(s), { name: `${full} S` }),
    full,
  );
}

const above =
  (edge: number, width = 30) =>
  (w: number) =>
    logisticEdge(w - edge, width);
const below =
  (edge: number, width = 30) =>
  (w: number) =>
    logisticEdge(edge - w, width);

/**
 * Invented demo paints (not measurements, not references): K and S per unit amount for a white and six colours, two-constant.
 *
 * @returns { white, red, green, blue, cyan, magenta, yellow }: `TwoConstantColourant`s on 360–830 nm every 5 nm.
 * @source none: invented demonstration data built from logistic edges.
 * @example Object.keys(demoPaints())
 */
export function demoPaints(): Record<
  "white" | "red" | "green" | "blue" | "cyan" | "magenta" | "yellow",
  TwoConstantColourant
> {
  const strong = 6;
  const weak = 0.04;
  const pigmentS = (w: number) => 0.35 + 0.1 * below(500, 200)(w);
  return {
    white: paint(
      "white",
      (w) => 0.01 + 0.2 * below(410, 20)(w),
      () => 1.2,
    ),
    red: paint("red", (w) => weak + strong * below(595)(w), pigmentS),
    green: paint("green", (w) => weak + strong * (below(490)(w) + above(575)(w)), pigmentS),
    blue: paint("blue", (w) => weak + strong * above(505)(w), pigmentS),
    cyan: paint("cyan", (w) => weak + strong * above(590)(w), pigmentS),
    magenta: paint("magenta", (w) => weak + strong * above(495)(w) * below(590)(w), pigmentS),
    yellow: paint("yellow", (w) => weak + strong * below(495)(w), pigmentS),
  };
}
