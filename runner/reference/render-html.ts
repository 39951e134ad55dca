/**
 * The whole reference as one self-contained HTML page in the reports' style (runner/report/report.css, read in
 * place), grouped by topic (the lib folder), with a contents list. Every piece of text from the source is
 * HTML-escaped with the reports' escaping.
 */
import fs from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { escapeHtml } from "../report/escape.ts";
import { topicTitle, type ReferenceEntry, type ReferenceParameter } from "./extract.ts";

const here = path.dirname(fileURLToPath(import.meta.url));

/** The reports' stylesheet, read when a page is rendered (so this module loads without it). */
function reportCss(): string {
  return fs.readFileSync(path.join(here, "..", "report", "report.css"), "utf8");
}

/** Layout the reference adds to the reports' stylesheet. */
const REFERENCE_CSS = `
.reference-entry { margin: 0 0 2.2rem; break-inside: avoid-page; }
.reference-entry h3 { font-family: var(--mono); font-size: 1.05rem; margin-bottom: 0.3rem; }
.reference-entry pre.signature { background: var(--tint); padding: 0.5rem 0.7rem; margin: 0 0 0.7rem; white-space: pre-wrap; }
.reference-entry dl.arguments { font-size: 0.95rem; margin: 0 0 0.8rem; }
.reference-entry dl.arguments dt { font-family: var(--mono); font-size: 0.85rem; margin-top: 0.4rem; }
.reference-entry dl.arguments dt .type { color: var(--muted); }
.reference-entry dl.arguments dd { margin: 0 0 0 1.2rem; }
.reference-entry dl.arguments dl.options { margin: 0.2rem 0 0.2rem 0; }
.reference-entry .label { font-family: var(--sans); font-size: 0.72rem; text-transform: uppercase; letter-spacing: 0.06em; color: var(--muted); margin: 0.6rem 0 0.2rem; }
.reference-entry pre.example { border-left: 3px solid var(--rule); padding-left: 0.7rem; margin: 0 0 0.6rem; white-space: pre-wrap; }
.reference-entry .defined-in { font-family: var(--sans); font-size: 0.78rem; color: var(--faint); }
`;

/** Text with `code` spans turned into <code> elements (everything escaped first). */
function inline(text: string): string {
  return escapeHtml(text).replace(/`([^`]+)`/g, "<code>$1</code>");
}

function anchor(name: string): string {
  return `fn-${name}`;
}

function parameterHtml(p: ReferenceParameter): string {
  const doc = p.doc || (p.options.length > 0 ? "Options, each described below." : "");
  const initial =
    p.initializer && p.initializer !== "{}"
      ? ` (in the signature: <code>= ${escapeHtml(p.initializer)}</code>)`
      : "";
  const options = p.options.length
    ? `<dl class="options">${p.options
        .map(
          (o) =>
            `<dt>.${escapeHtml(o.name)}${o.optional ? "?" : ""}: <span class="type">${escapeHtml(o.type)}</span></dt><dd>${inline(o.doc)}</dd>`,
        )
        .join("")}</dl>`
    : "";
  return `<dt>${p.rest ? "..." : ""}${escapeHtml(p.name)}${p.optional ? "?" : ""}: <span class="type">${escapeHtml(p.type)}</span></dt><dd>${inline(doc)}${initial}${options}</dd>`;
}

function entryHtml(e: ReferenceEntry): string {
  const parts = [
    `<article class="reference-entry" id="${escapeHtml(anchor(e.name))}">`,
    `<h3>${escapeHtml(e.name)}</h3>`,
    `<pre class="signature"><code>${e.signatures.map(escapeHtml).join("\n")}</code></pre>`,
    `<p>${inline(e.summary)}</p>`,
    ...(e.details ? e.details.split("\n\n").map((d) => `<p>${inline(d)}</p>`) : []),
  ];
  if (e.parameters.length)
    parts.push(
      `<p class="label">Arguments</p><dl class="arguments">${e.parameters.map(parameterHtml).join("")}</dl>`,
    );
  parts.push(
    `<p class="label">Returns</p><p><code>${escapeHtml(e.returnType)}</code>${e.returns ? ` — ${inline(e.returns)}` : ""}</p>`,
    `<p class="label">Source</p><p>${inline(e.source || "(not given)")}</p>`,
  );
  if (e.examples.length)
    parts.push(
      `<p class="label">${e.examples.length === 1 ? "Example" : "Examples"}</p>${e.examples
        .map((x) => `<pre class="example"><code>${escapeHtml(x)}</code></pre>`)
        .join("")}`,
    );
  parts.push(`<p class="defined-in">${escapeHtml(`${e.file}:${e.line}`)}</p></article>`);
  return parts.join("\n");
}

/** The page: title block, contents by topic, then each topic's functions in full. */
export function renderReferenceHtml(entries: readonly ReferenceEntry[], version: string): string {
  const topics: string[] = [];
  for (const e of entries) if (!topics.includes(e.topic)) topics.push(e.topic);
  const contents = topics
    .map((t) => {
      const names = entries
        .filter((e) => e.topic === t)
        .map((e) => `<a href="#${escapeHtml(anchor(e.name))}"><code>${escapeHtml(e.name)}</code></a>`)
        .join(", ");
      return `<li><a href="#topic-${escapeHtml(t)}">${escapeHtml(topicTitle(t))}</a><br><span class="muted">${names}</span></li>`;
    })
    .join("");
  const sections = topics
    .map(
      (t) =>
        `<section class="reference-topic" id="topic-${escapeHtml(t)}"><h2>${escapeHtml(topicTitle(t))} <span class="muted">(lib/${escapeHtml(t)})</span></h2>\n${entries
          .filter((e) => e.topic === t)
          .map(entryHtml)
          .join("\n")}</section>`,
    )
    .join("\n");
  const title = "tristim library reference";
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="generator" content="${escapeHtml(`tristim ${version}`)}">
<title>${escapeHtml(title)}</title>
<style>${reportCss()}${REFERENCE_CSS}</style>
</head>
<body>
<main class="report reference">
<header class="title-block"><h1>${escapeHtml(title)}</h1>
<p class="title-sub">Every function a notebook cell can use (${entries.length} functions), generated from the doc comments in lib/. Units: wavelengths in nm, reflectance and transmittance as fractions, XYZ on the Y = 100 scale unless a function says otherwise.</p></header>
<nav class="contents" aria-label="Contents"><h2>Topics</h2><ol>${contents}</ol></nav>
${sections}
<footer class="report-footer">Made with tristim ${escapeHtml(version)} from the doc comments of lib/.</footer>
</main>
</body>
</html>
`;
}
