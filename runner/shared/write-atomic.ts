/**
 * Writes a file so that readers see either the old content or the new, never half of it: the text goes to a
 * temporary file in the same folder, which is then renamed over the target. A failure leaves the old file as it was.
 */
import fs from "node:fs";
import path from "node:path";

/** Writes `text` to `file` atomically; removes the temporary file if anything fails. */
export function writeFileAtomic(file: string, text: string): void {
  const temporary = path.join(
    path.dirname(file),
    `.${path.basename(file)}.${process.pid}.${Date.now().toString(36)}.tmp`,
  );
  try {
    fs.writeFileSync(temporary, text);
    fs.renameSync(temporary, file);
  } catch (e) {
    fs.rmSync(temporary, { force: true });
    throw e;
  }
}
