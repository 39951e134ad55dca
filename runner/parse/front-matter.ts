/** The YAML front matter of a notebook: title, author, date and named inputs with defaults. */
import { parseDocument } from "yaml";
import type { InputValue } from "../../cells/inputs.ts";
import { NotebookError } from "../shared/errors.ts";
import type { FrontMatter } from "./notebook.ts";

/** The keys the front matter may have. */
export const FRONT_MATTER_KEYS = ["title", "author", "date", "inputs"] as const;

/** Splits off the front matter: its YAML text, the line after it, and the body with the front matter lines blanked. */
export function splitFrontMatter(text: string, file: string): { yaml: string | null; body: string } {
  const lines = text.split("\n");
  if (lines[0]?.replace(/\r$/, "") !== "---") return { yaml: null, body: text };
  const end = lines.findIndex((l, i) => i > 0 && /^(---|\.\.\.)\s*$/.test(l.replace(/\r$/, "")));
  if (end < 0) {
    throw new NotebookError(
      "the front matter that starts with --- on line 1 is never closed; end it with a line holding only ---",
      { file, line: 1 },
    );
  }
  return {
    yaml: lines.slice(1, end).join("\n"),
    body: lines.map((l, i) => (i <= end ? "" : l)).join("\n"),
  };
}

/** Parses and checks the front matter YAML; errors name the file and line. */
export function parseFrontMatter(yamlText: string | null, file: string): FrontMatter {
  if (yamlText === null || yamlText.trim() === "") return { inputs: {} };
  const doc = parseDocument(yamlText, { prettyErrors: false, uniqueKeys: true });
  if (doc.errors.length > 0) {
    const error = doc.errors[0]!;
    // error.pos is an offset into the YAML text (linePos is only filled in with prettyErrors).
    const before = yamlText.slice(0, Math.max(0, Math.min(error.pos[0], yamlText.length)));
    const yamlLine = before.split("\n").length;
    const column = before.length - before.lastIndexOf("\n");
    const message = error.message.split("\n")[0]!.replace(/ at line \d+, column \d+:?$/, "");
    // The YAML starts on line 2 of the file (after the opening ---).
    throw new NotebookError(`invalid front matter: ${message}`, { file, line: yamlLine + 1, column });
  }
  const data: unknown = doc.toJS();
  if (data === null || typeof data !== "object" || Array.isArray(data)) {
    throw new NotebookError(
      "invalid front matter: expected keys such as title:, author:, date: and inputs:",
      { file, line: 2 },
    );
  }
  const record = data as Record<string, unknown>;
  for (const key of Object.keys(record)) {
    if (!(FRONT_MATTER_KEYS as readonly string[]).includes(key)) {
      throw new NotebookError(
        `invalid front matter: unknown key "${key}" (known keys: ${FRONT_MATTER_KEYS.join(", ")})`,
        { file, line: lineOfKey(yamlText, key) },
      );
    }
  }
  const text = (key: "title" | "author" | "date"): string | undefined => {
    const v = record[key];
    if (v === undefined || v === null) return undefined;
    if (typeof v === "string" || typeof v === "number") return String(v);
    if (v instanceof Date) return v.toISOString().slice(0, 10);
    throw new NotebookError(`invalid front matter: ${key} must be a single line of text`, {
      file,
      line: lineOfKey(yamlText, key),
    });
  };
  return {
    title: text("title"),
    author: text("author"),
    date: text("date"),
    inputs: parseInputs(record.inputs, yamlText, file),
  };
}

function parseInputs(value: unknown, yamlText: string, file: string): Record<string, InputValue> {
  if (value === undefined || value === null) return {};
  const line = lineOfKey(yamlText, "inputs");
  if (typeof value !== "object" || Array.isArray(value)) {
    throw new NotebookError("invalid front matter: inputs must map each input name to its default value", {
      file,
      line,
    });
  }
  const out: Record<string, InputValue> = {};
  for (const [name, def] of Object.entries(value as Record<string, unknown>)) {
    const where = lineOfKey(yamlText, name) ?? line;
    if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(name)) {
      throw new NotebookError(
        `invalid front matter: input name "${name}" must be a plain identifier (letters, digits, _)`,
        { file, line: where },
      );
    }
    out[name] = checkInputValue(def, name, file, where);
  }
  return out;
}

function checkInputValue(value: unknown, name: string, file: string, line: number | undefined): InputValue {
  if (typeof value === "number") {
    if (!Number.isFinite(value))
      throw new NotebookError(
        `invalid front matter: input "${name}" has the default ${value}; use a finite number`,
        { file, line },
      );
    return value;
  }
  if (typeof value === "string" || typeof value === "boolean") return value;
  if (value instanceof Date) return value.toISOString().slice(0, 10);
  if (Array.isArray(value)) return value.map((v) => checkInputValue(v, name, file, line));
  if (value !== null && typeof value === "object") {
    return Object.fromEntries(
      Object.entries(value).map(([k, v]) => [k, checkInputValue(v, name, file, line)]),
    );
  }
  throw new NotebookError(
    `invalid front matter: input "${name}" needs a default value (a number, text, true/false or a list); its type is taken from it`,
    { file, line },
  );
}

/** 1-based notebook line of a YAML key (the front matter starts on line 2 of the file). */
function lineOfKey(yamlText: string, key: string): number | undefined {
  const i = yamlText
    .split("\n")
    .findIndex((l) =>
      new RegExp(`^\\s*["']?${key.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}["']?\\s*:`).test(l),
    );
  return i < 0 ? undefined : i + 2;
}
