/**
 * A markdown-it plugin for the report's prose: a fence that is one of the notebook's cells renders as that cell
 * (code, outputs) through the environment's `renderCell`; any other fence renders as highlighted code.
 */
import type MarkdownIt from "markdown-it";
import { escapeHtml } from "./escape.ts";
import { highlight } from "./highlight.ts";
import type { CellView } from "./report-model.ts";

/** What the report passes as markdown-it's `env` when it renders the prose. */
export type CellFenceEnv = {
  /** The cells by the 0-based line of their opening fence (markdown-it's `token.map[0]`). */
  readonly cellsByFence?: ReadonlyMap<number, CellView>;
  readonly renderCell?: (view: CellView) => string;
};

/** Installs the fence rule; use as `md.use(cellFences)`. */
export const cellFences = (md: InstanceType<typeof MarkdownIt>): void => {
  md.renderer.rules.fence = (tokens, idx, _options, environment) => {
    const env = environment as CellFenceEnv;
    const token = tokens[idx]!;
    const view = token.map ? env.cellsByFence?.get(token.map[0]) : undefined;
    if (view && env.renderCell) return env.renderCell(view);
    const language = token.info.trim().split(/\s+/)[0] ?? "";
    return `<pre class="code-block"><code class="hljs${language ? ` language-${escapeHtml(language)}` : ""}">${highlight(token.content, language)}</code></pre>\n`;
  };
};
