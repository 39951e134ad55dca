/**
 * Figures of display measurement (issue 14): log-axis tick labels read as plain numbers or powers of ten (the
 * numbers they name are the tick values, checked by parsing the labels back; never an SI prefix such as "100μ", the
 * complaint of issue 14), legends below the plot area, every trace drawn from the data it was given. The readings
 * are invented; the PQ reference curve is checked against colorjs.io's rec2100pq.
 */
import Color from "colorjs.io";
import { describe, expect, it } from "vitest";
import * as t from "../../../lib/index.ts";

const SUPER = "⁰¹²³⁴⁵⁶⁷⁸⁹";
/** The number a tick label names: "0.001", "1000" or "10⁻⁵". */
function labelValue(label: string): number {
  const m = /^10([⁻]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+)$/.exec(label);
  if (m)
    return 10 ** Number(m[1]!.replace("⁻", "-").replace(/[⁰¹²³⁴⁵⁶⁷⁸⁹]/g, (c) => String(SUPER.indexOf(c))));
  expect(label).toMatch(/^\d+(\.\d+)?$/);
  return Number(label);
}

type Axis = { type?: string; tickvals?: number[]; ticktext?: string[]; range?: number[] };

describe("decade ticks", () => {
  it("labels every decade from 10⁻⁶ to 10⁵ with the number it stands for, never an SI prefix", () => {
    const { tickvals, ticktext } = t.decadeTicks(2e-6, 9e4);
    expect(tickvals).toHaveLength(12);
    ticktext.forEach((label, i) => {
      expect(label).not.toMatch(/[μµmkMG]/);
      expect(labelValue(label)).toBeCloseTo(tickvals[i]!, 12);
    });
    expect(ticktext).toContain("0.001");
    expect(ticktext).toContain("10⁻⁴");
    expect(ticktext).toContain("1000");
  });
});

describe("EOTF plot", () => {
  const ramp = [0, 0.02, 0.05, 0.1, 0.25, 0.5, 0.75, 1].map((s) => ({
    signal: s,
    luminance: 0.0005 + 400 * s ** 2.4,
  }));
  const fig = t.eotfPlot([{ label: "grey", readings: ramp, fit: t.fitEotf(ramp) }], {
    reference: "PQ",
    peakLuminance: 1000,
  });

  it("has log axes whose ticks cover the data range and read as numbers", () => {
    for (const key of ["xaxis", "yaxis"]) {
      const axis = fig.layout[key] as Axis;
      expect(axis.type).toBe("log");
      axis.ticktext!.forEach((label, i) => expect(labelValue(label)).toBeCloseTo(axis.tickvals![i]!, 12));
      const [lo, hi] = axis.range!;
      expect(Math.min(...axis.tickvals!)).toBeLessThanOrEqual(10 ** lo!);
      expect(Math.max(...axis.tickvals!)).toBeGreaterThanOrEqual(10 ** hi!);
    }
    const y = fig.layout.yaxis as Axis;
    expect(10 ** y.range![0]!).toBeLessThan(0.0005 + 400 * 0.02 ** 2.4);
    expect(10 ** y.range![1]!).toBeGreaterThan(1000);
  });

  it("leaves out the zero-signal reading on a log axis, and draws the PQ reference clipped at the peak", () => {
    const measured = fig.data.find((d) => d.name === "grey (measured)")!;
    expect(measured.x).toEqual(ramp.slice(1).map((r) => r.signal));
    const pq = fig.data.find((d) => String(d.name).startsWith("PQ target"))!;
    const xs = pq.x as number[],
      ys = pq.y as number[];
    xs.forEach((x, i) => {
      const theirs = new Color("rec2100pq", [x, x, x]).to("xyz-abs-d65").coords[1]!;
      // The plotted x is rounded to 6 decimals, so compare relatively.
      expect(Math.abs(ys[i]! - Math.min(theirs, 1000))).toBeLessThanOrEqual(
        1e-4 * Math.min(theirs, 1000) + 1e-6,
      );
    });
  });

  it("puts the legend below the plot area", () => {
    const legend = fig.layout.legend as { yref?: string; y?: number; orientation?: string };
    expect(legend.yref).toBe("container");
    expect(legend.orientation).toBe("h");
    expect(JSON.parse(JSON.stringify(fig))).toEqual(fig);
  });

  it("refuses a series with nothing to plot on log axes", () => {
    expect(() => t.eotfPlot([{ label: "dark", readings: [{ signal: 0, luminance: 0 }] }])).toThrow(
      /eotfPlot: series/,
    );
  });
});

describe("grey-scale tracking plot", () => {
  it("plots Δu′v′ and CCT per level in %, with the limit, legend below", () => {
    const g = t.greyscaleTracking(
      [0.1, 0.3, 0.6, 1].map((s, i) => ({ signal: s, xyz: { X: 95 + i, Y: 100, Z: 109 - 2 * i } })),
    );
    const fig = t.greyscaleTrackingPlot(g, { limit: 0.004 });
    const uv = fig.data[0]!;
    expect(uv.x).toEqual([10, 30, 60, 100]);
    (uv.y as number[]).forEach((v, i) => expect(v).toBeCloseTo(g.levels[i]!.deltaUv, 5));
    expect(fig.data.find((d) => String(d.name).startsWith("QA limit"))!.y).toEqual([0.004, 0.004]);
    expect((fig.layout.legend as { yref: string }).yref).toBe("container");
  });
});

describe("uniformity map", () => {
  it("has one cell per grid point with its luminance ratio and Δu′v′ written in it", () => {
    const p = (Y: number) => ({ X: 0.95 * Y, Y, Z: 1.09 * Y });
    const u = t.displayUniformity([
      [p(180), p(190), p(185)],
      [p(195), p(200), p(196)],
      [p(170), p(188), p(182)],
    ]);
    const fig = t.uniformityMap(u);
    const h = fig.data[0]!;
    expect(h.z).toEqual([
      [90, 95, 92.5],
      [97.5, 100, 98],
      [85, 94, 91],
    ]);
    expect((h.text as string[][])[2]![0]).toBe("85.0 %<br>Δu′v′ 0.0000");
    expect(fig.layout.showlegend).toBe(false);
  });
});
