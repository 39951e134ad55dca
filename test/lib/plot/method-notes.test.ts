/**
 * Figures are decorations: drawing one must not add a condition to the report's Methods section that the notebook
 * did not compute itself (the reviewers found a CCT method listed in a report that computed no CCT, because the
 * chromaticity diagram's hover readouts call cctAndDuv). `withoutMethodNotes` is the library's no-notes path.
 */
import { afterEach, describe, expect, it } from "vitest";
import {
  methodsUsed,
  methodNotesActive,
  noteMethod,
  resetMethodLog,
  withoutMethodNotes,
} from "../../../lib/methods/method-log.ts";
import {
  chromaticityDiagram,
  labPlane,
  lightnessChromaPlot,
  spectrumPlot,
  swatch,
} from "../../../lib/plot/index.ts";
import { pointTraces } from "../../../lib/plot/chromaticity-overlays.ts";
import { cctAndDuv } from "../../../lib/temperature/cct.ts";
import { deltaE2000 } from "../../../lib/difference/delta-e-2000.ts";
import { sampler } from "../../../lib/spectrum/sample.ts";
import { spectrum } from "../../../lib/spectrum/spectrum.ts";

afterEach(() => resetMethodLog());

describe("withoutMethodNotes", () => {
  it("records nothing inside, returns the value, and records again afterwards", () => {
    resetMethodLog();
    const v = withoutMethodNotes(() => {
      noteMethod("other", "Inside the silent scope.");
      expect(methodNotesActive()).toBe(false);
      return 42;
    });
    expect(v).toBe(42);
    expect(methodsUsed()).toEqual([]);
    expect(methodNotesActive()).toBe(true);
    // The statement was not remembered as seen, so a real computation later still records it.
    noteMethod("other", "Inside the silent scope.");
    expect(methodsUsed()).toEqual([{ topic: "other", statement: "Inside the silent scope." }]);
  });

  it("nests, and restores recording when the computation throws", () => {
    resetMethodLog();
    expect(() =>
      withoutMethodNotes(() =>
        withoutMethodNotes(() => {
          throw new Error("boom");
        }),
      ),
    ).toThrow("boom");
    expect(methodNotesActive()).toBe(true);
    noteMethod("other", "After the failure.");
    expect(methodsUsed()).toHaveLength(1);
  });

  it("refuses a computation that returns a promise (its later notes could not be kept out)", () => {
    expect(() => withoutMethodNotes(() => Promise.resolve(1))).toThrow(/promise/);
    expect(methodNotesActive()).toBe(true);
  });

  it("a sampler first used for a figure still notes its interpolation when a real computation uses it", () => {
    resetMethodLog();
    const s = spectrum([400, 450, 500, 550, 600, 650, 700], [0.1, 0.2, 0.4, 0.5, 0.4, 0.3, 0.2], {
      name: "invented",
      quantity: "reflectance",
    });
    const read = sampler(s);
    withoutMethodNotes(() => read(512));
    expect(methodsUsed()).toEqual([]);
    read(513);
    expect(methodsUsed().map((n) => n.topic)).toEqual(["interpolation"]);
  });
});

describe("figures note nothing the notebook did not compute", () => {
  const everything = {
    diagram: "u'v'",
    points: [
      { label: "lamp (invented)", x: 0.4476, y: 0.4074 },
      { label: "panel (invented)", X: 95.2, Y: 100, Z: 108.1 },
    ],
    whitePoints: true,
    planckian: { duvBand: 0.006 },
    daylight: true,
    gamuts: [
      "sRGB",
      "Display P3",
      {
        name: "device (invented)",
        r: { x: 0.68, y: 0.31 },
        g: { x: 0.27, y: 0.66 },
        b: { x: 0.15, y: 0.05 },
      },
    ],
    tolerances: [{ label: "circle", center: { x: 0.3127, y: 0.329 }, radius: 0.004 }],
    arrows: [{ from: { x: 0.3127, y: 0.329 }, to: { x: 0.32, y: 0.335 } }],
  } as const;

  it("the hover readout of a plotted point computes a CCT, which would be noted if drawing did not suppress it", () => {
    // Shows what the diagram suppresses: the point traces on their own call cctAndDuv (CIE 015:2018 CCT).
    resetMethodLog();
    pointTraces([{ label: "p", x: 0.4476, y: 0.4074 }], "xy");
    expect(methodsUsed().map((n) => n.topic)).toContain("colour temperature");
  });

  it("a chromaticity diagram with every overlay, in both diagrams and for both observers, notes nothing", () => {
    resetMethodLog();
    chromaticityDiagram({ ...everything, diagram: "xy" });
    chromaticityDiagram(everything);
    chromaticityDiagram({ ...everything, range: "white region" });
    chromaticityDiagram({ observer: "10°", daylight: false, whitePoints: true, points: everything.points });
    expect(methodsUsed()).toEqual([]);
  });

  it("after the notebook computed a CCT itself, drawing the diagram leaves the log exactly as it was", () => {
    resetMethodLog();
    cctAndDuv({ x: 0.4476, y: 0.4074 }, { method: "robertson" });
    const before = methodsUsed();
    chromaticityDiagram(everything);
    expect(methodsUsed()).toEqual(before);
    // In particular no Ohno statement appeared, though the hover readouts use Ohno's method.
    expect(methodsUsed().filter((n) => n.topic === "colour temperature")).toHaveLength(1);
  });

  it("CIELAB plots (ΔE00 only in the hover box) and spectrum plots note nothing", () => {
    const pairs = [
      {
        label: "chip (invented)",
        reference: { L: 50, a: 2.6772, b: -79.7751 },
        sample: { L: 50, a: 0, b: -82.7485 },
      },
    ];
    resetMethodLog();
    deltaE2000(pairs[0]!.reference, pairs[0]!.sample);
    expect(methodsUsed().map((n) => n.topic)).toEqual(["colour difference"]); // what the hover would have noted
    resetMethodLog();
    labPlane({ pairs, samples: [{ label: "tile", lab: { L: 60, a: 10, b: -35 } }] });
    lightnessChromaPlot({ pairs });
    const s = spectrum([400, 410, 420, 430, 440, 450, 460], [0.1, 0.2, 0.3, 0.35, 0.3, 0.2, 0.1], {
      name: "invented",
      quantity: "reflectance",
    });
    spectrumPlot([s], { band: true });
    expect(methodsUsed()).toEqual([]);
  });

  it("the display conversion of a swatch (Bradford adaptation to the display white, encoding) notes nothing", () => {
    resetMethodLog();
    swatch("D50 colour", { lab: { L: 60, a: 20, b: -30 }, white: { X: 96.422, Y: 100, Z: 82.521 } });
    swatch("light", { XYZ: { X: 20, Y: 3, Z: 120 } });
    expect(methodsUsed()).toEqual([]);
  });
});
