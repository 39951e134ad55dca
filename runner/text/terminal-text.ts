/** Text for the terminal: control characters from data (escape sequences in a sample name) shown, not obeyed. */

import type { NotebookError } from "../shared/errors.ts";

/** C0 controls other than tab and newline, DEL, and C1 controls (U+0080–U+009F), plus bidi overrides. */
const CONTROL = /[\u0000-\u0008\u000b-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g;

/** Replaces each control character with a visible escape such as \x1B or \u202E. */
export function escapeControls(text: string): string {
  return text.replace(CONTROL, (c) => {
    const code = c.charCodeAt(0);
    return code <= 0xff
      ? `\\x${code.toString(16).toUpperCase().padStart(2, "0")}`
      : `\\u${code.toString(16).toUpperCase()}`;
  });
}

/** Every line of `text` indented by two spaces, as code frames are shown under a message on the terminal. */
export function indentLines(text: string): string {
  return text
    .split("\n")
    .map((l) => `  ${l}`)
    .join("\n");
}

/** A NotebookError as the terminal shows it: "place: message", then its code frame indented, when it has one. */
export function notebookErrorText(error: NotebookError, shownPath: string): string {
  return `${error.where(shownPath)}\n${error.codeFrame ? `${indentLines(error.codeFrame)}\n` : ""}`;
}
