/**
 * The report: built from run records only, escaped, self-contained, numbered, with the summary, contents, Methods
 * and run record. Most tests render hand-made records (no cell process), one runs a real notebook end to end.
 */
import fs from "node:fs";
import { createRequire } from "node:module";
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { OutputRecord, SwatchRecord } from "../../cells/records.ts";
import { parseNotebook } from "../../runner/parse/parse-notebook.ts";
import { writeReport } from "../../runner/report/report-file.ts";
import { PLOTLY_ASSET, prewarmReport, renderReport } from "../../runner/report/render-report.ts";
import type { CellRun, RunRecord } from "../../runner/records/run-record.ts";
import { writeFileAtomic } from "../../runner/shared/write-atomic.ts";
import { runText, tempFolder, ts } from "./helpers.ts";
import { okCell, runRecord } from "./run-records.ts";

const require = createRequire(import.meta.url);
const FIGURE: OutputRecord = {
  kind: "figure",
  spec: { data: [{ type: "scatter", x: [1, 2], y: [3, 4] }], layout: {} },
};

const record = runRecord;
const ok = (index: number, outputs: OutputRecord[]): CellRun => okCell(index, outputs);

describe("the report", () => {
  it("escapes text from cells and data: a sample named <script>alert(1)</script> appears as text", () => {
    const evil = "<script>alert(1)</script>";
    const doc = parseNotebook(`---\ntitle: "${evil}"\n---\n` + ts("1"), "/lab/nb.md");
    const outputs: OutputRecord[] = [
      { kind: "console", stream: "stdout", text: evil },
      { kind: "value", text: evil },
      {
        kind: "table",
        columns: [{ label: evil, unit: evil, numeric: false }],
        rows: [[evil]],
        totalRows: 1,
        caption: evil,
      },
      {
        kind: "swatches",
        swatches: [{ label: evil, hex: "#112233", note: evil, display: evil, outOfDisplayGamut: true }],
      },
      {
        kind: "swatches",
        swatches: [
          { label: evil, hex: "#112233", pair: { label: evil, role: "reference" } },
          { label: evil, hex: "#112233", pair: { label: evil, role: "sample", deltaE00: 1 } },
        ],
      },
      { kind: "markdown", text: `# ${evil}\n\n<img src=x onerror=alert(1)>`, trusted: false },
      { kind: "html", html: evil, trusted: false },
      { kind: "caution", title: evil, text: evil },
      { kind: "figure", spec: { data: [{ name: "</script><script>alert(1)</script>" }] }, caption: evil },
      { kind: "error", failure: "thrown", message: evil, name: "Error" },
    ];
    const html = renderReport(
      doc,
      record([{ ...ok(0, outputs), status: "failed" }], { inputs: { sample: evil } }),
    );
    expect(html).not.toContain(evil);
    expect(html).not.toContain("<img src=x");
    expect(html).toContain("&lt;script&gt;alert(1)&lt;/script&gt;");
    // The only <script> elements are the run record, the carried sources, packed Plotly and its loader, the figure
    // data and the figure drawing code.
    expect(html.match(/<script\b/g)).toHaveLength(6);
  });

  it("renders trusted HTML and Markdown from code as HTML", () => {
    const doc = parseNotebook(ts("1"), "/lab/nb.md");
    const html = renderReport(
      doc,
      record([
        ok(0, [
          { kind: "html", html: "<em class='mine'>made by code</em>", trusted: true },
          { kind: "markdown", text: "<b class='md'>bold</b>", trusted: true },
        ]),
      ]),
    );
    expect(html).toContain("<em class='mine'>made by code</em>");
    expect(html).toContain("<b class='md'>bold</b>");
  });

  it("embeds Plotly once however many figures, and makes no network request", () => {
    const doc = parseNotebook(ts("1") + ts("2"), "/lab/nb.md");
    const html = renderReport(doc, record([ok(0, [FIGURE, FIGURE]), ok(1, [FIGURE])]));
    const plotly = fs.readFileSync(
      path.join(path.dirname(require.resolve("plotly.js-dist-min")), "plotly.min.js"),
      "utf8",
    );
    // Plotly goes in once, gzip-compressed (test/runner/packed-plotly.test.ts unpacks it as the page does).
    expect(html.split('id="tristim-plotly-gzip"').length - 1).toBe(1);
    expect(html).not.toContain(plotly.slice(0, 200));
    expect(html).not.toMatch(/<(script|link|img)[^>]+(src|href)="(https?:)?\/\//);
    expect((html.match(/class="plot-figure"/g) ?? []).length).toBe(3);
  });

  it("is the same page when its figures and sources were prepared while the cells ran", async () => {
    const doc = parseNotebook(ts("1") + ts("2"), "/lab/nb.md");
    const spec = (y: number) => ({
      data: [{ type: "scatter", x: [1, 2], y: [y, 4] }],
      layout: { title: "<b>" },
    });
    const cells = [ok(0, [{ kind: "figure", spec: spec(3) }]), ok(1, [{ kind: "figure", spec: spec(5) }])];
    const fresh = renderReport(doc, record(structuredClone(cells)));
    const warm = prewarmReport(doc);
    for (const cell of cells) warm(cell);
    // Let the highlighting steps and the Plotly read run, as they do between cells.
    for (let i = 0; i < 5; i++) await new Promise((resolve) => setImmediate(resolve));
    expect(renderReport(doc, record(cells))).toBe(fresh);
    expect(fresh).toContain("\\u003cb\\u003e");
  });

  it("leaves Plotly out of a report without figures, and links a shared copy when asked", () => {
    const folder = tempFolder();
    const doc = parseNotebook(ts("1") + ts("2"), path.join(folder, "nb.md"));
    const plain = renderReport(doc, record([ok(0, [{ kind: "value", text: "1" }]), ok(1, [])]));
    expect(plain.length).toBeLessThan(100_000);
    const target = path.join(folder, "nb.html");
    const html = writeReport(doc, record([ok(0, [FIGURE]), ok(1, [])]), target, true);
    expect(html).toContain(`<script src="tristim-assets/${PLOTLY_ASSET}"></script>`);
    expect(html.length).toBeLessThan(100_000);
    expect(fs.statSync(path.join(folder, "tristim-assets", PLOTLY_ASSET)).size).toBeGreaterThan(1_000_000);
  });

  it("numbers figures and tables through the report and applies the fence-line caption", () => {
    const doc = parseNotebook(ts("1", 'caption="Lamp spectra"') + ts("2"), "/lab/nb.md");
    const table: OutputRecord = {
      kind: "table",
      columns: [{ label: "Y", unit: "cd/m²", numeric: true }],
      rows: [["1.5"]],
      totalRows: 3,
    };
    const html = renderReport(
      doc,
      record([ok(0, [FIGURE, FIGURE]), ok(1, [table, { ...FIGURE, caption: "Own caption" }])]),
    );
    expect(html).toContain('<span class="label">Figure 1.</span> Lamp spectra');
    expect(html).toContain('<span class="label">Figure 2.</span></figcaption>');
    expect(html).toContain('<span class="label">Table 1.</span> Columns: Y (cd/m²).</figcaption>');
    expect(html).toContain('<span class="label">Figure 3.</span> Own caption');
    expect(html).toContain('Y<span class="unit">cd/m²</span>');
    expect(html).toContain("the first 1 of 3 rows are shown");
  });

  it("keeps IDs, codes and values with units on one line in tables, and lets prose cells wrap", () => {
    const doc = parseNotebook(ts("1"), "/lab/nb.md");
    const columns = [
      { label: "blank", numeric: false },
      { label: "limit", numeric: false },
      { label: "remark", numeric: false },
      { label: "τv", unit: "%", numeric: true },
    ];
    const rows = [
      ["HG-114-01", "≤ 0.004", "edge chipped at the rim, re-measured after cleaning", "26.54"],
      ["#1a2b3c", "249.6 cd/m²", "ok", "1.2 × 10⁻⁵"],
      [`sha-${"0".repeat(60)}`, "20.0 % to 30.0 % of the reference", "", "3"],
    ];
    const html = renderReport(doc, record([ok(0, [{ kind: "table", columns, rows, totalRows: 3 }])]));
    const cells = [...html.matchAll(/<td( class="([\w-]+)")?>([^<]*)<\/td>/g)].map((m) => [m[3], m[2] ?? ""]);
    const classOf = (text: string) => cells.find(([t]) => t === text)?.[1];
    expect(classOf("HG-114-01")).toBe("one-line");
    expect(classOf("#1a2b3c")).toBe("one-line");
    expect(classOf("≤ 0.004")).toBe("one-line");
    expect(classOf("249.6 cd/m²")).toBe("one-line");
    expect(classOf("ok")).toBe("one-line");
    expect(classOf("1.2 × 10⁻⁵")).toBe("num");
    // Prose, long ranges and very long unbroken strings (hashes, paths) may wrap.
    expect(classOf("edge chipped at the rim, re-measured after cleaning")).toBe("");
    expect(classOf("20.0 % to 30.0 % of the reference")).toBe("");
    expect(classOf(`sha-${"0".repeat(60)}`)).toBe("");
    expect(html).toMatch(/td\.num, td\.one-line \{ white-space: nowrap; \}/);
  });

  it("sets tables of many columns tighter, so they fit an A4 page in print", () => {
    const doc = parseNotebook(ts("1"), "/lab/nb.md");
    const narrow: OutputRecord = {
      kind: "table",
      columns: [{ label: "a", numeric: false }],
      rows: [["x"]],
      totalRows: 1,
    };
    const columns = Array.from({ length: 11 }, (_, i) => ({ label: `c${i}`, numeric: true }));
    const wide: OutputRecord = { kind: "table", columns, rows: [columns.map(() => "1.5")], totalRows: 1 };
    const html = renderReport(doc, record([ok(0, [narrow, wide])]));
    expect(html.match(/<table( class="wide")?><thead>/g)).toEqual([
      "<table><thead>",
      '<table class="wide"><thead>',
    ]);
  });

  it("draws a reference/sample pair as one unit: both patches side by side, the pair's name above, ΔE00 under both", () => {
    const doc = parseNotebook(ts("1"), "/lab/nb.md");
    const pair = (name: string, de: number): SwatchRecord[] => [
      { label: `${name} reference`, hex: "#8a4b2f", pair: { label: name, role: "reference" } },
      {
        label: `${name} sample`,
        hex: "#8c4a2e",
        note: "L* 41",
        pair: { label: name, role: "sample", deltaE00: de },
      },
    ];
    const html = renderReport(
      doc,
      record([
        ok(0, [
          { kind: "swatches", swatches: [...pair("P1", 0.8), ...pair("P2", 1.234), ...pair("P3", 2)] },
          { kind: "swatches", swatches: [{ label: "white tile", hex: "#f4f4f2" }, ...pair("P4", 0.5)] },
        ]),
      ]),
    );
    const items = [...html.matchAll(/<li class="swatch-pair">([\s\S]*?)<\/li>/g)].map((m) => m[1]!);
    expect(items).toHaveLength(4);
    for (const [i, item] of items.entries()) {
      // Name, then exactly two patches (reference first), then the difference: one grid item, never split.
      expect(item).toMatch(new RegExp(`^<p class="pair-label">P${i + 1}</p><div class="pair-members">`));
      expect(item.match(/class="chip"/g)).toHaveLength(2);
      expect(item.indexOf(">reference<")).toBeLessThan(item.indexOf(">sample<"));
      expect(item).toMatch(/<\/div><p class="pair-difference">ΔE00 = \d\.\d\d<\/p>$/);
    }
    expect(items[1]).toContain("ΔE00 = 1.23");
    expect(items[0]).toContain('<span class="swatch-note">L* 41</span>');
    // A figure of pairs only gets the wider grid for pairs; a mixed one keeps single swatches beside the pair.
    expect(html).toContain('<ul class="swatches swatch-pairs"><li class="swatch-pair">');
    expect(html).toContain('<ul class="swatches"><li class="swatch">');
    expect(html).toMatch(/\.swatch-pair \{[^}]*grid-column: span 2;/);
    expect(html).toMatch(/\.swatch, \.swatch-pair,[^{]*\{ break-inside: avoid; \}/);
  });

  it("marks a patch outside its display gamut with a symbol on the patch and words, explained in a legend line", () => {
    const doc = parseNotebook(ts("1"), "/lab/nb.md");
    const html = renderReport(
      doc,
      record([
        ok(0, [
          {
            kind: "swatches",
            swatches: [
              { label: "inside", hex: "#8a4b2f", display: "Display P3", outOfDisplayGamut: false },
              {
                label: "wide",
                hex: "#00ff00",
                css: "color(display-p3 0 1 0)",
                outOfGamut: true,
                display: "Display P3",
                outOfDisplayGamut: false,
              },
              {
                label: "laser",
                hex: "#00ff00",
                css: "color(rec2020 0 1 0)",
                outOfGamut: true,
                display: "Display P3",
                outOfDisplayGamut: true,
              },
              {
                label: "spectral",
                hex: "#00ff00",
                outOfGamut: true,
                display: "Display P3",
                outOfDisplayGamut: true,
                inGamut: { sRGB: false, displayP3: false, bt2020: false },
              },
              {
                label: "lib note",
                hex: "#00ff00",
                outOfGamut: true,
                display: "Display P3",
                outOfDisplayGamut: true,
                note: "outside Display P3: shown clipped",
              },
            ],
          },
          { kind: "swatches", swatches: [{ label: "plain", hex: "#808080" }] },
          {
            kind: "swatches",
            swatches: [
              { label: "old shape", hex: "#00ff00", css: "color(display-p3 0 1 0)", outOfGamut: true },
            ],
          },
        ]),
      ]),
    );
    const swatches = [...html.matchAll(/<li class="swatch[^"]*">([\s\S]*?)<\/li>/g)].map((m) => m[0]);
    const of = (label: string) => swatches.find((s) => s.includes(`>${label}<`))!;
    // Classes: out-of-gamut = outside sRGB (the hex is an approximation); outside-display = marked.
    expect(of("inside")).toMatch(/^<li class="swatch">/);
    expect(of("wide")).toMatch(/^<li class="swatch out-of-gamut">/);
    expect(of("laser")).toMatch(/^<li class="swatch out-of-gamut outside-display">/);
    expect(of("inside")).not.toContain("gamut-mark");
    expect(of("wide")).not.toContain("gamut-mark");
    expect(of("wide")).toContain('<span class="gamut-note">outside sRGB</span>');
    expect(of("laser")).toContain(
      '<span class="gamut-mark" title="Outside the Display P3 gamut">◇</span></span>',
    );
    expect(of("laser")).toContain(
      '<span class="gamut-flag"><span aria-hidden="true">◇</span> outside Display P3</span>',
    );
    expect(of("spectral")).toContain("◇</span> outside Display P3; outside BT.2020 too</span>");
    // The words are not repeated when the note already says them (lib/plot's current notes do).
    expect(of("lib note")).toContain("gamut-mark");
    expect(of("lib note")).not.toContain("gamut-flag");
    expect(of("old shape")).toContain("gamut-mark");
    expect(of("old shape")).toContain("outside sRGB");
    const legends = [...html.matchAll(/<p class="swatch-legend">([\s\S]*?)<\/p>/g)].map((m) =>
      m[1]!.replace(/<[^>]+>/g, ""),
    );
    expect(legends).toEqual([
      "◇ marks a patch whose colour lies outside the Display P3 gamut: no such screen shows it exactly, so the patch is an approximation.",
      "◇ marks a patch whose colour lies outside the sRGB gamut: no such screen shows it exactly, so the patch is an approximation.",
    ]);
  });

  it("prints the title and page numbers at the foot of each page, the title escaped as a CSS string", () => {
    const title = 'Lot "7" </style><script>alert(1)</script> \\ ΔE00';
    const doc = parseNotebook(`---\ntitle: ${JSON.stringify(title)}\n---\n` + ts("1"), "/lab/nb.md");
    const html = renderReport(doc, record([ok(0, [])]));
    const style = /<style media="print">([^<]*)<\/style>/.exec(html)?.[1] ?? "";
    expect(style).toContain('@bottom-right { content: "page " counter(page) " of " counter(pages);');
    const content = /@bottom-left \{ content: ("[^"]*");/.exec(style)?.[1] ?? "";
    // Decode the CSS escapes (CSS Syntax Level 3 §4.3.7: backslash, hex digits, one optional space).
    const decoded = content
      .slice(1, -1)
      .replace(/\\([0-9a-f]{1,6}) ?/g, (_, h: string) => String.fromCodePoint(parseInt(h, 16)));
    expect(decoded).toBe(title);
    expect(html.match(/<\/style>/g)).toHaveLength(2);
    expect(html).not.toContain("<script>alert(1)");
  });

  it("reads as a lab report: title block, contents, folded code, no execution counters", () => {
    const text =
      "---\ntitle: Filter lot 7\nauthor: Q. Lab\ndate: 2024-06-01\n---\n## Setup\n\n" +
      ts("1") +
      "## Results\n\n### Detail\n\n" +
      ts("2", "show-source") +
      ts("3", "hide-source") +
      ts("4", "no-run");
    const doc = parseNotebook(text, "/lab/nb.md");
    const html = renderReport(
      doc,
      record([ok(0, []), ok(1, []), ok(2, []), { index: 3, status: "listing", outputs: [], reads: [] }]),
    );
    expect(html).toContain("<h1>Filter lot 7</h1>");
    // The head of a lab record: who and when in a sentence, the outcome before anything else, no grid of labels.
    expect(html).toContain("<p>Prepared by Q. Lab, dated <time>2024-06-01</time>.</p>");
    expect(html).toContain("by tristim 0.1.0 (3 cells in 1.23 s).</p>");
    expect(html).toContain('<p class="outcome-headline">No acceptance checks were stated</p>');
    expect(html).toContain("All 3 cells ran without error.");
    expect(html).not.toContain('<dl class="meta">');
    expect(html).toMatch(
      /<nav class="contents"[^]*href="#setup"[^]*href="#results"[^]*href="#detail"[^]*href="#run-record"/,
    );
    expect(html).toMatch(
      /<details class="cell-source"><summary>.*?<span class="fold-words">Calculation, cell 1, line/,
    );
    expect(html).toMatch(
      /<details class="cell-source" open><summary>.*?<span class="fold-words">Calculation, cell 2, line/,
    );
    expect(html).not.toContain("Calculation, cell 3");
    expect(html).not.toMatch(/<summary>Code\b/);
    expect(html).toContain("Listing, not run: cell 4");
    expect(html).not.toMatch(/In \[\d+\]|Out\[\d+\]/);
    expect(html).toContain("@media print");
    expect(html).toMatch(/figure, table[^{]*\{ break-inside: avoid; \}/);
  });

  it("describes a table given no caption by its columns, and a figure given none by its plot title", () => {
    const doc = parseNotebook("# T\n\n" + ts("1"), "/lab/nb.md");
    const html = renderReport(
      doc,
      record([
        ok(0, [
          {
            kind: "table",
            columns: [{ label: "blank" }, { label: "τv", unit: "%", numeric: true }],
            rows: [["A", "1"]],
            totalRows: 1,
          } as OutputRecord,
          { kind: "figure", spec: { data: [], layout: { title: { text: "Lot <b>114</b>" } } } },
        ]),
      ]),
    );
    expect(html).toContain('<span class="label">Table 1.</span> Columns: blank, τv (%).</figcaption>');
    expect(html).toContain('<span class="label">Figure 1.</span> Lot 114.</figcaption>');
  });

  it("puts a summary of failed cells and cautions at the top, and marks later cells not run", () => {
    const doc = parseNotebook("## A\n\n" + ts("1") + ts("2") + ts("3"), "/lab/nb.md");
    const error: OutputRecord = {
      kind: "error",
      failure: "thrown",
      name: "RangeError",
      message: "bad wavelength",
      location: { file: "/lab/nb.md", line: 8, column: 3 },
      codeFrame: "> 8 | 2",
    };
    const html = renderReport(
      doc,
      record([
        ok(0, [
          { kind: "caution", title: "Caution", text: "Informative only; the applicable standard decides." },
        ]),
        { index: 1, status: "failed", outputs: [error], reads: [] },
        { index: 2, status: "not-run", outputs: [], reads: [] },
      ]),
    );
    const summary = html.slice(html.indexOf('<section class="summary"'), html.indexOf("<article"));
    expect(summary).toContain("A cell failed");
    expect(summary).toContain(
      '<a href="#cell-2">Cell 2</a> <span class="where">(nb.md:8:3)</span>: RangeError: bad wavelength',
    );
    expect(summary).toContain("Not run because of the failure: cell 3.");
    expect(summary).toContain("Informative only; the applicable standard decides.");
    expect(html).toContain("Cell 3 was not run because cell 2 failed.");
    expect(html.indexOf('<section class="summary"')).toBeLessThan(html.indexOf("<article"));
  });

  it("writes a Methods section from the method log, grouped by topic in reading order, and the run record", () => {
    const doc = parseNotebook(ts("1"), "/lab/nb.md");
    const html = renderReport(
      doc,
      record([ok(0, [])], {
        methods: [
          { topic: "colour difference", statement: "CIEDE2000" },
          { topic: "observer", statement: "CIE 1931 2° standard observer" },
          { topic: "colour difference", statement: "CIE 1976 ΔE*ab" },
        ],
        inputs: { lamp: "A", n: 2 },
        inputsSet: { n: 2 },
        filesRead: [{ path: "/lab/data/lamp.csv", sha256: "cd".repeat(32), cells: [0] }],
      }),
    );
    const methods = html.slice(
      html.indexOf('<section class="methods"'),
      html.indexOf('<section class="run-details"'),
    );
    expect(methods.indexOf("Observer")).toBeLessThan(methods.indexOf("Colour difference"));
    expect(methods).toContain(
      '<strong class="run-in">Colour difference.</strong> CIEDE2000. CIE 1976 ΔE*ab.</p>',
    );
    const details = html.slice(html.indexOf('<section class="run-details"'));
    expect(details).toContain(`SHA-256 ${"ab".repeat(32)}`);
    expect(details).toContain(
      "<td><code>n</code></td><td><code>2</code></td><td>the command line (--input)</td>",
    );
    expect(details).toContain(
      "<td><code>lamp</code></td><td><code>&quot;A&quot;</code></td><td>the notebook&#39;s default</td>",
    );
    expect(details).toContain(`data/lamp.csv</td><td><code class="hash">${"cd".repeat(32)}`);
    expect(details).toMatch(/<td>ran<\/td><td class="num">5 ms<\/td>/);
  });

  it("renders a real run end to end, including errors with their notebook place", async () => {
    const { document, run } = await runText(
      "# Lamp check\n\n" +
        ts("showTable([{ name: '<b>x</b>', Y: 1.23456 }], { digits: 2, units: { Y: 'cd/m²' } });") +
        ts("null.x"),
    );
    const html = renderReport(document, run);
    expect(html).toContain("<h1>Lamp check</h1>");
    expect(html).toContain('<td class="one-line">&lt;b&gt;x&lt;/b&gt;</td><td class="num">1.23</td>');
    expect(html).toContain("TypeError: Cannot read properties of null (reading &#39;x&#39;)");
    expect(html).toContain("at nb.md:7:6");
  });
});

describe("atomic writing", () => {
  it("replaces a file whole and leaves no temporary file", () => {
    const folder = tempFolder();
    const file = path.join(folder, "r.html");
    writeFileAtomic(file, "old");
    writeFileAtomic(file, "new");
    expect(fs.readFileSync(file, "utf8")).toBe("new");
    expect(fs.readdirSync(folder)).toEqual(["r.html"]);
  });

  it("keeps the previous report when writing fails", () => {
    const folder = tempFolder();
    const file = path.join(folder, "r.html");
    fs.writeFileSync(file, "previous report");
    fs.mkdirSync(path.join(folder, "blocker"));
    // Renaming a file over a folder fails; the previous content of the target must survive, with no leftovers.
    expect(() => writeFileAtomic(path.join(folder, "blocker"), "x")).toThrow();
    expect(fs.readFileSync(file, "utf8")).toBe("previous report");
    expect(fs.readdirSync(folder).sort()).toEqual(["blocker", "r.html"]);
  });
});
