/**
 * Speed of the colorimetry library against general-purpose reference libraries doing the same work (invented data):
 *  - spectrum → XYZ for 100 000 reflectance spectra (5 nm, 360–830 nm, D65, CIE 1931 2°), against spdToXyz of
 *    spectral-color (given the same spectra as its own objects, multiplied by its D65 as its API expects). The
 *    reference needs about 1.4 ms per spectrum (some 140 s for 100 000), so by default it runs on the first 10 000
 *    spectra and its time is scaled by 10 (the work is the same for every spectrum); set TRISTIM_BENCH_FULL=1 to
 *    run it on all 100 000;
 *  - ΔE00 for 1 000 000 pairs of CIELAB colours, against culori's differenceCiede2000.
 * Target (the issue's): at least as fast as the reference library, i.e. a time ratio ours/reference ≤ 1.
 * The inputs are built before timing; each workload runs once to warm up, then the median of three runs is reported.
 */
import { differenceCiede2000 } from "culori";
import { Shape, SpectralDistribution, illuminants, spdToXyz } from "spectral-color";
import { deltaE2000, spectrumOnGrid, tristimulus, type Lab } from "../../lib/index.ts";
import { median, type Bench, type BenchResult } from "./bench.ts";

const SPECTRA = 100_000;
const REFERENCE_SPECTRA = process.env.TRISTIM_BENCH_FULL === "1" ? SPECTRA : 10_000;
const PAIRS = 1_000_000;

/** A deterministic pseudo-random sequence (mulberry32), so every run times the same invented data. */
function random(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function timeMs(repeats: number, f: () => number): { ms: number; check: number } {
  let check = f(); // warm-up
  const samples: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now();
    check = f();
    samples.push(performance.now() - t0);
  }
  return { ms: median(samples), check };
}

function compare(
  name: string,
  ours: number,
  reference: number,
  referenceName: string,
  referenceNote?: string,
): BenchResult[] {
  const ratio = ours / reference;
  return [
    { name: `${name}: tristim`, value: ours, unit: "ms" },
    { name: `${name}: ${referenceName}`, value: reference, unit: "ms", note: referenceNote },
    {
      name: `${name}: time ratio tristim/${referenceName}`,
      value: ratio,
      unit: "",
      target: "≤ 1",
      met: ratio <= 1,
      note:
        ratio < 1
          ? `tristim ${(1 / ratio).toFixed(ratio < 0.1 ? 0 : 2)}× as fast`
          : `tristim ${ratio.toFixed(2)}× as slow`,
    },
  ];
}

const bench: Bench = {
  name: "Colorimetry library against reference libraries",
  async run() {
    const rnd = random(20251202);
    // Invented smooth reflectances: a base level plus two broad bands, 95 samples at 5 nm.
    const wl = Array.from({ length: 95 }, (_, i) => 360 + 5 * i);
    const reflectances = Array.from({ length: SPECTRA }, () => {
      const base = 0.05 + 0.3 * rnd(),
        a1 = 0.5 * rnd(),
        m1 = 400 + 300 * rnd(),
        a2 = 0.3 * rnd(),
        m2 = 450 + 300 * rnd();
      return wl.map((w) =>
        Math.min(1, base + a1 * Math.exp(-(((w - m1) / 40) ** 2)) + a2 * Math.exp(-(((w - m2) / 70) ** 2))),
      );
    });
    const ourSpectra = reflectances.map((r, k) =>
      spectrumOnGrid(360, 5, r, { name: `invented ${k}`, quantity: "reflectance" }),
    );
    const shape = new Shape(360, 830, 5);
    const theirSpectra = reflectances.map((r) => new SpectralDistribution({ shape, samples: r }));

    const ours = timeMs(3, () => {
      let s = 0;
      for (const sp of ourSpectra) s += tristimulus(sp, { illuminant: "D65", interval: 5 }).Y;
      return s;
    });
    const subset = theirSpectra.slice(0, REFERENCE_SPECTRA);
    for (const sp of subset.slice(0, 200)) spdToXyz(sp.multiply(illuminants.D65)); // warm-up
    const t0 = performance.now();
    let theirSum = 0;
    for (const sp of subset) theirSum += spdToXyz(sp.multiply(illuminants.D65))[1]! * 100;
    const theirsMs = ((performance.now() - t0) * SPECTRA) / REFERENCE_SPECTRA;
    let ourSubsetSum = 0;
    for (const sp of ourSpectra.slice(0, REFERENCE_SPECTRA))
      ourSubsetSum += tristimulus(sp, { illuminant: "D65", interval: 5 }).Y;
    const agreement = Math.abs(ourSubsetSum - theirSum) / REFERENCE_SPECTRA;

    const labs: Lab[] = Array.from({ length: 2 * PAIRS }, () => ({
      L: 100 * rnd(),
      a: 200 * rnd() - 100,
      b: 200 * rnd() - 100,
    }));
    const culoriLabs = labs.map((c) => ({ mode: "lab65" as const, l: c.L, a: c.a, b: c.b }));
    const culoriDe = differenceCiede2000();
    const de = timeMs(3, () => {
      let s = 0;
      for (let i = 0; i < PAIRS; i++) s += deltaE2000(labs[2 * i]!, labs[2 * i + 1]!);
      return s;
    });
    const deRef = timeMs(3, () => {
      let s = 0;
      for (let i = 0; i < PAIRS; i++) s += culoriDe(culoriLabs[2 * i]!, culoriLabs[2 * i + 1]!);
      return s;
    });
    const deAgreement = Math.abs(de.check - deRef.check) / PAIRS;

    return [
      ...compare(
        `spectrum → XYZ, ${SPECTRA.toLocaleString("en")} spectra`,
        ours.ms,
        theirsMs,
        "spectral-color",
        REFERENCE_SPECTRA < SPECTRA
          ? `measured on ${REFERENCE_SPECTRA.toLocaleString("en")} spectra, scaled ×${SPECTRA / REFERENCE_SPECTRA}`
          : undefined,
      ),
      {
        name: "  mean |ΔY| between the two",
        value: agreement,
        unit: "",
        note: `Y = 100 scale: ${agreement.toExponential(1)}`,
      },
      ...compare(`ΔE00, ${PAIRS.toLocaleString("en")} pairs`, de.ms, deRef.ms, "culori"),
      {
        name: "  mean |ΔE00 difference| between the two",
        value: deAgreement,
        unit: "",
        note: deAgreement.toExponential(1),
      },
    ];
  },
};
export default bench;
