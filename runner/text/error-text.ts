/** Plain-text wording for errors, shared by the terminal and the report. */
import type { ErrorRecord, Location } from "../../cells/records.ts";
import { displayPath } from "./display-path.ts";

/** "notebook.md:12:5", the file relative to the notebook's folder (a file outside it in full). */
export function displayLocation(location: Location, notebookDir: string): string {
  return `${displayPath(location.file, notebookDir, "as given")}:${location.line}:${location.column}`;
}

/** The heading of an error: "TypeError: message" or the message alone. */
export function errorTitle(record: ErrorRecord): string {
  return record.name && record.failure !== "exit" ? `${record.name}: ${record.message}` : record.message;
}

/** Most characters of an error's heading in the summary and on the terminal (the cell's error block has it all). */
export const MAX_HEADLINE_CHARS = 500;

/** errorTitle, cut to MAX_HEADLINE_CHARS with a note saying how long it is, for lists and the terminal. */
export function errorHeadline(record: ErrorRecord): string {
  const title = errorTitle(record);
  if (title.length <= MAX_HEADLINE_CHARS) return title;
  return `${title.slice(0, MAX_HEADLINE_CHARS)}… (cut at ${MAX_HEADLINE_CHARS} characters; the report shows the message at the cell)`;
}
