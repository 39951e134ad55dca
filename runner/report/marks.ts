/**
 * The report's signs, drawn here as inline SVG of our own (no icon set, no font glyphs), so they look and print the
 * same in every browser: the outcome seal of the report's head and the hazard sign of a caution.
 */

/** The outcome's kind: decides the panel's colour and its mark. */
export type OutcomeKind = "pass" | "fail" | "incomplete" | "none";

/** A round seal with a tick (pass), a cross (fail) or a bar (incomplete, nothing to check), drawn in SVG. */
export function outcomeMark(kind: OutcomeKind): string {
  const inner =
    kind === "pass"
      ? '<path d="M7.2 12.4l3.2 3.3 6.6-7.4" fill="none" stroke="currentColor" stroke-width="2.4" stroke-linecap="round" stroke-linejoin="round"/>'
      : kind === "fail"
        ? '<path d="M8 8l8 8M16 8l-8 8" fill="none" stroke="currentColor" stroke-width="2.4" stroke-linecap="round"/>'
        : '<path d="M7.5 12h9" fill="none" stroke="currentColor" stroke-width="2.4" stroke-linecap="round"/>';
  return `<svg class="outcome-mark" viewBox="0 0 24 24" width="34" height="34" aria-hidden="true"><circle cx="12" cy="12" r="10.5" fill="none" stroke="currentColor" stroke-width="1.6"/><circle cx="12" cy="12" r="8.2" fill="none" stroke="currentColor" stroke-width="0.8"/>${inner}</svg>`;
}

/** The hazard sign of a caution: a triangle with rounded corners and an exclamation mark, drawn in SVG. */
export function hazardSign(size = 22): string {
  return (
    `<svg class="hazard-sign" viewBox="0 0 24 22" width="${size}" height="${Math.round((size * 22) / 24)}" aria-hidden="true">` +
    '<path d="M12 1.6c.5 0 .95.26 1.2.7l9.6 16.6c.52.9-.13 2.0-1.17 2.0H2.37c-1.04 0-1.69-1.1-1.17-2.0L10.8 2.3c.25-.44.7-.7 1.2-.7z" fill="currentColor"/>' +
    '<path d="M12 7.4v6.2" stroke="#fff" stroke-width="2.3" stroke-linecap="round"/><circle cx="12" cy="17" r="1.35" fill="#fff"/></svg>'
  );
}
