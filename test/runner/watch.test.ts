/**
 * Watch mode: serves on 127.0.0.1 only, refuses paths outside the notebook's folder, re-runs on a change of the
 * notebook or of a file a cell read, tells open pages to reload, and re-renders prose-only edits without running.
 */
import fs from "node:fs";
import http from "node:http";
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { EVENTS_PATH, startWatch, type RenderEvent, type Watcher } from "../../runner/watch/watch.ts";
import { tempFolder, ts, writeFiles } from "./helpers.ts";

let watcher: Watcher | undefined;
afterEach(async () => {
  await watcher?.close();
  watcher = undefined;
});

function nextRender(w: Watcher): Promise<RenderEvent> {
  return new Promise((resolve) => w.events.once("render", resolve));
}

/** A raw GET (no URL normalisation, so "/../" reaches the server as written). */
function get(
  port: number,
  rawPath: string,
  host = `127.0.0.1:${port}`,
): Promise<{ status: number; body: string }> {
  return new Promise((resolve, reject) => {
    const req = http.request({ host: "127.0.0.1", port, path: rawPath, headers: { host } }, (res) => {
      let body = "";
      res.setEncoding("utf8");
      res.on("data", (c) => (body += c));
      res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
    });
    req.on("error", reject);
    req.end();
  });
}

async function watchFolder(
  files: Record<string, string>,
): Promise<{ folder: string; notebook: string; w: Watcher; first: RenderEvent }> {
  const folder = tempFolder();
  writeFiles(folder, files);
  const notebook = path.join(folder, "nb.md");
  const w = await startWatch(notebook, {
    port: 0,
    inputs: {},
    keepGoing: false,
    linkAssets: false,
    quiet: true,
    debounceMs: 30,
  });
  watcher = w;
  const first = await nextRender(w);
  return { folder, notebook, w, first };
}

const NOTEBOOK =
  "# Watched\n\nFirst prose.\n\n" +
  ts(
    "import fs from 'node:fs';\nfs.appendFileSync('runs.log', 'run\\n');\nconst level = fs.readFileSync('level.txt', 'utf8').trim();\nconsole.log('level ' + level);",
  );

describe("tristim watch", () => {
  it("serves the report on 127.0.0.1 and writes it beside the notebook", async () => {
    const { w, first, folder } = await watchFolder({ "nb.md": NOTEBOOK, "level.txt": "3\n" });
    expect(first.executed).toBe(true);
    expect(w.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/$/);
    const page = await get(w.port, "/");
    expect(page.status).toBe(200);
    expect(page.body).toContain("level 3");
    expect(page.body).toContain(EVENTS_PATH);
    const written = fs.readFileSync(path.join(folder, "nb.html"), "utf8");
    expect(written).toContain("level 3");
    expect(written).not.toContain(EVENTS_PATH);
  });

  it("refuses paths outside the notebook's folder, hidden files, and foreign Host headers", async () => {
    const { w, folder } = await watchFolder({
      "nb.md": NOTEBOOK,
      "level.txt": "1",
      "img/dot.svg": "<svg/>",
      ".secret": "x",
    });
    fs.writeFileSync(path.join(path.dirname(folder), "outside-secret.txt"), "secret");
    expect((await get(w.port, "/img/dot.svg")).status).toBe(200);
    expect((await get(w.port, "/../outside-secret.txt")).status).toBe(403);
    expect((await get(w.port, "/%2e%2e/outside-secret.txt")).status).toBe(403);
    expect((await get(w.port, "/img/..%2f..%2f../outside-secret.txt")).status).toBe(403);
    expect((await get(w.port, "/.secret")).status).toBe(404);
    fs.symlinkSync(path.dirname(folder), path.join(folder, "escape"));
    expect((await get(w.port, "/escape/outside-secret.txt")).status).toBe(403);
    expect((await get(w.port, "/", "evil.example:80")).status).toBe(403);
  });

  it("re-renders a prose-only edit from the last records without running any cell", async () => {
    const { w, folder, notebook } = await watchFolder({ "nb.md": NOTEBOOK, "level.txt": "1" });
    const rendered = nextRender(w);
    fs.writeFileSync(
      notebook,
      NOTEBOOK.replace(
        "First prose.",
        "Edited prose, and a longer paragraph above the cell.\n\nAnother one.",
      ),
    );
    const event = await rendered;
    expect(event.executed).toBe(false);
    expect(fs.readFileSync(path.join(folder, "runs.log"), "utf8")).toBe("run\n");
    const page = await get(w.port, "/");
    expect(page.body).toContain("Another one.");
    expect(page.body).toContain("level 1");
  });

  it("runs again when a cell's code changes or a file a cell read changes, and tells pages to reload", async () => {
    const { w, folder, notebook } = await watchFolder({ "nb.md": NOTEBOOK, "level.txt": "1" });
    const events: string[] = [];
    const stream = http.get(
      { host: "127.0.0.1", port: w.port, path: EVENTS_PATH, headers: { host: `127.0.0.1:${w.port}` } },
      (res) => {
        res.setEncoding("utf8");
        res.on("data", (chunk: string) =>
          events.push(...[...chunk.matchAll(/^event: (\w+)$/gm)].map((m) => m[1]!)),
        );
      },
    );
    await new Promise((r) => setTimeout(r, 100));
    let rendered = nextRender(w);
    fs.writeFileSync(path.join(folder, "level.txt"), "2");
    expect((await rendered).executed).toBe(true);
    expect((await get(w.port, "/")).body).toContain("level 2");
    rendered = nextRender(w);
    fs.writeFileSync(notebook, NOTEBOOK.replace("'level '", "'new level '"));
    expect((await rendered).executed).toBe(true);
    expect((await get(w.port, "/")).body).toContain("new level 2");
    expect(fs.readFileSync(path.join(folder, "runs.log"), "utf8")).toBe("run\nrun\nrun\n");
    await new Promise((r) => setTimeout(r, 50));
    stream.destroy();
    expect(events.filter((e) => e === "reload").length).toBeGreaterThanOrEqual(2);
    expect(events).toContain("running");
  });

  it("shows a notebook that cannot be parsed as an error page instead of stopping", async () => {
    const { w, notebook } = await watchFolder({ "nb.md": NOTEBOOK, "level.txt": "1" });
    const rendered = nextRender(w);
    fs.writeFileSync(notebook, "# Broken\n\n```ts\nconst a = 1;\n");
    const event = await rendered;
    expect(event.error).toContain("never closed");
    expect((await get(w.port, "/")).body).toContain("never closed");
  });
});
