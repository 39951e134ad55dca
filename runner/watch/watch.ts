/**
 * `tristim watch`: serves the report on 127.0.0.1, runs the notebook again when it or a file a cell read changes,
 * and tells open pages to reload. An edit that leaves the cells' code, run options and inputs as they were only
 * re-renders the report from the last run's records, without running any cell.
 */
import { EventEmitter } from "node:events";
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import { NotebookError, UsageError } from "../shared/errors.ts";
import type { InputValue } from "../../cells/inputs.ts";
import { resolveInputs } from "../execute/inputs.ts";
import type { NotebookDocument } from "../parse/notebook.ts";
import { readNotebook } from "../parse/parse-notebook.ts";
import { defaultReportPath, writeReport } from "../report/report-file.ts";
import { escapeHtml } from "../report/escape.ts";
import { formatDuration } from "../text/duration.ts";
import { renderReport } from "../report/render-report.ts";
import { moveRecordsToEdit } from "../records/rerender.ts";
import type { RunRecord } from "../records/run-record.ts";
import { runDocument, runSignature } from "../execute/run-notebook.ts";
import { CellProcess, RunCancelled } from "../execute/cell-process.ts";
import { DEFAULT_TIME_LIMIT_MS } from "../shared/time-limit.ts";
import type { CommandOptions, Io } from "../cli/command-options.ts";

/** The port watch listens on unless --port says otherwise. */
export const DEFAULT_PORT = 4178;
/** Path of the server-sent events stream that tells pages to reload. */
export const EVENTS_PATH = "/__tristim/events";

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

const RELOAD_SCRIPT = `<script>(function(){var key="tristim-scroll";var y=sessionStorage.getItem(key);if(y!==null){sessionStorage.removeItem(key);addEventListener("load",function(){scrollTo(0,+y);});}
var badge;var s=new EventSource(${JSON.stringify(EVENTS_PATH)});
s.addEventListener("running",function(){if(!badge){badge=document.createElement("div");badge.textContent="Running the notebook again\\u2026";badge.setAttribute("style","position:fixed;right:12px;bottom:12px;padding:6px 10px;background:#1d2127;color:#fff;font:13px system-ui,sans-serif;border-radius:4px;opacity:.9");document.body.appendChild(badge);}});
s.addEventListener("reload",function(){sessionStorage.setItem(key,String(scrollY));location.reload();});})();</script>`;

const CONTENT_TYPES: Record<string, string> = {
  ".html": "text/html; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".js": "text/javascript; charset=utf-8",
  ".mjs": "text/javascript; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".svg": "image/svg+xml",
  ".png": "image/png",
  ".jpg": "image/jpeg",
  ".jpeg": "image/jpeg",
  ".gif": "image/gif",
  ".webp": "image/webp",
  ".csv": "text/csv; charset=utf-8",
  ".txt": "text/plain; charset=utf-8",
  ".md": "text/plain; charset=utf-8",
};

/** Starts watching and serving a notebook; resolves once the server listens (the first run continues after). */
export async function startWatch(notebook: string, options: WatchOptions): Promise<Watcher> {
  const notebookPath = path.resolve(notebook);
  const root = fs.realpathSync(path.dirname(notebookPath));
  const reportPath = options.output ? path.resolve(options.output) : defaultReportPath(notebookPath);
  const io = options.io ?? { out: () => undefined, err: () => undefined };
  const events = new EventEmitter();
  const clients = new Set<http.ServerResponse>();
  const timeLimitMs = options.timeLimitMs ?? DEFAULT_TIME_LIMIT_MS;
  let servedFor: string | undefined;
  let servedBanner: string | undefined;
  let served = Buffer.alloc(0);
  let html = pageMessage("Running the notebook…", "The report appears here when the first run finishes.");
  let lastRun: RunRecord | undefined;
  let lastDocument: NotebookDocument | undefined;
  let current: AbortController | undefined;
  let building: Promise<void> | undefined;
  let again = false;
  let closed = false;
  /** A file a cell read has changed since the last run, so even a prose-only edit needs a run. */
  let dirtyData = false;
  let timer: NodeJS.Timeout | undefined;
  /** Type errors as a banner on the page (runner/typecheck/), when asked for; the run goes ahead regardless. */
  let typeBanner = "";
  let checkTypes: ((document: NotebookDocument) => string) | undefined;
  const watchers = new Map<string, { watcher: fs.FSWatcher; names: Set<string> }>();

  const broadcast = (event: string) => {
    for (const res of clients) res.write(`event: ${event}\ndata: ${Date.now()}\n\n`);
  };

  const watchFiles = (files: string[]) => {
    const wanted = new Map<string, Set<string>>();
    for (const file of files) {
      const dir = path.dirname(file);
      wanted.set(dir, (wanted.get(dir) ?? new Set()).add(path.basename(file)));
    }
    for (const [dir, entry] of watchers) {
      if (!wanted.has(dir)) (entry.watcher.close(), watchers.delete(dir));
    }
    for (const [dir, names] of wanted) {
      const existing = watchers.get(dir);
      if (existing) {
        existing.names.clear();
        for (const n of names) existing.names.add(n);
        continue;
      }
      try {
        const entry = {
          names,
          watcher: fs.watch(dir, (_event, name) => {
            if (name !== null && !entry.names.has(name.toString())) return;
            // A change to anything but the notebook itself is a change of data: the cells must run again.
            if (name === null || path.join(dir, name.toString()) !== notebookPath) dirtyData = true;
            schedule();
          }),
        };
        entry.watcher.on("error", () => undefined);
        watchers.set(dir, entry);
      } catch {
        // a folder that vanished; nothing to watch there
      }
    }
  };

  const build = async (): Promise<void> => {
    const started = performance.now();
    let document: NotebookDocument;
    let inputs: Record<string, InputValue>;
    try {
      document = readNotebook(notebookPath);
      ({ inputs } = resolveInputs(document.frontMatter.inputs, options.inputs, path.basename(notebookPath)));
    } catch (e) {
      if (!(e instanceof NotebookError) && !(e instanceof UsageError)) throw e;
      const message = e instanceof NotebookError ? e.where(path.basename(notebookPath)) : e.message;
      io.err(`${message}\n`);
      html = pageMessage(
        "The notebook could not be read",
        message,
        e instanceof NotebookError ? e.codeFrame : undefined,
      );
      broadcast("reload");
      events.emit("render", {
        executed: false,
        error: message,
        ms: performance.now() - started,
      } satisfies RenderEvent);
      return;
    }
    if (options.typecheck)
      checkTypes ??= (await import("../typecheck/type-error-banner.ts")).watchTypecheck();
    const signature = runSignature(document, inputs, timeLimitMs, options.keepGoing);
    let run: RunRecord;
    let executed: boolean;
    if (lastRun && lastDocument && lastRun.signature === signature && !dirtyData) {
      run = moveRecordsToEdit(lastRun, lastDocument, document);
      typeBanner = checkTypes?.(document) ?? "";
      executed = false;
    } else {
      broadcast("running");
      events.emit("start");
      dirtyData = false;
      current = new AbortController();
      try {
        const running = runDocument(document, {
          inputs: options.inputs,
          timeLimitMs,
          keepGoing: options.keepGoing,
          signal: current.signal,
          // The next edit's run starts in a cell process readied while this one is shown.
          prepareNext: true,
        });
        typeBanner = checkTypes?.(document) ?? ""; // checks while the cells run in their own process
        run = await running;
      } catch (e) {
        if (e instanceof RunCancelled) return;
        throw e;
      } finally {
        current = undefined;
      }
      executed = true;
    }
    lastRun = run;
    lastDocument = document;
    // One rendering serves both the file and the page, unless the file links shared assets the page does not.
    let written: string | undefined;
    try {
      written = writeReport(document, run, reportPath, options.linkAssets);
    } catch (e) {
      io.err(`the report could not be written to ${reportPath}: ${(e as Error).message}\n`);
    }
    try {
      html = written !== undefined && !options.linkAssets ? written : renderReport(document, run, {});
    } catch (e) {
      // Math in the prose that cannot be typeset: said with its line; the page keeps the last good rendering.
      if (!(e instanceof NotebookError)) throw e;
      io.err(`${e.where(e.file ?? notebookPath)}\n`);
      return;
    }
    watchFiles([notebookPath, ...run.filesRead.map((f) => f.path)]);
    broadcast("reload");
    const ms = performance.now() - started;
    const failed = run.cells.filter((c) => c.status === "failed" && !c.failureAllowed).length;
    if (!options.quiet || failed) {
      io.out(
        `${new Date().toLocaleTimeString()} ${executed ? "ran" : "re-rendered (prose only)"} in ${formatDuration(ms)}${failed ? `; ${failed} failed cell${failed > 1 ? "s" : ""}` : ""}\n`,
      );
    }
    events.emit("render", { executed, ms } satisfies RenderEvent);
  };

  const rebuild = () => {
    if (closed) return;
    if (building) {
      again = true;
      current?.abort();
      return;
    }
    building = build()
      .catch((e) => {
        io.err(`tristim: internal error while rebuilding: ${(e as Error).message}\n`);
      })
      .finally(() => {
        building = undefined;
        if (again && !closed) {
          again = false;
          rebuild();
        }
      });
  };

  function schedule(): void {
    clearTimeout(timer);
    timer = setTimeout(rebuild, options.debounceMs ?? 40);
  }

  const server = http.createServer((req, res) => {
    const port = (server.address() as { port: number } | null)?.port;
    const host = req.headers.host ?? "";
    if (host !== `127.0.0.1:${port}` && host !== `localhost:${port}`) {
      res
        .writeHead(403, { "content-type": "text/plain; charset=utf-8" })
        .end("Forbidden: unexpected Host header\n");
      return;
    }
    if (req.method !== "GET" && req.method !== "HEAD") {
      res.writeHead(405, { allow: "GET, HEAD" }).end();
      return;
    }
    const url = new URL(req.url ?? "/", `http://${host}`);
    if (url.pathname === EVENTS_PATH) {
      res.writeHead(200, {
        "content-type": "text/event-stream",
        "cache-control": "no-store",
        connection: "keep-alive",
      });
      res.write("retry: 1000\n\n");
      clients.add(res);
      req.on("close", () => clients.delete(res));
      return;
    }
    if (url.pathname === "/" || url.pathname === `/${encodeURIComponent(path.basename(reportPath))}`) {
      res.writeHead(200, { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" });
      // The page with its banner and reload script is encoded once per rendering, not per request (a report is ~5 MB).
      if (servedFor !== html || servedBanner !== typeBanner) {
        served = Buffer.from(
          html
            .replace(/<body[^>]*>/, (body) => body + typeBanner)
            .replace("</body>", `${RELOAD_SCRIPT}\n</body>`),
        );
        servedFor = html;
        servedBanner = typeBanner;
      }
      res.end(req.method === "HEAD" ? undefined : served);
      return;
    }
    serveFile(root, req.url ?? "/", req.method === "HEAD", res);
  });

  await new Promise<void>((resolve, reject) => {
    server.once("error", (e: NodeJS.ErrnoException) => {
      reject(
        e.code === "EADDRINUSE"
          ? new UsageError(`port ${options.port} on 127.0.0.1 is in use; choose another with --port`)
          : e,
      );
    });
    server.listen(options.port, "127.0.0.1", () => resolve());
  });
  const port = (server.address() as { port: number }).port;
  watchFiles([notebookPath]);
  rebuild();

  return {
    url: `http://127.0.0.1:${port}/`,
    port,
    events,
    async close() {
      closed = true;
      clearTimeout(timer);
      current?.abort();
      for (const { watcher } of watchers.values()) watcher.close();
      watchers.clear();
      for (const res of clients) res.end();
      clients.clear();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await building;
      CellProcess.discardSpare(path.dirname(notebookPath));
    },
  };
}

/** Serves a file under `root`, refusing anything outside it (.., encoded .., symlinks out, hidden files). */
export function serveFile(root: string, rawUrl: string, head: boolean, res: http.ServerResponse): void {
  const refuse = (code: number, text: string): void =>
    void res.writeHead(code, { "content-type": "text/plain; charset=utf-8" }).end(`${text}\n`);
  let pathname: string;
  try {
    pathname = decodeURIComponent((rawUrl.split("?")[0] ?? "/").split("#")[0]!);
  } catch {
    return refuse(400, "Bad request");
  }
  if (pathname.includes("\0")) return refuse(400, "Bad request");
  const target = path.resolve(root, `.${path.sep}${pathname}`);
  if (target !== root && !target.startsWith(root + path.sep))
    return refuse(403, "Forbidden: outside the notebook's folder");
  if (
    path
      .relative(root, target)
      .split(path.sep)
      .some((part) => part.startsWith("."))
  )
    return refuse(404, "Not found");
  let real: string;
  try {
    real = fs.realpathSync(target);
  } catch {
    return refuse(404, "Not found");
  }
  if (real !== root && !real.startsWith(root + path.sep))
    return refuse(403, "Forbidden: outside the notebook's folder");
  let stat: fs.Stats;
  try {
    stat = fs.statSync(real);
  } catch {
    return refuse(404, "Not found");
  }
  if (!stat.isFile()) return refuse(404, "Not found");
  res.writeHead(200, {
    "content-type": CONTENT_TYPES[path.extname(real).toLowerCase()] ?? "application/octet-stream",
    "content-length": stat.size,
    "cache-control": "no-store",
  });
  if (head) return void res.end();
  fs.createReadStream(real).pipe(res);
}

/** A small page shown before the first run finishes or when the notebook cannot be read. */
function pageMessage(title: string, text: string, frame?: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>
<style>body{font:16px/1.5 system-ui,sans-serif;max-width:46rem;margin:3rem auto;padding:0 1rem;color:#1d2127}
h1{font-size:1.3rem}pre{background:#fbeeec;border-left:4px solid #9f2a1d;padding:.8rem;overflow-x:auto}</style></head>
<body><h1>${escapeHtml(title)}</h1><p>${escapeHtml(text)}</p>${frame ? `<pre>${escapeHtml(frame)}</pre>` : ""}</body></html>`;
}
