/**
 * The watch page's HTTP side: the report page with its reload script (encoded once per rendering), the event
 * stream that tells open pages to run or reload, and files beside the notebook (never outside its folder).
 */
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import { escapeHtml } from "../report/escape.ts";

/** Path of the server-sent events stream that tells pages to reload. */
export const EVENTS_PATH = "/__tristim/events";

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

/**
 * The page watch serves: the report's HTML as the text before the embedded Plotly, Plotly's bytes (absent when
 * the page has no figures) and the text after it, and a banner (type errors) shown above it. Kept in parts so
 * that a prose edit never joins or encodes again the 2 MB of Plotly (that cost about 40 ms an edit).
 */
export interface PageContent {
  readonly before: string;
  readonly plotly?: Buffer;
  readonly after: string;
  readonly banner: string;
}

/** A page of plain HTML (no embedded Plotly). */
export function htmlPage(html: string, banner = ""): PageContent {
  return { before: html, after: "", banner };
}

/** Serves the watch page at "/" and at the report's file name, the event stream, and files under `root`. */
export class WatchServer {
  readonly server: http.Server;
  private readonly clients = new Set<http.ServerResponse>();
  private servedFor: PageContent | undefined;
  private served = Buffer.alloc(0);

  constructor(
    private readonly root: string,
    reportName: string,
    private readonly page: () => PageContent,
  ) {
    this.server = http.createServer((req, res) => this.answer(req, res, reportName));
  }

  /** Sends an event ("running", "reload") to every open page. */
  broadcast(event: string): void {
    for (const res of this.clients) res.write(`event: ${event}\ndata: ${Date.now()}\n\n`);
  }

  async close(): Promise<void> {
    for (const res of this.clients) res.end();
    this.clients.clear();
    await new Promise<void>((resolve) => this.server.close(() => resolve()));
  }

  /** The page's bytes; made once per rendering and banner, not per request (a report is megabytes). */
  private pageBytes(): Buffer {
    const content = this.page();
    if (this.servedFor !== content) {
      const reload = (html: string) => html.replace("</body>", `${RELOAD_SCRIPT}\n</body>`);
      const before = content.before.replace(/<body[^>]*>/, (body) => body + content.banner);
      const closesInAfter = content.after.includes("</body>");
      this.served = Buffer.concat([
        Buffer.from(closesInAfter ? before : reload(before)),
        ...(content.plotly ? [content.plotly] : []),
        Buffer.from(closesInAfter ? reload(content.after) : content.after),
      ]);
      this.servedFor = content;
    }
    return this.served;
  }

  private answer(req: http.IncomingMessage, res: http.ServerResponse, reportName: string): void {
    const port = (this.server.address() as { port: number } | null)?.port;
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
      this.clients.add(res);
      req.on("close", () => this.clients.delete(res));
      return;
    }
    if (url.pathname === "/" || url.pathname === `/${encodeURIComponent(reportName)}`) {
      res.writeHead(200, { "content-type": "text/html; charset=utf-8", "cache-control": "no-store" });
      res.end(req.method === "HEAD" ? undefined : this.pageBytes());
      return;
    }
    serveFile(this.root, req.url ?? "/", req.method === "HEAD", res);
  }
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
export function pageMessage(title: string, text: string, frame?: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)}</title>
<style>body{font:16px/1.5 system-ui,sans-serif;max-width:46rem;margin:3rem auto;padding:0 1rem;color:#1d2127}
h1{font-size:1.3rem}pre{background:#fbeeec;border-left:4px solid #9f2a1d;padding:.8rem;overflow-x:auto}</style></head>
<body><h1>${escapeHtml(title)}</h1><p>${escapeHtml(text)}</p>${frame ? `<pre>${escapeHtml(frame)}</pre>` : ""}</body></html>`;
}
