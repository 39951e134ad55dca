/**
 * Re-runnable from the report alone (issue 18): a reproducible report carries its notebook and the files its cells
 * read or imported; `tristim restore` writes them into a new folder, and `tristim run --reproducible` there gives the
 * same report byte for byte. A file over the size limit is named as missing with its SHA-256 (recomputed here with
 * node:crypto), and restore never overwrites a file. Invented data.
 */
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { readCarriedSources } from "../../runner/report/carried-sources.ts";
import { CARRIED_FILE_LIMIT } from "../../runner/shared/carried-files.ts";
import { tempFolder, ts, writeFiles } from "./helpers.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

function tristim(args: string[], cwd: string): { code: number | null; out: string; err: string } {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 240_000 });
  return { code: result.status, out: result.stdout, err: result.stderr };
}

const NOTEBOOK =
  "---\ntitle: Tile readings (invented)\ninputs:\n  data: data/tiles.csv\n  scale: 1\n---\n\n" +
  ts(
    'import fs from "node:fs";\nimport { mean } from "./helpers/stats.ts";\n' +
      'const values = fs.readFileSync(inputs.data, "utf8").trim().split("\\n").map(Number);\n' +
      'show(mean(values) * inputs.scale);\ncheck("mean", mean(values) * inputs.scale, { min: 0, max: 100 });',
  );

describe("tristim restore", () => {
  it("writes back what a report carries, and a run there gives the same report byte for byte", () => {
    const folder = tempFolder("tristim-restore-");
    writeFiles(folder, {
      "lab/tiles.md": NOTEBOOK,
      "lab/data/tiles.csv": "12.5\n13.25\n11\n",
      "lab/helpers/stats.ts":
        "export const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length;\n",
    });
    const first = tristim(
      ["run", "lab/tiles.md", "--reproducible", "--input", "scale=2", "-o", "report.html"],
      folder,
    );
    expect(first.code).toBe(EXIT.ok);
    const report = fs.readFileSync(path.join(folder, "report.html"), "utf8");
    expect(report).toContain("tristim restore &lt;this report&gt; &lt;new folder&gt;");
    expect(report).toContain("<code>tristim run --reproducible tiles.md --input scale=2</code>");

    const restored = tristim(["restore", "report.html", "again"], folder);
    expect(restored.code).toBe(EXIT.ok);
    expect(restored.out).toContain("3 files restored");
    expect(restored.out).toContain("tristim run --reproducible tiles.md --input scale=2");
    expect(fs.readFileSync(path.join(folder, "again/data/tiles.csv"), "utf8")).toBe("12.5\n13.25\n11\n");

    const again = tristim(
      ["run", "--reproducible", "tiles.md", "--input", "scale=2"],
      path.join(folder, "again"),
    );
    expect(again.code).toBe(EXIT.ok);
    expect(fs.readFileSync(path.join(folder, "again/tiles.html"))).toEqual(
      fs.readFileSync(path.join(folder, "report.html")),
    );

    // Nothing is overwritten: a second restore into the same folder is refused, and the files stay as they are.
    fs.writeFileSync(path.join(folder, "again/data/tiles.csv"), "changed\n");
    const twice = tristim(["restore", "report.html", "again"], folder);
    expect(twice.code).toBe(EXIT.usage);
    expect(twice.err).toContain("exists already");
    expect(fs.readFileSync(path.join(folder, "again/data/tiles.csv"), "utf8")).toBe("changed\n");
  }, 240_000);

  it("names a file over the size limit as missing, by SHA-256, in the report and when restoring", () => {
    const folder = tempFolder("tristim-restore-big-");
    const big = Array.from({ length: Math.ceil(CARRIED_FILE_LIMIT / 2) + 10 }, (_, i) => String(i % 9)).join(
      "\n",
    );
    writeFiles(folder, {
      "tiles.md": NOTEBOOK,
      "data/tiles.csv": big,
      "helpers/stats.ts": "export const mean = (v: number[]) => v.reduce((a, b) => a + b, 0) / v.length;\n",
    });
    expect(Buffer.byteLength(big)).toBeGreaterThan(CARRIED_FILE_LIMIT);
    expect(tristim(["run", "tiles.md", "--reproducible"], folder).code).toBe(EXIT.ok);
    const html = fs.readFileSync(path.join(folder, "tiles.html"), "utf8");
    const hash = createHash("sha256").update(big).digest("hex");
    const sources = readCarriedSources(html);
    expect(sources.files.find((f) => f.path === "data/tiles.csv")).toEqual({
      path: "data/tiles.csv",
      sha256: hash,
      missing: "larger than 1 MiB",
    });
    expect(html).toContain("<code>data/tiles.csv</code> (larger than 1 MiB)");
    const restored = tristim(["restore", "tiles.html", "out"], folder);
    expect(restored.code).toBe(EXIT.notebookFailed);
    expect(restored.err).toContain(`not in the report: data/tiles.csv (larger than 1 MiB; SHA-256 ${hash})`);
    expect(fs.existsSync(path.join(folder, "out/helpers/stats.ts"))).toBe(true);
    expect(fs.existsSync(path.join(folder, "out/data/tiles.csv"))).toBe(false);
  }, 240_000);
});
