/**
 * Isotemperature-line labels: reviewers found that on a zoomed chromaticity diagram (notebooks/display-measurement-
 * record.md, Figure 1) only "6000 K" of five lines was labelled, because labels were put only at the lines' lower ends
 * and those lay outside the plotted range. Now every line with a visible part gets its label, inside the plot area,
 * not overlapping another label, and nearer its own line than any other. The line geometry itself (normal to the
 * Planckian locus in CIE 1960 uv, CIE 015:2018) is checked in locus-and-planckian.test.ts.
 */
import { describe, expect, it } from "vitest";
import { chromaticityDiagram, type ChromaticityDiagramOptions } from "../../../lib/plot/index.ts";
import {
  boxAt,
  boxesOverlap,
  clipSegment,
  squarePlotFrame,
  textSize,
  toPx,
  type Px,
} from "../../../lib/plot/line-labels.ts";
import type { PlotTrace } from "../../../lib/plot/figure.ts";

type Range = { x: readonly [number, number]; y: readonly [number, number] };
const WHOLE: Record<string, Range> = {
  xy: { x: [-0.045, 0.8], y: [-0.045, 0.9] },
  "u'v'": { x: [-0.045, 0.67], y: [-0.045, 0.62] },
};
const WHITE: Record<string, Range> = {
  xy: { x: [0.24, 0.56], y: [0.24, 0.46] },
  "u'v'": { x: [0.16, 0.3], y: [0.42, 0.56] },
};

function trace(fig: { data: PlotTrace[] }, name: RegExp): PlotTrace | undefined {
  return fig.data.find((t) => name.test(String(t.name)));
}

/** The drawn isotemperature segments (x, y pairs separated by null) with their temperatures, in option order. */
function segments(
  fig: { data: PlotTrace[] },
  temps: readonly number[],
): { t: number; a: [number, number]; b: [number, number] }[] {
  const tr = trace(fig, /^Isotemperature lines/)!;
  const x = tr.x as (number | null)[],
    y = tr.y as (number | null)[];
  return temps.map((t, i) => ({ t, a: [x[3 * i]!, y[3 * i]!], b: [x[3 * i + 1]!, y[3 * i + 1]!] }));
}

function distanceToSegment(
  p: readonly [number, number],
  a: readonly [number, number],
  b: readonly [number, number],
): number {
  const dx = b[0] - a[0],
    dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy));
}

function checkLabels(
  options: ChromaticityDiagramOptions,
  range: Range,
  temps: readonly number[],
): { labelled: string[]; visible: string[] } {
  const fig = chromaticityDiagram(options);
  const segs = segments(fig, temps);
  const frame = squarePlotFrame(range, options.height ?? 600);
  const area = { x0: 0, y0: 0, x1: frame.width, y1: frame.height };
  const visible = segs
    .filter((s) => clipSegment(toPx(frame, s.a) as Px, toPx(frame, s.b) as Px, area))
    .map((s) => `${s.t} K`);
  const labels = trace(fig, /^CCT labels$/);
  const texts = (labels?.text as string[] | undefined) ?? [];
  expect(labels?.textposition ?? "middle center").toBe("middle center");
  const boxes = texts.map((text, i) => {
    const at: [number, number] = [(labels!.x as number[])[i]!, (labels!.y as number[])[i]!];
    // Inside the plotted range, with its whole estimated text box inside the plot area.
    expect(
      at[0] > range.x[0] && at[0] < range.x[1] && at[1] > range.y[0] && at[1] < range.y[1],
      `${text} at ${at}`,
    ).toBe(true);
    const box = boxAt(toPx(frame, at), textSize(text, 9));
    expect(
      box.x0 >= 0 && box.y0 >= 0 && box.x1 <= frame.width && box.y1 <= frame.height,
      `${text} box inside`,
    ).toBe(true);
    // Nearer its own line than any other isotemperature line, so a reader cannot attach it to the wrong one.
    const own = segs.find((s) => `${s.t} K` === text)!;
    const dOwn = distanceToSegment(at, own.a, own.b);
    for (const other of segs.filter((s) => s !== own))
      expect(dOwn, `${text} vs ${other.t} K`).toBeLessThan(distanceToSegment(at, other.a, other.b));
    return box;
  });
  for (let i = 0; i < boxes.length; i++)
    for (let j = i + 1; j < boxes.length; j++)
      expect(boxesOverlap(boxes[i]!, boxes[j]!), `${texts[i]} / ${texts[j]}`).toBe(false);
  return { labelled: [...texts].sort(), visible: [...visible].sort() };
}

describe("every visible isotemperature line is labelled, inside the plot, without overlaps", () => {
  it("the zoomed u′v′ diagram of the display record: all five lines (5500–7500 K) labelled, not only 6000 K", () => {
    const temps = [5500, 6000, 6500, 7000, 7500];
    const range: Range = { x: [0.184, 0.212], y: [0.458, 0.48] };
    const d65 = { x: 0.31272, y: 0.32903 }; // CIE 015:2004 Table T.3 (5 nm, 380–780 nm)
    const r = checkLabels(
      {
        diagram: "u'v'",
        range,
        whitePoints: false,
        planckian: { isotemperature: temps, isotemperatureExtent: 0.01 },
        daylight: true,
        points: [
          { label: "D65 target", ...d65, group: "target" },
          { label: "white (invented)", x: 0.31133, y: 0.33284, group: "measured" },
        ],
        tolerances: [{ label: "QA limit", center: d65, radius: 0.004, space: "u'v'" }],
        arrows: [{ from: d65, to: { x: 0.31133, y: 0.33284 } }],
      },
      range,
      temps,
    );
    expect(r.visible).toEqual(temps.map((t) => `${t} K`).sort());
    expect(r.labelled).toEqual(r.visible);
  });

  it.each([
    ["xy", "whole"],
    ["u'v'", "whole"],
    ["xy", "white region"],
    ["u'v'", "white region"],
  ] as const)("%s diagram, %s, with the default lines, all white points and a point", (diagram, which) => {
    const zoomed = which === "white region";
    const temps = zoomed
      ? [2000, 2500, 3000, 3500, 4000, 4500, 5000, 5700, 6500, 8000, 10000]
      : [1500, 2000, 3000, 4000, 6500, 10000];
    const r = checkLabels(
      {
        diagram,
        range: zoomed ? "white region" : undefined,
        whitePoints: true,
        points: [{ label: "lamp (invented)", x: 0.4476, y: 0.4074 }],
      },
      zoomed ? WHITE[diagram]! : WHOLE[diagram]!,
      temps,
    );
    expect(r.visible.length).toBeGreaterThanOrEqual(zoomed ? 9 : 6);
    expect(r.labelled).toEqual(r.visible);
  });

  it("a line wholly outside the plotted range gets no label", () => {
    const temps = [2000, 6500];
    const range: Range = { x: [0.19, 0.21], y: [0.46, 0.48] };
    const r = checkLabels(
      {
        diagram: "u'v'",
        range,
        whitePoints: false,
        planckian: { isotemperature: temps, isotemperatureExtent: 0.01 },
      },
      range,
      temps,
    );
    expect(r.visible).toEqual(["6500 K"]);
    expect(r.labelled).toEqual(["6500 K"]);
  });
});

describe("clipSegment (Liang–Barsky)", () => {
  it("returns the parameters of the part inside a box, or undefined when the segment misses it", () => {
    const box = { x0: 0, y0: 0, x1: 10, y1: 10 };
    expect(clipSegment([-5, 5], [15, 5], box)).toEqual([0.25, 0.75]);
    expect(clipSegment([2, 2], [8, 8], box)).toEqual([0, 1]);
    expect(clipSegment([-5, -5], [-1, 20], box)).toBeUndefined();
    expect(clipSegment([5, 12], [5, 11], box)).toBeUndefined();
  });
});
