/** Syntax highlighting of code in reports (highlight.js core with the languages notebooks show). */
import hljs from "highlight.js/lib/core";
import bash from "highlight.js/lib/languages/bash";
import css from "highlight.js/lib/languages/css";
import javascript from "highlight.js/lib/languages/javascript";
import json from "highlight.js/lib/languages/json";
import plaintext from "highlight.js/lib/languages/plaintext";
import typescript from "highlight.js/lib/languages/typescript";
import xml from "highlight.js/lib/languages/xml";
import yaml from "highlight.js/lib/languages/yaml";
import { escapeHtml } from "./escape.ts";

hljs.registerLanguage("typescript", typescript);
hljs.registerLanguage("javascript", javascript);
hljs.registerLanguage("json", json);
hljs.registerLanguage("yaml", yaml);
hljs.registerLanguage("bash", bash);
hljs.registerLanguage("css", css);
hljs.registerLanguage("xml", xml);
hljs.registerLanguage("plaintext", plaintext);
hljs.registerAliases(["ts"], { languageName: "typescript" });
hljs.registerAliases(["js", "mjs"], { languageName: "javascript" });
hljs.registerAliases(["sh", "shell", "console"], { languageName: "bash" });
hljs.registerAliases(["html"], { languageName: "xml" });
hljs.registerAliases(["yml"], { languageName: "yaml" });

/** Highlighted code already made in this process, by language and code (see prewarmHighlighting). */
const made = new Map<string, string>();
/** How many highlighted pieces are kept (a long watch session would otherwise keep every edit). */
const KEEP = 2000;

/** Highlighted HTML for code in a language (escaped plain text for languages it does not know). */
export function highlight(code: string, language: string): string {
  const lang = language.toLowerCase();
  if (!lang || !hljs.getLanguage(lang)) return escapeHtml(code);
  const key = `${lang}\0${code}`;
  let html = made.get(key);
  if (html === undefined) {
    html = hljs.highlight(code, { language: lang, ignoreIllegals: true }).value;
    if (made.size >= KEEP) made.clear();
    made.set(key, html);
  }
  return html;
}

/**
 * Highlights pieces of code ahead of the report, one piece per turn of the event loop, so that it is done while
 * the runner waits for the cells (highlighting a 20-cell notebook took about 60 ms of the report's writing, most
 * of it highlight.js building its TypeScript grammar on first use), without holding up the cells' messages.
 */
export function prewarmHighlighting(
  pieces: readonly { readonly code: string; readonly language: string }[],
): void {
  let next = 0;
  const step = () => {
    const piece = pieces[next++];
    if (!piece) return;
    highlight(piece.code, piece.language);
    setImmediate(step).unref();
  };
  setImmediate(step).unref();
}
