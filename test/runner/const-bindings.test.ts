/**
 * A cell's `const` becomes a read-only global value once the cell has finished (so hot loops of later cells read it
 * fast): later cells see the value, may declare the name again, cannot assign to it, and a const the cell never
 * reached (it failed first) still fails to be read, as the binding would.
 */
import { describe, expect, it } from "vitest";
import { consoleText, outputsOf, runText, ts } from "./helpers.ts";

describe("const bindings shared between cells", () => {
  it("are read as values, may be declared again, and refuse assignment", async () => {
    const { run } = await runText(
      ts("const grid = [1, 2, 3];\nlet count = 1;") +
        ts("console.log(grid.length, count);\ncount = 5;") +
        ts("console.log(Object.getOwnPropertyDescriptor(globalThis, 'grid')!.writable, count);") +
        ts("const grid = 'again';\nconsole.log(grid);") +
        ts("console.log(grid);\ngrid = 'changed';", "may-fail"),
    );
    expect(consoleText(run, 1).trim()).toBe("3 1");
    // `let` stays live (a later assignment is seen), `const` is a read-only value.
    expect(consoleText(run, 2).trim()).toBe("false 5");
    expect(consoleText(run, 3).trim()).toBe("again");
    expect(consoleText(run, 4).trim()).toBe("again");
    const error = outputsOf(run, 4, "error")[0]!;
    expect(error.name).toBe("TypeError");
    expect(error.message).toContain("read only");
  });

  it("keeps a const that was never initialised unreadable", async () => {
    const { run } = await runText(
      ts("throw new Error('early');\nconst late = 1;", "may-fail") + ts("console.log(late);", "may-fail"),
    );
    expect(outputsOf(run, 0, "error")[0]!.message).toBe("early");
    expect(outputsOf(run, 1, "error")[0]!.name).toBe("ReferenceError");
  });
});
