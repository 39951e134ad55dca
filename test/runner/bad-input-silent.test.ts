/**
 * Nothing silent: an error raised by a timer after the last cell fails the cell that scheduled it (never exit 0),
 * a notebook that is not UTF-8 is refused at the line of its first invalid byte, and huge values and error
 * messages are cut with a note saying how much there was.
 */
import fs from "node:fs";
import { describe, expect, it } from "vitest";
import { EXIT } from "../../runner/shared/exit-codes.ts";
import { errorOf, notebookFile, runText, ts } from "./helpers.ts";
import { tristimCommand } from "./bad-input-helpers.ts";

const LIMIT = 180_000;

describe("late errors from timers after the last cell", () => {
  it(
    "a rejection from a timer after the last cell fails that cell and the command exits 1",
    async () => {
      const notebook = notebookFile(
        `# Late\n\n${ts('setTimeout(() => Promise.reject(new Error("late")), 100);\n1')}`,
      );
      const r = await tristimCommand(["run", notebook]);
      expect(r.hung).toBe(false);
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err).toMatch(/nb\.md:4:\d+: cell 1 failed: .*late/);
      const html = fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8");
      expect(html).toContain("late");
    },
    LIMIT,
  );

  it(
    "a throw from a timer is attributed to the cell that scheduled it, not to the last cell",
    async () => {
      const { run } = await runText(
        `# Late\n\n${ts('setTimeout(() => { throw new Error("from cell one"); }, 300);\n1')}\n${ts("2")}`,
      );
      expect(run.cells[0]!.status).toBe("failed");
      expect(errorOf(run, 0).message).toContain("from cell one");
      expect(run.cells[1]!.status).toBe("ok");
    },
    LIMIT,
  );

  it(
    "a timer that never stops (setInterval) does not keep the run from ending",
    async () => {
      const { run } = await runText(`# Interval\n\n${ts("setInterval(() => undefined, 50);\n1")}`);
      expect(run.cells[0]!.status).toBe("ok");
    },
    LIMIT,
  );
});

describe("notebooks that are not UTF-8", () => {
  it(
    "a Latin-1 notebook is refused at the line and column of its first invalid byte",
    async () => {
      const notebook = notebookFile("");
      fs.writeFileSync(notebook, Buffer.from("# Report\n\nCaf\xe9 and more\n\n```ts\n1\n```\n", "latin1"));
      const r = await tristimCommand(["run", notebook]);
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err).toContain("nb.md:3:4: not UTF-8 text: byte 0xE9 is not valid UTF-8");
      expect(r.err).toContain("Latin-1");
      expect(fs.existsSync(notebook.replace(/\.md$/, ".html"))).toBe(false);
    },
    LIMIT,
  );

  it("valid UTF-8, including a literal U+FFFD, is accepted", async () => {
    const { firstInvalidUtf8 } = await import("../../runner/parse/parse-notebook.ts");
    expect(firstInvalidUtf8(Buffer.from("Grün \uFFFD ok", "utf8"))).toBeUndefined();
    expect(firstInvalidUtf8(Buffer.from([0x61, 0xc3, 0xbc, 0x62, 0xff, 0x63]))).toBe(4);
    // A truncated sequence: C3 followed by an ASCII byte.
    expect(firstInvalidUtf8(Buffer.from([0x61, 0xc3, 0x41]))).toBe(1);
  });
});

describe("data files that are not UTF-8, read by a cell", () => {
  it(
    "a Latin-1 CGATS file and a Latin-1 CSV keep the sample name Grün, and the report states the encoding",
    async () => {
      const notebook = notebookFile(
        `# Readings\n\n${ts('const a = readColourReadings("latin.cgats");\nconst b = readColourReadings("latin.csv");\nshow(`${a.records[0]!.name}|${b.records[0]!.name}`);')}`,
      );
      const folder = notebook.replace(/nb\.md$/, "");
      const cgats =
        'CGATS.17\nORIGINATOR "Invented lab"\nNUMBER_OF_FIELDS 4\nBEGIN_DATA_FORMAT\nSAMPLE_NAME XYZ_X XYZ_Y XYZ_Z\n' +
        'END_DATA_FORMAT\nNUMBER_OF_SETS 1\nBEGIN_DATA\n"Gr\xfcn" 20.1 30.2 10.3\nEND_DATA\n';
      fs.writeFileSync(`${folder}latin.cgats`, Buffer.from(cgats, "latin1"));
      fs.writeFileSync(`${folder}latin.csv`, Buffer.from("name;X;Y;Z\nGr\xfcn;20,1;30,2;10,3\n", "latin1"));
      const r = await tristimCommand(["run", notebook, "--reproducible"]);
      expect(r.err).toBe("");
      expect(r.code).toBe(EXIT.ok);
      const html = fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8");
      expect(html).toContain("Grün|Grün");
      expect(html).not.toContain("\uFFFD");
      expect(html).toMatch(/Windows-1252[^<]*inferred because the bytes are not valid UTF-8/);
    },
    LIMIT,
  );
});

describe("huge values and error messages are cut with a note", () => {
  it(
    "a 20 M-character string value is cut at 200,000 characters with a note saying how long it was",
    async () => {
      const notebook = notebookFile(`# Big value\n\n${ts('"v".repeat(20_000_000) + ["TA", "IL"].join("")')}`);
      const r = await tristimCommand(["run", notebook, "--quiet"]);
      expect(r.code).toBe(EXIT.ok);
      const html = fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8");
      expect(html.length).toBeLessThan(5_000_000);
      expect(html).not.toContain("TAIL");
      expect(html).toContain(
        "Value cut: it has 20.0 million characters; the first 200,000 characters are shown.",
      );
    },
    LIMIT,
  );

  it(
    "a 3 M-character error message is cut on the terminal and in the report, and shown in full once",
    async () => {
      const notebook = notebookFile(
        `# Big error\n\n${ts('throw new Error("Q".repeat(3_000_000) + ["EN", "D"].join(""))')}`,
      );
      const r = await tristimCommand(["run", notebook]);
      expect(r.code).toBe(EXIT.notebookFailed);
      expect(r.err.length).toBeLessThan(5_000);
      expect(r.err).toContain("cut at 500 characters");
      const html = fs.readFileSync(notebook.replace(/\.md$/, ".html"), "utf8");
      expect(html).not.toContain("END");
      expect(html).toContain(
        "[message cut: it has 3.0 million characters; the first 10,000 characters are kept]",
      );
      // The error block holds the 10,000 kept characters once; the summary a 500-character heading; the embedded
      // run record (data, not shown) the kept message.
      const runs = [...html.matchAll(/Q{400,}/g)].map((m) => m[0].length).sort((a, b) => a - b);
      expect(runs).toEqual([493, 10_000, 10_000]);
      expect(html.length).toBeLessThan(200_000);
    },
    LIMIT,
  );
});
