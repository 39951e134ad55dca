/**
 * Overlays of the chromaticity diagrams: gamut outlines against the standards' primaries and an independent
 * colour library, hover readouts of labelled points, tolerance circles/ellipses and arrows; plus the rules every
 * figure follows (plain JSON, a caption, bad input named in the error).
 */
import Color from "colorjs.io";
import { describe, expect, it } from "vitest";
import { chromaticityDiagram } from "../../../lib/plot/index.ts";
import { toleranceOutline } from "../../../lib/plot/chromaticity-overlays.ts";
import { rgbSpaceFromPrimaries } from "../../../lib/rgb/rgb-space.ts";
import { HAVE_REFERENCE, NO_REFERENCE, readReferenceCsv } from "../reference-data.ts";

type Trace = Record<string, unknown> & { name?: string; x: (number | null)[]; y: (number | null)[] };
const byName = (fig: { data: unknown[] }, name: string) => {
  const t = (fig.data as Trace[]).find((d) => d.name === name);
  if (!t) throw new Error(`no trace named ${name}`);
  return t;
};
const uvp = (x: number, y: number) =>
  [(4 * x) / (-2 * x + 12 * y + 3), (9 * y) / (-2 * x + 12 * y + 3)] as const;

// Primaries as the standards print them (recalled from memory): IEC 61966-2-1:1999 (sRGB, = ITU-R BT.709-6),
// SMPTE EG 432-1:2010 (P3, used with D65 by Display P3), ITU-R BT.2020-2 Table 3.
const STANDARD_PRIMARIES = {
  sRGB: [
    [0.64, 0.33],
    [0.3, 0.6],
    [0.15, 0.06],
  ],
  "Display P3": [
    [0.68, 0.32],
    [0.265, 0.69],
    [0.15, 0.06],
  ],
  "BT.2020": [
    [0.708, 0.292],
    [0.17, 0.797],
    [0.131, 0.046],
  ],
} as const;
// colorjs.io space ids for the same gamuts (an independent implementation from the npm registry).
const COLORJS_SPACE = {
  sRGB: "srgb-linear",
  "Display P3": "p3-linear",
  "BT.2020": "rec2020-linear",
} as const;

describe("gamut outlines", () => {
  const names = ["sRGB", "Display P3", "BT.2020"] as const;
  const xyFig = chromaticityDiagram({ gamuts: [...names], fill: false });
  const uvFig = chromaticityDiagram({ diagram: "u'v'", gamuts: [...names], fill: false });

  for (const name of names) {
    it(`${name}: the outline's vertices are the standard's primaries, closed back to red`, () => {
      const t = byName(xyFig, name);
      expect(t.x).toHaveLength(4);
      STANDARD_PRIMARIES[name].forEach(([x, y], i) => {
        expect(t.x[i]).toBeCloseTo(x, 6);
        expect(t.y[i]).toBeCloseTo(y, 6);
      });
      expect([t.x[3], t.y[3]]).toEqual([t.x[0], t.y[0]]);
    });

    it(`${name}: vertices agree with colorjs.io's primaries, in xy and in u′v′`, () => {
      const t = byName(xyFig, name),
        u = byName(uvFig, name);
      [
        [1, 0, 0],
        [0, 1, 0],
        [0, 0, 1],
      ].forEach((rgb, i) => {
        const [X, Y, Z] = new Color(COLORJS_SPACE[name], rgb as [number, number, number]).to("xyz-d65")
          .coords as [number, number, number];
        const x = X / (X + Y + Z),
          y = Y / (X + Y + Z);
        expect(Math.abs((t.x[i] as number) - x)).toBeLessThan(2e-4);
        expect(Math.abs((t.y[i] as number) - y)).toBeLessThan(2e-4);
        const [up, vp] = uvp(x, y);
        expect(Math.abs((u.x[i] as number) - up)).toBeLessThan(2e-4);
        expect(Math.abs((u.y[i] as number) - vp)).toBeLessThan(2e-4);
      });
    });
  }

  it("BT.709 has the sRGB primaries (ITU-R BT.709-6 Table, item 1.3; IEC 61966-2-1 adopts them)", () => {
    const a = byName(chromaticityDiagram({ gamuts: ["BT.709"], fill: false }), "BT.709");
    expect(a.x.slice(0, 3)).toEqual([0.64, 0.3, 0.15]);
  });

  it("custom primaries may be given as xy, u′v′ or XYZ and land on the same point", () => {
    const fig = chromaticityDiagram({
      fill: false,
      gamuts: [
        {
          name: "Measured (invented)",
          r: { x: 0.64, y: 0.33 },
          g: { u: uvp(0.3, 0.6)[0], v: uvp(0.3, 0.6)[1] },
          b: { X: 15, Y: 6, Z: 79 },
        },
      ],
    });
    const t = byName(fig, "Measured (invented)");
    expect(t.x[1]).toBeCloseTo(0.3, 5);
    expect(t.y[1]).toBeCloseTo(0.6, 5);
    expect(t.x[2]).toBeCloseTo(0.15, 5);
    expect(t.y[2]).toBeCloseTo(0.06, 5);
  });

  it("an RGB space from lib/rgb (here from measured primaries) is outlined at its primaries under its own name", () => {
    // Invented measured primaries of a display.
    const measured = rgbSpaceFromPrimaries(
      { r: { x: 0.66, y: 0.325 }, g: { x: 0.29, y: 0.63 }, b: { x: 0.152, y: 0.058 } },
      { x: 0.313, y: 0.33 },
      { name: "Lab monitor (invented)" },
    );
    const t = byName(chromaticityDiagram({ gamuts: [measured], fill: false }), "Lab monitor (invented)");
    expect([t.x[0], t.y[0], t.x[1], t.y[1], t.x[2], t.y[2]]).toEqual([0.66, 0.325, 0.29, 0.63, 0.152, 0.058]);
  });

  it("an unknown gamut name is an error that names it", () => {
    expect(() => chromaticityDiagram({ gamuts: ["Adobe" as "sRGB"] })).toThrow(/unknown gamut "Adobe"/);
  });
});

describe.skipIf(!HAVE_REFERENCE)(
  `labelled points (${HAVE_REFERENCE ? "reference present" : NO_REFERENCE})`,
  () => {
    it("a point at illuminant A's chromaticity hovers with CCT ≈ 2856 K and Duv ≈ 0", () => {
      // A: x = 0.44758, y = 0.40745 (CIE 015:2004 Table T.3); its CCT is 2856 K (CIE 015:2018 §4.1: 2848 K with the
      // old c2, i.e. 2855.5 K with c2 = 1.4388e-2 m·K).
      const t = readReferenceCsv("cie_illuminant_white_points.csv");
      const a = t.rows.find((r) => r[0]!.startsWith("CIE 015:2004") && r[1] === "2" && r[2] === "A")!;
      const fig = chromaticityDiagram({
        fill: false,
        points: [{ label: "A", x: Number(a[6]), y: Number(a[7]) }],
      });
      const p = byName(fig, "Points");
      const custom = (p.customdata as string[][])[0]!;
      expect(custom[0]).toBe(Number(a[6]).toFixed(4));
      expect(custom[4]).toMatch(/^285[56] K$/);
      expect(Math.abs(Number(custom[5]!.replace("−", "-")))).toBeLessThan(2e-4);
      const [u, v] = uvp(Number(a[6]), Number(a[7]));
      expect(custom[2]).toBe(u.toFixed(4));
      expect(custom[3]).toBe(v.toFixed(4));
    });
  },
);

describe("labelled points", () => {
  it("groups points into one trace per group and says when CCT is not defined", () => {
    const fig = chromaticityDiagram({
      fill: false,
      points: [
        { label: "green LED (invented)", x: 0.17, y: 0.7, group: "LEDs" },
        { label: "white (invented)", x: 0.3457, y: 0.3585, group: "Whites" },
      ],
    });
    const leds = byName(fig, "LEDs");
    // |Duv| > 0.05: CIE 015:2018 gives no CCT there.
    expect((leds.customdata as string[][])[0]![4]).toMatch(/not defined/);
    expect(byName(fig, "Whites").x).toEqual([0.3457]);
  });

  it("labels are escaped for Plotly's HTML-like text", () => {
    const fig = chromaticityDiagram({ fill: false, points: [{ label: "<b>x</b>", x: 0.3, y: 0.3 }] });
    expect(byName(fig, "Points").text).toEqual(["&lt;b&gt;x&lt;/b&gt;"]);
  });

  it("a point that is not a chromaticity is an error naming the point", () => {
    expect(() => chromaticityDiagram({ points: [{ label: "bad", x: Number.NaN, y: 0.3 }] })).toThrow(
      /point "bad": x = NaN/,
    );
    expect(() => chromaticityDiagram({ points: [{ label: "bad", x: 0.8, y: 0.5 }] })).toThrow(
      /not a possible chromaticity/,
    );
  });
});

describe("tolerance regions and arrows", () => {
  it("a circle of radius r in u′v′ has every outline point r from its centre in u′v′", () => {
    const c = { x: 0.4369, y: 0.4041 };
    const cu = uvp(c.x, c.y);
    for (const p of toleranceOutline({ center: c, radius: 0.0045 })) {
      const [u, v] = uvp(p.x, p.y);
      expect(Math.hypot(u - cu[0], v - cu[1])).toBeCloseTo(0.0045, 9);
    }
  });

  it("an xy ellipse has its semi-axes a, b along the stated angle", () => {
    const e = { a: 0.0025, b: 0.001, angle: 58 };
    const pts = toleranceOutline({ center: { x: 0.3127, y: 0.329 }, ellipse: e, space: "xy" });
    const th = (58 * Math.PI) / 180;
    // Parametric point k = 0 is the end of the major axis, k = steps/4 the end of the minor axis.
    expect(pts[0]!.x - 0.3127).toBeCloseTo(e.a * Math.cos(th), 9);
    expect(pts[0]!.y - 0.329).toBeCloseTo(e.a * Math.sin(th), 9);
    expect(pts[24]!.x - 0.3127).toBeCloseTo(-e.b * Math.sin(th), 9);
    expect(pts[24]!.y - 0.329).toBeCloseTo(e.b * Math.cos(th), 9);
  });

  it("a tolerance needs a radius or an ellipse", () => {
    expect(() => chromaticityDiagram({ tolerances: [{ label: "T", center: { x: 0.3, y: 0.3 } }] })).toThrow(
      /needs a radius or an ellipse/,
    );
  });

  it("arrows run from the source to the target in diagram coordinates", () => {
    const fig = chromaticityDiagram({
      diagram: "u'v'",
      fill: false,
      arrows: [{ from: { x: 0.4476, y: 0.4074 }, to: { x: 0.38, y: 0.38 }, label: "filter" }],
    });
    const a = (fig.layout.annotations as Record<string, number | string>[])[0]!;
    const [u0, v0] = uvp(0.4476, 0.4074),
      [u1, v1] = uvp(0.38, 0.38);
    expect(a.ax).toBeCloseTo(u0, 5);
    expect(a.ay).toBeCloseTo(v0, 5);
    expect(a.x).toBeCloseTo(u1, 5);
    expect(a.y).toBeCloseTo(v1, 5);
    expect(a.text).toBe("filter");
  });
});

describe("every chromaticity figure", () => {
  const fig = chromaticityDiagram({
    points: [{ label: "P", x: 0.33, y: 0.33 }],
    gamuts: ["sRGB"],
    whitePoints: true,
  });

  it("is plain JSON (no functions, no class instances) and survives a JSON round trip", () => {
    expect(JSON.parse(JSON.stringify(fig))).toEqual(fig);
  });

  it("keeps the report small: under 150 kB including the colour fill (common practice, no source)", () => {
    expect(JSON.stringify(fig).length).toBeLessThan(150_000);
  });

  it("has a title, axis titles, equal axis scales and a caption that calls the fill approximate", () => {
    const layout = fig.layout as Record<string, Record<string, unknown>>;
    expect((layout.title as { text: string }).text).toMatch(/chromaticity diagram/);
    expect((layout.xaxis!.title as { text: string }).text).toBe("x");
    expect((layout.yaxis!.title as { text: string }).text).toBe("y");
    expect(layout.yaxis!.scaleanchor).toBe("x");
    expect(fig.caption).toMatch(/approximate/);
    expect((layout.images as unknown as { source: string }[])[0]!.source).toMatch(/^data:image\/png;base64,/);
  });

  it("does not use Plotly's default template colours", () => {
    // plotly.js's default colorway starts #1f77b4, #ff7f0e (src/components/color/attributes.js); the "plotly" template
    // of the Python package starts #636efa (both recalled from memory).
    const json = JSON.stringify(fig).toLowerCase();
    expect(json).not.toContain("#636efa");
    expect(json).not.toContain("#1f77b4");
    expect((fig.layout as { colorway: string[] }).colorway[0]).not.toBe("#1f77b4");
  });

  it("names a bad option value in its error", () => {
    expect(() => chromaticityDiagram({ diagram: "Lab" })).toThrow(/unknown chromaticity diagram "Lab"/);
    expect(() => chromaticityDiagram({ range: { x: [0.5, 0.2], y: [0, 1] } })).toThrow(/range.x/);
    expect(() => chromaticityDiagram({ observer: "10°", daylight: true })).toThrow(
      /daylight locus is defined for the CIE 1931/,
    );
    expect(() => chromaticityDiagram({ planckian: { duvBand: 0.2 } })).toThrow(/Duv band 0.2/);
  });
});
