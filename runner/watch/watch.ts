/**
 * `tristim watch`: serves the report on 127.0.0.1, runs the notebook again when it or a file a cell read changes,
 * and tells open pages to reload. An edit that leaves the cells' code, run options and inputs as they were only
 * re-renders the report from the last run's records, without running any cell.
 *
 * A `WatchSession` holds the whole state of one watch (the last run, the page shown, a rebuild in progress) and
 * advances by named steps: `schedule` (a change, debounced), `rebuild` (one build at a time; a change during a
 * build cancels its run and builds again after), `build` (read, then run or re-render), `publish` (write the
 * report, show it, watch the files the cells read).
 */
import { EventEmitter } from "node:events";
import fs from "node:fs";
import path from "node:path";
import { NotebookError, UsageError } from "../shared/errors.ts";
import type { InputValue } from "../../cells/inputs.ts";
import { resolveInputs } from "../execute/inputs.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import { readNotebook } from "../parse/parse-notebook.ts";
import { defaultReportPath, saveReport } from "../report/report-file.ts";
import { formatDuration } from "../text/duration.ts";
import {
  embeddedPlotlyScript,
  prewarmReport,
  renderReportParts,
  type ReportParts,
} from "../report/render-report.ts";
import { moveRecordsToEdit } from "../records/rerender.ts";
import type { RunRecord } from "../records/run-record.ts";
import { runDocument, runSignature } from "../execute/run-notebook.ts";
import { CellProcess, RunCancelled } from "../execute/cell-process.ts";
import { DEFAULT_TIME_LIMIT_MS } from "../shared/time-limit.ts";
import type { CommandOptions, Io } from "../cli/command-options.ts";
import { WatchedFiles } from "./watched-files.ts";
import { EVENTS_PATH, htmlPage, pageMessage, WatchServer, type PageContent } from "./watch-server.ts";

export { EVENTS_PATH, serveFile } from "./watch-server.ts";

/** The port watch listens on unless --port says otherwise. */
export const DEFAULT_PORT = 4178;

/** Options of watch mode: the run options that apply to it, plus where to print and how long to wait. */
export type WatchOptions = Pick<
  CommandOptions,
  "port" | "output" | "inputs" | "timeLimitMs" | "keepGoing" | "linkAssets" | "quiet" | "typecheck"
> & {
  readonly io?: Io;
  /** Wait this long after a change before rebuilding (editors write in several steps). */
  readonly debounceMs?: number;
};

/** What a finished rebuild did. */
export interface RenderEvent {
  /** True when cells ran; false for a prose-only re-render from the last records. */
  readonly executed: boolean;
  /** Set when the notebook could not be read or parsed. */
  readonly error?: string;
  readonly ms: number;
}

/** A running watch session. */
export interface Watcher {
  readonly url: string;
  readonly port: number;
  /** Emits "render" (RenderEvent) after every rebuild and "start" when a rebuild begins. */
  readonly events: EventEmitter;
  close(): Promise<void>;
}

/** Starts watching and serving a notebook; resolves once the server listens (the first run continues after). */
export async function startWatch(notebook: string, options: WatchOptions): Promise<Watcher> {
  const session = new WatchSession(notebook, options);
  const port = await session.listen();
  session.files.set([session.notebookPath]);
  session.rebuild();
  return {
    url: `http://127.0.0.1:${port}/`,
    port,
    events: session.events,
    close: () => session.close(),
  };
}

/** The state of one watch, and the steps that advance it. */
export class WatchSession {
  readonly notebookPath: string;
  readonly reportPath: string;
  readonly events = new EventEmitter();
  readonly files: WatchedFiles;
  private readonly io: Io;
  private readonly timeLimitMs: number;
  private readonly server: WatchServer;
  /** What the page shows now. */
  private page: PageContent = htmlPage(
    pageMessage("Running the notebook…", "The report appears here when the first run finishes."),
  );
  /** The last run and the document it ran, from which a prose-only edit is re-rendered. */
  private last: { run: RunRecord; document: NotebookDocument } | undefined;
  /** A file a cell read has changed since the last run, so even a prose-only edit needs a run. */
  private dataChanged = false;
  /** The run in progress, to cancel when a change arrives during it. */
  private running: AbortController | undefined;
  private building: Promise<void> | undefined;
  /** A change arrived during a build: build again when it ends. */
  private again = false;
  private closed = false;
  private timer: NodeJS.Timeout | undefined;
  /** Type errors as a banner on the page (runner/typecheck/), when asked for; the run goes ahead regardless. */
  private checkTypes: ((document: NotebookDocument) => string) | undefined;

  constructor(
    notebook: string,
    private readonly options: WatchOptions,
  ) {
    this.notebookPath = path.resolve(notebook);
    this.reportPath = options.output ? path.resolve(options.output) : defaultReportPath(this.notebookPath);
    this.io = options.io ?? { out: () => undefined, err: () => undefined };
    this.timeLimitMs = options.timeLimitMs ?? DEFAULT_TIME_LIMIT_MS;
    const root = fs.realpathSync(path.dirname(this.notebookPath));
    this.server = new WatchServer(root, path.basename(this.reportPath), () => this.page);
    this.files = new WatchedFiles(this.notebookPath, (kind) => {
      if (kind === "data") this.dataChanged = true;
      this.schedule();
    });
  }

  /** Listens on 127.0.0.1 at the port asked for (0: any free port); gives the port. */
  async listen(): Promise<number> {
    const { server } = this.server;
    await new Promise<void>((resolve, reject) => {
      server.once("error", (e: NodeJS.ErrnoException) => {
        reject(
          e.code === "EADDRINUSE"
            ? new UsageError(`port ${this.options.port} on 127.0.0.1 is in use; choose another with --port`)
            : e,
        );
      });
      server.listen(this.options.port, "127.0.0.1", () => resolve());
    });
    return (server.address() as { port: number }).port;
  }

  /** Step: a change arrived; rebuild once the editor has finished writing (debounced). */
  schedule(): void {
    clearTimeout(this.timer);
    this.timer = setTimeout(() => this.rebuild(), this.options.debounceMs ?? 40);
  }

  /** Step: builds now, or, during a build, cancels its run and builds again when it ends. */
  rebuild(): void {
    if (this.closed) return;
    if (this.building) {
      this.again = true;
      this.running?.abort();
      return;
    }
    this.building = this.build()
      .catch((e) => {
        this.io.err(`tristim: internal error while rebuilding: ${(e as Error).message}\n`);
      })
      .finally(() => {
        this.building = undefined;
        if (this.again && !this.closed) {
          this.again = false;
          this.rebuild();
        }
      });
  }

  /** Step: reads the notebook, then runs its cells or, when only prose changed, re-renders the last run. */
  async build(): Promise<void> {
    const started = performance.now();
    const read = this.read();
    if ("error" in read) return this.showReadError(read.error, started);
    const { document, inputs } = read;
    if (this.options.typecheck)
      this.checkTypes ??= (await import("../typecheck/type-error-banner.ts")).watchTypecheck();
    const signature = runSignature(document, inputs, this.timeLimitMs, this.options.keepGoing);
    if (this.last && this.last.run.signature === signature && !this.dataChanged) {
      const run = moveRecordsToEdit(this.last.run, this.last.document, document);
      this.publish(document, run, this.checkTypes?.(document) ?? "", false, started);
      return;
    }
    this.server.broadcast("running");
    this.events.emit("start");
    this.dataChanged = false;
    this.running = new AbortController();
    let run: RunRecord;
    let banner: string;
    try {
      const running = runDocument(document, {
        onCell: prewarmReport(document),
        inputs: this.options.inputs,
        timeLimitMs: this.timeLimitMs,
        keepGoing: this.options.keepGoing,
        signal: this.running.signal,
        // The next edit's run starts in a cell process readied while this one is shown.
        prepareNext: true,
      });
      banner = this.checkTypes?.(document) ?? ""; // checks while the cells run in their own process
      run = await running;
    } catch (e) {
      if (e instanceof RunCancelled) return;
      throw e;
    } finally {
      this.running = undefined;
    }
    this.publish(document, run, banner, true, started);
  }

  /** Step: writes the report, shows it, watches the files its cells read, and says what was done. */
  publish(
    document: NotebookDocument,
    run: RunRecord,
    banner: string,
    executed: boolean,
    started: number,
  ): void {
    this.last = { run, document };
    // One rendering serves both the file and the page, unless the file links shared assets the page does not.
    let written: ReportParts | undefined;
    let shown: ReportParts;
    try {
      try {
        written = saveReport(document, run, this.reportPath, this.options.linkAssets);
      } catch (e) {
        if (e instanceof NotebookError) throw e;
        this.io.err(`the report could not be written to ${this.reportPath}: ${(e as Error).message}\n`);
      }
      shown =
        written !== undefined && !this.options.linkAssets ? written : renderReportParts(document, run, {});
    } catch (e) {
      // Math in the prose that cannot be typeset: said with its line; the page keeps the last good rendering.
      if (!(e instanceof NotebookError)) throw e;
      const message = e.where(e.file);
      this.io.err(`${message}\n`);
      this.events.emit("render", {
        executed,
        error: message,
        ms: performance.now() - started,
      } satisfies RenderEvent);
      return;
    }
    this.page = {
      before: shown.before,
      ...(shown.embedsPlotly ? { plotly: embeddedPlotlyScript().bytes } : {}),
      after: shown.after,
      banner,
    };
    this.files.set([this.notebookPath, ...run.filesRead.map((f) => f.path)]);
    this.server.broadcast("reload");
    const ms = performance.now() - started;
    const failed = run.cells.filter((c) => c.status === "failed" && !c.failureAllowed).length;
    if (!this.options.quiet || failed) {
      this.io.out(
        `${new Date().toLocaleTimeString()} ${executed ? "ran" : "re-rendered (prose only)"} in ${formatDuration(ms)}${failed ? `; ${failed} failed cell${failed > 1 ? "s" : ""}` : ""}\n`,
      );
    }
    this.events.emit("render", { executed, ms } satisfies RenderEvent);
  }

  async close(): Promise<void> {
    this.closed = true;
    clearTimeout(this.timer);
    this.running?.abort();
    this.files.close();
    await this.server.close();
    await this.building;
    CellProcess.discardSpare(path.dirname(this.notebookPath));
  }

  /** The notebook and its resolved inputs, or the error that kept it from being read. */
  private read():
    | { document: NotebookDocument; inputs: Record<string, InputValue> }
    | { error: NotebookError | UsageError } {
    try {
      const document = readNotebook(this.notebookPath);
      const name = path.basename(this.notebookPath);
      const { inputs } = resolveInputs(document.frontMatter.inputs, this.options.inputs, name);
      return { document, inputs };
    } catch (e) {
      if (e instanceof NotebookError || e instanceof UsageError) return { error: e };
      throw e;
    }
  }

  /** Shows why the notebook could not be read, on the terminal and on the page. */
  private showReadError(error: NotebookError | UsageError, started: number): void {
    const message =
      error instanceof NotebookError ? error.where(path.basename(this.notebookPath)) : error.message;
    this.io.err(`${message}\n`);
    const frame = error instanceof NotebookError ? error.codeFrame : undefined;
    this.page = htmlPage(pageMessage("The notebook could not be read", message, frame));
    this.server.broadcast("reload");
    this.events.emit("render", {
      executed: false,
      error: message,
      ms: performance.now() - started,
    } satisfies RenderEvent);
  }
}
