/** CIELAB views: coordinates, C*ab and hab against the CIE 015 formulas, ΔE00 against Sharma et al., marker colours against colorjs.io. */
import Color from "colorjs.io";
import { describe, expect, it } from "vitest";
import { labDisplayHex, labPlane, lightnessChromaPlot } from "../../../lib/plot/index.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "../reference-data.ts";

type Trace = {
  name: string;
  x: (number | null)[];
  y: (number | null)[];
  customdata: string[][];
  marker: { color: string[] };
};
const byName = (fig: { data: unknown[] }, name: string) =>
  (fig.data as Trace[]).find((d) => d.name === name)!;

// Invented readings.
const samples = [
  { label: "S1", lab: { L: 52, a: 41.5, b: 27 } },
  { label: "S2", lab: { L: 40, a: -12, b: -30 }, group: "Lot B" },
];

describe("a*b* plane", () => {
  const fig = labPlane({ samples });
  it("places samples at (a*, b*), equal scales, symmetric range covering them", () => {
    const t = byName(fig, "Samples");
    expect([t.x[0], t.y[0]]).toEqual([41.5, 27]);
    const layout = fig.layout as {
      xaxis: { range: number[] };
      yaxis: { range: number[]; scaleanchor: string };
    };
    expect(layout.xaxis.range[0]).toBe(-layout.xaxis.range[1]!);
    expect(layout.xaxis.range[1]).toBeGreaterThanOrEqual(41.5);
    expect(layout.yaxis.scaleanchor).toBe("x");
  });

  it("hover gives C*ab = √(a*² + b*²) and hab = atan2(b*, a*) (CIE 015:2018 eqs. 8.12–8.13)", () => {
    const c = byName(fig, "Lot B").customdata[0]!;
    expect(Number(c[3])).toBeCloseTo(Math.hypot(-12, -30), 2);
    expect(Number(c[4])).toBeCloseTo((Math.atan2(-30, -12) * 180) / Math.PI + 360, 1);
  });

  it("fills each marker with the sRGB colour colorjs.io gives for that CIELAB (D65) colour, gamut-mapped by CSS Color 4", () => {
    const t = byName(fig, "Samples");
    const hexFor = (L: number, a: number, b: number) => {
      const rgb = new Color("lab-d65", [L, a, b]).toGamut({ space: "srgb", method: "css" }).to("srgb")
        .coords as number[];
      return (
        "#" +
        rgb
          .map((v) =>
            Math.round(Math.min(1, Math.max(0, v)) * 255)
              .toString(16)
              .padStart(2, "0"),
          )
          .join("")
      );
    };
    const distance = (x: string, y: string) =>
      Math.max(
        ...[1, 3, 5].map((i) => Math.abs(parseInt(x.slice(i, i + 2), 16) - parseInt(y.slice(i, i + 2), 16))),
      );
    expect(distance(t.marker.color[0]!, hexFor(52, 41.5, 27))).toBeLessThanOrEqual(1);
    // A colour far outside sRGB (invented): mapped as colorjs.io maps it.
    expect(distance(labDisplayHex({ L: 40, a: 10, b: -110 }), hexFor(40, 10, -110))).toBeLessThanOrEqual(1);
  });

  it("needs samples or pairs, and names a bad reading", () => {
    expect(() => labPlane({})).toThrow(/labPlane: options should be options with samples .* or pairs/);
    expect(() => labPlane({ samples: [{ label: "bad", lab: { L: 50, a: Number.NaN, b: 0 } }] })).toThrow(
      /sample 1 \("bad"\)/,
    );
  });
});

describe.skipIf(!HAVE_REFERENCE)(
  `ΔE vectors (${HAVE_REFERENCE ? "reference present" : NO_REFERENCE})`,
  () => {
    const t = HAVE_REFERENCE ? readReferenceCsv("sharma_ciede2000.csv") : undefined;
    const pairs = HAVE_REFERENCE
      ? t!.rows.slice(0, 12).map((r, i) => ({
          label: `pair ${i + 1}`,
          reference: { L: Number(r[1]), a: Number(r[2]), b: Number(r[3]) },
          sample: { L: Number(r[4]), a: Number(r[5]), b: Number(r[6]) },
        }))
      : [];

    for (const make of [labPlane, lightnessChromaPlot]) {
      it(`${make.name}: sample hover gives ΔE00 as Sharma, Wu & Dalal (2005) Table 1 does; vectors join reference to sample`, () => {
        const fig = make({ pairs });
        const s = byName(fig, "Sample");
        const dE = t!.column("dE00");
        s.customdata.forEach((c, i) => expect(Math.abs(Number(c[5]) - dE[i]!)).toBeLessThanOrEqual(0.0051));
        const v = byName(fig, "Reference → sample");
        const r = byName(fig, "Reference");
        expect([v.x[0], v.y[0]]).toEqual([r.x[0], r.y[0]]);
        expect([v.x[1], v.y[1]]).toEqual([s.x[0], s.y[0]]);
        expect(v.x[2]).toBeNull();
      });
    }
  },
);

describe("L* against C*ab", () => {
  it("plots C*ab across and L* up, L* from 0 to 100", () => {
    const fig = lightnessChromaPlot({ samples });
    const t = byName(fig, "Samples");
    expect(t.x[0]).toBeCloseTo(Math.hypot(41.5, 27), 3);
    expect(t.y[0]).toBe(52);
    expect((fig.layout as { yaxis: { range: number[] } }).yaxis.range).toEqual([0, 100]);
  });
});
