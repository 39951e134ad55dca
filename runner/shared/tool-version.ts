/** The tool's name and version, from package.json. */
import fs from "node:fs";
import path from "node:path";
import { PACKAGE_ROOT } from "./package-root.ts";

let cached: { name: string; version: string } | undefined;

/** { name: "tristim", version } of this installation. */
export function toolVersion(): { name: string; version: string } {
  cached ??= (() => {
    const pkg = JSON.parse(fs.readFileSync(path.join(PACKAGE_ROOT, "package.json"), "utf8")) as {
      name: string;
      version: string;
    };
    return { name: pkg.name, version: pkg.version };
  })();
  return cached;
}
