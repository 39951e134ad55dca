/** Text for the terminal: control characters from data (escape sequences in a sample name) shown, not obeyed. */

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
