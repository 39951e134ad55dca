/** The one rule for showing a file's path to a reader, in the terminal and in reports. */
import path from "node:path";

/**
 * `file` relative to `folder`, with "/" between names. A path outside the folder is shown relative ("../data/x.csv")
 * when `outside` is "relative", and as given (absolute) when it is "as given"; a path with no relative form (another
 * drive, or the folder itself) is shown as given.
 */
export function displayPath(file: string, folder: string, outside: "relative" | "as given"): string {
  const relative = path.relative(folder, file);
  if (!relative || path.isAbsolute(relative)) return file;
  if (outside === "as given" && relative.startsWith("..") && path.isAbsolute(file)) return file;
  return relative.split(path.sep).join("/");
}
