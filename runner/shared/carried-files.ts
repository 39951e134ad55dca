/**
 * What a report carries so that it can be run again from the report alone (`tristim restore`): the notebook's
 * source and the files its cells read or imported from inside the notebook's folder, each up to
 * CARRIED_FILE_LIMIT bytes and all together up to CARRIED_TOTAL_LIMIT; any other file is named, with its SHA-256,
 * as not carried and why.
 */
import path from "node:path";

/** The largest file a report carries: 1 MiB. */
export const CARRIED_FILE_LIMIT = 1024 * 1024;
/** The most a report carries in all (the notebook not counted): 4 MiB. */
export const CARRIED_TOTAL_LIMIT = 4 * 1024 * 1024;

/** "1 MiB" and the like, for the limits as the report states them. */
export function describeBytes(bytes: number): string {
  if (bytes % (1024 * 1024) === 0) return `${bytes / (1024 * 1024)} MiB`;
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MiB`;
  if (bytes >= 1024) return `${(bytes / 1024).toFixed(1)} KiB`;
  return `${bytes} bytes`;
}

/** Why a file cannot be carried, before its size is known: outside the notebook's folder, or an installed package. */
export function carryRefusal(file: string, notebookDir: string): string | undefined {
  const relative = path.relative(notebookDir, file);
  if (relative.startsWith("..") || path.isAbsolute(relative)) return "outside the notebook's folder";
  if (relative.split(path.sep).includes("node_modules")) return "part of an installed package";
  return undefined;
}
