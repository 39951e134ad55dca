/**
 * Math in prose (runner/report/prose-math.ts): `$…$` and `$$…$$` typeset as MathML by temml when the report is
 * written, with the documented rule that keeps prices as text, escaping, and errors that name the line.
 */
import { spawnSync } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { describe, expect, it } from "vitest";
import { parseNotebook } from "../../runner/parse/parse-notebook.ts";
import { renderCellMarkdown } from "../../runner/report/markdown.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import { NotebookError } from "../../runner/shared/errors.ts";
import { tempFolder, ts } from "./helpers.ts";
import { okCell, runRecord } from "./run-records.ts";

const body = (html: string) =>
  html.slice(html.indexOf('<article class="report-body">'), html.indexOf("</article>"));

describe("math in prose", () => {
  it("typesets inline and display math as MathML, with no script and the TeX kept as an annotation", () => {
    const text =
      "# Filter\n\nτv is the ratio $\\tau_\\mathrm{v} = a/b$ of two sums:\n\n$$\n\\tau_\\mathrm{v} = \\frac{\\sum_\\lambda S V \\tau}{\\sum_\\lambda S V}\n$$\n\n" +
      ts("1");
    const html = body(renderReport(parseNotebook(text, "/lab/nb.md"), runRecord([okCell(0, [])])));
    expect(html).toMatch(/<p>τv is the ratio <math><semantics>[^]*<msub><mi>τ<\/mi>/);
    expect(html).toMatch(/<div class="math-display"><math display="block"[^>]*>[^]*<mfrac>/);
    expect(html).toContain('<annotation encoding="application/x-tex">');
    expect(html).not.toContain("$$");
    expect(html).not.toMatch(/<script/);
  });

  it("leaves prices and amounts as text, and `\\$` as a dollar sign", () => {
    for (const prose of [
      "Costs $5 and $10.",
      "From US$12.50 to US$3.",
      "A $ 4 fee and a $20–$30 range.",
      "Not math: \\$x\\$.",
      "In code: `$x$`.",
    ]) {
      const html = renderCellMarkdown(prose, false);
      expect(html, prose).not.toContain("<math");
      expect(html, prose).toContain("$");
    }
    expect(renderCellMarkdown("Pay $5 for $x$.", false)).toMatch(/Pay \$5 for <math>/);
  });

  it("escapes text inside math like all text, and turns no TeX command into a link or raw HTML", () => {
    const html = renderCellMarkdown(
      "$\\text{<img src=x onerror=alert(1)>}$ and $\\href{javascript:alert(1)}{x}$",
      false,
    );
    expect(html).not.toMatch(/<img|<a /);
    expect(html).toContain("&lt;img");
  });

  it("stops the report with the notebook's file and line for malformed math in the prose", () => {
    const text = '---\ntitle: "T"\n---\n\nFirst line,\nsecond line with $\\frac{a$ broken.\n';
    const doc = parseNotebook(text, "/lab/nb.md");
    let error: unknown;
    try {
      renderReport(doc, runRecord([]));
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(NotebookError);
    expect((error as NotebookError).line).toBe(6);
    expect((error as NotebookError).file).toBe("/lab/nb.md");
    expect(String((error as Error).message)).toMatch(/math could not be typeset: .*\\frac\{a/);
    const unclosed = parseNotebook("Text.\n\n$$\n\\sqrt{2}\n\nMore.\n", "/lab/nb.md");
    expect(() => renderReport(unclosed, runRecord([]))).toThrow(/not closed with \$\$/);
  });

  it("tristim run prints the file and line of malformed math, exits 1 and writes no report", () => {
    const folder = tempFolder();
    fs.writeFileSync(path.join(folder, "nb.md"), "---\ntitle: T\n---\n\nBad $\\frac{a$ here.\n");
    const bin = fileURLToPath(new URL("../../runner/bin.mjs", import.meta.url));
    const result = spawnSync(process.execPath, [bin, "run", "nb.md"], {
      cwd: folder,
      encoding: "utf8",
      timeout: 60_000,
    });
    expect(result.status).toBe(1);
    expect(result.stderr).toMatch(/nb\.md:5: math could not be typeset: .*; nothing was written/);
    expect(fs.existsSync(path.join(folder, "nb.html"))).toBe(false);
  }, 60_000);

  it("marks malformed math in Markdown a cell showed, naming the cell and the line, and writes the rest", () => {
    const doc = parseNotebook("# T\n\n" + ts("1"), "/lab/nb.md");
    const html = renderReport(
      doc,
      runRecord([
        okCell(0, [{ kind: "markdown", text: "Fine $x^2$.\n\nBroken $\\frac{a$ here.", trusted: false }]),
      ]),
    );
    expect(html).toContain(
      '<span class="math-error" role="note">math could not be typeset (in the Markdown shown by cell 1, line 3)',
    );
    expect(html).toMatch(/Fine <math>/);
  });
});
