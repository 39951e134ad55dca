/** Code frames: a few numbered notebook lines around a position, with a marker under the column. */

/** Lines `line-2 .. line+2` of `text` with line numbers and a caret under `column` (both 1-based). */
export function codeFrame(text: string, line: number, column?: number, context = 2): string {
  const lines = text.split(/\r?\n/);
  const first = Math.max(1, line - context);
  const last = Math.min(lines.length, line + context);
  const width = String(last).length;
  const out: string[] = [];
  for (let n = first; n <= last; n++) {
    const marker = n === line ? ">" : " ";
    const source = (lines[n - 1] ?? "").replace(/\t/g, "  ");
    out.push(`${marker} ${String(n).padStart(width)} | ${source}`.trimEnd());
    if (n === line && column !== undefined && column >= 1) {
      const before = (lines[n - 1] ?? "").slice(0, column - 1).replace(/\t/g, "  ").replace(/[^\s]/g, " ");
      out.push(`  ${" ".repeat(width)} | ${before}^`);
    }
  }
  return out.join("\n");
}
