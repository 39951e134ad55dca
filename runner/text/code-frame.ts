/** Code frames: a few numbered notebook lines around a position, with a marker under the column. */

/**
 * Lines `line-2 .. line+2` of `text` with line numbers and a caret under `column` (both 1-based), kept within
 * `within` (first and last line, e.g. a cell's code lines) when given.
 */
export function codeFrame(
  text: string,
  line: number,
  column?: number,
  context = 2,
  within?: readonly [number, number],
): string {
  const lines = text.split(/\r?\n/);
  const inside = within && line >= within[0] && line <= within[1] ? within : undefined;
  const first = Math.max(1, line - context, inside?.[0] ?? 1);
  const last = Math.min(lines.length, line + context, inside?.[1] ?? Infinity);
  const width = String(last).length;
  const out: string[] = [];
  for (let n = first; n <= last; n++) {
    const marker = n === line ? ">" : " ";
    const source = (lines[n - 1] ?? "").replace(/\t/g, "  ");
    out.push(`${marker} ${String(n).padStart(width)} | ${source}`.trimEnd());
    if (n === line && column !== undefined && column >= 1) {
      const before = (lines[n - 1] ?? "")
        .slice(0, column - 1)
        .replace(/\t/g, "  ")
        .replace(/[^\s]/g, " ");
      out.push(`  ${" ".repeat(width)} | ${before}^`);
    }
  }
  return out.join("\n");
}
