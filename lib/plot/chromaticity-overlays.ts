/**
 * What a chromaticity diagram can carry on top of its reference curves: labelled points (hover with x, y, u′, v′,
 * CCT and Duv), gamut outlines from primaries, tolerance circles and ellipses, and arrows between chromaticities.
 */
import { uvPrimeFromXy, xyFromUvPrime, type Chromaticity } from "../colorimetry/chromaticity.ts";
import { diagramPoint, diagramSpace, type DiagramSpace } from "./chromaticity-space.ts";
import { toXy, type ChromaticityInput } from "./chromaticity-input.ts";
import type { DisplayGamut } from "./display-rgb.ts";
import { rgbSpace, rgbSpaceNames, type RgbSpace } from "../rgb/rgb-space.ts";
import { cctAndDuv } from "../temperature/cct.ts";
import { roundForDisplay as r5, type PlotTrace } from "./figure.ts";
import { FONT_FAMILY, INK, SERIES_COLOURS, SERIES_DASHES, SERIES_MARKERS } from "./style.ts";

/** A chromaticity with a label: {label, x, y}, {label, u, v} or {label, X, Y, Z}; `group` collects points under one legend entry. */
export type LabelledChromaticity = ChromaticityInput & { readonly label: string; readonly group?: string };

/** Custom or measured primaries. */
export interface CustomGamut {
  readonly name: string;
  readonly r: ChromaticityInput;
  readonly g: ChromaticityInput;
  readonly b: ChromaticityInput;
}
/** A gamut outline: a standard RGB space by name (any name lib/rgb's rgbSpace knows), an RgbSpace, or custom primaries. */
export type GamutChoice = DisplayGamut | "BT.709" | string | RgbSpace | CustomGamut;

/** A circle (radius) or ellipse (semi-axes a ≥ b, major axis at `angle` degrees from the horizontal axis) in xy or u′v′. */
export interface ToleranceRegion {
  readonly label?: string;
  readonly center: ChromaticityInput;
  readonly radius?: number;
  readonly ellipse?: { readonly a: number; readonly b: number; readonly angle: number };
  /** The diagram the radius or semi-axes are measured in; default "u'v'". */
  readonly space?: "xy" | "u'v'";
}

/** An arrow from one chromaticity to another (source to filtered light, target to measured). */
export interface ChromaticityArrow {
  readonly from: ChromaticityInput;
  readonly to: ChromaticityInput;
  readonly label?: string;
}

/** Where each standard gamut's primaries come from (for the caption; the legend shows the short name). */
export const GAMUT_SOURCES: Readonly<Record<string, string>> = {
  sRGB: "sRGB (IEC 61966-2-1)",
  "BT.709": "BT.709 (ITU-R BT.709-6)",
  "Display P3": "Display P3 (SMPTE EG 432-1 primaries, D65)",
  "BT.2020": "BT.2020 (ITU-R BT.2020-2)",
};

/** The r, g, b primaries (xy) of a gamut choice, with its legend name. */
export function gamutPrimaries(g: GamutChoice): {
  name: string;
  source: string;
  r: Chromaticity;
  g: Chromaticity;
  b: Chromaticity;
} {
  if (typeof g === "string") {
    let space: RgbSpace;
    try {
      space = rgbSpace(g);
    } catch {
      throw new Error(
        `unknown gamut "${g}"; use ${rgbSpaceNames()
          .map((n) => `"${n}"`)
          .join(", ")}, an RGB space, or {name, r, g, b}`,
      );
    }
    return {
      name: space.name,
      source: GAMUT_SOURCES[space.name] ?? `${space.name} (${space.source})`,
      ...space.primaries,
    };
  }
  if (g && typeof g === "object" && (g as RgbSpace).kind === "rgb space") {
    const space = g as RgbSpace;
    return { name: space.name, source: `${space.name} (${space.source})`, ...space.primaries };
  }
  const c = g as CustomGamut;
  if (!c || typeof c !== "object" || typeof c.name !== "string")
    throw new Error(`gamut ${JSON.stringify(g)} needs a name and r, g, b primaries`);
  return {
    name: c.name,
    source: `${c.name} (given primaries)`,
    r: toXy(c.r, `gamut "${c.name}" red`),
    g: toXy(c.g, `gamut "${c.name}" green`),
    b: toXy(c.b, `gamut "${c.name}" blue`),
  };
}

/** Closed outline traces of the gamuts, each with its own dash so a grey print tells them apart. */
export function gamutTraces(
  gamuts: readonly GamutChoice[],
  space: DiagramSpace,
): { traces: PlotTrace[]; names: string[] } {
  const traces: PlotTrace[] = [];
  const names: string[] = [];
  gamuts.forEach((g, i) => {
    const p = gamutPrimaries(g);
    const pts = [p.r, p.g, p.b, p.r].map((c) => diagramPoint(c, space));
    names.push(p.source);
    traces.push({
      type: "scatter",
      mode: "lines+markers",
      name: escapeHover(p.name),
      x: pts.map((q) => r5(q[0])),
      y: pts.map((q) => r5(q[1])),
      text: ["R", "G", "B", "R"],
      line: {
        color: SERIES_COLOURS[(i + 5) % SERIES_COLOURS.length],
        width: 1.6,
        dash: SERIES_DASHES[i % SERIES_DASHES.length],
      },
      marker: { size: 5, symbol: "square", color: SERIES_COLOURS[(i + 5) % SERIES_COLOURS.length] },
      hovertemplate: `${escapeHover(p.name)}<br>%{text} primary: %{x:.4f}, %{y:.4f}<extra></extra>`,
    });
  });
  return { traces, names };
}

/** Points, one trace per group, with hover readouts of x, y, u′, v′, CCT and Duv (CCT per CIE 015:2018). */
export function pointTraces(points: readonly LabelledChromaticity[], space: DiagramSpace): PlotTrace[] {
  const groups = new Map<string, LabelledChromaticity[]>();
  for (const p of points) {
    if (!p || typeof p.label !== "string") throw new Error(`point ${JSON.stringify(p)} needs a label`);
    const g = p.group ?? "Points";
    if (!groups.has(g)) groups.set(g, []);
    groups.get(g)!.push(p);
  }
  let gi = 0;
  const traces: PlotTrace[] = [];
  for (const [group, list] of groups) {
    const xs: number[] = [],
      ys: number[] = [],
      custom: (string | number)[][] = [];
    for (const p of list) {
      const xy = toXy(p, `point "${p.label}"`);
      const uv = uvPrimeFromXy(xy);
      const at = diagramPoint(xy, space);
      const t = cctOrNothing(xy);
      xs.push(r5(at[0]));
      ys.push(r5(at[1]));
      custom.push([
        xy.x.toFixed(4),
        xy.y.toFixed(4),
        uv.u.toFixed(4),
        uv.v.toFixed(4),
        t ? `${Math.round(t.cct)} K` : "not defined (|Duv| > 0.05)",
        t ? (t.duv >= 0 ? "+" : "−") + Math.abs(t.duv).toFixed(4) : "–",
      ]);
    }
    const colour = SERIES_COLOURS[gi % SERIES_COLOURS.length];
    traces.push({
      type: "scatter",
      mode: "markers+text",
      name: escapeHover(group),
      x: xs,
      y: ys,
      text: list.map((p) => escapeHover(p.label)),
      textposition: "top right",
      textfont: { family: FONT_FAMILY, size: 11, color: INK.text },
      customdata: custom,
      marker: {
        symbol: SERIES_MARKERS[gi % SERIES_MARKERS.length],
        size: 9,
        color: colour,
        line: { color: INK.text, width: 1 },
      },
      hovertemplate:
        "<b>%{text}</b><br>x = %{customdata[0]}, y = %{customdata[1]}<br>u′ = %{customdata[2]}, v′ = %{customdata[3]}<br>CCT %{customdata[4]}<br>Duv %{customdata[5]}<extra>" +
        escapeHover(group) +
        "</extra>",
      cliponaxis: false,
    });
    gi++;
  }
  return traces;
}

/** Outline points of a tolerance region, in xy. */
export function toleranceOutline(t: ToleranceRegion, steps = 96): Chromaticity[] {
  const native = diagramSpace(t.space ?? "u'v'");
  const c = diagramPoint(toXy(t.center, `tolerance "${t.label ?? ""}" centre`), native);
  let a: number, b: number, angle: number;
  if (t.ellipse) {
    ({ a, b, angle } = t.ellipse);
    if (!(a > 0 && b > 0 && Number.isFinite(angle)))
      throw new Error(
        `tolerance ellipse "${t.label ?? ""}": a = ${a}, b = ${b}, angle = ${angle}° must be positive semi-axes and a finite angle`,
      );
  } else if (t.radius !== undefined) {
    if (!(t.radius > 0 && t.radius < 0.2))
      throw new Error(`tolerance circle "${t.label ?? ""}": radius ${t.radius} must lie in (0, 0.2)`);
    a = b = t.radius;
    angle = 0;
  } else throw new Error(`tolerance "${t.label ?? ""}" needs a radius or an ellipse {a, b, angle}`);
  const th = (angle * Math.PI) / 180;
  const out: Chromaticity[] = [];
  for (let k = 0; k <= steps; k++) {
    const s = (2 * Math.PI * k) / steps;
    const ex = a * Math.cos(s),
      ey = b * Math.sin(s);
    const p: [number, number] = [
      c[0] + ex * Math.cos(th) - ey * Math.sin(th),
      c[1] + ex * Math.sin(th) + ey * Math.cos(th),
    ];
    out.push(native === "xy" ? { x: p[0], y: p[1] } : xyFromUvPrime({ u: p[0], v: p[1] }));
  }
  return out;
}

/** Tolerance circles and ellipses, each as a closed outline. */
export function toleranceTraces(regions: readonly ToleranceRegion[], space: DiagramSpace): PlotTrace[] {
  return regions.map((t, i) => {
    const pts = toleranceOutline(t).map((p) => diagramPoint(p, space));
    const what = t.ellipse
      ? `ellipse a = ${t.ellipse.a}, b = ${t.ellipse.b}, ${t.ellipse.angle}°`
      : `radius ${t.radius}`;
    const name = t.label ?? `Tolerance ${i + 1}`;
    return {
      type: "scatter",
      mode: "lines",
      name: escapeHover(name),
      x: pts.map((q) => r5(q[0], 6)),
      y: pts.map((q) => r5(q[1], 6)),
      line: {
        color: SERIES_COLOURS[(i + 3) % SERIES_COLOURS.length],
        width: 1.3,
        dash: SERIES_DASHES[(i + 1) % SERIES_DASHES.length],
      },
      hovertemplate: `${escapeHover(name)}<br>${what} in ${t.space ?? "u'v'"}<extra></extra>`,
    };
  });
}

/** Arrows as layout annotations (tail at `from`, head at `to`), label at the tail. */
export function arrowAnnotations(
  arrows: readonly ChromaticityArrow[],
  space: DiagramSpace,
): Record<string, unknown>[] {
  return arrows.map((a, i) => {
    const from = diagramPoint(toXy(a.from, `arrow ${i + 1} start`), space);
    const to = diagramPoint(toXy(a.to, `arrow ${i + 1} end`), space);
    return {
      x: r5(to[0], 6),
      y: r5(to[1], 6),
      ax: r5(from[0], 6),
      ay: r5(from[1], 6),
      xref: "x",
      yref: "y",
      axref: "x",
      ayref: "y",
      showarrow: true,
      arrowhead: 3,
      arrowsize: 1.1,
      arrowwidth: 1.4,
      arrowcolor: INK.text,
      standoff: 4,
      startstandoff: 4,
      text: a.label ? escapeHover(a.label) : "",
      font: { family: FONT_FAMILY, size: 10, color: INK.text },
      bgcolor: a.label ? "rgba(255,255,255,0.8)" : undefined,
    };
  });
}

/** Escapes text for Plotly's HTML-like hover and annotation strings. */
export function escapeHover(s: string): string {
  return String(s).replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
}

/** CCT and Duv by lib/temperature (CIE 015:2018), or undefined where they are not defined (|Duv| > 0.05, out of range). */
function cctOrNothing(xy: Chromaticity): { cct: number; duv: number } | undefined {
  try {
    return cctAndDuv(xy);
  } catch {
    return undefined;
  }
}
