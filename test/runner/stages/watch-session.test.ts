// Watch's state driven step by step: WatchSession.build() called directly (no file events, no debounce), to see
// which edits run the cells and which only re-render the last run's records.
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { WatchSession, type RenderEvent } from "../../../runner/watch/watch.ts";

const folder = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-watch-session-"));
afterAll(() => fs.rmSync(folder, { recursive: true, force: true }));

/** Drives a WatchSession on `notebook` through `steps`, gathering its render events; closes it whatever happens. */
async function withSession(
  notebook: string,
  steps: (session: WatchSession) => Promise<void>,
): Promise<{ renders: RenderEvent[]; session: WatchSession }> {
  const session = new WatchSession(notebook, {
    port: 0,
    inputs: {},
    keepGoing: false,
    linkAssets: false,
    quiet: true,
    // The steps call build() themselves: file events must not add builds of their own (under load a 40 ms
    // debounce fired between steps and a fourth render appeared), so their debounce outlasts any test.
    debounceMs: 600_000,
  });
  const renders: RenderEvent[] = [];
  session.events.on("render", (e: RenderEvent) => renders.push(e));
  try {
    await session.listen();
    await steps(session);
  } finally {
    await session.close();
  }
  return { renders, session };
}

describe("WatchSession steps", () => {
  it("runs on the first build, re-renders after a prose edit, runs again after a code edit", async () => {
    const notebook = path.join(folder, "steps.md");
    fs.writeFileSync(notebook, "# Steps\n\nFirst words.\n\n```ts\nshow(6 * 7);\n```\n");
    const { renders, session } = await withSession(notebook, async (session) => {
      await session.build();
      fs.writeFileSync(notebook, "# Steps\n\nOther words.\n\n```ts\nshow(6 * 7);\n```\n");
      await session.build();
      fs.writeFileSync(notebook, "# Steps\n\nOther words.\n\n```ts\nshow(6 * 8);\n```\n");
      await session.build();
    });
    expect(renders.map((r) => r.executed)).toEqual([true, false, true]);
    const report = fs.readFileSync(session.reportPath, "utf8");
    expect(report).toContain("Other words.");
    expect(report).toContain("48");
  }, 60_000);

  it("shows a notebook that cannot be read as an error event, without running", async () => {
    const notebook = path.join(folder, "broken.md");
    fs.writeFileSync(notebook, "---\ntitle: [unclosed\n---\n\nText.\n");
    const { renders } = await withSession(notebook, (session) => session.build());
    expect(renders).toHaveLength(1);
    expect(renders[0]!.executed).toBe(false);
    expect(renders[0]!.error).toMatch(/broken\.md:\d+/);
  }, 60_000);
});
