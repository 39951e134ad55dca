/** The text of `tristim --help` (README.md shows the same). */
import { EXIT } from "../shared/exit-codes.ts";
import { DEFAULT_PORT } from "../watch/watch.ts";

/** Help for the whole command. */
export function helpText(version: string): string {
  return `tristim ${version} - run Markdown notebooks with TypeScript cells and write HTML lab reports

Usage:
  tristim run <notebook.md>... [options]   run notebooks, write <notebook>.html beside each
  tristim run <notebook.md> --each <input>=<files> [options]
                                           run one notebook once per data file, one report each
                                           and an index page
  tristim watch <notebook.md> [options]    serve the report on 127.0.0.1, re-run on save
  tristim collate <shard folder>... -o <folder> [--results <file>]
                                           merge the folders of a batch's shards (--shard K/N) into
                                           one folder: every report, one index page, one results file
  tristim restore <report.html> <folder>   write the notebook and data files a report carries into a
                                           new folder and print the command that runs them again
  tristim typecheck <notebook.md>... [--quiet]
                                           type-check the cells as a run links them; prints
                                           notebook.md:line:column: message for each error
  tristim editor-types <folder>            write tristim-globals.d.ts and tsconfig.json into a notebook
                                           folder, so editors and tsc check its helper .ts files
  tristim reference [name]                 the library's functions: signature, arguments with units and
                                           defaults, returns, published source, an example
  tristim reference --html <file>          the whole library reference as one HTML page
  tristim help                             show this text (also --help, -h)
  tristim --version                        print the version

Options for run and watch:
  -o, --output <path>      where to write the report: a file for one notebook, a folder for several
                           (default: beside the notebook, same name, .html)
  --input <name=value>     set a notebook input declared in its front matter; repeat for more inputs;
                           the value is read as the type of the input's default
  --time-limit <time>      time limit of each cell, e.g. 30s, 2m, 500ms (default 30s); a cell can set its
                           own with time-limit=... on its fence line
  --keep-going             after a cell fails, run the remaining cells anyway
  --link-assets            link Plotly from a shared folder tristim-assets/ beside the report instead of
                           embedding it in every report (for folders of many reports)
  --quiet                  print only failures
Options for run:
  --reproducible           leave every wall-clock value (date, durations) out of the report, so that two
                           runs of the same notebook on the same files give identical bytes (diff them)
  --each <input>=<files>   run the notebook once per data file, binding the file's path (relative to the
                           notebook) to the text input <input>. <files> is a folder (every visible file in
                           it), a file, or a pattern: * and ? within a name, ** for any depth of folders,
                           relative to the current folder; quote it, e.g. --each 'data=lots/*.csv'.
                           Reports go to -o <folder> (default <notebook>-reports/ beside the notebook),
                           one per data file named after it, with index.html listing every run.
                           The exit code is the worst over the runs.
  --typecheck              type-check the cells first; do not run a notebook with type errors
  --jobs <n>               how many runs go at the same time, of several notebooks or of --each
                           (default: the number of cores); the output is the same as one at a time
                           (reports, index and messages in order); on a terminal a progress line
                           shows runs done, failures and time left
  --fresh-process          start a new cell process for every run. By default a run whose cells left
                           the process clean hands it on to the next run of a notebook in the same
                           folder, after putting back what the run changed (globals, built-ins,
                           environment, working folder); a run that leaves a server, socket, child
                           process or import() module behind never hands its process on
  --shard <k>/<n>          with --each: run only the k-th of n slices of the data files (in their
                           order), e.g. one per array job; merge the folders with tristim collate
  --results <file>         also write the results as data: <file>.json holds every run's cells,
                           checks (value, limits, outcome, unit), tables, cautions, inputs and
                           data-file SHA-256 (schema: docs/results.md); <file>.csv the checks, one a
                           row; repeat for both
  --pdf                    also print each report to <report>.pdf with headless Chromium (the
                           system's, or CHROMIUM_PATH), after its figures are drawn
Options for watch:
  --port <number>          port on 127.0.0.1 (default ${DEFAULT_PORT}; 0 picks a free one)
  --no-typecheck           do not type-check (by default type errors show in a banner on the page,
                           and the cells run anyway)

Notebook format:
  A Markdown file (.md). Optional YAML front matter between --- lines: title, author, date, and
  inputs (name: default value). Fenced blocks in \`\`\`ts or \`\`\`typescript are cells, run top to
  bottom; other fences are only shown. Words after ts on the fence line set cell options:
    hide-source            leave the code out of the report, show only the output
    show-source            show the code unfolded (it is folded by default)
    no-run                 show the code as a listing, do not run it
    may-fail               a failure of this cell is shown but does not stop the run
    caption="..."          caption for the cell's first figure or table
    time-limit=90s         this cell's time limit
  Example:  \`\`\`ts hide-source caption="Spectral radiance of lamp 2" time-limit=2m

In a cell: show(value), showTable(rows, options), showFigure(spec, caption), showSwatches(list, caption),
showMarkdown(text), showHtml(html, { trusted }), showCaution(text), inputs.<name>, and the standard
library, as globals or with import { ... } from "tristim". A shown value, table or figure with a
caution field (e.g. a sunglass category) gets that caution shown beside it and in the summary.

Acceptance checks (shown in place and summarised at the top; a failed one makes run exit with ${EXIT.checkFailed}):
  check(label, value, { min, max, target, tolerance, unit, digits })
                           passes when every limit given holds: min <= value <= max,
                           |value - target| <= tolerance; NaN, Infinity or a non-number fails
  check(label, value, { ..., uncertainty: U, rule: "simple" | "guarded", guardBand })
                           value ± U (k = 2), also check(label, result.outputs.y, limits): simple
                           acceptance decides on the value, guarded on the limits narrowed by the
                           guard band (default U); a pass or fail whose value ± U reaches across a
                           limit is marked marginal (a marginal fail exits ${EXIT.checkFailed} too)
  checkCondition(label, condition, detail?)
                           passes when condition is true
  Both return true or false.

Exit codes:
  ${EXIT.ok}  every notebook ran and its report was written (typecheck: no type errors)
  ${EXIT.notebookFailed}  a cell failed, or a notebook could not be read or parsed (typecheck: a type error)
  ${EXIT.usage}  wrong command line (unknown option, bad value, unknown input name)
  ${EXIT.checkFailed}  every cell ran, but an acceptance check failed (check / checkCondition)
  With several notebooks the most severe code is returned: ${EXIT.internal}, then ${EXIT.notebookFailed}, then ${EXIT.checkFailed}; a failed cell (${EXIT.notebookFailed})
  wins over a failed check (${EXIT.checkFailed}).
  ${EXIT.internal}  the runner itself failed (report, results or PDF not written, internal error; TRISTIM_DEBUG=1
     shows details)
  collate exits with the worst code of the merged runs, restore with ${EXIT.notebookFailed} when the report lacks a file.
`;
}
