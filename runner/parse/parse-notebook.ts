/**
 * Stage 1 of the pipeline: notebook text → NotebookDocument. Reads the front matter, finds the fenced code blocks
 * with markdown-it (so fences inside lists and quotes are found as a Markdown reader sees them) and turns the `ts` /
 * `typescript` ones into cells with their options and notebook line numbers.
 */
import { createHash } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import MarkdownIt from "markdown-it";
import { CELL_LANGUAGES, parseCellOptions } from "./cell-options.ts";
import { codeFrame } from "../text/code-frame.ts";
import { NotebookError } from "../shared/errors.ts";
import { parseFrontMatter, splitFrontMatter } from "./front-matter.ts";
import type { CellSource, NotebookDocument } from "./notebook.ts";

/** File name endings accepted as notebooks. */
export const NOTEBOOK_EXTENSIONS = [".md", ".markdown"] as const;

const markdown = new MarkdownIt("commonmark");

/** Reads and parses a notebook file; throws NotebookError for a missing or unreadable file or bad content. */
export function readNotebook(file: string): NotebookDocument {
  const absolute = path.resolve(file);
  if (!(NOTEBOOK_EXTENSIONS as readonly string[]).includes(path.extname(absolute).toLowerCase())) {
    throw new NotebookError(`not a notebook: a notebook is a Markdown file ending in .md`, { file });
  }
  let bytes: Buffer;
  try {
    bytes = fs.readFileSync(absolute);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === "ENOENT") throw new NotebookError("no such file", { file });
    if (code === "EISDIR") throw new NotebookError("this is a folder, not a notebook file", { file });
    throw new NotebookError(`cannot read the file (${code ?? String(e)})`, { file });
  }
  if (bytes.includes(0))
    throw new NotebookError("not a notebook: the file holds binary data, not Markdown text", { file });
  const invalid = firstInvalidUtf8(bytes);
  if (invalid !== undefined) {
    const before = bytes.subarray(0, invalid).toString("utf8");
    const lines = before.split(/\r\n?|\n/);
    const line = lines.length;
    const column = [...lines.at(-1)!].length + 1;
    const byte = bytes[invalid]!.toString(16).toUpperCase().padStart(2, "0");
    throw new NotebookError(
      `not UTF-8 text: byte 0x${byte} is not valid UTF-8 (the file may be Latin-1 or Windows-1252); save the notebook as UTF-8`,
      { file, line, column },
    );
  }
  return parseNotebook(bytes.toString("utf8"), absolute, createHash("sha256").update(bytes).digest("hex"));
}

/** Byte offset of the first byte that is not part of valid UTF-8, or undefined when all of it is valid. */
export function firstInvalidUtf8(bytes: Uint8Array): number | undefined {
  const decoded = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("utf8");
  if (!decoded.includes("\uFFFD")) return undefined;
  // Walk the decoded text; a U+FFFD not spelled EF BF BD in the bytes marks the first invalid byte.
  let offset = 0;
  for (const char of decoded) {
    if (
      char === "\uFFFD" &&
      !(bytes[offset] === 0xef && bytes[offset + 1] === 0xbf && bytes[offset + 2] === 0xbd)
    )
      return offset;
    offset += Buffer.byteLength(char, "utf8");
  }
  return undefined;
}

/** Parses notebook text (already read) into a document. */
export function parseNotebook(
  text: string,
  file: string,
  sha256 = createHash("sha256").update(text).digest("hex"),
): NotebookDocument {
  // CR-only and CRLF line endings read as LF.
  const source = (text.startsWith("\uFEFF") ? text.slice(1) : text).replace(/\r\n?/g, "\n");
  const { yaml, body } = splitFrontMatter(source, file);
  const frontMatter = parseFrontMatter(yaml, file);
  const lines = body.split("\n").map((l) => l.replace(/\r$/, ""));
  const cells: CellSource[] = [];
  for (const token of markdown.parse(body, {})) {
    if (token.type !== "fence" || !token.map) continue;
    const [start, end] = token.map;
    const fenceLine = start + 1;
    checkClosed(lines, start, end, token.markup, file, source);
    const info = token.info.trim();
    const language = info.split(/\s+/)[0] ?? "";
    if (!(CELL_LANGUAGES as readonly string[]).includes(language)) continue;
    const options = parseCellOptions(info.slice(language.length), file, fenceLine);
    const code = token.content.replace(/\n$/, "");
    cells.push({
      index: cells.length,
      code,
      fenceLine,
      firstLine: fenceLine + 1,
      lastLine: fenceLine + code.split("\n").length,
      columnOffset: columnOffset(lines, start + 1, code),
      options,
    });
  }
  return { path: file, text: source, sha256, frontMatter, body, cells };
}

/** Throws when the fence that opens on line `start` runs to the end of its container without a closing fence. */
function checkClosed(
  lines: string[],
  start: number,
  end: number,
  markup: string,
  file: string,
  text: string,
): void {
  const last = end - 1;
  const closing = (lines[last] ?? "").replace(/^[\s>]*/, "").trimEnd();
  const ok =
    last > start &&
    closing.length >= markup.length &&
    closing === closing[0]!.repeat(closing.length) &&
    closing[0] === markup[0];
  if (!ok) {
    throw new NotebookError(
      `the code fence opened here is never closed; add a line with ${markup} after the code`,
      { file, line: start + 1 },
      codeFrame(text, start + 1),
    );
  }
}

/** How many characters precede the code on its lines in the file (fence indentation or quote markers). */
function columnOffset(lines: string[], firstCodeLine: number, code: string): number {
  const codeLines = code.split("\n");
  for (let i = 0; i < codeLines.length; i++) {
    const inCode = codeLines[i]!;
    const inFile = lines[firstCodeLine + i] ?? "";
    if (inCode.trim() !== "" && inFile.endsWith(inCode)) return inFile.length - inCode.length;
  }
  return 0;
}
