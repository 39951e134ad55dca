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
