// Stage 5 (report), its model alone: numbers, anchors and caution reminders decided once from (document, run),
// and renderers that are pure functions of it.
import MarkdownIt from "markdown-it";
import { describe, expect, it } from "vitest";
import type { OutputRecord } from "../../../cells/records.ts";
import { parseNotebook } from "../../../runner/parse/parse-notebook.ts";
import { checkResults } from "../../../runner/records/check-results.ts";
import { proseMarkdown, renderCellMarkdown } from "../../../runner/report/markdown.ts";
import { renderOutputs } from "../../../runner/report/render-output.ts";
import { reportModel } from "../../../runner/report/report-model.ts";
import { okCell, runRecord } from "../run-records.ts";

const figure: OutputRecord = { kind: "figure", spec: { data: [], layout: {} } };
const table: OutputRecord = {
  kind: "table",
  columns: [{ label: "a", numeric: true }],
  rows: [["1"]],
  totalRows: 1,
};
const check = (label: string): OutputRecord => ({
  kind: "check",
  label,
  passed: true,
  value: 1,
  valueText: "1",
  limits: { max: 2 },
});
const caution = (text: string): OutputRecord => ({ kind: "caution", title: "Caution", text });

const document = parseNotebook(
  '# Model\n\n```ts caption="Lamp spectra"\n1\n```\n\nText.\n\n```ts\n2\n```\n',
  "/lab/nb.md",
);
const run = runRecord([
  okCell(0, [table, figure, check("a"), caution("Not a certification."), check("b")]),
  okCell(1, [
    { kind: "swatches", swatches: [] } as unknown as OutputRecord,
    figure,
    caution("Not a certification."),
    check("c"),
  ]),
]);

describe("reportModel", () => {
  const model = reportModel(document, run);
  const [first, second] = model.cells;

  it("numbers figures (swatches included) and tables across cells in notebook order", () => {
    expect(first!.outputs.map((o) => o.number)).toEqual([1, 1, undefined, undefined, undefined]);
    expect(second!.outputs.map((o) => o.number)).toEqual([2, 3, undefined, undefined]);
  });

  it("gives the fence line's caption to the cell's first uncaptioned figure or table only", () => {
    expect(first!.outputs.map((o) => ("caption" in o.record ? o.record.caption : undefined))).toEqual([
      "Lamp spectra",
      undefined,
      undefined,
      undefined,
      undefined,
    ]);
    expect(run.cells[0]!.outputs[0]).not.toHaveProperty("caption");
  });

  it("lets the fence's caption win over a figure's own caption, keeping both, and never drops it silently", () => {
    const doc = parseNotebook(
      '# M\n\n```ts caption="Lot 114 as measured"\n1\n```\n\n```ts caption="Lost?"\n2\n```\n',
      "/lab/nb.md",
    );
    const own: OutputRecord = {
      kind: "figure",
      caption: "Spectral transmittance (invented data).",
      spec: { data: [] },
    };
    const m = reportModel(doc, runRecord([okCell(0, [own]), okCell(1, [check("x")])]));
    expect((m.cells[0]!.outputs[0]!.record as { caption?: string }).caption).toBe(
      "Lot 114 as measured. Spectral transmittance (invented data).",
    );
    expect(m.cells[1]!.outputs.at(-1)!.record).toEqual({
      kind: "note",
      text: 'The caption on this cell\'s fence line ("Lost?") has no figure or table to go to.',
    });
  });

  it("takes the check anchors from the run's check results, so report and summary link the same rows", () => {
    const anchors = model.cells.flatMap((c) =>
      c.outputs.filter((o) => o.record.kind === "check").map((o) => o.anchor),
    );
    expect(anchors).toEqual(checkResults(run).map((c) => c.anchor));
    expect(anchors).toEqual(["check-1-1", "check-1-2", "check-2-1"]);
  });

  it("says a caution in full once and then as a reminder pointing to it", () => {
    const cautions = model.cells.flatMap((c) => c.outputs.filter((o) => o.record.kind === "caution"));
    expect(cautions.map((o) => o.caution)).toEqual([
      { anchor: "caution-1", repeat: false },
      { anchor: "caution-1", repeat: true },
    ]);
  });

  it("indexes cells by the 0-based line of their opening fence", () => {
    expect([...model.cellsByFence.keys()]).toEqual([2, 8]);
  });

  it("renders a cell's outputs the same way every time (no counters kept between calls)", () => {
    const once = renderOutputs(second!.outputs, model.notebookDir);
    expect(renderOutputs(second!.outputs, model.notebookDir)).toBe(once);
    expect(once).toContain('id="figure-3"');
    expect(once).toContain('id="check-2-1"');
    expect(once).toContain("caution-repeat");
  });
});

describe("cell fences plugin", () => {
  it("applies to the report's prose renderer only, not to other markdown-it instances", () => {
    const fence = "```js\nlet a = 1;\n```\n";
    expect(proseMarkdown.render(fence)).toContain('<pre class="code-block"><code class="hljs language-js">');
    expect(new MarkdownIt().render(fence)).toBe('<pre><code class="language-js">let a = 1;\n</code></pre>\n');
    // A fence in untrusted cell Markdown is highlighted code, never a cell.
    expect(renderCellMarkdown(fence, false)).toContain('class="code-block"');
  });
});
