/**
 * Where a report may be written. A report never replaces the notebook, one of its input files or a file a cell
 * read (that would lose the user's data), and its folder is made one level at a time so that a path that cannot
 * exist (under a file, under /proc) fails at once with a clear message.
 */
import fs from "node:fs";
import path from "node:path";

/** A file the report must not replace, and what it is ("the notebook", "input data", "read by cell 2"). */
export interface GuardedFile {
  readonly path: string;
  readonly what: string;
}

/** True when `a` and `b` name the same file (same device and inode when both exist, else the same path). */
export function sameFile(a: string, b: string): boolean {
  const resolvedA = path.resolve(a);
  const resolvedB = path.resolve(b);
  if (resolvedA === resolvedB) return true;
  try {
    const sa = fs.statSync(resolvedA);
    const sb = fs.statSync(resolvedB);
    return sa.dev === sb.dev && sa.ino === sb.ino;
  } catch {
    return false;
  }
}

/** The first guarded file that `target` is, if any. */
export function clashingFile(target: string, guarded: readonly GuardedFile[]): GuardedFile | undefined {
  return guarded.find((g) => sameFile(target, g.path));
}

/** The notebook and each input whose text value names an existing file (relative to the notebook's folder). */
export function notebookGuardedFiles(
  notebookPath: string,
  inputs: Readonly<Record<string, unknown>>,
): GuardedFile[] {
  const guarded: GuardedFile[] = [{ path: notebookPath, what: "the notebook itself" }];
  for (const [name, value] of Object.entries(inputs)) {
    if (typeof value !== "string" || value === "") continue;
    const file = path.resolve(path.dirname(notebookPath), value);
    try {
      if (fs.statSync(file).isFile()) guarded.push({ path: file, what: `the file of input "${name}"` });
    } catch {
      // not a file: nothing to protect
    }
  }
  return guarded;
}

/** A report folder that cannot be made, with the reason in words. */
export class ReportFolderError extends Error {
  override readonly name = "ReportFolderError";
}

/**
 * Makes `folder` and any missing parents, one level at a time (never retrying): fails with a ReportFolderError
 * when a parent is a file or a level cannot be made (a pseudo file system such as /proc, no permission).
 */
export function makeReportFolder(folder: string): void {
  const absolute = path.resolve(folder);
  const missing: string[] = [];
  let existing = absolute;
  for (;;) {
    let stat: fs.Stats | undefined;
    try {
      stat = fs.statSync(existing);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code !== "ENOENT" && code !== "ENOTDIR")
        throw new ReportFolderError(`${existing} cannot be read (${reason(e)})`);
    }
    if (stat) {
      if (!stat.isDirectory())
        throw new ReportFolderError(`${existing} is a file, not a folder, so no folder can be made in it`);
      break;
    }
    const parent = path.dirname(existing);
    if (parent === existing) break;
    missing.unshift(existing);
    existing = parent;
  }
  for (const level of missing) {
    try {
      fs.mkdirSync(level);
    } catch (e) {
      const code = (e as NodeJS.ErrnoException).code;
      if (code === "EEXIST" && isDirectory(level)) continue;
      throw new ReportFolderError(`the folder ${level} cannot be made (${reason(e)})`);
    }
  }
}

function isDirectory(p: string): boolean {
  try {
    return fs.statSync(p).isDirectory();
  } catch {
    return false;
  }
}

/** An fs error's code in words, with the code. */
function reason(e: unknown): string {
  const code = (e as NodeJS.ErrnoException).code;
  const words: Record<string, string> = {
    ENOENT: "the file system does not allow it, e.g. a pseudo file system such as /proc",
    EACCES: "permission denied",
    EPERM: "operation not permitted",
    EROFS: "read-only file system",
    ENOSPC: "no space left on the device",
  };
  return code ? `${words[code] ?? "failed"}: ${code}` : (e as Error).message;
}
