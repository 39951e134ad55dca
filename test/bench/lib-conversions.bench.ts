/**
 * Speed of the colour-space conversions against culori (the general-purpose reference library) on the same
 * 1 000 000 invented colours, each pair of workloads doing the same conversion:
 *  - sRGB → XYZ (xyzFromRgb; culori rgb → xyz65), XYZ → sRGB (rgbFromXYZ; culori xyz65 → rgb),
 *  - XYZ → CIELAB (labFromXYZ, white of sRGB; culori xyz65 → lab65), CIELAB → XYZ (xyzFromLab; lab65 → xyz65),
 *  - sRGB → CIELAB (xyzFromRgb then labFromXYZ; culori rgb → lab65), CIELAB → sRGB (the reverse; lab65 → rgb),
 *  - XYZ → CIELUV (luvFromXYZ, D50 white of culori; culori xyz50 → luv), CIELAB → LCh (lchFromLab; lab65 → lch65).
 * culori's XYZ is on the Y = 1 scale, ours on Y = 100; the inputs are built for each before timing. Each line
 * also reports the mean difference between the two libraries' results (on the ours scale).
 * Target (issue 16): not slower than culori, i.e. a time ratio ours/culori ≤ 1. Each workload runs once to warm
 * up, then the median of five runs is reported; the two libraries' runs alternate.
 */
import { converter } from "culori";
import {
  labFromXYZ,
  lchFromLab,
  luvFromXYZ,
  rgbFromXYZ,
  rgbSpace,
  xyzFromLab,
  xyzFromRgb,
  type Lab,
  type Rgb,
  type Tristimulus,
} from "../../lib/index.ts";
import { median, type Bench, type BenchResult } from "./bench.ts";

const COLOURS = Number(process.env.TRISTIM_BENCH_COLOURS ?? 1_000_000);

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

/** Times two workloads alternately, each going first in turn (after one warm-up each); median times in ms. */
function timePair(ours: () => number, theirs: () => number): [number, number] {
  ours();
  theirs();
  const a: number[] = [],
    b: number[] = [];
  const once = (f: () => number, into: number[]) => {
    const t0 = performance.now();
    f();
    into.push(performance.now() - t0);
  };
  for (let i = 0; i < 5; i++) {
    if (i % 2) {
      once(theirs, b);
      once(ours, a);
    } else {
      once(ours, a);
      once(theirs, b);
    }
  }
  return [median(a), median(b)];
}

interface Workload {
  name: string;
  /** Each workload writes its own loop, so that every call site sees one function (as in a cell's loop). */
  ours: () => number;
  theirs: () => number;
  /** Mean |difference| over a sample, on our scale. */
  agreement: () => number;
}

const bench: Bench = {
  name: "Colour-space conversions against culori",
  async run() {
    const rnd = random(20251216);
    const srgb = rgbSpace("sRGB");
    const rgbs: Rgb[] = Array.from({ length: COLOURS }, () => ({ r: rnd(), g: rnd(), b: rnd() }));
    const culoriRgbs = rgbs.map((c) => ({ mode: "rgb" as const, r: c.r, g: c.g, b: c.b }));
    // The inputs are copied into objects made here, as culori's are: objects that a library function made and that
    // survive teach V8 to allocate that function's results in the old generation (allocation-site pretenuring),
    // which would slow the timed loops below, whose results die at once, for reasons of the set-up alone.
    const xyzs: Tristimulus[] = rgbs.map((c) => {
      const t = xyzFromRgb(c, srgb);
      return { X: t.X, Y: t.Y, Z: t.Z };
    });
    const culoriXyz65 = xyzs.map((c) => ({
      mode: "xyz65" as const,
      x: c.X / 100,
      y: c.Y / 100,
      z: c.Z / 100,
    }));
    const culoriXyz50 = culoriXyz65.map((c) => ({ ...c, mode: "xyz50" as const }));
    const white = xyzFromRgb({ r: 1, g: 1, b: 1 }, srgb);
    // culori's D50 white for CIELUV (its xyz50 white is the D50 of CIE 015 x, y = 0.3457, 0.3585).
    const d50: Tristimulus = {
      X: (0.3457 / 0.3585) * 100,
      Y: 100,
      Z: ((1 - 0.3457 - 0.3585) / 0.3585) * 100,
    };
    const labs: Lab[] = xyzs.map((c) => {
      const t = labFromXYZ(c, white);
      return { L: t.L, a: t.a, b: t.b };
    });
    const culoriLabs = labs.map((c) => ({ mode: "lab65" as const, l: c.L, a: c.a, b: c.b }));

    const toXyz65 = converter("xyz65"),
      toRgb = converter("rgb"),
      toLab65 = converter("lab65"),
      toLuv = converter("luv"),
      toLch65 = converter("lch65");
    const sample = (f: (i: number) => number) => {
      let s = 0;
      for (let i = 0; i < COLOURS; i += 97) s += f(i);
      return s / Math.ceil(COLOURS / 97);
    };
    const workloads: Workload[] = [
      {
        name: "sRGB → XYZ",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += xyzFromRgb(rgbs[i]!, srgb).Y;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toXyz65(culoriRgbs[i]!).y;
          return s;
        },
        agreement: () =>
          sample((i) => Math.abs(xyzFromRgb(rgbs[i]!, srgb).X - 100 * toXyz65(culoriRgbs[i]!).x)),
      },
      {
        name: "XYZ → sRGB",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += rgbFromXYZ(xyzs[i]!, srgb).g;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toRgb(culoriXyz65[i]!).g;
          return s;
        },
        agreement: () => sample((i) => Math.abs(rgbFromXYZ(xyzs[i]!, srgb).r - toRgb(culoriXyz65[i]!).r)),
      },
      {
        name: "XYZ → CIELAB",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += labFromXYZ(xyzs[i]!, white).a;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toLab65(culoriXyz65[i]!).a;
          return s;
        },
        agreement: () => sample((i) => Math.abs(labFromXYZ(xyzs[i]!, white).b - toLab65(culoriXyz65[i]!).b)),
      },
      {
        name: "CIELAB → XYZ",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += xyzFromLab(labs[i]!, white).Y;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toXyz65(culoriLabs[i]!).y;
          return s;
        },
        agreement: () =>
          sample((i) => Math.abs(xyzFromLab(labs[i]!, white).Z - 100 * toXyz65(culoriLabs[i]!).z)),
      },
      {
        name: "sRGB → CIELAB",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += labFromXYZ(xyzFromRgb(rgbs[i]!, srgb), white).L;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toLab65(culoriRgbs[i]!).l;
          return s;
        },
        agreement: () =>
          sample((i) =>
            Math.abs(labFromXYZ(xyzFromRgb(rgbs[i]!, srgb), white).a - toLab65(culoriRgbs[i]!).a),
          ),
      },
      {
        name: "CIELAB → sRGB",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += rgbFromXYZ(xyzFromLab(labs[i]!, white), srgb).b;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toRgb(culoriLabs[i]!).b;
          return s;
        },
        agreement: () =>
          sample((i) => Math.abs(rgbFromXYZ(xyzFromLab(labs[i]!, white), srgb).g - toRgb(culoriLabs[i]!).g)),
      },
      {
        name: "XYZ → CIELUV",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += luvFromXYZ(xyzs[i]!, d50).u;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toLuv(culoriXyz50[i]!).u;
          return s;
        },
        agreement: () => sample((i) => Math.abs(luvFromXYZ(xyzs[i]!, d50).v - toLuv(culoriXyz50[i]!).v)),
      },
      {
        name: "CIELAB → LCh",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += lchFromLab(labs[i]!).C;
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) s += toLch65(culoriLabs[i]!).c;
          return s;
        },
        agreement: () => sample((i) => Math.abs(lchFromLab(labs[i]!).C - toLch65(culoriLabs[i]!).c)),
      },
    ];

    const results: BenchResult[] = [];
    for (const w of workloads) {
      const [ours, theirs] = timePair(w.ours, w.theirs);
      const ratio = ours / theirs;
      results.push({
        name: `${w.name}: time ratio tristim/culori`,
        value: ratio,
        unit: "",
        target: "≤ 1",
        met: ratio <= 1,
        note: `${ours.toFixed(0)} ms against ${theirs.toFixed(0)} ms; mean |difference| ${w.agreement().toExponential(1)}`,
      });
    }
    return results;
  },
};
export default bench;
