/**
 * Reads the reference of every public library function from the source: the functions `lib/index.ts` exports, their
 * signatures (from the TypeScript compiler API) and their doc comments (convention in DEVELOPERS.md, "Doc comments of
 * public functions"). Nothing is written twice: the text a user reads is the comment above the function, and the
 * options' meanings are the comments on the options' interface properties.
 */
import path from "node:path";
import { fileURLToPath } from "node:url";
import type {
  FunctionDeclaration,
  JSDocComment,
  JSDocTag,
  NodeArray,
  ParameterDeclaration,
  TypeChecker,
} from "typescript";
import ts from "../typecheck/typescript.ts";

/** The folder of the tristim package (where lib/ and runner/ are). */
const PACKAGE_ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..", "..");

/** One option of an options argument: a property of its type. */
export interface ReferenceOption {
  readonly name: string;
  readonly type: string;
  readonly optional: boolean;
  /** The option's doc comment (on the interface property, or `@param options.name` on the function). */
  readonly doc: string;
}

/** One argument of a public function. */
export interface ReferenceParameter {
  readonly name: string;
  readonly type: string;
  readonly optional: boolean;
  readonly rest: boolean;
  /** The default written in the signature (`= {}`, `= 1e-6`), when there is one. */
  readonly initializer?: string;
  /** The `@param` text. */
  readonly doc: string;
  /** For an options argument (a parameter named `options` or typed `…Options`): each property with its comment. */
  readonly options: readonly ReferenceOption[];
}

/** The reference of one public function. */
export interface ReferenceEntry {
  readonly name: string;
  /** The lib folder the function lives in (`spectrum`, `colorimetry`, …): the topic it is listed under. */
  readonly topic: string;
  /** Path from the package root, with `/`. */
  readonly file: string;
  readonly line: number;
  /** `name(a: A, b?: B): R` (one line per overload). */
  readonly signatures: readonly string[];
  /** The first paragraph of the doc comment (one sentence by the convention); empty when there is no comment. */
  readonly summary: string;
  /** The further paragraphs of the comment's text (before the tags), separated by blank lines. */
  readonly details: string;
  readonly parameters: readonly ReferenceParameter[];
  readonly returnType: string;
  /** The `@returns` text. */
  readonly returns: string;
  /** The `@source` text: the published source of the formula or data. */
  readonly source: string;
  /** The `@example` lines (each an expression or statements using the library's exports). */
  readonly examples: readonly string[];
  /** True when the function has a doc comment at all. */
  readonly documented: boolean;
}

/** Topic titles for the lib folders, in the order the reference lists them; unknown folders follow, by name. */
export const TOPICS: ReadonlyArray<readonly [string, string]> = [
  ["spectrum", "Spectra"],
  ["observers", "Standard observers"],
  ["illuminants", "Illuminants"],
  ["colorimetry", "Colorimetry"],
  ["temperature", "Colour temperature"],
  ["difference", "Colour differences"],
  ["rgb", "RGB spaces"],
  ["adaptation", "Chromatic adaptation"],
  ["gamut", "Gamut"],
  ["photometry", "Photometry"],
  ["filters", "Filters and plates"],
  ["mixing", "Mixing"],
  ["halftone", "Halftone"],
  ["rendering", "Colour rendering"],
  ["appearance", "HDR colour and appearance"],
  ["video", "Video signals and code values"],
  ["display", "Display measurement"],
  ["vision", "Cones and colour vision"],
  ["camera", "Camera model"],
  ["synthesis", "Demo spectra"],
  ["plot", "Figures and swatches"],
  ["files", "Measurement files"],
  ["uncertainty", "Measurement uncertainty"],
  ["methods", "Methods log"],
];

/** The title of a topic (lib folder). */
export function topicTitle(topic: string): string {
  return TOPICS.find(([t]) => t === topic)?.[1] ?? topic;
}

const FORMAT = ts.TypeFormatFlags.NoTruncation | ts.TypeFormatFlags.UseAliasDefinedOutsideCurrentScope;

/** Extracts the reference of every function exported from `lib/index.ts` (or another entry), sorted by topic and name. */
export function extractReference(
  entry: string = path.join(PACKAGE_ROOT, "lib", "index.ts"),
): ReferenceEntry[] {
  const program = ts.createProgram([entry], {
    target: ts.ScriptTarget.ES2022,
    module: ts.ModuleKind.NodeNext,
    moduleResolution: ts.ModuleResolutionKind.NodeNext,
    allowImportingTsExtensions: true,
    resolveJsonModule: true,
    strict: true,
    noEmit: true,
    skipLibCheck: true,
    types: [],
  });
  const checker = program.getTypeChecker();
  const source = program.getSourceFile(entry);
  if (!source) throw new Error(`reference: cannot read ${entry}`);
  const moduleSymbol = checker.getSymbolAtLocation(source);
  if (!moduleSymbol) throw new Error(`reference: ${entry} is not a module`);
  const root = path.dirname(path.dirname(entry));
  const entries: ReferenceEntry[] = [];
  for (const exported of checker.getExportsOfModule(moduleSymbol)) {
    const symbol = exported.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exported) : exported;
    const declarations = (symbol.declarations ?? []).filter(ts.isFunctionDeclaration);
    if (declarations.length === 0) continue;
    entries.push(entryFor(exported.name, declarations, checker, root));
  }
  return entries.sort(
    (a, b) => topicRank(a.topic) - topicRank(b.topic) || a.topic.localeCompare(b.topic) || compareNames(a, b),
  );
}

function compareNames(a: ReferenceEntry, b: ReferenceEntry): number {
  return a.name.localeCompare(b.name, "en");
}

function topicRank(topic: string): number {
  const i = TOPICS.findIndex(([t]) => t === topic);
  return i < 0 ? TOPICS.length : i;
}

function entryFor(
  name: string,
  overloads: FunctionDeclaration[],
  checker: TypeChecker,
  root: string,
): ReferenceEntry {
  // The documented declaration: the first overload with a comment, else the implementation, else the first.
  const documented = overloads.find((d) => ts.getJSDocCommentsAndTags(d).length > 0);
  const declaration = documented ?? overloads.find((d) => d.body) ?? overloads[0]!;
  const visible = overloads.length > 1 ? overloads.filter((d) => !d.body) : overloads;
  const file = declaration.getSourceFile();
  const relative = path.relative(root, file.fileName).split(path.sep).join("/");
  const docs = readDoc(declaration);
  const paragraphs = docs.text.split(/\n\s*\n/).map(oneParagraph);
  const signature = checker.getSignatureFromDeclaration(declaration);
  const returnType = declaration.type
    ? squash(declaration.type.getText())
    : signature
      ? checker.typeToString(signature.getReturnType(), declaration, FORMAT)
      : "void";
  return {
    name,
    topic: relative.split("/")[1] ?? "lib",
    file: relative,
    line: file.getLineAndCharacterOfPosition(declaration.getStart()).line + 1,
    signatures: visible.map((d) => signatureText(name, d, checker)),
    summary: paragraphs[0] ?? "",
    details: paragraphs.slice(1).join("\n\n"),
    parameters: declaration.parameters.map((p) => parameterFor(p, docs.params, checker)),
    returnType,
    returns: docs.returns,
    source: docs.source,
    examples: docs.examples,
    documented: docs.present,
  };
}

function signatureText(name: string, d: FunctionDeclaration, checker: TypeChecker): string {
  const params = d.parameters.map((p) => {
    const rest = p.dotDotDotToken ? "..." : "";
    const optional = p.questionToken || p.initializer ? "?" : "";
    return `${rest}${p.name.getText()}${optional}: ${typeText(p, checker)}`;
  });
  const signature = checker.getSignatureFromDeclaration(d);
  const result = d.type
    ? d.type.getText()
    : signature
      ? checker.typeToString(signature.getReturnType(), d, FORMAT)
      : "void";
  const generics = d.typeParameters ? `<${d.typeParameters.map((t) => t.getText()).join(", ")}>` : "";
  return `${name}${generics}(${params.join(", ")}): ${squash(result)}`;
}

function typeText(p: ParameterDeclaration, checker: TypeChecker): string {
  if (p.type) return squash(p.type.getText());
  return checker.typeToString(checker.getTypeAtLocation(p), p, FORMAT);
}

/** Collapses the line breaks and indentation of a multi-line type into one line. */
function squash(text: string): string {
  return text.replace(/\s*\n\s*/g, " ").replace(/;\s*}/g, " }");
}

/** An argument is an options argument when it is named `options` or its type's name ends in `Options`. */
function isOptionsParameter(p: ParameterDeclaration): boolean {
  const name = p.name.getText();
  const type = p.type?.getText() ?? "";
  return name === "options" || /Options(<.*>)?$/.test(type);
}

function parameterFor(
  p: ParameterDeclaration,
  params: ReadonlyMap<string, string>,
  checker: TypeChecker,
): ReferenceParameter {
  const name = p.name.getText();
  let options: ReferenceOption[] = [];
  if (isOptionsParameter(p)) {
    const type = checker.getNonNullableType(checker.getTypeAtLocation(p));
    options = checker.getPropertiesOfType(type).map((property) => {
      const declaration = property.valueDeclaration ?? property.declarations?.[0];
      const propertyType = declaration
        ? checker.getTypeOfSymbolAtLocation(property, declaration)
        : checker.getTypeOfSymbol(property);
      const own = ts.displayPartsToString(property.getDocumentationComment(checker)).trim();
      return {
        name: property.name,
        type: squash(checker.typeToString(checker.getNonNullableType(propertyType), declaration, FORMAT)),
        optional: (property.flags & ts.SymbolFlags.Optional) !== 0,
        doc: oneParagraph(params.get(`${name}.${property.name}`) ?? own),
      };
    });
  }
  return {
    name,
    type: typeText(p, checker),
    optional: Boolean(p.questionToken || p.initializer),
    rest: Boolean(p.dotDotDotToken),
    ...(p.initializer ? { initializer: p.initializer.getText() } : {}),
    doc: params.get(name) ?? "",
    options,
  };
}

interface DocParts {
  present: boolean;
  text: string;
  params: Map<string, string>;
  returns: string;
  source: string;
  examples: string[];
}

function commentText(comment: string | NodeArray<JSDocComment> | undefined): string {
  if (comment === undefined) return "";
  if (typeof comment === "string") return comment;
  return comment.map((c) => c.text).join("");
}

function readDoc(d: FunctionDeclaration): DocParts {
  const docs = ts.getJSDocCommentsAndTags(d).filter(ts.isJSDoc);
  const doc = docs[docs.length - 1];
  const parts: DocParts = {
    present: doc !== undefined,
    text: commentText(doc?.comment).trim(),
    params: new Map(),
    returns: "",
    source: "",
    examples: [],
  };
  const source = d.getSourceFile().text;
  for (const tag of doc?.tags ?? []) {
    // A text that starts with "{" (e.g. "{ X, Y, Z } on the Y = 100 scale") is parsed as a JSDoc type: put it back.
    const typed = (ts.isJSDocParameterTag(tag) || ts.isJSDocReturnTag(tag)) && tag.typeExpression;
    const text = typed ? rawTagText(source, tag) : commentText(tag.comment).trim();
    if (ts.isJSDocParameterTag(tag)) {
      parts.params.set(tag.name.getText(), oneParagraph(text.replace(/^-\s*/, "")));
    } else if (ts.isJSDocReturnTag(tag)) {
      parts.returns = oneParagraph(text);
    } else if (tag.tagName.text === "source") {
      parts.source = oneParagraph(text);
    } else if (tag.tagName.text === "example") {
      if (text) parts.examples.push(text);
    }
  }
  return parts;
}

/** A tag's text as written in the source, without "@tag", the parameter name and the comment's line-start stars. */
function rawTagText(source: string, tag: JSDocTag): string {
  const raw = source
    .slice(tag.pos, tag.end)
    .replace(/\n[ \t]*\*(?!\/)[ \t]?/g, "\n")
    .replace(/\*\/\s*$/, "")
    .replace(/^\s*@\w+\s*/, "");
  return (ts.isJSDocParameterTag(tag) ? raw.replace(/^[\w.$]+\s*/, "") : raw).trim();
}

/** Joins a comment's wrapped lines into running text. */
function oneParagraph(text: string): string {
  return text.replace(/\s*\n\s*/g, " ").trim();
}
