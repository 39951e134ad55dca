/**
 * Where display functions send their records. The cell process installs a sink under a registry symbol (so the
 * display functions find it whichever copy of this module they were bundled from); outside a notebook run there is
 * no sink and display functions fall back to the console, so library code that shows something still works in
 * plain scripts and tests.
 */
import type { OutputRecord } from "./records.ts";

/** The function that receives every record a cell shows. */
export type OutputSink = (record: OutputRecord) => void;

const SINK_KEY = Symbol.for("tristim.output-sink");

/** Installs the sink of the running cell process (called once by the cell harness). */
export function installOutputSink(sink: OutputSink): void {
  (globalThis as Record<symbol, unknown>)[SINK_KEY] = sink;
}

/** The installed sink, or undefined outside a notebook run. */
export function currentOutputSink(): OutputSink | undefined {
  const sink = (globalThis as Record<symbol, unknown>)[SINK_KEY];
  return typeof sink === "function" ? (sink as OutputSink) : undefined;
}
