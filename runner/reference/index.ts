/** The reference of every public library function (`tristim reference`): extraction, text, HTML, the command. */
export { referenceCommand, type ReferenceOutput } from "./command.ts";
export {
  extractReference,
  topicTitle,
  TOPICS,
  type ReferenceEntry,
  type ReferenceParameter,
  type ReferenceOption,
} from "./extract.ts";
export { renderEntryText, renderIndexText, closeMatches } from "./render-text.ts";
export { renderReferenceHtml } from "./render-html.ts";
