/**
 * The provenance appendix (SHA-256 of the notebook and of every file a cell read or imported, relative paths,
 * versions, date, durations, inputs and where they came from) and --reproducible: two runs give identical bytes.
 * SHA-256 reference: FIPS 180-2, Appendix B.1 — SHA-256("abc") = ba7816bf…f20015ad.
 */
import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { readEmbeddedRunRecord } from "../../runner/report/embedded-run-record.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import { inInstalledPackage } from "../../runner/compile/compile-cell.ts";
import { runDocument } from "../../runner/execute/run-notebook.ts";
import { readNotebook } from "../../runner/parse/parse-notebook.ts";
import { runText, tempFolder, ts, writeFiles } from "./helpers.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));
const ABC_SHA256 = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"; // FIPS 180-2, B.1

function tristim(args: string[], cwd?: string): { code: number | null; out: string; err: string } {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 60_000 });
  return { code: result.status, out: result.stdout, err: result.stderr };
}

describe("the provenance appendix", () => {
  it("lists files read and imported with their SHA-256, relative to the notebook, and where each input came from", async () => {
    const { document, run } = await runText(
      "---\ninputs:\n  lamp: A\n  n: 1\n---\n# Lamp\n\n" +
        ts(
          "import fs from 'node:fs';\nimport { scale } from './lib/helper.ts';\nconst t = fs.readFileSync('data/abc.txt', 'utf8');\nscale(inputs.n)",
        ),
      { inputs: { n: "3" } },
      { "data/abc.txt": "abc", "lib/helper.ts": "export const scale = (n: number): number => 2 * n;\n" },
    );
    expect(run.cells[0]!.status).toBe("ok");
    const html = renderReport(document, run);
    const appendix = html.slice(html.indexOf('<section class="run-details"'));
    expect(appendix).toContain(
      `<td class="file-path">data/abc.txt</td><td><code class="hash">${ABC_SHA256}</code>`,
    );
    const helper = fs.readFileSync(path.join(path.dirname(document.path), "lib/helper.ts"));
    expect(appendix).toContain(
      `lib/helper.ts <span class="file-how">imported</span></td><td><code class="hash">${createHash("sha256").update(helper).digest("hex")}`,
    );
    expect(appendix).toContain(
      `SHA-256 ${createHash("sha256").update(fs.readFileSync(document.path)).digest("hex")}`,
    );
    expect(appendix).toContain(
      "<td><code>n</code></td><td><code>3</code></td><td>the command line (--input)</td>",
    );
    expect(appendix).toContain(
      "<td><code>lamp</code></td><td><code>&quot;A&quot;</code></td><td>the notebook&#39;s default</td>",
    );
    expect(appendix).toContain(`Node.js ${process.version}`);
    expect(appendix).toContain("Run started");
    expect(appendix).toMatch(/<th class="num">Duration<\/th>/);
    expect(appendix).not.toContain("/tmp");
  });

  it("a reproducible report leaves out the date and every duration", async () => {
    const { document, run } = await runText(ts("1 + 1"), { reproducible: true });
    const html = renderReport(document, run);
    expect(html).not.toContain(run.startedAt.slice(0, 10));
    expect(html).not.toContain("Run started");
    expect(html).not.toContain("Duration");
    expect(html).toContain("this is a reproducible report");
  });
});

describe("tristim run --reproducible", () => {
  it("gives byte-identical reports for two runs (compared with diff), with figures, checks, cautions, reads and an error", () => {
    const folder = tempFolder();
    writeFiles(folder, {
      "nb.md":
        "---\ntitle: Same bytes\ninputs:\n  limit: 1\n---\n# Same bytes\n\n" +
        ts(
          "import fs from 'node:fs';\nconst v = Number(fs.readFileSync('data/v.txt', 'utf8'));\ncheck('v', v, { max: inputs.limit });\nshow({ category: 1, caution: 'Informative only.' });\nshowFigure({ data: [{ type: 'scatter', x: [1, 2], y: [v, 2 * v] }] }, 'v');",
        ) +
        ts("import { boom } from './helper.ts';\nboom()", "may-fail"),
      "data/v.txt": "2.5",
      "helper.ts": "export function boom(): never {\n  throw new RangeError('out of range');\n}\n",
    });
    const first = tristim(
      ["run", "nb.md", "--reproducible", "--link-assets", "--input", "limit=2", "-o", "first.html"],
      folder,
    );
    const second = tristim(
      ["run", "nb.md", "--reproducible", "--link-assets", "--input", "limit=2", "-o", "second.html"],
      folder,
    );
    expect(first.code).toBe(EXIT.checkFailed);
    expect(second.code).toBe(EXIT.checkFailed);
    const diff = spawnSync("diff", ["first.html", "second.html"], { cwd: folder, encoding: "utf8" });
    expect(diff.stdout).toBe("");
    expect(diff.status).toBe(0);
    const html = fs.readFileSync(path.join(folder, "first.html"), "utf8");
    // It is a full report: the failed check, the caution, the figure and the error from the imported file.
    expect(html).toContain("1 of 1 acceptance check failed");
    expect(html).toContain("This report contains a caution");
    expect(html).toContain('class="plot-figure"');
    expect(html).toContain("RangeError: out of range");
    expect(html).not.toContain(new Date().toISOString().slice(0, 10));
    // The embedded run record says the same as the command: exit code 3, and no wall-clock value.
    const record = readEmbeddedRunRecord(html);
    expect(record.exitCode).toBe(first.code);
    expect(record.reproducible).toBe(true);
    expect(record).not.toHaveProperty("startedAt");
    expect(record.cells.map((c) => [c.status, c.durationMs])).toEqual([
      ["ok", undefined],
      ["failed", undefined],
    ]);
    expect(record.inputs).toEqual([{ name: "limit", value: 2, setBy: "--input" }]);
    // The error is placed at the notebook line that called into the helper (line 17: `boom()`).
    expect(record.cells[1]!.error).toMatchObject({
      name: "RangeError",
      message: "out of range",
      location: { file: "nb.md", line: 17 },
    });

    // Without the option the report carries the date and durations.
    const plain = tristim(
      ["run", "nb.md", "--link-assets", "--input", "limit=2", "-o", "plain.html"],
      folder,
    );
    expect(plain.code).toBe(EXIT.checkFailed);
    expect(fs.readFileSync(path.join(folder, "plain.html"), "utf8")).toContain("Run started");
  }, 120_000);

  it("lists the files the cells wrote with their SHA-256, and a file read back after writing it is not an input", async () => {
    // SHA-256 of "abc": the worked example of FIPS 180-2, Appendix B.1.
    const { document, run } = await runText(
      "# Writes\n\n" +
        ts(
          'import fs from "node:fs";\nfs.mkdirSync("out", { recursive: true });\nfs.writeFileSync("out/abc.txt", "abc");',
        ) +
        ts('import fs from "node:fs";\nfs.readFileSync("out/abc.txt", "utf8")'),
    );
    expect(run.filesWritten?.map((f) => [path.basename(f.path), f.sha256, f.cells])).toEqual([
      ["abc.txt", "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", [0]],
    ]);
    expect(run.filesRead.map((f) => path.basename(f.path))).not.toContain("abc.txt");
    const html = renderReport(document, run);
    const written = html.slice(html.indexOf("<h3>Files written by the cells</h3>"));
    expect(written).toContain("out/abc.txt");
    expect(written).toContain("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });
});

describe("which imported files are the notebook's own", () => {
  it("leaves out installed packages, also for a notebook kept below a node_modules folder", () => {
    const p = path.sep;
    const at = (...parts: string[]) => [""].concat(parts).join(p);
    expect(inInstalledPackage(at("w", "node_modules", "culori", "src", "index.js"), at("w", "nb"))).toBe(
      true,
    );
    expect(inInstalledPackage(at("w", "nb", "node_modules", "x", "i.js"), at("w", "nb"))).toBe(true);
    // A notebook in node_modules/.cache imports culori as ../../culori/src/index.js: still a package file.
    const cached = at("w", "node_modules", ".cache", "nb");
    expect(inInstalledPackage(at("w", "node_modules", "culori", "src", "index.js"), cached)).toBe(true);
    expect(inInstalledPackage(at("w", "node_modules", ".cache", "nb", "helper.ts"), cached)).toBe(false);
    expect(inInstalledPackage(at("w", "nb", "lib", "helper.ts"), at("w", "nb"))).toBe(false);
  });

  it("lists no culori file among the imports of a notebook kept in node_modules/.cache", async () => {
    const cache = path.join(fileURLToPath(new URL("../../node_modules/.cache", import.meta.url)));
    fs.mkdirSync(cache, { recursive: true });
    const folder = fs.mkdtempSync(path.join(cache, "tristim-provenance-"));
    try {
      writeFiles(folder, {
        "nb.md":
          "# Packages (invented)\n\n" +
          ts(
            'import { converter } from "culori";\nimport { k } from "./helper.ts";\nconsole.log(typeof converter, k);',
          ),
        "helper.ts": "export const k = 2;\n",
      });
      const document = readNotebook(path.join(folder, "nb.md"));
      const run = await runDocument(document);
      expect(run.cells[0]!.status).toBe("ok");
      expect(run.filesRead.map((f) => path.basename(f.path))).toEqual(["helper.ts"]);
    } finally {
      fs.rmSync(folder, { recursive: true, force: true });
    }
  });
});
