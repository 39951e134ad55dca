/** The reference as plain text for the terminal: one function in full, or the list of every function by topic. */
import { topicTitle, type ReferenceEntry, type ReferenceParameter } from "./extract.ts";

const WIDTH = 100;

/** Wraps running text to the terminal width with a hanging indent. */
function wrap(text: string, indent: string, first = indent): string {
  const words = text.split(/\s+/).filter(Boolean);
  const lines: string[] = [];
  let line = first;
  let empty = true;
  for (const word of words) {
    if (!empty && line.length + 1 + word.length > WIDTH) {
      lines.push(line);
      line = indent + word;
    } else line += (empty ? "" : " ") + word;
    empty = false;
  }
  lines.push(line);
  return lines.join("\n");
}

function parameterLines(p: ReferenceParameter): string[] {
  const head = `  ${p.rest ? "..." : ""}${p.name}${p.optional ? " (optional)" : ""}: ${p.type}`;
  const lines = [head];
  const doc = p.doc || (p.options.length > 0 ? "options, each described below" : "");
  if (doc) lines.push(wrap(doc, "      "));
  if (p.initializer && p.initializer !== "{}") lines.push(`      in the signature: = ${p.initializer}`);
  for (const o of p.options) {
    lines.push(`    .${o.name}${o.optional ? " (optional)" : ""}: ${o.type}`);
    if (o.doc) lines.push(wrap(o.doc, "        "));
  }
  return lines;
}

/** The full text of one function: signature, summary, arguments and options, returns, source, examples, file. */
export function renderEntryText(e: ReferenceEntry): string {
  const out: string[] = [];
  out.push(`${e.name} — ${topicTitle(e.topic)}`, "");
  for (const s of e.signatures) out.push(wrap(s, "    ", "  "));
  out.push("");
  if (e.summary) out.push(wrap(e.summary, "  "));
  for (const paragraph of e.details ? e.details.split("\n\n") : []) out.push("", wrap(paragraph, "  "));
  if (e.parameters.length > 0) {
    out.push("", "Arguments");
    for (const p of e.parameters) out.push(...parameterLines(p));
  }
  out.push("", "Returns", wrap(`${e.returnType}${e.returns ? ` — ${e.returns}` : ""}`, "    ", "  "));
  out.push("", "Source", wrap(e.source || "(not given)", "  "));
  if (e.examples.length > 0) {
    out.push("", e.examples.length === 1 ? "Example" : "Examples");
    for (const x of e.examples) out.push(...x.split("\n").map((l) => `  ${l}`));
  }
  out.push("", `Defined in ${e.file}:${e.line}`);
  return `${out.join("\n")}\n`;
}

/** Every function by topic, one line each: name and summary. */
export function renderIndexText(entries: readonly ReferenceEntry[]): string {
  const out: string[] = [
    `${entries.length === 1 ? "1 function" : `${entries.length} functions`} of the tristim library. "tristim reference <name>" shows one in full;`,
    `"tristim reference --html <file>" writes the whole reference as one page.`,
  ];
  let topic = "";
  const width = Math.min(32, Math.max(...entries.map((e) => e.name.length)) + 2);
  for (const e of entries) {
    if (e.topic !== topic) {
      topic = e.topic;
      out.push("", `${topicTitle(topic)} (lib/${topic})`);
    }
    const name = `  ${e.name.padEnd(width)}`;
    out.push(wrap(e.summary, " ".repeat(name.length + 1), `${name} `).trimEnd());
  }
  return `${out.join("\n")}\n`;
}

/** Edit distance (Levenshtein), case-insensitive. */
function distance(a: string, b: string): number {
  const x = a.toLowerCase(),
    y = b.toLowerCase();
  let previous = Array.from({ length: y.length + 1 }, (_, j) => j);
  for (let i = 1; i <= x.length; i++) {
    const row = [i];
    for (let j = 1; j <= y.length; j++) {
      row.push(
        Math.min(previous[j]! + 1, row[j - 1]! + 1, previous[j - 1]! + (x[i - 1] === y[j - 1] ? 0 : 1)),
      );
    }
    previous = row;
  }
  return previous[y.length]!;
}

/** Names close to `name`: containing it (or contained in it, ignoring case), or within a few edits; best first. */
export function closeMatches(name: string, names: readonly string[], limit = 5): string[] {
  const lower = name.toLowerCase();
  const scored = names
    .map((n) => {
      const l = n.toLowerCase();
      const contains = lower.length >= 3 && (l.includes(lower) || lower.includes(l));
      return { n, score: contains ? -1 : distance(name, n) };
    })
    .filter(
      ({ n, score }) => score < 0 || score <= Math.max(2, Math.floor(Math.min(name.length, n.length) / 3)),
    );
  return scored
    .sort((a, b) => a.score - b.score || a.n.length - b.n.length || a.n.localeCompare(b.n))
    .slice(0, limit)
    .map((s) => s.n);
}
