/**
 * Access to the independent reference tables in /work/shared/reference (see the README there for provenance).
 * Tests read them in place and never copy them; when the folder is absent the tests that need it are skipped.
 */
import { existsSync, readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";

/**
 * The reference folder beside the repository: <repo>/../shared/reference/ (resolved from test/lib/), or the folder
 * named by TRISTIM_REFERENCE_DIR (e.g. to check that the tests skip cleanly when it is missing).
 */
export const REFERENCE_DIR = process.env.TRISTIM_REFERENCE_DIR
  ? process.env.TRISTIM_REFERENCE_DIR.replace(/\/?$/, "/")
  : fileURLToPath(new URL("../../../shared/reference/", import.meta.url));

/** True when the reference folder is present (tests that read it are skipped otherwise). */
export const HAVE_REFERENCE = existsSync(REFERENCE_DIR) && existsSync(REFERENCE_DIR + "README.md");

/** The message a skipped reference test shows. */
export const NO_REFERENCE = `reference data folder ${REFERENCE_DIR} is absent; skipping checks against the CIE tables`;

export interface CsvTable {
  readonly header: string[];
  readonly rows: string[][];
  /** Column by header name, as numbers (NaN where the file has NaN or an empty cell). */
  column(name: string): number[];
}

/** Reads one CSV file of the reference folder (simple comma-separated, quoted fields allowed). */
export function readReferenceCsv(file: string): CsvTable {
  const text = readFileSync(REFERENCE_DIR + file, "utf8");
  const lines = text.split("\n").filter((l) => l.length > 0);
  const parse = (line: string): string[] => {
    const out: string[] = [];
    let cur = "";
    let quoted = false;
    for (const ch of line) {
      if (ch === '"') quoted = !quoted;
      else if (ch === "," && !quoted) {
        out.push(cur);
        cur = "";
      } else cur += ch;
    }
    out.push(cur);
    return out;
  };
  const header = parse(lines[0]!);
  const rows = lines.slice(1).map(parse);
  return {
    header,
    rows,
    column(name: string): number[] {
      const i = header.indexOf(name);
      if (i < 0) throw new Error(`${file} has no column "${name}"; it has ${header.join(", ")}`);
      return rows.map((r) => (r[i] === "" ? NaN : Number(r[i])));
    },
  };
}
