// How a cell process is started, in plain JavaScript so that two places share it: the launcher (runner/bin.mjs),
// which starts one for `tristim run` as its first step, before the CLI bundle is even looked for, and
// cell-process.ts, which starts every other one and adopts the launcher's. Types: cell-spawn.d.mts.
//
// Why the launcher starts it: the cell process's own start (node, then the harness and the library) is the longest
// thing on the way to the first cell, longer than loading the CLI, parsing and compiling. Started by the launcher,
// it begins about 30 ms sooner than from the CLI's early-start bundle (measured on a loaded 2-core machine), since
// the launcher no longer walks the sources and loads a bundle first. The launcher does not know whether the
// runtime bundle is current (that takes stamping lib/ and cells/): it starts the worker the last run used, named
// in a pointer file, and the CLI adopts the process only when the runtime it built is that same one.
import { spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";

/** The heap limit of a cell process in MB unless TRISTIM_MEMORY_LIMIT_MB says otherwise. */
export const DEFAULT_MEMORY_LIMIT_MB = 4096;

/** The heap limit a cell process gets (MB): TRISTIM_MEMORY_LIMIT_MB when it is a whole number ≥ 16, else the default. */
export function memoryLimitMb(env = process.env) {
  const asked = Number(env.TRISTIM_MEMORY_LIMIT_MB);
  return Number.isInteger(asked) && asked >= 16 ? asked : DEFAULT_MEMORY_LIMIT_MB;
}

/** Where tristim keeps its cached bundles and each run's temporary files. */
export function cacheRoot() {
  const uid = typeof process.getuid === "function" ? process.getuid() : "user";
  return path.join(os.tmpdir(), `tristim-${uid}`);
}

/** The file naming the worker of the runtime bundle last built or used (written by runtime-bundle.ts). */
export function latestWorkerFile() {
  return path.join(cacheRoot(), "runtime", "latest-worker");
}

/**
 * Starts a cell process: node with the heap limit, running the harness `worker`, in `folder`, its output piped and
 * an IPC channel open, in a process group of its own so that processes its cells start end with it.
 */
export function spawnCellProcess(worker, folder, limitMb) {
  return spawn(process.execPath, [`--max-old-space-size=${limitMb}`, worker], {
    cwd: folder,
    stdio: ["ignore", "pipe", "pipe", "ipc"],
    env: cellProcessEnv(),
    detached: true,
  });
}

/** The variable that hands NODE_EXTRA_CA_CERTS to the cell process, which reads it on first use (see below). */
export const DEFERRED_CA_CERTS = "TRISTIM_DEFERRED_CA_CERTS";

/**
 * The cell process's environment: the runner's, with warnings off, and NODE_EXTRA_CA_CERTS handed over under
 * DEFERRED_CA_CERTS. Node reads and parses that file while it starts, before any code runs (40 ms for a system
 * bundle of 140 certificates, on the way to every notebook's first cell, whether a cell uses TLS or not); the
 * harness (cells/deferred-ca-certificates.ts) puts the variable back at once and adds the certificates to each TLS
 * context as Node would, parsing them when a cell first makes one. Only on Node 20, where that was tested.
 */
export function cellProcessEnv(env = process.env) {
  const out = { ...env, NODE_NO_WARNINGS: "1" };
  const major = Number(process.versions.node.split(".")[0]);
  if (env.NODE_EXTRA_CA_CERTS && major === 20) {
    delete out.NODE_EXTRA_CA_CERTS;
    out[DEFERRED_CA_CERTS] = env.NODE_EXTRA_CA_CERTS;
  }
  return out;
}

/** Kills a cell process's group: the process and every process its cells started that did not leave it. */
export function killGroup(child) {
  if (child.pid === undefined) return;
  try {
    process.kill(-child.pid, "SIGKILL");
  } catch {
    // the group is already gone
  }
}

/** Options of `run` that take a value (their value is not a notebook). */
const VALUE_OPTIONS = new Set(["-o", "--output", "--input", "--time-limit", "--each", "--port", "--jobs"]);

/** The first notebook named on a `tristim run` command line, read roughly (the CLI checks it properly). */
export function firstNotebookOfRun(argv) {
  if (argv[0] !== "run") return undefined;
  for (let i = 1; i < argv.length; i++) {
    const arg = argv[i];
    if (VALUE_OPTIONS.has(arg)) i++;
    else if (!arg.startsWith("-")) return fs.existsSync(arg) ? path.resolve(arg) : undefined;
  }
  return undefined;
}

/** Where the launcher leaves the process it started, for cell-process.ts to adopt (shared by every module copy). */
export const EARLY_PROCESS = Symbol.for("tristim.early-cell-process");

/**
 * The launcher's step: for `tristim run`, starts a cell process for the first notebook's folder with the worker the
 * last run used, and leaves it at globalThis[EARLY_PROCESS]. It does not hold the event loop, is killed when the
 * launcher exits unless adopted, and never fails: without a pointer, or where anything goes wrong, the CLI starts
 * its own as before.
 */
export function startEarlyCellProcess(argv) {
  try {
    const notebook = firstNotebookOfRun(argv);
    if (notebook === undefined) return;
    const worker = fs.readFileSync(latestWorkerFile(), "utf8").trim();
    if (!path.isAbsolute(worker) || !fs.existsSync(worker)) return;
    const folder = path.dirname(notebook);
    const limitMb = memoryLimitMb();
    const child = spawnCellProcess(worker, folder, limitMb);
    const early = { child, worker, folder, limitMb, adopted: false, failed: false };
    child.on("error", () => (early.failed = true));
    for (const handle of [child, child.channel, child.stdout, child.stderr]) handle?.unref?.();
    process.once("exit", () => {
      if (!early.adopted) killGroup(child);
    });
    globalThis[EARLY_PROCESS] = early;
  } catch {
    // The CLI starts its own cell process.
  }
}
