/**
 * Time of a chromaticity diagram with its default colour fill (CIE 1931 xy, 2° observer, the whole diagram), as a
 * notebook cell draws it: the first one of a run draws the fill, later ones of the same observer, diagram and size
 * reuse it. Measured side by side in this run: the same diagram without the fill, and with a fill drawn afresh each
 * time (a fill size not drawn before: 361, 362, ... px, so nothing is reused).
 * Target (issue 16): a diagram with its default fill under 50 ms. Medians of five after one warm-up.
 */
import { chromaticityDiagram } from "../../lib/index.ts";
import { median, type Bench } from "./bench.ts";

function timeMs(repeats: number, f: (k: number) => unknown): number {
  f(-1);
  const samples: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const t0 = performance.now();
    f(k);
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

const bench: Bench = {
  name: "Chromaticity diagram with its colour fill",
  async run() {
    const t0 = performance.now();
    chromaticityDiagram();
    const firstMs = performance.now() - t0;
    const withFill = timeMs(5, () => chromaticityDiagram());
    const without = timeMs(5, () => chromaticityDiagram({ fill: false }));
    const afresh = timeMs(5, (k) => chromaticityDiagram({ fill: { resolution: 362 + k } }));
    return [
      {
        name: "diagram with the default fill",
        value: withFill,
        unit: "ms",
        target: "< 50",
        met: withFill < 50,
      },
      {
        name: "  the same without the fill",
        value: without,
        unit: "ms",
        note: `the fill adds ${(withFill - without).toFixed(1)} ms`,
      },
      {
        name: "  with a fill drawn afresh",
        value: afresh,
        unit: "ms",
        note: `with fill / afresh = ${(withFill / afresh).toFixed(2)}`,
      },
      { name: "  first diagram of the run (draws the fill)", value: firstMs, unit: "ms" },
    ];
  },
};
export default bench;
