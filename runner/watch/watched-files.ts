/**
 * The files watch mode listens to: the notebook and the files its cells read, one fs.watch per folder (an editor
 * that saves by renaming replaces the file, which a watch on the file itself would miss).
 */
import fs from "node:fs";
import path from "node:path";

/** What changed: the notebook itself, or a file a cell read (data: the cells must run again). */
export type ChangeKind = "notebook" | "data";

/** The set of watched files; `onChange` is called for every change to one of them. */
export class WatchedFiles {
  private readonly folders = new Map<string, { watcher: fs.FSWatcher; names: Set<string> }>();

  constructor(
    private readonly notebookPath: string,
    private readonly onChange: (kind: ChangeKind) => void,
  ) {}

  /** Watches exactly `files` from now on (folders no longer needed are let go). */
  set(files: readonly string[]): void {
    const wanted = new Map<string, Set<string>>();
    for (const file of files) {
      const dir = path.dirname(file);
      wanted.set(dir, (wanted.get(dir) ?? new Set()).add(path.basename(file)));
    }
    for (const [dir, entry] of this.folders) {
      if (!wanted.has(dir)) (entry.watcher.close(), this.folders.delete(dir));
    }
    for (const [dir, names] of wanted) {
      const existing = this.folders.get(dir);
      if (existing) {
        existing.names.clear();
        for (const n of names) existing.names.add(n);
        continue;
      }
      try {
        const entry = {
          names,
          watcher: fs.watch(dir, (_event, name) => {
            if (name !== null && !entry.names.has(name.toString())) return;
            // A change to anything but the notebook itself is a change of data.
            const isNotebook = name !== null && path.join(dir, name.toString()) === this.notebookPath;
            this.onChange(isNotebook ? "notebook" : "data");
          }),
        };
        entry.watcher.on("error", () => undefined);
        this.folders.set(dir, entry);
      } catch {
        // a folder that vanished; nothing to watch there
      }
    }
  }

  close(): void {
    for (const { watcher } of this.folders.values()) watcher.close();
    this.folders.clear();
  }
}
