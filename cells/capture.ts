/**
 * Collects the records of the running cell: merges console text, keeps to the size budget (truncating with a note
 * that says how much was left out) and hands batches to the sender.
 */
import type { OutputRecord } from "./records.ts";

/** Most characters of console text one cell keeps. */
export const MAX_CONSOLE_CHARS = 400_000;
/** Most characters of JSON one cell's other records (tables, figures, ...) may take. */
export const MAX_RECORD_CHARS = 30_000_000;
/** Most characters of one shown value (a string or an inspected value); the rest is cut with a note. */
export const MAX_VALUE_CHARS = 200_000;
/** Most characters of one error message kept in the records; the rest is cut with a note in the message. */
export const MAX_ERROR_MESSAGE_CHARS = 10_000;
/** Most separate records one cell keeps. */
export const MAX_RECORDS = 1_000;

/** The output of one cell, kept within budget. */
export class CellOutput {
  private pending: OutputRecord[] = [];
  private consoleChars = 0;
  private droppedConsoleChars = 0;
  private recordChars = 0;
  private records = 0;
  private droppedRecords = 0;
  private readonly omitted: string[] = [];

  /** Adds console text, merged with the previous chunk of the same stream. */
  addText(stream: "stdout" | "stderr", text: string): void {
    if (text === "") return;
    const room = MAX_CONSOLE_CHARS - this.consoleChars;
    if (room <= 0) {
      this.droppedConsoleChars += text.length;
      return;
    }
    const kept = text.length > room ? text.slice(0, room) : text;
    this.droppedConsoleChars += text.length - kept.length;
    this.consoleChars += kept.length;
    const last = this.pending.at(-1);
    if (last?.kind === "console" && last.stream === stream) {
      this.pending[this.pending.length - 1] = { kind: "console", stream, text: last.text + kept };
    } else if (this.count()) {
      this.pending.push({ kind: "console", stream, text: kept });
    }
  }

  /**
   * Adds a record other than console text, or a note in its place when it would exceed the budget. Checks and
   * cautions are always kept: a dropped failed check or caution would mislead the reader.
   */
  addRecord(record: OutputRecord): void {
    if (record.kind === "check" || record.kind === "caution") {
      this.pending.push(record);
      return;
    }
    if (record.kind === "value" && record.text.length > MAX_VALUE_CHARS) {
      const total = record.text.length;
      this.addRecord({ kind: "value", text: record.text.slice(0, MAX_VALUE_CHARS) });
      this.addRecord({
        kind: "note",
        text: `Value cut: it has ${formatChars(total)}; the first ${formatChars(MAX_VALUE_CHARS)} are shown.`,
      });
      return;
    }
    const size = JSON.stringify(record).length;
    if (this.recordChars + size > MAX_RECORD_CHARS) {
      this.omitted.push(`a ${record.kind} of ${formatChars(size)}`);
      return;
    }
    if (!this.count()) return;
    this.recordChars += size;
    this.pending.push(record);
  }

  /** Takes the records gathered since the last call. */
  take(): OutputRecord[] {
    const out = this.pending;
    this.pending = [];
    return out;
  }

  /** Takes the remaining records plus notes about anything that was cut, when the cell ends. */
  finish(): OutputRecord[] {
    if (this.droppedConsoleChars > 0) {
      const total = this.consoleChars + this.droppedConsoleChars;
      this.pending.push({
        kind: "note",
        text: `Output truncated: the cell wrote ${formatChars(total)} of console text; the first ${formatChars(this.consoleChars)} are shown.`,
      });
    }
    if (this.droppedRecords > 0) {
      this.pending.push({
        kind: "note",
        text: `Output truncated: the cell produced ${MAX_RECORDS + this.droppedRecords} separate outputs; the first ${MAX_RECORDS} are shown.`,
      });
    }
    for (const what of this.omitted) {
      this.pending.push({
        kind: "note",
        text: `Output left out: ${what} would take this cell's output past ${formatChars(MAX_RECORD_CHARS)}; reduce the data shown (fewer points, rounded values).`,
      });
    }
    this.droppedConsoleChars = 0;
    this.droppedRecords = 0;
    this.omitted.length = 0;
    return this.take();
  }

  private count(): boolean {
    if (this.records >= MAX_RECORDS) {
      this.droppedRecords++;
      return false;
    }
    this.records++;
    return true;
  }
}

/** "12,345 characters" / "4.2 MB" style size for notes. */
export function formatChars(n: number): string {
  if (n >= 1_000_000) return `${(n / 1_000_000).toFixed(1)} million characters`;
  return `${n.toLocaleString("en-US")} characters`;
}

/** An error message within MAX_ERROR_MESSAGE_CHARS, with a note saying how long it was when it had to be cut. */
export function cutErrorMessage(message: string): string {
  if (message.length <= MAX_ERROR_MESSAGE_CHARS) return message;
  return `${message.slice(0, MAX_ERROR_MESSAGE_CHARS)}… [message cut: it has ${formatChars(message.length)}; the first ${formatChars(MAX_ERROR_MESSAGE_CHARS)} are kept]`;
}
