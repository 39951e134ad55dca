/**
 * The files a `--each name=pattern` batch runs over. The pattern is a folder (every visible file directly in it), a
 * single file, or a path with wildcards: `*` any characters within one folder or file name, `?` one character, and
 * `**` as a whole path part for any depth of folders. Names starting with a dot match only a part that starts with a
 * dot. The files come back sorted, as absolute paths.
 */
import fs from "node:fs";
import path from "node:path";
import { UsageError } from "../shared/errors.ts";

/** Whether a path part has a wildcard. */
function isWild(part: string): boolean {
  return /[*?]/.test(part);
}

/** A path part with `*` and `?` as a regular expression. */
function partRegExp(part: string): RegExp {
  const body = part
    .replace(/[.+^${}()|[\]\\]/g, "\\$&")
    .replace(/\*/g, "[^/]*")
    .replace(/\?/g, "[^/]");
  return new RegExp(`^${body}$`);
}

/** The files a pattern names, relative to `cwd`, sorted; throws a UsageError when there are none. */
export function expandFilePattern(pattern: string, cwd: string, what: string): string[] {
  if (pattern.trim() === "")
    throw new UsageError(`${what}: the pattern is empty; give a folder, a file or a pattern like data/*.csv`);
  const absolute = path.resolve(cwd, pattern);
  let files: string[];
  if (!isWild(pattern)) {
    const stat = statOrUndefined(absolute);
    if (!stat) throw new UsageError(`${what}: ${pattern}: no such file or folder (relative to ${cwd})`);
    files = stat.isDirectory()
      ? fs
          .readdirSync(absolute)
          .filter((n) => !n.startsWith("."))
          .map((n) => path.join(absolute, n))
          .filter(isFile)
      : [absolute];
  } else {
    const parts = absolute.split(path.sep);
    const firstWild = parts.findIndex(isWild);
    const base = parts.slice(0, firstWild).join(path.sep) || path.sep;
    files = walk(base, parts.slice(firstWild));
  }
  files = [...new Set(files)].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  if (files.length === 0) throw new UsageError(`${what}: no files match ${pattern} (relative to ${cwd})`);
  return files;
}

function walk(dir: string, parts: readonly string[]): string[] {
  const [part, ...rest] = parts;
  if (part === undefined) return isFile(dir) ? [dir] : [];
  if (part === "**") {
    // Zero folders, or one more folder and ** again.
    const here = walk(dir, rest);
    const deeper = listDir(dir)
      .filter((n) => !n.startsWith(".") && isDirectory(path.join(dir, n)))
      .flatMap((n) => walk(path.join(dir, n), parts));
    return [...here, ...deeper];
  }
  if (!isWild(part)) return walk(path.join(dir, part), rest);
  const re = partRegExp(part);
  return listDir(dir)
    .filter((n) => re.test(n) && (part.startsWith(".") || !n.startsWith(".")))
    .flatMap((n) => walk(path.join(dir, n), rest));
}

function listDir(dir: string): string[] {
  try {
    return fs.readdirSync(dir);
  } catch {
    return [];
  }
}

function statOrUndefined(p: string): fs.Stats | undefined {
  try {
    return fs.statSync(p);
  } catch {
    return undefined;
  }
}

function isFile(p: string): boolean {
  return statOrUndefined(p)?.isFile() ?? false;
}

function isDirectory(p: string): boolean {
  return statOrUndefined(p)?.isDirectory() ?? false;
}

/**
 * A report file name for each data file, named after it: "lot-114.html" for lot-114.csv; the full file name
 * ("lot-114.cgats.txt.html") or the path relative to `base` when two would clash, and never "index.html".
 */
export function reportNamesFor(
  files: readonly string[],
  base: string,
  reserved = "index",
): Map<string, string> {
  const stem = (f: string) => path.basename(f).replace(/\.[^.]*$/, "") || path.basename(f);
  const candidates: ((f: string) => string)[] = [
    stem,
    (f) => path.basename(f),
    (f) =>
      path
        .relative(base, f)
        .split(path.sep)
        .filter((p) => p !== "..")
        .join("_"),
  ];
  const names = new Map<string, string>();
  const taken = new Set<string>([reserved.toLowerCase()]);
  for (const file of files) {
    let name: string | undefined;
    for (const candidate of candidates) {
      const c = candidate(file);
      const clash = files.some(
        (other) => other !== file && candidate(other).toLowerCase() === c.toLowerCase(),
      );
      if (!clash && !taken.has(c.toLowerCase())) {
        name = c;
        break;
      }
    }
    let n = 2;
    const fallback = path.basename(file);
    while (name === undefined || taken.has(name.toLowerCase())) name = `${fallback}-${n++}`;
    taken.add(name.toLowerCase());
    names.set(file, `${name}.html`);
  }
  return names;
}
