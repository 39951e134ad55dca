/**
 * Safety cautions: a result that carries a `caution` field gets its caution shown beside it automatically (each
 * distinct text in full once, then a short reminder), in the summary, and announced in the title block; the table
 * does not repeat the text in a column. The caution rule itself is the project's (see notes: results that could
 * feed a safety decision carry one) — common practice, no source.
 */
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { findCautions } from "../../cells/cautions.ts";
import { show, showFigure, showTable } from "../../cells/display.ts";
import { installOutputSink } from "../../cells/output-sink.ts";
import type { OutputRecord } from "../../cells/records.ts";
import { cautionResults } from "../../runner/records/caution-results.ts";
import { parseNotebook } from "../../runner/parse/parse-notebook.ts";
import { renderReport } from "../../runner/report/render-report.ts";
import { outputsOf, runText, ts } from "./helpers.ts";
import { okCell, runRecord } from "./run-records.ts";

const TEXT =
  "Informative only: this is not a certification. The applicable standard, local codes and accredited testing decide.";

describe("finding cautions in shown values", () => {
  it("finds each distinct caution in nested plain objects and arrays, once", () => {
    const rows = [
      { filter: "A", category: { category: 3, caution: TEXT } },
      { filter: "B", category: { category: 2, caution: TEXT } },
      { filter: "C", caution: "Another caution." },
    ];
    expect(findCautions(rows)).toEqual([TEXT, "Another caution."]);
    expect(findCautions({ caution: "" })).toEqual([]);
    expect(findCautions({ caution: 3 })).toEqual([]);
    const circular: Record<string, unknown> = { caution: "x" };
    circular.self = circular;
    expect(findCautions(circular)).toEqual(["x"]);
  });
});

describe("display functions add the caution a result carries", () => {
  let records: OutputRecord[] = [];
  beforeEach(() => {
    records = [];
    installOutputSink((r) => records.push(r));
  });
  afterEach(() => installOutputSink(undefined as never));

  it("after a value, a table and a figure, each distinct text once; the table leaves out the caution column", () => {
    show({ category: 3, caution: TEXT });
    showTable([
      { filter: "A", tv: 0.12, caution: TEXT },
      { filter: "B", tv: 0.3, caution: TEXT },
    ]);
    showFigure({ data: [{ type: "scatter", x: [1], y: [2] }], caution: "Figure caution." } as never);
    expect(records.map((r) => `${r.kind}${r.kind === "caution" ? `:${r.about}` : ""}`)).toEqual([
      "value",
      "caution:value",
      "table",
      "caution:table",
      "figure",
      "caution:figure",
    ]);
    const table = records[2] as Extract<OutputRecord, { kind: "table" }>;
    expect(table.columns.map((c) => c.label)).toEqual(["filter", "tv"]);
  });

  it("keeps a caution column the author asked for", () => {
    showTable([{ filter: "A", caution: TEXT }], { columns: ["filter", "caution"] });
    expect((records[0] as Extract<OutputRecord, { kind: "table" }>).columns.map((c) => c.label)).toEqual([
      "filter",
      "caution",
    ]);
    expect(records[1]).toMatchObject({ kind: "caution", text: TEXT });
  });
});

describe("cautions in a run and its report", () => {
  it("shows the library's sunglass-category caution beside the result, in full once, then as a reminder", async () => {
    const { document, run } = await runText(
      "# Lot\n\n" +
        ts("const c = sunglassCategory(0.12);\nc") +
        ts("showTable([{ filter: 'A', category: sunglassCategory(0.12).category, caution: c.caution }])") +
        ts("1 + 1"),
    );
    expect(run.cells.map((c) => c.status)).toEqual(["ok", "ok", "ok"]);
    const first = outputsOf(run, 0, "caution");
    expect(first).toHaveLength(1);
    // The library's own text (lib/filters/sunglass-category.ts), whatever its wording.
    expect(first[0]!.text).toMatch(/informative only/i);
    expect(outputsOf(run, 1, "caution").map((c) => c.text)).toEqual([first[0]!.text]);
    expect(cautionResults(run)).toHaveLength(1);

    const html = renderReport(document, run);
    const escaped = first[0]!.text.replace(/'/g, "&#39;");
    // In full once beside the first result (and once in the summary); the table in cell 2 gets a short reminder.
    expect(html.split(`<p>${escaped}</p></div></aside>`).length - 1).toBe(1);
    expect(html.split(`${escaped} <a href="#caution-1">(cell 1)</a></li>`).length - 1).toBe(1);
    expect(html).toContain('id="caution-1"');
    expect(html).toContain('class="caution caution-repeat"');
    expect(html).toContain('href="#caution-1"');
    expect(html).toContain("This report contains a caution");
    expect(html).toContain("applies to the table above");
  });

  it("treats a caution already said within an earlier, longer one as the same caution", () => {
    const short = "Informative only: not a certification.";
    const run = runRecord([
      okCell(0, [
        { kind: "caution", title: "Eye protection", text: `${short} Do not release eyewear on this record.` },
      ]),
      okCell(1, [
        { kind: "value", text: "3" },
        { kind: "caution", title: "Caution", text: short, about: "value" },
      ]),
    ]);
    expect(cautionResults(run)).toHaveLength(1);
    const html = renderReport(parseNotebook(ts("1") + ts("2"), "/lab/nb.md"), run);
    expect(html).toContain("This report contains a caution ");
    expect(html.match(/class="caution caution-repeat"/g)).toHaveLength(1);
    expect(html).toContain('<a href="#caution-1">(full text above)</a>');
  });

  it("says nothing about cautions in the title block when there are none", async () => {
    const { document, run } = await runText(ts("show({ category: 1 })"));
    expect(renderReport(document, run)).not.toContain("This report contains");
  });
});
