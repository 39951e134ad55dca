/** Helpers for the bad-input tests: the `tristim` command run as a user runs it, with a generous deadline. */
import { spawn } from "node:child_process";
import { fileURLToPath } from "node:url";

export const BIN = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));

/** What a run of the command gave; `hung` is true when it had to be killed at the deadline. */
export interface CommandResult {
  readonly code: number | null;
  readonly out: string;
  readonly err: string;
  readonly hung: boolean;
}

/**
 * Runs `tristim args...` and resolves when the command has exited and closed its output (so a child that holds
 * the output pipes open counts as a hang). The deadline is generous (a loaded 2-core machine); it is a hang guard,
 * not a timing assertion.
 */
export function tristimCommand(
  args: readonly string[],
  deadlineMs = 120_000,
  env: NodeJS.ProcessEnv = {},
): Promise<CommandResult> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [BIN, ...args], {
      stdio: ["ignore", "pipe", "pipe"],
      env: { ...process.env, ...env },
    });
    let out = "";
    let err = "";
    let hung = false;
    child.stdout.on("data", (c: Buffer) => (out += c.toString("utf8")));
    child.stderr.on("data", (c: Buffer) => (err += c.toString("utf8")));
    const timer = setTimeout(() => {
      hung = true;
      child.kill("SIGKILL");
      child.stdout.destroy();
      child.stderr.destroy();
      resolve({ code: child.exitCode, out, err, hung });
    }, deadlineMs);
    child.on("close", (code) => {
      clearTimeout(timer);
      if (!hung) resolve({ code, out, err, hung });
    });
  });
}
