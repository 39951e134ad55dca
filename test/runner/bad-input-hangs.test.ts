/**
 * Nothing hangs: processes a cell starts are ended with the cell process (its own process group), the command
 * never waits on pipes they hold, and an output path that cannot be written ends the command with exit 4.
 * The deadlines are generous hang guards for a loaded machine, not timing assertions.
 */
import { execFileSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { notebookFile, tempFolder, ts } from "./helpers.ts";
import { tristimCommand } from "./bad-input-helpers.ts";

const LIMIT = 240_000;

/** True while a process with this exact marker in its command line runs (zombies do not count). */
function running(marker: string): boolean {
  const out = execFileSync("ps", ["-eo", "stat=,args="], { encoding: "utf8" });
  return out.split("\n").some((l) => l.includes(marker) && !l.trim().startsWith("Z"));
}

describe("processes started by cells end with the run", () => {
  it(
    "a child inheriting the cell process's output (sleep) does not keep the command waiting",
    async () => {
      const marker = `${300 + Math.floor(Math.random() * 600)}.${process.pid}`;
      const notebook = notebookFile(
        `# Spawn\n\n${ts(`import { spawn } from "node:child_process";\nspawn("sleep", ["${marker}"], { stdio: "inherit" });\n1`)}`,
      );
      const r = await tristimCommand(["run", notebook, "--quiet"], 150_000);
      expect(r.hung).toBe(false);
      expect(r.code).toBe(EXIT.ok);
      expect(fs.existsSync(notebook.replace(/\.md$/, ".html"))).toBe(true);
      expect(running(`sleep ${marker}`)).toBe(false);
    },
    LIMIT,
  );

  it(
    "a server started in a child process that never exits is ended too",
    async () => {
      const marker = `tristim-test-server-${process.pid}-${Date.now()}`;
      const notebook = notebookFile(
        `# Server\n\n${ts(
          `import { spawn } from "node:child_process";\n` +
            `spawn(process.execPath, ["-e", "require('node:http').createServer().listen(0); // ${marker}"], { stdio: "inherit" });\n` +
            `await new Promise((r) => setTimeout(r, 300));\n1`,
        )}`,
      );
      const r = await tristimCommand(["run", notebook, "--quiet"], 150_000);
      expect(r.hung).toBe(false);
      expect(r.code).toBe(EXIT.ok);
      expect(running(marker)).toBe(false);
    },
    LIMIT,
  );
});

describe("an output path that cannot be written ends the command with exit 4", () => {
  const notebook = () => notebookFile(`# Small\n\n${ts("1")}`);

  it(
    "a path under a pseudo file system (/proc)",
    async () => {
      const r = await tristimCommand(["run", notebook(), "-o", "/proc/x/report.html"], 150_000);
      expect(r.hung).toBe(false);
      expect(r.code).toBe(EXIT.internal);
      expect(r.err).toContain("the report could not be written to /proc/x/report.html");
      expect(r.err).toContain("/proc/x");
    },
    LIMIT,
  );

  it(
    "a file as the parent folder, and a missing parent that cannot be made below a file",
    async () => {
      const folder = tempFolder();
      const file = path.join(folder, "plain.txt");
      fs.writeFileSync(file, "not a folder\n");
      for (const target of [path.join(file, "report.html"), path.join(file, "a", "b", "report.html")]) {
        const r = await tristimCommand(["run", notebook(), "-o", target], 150_000);
        expect(r.hung).toBe(false);
        expect(r.code).toBe(EXIT.internal);
        expect(r.err).toContain(`${file} is a file, not a folder`);
      }
      expect(fs.readFileSync(file, "utf8")).toBe("not a folder\n");
    },
    LIMIT,
  );

  it.skipIf(process.getuid?.() === 0)(
    "a read-only folder (skipped when running as root: root may write into any folder)",
    async () => {
      const folder = tempFolder();
      fs.chmodSync(folder, 0o555);
      try {
        const r = await tristimCommand(["run", notebook(), "-o", path.join(folder, "report.html")], 150_000);
        expect(r.hung).toBe(false);
        expect(r.code).toBe(EXIT.internal);
        expect(r.err).toContain("the report could not be written");
      } finally {
        fs.chmodSync(folder, 0o755);
      }
    },
    LIMIT,
  );
  if (process.getuid?.() === 0)
    console.log(
      `bad-input-hangs: read-only-folder check skipped: running as root (${os.userInfo().username})`,
    );
});
