#!/usr/bin/env node
// The `tristim` command. The sources are TypeScript and there is no build step: on first use (and whenever a file
// in runner/ or cells/ changes) this launcher has esbuild bundle runner/cli/cli.ts into the package's
// node_modules/.cache/tristim/, and imports that; node starts it several times faster than through tsx's loader
// (measured: about 0.25 s against 0.9 s). Where the cache cannot be written, or with TRISTIM_TSX=1, it registers tsx
// and imports the TypeScript directly.
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");

async function loadCli(argv) {
  if (process.env.TRISTIM_TSX !== "1") {
    try {
      const bundles = await cachedBundle();
      // `run` starts its cell process first (early-start.ts), then loads the rest of the CLI.
      if (argv[0] === "run") await (await import(pathToFileURL(bundles.early).href)).startEarly(argv);
      return await import(pathToFileURL(bundles.cli).href);
    } catch (error) {
      if (process.env.TRISTIM_DEBUG) console.error("tristim: bundled start failed, using tsx:", error);
    }
  }
  const { register } = await import("tsx/esm/api");
  register();
  return import("./cli/cli.ts");
}

/** Paths of the bundled CLI (and its early start) for the current sources, building them when missing. */
async function cachedBundle() {
  const hash = createHash("sha256").update(process.version);
  const walk = (dir) => {
    for (const entry of fs
      .readdirSync(dir, { withFileTypes: true })
      .sort((a, b) => (a.name < b.name ? -1 : 1))) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) walk(full);
      else {
        const s = fs.statSync(full);
        hash.update(`${full}\0${s.size}\0${s.mtimeMs}\n`);
      }
    }
  };
  walk(path.join(root, "runner"));
  walk(path.join(root, "cells"));
  for (const f of ["package.json", "package-lock.json"]) {
    try {
      const s = fs.statSync(path.join(root, f));
      hash.update(`${f}\0${s.size}\0${s.mtimeMs}\n`);
    } catch {}
  }
  const folder = path.join(root, "node_modules", ".cache", "tristim");
  const file = path.join(folder, `cli-${hash.digest("hex").slice(0, 16)}`);
  const bundles = { cli: path.join(file, "cli.mjs"), early: path.join(file, "early-start.mjs") };
  if (fs.existsSync(bundles.cli)) return bundles;
  const esbuild = await import("esbuild");
  fs.mkdirSync(folder, { recursive: true });
  const temporary = `${file}.${process.pid}.tmp`;
  // The CLI's npm dependencies (markdown-it, yaml, highlight.js, acorn) are bundled in: node loads one file instead
  // of hundreds. esbuild stays external (it runs its own binary).
  await esbuild.build({
    entryPoints: [
      path.join(root, "runner", "cli", "cli.ts"),
      path.join(root, "runner", "cli", "early-start.ts"),
    ],
    bundle: true,
    external: ["esbuild"],
    platform: "node",
    format: "esm",
    target: "node20",
    outdir: temporary,
    outExtension: { ".js": ".mjs" },
    logLevel: "silent",
    banner: {
      js: 'import { createRequire as __tristimRequire } from "node:module"; const require = __tristimRequire(import.meta.url);',
    },
    plugins: [keepModuleUrls],
  });
  try {
    fs.renameSync(temporary, file);
  } catch {
    fs.rmSync(temporary, { recursive: true, force: true }); // another start built the same bundles
  }
  for (const old of fs.readdirSync(folder)) {
    if (old.startsWith("cli-") && path.join(folder, old) !== file)
      fs.rmSync(path.join(folder, old), { recursive: true, force: true });
  }
  return bundles;
}

/** Each source file keeps its own import.meta.url (the runner finds report.css and the package root with it). */
const keepModuleUrls = {
  name: "keep-module-urls",
  setup(build) {
    build.onLoad({ filter: /[\\/](runner|cells|lib)[\\/].*\.ts$/ }, (args) => ({
      contents: fs
        .readFileSync(args.path, "utf8")
        .replaceAll("import.meta.url", JSON.stringify(pathToFileURL(args.path).href)),
      loader: "ts",
    }));
  },
};

const argv = process.argv.slice(2);
if (argv.length === 1 && (argv[0] === "--version" || argv[0] === "-v")) {
  // Answered before anything else is loaded (the CLI's main gives the same answer).
  process.stdout.write(`${JSON.parse(fs.readFileSync(path.join(root, "package.json"), "utf8")).version}\n`);
} else {
  const { main } = await loadCli(argv);
  process.exitCode = await main(argv);
}
