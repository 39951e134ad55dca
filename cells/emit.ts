/**
 * Hands an output record to the running notebook, or prints a plain-text form of it when called outside a notebook
 * run (so library code and plain scripts that show something still work).
 */
import { currentOutputSink } from "./output-sink.ts";
import type { OutputRecord } from "./records.ts";

/** Sends a record to the running notebook, or prints a plain-text form when called outside a notebook run. */
export function emitRecord(record: OutputRecord): void {
  const sink = currentOutputSink();
  if (sink) return sink(record);
  if (record.kind === "caution") return console.warn(`${record.title}: ${record.text}`);
  if (record.kind === "check") {
    const value =
      record.valueText === undefined ? "" : `: ${record.valueText}${record.unit ? ` ${record.unit}` : ""}`;
    const line = `${record.passed ? "PASS" : "FAIL"} ${record.label}${value}${record.detail ? ` (${record.detail})` : ""}`;
    return record.passed ? console.log(line) : console.warn(line);
  }
  console.log("text" in record ? record.text : JSON.stringify(record));
}
