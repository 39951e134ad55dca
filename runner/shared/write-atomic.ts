/**
 * Writes a file so that readers see either the old content or the new, never half of it: the text goes to a
 * temporary file in the same folder, which is then renamed over the target. A failure leaves the old file as it was.
 */
import fs from "node:fs";
import path from "node:path";

/** Writes `text` (or its pieces, one after another) to `file` atomically; removes the temporary file if anything fails. */
export function writeFileAtomic(file: string, text: string | readonly (string | Uint8Array)[]): void {
  const temporary = path.join(
    path.dirname(file),
    `.${path.basename(file)}.${process.pid}.${Date.now().toString(36)}.tmp`,
  );
  try {
    if (typeof text === "string") fs.writeFileSync(temporary, text);
    else {
      const fd = fs.openSync(temporary, "w");
      try {
        for (const piece of text) {
          const bytes = typeof piece === "string" ? Buffer.from(piece, "utf8") : piece;
          for (let at = 0; at < bytes.length;) at += fs.writeSync(fd, bytes, at);
        }
      } finally {
        fs.closeSync(fd);
      }
    }
    fs.renameSync(temporary, file);
  } catch (e) {
    fs.rmSync(temporary, { force: true });
    throw e;
  }
}
