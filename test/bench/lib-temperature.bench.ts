/**
 * Speed of CCT and Duv (invented chromaticities near the Planckian locus, 2000–40 000 K, |Duv| ≤ 0.02):
 *  - cctAndDuv by Ohno 2014 (the default) on 1 000 000 chromaticities, against the brute-force baseline below: the
 *    nearest point of a Planckian table in 1 K steps from 1000 K to 100 000 K (99 001 rows), scanned in full. The
 *    baseline needs some 60 µs per chromaticity, so it runs on the first 5 000 and its rate is compared;
 *  - Robertson 1968 on the same 1 000 000.
 * Targets (issue 16): Ohno at least 1 000 000 chromaticities per second and at least 20× the baseline's rate.
 * Also reported: the largest differences between Ohno and the baseline (the baseline's own resolution is 1 K), and
 * the time of the first call in this process, which builds Ohno's fine table.
 * The inputs are built before timing; each workload runs once to warm up, then the median of three runs is reported.
 */
import { cctAndDuv, chromaticityAtCct, uv1960FromXy, type Chromaticity } from "../../lib/index.ts";
import { planckianUv } from "../../lib/temperature/planckian-locus.ts";
import { median, type Bench, type BenchResult } from "./bench.ts";

const POINTS = 1_000_000;
const BASELINE_POINTS = 5_000;

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

/** Median wall time and median CPU time of this process (ms): on a loaded machine the two differ. */
function timeMs(repeats: number, f: () => number): number {
  return time(repeats, f).wall;
}
function time(repeats: number, f: () => number): { wall: number; cpu: number } {
  f(); // warm-up
  const wall: number[] = [],
    cpu: number[] = [];
  for (let i = 0; i < repeats; i++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    f();
    wall.push(performance.now() - t0);
    const c = process.cpuUsage(c0);
    cpu.push((c.user + c.system) / 1000);
  }
  return { wall: median(wall), cpu: median(cpu) };
}

const bench: Bench = {
  name: "CCT and Duv",
  async run() {
    const rnd = random(20251216);
    const points: Chromaticity[] = [];
    while (points.length < POINTS) {
      const t = Math.exp(Math.log(2000) + rnd() * Math.log(20));
      try {
        points.push(chromaticityAtCct(t, 0.04 * rnd() - 0.02));
      } catch {
        // beyond the spectrum locus at low T: draw again
      }
    }

    // The brute-force baseline: a 1 K Planckian table, then the nearest row by a full scan.
    const rows = 99_001;
    const tu = new Float64Array(rows),
      tv = new Float64Array(rows);
    for (let i = 0; i < rows; i++) ({ u: tu[i]!, v: tv[i]! } = planckianUv(1000 + i));
    const bruteForce = (xy: Chromaticity): { cct: number; duv: number } => {
      const { u, v } = uv1960FromXy(xy);
      let best = 0,
        bestD = Infinity;
      for (let i = 0; i < rows; i++) {
        const d = (u - tu[i]!) ** 2 + (v - tv[i]!) ** 2;
        if (d < bestD) [best, bestD] = [i, d];
      }
      return { cct: 1000 + best, duv: Math.sqrt(bestD) * Math.sign(v - tv[best]!) };
    };

    const t0 = performance.now();
    cctAndDuv(points[0]!);
    const firstMs = performance.now() - t0;

    const ohno = time(3, () => {
      let s = 0;
      for (const p of points) s += cctAndDuv(p).cct;
      return s;
    });
    const ohnoMs = ohno.wall;
    const robertsonMs = timeMs(3, () => {
      let s = 0;
      for (const p of points) s += cctAndDuv(p, { method: "robertson" }).cct;
      return s;
    });
    const subset = points.slice(0, BASELINE_POINTS);
    const baselineMs = timeMs(3, () => {
      let s = 0;
      for (const p of subset) s += bruteForce(p).cct;
      return s;
    });
    let dT = 0,
      dDuv = 0;
    for (const p of subset) {
      const a = cctAndDuv(p),
        b = bruteForce(p);
      dT = Math.max(dT, Math.abs(a.cct - b.cct));
      dDuv = Math.max(dDuv, Math.abs(a.duv - b.duv));
    }

    const ohnoRate = (POINTS / ohnoMs) * 1000;
    const baselineRate = (BASELINE_POINTS / baselineMs) * 1000;
    const ratio = ohnoRate / baselineRate;
    const results: BenchResult[] = [
      {
        name: "Ohno 2014: chromaticities per second",
        value: ohnoRate,
        unit: "/s",
        target: "≥ 1000000",
        met: ohnoRate >= 1e6,
        note: `${POINTS.toLocaleString("en")} in ${ohnoMs.toFixed(0)} ms`,
      },
      {
        name: "  the same per second of CPU time",
        value: (POINTS / ohno.cpu) * 1000,
        unit: "/s",
        note: "differs from the above when other processes share the cores",
      },
      {
        name: "brute force (1 K table, full scan): per second",
        value: baselineRate,
        unit: "/s",
        note: `${BASELINE_POINTS.toLocaleString("en")} in ${baselineMs.toFixed(0)} ms`,
      },
      {
        name: "Ohno rate / brute-force rate",
        value: ratio,
        unit: "×",
        target: "≥ 20",
        met: ratio >= 20,
      },
      {
        name: "Robertson 1968: chromaticities per second",
        value: (POINTS / robertsonMs) * 1000,
        unit: "/s",
      },
      { name: "  largest |ΔCCT| Ohno − brute force", value: dT, unit: "K", note: "the baseline steps 1 K" },
      { name: "  largest |ΔDuv| Ohno − brute force", value: dDuv, unit: "", note: dDuv.toExponential(1) },
      { name: "first call (builds Ohno's fine table)", value: firstMs, unit: "ms" },
    ];
    return results;
  },
};
export default bench;
