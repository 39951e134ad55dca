/**
 * Speed of the physics and file modules on typical notebook workloads (invented data): the colour rendering index of
 * one source, reading a large spectral CSV (200 samples × 401 wavelengths), drive levels of five primaries, and a
 * paint recipe's colour. Targets (a notebook cell should stay interactive; common practice, no source): CRI ≤ 20 ms,
 * the CSV ≤ 300 ms, drive levels ≤ 5 ms, a recipe colour ≤ 5 ms.
 */
import {
  colourRenderingIndex,
  demoPaints,
  formatSpectraCsv,
  illuminant,
  ledSpectrum,
  parseSpectraCsv,
  recipeColour,
  solveDriveLevels,
  spectrum,
} from "../../lib/index.ts";
import { median, type Bench, type BenchResult } from "./bench.ts";

function time(repeats: number, f: () => unknown): number {
  f(); // warm up caches and the JIT
  const samples: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    f();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

function result(name: string, ms: number, limit: number): BenchResult {
  return { name, value: ms, unit: "ms", target: `≤ ${limit}`, met: ms <= limit };
}

const bench: Bench = {
  name: "Physics and measurement files",
  async run() {
    const fl2 = illuminant("FL2");
    const wl = Array.from({ length: 401 }, (_, i) => 380 + i);
    const big = Array.from({ length: 200 }, (_, k) =>
      spectrum(
        wl,
        wl.map((w) => 0.5 + 0.4 * Math.sin((w + 7 * k) / 40)),
        { name: `invented ${k}`, quantity: "reflectance" },
      ),
    );
    const csv = formatSpectraCsv(big, { delimiter: ";", decimal: ",", scale: "percent" });
    const grid = { start: 380, end: 780, step: 1 };
    const five = [630, 590, 530, 500, 455].map((peak) => ledSpectrum({ peak, fwhm: 20, grid }));
    const paints = demoPaints();
    return [
      result(
        "colour rendering index, one source",
        time(20, () => colourRenderingIndex(fl2)),
        20,
      ),
      result(
        "parse CSV 200 × 401, decimal comma",
        time(5, () => parseSpectraCsv(csv, { quantity: "reflectance" })),
        300,
      ),
      result(
        "drive levels, five primaries (NNLS)",
        time(20, () => solveDriveLevels(five, { x: 0.3127, y: 0.329, Y: 50 })),
        5,
      ),
      result(
        "recipe colour, three paints",
        time(20, () =>
          recipeColour([
            { colourant: paints.red, amount: 1 },
            { colourant: paints.yellow, amount: 2 },
            { colourant: paints.white, amount: 5 },
          ]),
        ),
        5,
      ),
    ];
  },
};
export default bench;
