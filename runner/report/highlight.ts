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

/** Highlighted HTML for code in a language (escaped plain text for languages it does not know). */
export function highlight(code: string, language: string): string {
  const lang = language.toLowerCase();
  if (lang && hljs.getLanguage(lang))
    return hljs.highlight(code, { language: lang, ignoreIllegals: true }).value;
  return escapeHtml(code);
}
