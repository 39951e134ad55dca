/**
 * `tristim reference`: the extractor (checked on a small invented library whose comments are known), the plain-text
 * and HTML renderings, and the command's exit codes and messages (checked on the real lib/).
 */
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import {
  closeMatches,
  extractReference,
  referenceCommand,
  renderEntryText,
  renderReferenceHtml,
} from "../../runner/reference/index.ts";

const here = path.dirname(fileURLToPath(import.meta.url));
const fixture = extractReference(path.join(here, "reference-fixture", "lib", "index.ts"));

async function run(args: string[]): Promise<{ code: number; text: string }> {
  let text = "";
  const code = await referenceCommand(args, { write: (s) => void (text += s) });
  return { code, text };
}

describe("extractReference (invented fixture library)", () => {
  it("lists exported functions only, with their topic (lib folder) and file", () => {
    expect(fixture.map((e) => e.name)).toEqual([
      "frameCorner",
      "lensPower",
      "plateThickness",
      "undocumented",
    ]);
    expect(fixture.every((e) => e.topic === "optics" && e.file === "lib/optics/lens.ts")).toBe(true);
  });
  it("reads summary, details, @param, @returns, @source and @example", () => {
    const lens = fixture[1]!;
    expect(lens.signatures).toEqual(["lensPower(aperture: number, options?: LensOptions): number"]);
    expect(lens.summary).toBe("Power of an invented lens.");
    expect(lens.details).toBe("A second paragraph <with markup> that the page must escape.");
    expect(lens.parameters[0]).toMatchObject({
      name: "aperture",
      optional: false,
      doc: "The f-number, dimensionless.",
    });
    expect(lens.returns).toBe("Power in dioptres (1/m).");
    expect(lens.source).toBe("Invented for this test.");
    expect(lens.examples).toEqual(["lensPower(2, { focalLength: 100 })"]);
    expect(lens.documented).toBe(true);
  });
  it("takes each option's meaning from its interface property, or from @param options.name", () => {
    const lens = fixture[1]!;
    expect(lens.parameters[1]!.options).toEqual([
      { name: "focalLength", type: "number", optional: true, doc: "Focal length in mm; default 50." },
      { name: "coated", type: "boolean", optional: true, doc: "Whether the lens is coated; default false." },
    ]);
    const plate = fixture[2]!;
    expect(plate.parameters[1]!.options).toEqual([
      { name: "material", type: "string", optional: true, doc: 'Plate material; default "glass".' },
    ]);
    expect(plate.parameters[1]!.initializer).toBe("{}");
  });
  it("keeps a @param or @returns text that starts with a brace (JSDoc would take it for a type)", () => {
    const corner = fixture[0]!;
    expect(corner.parameters[0]!.doc).toBe("{ width, height } in mm.");
    expect(corner.returns).toBe("{ x, y } of the first corner, in mm.");
  });
  it("marks a function without a comment", () => {
    expect(fixture[3]).toMatchObject({ documented: false, summary: "", source: "", examples: [] });
  });
});

describe("renderings", () => {
  it("plain text shows signature, arguments with options, returns, source and example", () => {
    const text = renderEntryText(fixture[1]!);
    for (const part of [
      "lensPower(aperture: number, options?: LensOptions): number",
      "Arguments",
      ".focalLength (optional): number",
      "Focal length in mm; default 50.",
      "Returns\n  number — Power in dioptres (1/m).",
      "Source\n  Invented for this test.",
      "Example\n  lensPower(2, { focalLength: 100 })",
    ])
      expect(text).toContain(part);
  });
  it("HTML escapes the comments' text, groups by topic and carries the reports' stylesheet", () => {
    const html = renderReferenceHtml(fixture, "0.0.0");
    expect(html).toContain("A second paragraph &lt;with markup&gt; that the page must escape.");
    expect(html).not.toContain("<with markup>");
    expect(html).toContain('<section class="reference-topic" id="topic-optics">');
    expect(html).toContain('id="fn-lensPower"');
    const css = fs.readFileSync(path.join(here, "..", "..", "runner", "report", "report.css"), "utf8");
    expect(html).toContain(css.slice(0, 200));
  });
  it("close matches: case, contained names and small misspellings", () => {
    const names = ["deltaE76", "deltaE94", "deltaE2000", "spectrum", "spectrumOnGrid", "luminance"];
    expect(closeMatches("deltaE", names)).toEqual(["deltaE76", "deltaE94", "deltaE2000"]);
    expect(closeMatches("spectrm", names)).toContain("spectrum");
    expect(closeMatches("lumnance", names)).toEqual(["luminance"]);
    expect(closeMatches("zzzzzz", names)).toEqual([]);
  });
});

// Each command reads lib/ afresh with the compiler (about 2 s, more on a loaded machine).
describe("referenceCommand on lib/", { timeout: 60_000 }, () => {
  it("shows one function in full", async () => {
    const { code, text } = await run(["deltaE2000"]);
    expect(code).toBe(0);
    expect(text).toContain("deltaE2000(");
    expect(text).toMatch(/Source\n {2}\S/);
    expect(text).not.toContain("(not given)");
    expect(text).toMatch(/Example\n {2}\S*deltaE2000\(/);
  });
  it("lists every function by topic without a name", async () => {
    const { code, text } = await run([]);
    expect(code).toBe(0);
    expect(text).toContain("Colour differences (lib/difference)");
    expect(text).toMatch(/\n {2}deltaE76 +\S/);
  });
  it("a topic (lib folder or its title) lists that topic's functions only", async () => {
    const { code, text } = await run(["difference"]);
    expect(code).toBe(0);
    expect(text).toContain("Colour differences (lib/difference)");
    expect(text).not.toContain("(lib/spectrum)");
    expect((await run(["Colour differences"])).text).toBe(text);
  });
  it("an unknown name exits 2 with close matches", async () => {
    const { code, text } = await run(["deltaE"]);
    expect(code).toBe(2);
    // The list grows with the library (deltaEz and deltaEItp joined it in issue 14): check the match, not the list.
    expect(text).toMatch(/no public function is named "deltaE"; close matches: [^\n]*\bdeltaE76\b/);
  });
  it("a wrong command line exits 2", async () => {
    expect((await run(["--nope"])).code).toBe(2);
    expect((await run(["a", "b"])).code).toBe(2);
    expect((await run(["--html", ""])).code).toBe(2);
  });
  it("--html writes the page atomically, leaving no temporary file", async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "tristim-reference-"));
    try {
      const file = path.join(dir, "reference.html");
      const { code, text } = await run(["--html", file]);
      expect(code).toBe(0);
      expect(text).toMatch(/^wrote the reference of \d+ functions/);
      const html = fs.readFileSync(file, "utf8");
      expect(html.startsWith("<!doctype html>")).toBe(true);
      expect(html).toContain('id="fn-spectrum"');
      expect(fs.readdirSync(dir)).toEqual(["reference.html"]);
    } finally {
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });
  it("--html into a missing folder exits 4 with the path", async () => {
    const { code, text } = await run(["--html", "/nonexistent-tristim-folder/reference.html"]);
    expect(code).toBe(4);
    expect(text).toContain("could not write /nonexistent-tristim-folder/reference.html");
  });
});
