/**
 * The raster layers (PNG writer, chromaticity fill, visible band) and spectrum plots: PNG structure against the PNG
 * specification, fill colours against the sRGB standard's primaries and white, axis quantities and units.
 */
import { inflateSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { spectrumPlot } from "../../../lib/plot/index.ts";
import { crc32, encodePng } from "../../../lib/plot/png-image.ts";
import { chromaticityFill } from "../../../lib/plot/chromaticity-fill.ts";
import { spectralLocus } from "../../../lib/plot/spectral-locus.ts";
import { spectralDisplayColour } from "../../../lib/plot/spectrum-band.ts";
import { brightDisplayColour } from "../../../lib/plot/display-rgb.ts";
import { xyFromDiagram, type DiagramSpace } from "../../../lib/plot/chromaticity-space.ts";
import { chromaticityDiagram } from "../../../lib/plot/chromaticity-diagram.ts";
import { illuminant } from "../../../lib/illuminants/standard-illuminant.ts";
import { spectrum } from "../../../lib/spectrum/spectrum.ts";

/** Decodes our PNGs (8-bit RGBA, one IDAT) by the PNG specification (W3C PNG 2nd ed. §9 filters), independently of the writer. */
function decodePng(png: Uint8Array): { width: number; height: number; rgba: Uint8Array } {
  const view = new DataView(png.buffer, png.byteOffset, png.byteLength);
  let o = 8,
    width = 0,
    height = 0;
  const idat: Uint8Array[] = [];
  while (o < png.length) {
    const len = view.getUint32(o);
    const type = String.fromCharCode(...png.subarray(o + 4, o + 8));
    if (type === "IHDR") [width, height] = [view.getUint32(o + 8), view.getUint32(o + 12)];
    if (type === "IDAT") idat.push(png.subarray(o + 8, o + 8 + len));
    o += 12 + len;
  }
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * 4,
    out = new Uint8Array(width * height * 4);
  for (let y = 0; y < height; y++) {
    const f = raw[y * (stride + 1)]!;
    for (let i = 0; i < stride; i++) {
      const x = raw[y * (stride + 1) + 1 + i]!;
      const a = i >= 4 ? out[y * stride + i - 4]! : 0,
        b = y > 0 ? out[(y - 1) * stride + i]! : 0,
        c = y > 0 && i >= 4 ? out[(y - 1) * stride + i - 4]! : 0;
      const p = a + b - c,
        pa = Math.abs(p - a),
        pb = Math.abs(p - b),
        pc = Math.abs(p - c);
      const pred = [0, a, b, (a + b) >> 1, pa <= pb && pa <= pc ? a : pb <= pc ? b : c][f]!;
      out[y * stride + i] = (x + pred) & 255;
    }
  }
  return { width, height, rgba: out };
}

describe("PNG writer", () => {
  it('CRC-32 of "123456789" is 0xCBF43926 (the check value of CRC-32/ISO-HDLC, recalled from memory)', () => {
    expect(crc32(new TextEncoder().encode("123456789"))).toBe(0xcbf43926);
  });

  it("writes the PNG signature, IHDR for 8-bit RGBA, and pixels that decode back unchanged", () => {
    const w = 7,
      h = 5,
      rgba = new Uint8Array(w * h * 4).map((_, i) => (i * 37 + (i >> 3)) & 255);
    const png = encodePng(w, h, rgba);
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(String.fromCharCode(...png.subarray(12, 16))).toBe("IHDR");
    expect(png[24]).toBe(8); // bit depth
    expect(png[25]).toBe(6); // colour type 6: RGBA
    const d = decodePng(png);
    expect([d.width, d.height]).toEqual([w, h]);
    expect([...d.rgba]).toEqual([...rgba]);
    // Each chunk's CRC covers its type and data (PNG spec §5.3): check IHDR's.
    const view = new DataView(png.buffer);
    expect(view.getUint32(29)).toBe(crc32(png, 12, 29));
  });

  it("refuses a pixel buffer of the wrong size", () => {
    expect(() => encodePng(2, 2, new Uint8Array(15))).toThrow(/15 bytes of pixels for 2 × 2 px/);
  });
});

describe("approximate colour fill of the xy diagram", () => {
  const locus = spectralLocus("2°", "xy", 380, 780).map((p) => p.at);
  const img = chromaticityFill(locus, "xy", [0, 0.8], [0, 0.9], { resolution: 160, veil: 0 });
  const d = decodePng(Buffer.from(img.source.replace(/^data:image\/png;base64,/, ""), "base64"));
  const pixel = (x: number, y: number) => {
    const i = Math.floor((x / 0.8) * d.width),
      j = Math.floor(((0.9 - y) / 0.9) * d.height);
    return [...d.rgba.subarray((j * d.width + i) * 4, (j * d.width + i) * 4 + 4)];
  };

  it("is white at D65, the sRGB white point (IEC 61966-2-1: x = 0.3127, y = 0.3290)", () => {
    const [r, g, b, a] = pixel(0.3127, 0.329);
    expect(a).toBe(255);
    for (const c of [r, g, b]) expect(c).toBeGreaterThanOrEqual(250);
  });

  it("is pure red, green and blue at the sRGB primaries (IEC 61966-2-1), to within a pixel's chromaticity spread", () => {
    const [r, g, b] = pixel(0.64, 0.33);
    expect(r).toBe(255);
    expect(Math.max(g!, b!)).toBeLessThan(40);
    const green = pixel(0.3, 0.6);
    expect(green[1]).toBe(255);
    expect(Math.max(green[0]!, green[2]!)).toBeLessThan(40);
    const blue = pixel(0.15, 0.062);
    expect(blue[2]).toBe(255);
    expect(Math.max(blue[0]!, blue[1]!)).toBeLessThan(60);
  });

  it("is transparent outside the spectral locus", () => {
    expect(pixel(0.7, 0.8)[3]).toBe(0);
    expect(pixel(0.05, 0.02)[3]).toBe(0);
  });
});

/**
 * The fill as it was drawn before it was cached and written with faster compression: every pixel recomputed here,
 * with the same scanline (even–odd) rule, neighbour seam and colours, for comparison pixel by pixel.
 */
function referenceFill(
  polygon: readonly (readonly [number, number])[],
  space: DiagramSpace,
  [x0, x1]: readonly [number, number],
  [y0, y1]: readonly [number, number],
  w: number,
  veil: number,
): { width: number; height: number; rgba: Uint8Array } {
  const h = Math.max(16, Math.round((w * (y1 - y0)) / (x1 - x0)));
  const dx = (x1 - x0) / w,
    dy = (y1 - y0) / h;
  const inside = new Uint8Array(w * h);
  for (let j = 0; j < h; j++) {
    const b = y1 - (j + 0.5) * dy;
    const cross: number[] = [];
    for (let k = 0, l = polygon.length - 1; k < polygon.length; l = k++) {
      const [xk, yk] = polygon[k]!,
        [xl, yl] = polygon[l]!;
      if (yk > b !== yl > b) cross.push(((xl - xk) * (b - yk)) / (yl - yk) + xk);
    }
    cross.sort((p, q) => p - q);
    for (let c = 0; c + 1 < cross.length; c += 2)
      for (
        let i = Math.max(0, Math.ceil((cross[c]! - x0) / dx - 0.5));
        i <= Math.min(w - 1, Math.floor((cross[c + 1]! - x0) / dx - 0.5));
        i++
      )
        inside[j * w + i] = 1;
  }
  const rgba = new Uint8Array(w * h * 4);
  for (let j = 0; j < h; j++)
    for (let i = 0; i < w; i++) {
      let near = false;
      for (let dj = -1; dj <= 1; dj++)
        for (let di = -1; di <= 1; di++) {
          const jj = j + dj,
            ii = i + di;
          if (jj >= 0 && jj < h && ii >= 0 && ii < w && inside[jj * w + ii]) near = true;
        }
      if (!near) continue;
      let xy;
      try {
        xy = xyFromDiagram(x0 + (i + 0.5) * dx, y1 - (j + 0.5) * dy, space);
      } catch {
        continue;
      }
      if (!(xy.y > 1e-4)) continue;
      const c = brightDisplayColour({ X: xy.x / xy.y, Y: 1, Z: (1 - xy.x - xy.y) / xy.y });
      const k = (j * w + i) * 4;
      for (let n = 0; n < 3; n++) rgba[k + n] = Math.round((c[n]! * (1 - veil) + veil) * 255);
      rgba[k + 3] = 255;
    }
  return { width: w, height: h, rgba };
}

describe("the fill drawn once per observer, diagram and size", () => {
  const decode = (source: string) =>
    decodePng(Buffer.from(source.replace(/^data:image\/png;base64,/, ""), "base64"));
  it.each([
    ["2°", "xy", [0, 0.8], [0, 0.9], 360, 0.12],
    ["10°", "xy", [0, 0.8], [0, 0.9], 200, 0.12],
    ["2°", "u'v'", [0, 0.65], [0, 0.6], 240, 0],
    ["2°", "xy", [0.25, 0.45], [0.25, 0.45], 180, 0.3],
  ] as const)(
    "%s %s %j × %j at %i px, veil %d: the same pixels as drawn afresh",
    (obs, space, xr, yr, res, veil) => {
      const polygon = spectralLocus(obs, space, 380, 780).map((p) => p.at);
      const first = chromaticityFill(polygon, space, xr, yr, { resolution: res, veil });
      const again = chromaticityFill(polygon, space, xr, yr, { resolution: res, veil });
      expect(again).toBe(first); // cached
      const got = decode(first.source);
      const want = referenceFill(polygon, space, xr, yr, res, veil);
      expect([got.width, got.height]).toEqual([want.width, want.height]);
      expect(Buffer.from(got.rgba).equals(Buffer.from(want.rgba))).toBe(true);
    },
  );

  it("draws a new fill when anything it depends on changes", () => {
    const polygon = spectralLocus("2°", "xy", 380, 780).map((p) => p.at);
    const base = chromaticityFill(polygon, "xy", [0, 0.8], [0, 0.9], { resolution: 100 });
    const other = [
      chromaticityFill(polygon, "xy", [0, 0.8], [0, 0.9], { resolution: 101 }),
      chromaticityFill(polygon, "xy", [0, 0.8], [0, 0.9], { resolution: 100, veil: 0.2 }),
      chromaticityFill(polygon, "xy", [0, 0.7], [0, 0.9], { resolution: 100 }),
      chromaticityFill(
        spectralLocus("10°", "xy", 380, 780).map((p) => p.at),
        "xy",
        [0, 0.8],
        [0, 0.9],
        { resolution: 100 },
      ),
    ];
    for (const o of other) expect(o.source).not.toBe(base.source);
  });

  it("a second diagram of a run carries the very same image as the first", () => {
    const a = chromaticityDiagram({ observer: "10°", daylight: false });
    const b = chromaticityDiagram({ observer: "10°", daylight: false, title: "another" });
    const img = (f: typeof a) => (f.layout.images as { source: string }[])[0]!.source;
    expect(img(b)).toBe(img(a));
  });
});

describe("visible-spectrum band", () => {
  it("runs blue → green → red along the wavelength axis (common practice, no source)", () => {
    const at = (nm: number) => spectralDisplayColour(nm);
    expect(at(450)[2]).toBeGreaterThan(Math.max(at(450)[0], at(450)[1]));
    expect(at(530)[1]).toBeGreaterThan(Math.max(at(530)[0], at(530)[2]));
    expect(at(650)[0]).toBeGreaterThan(Math.max(at(650)[1], at(650)[2]));
    expect(at(300)).toEqual([0, 0, 0]);
  });
});

describe("spectrum plots", () => {
  const w = [400, 450, 500, 550, 600, 650, 700];
  // Invented filter data.
  const t = spectrum(w, [0.1, 0.2, 0.5, 0.8, 0.85, 0.86, 0.87], {
    name: "Filter (invented)",
    quantity: "transmittance",
  });
  const r = spectrum(w, [0.05, 0.06, 0.1, 0.3, 0.5, 0.6, 0.62], {
    name: "Plate (invented)",
    quantity: "reflectance",
  });
  const L = spectrum(w, [0.001, 0.004, 0.006, 0.005, 0.004, 0.003, 0.001], {
    name: "Lamp (invented)",
    quantity: "radiance",
    unit: "W/(sr·m²·nm)",
  });

  it("puts the quantity and unit on the value axis and shows transmittance in percent", () => {
    const fig = spectrumPlot(t);
    const layout = fig.layout as Record<string, Record<string, { text: string }>>;
    expect(layout.yaxis!.title!.text).toBe("Transmittance (%)");
    expect(layout.xaxis!.title!.text).toBe("Wavelength λ (nm)");
    expect((fig.data[0] as { y: number[] }).y).toEqual([10, 20, 50, 80, 85, 86, 87]);
    expect(
      (spectrumPlot(t, { percent: false }).layout as Record<string, Record<string, { text: string }>>).yaxis!
        .title!.text,
    ).toBe("Transmittance");
  });

  it("uses the spectra's unit for absolute quantities", () => {
    const y = (spectrumPlot(L).layout as Record<string, Record<string, { text: string }>>).yaxis!.title!.text;
    expect(y).toBe("Spectral radiance (W/(sr·m²·nm))");
  });

  it("refuses to mix quantities on one axis unless the axis is named", () => {
    expect(() => spectrumPlot([t, r])).toThrow(/different quantities \(transmittance, reflectance\)/);
    expect(spectrumPlot([t, r], { quantity: "Transmittance or reflectance", unit: "" }).data).toHaveLength(2);
  });

  it("draws a log value axis for optical density, with marks and a band image", () => {
    const od = spectrum(w, [0.1, 0.2, 3, 5, 3, 0.5, 0.1], {
      name: "OD (invented)",
      quantity: "optical density",
    });
    const fig = spectrumPlot(od, { scale: "log", marks: [{ wavelength: 532, label: "532 nm" }] });
    const layout = fig.layout as Record<string, unknown> & {
      yaxis: { type: string };
      images: { source: string }[];
      shapes: { x0: number }[];
    };
    expect(layout.yaxis.type).toBe("log");
    expect(layout.shapes[0]!.x0).toBe(532);
    expect(layout.images[0]!.source).toMatch(/^data:image\/png;base64,/);
    const marks = fig.data.find((d) => (d as { name: string }).name === "Marked wavelengths") as {
      y: number[];
    };
    // Linear reading between 500 nm (3) and 550 nm (5) at 532 nm: 3 + 32/50 × 2 = 4.28.
    expect(marks.y[0]).toBeCloseTo(4.28, 6);
    expect(fig.caption).toMatch(/logarithmic/);
  });

  it("gives every series its own dash and marker for black-and-white print", () => {
    const fig = spectrumPlot([illuminant("D65"), illuminant("A"), illuminant("FL2")]);
    const looks = fig.data.map((d) =>
      JSON.stringify([
        (d as { line: { dash: string } }).line.dash,
        (d as { marker: { symbol: string } }).marker.symbol,
      ]),
    );
    expect(new Set(looks).size).toBe(3);
  });

  it("names a bad mark or range", () => {
    expect(() => spectrumPlot(t, { marks: [{ wavelength: 900 }] })).toThrow(/mark at 900 nm is outside/);
    expect(() => spectrumPlot(t, { wavelengthRange: [700, 400] })).toThrow(/wavelength range/);
  });
});
