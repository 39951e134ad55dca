/**
 * Cache keys from files' sizes and modification times: what the runtime bundle and the type checker's library
 * declarations are keyed on, so that an edit anywhere in lib/ or cells/ (or a new install) makes a new key without
 * reading any file's content.
 */
import type { Hash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";

/** Adds every file below `folder` (sorted, recursively) to `hash`; a missing folder adds nothing. */
export function stampTree(folder: string, hash: Hash): void {
  let entries: fs.Dirent[];
  try {
    entries = fs.readdirSync(folder, { withFileTypes: true });
  } catch {
    return;
  }
  entries.sort((a, b) => (a.name < b.name ? -1 : 1));
  for (const entry of entries) {
    const full = path.join(folder, entry.name);
    if (entry.isDirectory()) stampTree(full, hash);
    else stampFile(full, hash);
  }
}

/** Adds one file's path, size and modification time to `hash` (or that it is missing). */
export function stampFile(file: string, hash: Hash): void {
  try {
    const s = fs.statSync(file);
    hash.update(`${file}\0${s.size}\0${s.mtimeMs}\n`);
  } catch {
    hash.update(`${file}\0missing\n`);
  }
}
