/** The banner `tristim watch` puts on the served page when the notebook has type errors (the run goes ahead). */
import path from "node:path";
import type { NotebookDocument } from "../parse/notebook.ts";
import { escapeHtml } from "../report/escape.ts";
import { displayPath } from "../text/display-path.ts";
import { createTypecheckSession } from "./typecheck.ts";
import type { TypeDiagnostic } from "./type-diagnostic.ts";

/** A checker for one watch session: document in, banner HTML out ("" without errors); keeps its program. */
export function watchTypecheck(): (document: NotebookDocument) => string {
  const session = createTypecheckSession();
  return (document) => typeErrorBanner(session.check(document), path.dirname(document.path));
}

/** HTML of the banner listing the type errors, every text escaped; "" for none. */
export function typeErrorBanner(found: readonly TypeDiagnostic[], notebookDir: string): string {
  if (found.length === 0) return "";
  const items = found
    .map((d) => {
      const place = `${displayPath(d.location.file, notebookDir, "relative")}:${d.location.line}:${d.location.column}`;
      return `<li><b>${escapeHtml(place)}</b> ${escapeHtml(d.message)}<pre style="margin:.3rem 0;overflow-x:auto">${escapeHtml(d.codeFrame)}</pre></li>`;
    })
    .join("");
  const title = found.length === 1 ? "1 type error" : `${found.length} type errors`;
  return `<div id="tristim-type-errors" role="status" style="position:sticky;top:0;z-index:1000;max-height:40vh;overflow:auto;background:#fff6e0;border-bottom:3px solid #b26b00;color:#1d2127;padding:.6rem 1rem;font:14px/1.4 system-ui,sans-serif"><details open><summary><b>${title}</b> (tristim typecheck; the cells ran anyway)</summary><ul style="margin:.4rem 0;padding-left:1.2rem">${items}</ul></details></div>`;
}
