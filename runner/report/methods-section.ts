/**
 * The Methods section: the colorimetric conditions the library noted during the run (observer, illuminant,
 * wavelength range, interpolation, ...), written as a lab report's Methods: grouped under a few headings in the order
 * a reviewer reads them, each topic a paragraph with a run-in heading. It says that no colorimetric computation was
 * recorded only when that is true: the log was collected from every cell that ran.
 */
import { METHOD_TOPICS } from "../../lib/methods/method-log.ts";
import type { MethodNote, RunRecord } from "../records/run-record.ts";
import { escapeHtml } from "./escape.ts";
import { describeCells } from "../text/cell-numbers.ts";

/** The headings of the section and the topics under each, in reading order. */
const GROUPS: readonly { readonly heading: string; readonly topics: readonly string[] }[] = [
  {
    heading: "Colorimetric conditions",
    topics: [
      "observer",
      "illuminant",
      "wavelength range",
      "interpolation",
      "extrapolation",
      "integration",
      "normalisation",
    ],
  },
  {
    heading: "Derived quantities",
    topics: [
      "colour space",
      "colour temperature",
      "colour difference",
      "chromatic adaptation",
      "photometry",
      "rgb encoding",
      "gamut",
      "colour rendering",
    ],
  },
  { heading: "Optical, mixing and print models", topics: ["optics", "mixing", "halftone"] },
  { heading: "Data handling", topics: ["data files"] },
  { heading: "Measurement uncertainty", topics: ["uncertainty"] },
];

/** More statements than this under one topic are listed rather than run together. */
const LIST_ABOVE = 3;

/** Run-in headings for topics whose plain name would read oddly. */
const TOPIC_LABEL: Record<string, string> = {
  "rgb encoding": "RGB encoding",
  "data files": "Files read and written",
};

/** Topics where more than one condition in one run deserves a remark (results may not be comparable). */
const ONE_EXPECTED: Record<string, string> = {
  observer:
    "More than one observer was used in this run; results computed with different observers are not comparable.",
  illuminant: "More than one illuminant was used in this run; each result's cell shows which one it used.",
};

/** The Methods section HTML (always present, so a reader knows whether anything was recorded). */
export function renderMethods(
  run: Pick<RunRecord, "methods" | "methodsMissingFrom" | "cells">,
  id: string,
): string {
  const { methods } = run;
  const gaps = run.methodsMissingFrom ?? [];
  const ran = run.cells.some((c) => c.status === "ok" || c.status === "failed");
  const gapNote =
    gaps.length === 0
      ? ""
      : `<p class="section-note methods-gap">The conditions used by ${describeCells(gaps.map((i) => i + 1))} could not be collected, because ` +
        `${gaps.length === 1 ? "its process was" : "their process was"} stopped before reporting them; this list may be incomplete.</p>`;
  if (methods.length === 0) {
    const text = !ran
      ? "No cells ran, so no computations were recorded."
      : gaps.length > 0
        ? "No colorimetric conditions were collected from the cells that finished."
        : "No colorimetric computations were recorded during this run: no cell used a library function that depends on an observer, illuminant, formula or other condition.";
    return `<section class="methods" id="${id}"><h2>Methods</h2><p class="section-note">${escapeHtml(text)}</p>${gapNote}</section>`;
  }

  const known = new Set(GROUPS.flatMap((g) => g.topics));
  const byTopic = new Map<string, MethodNote[]>();
  for (const m of methods) byTopic.set(m.topic, [...(byTopic.get(m.topic) ?? []), m]);
  const order = (topic: string) => {
    const i = (METHOD_TOPICS as readonly string[]).indexOf(topic);
    return i < 0 ? METHOD_TOPICS.length : i;
  };
  const others = [...byTopic.keys()].filter((t) => !known.has(t)).sort((a, b) => order(a) - order(b));
  const groups = [...GROUPS, { heading: "Other conditions", topics: others }];

  const html = groups
    .map((group) => {
      const paragraphs = group.topics
        .filter((t) => byTopic.has(t))
        .map((topic) => {
          const statements = byTopic.get(topic)!.map((m) => methodSentence(m.statement));
          if (statements.length > 1 && ONE_EXPECTED[topic]) statements.push(ONE_EXPECTED[topic]!);
          const head = `<strong class="run-in">${escapeHtml(topicLabel(topic))}.</strong>`;
          // A few conditions read as a paragraph; a longer run of them as a list, so none is lost in a wall of text.
          if (statements.length <= LIST_ABOVE)
            return `<p>${head} ${statements.map(escapeHtml).join(" ")}</p>`;
          return `<p>${head}</p><ul>${statements.map((t) => `<li>${escapeHtml(t)}</li>`).join("")}</ul>`;
        });
      return paragraphs.length ? `<h3>${escapeHtml(group.heading)}</h3>${paragraphs.join("")}` : "";
    })
    .join("");
  return (
    `<section class="methods" id="${id}"><h2>Methods</h2>` +
    `<p class="section-note">The computations in this report used the following conditions, as the library recorded them while the cells ran.</p>` +
    `${gapNote}<div class="method-text">${html}</div></section>`
  );
}

function topicLabel(topic: string): string {
  return TOPIC_LABEL[topic] ?? topic.charAt(0).toUpperCase() + topic.slice(1);
}

/**
 * A statement as a sentence: its text exactly as the library wrote it, with a full stop added when it has no closing
 * punctuation. The case is never changed: a statement may start with a symbol or name whose case is its meaning
 * ("sRGB", "u′v′", "pH"), and capitalising it would misstate it.
 */
export function methodSentence(statement: string): string {
  const text = statement.trim();
  return /[.!?]$/.test(text) ? text : `${text}.`;
}
