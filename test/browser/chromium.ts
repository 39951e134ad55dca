// The one Chromium lookup of the browser tests: CHROMIUM_PATH, else Debian's chromium (installed by .ci/run).
import fs from "node:fs";

/** Path of a Chromium executable, or undefined when none is installed. */
export const CHROMIUM: string | undefined = [
  process.env.CHROMIUM_PATH,
  "/usr/bin/chromium",
  "/usr/bin/chromium-browser",
].find((p): p is string => !!p && fs.existsSync(p));

/** Why a browser test is skipped, for its title and the console. */
export const NO_CHROMIUM =
  "no Chromium found: set CHROMIUM_PATH or install Debian's chromium (apt-get install -y chromium, as .ci/run does)";

/** Launches the Chromium found above headless, with no GPU and no background networking (as the brief says). */
export async function launchChromium(): Promise<import("playwright-core").Browser> {
  const { chromium } = await import("playwright-core");
  if (!CHROMIUM) throw new Error(NO_CHROMIUM);
  return chromium.launch({
    executablePath: CHROMIUM,
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking"],
  });
}

/** Writes the report of `notebook` to `report` as a user does: the runner's CLI, from the package root. */
export async function reportByCli(notebook: string, report: string): Promise<void> {
  const { execFile } = await import("node:child_process");
  const { promisify } = await import("node:util");
  const root = new URL("../../", import.meta.url).pathname;
  await promisify(execFile)(process.execPath, [`${root}runner/bin.mjs`, "run", notebook, "-o", report], {
    cwd: root,
    timeout: 120_000,
  });
}
