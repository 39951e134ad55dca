/** HTML escaping for every piece of text that comes from a notebook, a cell or data. */

const ENTITIES: Record<string, string> = {
  "&": "&amp;",
  "<": "&lt;",
  ">": "&gt;",
  '"': "&quot;",
  "'": "&#39;",
};

/** Escapes text for HTML element content and attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]!);
}

/** JSON that is safe inside a <script type="application/json"> element (no "</script>", no "<!--"). */
export function jsonForScript(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, "\\u003c")
    .replace(/>/g, "\\u003e")
    .replace(/&/g, "\\u0026")
    .replace(/\u2028/g, "\\u2028")
    .replace(/\u2029/g, "\\u2029");
}

/**
 * A CSS string literal ("…") for any text: every character other than letters, digits, spaces and plain punctuation
 * is written as a CSS escape (CSS Syntax Level 3 §4.3.7), so the text can neither end the string nor close a
 * <style> element.
 */
export function cssString(text: string): string {
  const body = Array.from(text.replace(/[\r\n\t]+/g, " "))
    .map((c) => (/^[A-Za-z0-9 .,:;()\-_!?+=%#@/]$/.test(c) ? c : `\\${c.codePointAt(0)!.toString(16)} `))
    .join("");
  return `"${body}"`;
}
