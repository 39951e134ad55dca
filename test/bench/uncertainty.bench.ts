/**
 * Speed of Monte Carlo propagation (issue 13): 10 000 trials of spectrum → XYZ → CIELAB → ΔE00 for one sample (an
 * invented 5 nm reflectance, 380–780 nm, with all five spectral effects: photometric scale, band noise, correlated
 * noise, wavelength shift and bandwidth error), against a fixed reference colour. Target: < 1 s for the 10 000 trials,
 * on its own and with the first-order comparison. Median of three runs after one warm-up.
 */
import {
  deltaE2000,
  labFromXYZ,
  monteCarloUncertainty,
  objectColour,
  spectralInput,
  spectrumOnGrid,
  type Spectrum,
} from "../../lib/index.ts";
import { median, type Bench } from "./bench.ts";

const sample = spectrumOnGrid(
  380,
  5,
  Array.from({ length: 81 }, (_, i) => 0.15 + 0.6 / (1 + Math.exp(-(380 + 5 * i - 590) / 18))),
  { quantity: "reflectance", name: "invented orange tile" },
);
const reference = { L: 62, a: 38, b: 52 };
const input = spectralInput(sample, {
  scale: 0.003,
  bandNoise: 0.001,
  correlatedNoise: { u: 0.002, length: 40 },
  wavelengthShift: 0.1,
  bandwidthError: { bandwidth: 5, u: 0.2 },
});
const model = (v: Record<string, number | Spectrum>) => {
  const c = objectColour(v.sample as Spectrum);
  const lab = labFromXYZ(c.XYZ, c.white);
  return { L: lab.L, a: lab.a, b: lab.b, dE00: deltaE2000(reference, lab) };
};

function time(compare: boolean): { ms: number; u: number } {
  const run = () =>
    monteCarloUncertainty(model, { sample: input }, { trials: 10_000, seed: 1, compare }).outputs.dE00!
      .standardUncertainty;
  let u = run();
  const samples: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    u = run();
    samples.push(performance.now() - t0);
  }
  return { ms: median(samples), u };
}

const bench: Bench = {
  name: "Monte Carlo uncertainty (JCGM 101)",
  async run() {
    const plain = time(false);
    const compared = time(true);
    return [
      {
        name: "10 000 trials spectrum → XYZ → Lab → ΔE00",
        value: plain.ms,
        unit: "ms",
        target: "< 1000",
        met: plain.ms < 1000,
        note: `u(ΔE00) = ${plain.u.toFixed(4)}`,
      },
      {
        name: "the same with the first-order comparison",
        value: compared.ms,
        unit: "ms",
        target: "< 1000",
        met: compared.ms < 1000,
      },
    ];
  },
};
export default bench;
