/**
 * A markdown-it plugin (`md.use(proseMath)`): TeX math in prose, typeset when the report is written, as MathML
 * (temml), so the report needs no script and no font to show it, and prints as it looks.
 *
 * The rule for `$` (README, "Math in prose"), chosen so that prices and amounts stay text:
 * - `$$ … $$` is display math: either a paragraph of its own (the opening `$$` starts a line, the closing `$$` ends
 *   one; it may span lines) or inline in a sentence;
 * - `$…$` is inline math only when the character after the opening `$` is not a space and the next `$` can close
 *   it: no space before it, no digit after it; else the opening `$` is a plain dollar sign. So "$5 and $10",
 *   "US$12.50 to US$3", "$20–$30" and "costs $ 4" stay text, and "pay $5 for $x$" has one piece of math, x;
 * - `\$` is always a literal dollar sign, in text and inside math;
 * - a `$` with no closing partner is a literal dollar sign; a `$$` paragraph with no closing `$$` is an error.
 * Math in code spans and code blocks is never touched (markdown-it reads those first).
 *
 * TeX that temml cannot read is an error naming the notebook's file and line when the prose is the notebook's
 * (`MathEnv.mathFile`); in Markdown shown by a cell it is marked in place, naming the cell and the line of that
 * Markdown, so the rest of the report is still written.
 */
import { createRequire } from "node:module";
import type MarkdownIt from "markdown-it";
import type { StateBlock, StateCore, StateInline, Token } from "markdown-it";
import type Temml from "temml";
import { NotebookError } from "../shared/errors.ts";
import { escapeHtml } from "./escape.ts";

/** What the plugin reads from markdown-it's `env`. */
export type MathEnv = {
  /** The notebook file whose prose this is: malformed math throws a `NotebookError` naming it and the line. */
  readonly mathFile?: string;
  /** For Markdown shown by a cell: who showed it ("cell 5"), named in the mark left for malformed math. */
  readonly mathShownBy?: string;
};

/**
 * temml, loaded with require the first time a report has math: it is a third of the bundled CLI (450 kB), which
 * node would otherwise parse on every run, math or not (a static import of an npm package is bundled in).
 */
let temml: typeof Temml | undefined;
const typesetter = (): typeof Temml => (temml ??= createRequire(import.meta.url)("temml") as typeof Temml);

const DOLLAR = 0x24;
const BACKSLASH = 0x5c;

function isSpace(code: number): boolean {
  return code === 0x20 || code === 0x09 || code === 0x0a || code === 0x0d;
}

function isDigit(code: number): boolean {
  return code >= 0x30 && code <= 0x39;
}

/** The index of the `$` (or `$$`) that closes math opened before `from`, or -1. */
function findCloser(src: string, from: number, end: number, display: boolean): number {
  for (let i = from; i < end; i++) {
    const c = src.charCodeAt(i);
    if (c === BACKSLASH) {
      i++; // `\$` and any other escape inside TeX belong to the math
      continue;
    }
    if (c !== DOLLAR) continue;
    if (display) {
      if (src.charCodeAt(i + 1) === DOLLAR) return i;
      continue;
    }
    // Inline math ends at the next `$`; if that one cannot close, the opening `$` was a plain dollar sign.
    const canClose =
      src.charCodeAt(i + 1) !== DOLLAR && !isSpace(src.charCodeAt(i - 1)) && !isDigit(src.charCodeAt(i + 1));
    return canClose ? i : -1;
  }
  return -1;
}

function mathInline(state: StateInline, silent: boolean): boolean {
  const { src, pos, posMax } = state;
  if (src.charCodeAt(pos) !== DOLLAR) return false;
  const display = src.charCodeAt(pos + 1) === DOLLAR;
  const open = display ? 2 : 1;
  const first = src.charCodeAt(pos + open);
  if (!display && (Number.isNaN(first) || isSpace(first))) return false;
  const close = findCloser(src, pos + open, posMax, display);
  if (close < 0 || close === pos + open) return false;
  if (!silent) {
    const token = state.push("math_inline", "math", 0);
    token.content = src.slice(pos + open, close);
    token.markup = display ? "$$" : "$";
    token.meta = { offset: pos, display };
  }
  state.pos = close + open;
  return true;
}

function mathBlock(state: StateBlock, startLine: number, endLine: number, silent: boolean): boolean {
  const start = state.bMarks[startLine]! + state.tShift[startLine]!;
  const max = state.eMarks[startLine]!;
  if (state.sCount[startLine]! - state.blkIndent >= 4) return false;
  if (state.src.slice(start, start + 2) !== "$$") return false;
  const firstRest = state.src.slice(start + 2, max);
  let last = startLine;
  let content: string;
  if (firstRest.trimEnd().endsWith("$$") && firstRest.trim().length > 2) {
    content = firstRest.trimEnd().slice(0, -2);
  } else {
    const parts = [firstRest];
    let closed = false;
    for (let line = startLine + 1; line < endLine; line++) {
      const text = state.src.slice(state.bMarks[line]! + state.tShift[line]!, state.eMarks[line]!);
      if (text.trim() === "" && state.sCount[line]! < state.blkIndent) break;
      if (text.trimEnd().endsWith("$$")) {
        parts.push(text.trimEnd().slice(0, -2));
        last = line;
        closed = true;
        break;
      }
      if (text.trim() === "") break;
      parts.push(text);
    }
    if (!closed) {
      if (silent) return false;
      const token = state.push("math_block", "math", 0);
      token.map = [startLine, startLine + 1];
      token.meta = { unclosed: true };
      state.line = startLine + 1;
      return true;
    }
    content = parts.join("\n");
  }
  if (silent) return true;
  const token = state.push("math_block", "math", 0);
  token.content = content;
  token.markup = "$$";
  token.map = [startLine, last + 1];
  state.line = last + 1;
  return true;
}

/** Typesets each math token once the inline pass has run, where the line of each piece of math is known. */
function typesetMath(state: StateCore): void {
  const env = (state.env ?? {}) as MathEnv;
  const typeset = (token: Token, line: number, display: boolean): void => {
    if (token.meta?.unclosed) {
      fail(env, line, "display math opened with $$ is not closed with $$ at the end of a line", "$$");
      token.meta = { html: mark(env, line, "display math opened with $$ is not closed", "$$") };
      return;
    }
    try {
      const html = typesetter().renderToString(token.content, {
        displayMode: display,
        throwOnError: true,
        annotate: true,
        trust: false,
        maxExpand: 1000,
      });
      token.meta = { ...token.meta, html };
    } catch (error) {
      const message =
        error instanceof Error
          ? error.message.replace(/^\s*Temml parse error:\s*/i, "").trim()
          : String(error);
      fail(env, line, message, token.content);
      token.meta = { ...token.meta, html: mark(env, line, message, token.content) };
    }
  };
  for (const token of state.tokens) {
    const firstLine = (token.map?.[0] ?? 0) + 1;
    if (token.type === "math_block") typeset(token, firstLine, true);
    if (token.type !== "inline" || !token.children) continue;
    for (const child of token.children) {
      if (child.type !== "math_inline") continue;
      const offset = (child.meta as { offset: number }).offset;
      const line = firstLine + (token.content.slice(0, offset).match(/\n/g)?.length ?? 0);
      typeset(child, line, (child.meta as { display: boolean }).display);
    }
  }
}

/** Malformed math in the notebook's own prose stops the report with the file and line. */
function fail(env: MathEnv, line: number, message: string, tex: string): void {
  if (env.mathFile === undefined) return;
  throw new NotebookError(`math could not be typeset: ${message} (in "${shorten(tex)}")`, {
    file: env.mathFile,
    line,
  });
}

/** Malformed math in Markdown a cell showed: marked where it stands, with the TeX as written. */
function mark(env: MathEnv, line: number, message: string, tex: string): string {
  const where = `${env.mathShownBy ? `in the Markdown shown by ${env.mathShownBy}, ` : ""}line ${line}`;
  return `<span class="math-error" role="note">math could not be typeset (${escapeHtml(where)}): ${escapeHtml(message)}; written as <code>${escapeHtml(tex)}</code></span>`;
}

function shorten(tex: string): string {
  const one = tex.replace(/\s+/g, " ").trim();
  return one.length > 60 ? `${one.slice(0, 57)}…` : one;
}

/** Installs the math rules; use as `md.use(proseMath)`. */
export const proseMath = (md: InstanceType<typeof MarkdownIt>): void => {
  md.inline.ruler.before("escape", "prose_math_inline", mathInline);
  md.block.ruler.before("paragraph", "prose_math_block", mathBlock, {
    alt: ["paragraph", "reference", "blockquote", "list"],
  });
  md.core.ruler.after("inline", "prose_math", typesetMath);
  md.renderer.rules.math_inline = (tokens, i) => String(tokens[i]!.meta?.html ?? "");
  md.renderer.rules.math_block = (tokens, i) =>
    `<div class="math-display">${String(tokens[i]!.meta?.html ?? "")}</div>\n`;
};
