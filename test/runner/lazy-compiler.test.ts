// The TypeScript compiler (about 10 MB) is loaded only by the commands that need it, through the lazy require in
// runner/typecheck/typescript.ts. A value import of "typescript" anywhere in runner/ or cells/ would be bundled
// into the CLI that every `tristim run` parses (it once made a syntax-error run take 0.9 s instead of 0.5 s).
// The same holds for temml (450 kB, loaded by runner/report/prose-math.ts only when a report has math).
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";

const ROOT = fileURLToPath(new URL("../../", import.meta.url));

function sources(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    return e.isDirectory() ? sources(full) : /\.(ts|mjs|js)$/.test(e.name) ? [full] : [];
  });
}

describe("the compiler and the math typesetter stay out of the bundled CLI", () => {
  it.each(["typescript", "temml"])(
    "no runner or cells module imports %s as a value (type-only imports are erased)",
    (name) => {
      const valueImport = new RegExp(`^\\s*import\\s+(?!type\\b)[^;]*\\bfrom\\s+["']${name}["']`, "m");
      const offenders = [...sources(path.join(ROOT, "runner")), ...sources(path.join(ROOT, "cells"))].filter(
        (f) => valueImport.test(fs.readFileSync(f, "utf8")),
      );
      expect(offenders.map((f) => path.relative(ROOT, f))).toEqual([]);
    },
  );
});
