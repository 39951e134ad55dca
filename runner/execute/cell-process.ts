/**
 * The runner's side of the cell process: starts it (a child Node process in the notebook's folder), sends it cells,
 * receives their records, and stops it when a cell runs past its time limit or the run is cancelled. The CLI never
 * waits on a cell process without a deadline.
 */
import type { ChildProcess } from "node:child_process";
import path from "node:path";
import type { InputValue } from "../../cells/inputs.ts";
import type { FromCellProcess, RawError, ToCellProcess } from "../../cells/protocol.ts";
import type { MethodNote, OutputRecord } from "../../cells/records.ts";
import type { RuntimeBundle } from "./runtime-bundle.ts";
import {
  EARLY_PROCESS,
  killGroup,
  memoryLimitMb,
  spawnCellProcess,
  type EarlyCellProcess,
} from "./cell-spawn.mjs";

export { DEFAULT_MEMORY_LIMIT_MB, memoryLimitMb } from "./cell-spawn.mjs";

/** How long the cell process may take to load the library and get ready. */
export const STARTUP_LIMIT_MS = 60_000;
/** How long the cell process may take to answer "finish" after the last cell. */
export const FINISH_LIMIT_MS = 10_000;

/** What V8 prints when a process reaches its heap limit. */
const OUT_OF_MEMORY = /heap out of memory|Reached heap limit|Allocation failed/;
/** Lines of a crashed process's output that belong to the engine or the runner, never to the notebook. */
const ENGINE_OR_RUNNER_LINE =
  /node::|\[node\]|0x[0-9a-f]{6,}|Native stack trace|^\s*-----|Last few GCs|FATAL ERROR|Security context|^\s*\d+: tristim-cell-\d+\.js|\/runtime\/[0-9a-f]+\/worker\.mjs|node:internal|^\s*\d+:\s*$|^\s*<---|^\s*\[\d+:0x/;

/** How one cell ended, seen from the runner. */
export type CellOutcome =
  | {
      readonly kind: "done";
      readonly durationMs: number;
      readonly error?: RawError;
      readonly reads: readonly string[];
      readonly writes: readonly string[];
      readonly methods: readonly MethodNote[];
    }
  | { readonly kind: "time-limit"; readonly durationMs: number }
  | { readonly kind: "crash"; readonly durationMs: number; readonly detail: string }
  | { readonly kind: "out-of-memory"; readonly durationMs: number; readonly limitMb: number };

/** How many runs one cell process may serve before it is replaced (each run's import bundles stay loaded in it). */
export const RUNS_PER_PROCESS = 100;
/** How many clean processes may wait for runs of one folder. */
const IDLE_LIMIT = 4;

/**
 * A run's hold on a cell process: the cell process of a run, or of part of a run after a restart. When the run
 * finishes with `reuse` and the process is clean, the process goes back to the idle pool for the next run of the
 * same folder and this hold is void (its `kill` then does nothing, `alive` is false), so a late call from the
 * finished run can never touch the next run's process.
 */
export class CellProcess {
  private released = false;

  private constructor(private readonly host: ProcessHost) {}

  /** Receives the records of running cells (set by whoever runs the cells). */
  set onOutput(receive: (cell: number, records: readonly OutputRecord[]) => void) {
    if (!this.released) this.host.onOutput = receive;
  }

  /** Starts a cell process (or takes an idle one for the folder) and waits until it is ready for this run. */
  static async start(
    runtime: RuntimeBundle,
    notebookPath: string,
    inputs: Readonly<Record<string, InputValue>>,
    signal?: AbortSignal,
  ): Promise<CellProcess> {
    return new CellProcess(await ProcessHost.start(runtime, notebookPath, inputs, signal));
  }

  /** See ProcessHost.prepare. */
  static prepare(runtime: RuntimeBundle, folder: string): void {
    ProcessHost.prepare(runtime, folder);
  }

  /** Stops the idle cell processes waiting for notebooks in `folder` (watch mode, when it stops). */
  static discardSpare(folder: string): void {
    ProcessHost.discardSpare(folder);
  }

  /** Runs one compiled cell with a time limit. */
  run(
    message: Extract<ToCellProcess, { type: "run" }>,
    timeLimitMs: number,
    signal?: AbortSignal,
  ): Promise<CellOutcome> {
    if (this.released) throw new Error("internal: a released cell process was asked to run a cell");
    return this.host.run(message, timeLimitMs, signal);
  }

  /**
   * Sends a cell's run ahead, while the cell before it still runs, so the process starts it without waiting for a
   * round trip through the runner; `run` with the same cell later waits for it (its time limit counted from then).
   */
  sendAhead(message: Extract<ToCellProcess, { type: "run" }>): void {
    if (!this.released) this.host.sendAhead(message);
  }

  /**
   * Asks for the method log and ends the process; with `reuse`, a process that comes back clean (cells/run-
   * baseline.ts) is handed to the idle pool instead, and this hold is released. Undefined when it does not answer.
   */
  async finish(
    options: { readonly reuse?: boolean } = {},
  ): Promise<Extract<FromCellProcess, { type: "finished" }> | undefined> {
    if (this.released) return undefined;
    const reuse = options.reuse === true && this.host.runs < RUNS_PER_PROCESS;
    const finished = await this.host.finish(reuse);
    if (finished?.reusable && this.host.alive) {
      this.released = true;
      this.host.offer();
    } else this.host.kill();
    return finished;
  }

  /** Stops the process at once (nothing once the process was handed on). */
  kill(): void {
    if (!this.released) this.host.kill();
  }

  /** False once the process has exited, been told to stop, or been handed on. */
  get alive(): boolean {
    return !this.released && this.host.alive;
  }
}

/** One child Node process running the cell harness, over one or several runs. */
class ProcessHost {
  private readonly child: ChildProcess;
  /** How many runs this process has been started for ("init" messages sent). */
  runs = 0;
  private exited = false;
  private killed = false;
  private groupEnded = false;
  private exitDetail = "";
  private stderrTail = "";
  private readonly limitMb = memoryLimitMb();
  private listeners = new Set<(message: FromCellProcess) => void>();
  /** Cells whose run was sent ahead, with their "done" once it came (it may come before anyone waits for it). */
  private readonly ahead = new Map<number, Extract<FromCellProcess, { type: "done" }> | undefined>();
  private exitListeners = new Set<() => void>();

  /** Receives the records of running cells (set by whoever runs the cells). */
  onOutput: (cell: number, records: readonly OutputRecord[]) => void = () => undefined;

  private readonly key: string;

  /** Starts a cell process for `folder`, or takes on `started`, one the launcher started with the same arguments. */
  private constructor(runtime: RuntimeBundle, folder: string, started?: ChildProcess) {
    this.key = spareKey(runtime, folder);
    // In a process group of its own, so that processes a cell starts are ended with it (endGroup).
    this.child = started ?? spawnCellProcess(runtime.worker, folder, this.limitMb);
    liveGroups.add(this);
    const keepTail = (chunk: Buffer) => {
      this.stderrTail = (this.stderrTail + chunk.toString("utf8")).slice(-4000);
    };
    this.child.stderr?.on("data", keepTail);
    this.child.stdout?.on("data", keepTail);
    this.child.on("message", (message: FromCellProcess) => {
      if (message.type === "output") this.onOutput(message.cell, message.records);
      else if (message.type === "done" && this.ahead.has(message.cell)) this.ahead.set(message.cell, message);
      for (const listener of [...this.listeners]) listener(message);
    });
    this.child.on("error", (error) => {
      this.exitDetail = `the cell process could not be started: ${error.message}`;
      this.markExited();
    });
    this.child.on("exit", (code, signal) => {
      this.exitDetail ||= signal
        ? `the cell process was ended by signal ${signal}`
        : `the cell process ended with exit code ${code}`;
      this.markExited();
      // Children a cell started may still hold the output pipes: end them, and stop reading the pipes.
      this.endGroup();
      this.child.stdout?.destroy();
      this.child.stderr?.destroy();
    });
  }

  /** Starts a cell process (or takes an idle one) and waits until the library is loaded and the inputs are set. */
  static async start(
    runtime: RuntimeBundle,
    notebookPath: string,
    inputs: Readonly<Record<string, InputValue>>,
    signal?: AbortSignal,
  ): Promise<ProcessHost> {
    adoptEarly(runtime);
    const cell =
      takeSpare(runtime, path.dirname(notebookPath)) ?? new ProcessHost(runtime, path.dirname(notebookPath));
    cell.runs++;
    // A cell sent ahead in the last run and skipped there is not this run's.
    cell.ahead.clear();
    cell.send({ type: "init", notebookPath, inputs });
    const answer = await cell.wait(
      (m) => m.type === "ready" || m.type === "startup-failed",
      STARTUP_LIMIT_MS,
      signal,
    );
    if (answer === "timeout") {
      cell.kill();
      throw new CellProcessStartError({
        failure: "startup",
        message: `the cell process did not get ready within ${STARTUP_LIMIT_MS / 1000} s`,
      });
    }
    if (answer === "exit")
      throw new CellProcessStartError({ failure: "startup", message: cell.describeExit() });
    if (answer.type === "startup-failed") {
      cell.kill();
      throw new CellProcessStartError(answer.error);
    }
    return cell;
  }

  /**
   * Starts a spare cell process for notebooks in `folder` ahead of time, unless one is idle already: node boots and
   * loads the library while the runner does other work, and the next `start` for that folder takes it. An idle
   * process does not keep the runner alive and dies with it.
   */
  static prepare(runtime: RuntimeBundle, folder: string): void {
    adoptEarly(runtime);
    const idle = idleFor(spareKey(runtime, folder));
    if (idle.some((host) => host.alive)) return;
    const cell = new ProcessHost(runtime, folder);
    cell.setHeld(false);
    idle.push(cell);
  }

  /**
   * Takes on the cell process the launcher started (cell-spawn.mjs) as an idle process of its folder, when it runs
   * `runtime`'s worker with this process's heap limit and is still alive; stops it otherwise (a runtime rebuilt
   * since the last run). Either way it is no longer the launcher's.
   */
  static adoptEarly(runtime: RuntimeBundle, early: EarlyCellProcess): void {
    early.adopted = true;
    const { child } = early;
    const usable =
      early.worker === runtime.worker &&
      early.limitMb === memoryLimitMb() &&
      !early.failed &&
      child.exitCode === null &&
      child.signalCode === null &&
      child.connected;
    if (!usable) return killGroup(child);
    const cell = new ProcessHost(runtime, early.folder, child);
    cell.setHeld(false);
    idleFor(cell.key).push(cell);
  }

  /** Stops the idle cell processes waiting for notebooks in `folder` (watch mode, when it stops). */
  static discardSpare(folder: string): void {
    for (const [key, idle] of spares()) {
      if (key.endsWith(`\0${path.resolve(folder)}`)) {
        for (const host of idle) host.kill();
        spares().delete(key);
      }
    }
  }

  /** Puts this clean, finished process in the idle pool of its folder (or stops it when the pool is full). */
  offer(): void {
    const idle = idleFor(this.key);
    if (idle.filter((host) => host.alive).length >= IDLE_LIMIT) return this.kill();
    this.onOutput = () => undefined;
    this.setHeld(false);
    idle.push(this);
  }

  /** Keeps the runner's event loop alive for this process (or not, while it waits as a spare); for this module. */
  setHeld(held: boolean): void {
    const handles = [this.child, this.child.channel, this.child.stdout, this.child.stderr] as (
      { ref?: () => void; unref?: () => void } | null | undefined
    )[];
    for (const h of handles) (held ? h?.ref : h?.unref)?.call(h);
  }

  /** Runs one compiled cell with a time limit. */
  async run(
    message: Extract<ToCellProcess, { type: "run" }>,
    timeLimitMs: number,
    signal?: AbortSignal,
  ): Promise<CellOutcome> {
    const started = performance.now();
    if (!this.ahead.has(message.cell)) this.send(message);
    const answer =
      this.ahead.get(message.cell) ??
      (await this.wait((m) => m.type === "done" && m.cell === message.cell, timeLimitMs, signal));
    this.ahead.delete(message.cell);
    const durationMs = performance.now() - started;
    if (answer === "timeout") {
      this.kill();
      return { kind: "time-limit", durationMs };
    }
    if (answer === "exit") {
      if (OUT_OF_MEMORY.test(this.stderrTail))
        return { kind: "out-of-memory", durationMs, limitMb: this.limitMb };
      return { kind: "crash", durationMs, detail: this.describeExit() };
    }
    const done = answer as Extract<FromCellProcess, { type: "done" }>;
    return {
      kind: "done",
      durationMs: done.durationMs,
      error: done.error,
      reads: done.reads,
      writes: done.writes ?? [],
      methods: done.methods ?? [],
    };
  }

  /** See CellProcess.sendAhead. */
  sendAhead(message: Extract<ToCellProcess, { type: "run" }>): void {
    this.ahead.set(message.cell, undefined);
    this.send(message);
  }

  /**
   * Asks for the method log; undefined when it does not answer in time. Without `reuse` the process then ends (the
   * caller kills it in any case unless the answer says `reusable`).
   */
  async finish(reuse: boolean): Promise<Extract<FromCellProcess, { type: "finished" }> | undefined> {
    if (this.exited) return undefined;
    this.send({ type: "finish", ...(reuse ? { reuse } : {}) });
    const answer = await this.wait((m) => m.type === "finished", FINISH_LIMIT_MS);
    return typeof answer === "object"
      ? (answer as Extract<FromCellProcess, { type: "finished" }>)
      : undefined;
  }

  /** Stops the process at once. */
  kill(): void {
    this.endGroup();
    if (this.exited) return;
    this.killed = true;
    this.child.kill("SIGKILL");
  }

  /** Kills the process group: the cell process and every process its cells started that did not leave it. */
  endGroup(): void {
    if (this.groupEnded || this.child.pid === undefined) return;
    killGroup(this.child);
    if (this.exited) {
      this.groupEnded = true;
      liveGroups.delete(this);
    }
  }

  /** False once the process has exited or been told to stop (its exit event may come a moment later). */
  get alive(): boolean {
    return !this.exited && !this.killed;
  }

  /** How the process ended, with its last lines of output, less the engine's native frames and the runner's own. */
  private describeExit(): string {
    const tail = this.stderrTail
      .trim()
      .split("\n")
      .filter((line) => line.trim() !== "" && !ENGINE_OR_RUNNER_LINE.test(line))
      .slice(-6)
      .join("\n");
    const detail = this.exitDetail.endsWith("SIGABRT")
      ? `${this.exitDetail} (process.abort(), or a fatal error inside Node.js)`
      : this.exitDetail;
    return tail ? `${detail}; its last output was:\n${tail}` : detail;
  }

  private send(message: ToCellProcess): void {
    if (!this.exited && this.child.connected) this.child.send(message);
  }

  private markExited(): void {
    if (this.exited) return;
    this.exited = true;
    for (const listener of [...this.exitListeners]) listener();
  }

  /** Waits for a matching message, the process's exit, a deadline or an abort (which kills the process). */
  private wait(
    match: (m: FromCellProcess) => boolean,
    limitMs: number,
    signal?: AbortSignal,
  ): Promise<FromCellProcess | "timeout" | "exit"> {
    return new Promise((resolve, reject) => {
      const cleanup = () => {
        clearTimeout(timer);
        this.listeners.delete(onMessage);
        this.exitListeners.delete(onExit);
        signal?.removeEventListener("abort", onAbort);
      };
      const onMessage = (m: FromCellProcess) => {
        if (match(m)) (cleanup(), resolve(m));
      };
      const onExit = () => (cleanup(), resolve("exit"));
      const onAbort = () => {
        cleanup();
        this.kill();
        reject(new RunCancelled());
      };
      const timer = setTimeout(() => (cleanup(), resolve("timeout")), limitMs);
      this.listeners.add(onMessage);
      this.exitListeners.add(onExit);
      signal?.addEventListener("abort", onAbort);
      if (signal?.aborted) onAbort();
      else if (this.exited) onExit();
    });
  }
}

/** Cell processes whose groups may still have members; ended if the runner itself exits. */
const liveGroups = new Set<ProcessHost>();
process.on("exit", () => {
  for (const group of liveGroups) group.endGroup();
});

/** The idle cell processes of this runner process, by worker and folder (shared by every copy of this module). */
function spares(): Map<string, ProcessHost[]> {
  const registry = globalThis as Record<symbol, unknown>;
  const key = Symbol.for("tristim.idle-cell-processes");
  if (!registry[key]) {
    const pool = new Map<string, ProcessHost[]>();
    registry[key] = pool;
    process.once("exit", () => {
      for (const idle of pool.values()) for (const cell of idle) cell.kill();
    });
  }
  return registry[key] as Map<string, ProcessHost[]>;
}

/** The idle processes for one key (a list kept in the pool). */
function idleFor(key: string): ProcessHost[] {
  let idle = spares().get(key);
  if (!idle) spares().set(key, (idle = []));
  return idle;
}

/** Takes on the launcher's cell process, if it left one (see ProcessHost.adoptEarly). */
function adoptEarly(runtime: RuntimeBundle): void {
  const registry = globalThis as { [EARLY_PROCESS]?: EarlyCellProcess };
  const early = registry[EARLY_PROCESS];
  if (!early) return;
  delete registry[EARLY_PROCESS];
  ProcessHost.adoptEarly(runtime, early);
}

function spareKey(runtime: RuntimeBundle, folder: string): string {
  return `${runtime.worker}\0${path.resolve(folder)}`;
}

/** Takes an idle process for `folder` if one is waiting and alive (the one that went idle last). */
function takeSpare(runtime: RuntimeBundle, folder: string): ProcessHost | undefined {
  const idle = idleFor(spareKey(runtime, folder));
  for (let cell = idle.pop(); cell; cell = idle.pop()) {
    if (!cell.alive) continue;
    cell.setHeld(true);
    return cell;
  }
  return undefined;
}

/** The cell process could not start (the library threw while loading, or the process died). */
export class CellProcessStartError extends Error {
  override readonly name = "CellProcessStartError";
  constructor(readonly error: RawError) {
    super(error.message);
  }
}

/** The run was cancelled (watch mode starts a new run when the notebook changes). */
export class RunCancelled extends Error {
  override readonly name = "RunCancelled";
  constructor() {
    super("the run was cancelled");
  }
}
