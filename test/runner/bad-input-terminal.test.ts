/** Control characters from data (an escape sequence in a sample name) are escaped in terminal messages. */
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { escapeControls } from "../../runner/text/terminal-text.ts";
import { notebookFile, ts } from "./helpers.ts";
import { tristimCommand } from "./bad-input-helpers.ts";

describe("control characters on the terminal", () => {
  it("an escape sequence in a sample name read from a data file is printed escaped in the error message", async () => {
    const notebook = notebookFile(
      `# Names\n\n${ts('import fs from "node:fs";\nconst name = fs.readFileSync("names.txt", "utf8").trim();\nthrow new Error(`sample ${name} is out of range`);')}`,
      { "names.txt": "lot\u001b[2J\u001b]0;pwned\u0007-7\u009b31m\n" },
    );
    const r = await tristimCommand(["run", notebook]);
    expect(r.code).toBe(EXIT.notebookFailed);
    expect(r.err).toContain("sample lot\\x1B[2J\\x1B]0;pwned\\x07-7\\x9B31m is out of range");
    expect(r.err).not.toMatch(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/);
  }, 180_000);

  it("keeps newlines, tabs and ordinary text, and shows bidi overrides", () => {
    expect(escapeControls("a\tb\nc Grün ΔE00")).toBe("a\tb\nc Grün ΔE00");
    expect(escapeControls("x\u202Ey\r")).toBe("x\\u202Ey\\x0D");
  });
});
