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
