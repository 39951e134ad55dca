/**
 * The Methods section: the colorimetric conditions the library noted during the run (observer, illuminant,
 * wavelength range, interpolation, ...), grouped by topic in the order a reviewer reads them.
 */
import { METHOD_TOPICS } from "../../lib/methods/method-log.ts";
import type { MethodRecord } from "../run-record.ts";
import { escapeHtml } from "./escape.ts";

/** The Methods section HTML, or an empty string when nothing was noted. */
export function renderMethods(methods: readonly MethodRecord[], id: string): string {
  if (methods.length === 0) return "";
  const order = (topic: string) => {
    const i = (METHOD_TOPICS as readonly string[]).indexOf(topic);
    return i < 0 ? METHOD_TOPICS.length : i;
  };
  const topics = [...new Set(methods.map((m) => m.topic))].sort((a, b) => order(a) - order(b));
  const groups = topics.map((topic) => {
    const items = methods.filter((m) => m.topic === topic).map((m) => `<li>${escapeHtml(m.statement)}</li>`).join("");
    return `<dt>${escapeHtml(topic.charAt(0).toUpperCase() + topic.slice(1))}</dt><dd><ul>${items}</ul></dd>`;
  });
  return `<section class="methods" id="${id}"><h2>Methods</h2>` +
    `<p class="section-note">Conditions the computations in this report used, as recorded by the library during the run.</p>` +
    `<dl class="method-list">${groups.join("")}</dl></section>`;
}
