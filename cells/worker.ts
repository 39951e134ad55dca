/**
 * The cell process: a child Node process the runner starts for a run (working directory = the notebook's folder).
 * It loads the standard library once, sets the globals, then runs the compiled cells it is sent one by one, sending
 * back plain output records. Console output, file reads, process.exit() and errors raised by timers or unawaited
 * promises are all caught here and attributed to the running cell. The runner watches the clock and stops this
 * process when a cell runs past its time limit.
 */
import { Console } from "node:console";
import fs from "node:fs";
import { createRequire, isBuiltin, syncBuiltinESMExports } from "node:module";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { Writable } from "node:stream";
import { pathToFileURL } from "node:url";
import vm from "node:vm";
import { CellOutput, cutErrorMessage, MAX_ERROR_MESSAGE_CHARS } from "./capture.ts";
import { installDeferredCaCertificates } from "./deferred-ca-certificates.ts";
import { inspectValue, show } from "./display.ts";
import { inputs as runInputs, setRunInputs } from "./inputs.ts";
import { installOutputSink } from "./output-sink.ts";
import type { CellRuntime, FromCellProcess, RawError, RunCellMessage, ToCellProcess } from "./protocol.ts";
import type { FailureKind, MethodNote } from "./records.ts";
import { sameFingerprint, sharedTableChanged, tablesFingerprint } from "../lib/data/shared-tables.ts";
import { restoreBaseline, takeBaseline, type ProcessBaseline } from "./run-baseline.ts";

const realExit = process.exit.bind(process);
const realSetTimeout = setTimeout;
const realSetImmediate = setImmediate;
const send = (message: FromCellProcess): void => {
  process.send?.(message);
};

/** process.exit() inside a cell throws this instead of ending the process. */
class CellExit extends Error {
  override readonly name = "CellExit";
  constructor(readonly code: unknown) {
    super(
      `process.exit(${code === undefined ? "" : String(code)}) was called in the cell; a cell cannot end the run (throw an Error to stop it with a message)`,
    );
  }
}

/** Everything the harness keeps between messages; changed only by the named steps below. */
interface WorkerState {
  /** The notebook (set by "init"); cells resolve imports and relative paths from its folder. */
  notebookDir: string;
  notebookPath: string;
  /** The "tristim" module namespace, loaded once by start(). */
  lib: Record<string, unknown>;
  /** The cell running now, or the last one that ran (for output written later by its timers). */
  currentCell: number | null;
  lastCell: number | null;
  /** The last cell that ran, when it failed (a cell sent ahead `unlessFailed` it is then skipped). */
  lastFailed: number | null;
  /** The running cell's output and the files it read. */
  output: CellOutput;
  reads: Set<string>;
  /** The files the running cell wrote (for the report's Provenance). */
  writes: Set<string>;
  /** Fails the running cell (an uncaught error while it runs); null between cells. */
  failCurrentCell: ((error: RawError) => void) | null;
  /** The first uncaught error after the last cell finished, reported with "finished", and the cell it came from. */
  lateError: RawError | undefined;
  lateErrorCell: number | undefined;
  /** The cell that scheduled the timer or immediate whose callback runs now (kept until the next callback). */
  callbackCell: number | null;
  /** True while a cell's import bundle loads (its reads are the runner's, not the cell's). */
  suppressReadTracking: boolean;
  /** Which run this process serves (1 for the first; later ones when a batch hands the process on). */
  runNumber: number;
  /** The state recorded once the library loaded, put back between runs (run-baseline.ts). */
  baseline: ProcessBaseline | undefined;
  /** Timers and immediates scheduled through the globals and not yet fired (cleared before a reuse). */
  timers: Set<() => void>;
  /** Set when a cell loaded an ES module at run time (import()): node keeps it, so the process is not handed on. */
  loadedModules: boolean;
  /** The fingerprint of the library's tables when the process became ready (lib/data/shared-tables.ts). */
  tables: number[];
}

const state: WorkerState = {
  notebookDir: process.cwd(),
  notebookPath: "",
  lib: {},
  currentCell: null,
  lastCell: null,
  lastFailed: null,
  output: new CellOutput(),
  reads: new Set(),
  writes: new Set(),
  failCurrentCell: null,
  lateError: undefined,
  lateErrorCell: undefined,
  callbackCell: null,
  suppressReadTracking: false,
  runNumber: 0,
  baseline: undefined,
  timers: new Set(),
  loadedModules: false,
  tables: [],
};

/** How long timers left pending by the cells may still fire after the last cell (README, "When something goes wrong"). */
const LATE_TIMER_GRACE_MS = 1000;

// --- output: console, stdout/stderr and display records all go to the running cell -------------------------------
function captureText(stream: "stdout" | "stderr", chunk: unknown): void {
  const text =
    typeof chunk === "string" ? chunk : Buffer.isBuffer(chunk) ? chunk.toString("utf8") : String(chunk);
  state.output.addText(stream, text);
}
const captureStream = (stream: "stdout" | "stderr") =>
  new Writable({
    decodeStrings: false,
    write(chunk: unknown, _encoding, done) {
      captureText(stream, chunk);
      done();
    },
  });
/** Install step: console, stdout/stderr and display records go to the running cell, flushed every 250 ms. */
function installOutputCapture(): void {
  globalThis.console = new Console({
    stdout: captureStream("stdout"),
    stderr: captureStream("stderr"),
    colorMode: false,
  });
  process.stdout.write = ((chunk: unknown) => (
    captureText("stdout", chunk),
    true
  )) as typeof process.stdout.write;
  process.stderr.write = ((chunk: unknown) => (
    captureText("stderr", chunk),
    true
  )) as typeof process.stderr.write;
  installOutputSink((record) => state.output.addRecord(record));
  setInterval(flush, 250).unref();
}

function flush(): void {
  const records = state.output.take();
  const cell = state.currentCell ?? state.lastCell;
  if (records.length > 0 && cell !== null) send({ type: "output", cell, records });
}

// --- process.exit() and errors nobody awaited ---------------------------------------------------------------------
/** Install step: process.exit() becomes an error of the cell; errors nobody awaited are attributed to a cell. */
function installErrorCapture(): void {
  Error.stackTraceLimit = 40;
  process.exit = ((code?: unknown) => {
    throw new CellExit(code);
  }) as typeof process.exit;
  process.on("uncaughtException", (error) =>
    raiseUncaught(error, "an error was thrown outside the cell's own flow (by a timer or callback)"),
  );
  process.on("unhandledRejection", (reason) =>
    raiseUncaught(reason, "a promise was rejected and nothing awaited or caught it"),
  );
}

function raiseUncaught(error: unknown, what: string): void {
  const raw = toRawError(error, "uncaught");
  const message = `${what}: ${raw.message}`;
  if (state.failCurrentCell) state.failCurrentCell({ ...raw, message });
  else if (state.lateError === undefined) {
    state.lateError = {
      ...raw,
      message: `${message} (raised after the cell had finished, by a timer, callback or promise it left running)`,
    };
    state.lateErrorCell = state.callbackCell ?? state.lastCell ?? undefined;
  }
}

/** Install step: timers and immediates remember the cell that scheduled them, so a late error names that cell. */
function installTimerTracking(): void {
  const g = globalThis as unknown as Record<string, (...args: unknown[]) => unknown>;
  const clears: Record<string, (handle: unknown) => void> = {
    setTimeout: clearTimeout as (handle: unknown) => void,
    setInterval: clearInterval as (handle: unknown) => void,
    setImmediate: clearImmediate as (handle: unknown) => void,
  };
  for (const name of ["setTimeout", "setInterval", "setImmediate"]) {
    const original = g[name]!;
    const clear = clears[name]!;
    const repeats = name === "setInterval";
    g[name] = function (this: unknown, callback: unknown, ...rest: unknown[]) {
      if (typeof callback !== "function") return original.call(this, callback, ...rest);
      const cell = state.currentCell;
      // Kept until it fires (an interval until cleared), so that a reuse can clear what is still pending.
      const forget = () => clear(handle);
      const tracked = function (this: unknown, ...args: unknown[]) {
        if (cell !== null) state.callbackCell = cell;
        if (!repeats) state.timers.delete(forget);
        return (callback as (...a: unknown[]) => unknown).apply(this, args);
      };
      const handle = original.call(this, tracked, ...rest);
      state.timers.add(forget);
      return handle;
    };
  }
}

/** True while timers or immediates (other than the harness's own, unreferenced ones) are pending. */
function timersPending(): boolean {
  return process.getActiveResourcesInfo().some((r) => r === "Timeout" || r === "Immediate");
}

// --- files the cells read (for watch re-runs and the report's record of inputs) -----------------------------------
function trackRead(file: unknown): void {
  if (state.suppressReadTracking || state.currentCell === null) return;
  let p: string | undefined;
  if (typeof file === "string") p = file;
  else if (file instanceof URL && file.protocol === "file:") p = decodeURIComponent(file.pathname);
  else if (Buffer.isBuffer(file)) p = file.toString("utf8");
  if (p === undefined) return;
  const absolute = path.resolve(p);
  if (absolute.includes(`${path.sep}node_modules${path.sep}`)) return;
  state.reads.add(absolute);
}
function trackWrite(file: unknown): void {
  if (state.currentCell === null) return;
  let p: string | undefined;
  if (typeof file === "string") p = file;
  else if (file instanceof URL && file.protocol === "file:") p = decodeURIComponent(file.pathname);
  if (p === undefined) return;
  state.writes.add(path.resolve(p));
}
function isReadFlag(flags: unknown): boolean {
  return (
    flags === undefined ||
    flags === null ||
    flags === "r" ||
    flags === "rs" ||
    flags === fs.constants.O_RDONLY
  );
}
/** Install step: the fs functions that read files note what the running cell read. */
function installReadTracking(): void {
  const f = fs as unknown as Record<string, (...args: unknown[]) => unknown>;
  for (const name of ["readFileSync", "readFile", "createReadStream"]) {
    const original = f[name]!;
    f[name] = function (this: unknown, ...args: unknown[]) {
      trackRead(args[0]);
      return original.apply(this, args);
    };
  }
  for (const name of ["openSync", "open"]) {
    const original = f[name]!;
    f[name] = function (this: unknown, ...args: unknown[]) {
      if (isReadFlag(typeof args[1] === "function" ? undefined : args[1])) trackRead(args[0]);
      else trackWrite(args[0]);
      return original.apply(this, args);
    };
  }
  // Files the cells write (listed with their SHA-256 in the report's Provenance, like files read).
  for (const name of ["writeFileSync", "writeFile", "appendFileSync", "appendFile", "createWriteStream"]) {
    const original = f[name]!;
    f[name] = function (this: unknown, ...args: unknown[]) {
      trackWrite(args[0]);
      return original.apply(this, args);
    };
  }
  for (const name of ["copyFileSync", "copyFile", "renameSync", "rename"]) {
    const original = f[name]!;
    f[name] = function (this: unknown, ...args: unknown[]) {
      trackWrite(args[1]);
      return original.apply(this, args);
    };
  }
  const promises = fs.promises as unknown as Record<string, (...args: unknown[]) => unknown>;
  const readFile = promises.readFile!;
  promises.readFile = function (this: unknown, ...args: unknown[]) {
    trackRead(args[0]);
    return readFile.apply(this, args);
  };
  const open = promises.open!;
  promises.open = function (this: unknown, ...args: unknown[]) {
    if (isReadFlag(args[1])) trackRead(args[0]);
    else trackWrite(args[0]);
    return open.apply(this, args);
  };
  for (const name of ["writeFile", "appendFile"]) {
    const original = promises[name]!;
    promises[name] = function (this: unknown, ...args: unknown[]) {
      trackWrite(args[0]);
      return original.apply(this, args);
    };
  }
  syncBuiltinESMExports();
}

// --- errors as data -------------------------------------------------------------------------------------------------
function toRawError(error: unknown, failure: FailureKind): RawError {
  try {
    if (error instanceof CellExit)
      return { failure: "exit", name: "process.exit", message: error.message, stack: error.stack };
    if (typeof error === "object" && error !== null && "message" in error) {
      const e = error as { name?: unknown; message?: unknown; stack?: unknown };
      const name = typeof e.name === "string" ? e.name : "Error";
      const message = String(e.message);
      let stack = typeof e.stack === "string" ? e.stack : undefined;
      // A huge message is cut; the stack repeats it at its start, so only its frames are kept after the cut text.
      if (stack !== undefined && message.length > MAX_ERROR_MESSAGE_CHARS) {
        const at = stack.indexOf(message);
        stack =
          at < 0 ? undefined : `${name}: ${cutErrorMessage(message)}${stack.slice(at + message.length)}`;
      }
      return {
        failure: name === "UnserializableError" ? "unserializable" : failure,
        name,
        message: cutErrorMessage(message),
        stack,
      };
    }
    return { failure, message: `a value that is not an Error was thrown: ${inspectValue(error)}` };
  } catch {
    return { failure, message: "an error was thrown that could not be read" };
  }
}

// --- running a cell -------------------------------------------------------------------------------------------------
/**
 * The URL a run imports a cell's import bundle by: the file's URL, with the run's number after the first run, so a
 * run in a process handed on evaluates the bundled modules afresh instead of getting the earlier run's instances.
 */
function runModuleUrl(file: string): string {
  const url = pathToFileURL(file).href;
  return state.runNumber > 1 ? `${url}?run=${state.runNumber}` : url;
}

const notebookRequire = () => createRequire(path.join(state.notebookDir, "noop.js"));

/** A cell's runtime, and its `const` bindings (name, read) to freeze when it has finished. */
type CellRuntimeWithConstants = CellRuntime & { readonly constants: [string, () => unknown][] };

function runtimeFor(namespaces: Record<string, Record<string, unknown>>): CellRuntimeWithConstants {
  const constants: [string, () => unknown][] = [];
  return {
    constants,
    declare(names) {
      for (const name of names) declareGlobal(name);
    },
    link(bindings) {
      for (const [name, get, set, constant] of bindings) {
        if (constant) constants.push([name, get]);
        const d = Object.getOwnPropertyDescriptor(globalThis, name);
        if (d && !d.configurable) {
          throw new TypeError(
            `the cell declares "${name}", a built-in global that cannot be replaced; choose another name`,
          );
        }
        Object.defineProperty(globalThis, name, { get, set, configurable: true, enumerable: true });
      }
    },
    imported(i) {
      return namespaces[`m${i}`]!;
    },
    lib: state.lib,
    bindImport(local, namespace, name, from) {
      declareGlobal(local);
      if (name in namespace) {
        (globalThis as Record<string, unknown>)[local] = namespace[name];
        return;
      }
      Object.defineProperty(globalThis, local, {
        configurable: true,
        enumerable: true,
        get() {
          throw new SyntaxError(`the module "${from}" has no export named "${name}"`);
        },
        set(value: unknown) {
          Object.defineProperty(globalThis, local, {
            value,
            writable: true,
            configurable: true,
            enumerable: true,
          });
        },
      });
    },
    async dynamicImport(specifier) {
      if (specifier === "tristim") return state.lib;
      if (isBuiltin(specifier)) return import(specifier);
      state.loadedModules = true;
      if (/^\.{0,2}\//.test(specifier))
        return import(pathToFileURL(path.resolve(state.notebookDir, specifier)).href);
      try {
        return await import(pathToFileURL(notebookRequire().resolve(specifier)).href);
      } catch {
        return import(specifier);
      }
    },
    meta: {
      url: pathToFileURL(state.notebookPath).href,
      dirname: state.notebookDir,
      filename: state.notebookPath,
    },
  };
}

function declareGlobal(name: string): void {
  const g = globalThis as Record<string, unknown>;
  const d = Object.getOwnPropertyDescriptor(g, name);
  if (d && "value" in d && d.writable) return;
  if (d && !d.configurable) {
    throw new TypeError(
      `the cell declares "${name}", a built-in global that cannot be replaced; choose another name`,
    );
  }
  Object.defineProperty(g, name, {
    value: d && "value" in d ? d.value : undefined,
    writable: true,
    configurable: true,
    enumerable: true,
  });
}

/**
 * After a cell: each of its `const` bindings that was initialised becomes a read-only global value (it can never
 * change again), so later cells read it as fast as a module-level constant instead of through an accessor. One not
 * initialised (the cell failed first) keeps its accessor, which throws as the binding would. A later cell may still
 * declare the name again (the property stays configurable); assigning to it throws in strict code, as for a const.
 */
function freezeConstants(runtime: CellRuntimeWithConstants | undefined): void {
  for (const [name, get] of runtime?.constants ?? []) {
    let value: unknown;
    try {
      value = get();
    } catch {
      continue;
    }
    Object.defineProperty(globalThis, name, { value, writable: false, configurable: true, enumerable: true });
  }
}

/** Run step: one cell, its output and reads collected, then "done" with the method log so far. */
async function runCell(message: RunCellMessage): Promise<void> {
  state.currentCell = message.cell;
  state.output = new CellOutput();
  state.reads = new Set();
  state.writes = new Set();
  const failed = new Promise<never>((_, reject) => {
    state.failCurrentCell = reject;
  });
  failed.catch(() => undefined);
  const started = performance.now();
  let error: RawError | undefined;
  let runtime: CellRuntimeWithConstants | undefined;
  try {
    let namespaces: Record<string, Record<string, unknown>> = {};
    if (message.importBundle) {
      state.suppressReadTracking = true;
      try {
        namespaces = (await Promise.race([
          import(runModuleUrl(message.importBundle)),
          failed,
        ])) as typeof namespaces;
      } finally {
        state.suppressReadTracking = false;
      }
    }
    const fn = vm.runInThisContext(message.code, { filename: message.filename }) as (
      rt: CellRuntime,
    ) => Promise<unknown>;
    runtime = runtimeFor(namespaces);
    const value = await Promise.race([fn(runtime), failed]);
    if (value !== undefined) show(value);
    // Let rejections nobody handled surface now, so they count against this cell.
    await Promise.race([new Promise((resolve) => setImmediate(resolve)), failed]);
  } catch (e) {
    error =
      (e as RawError)?.failure !== undefined && !(e instanceof Error)
        ? (e as RawError)
        : toRawError(e, "thrown");
  }
  const durationMs = performance.now() - started;
  state.failCurrentCell = null;
  freezeConstants(runtime);
  const records = state.output.finish();
  if (records.length > 0) send({ type: "output", cell: message.cell, records });
  send({
    type: "done",
    cell: message.cell,
    durationMs,
    error,
    reads: [...state.reads],
    writes: [...state.writes],
    methods: methodLog(),
  });
  state.lastCell = state.currentCell;
  state.lastFailed = error ? message.cell : null;
  state.currentCell = null;
}

/** The library's method log as plain records (empty if the library has none or it fails). */
function methodLog(): MethodNote[] {
  const methodsUsed = state.lib.methodsUsed;
  try {
    if (typeof methodsUsed !== "function") return [];
    return (methodsUsed() as { topic: unknown; statement: unknown }[]).map((m) => ({
      topic: String(m.topic),
      statement: String(m.statement),
    }));
  } catch {
    return [];
  }
}

/** Start step: load the library once, then handle the runner's messages one after another. */
async function start(): Promise<void> {
  installDeferredCaCertificates();
  try {
    state.lib = { ...(await import("./tristim-entry.ts")) };
    resetLibraryLog();
  } catch (e) {
    send({ type: "startup-failed", error: toRawError(e, "startup") });
    setTimeout(() => realExit(1), 50);
    return;
  }
  let queue = Promise.resolve();
  process.on("message", (message: ToCellProcess) => {
    queue = queue.then(() => handle(message));
  });
  // Last, so that the harness's own listeners and patches belong to the baseline.
  state.baseline = takeBaseline({ "the tristim module": state.lib });
  state.tables = tablesFingerprint(exportedTables());
}

/** The library's exported constants that are tables (observers, data tables), for the fingerprint. */
function exportedTables(): unknown[] {
  // `inputs` is each run's own, set at "init".
  return Object.entries(state.lib)
    .filter(([name, v]) => name !== "inputs" && typeof v === "object" && v !== null)
    .map(([, v]) => v);
}

function resetLibraryLog(): void {
  const resetMethodLog = state.lib.resetMethodLog;
  if (typeof resetMethodLog === "function") resetMethodLog();
}

async function handle(message: ToCellProcess): Promise<void> {
  if (message.type === "init") {
    state.runNumber++;
    if (state.runNumber > 1) resetLibraryLog();
    state.notebookPath = message.notebookPath;
    state.notebookDir = path.dirname(message.notebookPath);
    setRunInputs(message.inputs);
    // The copy of the library's exports holds the inputs object of the run it was made in; this run has its own.
    if ("inputs" in state.lib) state.lib.inputs = runInputs;
    for (const [name, value] of Object.entries(state.lib)) {
      Object.defineProperty(globalThis, name, {
        value,
        writable: true,
        configurable: true,
        enumerable: false,
      });
    }
    send({ type: "ready" });
  } else if (message.type === "run") {
    if (message.unlessFailed !== undefined && message.unlessFailed === state.lastFailed) return;
    await runCell(message);
  } else if (message.type === "finish") {
    await finish(message.reuse === true);
  }
}

/**
 * Finish step: let timers the cells left pending fire for up to LATE_TIMER_GRACE_MS (an error they raise counts),
 * then send the method log and any late error, and end the process; or, when the runner asks to reuse it, put the
 * process's state back (reset step) and stay, saying whether it is clean enough to serve another run.
 */
async function finish(reuse: boolean): Promise<void> {
  const until = performance.now() + LATE_TIMER_GRACE_MS;
  while (timersPending() && state.lateError === undefined && performance.now() < until)
    await new Promise((resolve) => realSetTimeout(resolve, 10));
  // One more turn, so that a rejection from the last callback is reported.
  await new Promise((resolve) => realSetImmediate(resolve));
  if (reuse) {
    const methods = methodLog();
    if (await reset()) {
      // Clean: the process stays and waits for the next run's "init".
      send({ type: "finished", methods, reusable: true });
      return;
    }
  }
  process.send?.(
    {
      type: "finished",
      methods: methodLog(),
      lateError: state.lateError,
      ...(state.lateErrorCell === undefined ? {} : { lateErrorCell: state.lateErrorCell }),
    } satisfies FromCellProcess,
    () => {
      process.disconnect?.();
      realExit(0);
    },
  );
}

/**
 * Reset step, between two runs that share this process: clears the timers the run left, puts the baseline back and
 * forgets the run. True when the process is clean (run-baseline.ts); false when it must not serve another run.
 */
async function reset(): Promise<boolean> {
  if (!state.baseline || state.loadedModules || state.lateError !== undefined) return false;
  // A run that wrote into a library table (an observer, illuminant("D65")) would change every later result.
  if (sharedTableChanged() || !sameFingerprint(state.tables, tablesFingerprint(exportedTables())))
    return false;
  for (const clear of state.timers) clear();
  state.timers.clear();
  // Give the cleared handles a turn to close before the active resources are counted.
  await new Promise((resolve) => realSetImmediate(resolve));
  const outcome = restoreBaseline(state.baseline);
  state.currentCell = null;
  state.lastCell = null;
  state.lastFailed = null;
  state.callbackCell = null;
  state.output = new CellOutput();
  state.reads = new Set();
  state.writes = new Set();
  state.lateError = undefined;
  state.lateErrorCell = undefined;
  return outcome.clean;
}

/** Install step: every patch of the process, made once before the library loads. */
function install(): void {
  installOutputCapture();
  installErrorCapture();
  installReadTracking();
  installTimerTracking();
  process.on("disconnect", () => realExit(0));
}

install();
void start();
