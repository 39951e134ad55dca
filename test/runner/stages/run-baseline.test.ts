/**
 * cells/run-baseline.ts on its own (in this test's process): what a run changes is put back, and what cannot be put
 * back, or is still active, makes the process unfit to serve another run.
 */
import path from "node:path";
import { afterEach, describe, expect, it } from "vitest";
import { restoreBaseline, takeBaseline } from "../../../cells/run-baseline.ts";

const g = globalThis as Record<string, unknown>;
const cwd = process.cwd();

afterEach(() => {
  delete g.leftBehind;
  delete (Array.prototype as unknown as Record<string, unknown>).leftBehind;
  delete process.env.TRISTIM_LEFT_BEHIND;
  process.chdir(cwd);
});

describe("run baseline", () => {
  it("puts back globals, a patched prototype, env and the working folder, and says the process is clean", () => {
    const baseline = takeBaseline();
    g.leftBehind = 1;
    (Array.prototype as unknown as Record<string, unknown>).leftBehind = 1;
    const realIsArray = Array.isArray;
    Array.isArray = ((v: unknown) => realIsArray(v)) as typeof Array.isArray;
    process.env.TRISTIM_LEFT_BEHIND = "yes";
    process.chdir(path.parse(cwd).root);
    expect(restoreBaseline(baseline)).toEqual({ clean: true, leftovers: [] });
    expect(g.leftBehind).toBeUndefined();
    expect(([] as unknown as Record<string, unknown>).leftBehind).toBeUndefined();
    expect(Array.isArray).toBe(realIsArray);
    expect(process.env.TRISTIM_LEFT_BEHIND).toBeUndefined();
    expect(process.cwd()).toBe(cwd);
  });

  it("is not clean while a timer is pending, or after a property was made non-configurable", () => {
    const baseline = takeBaseline();
    const timer = setInterval(() => undefined, 60_000);
    const pending = restoreBaseline(baseline);
    clearInterval(timer);
    expect(pending.clean).toBe(false);
    expect(pending.leftovers.join(" ")).toMatch(/Timeout still active/);

    const again = takeBaseline();
    Object.defineProperty(globalThis, "leftBehindForGood", { value: 1, configurable: false });
    const stuck = restoreBaseline(again);
    expect(stuck.clean).toBe(false);
    expect(stuck.leftovers).toContain("globalThis.leftBehindForGood cannot be removed");
  });
});
