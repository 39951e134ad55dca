/** What the type check hands back: plain data, one record per error, placed in the notebook (or a helper file). */
import type { Location } from "../../cells/records.ts";

/** One type or syntax error found by `tristim typecheck`. */
export interface TypeDiagnostic {
  /** Notebook line and column (1-based), or the place in a helper file the notebook imports. */
  readonly location: Location;
  /** The compiler's message; continuation lines of a longer explanation are separated by "\n". */
  readonly message: string;
  /** Numbered lines around the place with a caret under the column (runner/text/code-frame.ts). */
  readonly codeFrame: string;
  /** The cell it was found in (0-based), absent for a helper file. */
  readonly cell?: number;
}
