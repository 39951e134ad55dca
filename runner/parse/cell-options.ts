/**
 * The words after `ts` on a cell's fence line, e.g. ```ts hide-source caption="Reflectance of tile 4" time-limit=2m
 * Flags are bare words; valued options are word=value, the value in double quotes when it has spaces.
 */
import { NotebookError, UsageError } from "../shared/errors.ts";
import type { CellOptions } from "./notebook.ts";
import { parseTimeLimit } from "../shared/time-limit.ts";

/** Option words that stand alone. */
export const CELL_FLAGS = ["hide-source", "show-source", "no-run", "may-fail"] as const;
/** Option words that take a value. */
export const CELL_VALUE_OPTIONS = ["caption", "time-limit"] as const;

/** The fence languages that make a cell (other fences are only shown). */
export const CELL_LANGUAGES = ["ts", "typescript"] as const;

/** Parses the option text after the language; errors name the option and the notebook line. */
export function parseCellOptions(text: string, file: string, line: number): CellOptions {
  const options: { -readonly [K in keyof CellOptions]: CellOptions[K] } = {
    hideSource: false,
    showSource: false,
    noRun: false,
    mayFail: false,
  };
  const seen = new Set<string>();
  const pattern = /\s*([A-Za-z][A-Za-z0-9-]*)(?:=("(?:[^"\\]|\\.)*"|[^\s"]+))?(?=\s|$)/y;
  let at = 0;
  const rest = text.trimEnd();
  while (at < rest.length) {
    pattern.lastIndex = at;
    const m = pattern.exec(rest);
    if (!m) {
      const bad = rest.slice(at).trim().split(/\s+/)[0];
      throw new NotebookError(
        `cannot read the cell option "${bad}"; write options as words, e.g. hide-source caption="A caption"`,
        { file, line },
      );
    }
    at = pattern.lastIndex;
    const name = m[1]!;
    const raw = m[2];
    if (seen.has(name)) throw new NotebookError(`the cell option "${name}" is given twice`, { file, line });
    seen.add(name);
    if ((CELL_FLAGS as readonly string[]).includes(name)) {
      if (raw !== undefined)
        throw new NotebookError(`the cell option "${name}" takes no value (write just ${name})`, {
          file,
          line,
        });
      if (name === "hide-source") options.hideSource = true;
      if (name === "show-source") options.showSource = true;
      if (name === "no-run") options.noRun = true;
      if (name === "may-fail") options.mayFail = true;
    } else if ((CELL_VALUE_OPTIONS as readonly string[]).includes(name)) {
      if (raw === undefined || raw === '""') {
        throw new NotebookError(
          `the cell option "${name}" needs a value, e.g. ${name === "caption" ? 'caption="Spectral radiance of lamp 2"' : "time-limit=90s"}`,
          { file, line },
        );
      }
      const value = raw.startsWith('"') ? raw.slice(1, -1).replace(/\\(.)/g, "$1") : raw;
      if (name === "caption") options.caption = value;
      else {
        try {
          options.timeLimitMs = parseTimeLimit(value, "time-limit");
        } catch (e) {
          throw new NotebookError(e instanceof UsageError ? e.message : String(e), { file, line });
        }
      }
    } else {
      throw new NotebookError(
        `unknown cell option "${name}" (known options: ${[...CELL_FLAGS, ...CELL_VALUE_OPTIONS.map((o) => `${o}=...`)].join(", ")})`,
        { file, line },
      );
    }
  }
  if (options.hideSource && options.showSource) {
    throw new NotebookError('the cell options "hide-source" and "show-source" contradict each other', {
      file,
      line,
    });
  }
  return options;
}
