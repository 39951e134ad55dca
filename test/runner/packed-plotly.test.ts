/**
 * The compressed Plotly of a report (issue 18): seven-bit text round-trips any bytes (random, and runs of the three
 * escaped groups), and the page's own loader (runner/report/plotly-loader.js), run here against Node's standard
 * DecompressionStream, Blob and Response with a stand-in document, gives back plotly.min.js byte for byte.
 */
import crypto from "node:crypto";
import fs from "node:fs";
import { createRequire } from "node:module";
import vm from "node:vm";
import { describe, expect, it } from "vitest";
import { embeddedPlotlyScript, plotlyScript } from "../../runner/report/render-report.ts";
import { bytesFromSevenBitText, sevenBitText } from "../../runner/report/seven-bit-text.ts";

const LOADER = fs.readFileSync(new URL("../../runner/report/plotly-loader.js", import.meta.url), "utf8");

describe("seven-bit text", () => {
  it("round-trips random bytes of every length near a 7-byte boundary, at 8/7 of their size", () => {
    for (const n of [0, 1, 6, 7, 8, 13, 14, 15, 1000, 65_537]) {
      const bytes = crypto.randomBytes(n);
      const text = sevenBitText(bytes);
      expect(Buffer.from(bytesFromSevenBitText(text, n))).toEqual(bytes);
      expect(Buffer.byteLength(text, "utf8")).toBeLessThanOrEqual(Math.ceil((n * 8) / 7) + 2);
    }
  });
  it("never writes NUL, CR or < (an HTML parser changes or acts on them) and round-trips bytes made of them", () => {
    // 0x00, 0x0d and 0x3c patterns make the 7-bit groups 0, 13 and 60 over and over.
    const awkward = Buffer.from(Array.from({ length: 4000 }, (_, i) => [0, 0x0d, 0x3c, 0x1a, 0xc3][i % 5]!));
    for (const bytes of [awkward, Buffer.alloc(999), crypto.randomBytes(50_000)]) {
      const text = sevenBitText(bytes);
      expect(text).not.toMatch(/[\0\r<]/);
      expect(Buffer.from(bytesFromSevenBitText(text, bytes.length))).toEqual(bytes);
    }
  });
});

describe("the page's Plotly loader", () => {
  it("unpacks the embedded copy into plotly.min.js exactly", async () => {
    const html = embeddedPlotlyScript().text;
    const m =
      /<script type="application\/gzip" id="tristim-plotly-gzip" data-bytes="(\d+)">([^<]*)<\/script>/.exec(
        html,
      );
    expect(m).not.toBeNull();
    let ran = "";
    const element = {
      textContent: m![2]!,
      getAttribute: (name: string) => (name === "data-bytes" ? m![1] : null),
    };
    const context = {
      document: {
        getElementById: (id: string) => (id === "tristim-plotly-gzip" ? element : null),
        createElement: () => ({ textContent: "" }),
        head: { appendChild: (script: { textContent: string }) => void (ran = script.textContent) },
      },
      DecompressionStream,
      Blob,
      Response,
      Uint8Array,
      Promise,
      Number,
      Error,
    } as Record<string, unknown>;
    context.window = context;
    vm.runInNewContext(LOADER, context);
    await (context.tristimPlotlyReady as Promise<void>);
    const original = fs.readFileSync(createRequire(import.meta.url).resolve("plotly.js-dist-min"), "utf8");
    expect(ran.length).toBe(original.length);
    expect(ran === original).toBe(true);
    expect(plotlyScript() === original).toBe(true);
    // About 1.7 MB in the page instead of 4.8 MB.
    expect(Buffer.byteLength(html)).toBeLessThan(0.4 * Buffer.byteLength(original));
  });
});
