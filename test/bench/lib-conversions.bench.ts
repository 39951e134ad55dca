/**
 * Speed of the colour-space conversions against culori (the general-purpose reference library) on the same
 * 1 000 000 invented colours, each pair of workloads doing the same conversion:
 *  - sRGB → XYZ (xyzFromRgb; culori rgb → xyz65), XYZ → sRGB (rgbFromXYZ; culori xyz65 → rgb),
 *  - XYZ → CIELAB (labFromXYZ, white of sRGB; culori xyz65 → lab65), CIELAB → XYZ (xyzFromLab; lab65 → xyz65),
 *  - sRGB → CIELAB (xyzFromRgb then labFromXYZ; culori rgb → lab65), CIELAB → sRGB (the reverse; lab65 → rgb),
 *  - XYZ → CIELUV (luvFromXYZ, D50 white of culori; culori xyz50 → luv), CIELAB → LCh (lchFromLab; lab65 → lch65).
 * culori's XYZ is on the Y = 1 scale, ours on Y = 100; the inputs are built for each before timing. Each line
 * also reports the mean difference between the two libraries' results (on the ours scale). Every loop adds up all
 * three fields of each result, so that neither library's work can be dropped by the compiler as unused (a loop that
 * read one field let V8 skip the other two once a conversion inlined whole).
 * Target (issue 16): not slower than culori, i.e. a time ratio ours/culori ≤ 1. Each workload runs once to warm
 * up, then the median of TRISTIM_BENCH_REPEATS runs (default 5) is reported; the two libraries' runs alternate, each
 * going first in turn. TRISTIM_BENCH_ONLY (words separated by commas) times only the workloads whose name contains
 * one of them, e.g. TRISTIM_BENCH_ONLY="sRGB → CIELAB".
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
const REPEATS = Math.max(1, Number(process.env.TRISTIM_BENCH_REPEATS ?? 5));
const ONLY = (process.env.TRISTIM_BENCH_ONLY ?? "")
  .split(",")
  .map((w) => w.trim())
  .filter((w) => w !== "");

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

// Every workload's sum ends here, so that no loop's result is unused.
let sink = 0;

/** Times two workloads alternately, each going first in turn (after one warm-up each); median times in ms. */
function timePair(ours: () => number, theirs: () => number): [number, number] {
  sink += ours();
  sink += theirs();
  const a: number[] = [],
    b: number[] = [];
  const once = (f: () => number, into: number[]) => {
    const t0 = performance.now();
    sink += f();
    into.push(performance.now() - t0);
  };
  for (let i = 0; i < REPEATS; i++) {
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
          for (let i = 0; i < COLOURS; i++) {
            const c = xyzFromRgb(rgbs[i]!, srgb);
            s += c.X + c.Y + c.Z;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toXyz65(culoriRgbs[i]!);
            s += c.x + c.y + c.z;
          }
          return s;
        },
        agreement: () =>
          sample((i) => Math.abs(xyzFromRgb(rgbs[i]!, srgb).X - 100 * toXyz65(culoriRgbs[i]!).x)),
      },
      {
        name: "XYZ → sRGB",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = rgbFromXYZ(xyzs[i]!, srgb);
            s += c.r + c.g + c.b;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toRgb(culoriXyz65[i]!);
            s += c.r + c.g + c.b;
          }
          return s;
        },
        agreement: () => sample((i) => Math.abs(rgbFromXYZ(xyzs[i]!, srgb).r - toRgb(culoriXyz65[i]!).r)),
      },
      {
        name: "XYZ → CIELAB",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = labFromXYZ(xyzs[i]!, white);
            s += c.L + c.a + c.b;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toLab65(culoriXyz65[i]!);
            s += c.l + c.a + c.b;
          }
          return s;
        },
        agreement: () => sample((i) => Math.abs(labFromXYZ(xyzs[i]!, white).b - toLab65(culoriXyz65[i]!).b)),
      },
      {
        name: "CIELAB → XYZ",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = xyzFromLab(labs[i]!, white);
            s += c.X + c.Y + c.Z;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toXyz65(culoriLabs[i]!);
            s += c.x + c.y + c.z;
          }
          return s;
        },
        agreement: () =>
          sample((i) => Math.abs(xyzFromLab(labs[i]!, white).Z - 100 * toXyz65(culoriLabs[i]!).z)),
      },
      {
        name: "sRGB → CIELAB",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = labFromXYZ(xyzFromRgb(rgbs[i]!, srgb), white);
            s += c.L + c.a + c.b;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toLab65(culoriRgbs[i]!);
            s += c.l + c.a + c.b;
          }
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
          for (let i = 0; i < COLOURS; i++) {
            const c = rgbFromXYZ(xyzFromLab(labs[i]!, white), srgb);
            s += c.r + c.g + c.b;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toRgb(culoriLabs[i]!);
            s += c.r + c.g + c.b;
          }
          return s;
        },
        agreement: () =>
          sample((i) => Math.abs(rgbFromXYZ(xyzFromLab(labs[i]!, white), srgb).g - toRgb(culoriLabs[i]!).g)),
      },
      {
        name: "XYZ → CIELUV",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = luvFromXYZ(xyzs[i]!, d50);
            s += c.L + c.u + c.v;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toLuv(culoriXyz50[i]!);
            s += c.l + c.u + c.v;
          }
          return s;
        },
        agreement: () => sample((i) => Math.abs(luvFromXYZ(xyzs[i]!, d50).v - toLuv(culoriXyz50[i]!).v)),
      },
      {
        name: "CIELAB → LCh",
        ours: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = lchFromLab(labs[i]!);
            s += c.L + c.C + c.h;
          }
          return s;
        },
        theirs: () => {
          let s = 0;
          for (let i = 0; i < COLOURS; i++) {
            const c = toLch65(culoriLabs[i]!);
            s += c.l + c.c + (c.h ?? 0); // culori leaves h out for a grey
          }
          return s;
        },
        agreement: () => sample((i) => Math.abs(lchFromLab(labs[i]!).C - toLch65(culoriLabs[i]!).c)),
      },
    ];

    const results: BenchResult[] = [];
    for (const w of workloads) {
      if (ONLY.length > 0 && !ONLY.some((word) => w.name.includes(word))) continue;
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
    if (!Number.isFinite(sink)) throw new Error(`a workload's sum is not finite (${sink})`);
    return results;
  },
};
export default bench;
