/**
 * The conversions note their conditions once per distinct condition (a cached statement, a fast path for a repeated
 * note), and the Methods log stays what it was when every call built its sentence: the same statements, in the same
 * order, after a reset too, and nothing from inside withoutMethodNotes. The expected RGB sentence below is written
 * out here as the library wrote it before the cache (SMPTE RP 177-1993 matrices; IEC 61966-2-1 sRGB primaries and
 * white), so a cache that returned a wrong space's or a stale statement fails.
 */
import { describe, expect, it } from "vitest";
import {
  cctAndDuv,
  labFromXYZ,
  luvFromXYZ,
  rgbFromXYZ,
  rgbSpace,
  rgbSpaceFromPrimaries,
  transferFunction,
  xyzFromRgb,
  type RgbSpace,
} from "../../lib/index.ts";
import { methodsUsed, noteMethod, resetMethodLog, withoutMethodNotes } from "../../lib/methods/method-log.ts";

function sentence(space: RgbSpace, encoded: boolean): string {
  const p = space.primaries,
    w = space.white;
  return `Conversions between XYZ and ${space.name} RGB (${space.source}) used the primaries R (${p.r.x}, ${p.r.y}), G (${p.g.x}, ${p.g.y}), B (${p.b.x}, ${p.b.y}) and white (${w.x}, ${w.y}), with RGB–XYZ matrices derived per SMPTE RP 177-1993${encoded ? ` and ${transferFunction(space.transfer).description}` : "; the RGB values are linear (no transfer function was applied)"}.`;
}

const white = { X: 95.047, Y: 100, Z: 108.883 };

describe("method notes once per condition", () => {
  const srgb = rgbSpace("sRGB"),
    p3 = rgbSpace("Display P3");
  const measured = rgbSpaceFromPrimaries(
    { r: { x: 0.68, y: 0.31 }, g: { x: 0.27, y: 0.67 }, b: { x: 0.15, y: 0.07 } },
    { x: 0.3127, y: 0.329 },
    { name: "sRGB", transfer: "sRGB", source: "an invented display's measured primaries" },
  );
  const calls = () => {
    for (let i = 0; i < 3; i++) xyzFromRgb({ r: 0.2, g: 0.5, b: 0.7 }, srgb);
    labFromXYZ({ X: 20, Y: 30, Z: 40 }, white);
    rgbFromXYZ({ X: 20, Y: 30, Z: 40 }, srgb, { encode: false });
    xyzFromRgb({ r: 0.2, g: 0.5, b: 0.7 }, srgb);
    rgbFromXYZ({ X: 20, Y: 30, Z: 40 }, p3);
    luvFromXYZ({ X: 20, Y: 30, Z: 40 }, white);
    xyzFromRgb({ r: 0.2, g: 0.5, b: 0.7 }, measured); // same name as sRGB, other primaries: its own statement
    labFromXYZ({ X: 20, Y: 30, Z: 40 }, white);
    cctAndDuv({ x: 0.3127, y: 0.329 });
    xyzFromRgb({ r: 0.2, g: 0.5, b: 0.7 }, srgb, { decode: false });
  };
  const expected = [
    ["rgb encoding", sentence(srgb, true)],
    ["colour space", "CIELAB (CIE 1976 L*a*b*) values were computed per CIE 015:2018 §8.2.1."],
    ["rgb encoding", sentence(srgb, false)],
    ["rgb encoding", sentence(p3, true)],
    ["colour space", "CIELUV (CIE 1976 L*u*v*) values were computed per CIE 015:2018 §8.2.2."],
    ["rgb encoding", sentence(measured, true)],
  ];

  it("keeps the statements of the calls, each once, in first-use order", () => {
    resetMethodLog();
    calls();
    const notes = methodsUsed();
    expect(notes.slice(0, 6).map((n) => [n.topic, n.statement])).toEqual(expected);
    expect(notes[6]!.topic).toBe("colour temperature");
    expect(notes[6]!.statement).toMatch(/Ohno/);
    expect(notes).toHaveLength(7); // the second decode: false call adds nothing: it was noted as the third
    expect(new Set(notes.map((n) => n.statement)).size).toBe(7);
  });

  it("notes the same again after a reset (the cache does not remember across runs)", () => {
    resetMethodLog();
    calls();
    const first = methodsUsed();
    resetMethodLog();
    expect(methodsUsed()).toEqual([]);
    calls();
    expect(methodsUsed()).toEqual(first);
  });

  it("records nothing inside withoutMethodNotes, and the next call outside is recorded", () => {
    resetMethodLog();
    withoutMethodNotes(() => xyzFromRgb({ r: 0.1, g: 0.1, b: 0.1 }, p3));
    expect(methodsUsed()).toEqual([]);
    xyzFromRgb({ r: 0.1, g: 0.1, b: 0.1 }, p3);
    expect(methodsUsed().map((n) => n.statement)).toEqual([sentence(p3, true)]);
  });

  it("a repeated note after another topic is not added twice, and a new one after a repeat is added", () => {
    resetMethodLog();
    noteMethod("other", "A was done.");
    noteMethod("gamut", "B was done.");
    noteMethod("other", "A was done.");
    noteMethod("other", "A was done.");
    noteMethod("gamut", "C was done.");
    noteMethod("other", "B was done."); // same words, other topic: a note of its own
    expect(methodsUsed()).toEqual([
      { topic: "other", statement: "A was done." },
      { topic: "gamut", statement: "B was done." },
      { topic: "gamut", statement: "C was done." },
      { topic: "other", statement: "B was done." },
    ]);
  });

  it("two notes alternating in a loop, then a third, then the first two again: each kept once, in first-use order", () => {
    resetMethodLog();
    for (let i = 0; i < 3; i++) {
      noteMethod("rgb encoding", "A was done.");
      noteMethod("colour space", "B was done.");
    }
    noteMethod("gamut", "C was done.");
    noteMethod("colour space", "B was done.");
    noteMethod("rgb encoding", "A was done.");
    noteMethod("gamut", "C was done.");
    expect(methodsUsed().map((n) => n.statement)).toEqual(["A was done.", "B was done.", "C was done."]);
    resetMethodLog();
    noteMethod("colour space", "B was done.");
    expect(methodsUsed().map((n) => n.statement)).toEqual(["B was done."]);
  });

  it("three, then more notes cycling in a loop than the log keeps at hand (ten): each kept once, in first-use order", () => {
    resetMethodLog();
    const notes = ["A", "B", "C", "D", "E", "F", "G", "H", "I", "J"].map((x) => `${x} was done.`);
    for (let i = 0; i < 5; i++) for (const n of notes.slice(0, 3)) noteMethod("other", n);
    for (let i = 0; i < 5; i++) for (const n of notes) noteMethod("other", n);
    for (let i = 0; i < 5; i++) for (const n of notes.slice(0, 3)) noteMethod("gamut", n);
    expect(methodsUsed()).toEqual([
      ...notes.map((statement) => ({ topic: "other", statement })),
      ...notes.slice(0, 3).map((statement) => ({ topic: "gamut", statement })),
    ]);
  });

  it("a recent statement under a topic that is not one is still refused (the quick answer compares the topic too)", () => {
    resetMethodLog();
    noteMethod("other", "A was done.");
    expect(() => noteMethod("no such topic" as never, "A was done.")).toThrow(/noteMethod.*topic/);
    expect(() => noteMethod(undefined as never, "A was done.")).toThrow(/noteMethod.*topic/);
    expect(methodsUsed()).toEqual([{ topic: "other", statement: "A was done." }]);
  });

  it("a loop of sRGB → XYZ → CIELAB → CIELUV → XYZ → sRGB notes each condition once, and again after a reset", () => {
    const srgb = rgbSpace("sRGB");
    const loop = () => {
      for (let i = 0; i < 50; i++) {
        const t = xyzFromRgb({ r: i / 50, g: 0.5, b: 0.2 }, srgb);
        labFromXYZ(t, white);
        luvFromXYZ(t, white);
        rgbFromXYZ(t, srgb, { encode: false });
        rgbFromXYZ(t, srgb);
      }
    };
    const expected = [
      ["rgb encoding", sentence(srgb, true)],
      ["colour space", "CIELAB (CIE 1976 L*a*b*) values were computed per CIE 015:2018 §8.2.1."],
      ["colour space", "CIELUV (CIE 1976 L*u*v*) values were computed per CIE 015:2018 §8.2.2."],
      ["rgb encoding", sentence(srgb, false)],
    ];
    resetMethodLog();
    loop();
    expect(methodsUsed().map((n) => [n.topic, n.statement])).toEqual(expected);
    resetMethodLog();
    withoutMethodNotes(loop);
    expect(methodsUsed()).toEqual([]);
    loop();
    expect(methodsUsed().map((n) => [n.topic, n.statement])).toEqual(expected);
  });
});
