#!/usr/bin/env node
// The `tristim` command. The sources are TypeScript and there is no build step: on first use (and whenever a file
// in runner/ or cells/ changes) this launcher has esbuild bundle runner/cli/cli.ts into the package's
// node_modules/.cache/tristim/, and runs that; node starts it several times faster than through tsx's loader
// (measured: about 0.25 s against 0.9 s). Where the cache cannot be written, or with TRISTIM_TSX=1, it registers tsx
// and imports the TypeScript directly.
//
// The bundle is a CommonJS script, compiled with V8's code cache (vm.Script cachedData, kept beside the bundle and
// written after the first run, so it holds the functions that run used): node 20 has no code cache for ES modules,
// and compiling the 1.1 MB bundle afresh took about half of a short command's own time (import of the ES module
// bundle 180 ms against 85 ms with the cache, measured side by side on a loaded 2-core machine).
//
// Only fs and path are imported up front, so that `--version` loads nothing else; the other built-in modules are
// imported when the CLI is loaded.
import fs from "node:fs";
import path from "node:path";

const root = path.resolve(path.dirname(decodeURIComponent(new URL(import.meta.url).pathname)), "..");

/** The built-in modules the launcher needs beyond fs and path, imported once the CLI is to be loaded. */
let builtins;
async function loadBuiltins() {
  const [crypto, module, url, vm] = await Promise.all([
    import("node:crypto"),
    import("node:module"),
    import("node:url"),
    import("node:vm"),
  ]);
  builtins = {
    createHash: crypto.createHash,
    Module: module.default,
    createRequire: module.createRequire,
    url,
    vm: vm.default,
  };
}

async function loadCli(argv) {
  await loadBuiltins();
  if (process.env.TRISTIM_TSX !== "1") {
    try {
      const bundles = await cachedBundle();
      // `run` readies its cell process (early-start.ts: adopts the one started above), then loads the rest.
      if (argv[0] === "run") await loadScript(bundles.early).exports.startEarly(argv);
      const cli = loadScript(bundles.cli);
      return { main: async (args) => cli.finished(await cli.exports.main(args)) };
    } catch (error) {
      if (process.env.TRISTIM_DEBUG) console.error("tristim: bundled start failed, using tsx:", error);
    }
  }
  const { register } = await import("tsx/esm/api");
  register();
  return import("./cli/cli.ts");
}

/**
 * Runs a bundled CommonJS script with V8's code cache (`<file>.v8cache`): its exports, and `finished(value)`, which
 * writes the cache when there was none (or V8 refused it) and returns `value`. The cache is made after the command
 * ran, so the functions it compiled are in it; it is written to a temporary file and renamed, so a run at the same
 * time reads either no cache or a whole one, and V8 refuses a cache that does not match the source.
 */
function loadScript(file) {
  const { Module, createRequire, vm } = builtins;
  const cacheFile = `${file}.v8cache`;
  let cachedData;
  try {
    cachedData = fs.readFileSync(cacheFile);
  } catch {
    // no cache yet
  }
  const script = new vm.Script(Module.wrap(fs.readFileSync(file, "utf8")), {
    filename: file,
    cachedData,
    importModuleDynamically: vm.constants.USE_MAIN_CONTEXT_DEFAULT_LOADER,
  });
  const module = { exports: {} };
  script.runInThisContext()(module.exports, createRequire(file), module, file, path.dirname(file));
  const finished = (value) => {
    if (cachedData === undefined || script.cachedDataRejected) {
      try {
        const temporary = `${cacheFile}.${process.pid}.tmp`;
        fs.writeFileSync(temporary, script.createCachedData());
        fs.renameSync(temporary, cacheFile);
      } catch {
        // a cache that cannot be written only costs time
      }
    }
    return value;
  };
  return { exports: module.exports, finished };
}

/** Paths of the bundled CLI (and its early start) for the current sources, building them when missing. */
async function cachedBundle() {
  const hash = builtins.createHash("sha256").update(`${process.version}\0cjs`);
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
  const bundles = { cli: path.join(file, "cli.cjs"), early: path.join(file, "early-start.cjs") };
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
    format: "cjs",
    target: "node20",
    outdir: temporary,
    outExtension: { ".js": ".cjs" },
    logLevel: "silent",
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
        .replaceAll("import.meta.url", JSON.stringify(builtins.url.pathToFileURL(args.path).href)),
      loader: "ts",
    }));
  },
};

const argv = process.argv.slice(2);
if (argv.length === 1 && (argv[0] === "--version" || argv[0] === "-v")) {
  // Answered before anything else is loaded (the CLI's main gives the same answer).
  process.stdout.write(`${JSON.parse(fs.readFileSync(path.join(root, "package.json"), "utf8")).version}\n`);
} else {
  // `run` starts its cell process first of all (cell-spawn.mjs), so that node's start overlaps everything else.
  if (argv[0] === "run") (await import("./execute/cell-spawn.mjs")).startEarlyCellProcess(argv);
  const { main } = await loadCli(argv);
  const code = await main(argv);
  // Everything is written (files synchronously, stdout and stderr are synchronous on pipes and files): exit now,
  // instead of letting node take down the whole environment after the event loop drains (about 10 ms).
  process.exit(code);
}
