/**
 * The benchmark notebook (invented workload, invented data): 20 cells as a colour lab would write them. 2000
 * synthetic reflectance spectra → XYZ → CIELAB → ΔE00 against a reference (cross-checked with culori, an npm
 * import), white LEDs with CCT/Duv, a spectrum plot and two chromaticity diagrams, tables, acceptance checks and a
 * heavy loop. `plainScript` is the same code as one program for plain node (the "tristim" names from
 * cells/tristim-entry.ts, records collected and serialised as the cell process would).
 */
export const BENCH_CELLS: readonly string[] = [
  `import { differenceCiede2000 } from "culori";
function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = Math.imul(a ^ (a >>> 15), 1 | a);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
const random = prng(16);
const grid = Array.from({ length: 81 }, (_, i) => 380 + 5 * i);`,
  `// 2000 smooth invented reflectances: a sum of three broad bumps each.
const samples = Array.from({ length: 2000 }, (_, n) => {
  const bumps = [0, 1, 2].map(() => ({ mu: 380 + 400 * random(), sigma: 30 + 80 * random(), h: 0.1 + 0.5 * random() }));
  const values = grid.map((w) => Math.min(0.98, 0.03 + bumps.reduce((s, b) => s + b.h * Math.exp(-0.5 * ((w - b.mu) / b.sigma) ** 2), 0)));
  return spectrum(grid, values, { name: "sample " + (n + 1), quantity: "reflectance" });
});
console.log(samples.length + " reflectance spectra");`,
  `const colours = samples.map((s) => objectColour(s, { illuminant: "D65" }));`,
  `const labs = colours.map((c) => labFromXYZ(c.XYZ, c.white));
const reference = labs[0]!;`,
  `const deltas = labs.map((lab) => deltaE2000(reference, lab));
const meanDelta = deltas.reduce((s, d) => s + d, 0) / deltas.length;`,
  `// Cross-check 200 differences with culori (an independent implementation from npm).
const culoriDeltas = labs.slice(0, 200).map((lab) =>
  differenceCiede2000()({ mode: "lab65", l: reference.L, a: reference.a, b: reference.b }, { mode: "lab65", l: lab.L, a: lab.a, b: lab.b }),
);
const largestGap = Math.max(...culoriDeltas.map((d, i) => Math.abs(d - deltas[i]!)));`,
  `showTable(
  labs.slice(0, 12).map((lab, i) => ({ sample: samples[i]!.name, L: lab.L, a: lab.a, b: lab.b, dE: deltas[i] })),
  { caption: "The first twelve invented samples.", columns: ["sample", { key: "L", digits: 2 }, { key: "a", digits: 2 }, { key: "b", digits: 2 }, { key: "dE", label: "ΔE00", digits: 2 }] },
);`,
  `check("ΔE00 agrees with culori", largestGap, { max: 1e-6, digits: 9 });`,
  `const leds = Array.from({ length: 40 }, (_, i) =>
  phosphorWhite({ blue: { peak: 445 + i * 0.3, fwhm: 20 }, phosphor: { peak: 555 + i, fwhm: 110 }, phosphorToBlue: 2 + i * 0.05, name: "LED " + (i + 1) }),
);`,
  `const ledColours = leds.map((led) => {
  const xy = chromaticityXy(lightTristimulus(led));
  return { name: led.name, ...xy, ...cctAndDuv(xy) };
});`,
  `showFigure(spectrumPlot(leds.slice(0, 5).map((s) => ({ spectrum: s })), { title: "Five invented white LEDs" }));`,
  `showFigure(chromaticityDiagram({ title: "Invented LEDs", points: ledColours.map((c) => ({ label: c.name, x: c.x, y: c.y, group: "LEDs" })) }));`,
  `showTable(ledColours.slice(0, 10), { caption: "CCT and Duv of ten invented LEDs.", columns: ["name", { key: "x", digits: 4 }, { key: "y", digits: 4 }, { key: "cct", label: "CCT", unit: "K", digits: 0 }, { key: "duv", label: "Duv", digits: 4 }] });`,
  `for (const c of ledColours.slice(0, 5)) check(c.name + " Duv", c.duv, { min: -0.05, max: 0.05, digits: 4 });`,
  `showFigure(chromaticityDiagram({ title: "Invented samples", points: colours.slice(0, 300).map((c, i) => ({ label: "s" + i, ...chromaticityXy(c.XYZ), group: "samples" })) }));`,
  `// Heavy compute: integrate many random spectra against the grid (invented workload).
function integrate(seed: number, count: number): number {
  const r = prng(seed);
  let sum = 0;
  for (let n = 0; n < count; n++) for (let i = 0; i < 81; i++) sum += r() * Math.sin(grid[i]! / 50);
  return sum / count;
}
const heavy = [1, 2, 3].map((s) => integrate(s, 200000));`,
  `console.log("heavy", heavy.map((v) => v.toFixed(4)).join(" "));`,
  `showMarkdown("Mean ΔE00 from the first sample: **" + meanDelta.toFixed(2) + "**.");`,
  `check("mean ΔE00", meanDelta, { max: 100, digits: 2 });`,
  `show({ samples: samples.length, leds: leds.length, meanDelta });`,
];

/** The notebook file's text. */
export function benchNotebook(cells: readonly string[] = BENCH_CELLS): string {
  return (
    "---\ntitle: Runner benchmark (invented workload)\n---\n\nAll data here are invented.\n\n" +
    cells
      .map((c, i) => `## Step ${i + 1}\n\nSome prose about step ${i + 1}.\n\n\`\`\`ts\n${c}\n\`\`\`\n`)
      .join("\n")
  );
}

/** The same cells as one plain module for node (bundled by esbuild with the library entry at `entry`). */
export function plainScript(entry: string, cells: readonly string[] = BENCH_CELLS): string {
  const imports = cells.flatMap((c) => c.split("\n").filter((l) => l.startsWith("import ")));
  const bodies = cells.map((c) =>
    c
      .split("\n")
      .filter((l) => !l.startsWith("import "))
      .join("\n"),
  );
  return [
    `import * as tristimEntry from ${JSON.stringify(entry)};`,
    ...imports,
    `const records: unknown[] = [];`,
    `(globalThis as Record<symbol, unknown>)[Symbol.for("tristim.output-sink")] = (r: unknown) => void records.push(r);`,
    `const { ${[...new Set(namesUsed(bodies.join("\n")))].join(", ")} } = tristimEntry as unknown as Record<string, any>;`,
    ...bodies,
    `process.stdout.write(String(JSON.stringify(records).length) + " bytes of records\\n");`,
    `export {};`,
  ].join("\n");
}

const LIBRARY_NAMES = [
  "spectrum",
  "objectColour",
  "labFromXYZ",
  "deltaE2000",
  "showTable",
  "check",
  "phosphorWhite",
  "chromaticityXy",
  "lightTristimulus",
  "cctAndDuv",
  "showFigure",
  "spectrumPlot",
  "chromaticityDiagram",
  "showMarkdown",
  "show",
];

function namesUsed(code: string): string[] {
  return LIBRARY_NAMES.filter((n) => new RegExp(`\\b${n}\\(`).test(code));
}
