/**
 * Speed of the spectral-table reader on a ~50 MB CSV (invented values: 150 samples, 300–1100 nm every 0.02 nm, six
 * decimals), generated in a temporary folder, against csv-parse alone (parsing the same file into strings, the
 * least any CSV reader must do). The reader's time includes reading the bytes, decoding, finding the header, every
 * inference, the numbers and the spectra; csv-parse's includes reading the file as UTF-8 text and parsing it.
 * Target (the brief's): the reader within 1.5× of csv-parse's time. Each runs once to warm up, then the median of
 * three runs is reported.
 */
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { parse } from "csv-parse/sync";
import { readSpectralTable, withoutMethodNotes } from "../../lib/index.ts";
import { median, type Bench, type BenchResult } from "./bench.ts";

const SAMPLES = 150;
const START = 300;
const STEP = 0.02;
const ROWS = 40_001;

function makeFile(path: string): void {
  let seed = 12345;
  const next = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
  const parts: string[] = [
    "# INVENTED benchmark data, not a measurement",
    "Instrument: invented bench spectrometer",
    ["wavelength_nm", ...Array.from({ length: SAMPLES }, (_, i) => `sample ${i + 1}`)].join(","),
  ];
  for (let r = 0; r < ROWS; r++) {
    const row = [(START + r * STEP).toFixed(2)];
    for (let s = 0; s < SAMPLES; s++) row.push(next().toFixed(6));
    parts.push(row.join(","));
  }
  writeFileSync(path, parts.join("\n") + "\n");
}

function timeMs(f: () => unknown): number {
  f(); // warm-up
  const samples: number[] = [];
  for (let i = 0; i < 3; i++) {
    const t0 = performance.now();
    f();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

const bench: Bench = {
  name: "Reading measurement files",
  async run(): Promise<BenchResult[]> {
    const dir = mkdtempSync(join(tmpdir(), "tristim-bench-files-"));
    try {
      const path = join(dir, "large-spectral-table.csv");
      makeFile(path);
      const mb = statSync(path).size / 1e6;
      let check = 0;
      const readerMs = timeMs(() => {
        const r = withoutMethodNotes(() => readSpectralTable(path, { quantity: "reflectance" }));
        check = r.spectra.length * r.spectra[0]!.values.length;
      });
      if (check !== SAMPLES * ROWS)
        throw new Error(`the reader gave ${check} values, expected ${SAMPLES * ROWS}`);
      const csvParseMs = timeMs(() =>
        parse(readFileSync(path, "utf8"), { comment: "#", relax_column_count: true }),
      );
      const ratio = readerMs / csvParseMs;
      return [
        { name: "file size", value: mb, unit: "MB" },
        {
          name: "spectral-table reader",
          value: mb / (readerMs / 1000),
          unit: "MB/s",
          note: `${(readerMs / 1000).toFixed(2)} s`,
        },
        {
          name: "csv-parse alone",
          value: mb / (csvParseMs / 1000),
          unit: "MB/s",
          note: `${(csvParseMs / 1000).toFixed(2)} s`,
        },
        {
          name: "time ratio reader / csv-parse",
          value: ratio,
          unit: "×",
          target: "≤ 1.5",
          met: ratio <= 1.5,
        },
      ];
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  },
};

export default bench;
