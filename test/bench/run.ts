/**
 * `npm run bench`: runs every test/bench/*.bench.ts module (see bench.ts for the contract) and prints the results.
 * Arguments filter the modules by file name. Exits with 1 when a result misses its target.
 */
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import type { Bench, BenchResult } from "./bench.ts";

const folder = path.dirname(fileURLToPath(import.meta.url));
const filters = process.argv.slice(2);
const modules = fs
  .readdirSync(folder)
  .filter((f) => f.endsWith(".bench.ts"))
  .filter((f) => filters.length === 0 || filters.some((w) => f.includes(w)))
  .sort();

if (modules.length === 0) {
  console.error(
    `no benchmark modules${filters.length ? ` matching ${filters.join(", ")}` : ""} in ${folder}`,
  );
  process.exit(2);
}

let missed = 0;
for (const file of modules) {
  const bench = (await import(pathToFileURL(path.join(folder, file)).href)).default as Bench;
  console.log(`\n${bench.name} (${file})`);
  let results: BenchResult[];
  try {
    results = await bench.run();
  } catch (e) {
    console.log(`  failed: ${(e as Error).stack ?? e}`);
    missed++;
    continue;
  }
  const width = Math.max(...results.map((r) => r.name.length));
  for (const r of results) {
    const value = `${r.value < 10 ? r.value.toFixed(2) : r.value.toFixed(0)} ${r.unit}`;
    const target = r.target ? `  target ${r.target}: ${r.met ? "met" : "MISSED"}` : "";
    if (r.target && !r.met) missed++;
    console.log(`  ${r.name.padEnd(width)}  ${value.padStart(12)}${target}${r.note ? `  (${r.note})` : ""}`);
  }
}
console.log(missed ? `\n${missed} target(s) missed` : "\nall targets met");
process.exitCode = missed ? 1 : 0;
