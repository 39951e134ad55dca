/**
 * The `tristim` command as a user runs it (a real process): help, exit codes, clear messages without the runner's
 * stack trace, report paths, inputs from the command line.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { notebookFile, tempFolder, ts, writeFiles } from "./helpers.ts";

const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

function tristim(args: string[], cwd?: string): { code: number | null; out: string; err: string } {
  const result = spawnSync(process.execPath, [BIN, ...args], { cwd, encoding: "utf8", timeout: 60_000 });
  return { code: result.status, out: result.stdout, err: result.stderr };
}

/** No stack frames of the runner's own code in what the user sees. */
function expectNoRunnerStack(text: string): void {
  expect(text).not.toMatch(/^\s+at .*(runner|cells)[/\\]/m);
  expect(text).not.toMatch(/node:internal/);
}

// Each test spawns the CLI several times; on a loaded machine one start takes seconds, so the budget is wide.
describe("tristim command line", { timeout: 60_000 }, () => {
  it("prints help with the commands, options, cell options and exit codes", () => {
    const { code, out } = tristim(["--help"]);
    expect(code).toBe(EXIT.ok);
    for (const word of [
      "tristim run",
      "tristim watch",
      "--output",
      "--input",
      "--time-limit",
      "--keep-going",
      "--link-assets",
      "--port",
      "hide-source",
      "no-run",
      "caption=",
      "time-limit=",
      "Exit codes",
    ]) {
      expect(out).toContain(word);
    }
    const bare = tristim([]);
    expect(bare.code).toBe(EXIT.usage);
    expect(bare.out).toContain("Usage:");
  });

  it("rejects a wrong command line with exit code 2 and a clear message", () => {
    const unknownCommand = tristim(["render", "x.md"]);
    expect(unknownCommand.code).toBe(EXIT.usage);
    expect(unknownCommand.err).toContain('unknown command "render"');
    const unknownOption = tristim(["run", "x.md", "--frobnicate"]);
    expect(unknownOption.code).toBe(EXIT.usage);
    expect(unknownOption.err).toContain("--frobnicate");
    const badLimit = tristim(["run", "x.md", "--time-limit", "soon"]);
    expect(badLimit.code).toBe(EXIT.usage);
    expect(badLimit.err).toContain('"soon" is not a time limit');
    for (const r of [unknownCommand, unknownOption, badLimit]) expectNoRunnerStack(r.err);
  });

  it("reports a missing notebook and a broken one with exit code 1, keeping the previous report", () => {
    const folder = tempFolder();
    writeFiles(folder, { "broken.md": "# B\n\n```ts\nconst a = 1;\n", "broken.html": "previous report" });
    const missing = tristim(["run", "nope.md"], folder);
    expect(missing.code).toBe(EXIT.notebookFailed);
    expect(missing.err).toContain("nope.md: no such file");
    const broken = tristim(["run", "broken.md"], folder);
    expect(broken.code).toBe(EXIT.notebookFailed);
    expect(broken.err).toContain("broken.md:3: the code fence opened here is never closed");
    expect(fs.readFileSync(path.join(folder, "broken.html"), "utf8")).toBe("previous report");
    expectNoRunnerStack(missing.err + broken.err);
  });

  it("runs a notebook with inputs from the command line and writes the report where -o says", () => {
    const file = notebookFile(
      "---\ninputs:\n  lamp: A\n  n: 1\n---\n" + ts("console.log(`lamp=${inputs.lamp} n=${inputs.n + 1}`)"),
    );
    const target = path.join(path.dirname(file), "out", "report.html");
    const { code, out } = tristim(["run", file, "-o", target, "--input", "lamp=F11", "--input", "n=41"]);
    expect(code).toBe(EXIT.ok);
    expect(out).toContain("1 cell ran");
    expect(fs.readFileSync(target, "utf8")).toContain("lamp=F11 n=42");
    const unknown = tristim(["run", file, "--input", "lamb=F11"]);
    expect(unknown.code).toBe(EXIT.usage);
    expect(unknown.err).toContain('has no input named "lamb"');
  });

  it("exits with 1 when a cell fails, names notebook file:line:column, and still writes the report", () => {
    const folder = tempFolder();
    writeFiles(folder, {
      "a.md":
        "# A\n\n" +
        ts("const x = 1;\nthrow new RangeError('wavelength 2000 nm is outside 360-830 nm');") +
        ts("1"),
      "b.md": ts("1"),
    });
    const { code, err, out } = tristim(["run", "a.md", "b.md", "-o", "reports"], folder);
    expect(code).toBe(EXIT.notebookFailed);
    expect(err).toContain("a.md:5:7: cell 1 failed: RangeError: wavelength 2000 nm is outside 360-830 nm");
    expect(err).toContain("> 5 | throw new RangeError");
    expect(err).toContain("cell 2 not run");
    expect(out).toContain("b.md: 1 cell ran");
    expect(fs.existsSync(path.join(folder, "reports", "a.html"))).toBe(true);
    expect(fs.existsSync(path.join(folder, "reports", "b.html"))).toBe(true);
    expectNoRunnerStack(err);
  });
});
