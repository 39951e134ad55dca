/**
 * `tristim reference [name]` and `tristim reference --html <file>`: the reference of every public library function,
 * read from the doc comments (extract.ts). Resolves to an exit code: 0 shown or written, 2 a wrong command line or an
 * unknown name (with the close matches), 4 the page could not be written.
 */
import path from "node:path";
import { parseArgs } from "node:util";
import { EXIT } from "../shared/exit-codes.ts";
import { toolVersion } from "../shared/tool-version.ts";
import { writeFileAtomic } from "../shared/write-atomic.ts";
import { extractReference, topicTitle, type ReferenceEntry } from "./extract.ts";
import { renderReferenceHtml } from "./render-html.ts";
import { closeMatches, renderEntryText, renderIndexText } from "./render-text.ts";

/** Where the command writes: the terminal, or a test's buffer. */
export interface ReferenceOutput {
  write(s: string): void;
}

const USAGE =
  "usage: tristim reference [name]        show one function, or the functions of one topic (a lib folder, e.g.\n" +
  "                                        photometry); without a name, every function by topic\n" +
  "       tristim reference --html <file>  write the whole reference as one HTML page\n";

/** Runs `tristim reference` with the arguments after the command word; resolves to the exit code. */
export async function referenceCommand(args: string[], out: ReferenceOutput): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args,
      allowPositionals: true,
      options: { html: { type: "string" }, help: { type: "boolean", short: "h" } },
    });
  } catch (e) {
    out.write(`tristim reference: ${(e as Error).message}\n${USAGE}`);
    return EXIT.usage;
  }
  const { values, positionals } = parsed;
  if (values.help) {
    out.write(USAGE);
    return EXIT.ok;
  }
  if (positionals.length > 1 || (values.html !== undefined && positionals.length > 0)) {
    out.write(`tristim reference: give one function name, or --html <file>, not both or more\n${USAGE}`);
    return EXIT.usage;
  }
  if (values.html !== undefined && values.html.trim() === "") {
    out.write(`tristim reference: --html needs the path of the page to write\n${USAGE}`);
    return EXIT.usage;
  }
  const entries = extractReference();
  if (values.html !== undefined) {
    const file = path.resolve(values.html);
    try {
      writeFileAtomic(file, renderReferenceHtml(entries, toolVersion().version));
    } catch (e) {
      out.write(`tristim reference: could not write ${values.html}: ${(e as Error).message}\n`);
      return EXIT.internal;
    }
    out.write(`wrote the reference of ${entries.length} functions to ${values.html}\n`);
    return EXIT.ok;
  }
  const name = positionals[0];
  if (name === undefined) {
    out.write(renderIndexText(entries));
    return EXIT.ok;
  }
  const entry = findEntry(entries, name);
  if (entry) {
    out.write(renderEntryText(entry));
    return EXIT.ok;
  }
  const topic = entries.filter(
    (e) => e.topic === name.toLowerCase() || topicTitle(e.topic).toLowerCase() === name.toLowerCase(),
  );
  if (topic.length > 0) {
    out.write(renderIndexText(topic));
    return EXIT.ok;
  }
  const close = closeMatches(
    name,
    entries.map((e) => e.name),
  );
  out.write(
    `tristim reference: no public function is named "${name}"` +
      (close.length ? `; close matches: ${close.join(", ")}\n` : "\n") +
      'Run "tristim reference" for the list of every function.\n',
  );
  return EXIT.usage;
}

/** The entry of that exact name, else the only one whose name matches ignoring case. */
function findEntry(entries: readonly ReferenceEntry[], name: string): ReferenceEntry | undefined {
  const exact = entries.find((e) => e.name === name);
  if (exact) return exact;
  const folded = entries.filter((e) => e.name.toLowerCase() === name.toLowerCase());
  return folded.length === 1 ? folded[0] : undefined;
}
