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
import { CellOutput } from "./capture.ts";
import { inspectValue, show } from "./display.ts";
import { setRunInputs } from "./inputs.ts";
import { installOutputSink } from "./output-sink.ts";
import type { CellRuntime, FromCellProcess, RawError, RunCellMessage, ToCellProcess } from "./protocol.ts";
import type { FailureKind, MethodNote } from "./records.ts";

const realExit = process.exit.bind(process);
const send = (message: FromCellProcess): void => {
  process.send?.(message);
};

Error.stackTraceLimit = 40;

/** process.exit() inside a cell throws this instead of ending the process. */
class CellExit extends Error {
  override readonly name = "CellExit";
  constructor(readonly code: unknown) {
    super(
      `process.exit(${code === undefined ? "" : String(code)}) was called in the cell; a cell cannot end the run (throw an Error to stop it with a message)`,
    );
  }
}

let notebookDir = process.cwd();
let notebookPath = "";
let lib: Record<string, unknown> = {};
/** The cell running now, or the last one that ran (for output written later by its timers). */
let currentCell: number | null = null;
let lastCell: number | null = null;
let output = new CellOutput();
let reads = new Set<string>();
let failCurrentCell: ((error: RawError) => void) | null = null;
let lateError: RawError | undefined;
let suppressReadTracking = false;

// --- output: console, stdout/stderr and display records all go to the running cell -------------------------------
function captureText(stream: "stdout" | "stderr", chunk: unknown): void {
  const text =
    typeof chunk === "string" ? chunk : Buffer.isBuffer(chunk) ? chunk.toString("utf8") : String(chunk);
  output.addText(stream, text);
}
const captureStream = (stream: "stdout" | "stderr") =>
  new Writable({
    decodeStrings: false,
    write(chunk: unknown, _encoding, done) {
      captureText(stream, chunk);
      done();
    },
  });
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
installOutputSink((record) => output.addRecord(record));

function flush(): void {
  const records = output.take();
  const cell = currentCell ?? lastCell;
  if (records.length > 0 && cell !== null) send({ type: "output", cell, records });
}
setInterval(flush, 250).unref();

// --- process.exit() and errors nobody awaited ---------------------------------------------------------------------
process.exit = ((code?: unknown) => {
  throw new CellExit(code);
}) as typeof process.exit;

function raiseUncaught(error: unknown, what: string): void {
  const raw = toRawError(error, "uncaught");
  const message = `${what}: ${raw.message}`;
  if (failCurrentCell) failCurrentCell({ ...raw, message });
  else
    lateError ??= {
      ...raw,
      message: `${message} (raised after the cell had finished, by a timer, callback or promise it left running)`,
    };
}
process.on("uncaughtException", (error) =>
  raiseUncaught(error, "an error was thrown outside the cell's own flow (by a timer or callback)"),
);
process.on("unhandledRejection", (reason) =>
  raiseUncaught(reason, "a promise was rejected and nothing awaited or caught it"),
);

// --- files the cells read (for watch re-runs and the report's record of inputs) -----------------------------------
function trackRead(file: unknown): void {
  if (suppressReadTracking || currentCell === null) return;
  let p: string | undefined;
  if (typeof file === "string") p = file;
  else if (file instanceof URL && file.protocol === "file:") p = decodeURIComponent(file.pathname);
  else if (Buffer.isBuffer(file)) p = file.toString("utf8");
  if (p === undefined) return;
  const absolute = path.resolve(p);
  if (absolute.includes(`${path.sep}node_modules${path.sep}`)) return;
  reads.add(absolute);
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
{
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
    return open.apply(this, args);
  };
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
      return {
        failure: name === "UnserializableError" ? "unserializable" : failure,
        name,
        message: String(e.message),
        stack: typeof e.stack === "string" ? e.stack : undefined,
      };
    }
    return { failure, message: `a value that is not an Error was thrown: ${inspectValue(error)}` };
  } catch {
    return { failure, message: "an error was thrown that could not be read" };
  }
}

// --- running a cell -------------------------------------------------------------------------------------------------
const notebookRequire = () => createRequire(path.join(notebookDir, "noop.js"));

function runtimeFor(namespaces: Record<string, Record<string, unknown>>): CellRuntime {
  return {
    declare(names) {
      for (const name of names) declareGlobal(name);
    },
    link(bindings) {
      for (const [name, get, set] of bindings) {
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
    lib,
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
      if (specifier === "tristim") return lib;
      if (isBuiltin(specifier)) return import(specifier);
      if (/^\.{0,2}\//.test(specifier))
        return import(pathToFileURL(path.resolve(notebookDir, specifier)).href);
      try {
        return await import(pathToFileURL(notebookRequire().resolve(specifier)).href);
      } catch {
        return import(specifier);
      }
    },
    meta: {
      url: pathToFileURL(notebookPath).href,
      dirname: notebookDir,
      filename: notebookPath,
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

async function runCell(message: RunCellMessage): Promise<void> {
  currentCell = message.cell;
  output = new CellOutput();
  reads = new Set();
  const failed = new Promise<never>((_, reject) => {
    failCurrentCell = reject;
  });
  failed.catch(() => undefined);
  const started = performance.now();
  let error: RawError | undefined;
  try {
    let namespaces: Record<string, Record<string, unknown>> = {};
    if (message.importBundle) {
      suppressReadTracking = true;
      try {
        namespaces = (await Promise.race([
          import(pathToFileURL(message.importBundle).href),
          failed,
        ])) as typeof namespaces;
      } finally {
        suppressReadTracking = false;
      }
    }
    const fn = vm.runInThisContext(message.code, { filename: message.filename }) as (
      rt: CellRuntime,
    ) => Promise<unknown>;
    const value = await Promise.race([fn(runtimeFor(namespaces)), failed]);
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
  failCurrentCell = null;
  const records = output.finish();
  if (records.length > 0) send({ type: "output", cell: message.cell, records });
  send({ type: "done", cell: message.cell, durationMs, error, reads: [...reads], methods: methodLog() });
  lastCell = currentCell;
  currentCell = null;
}

/** The library's method log as plain records (empty if the library has none or it fails). */
function methodLog(): MethodNote[] {
  const methodsUsed = lib.methodsUsed;
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

async function start(): Promise<void> {
  try {
    lib = { ...(await import("./tristim-entry.ts")) };
    const resetMethodLog = lib.resetMethodLog;
    if (typeof resetMethodLog === "function") resetMethodLog();
  } catch (e) {
    send({ type: "startup-failed", error: toRawError(e, "startup") });
    setTimeout(() => realExit(1), 50);
    return;
  }
  let queue = Promise.resolve();
  process.on("message", (message: ToCellProcess) => {
    queue = queue.then(() => handle(message));
  });
}

async function handle(message: ToCellProcess): Promise<void> {
  if (message.type === "init") {
    notebookPath = message.notebookPath;
    notebookDir = path.dirname(message.notebookPath);
    setRunInputs(message.inputs);
    for (const [name, value] of Object.entries(lib)) {
      Object.defineProperty(globalThis, name, {
        value,
        writable: true,
        configurable: true,
        enumerable: false,
      });
    }
    send({ type: "ready" });
  } else if (message.type === "run") {
    await runCell(message);
  } else if (message.type === "finish") {
    process.send?.({ type: "finished", methods: methodLog(), lateError } satisfies FromCellProcess, () => {
      process.disconnect?.();
      realExit(0);
    });
  }
}

process.on("disconnect", () => realExit(0));
void start();
