/**
 * The exported functions of lib/index.ts with their parameters (name, declared type, optional), read with the
 * TypeScript compiler API so that optional parameters with defaults, which Function.length does not count, are known.
 */
import { fileURLToPath } from "node:url";
import ts from "typescript";

export interface PublicParameter {
  readonly name: string;
  readonly type: string;
  readonly optional: boolean;
}
export interface PublicFunction {
  readonly name: string;
  /** Path below lib/, e.g. "filters/optical-density.ts". */
  readonly file: string;
  readonly parameters: readonly PublicParameter[];
}

const LIB = fileURLToPath(new URL("../../../lib/", import.meta.url));

/** Every function (not class) exported by lib/index.ts. */
export function publicFunctions(): PublicFunction[] {
  const entry = `${LIB}index.ts`;
  const program = ts.createProgram([entry], {
    allowImportingTsExtensions: true,
    noEmit: true,
    target: ts.ScriptTarget.ES2022,
    module: ts.ModuleKind.NodeNext,
    moduleResolution: ts.ModuleResolutionKind.NodeNext,
    strict: true,
    skipLibCheck: true,
    types: [],
  });
  const checker = program.getTypeChecker();
  const moduleSymbol = checker.getSymbolAtLocation(program.getSourceFile(entry)!)!;
  const out: PublicFunction[] = [];
  for (const exported of checker.getExportsOfModule(moduleSymbol)) {
    const symbol = exported.flags & ts.SymbolFlags.Alias ? checker.getAliasedSymbol(exported) : exported;
    if (!(symbol.flags & ts.SymbolFlags.Function)) continue;
    const declaration = symbol.declarations![0]!;
    const signature = checker.getTypeOfSymbolAtLocation(symbol, declaration).getCallSignatures()[0]!;
    out.push({
      name: exported.name,
      file: declaration.getSourceFile().fileName.slice(LIB.length),
      parameters: signature.parameters.map((p) => {
        const d = p.valueDeclaration as ts.ParameterDeclaration;
        return {
          name: p.name,
          type: d.type ? d.type.getText() : checker.typeToString(checker.getTypeOfSymbolAtLocation(p, d)),
          optional: Boolean(d.questionToken || d.initializer || d.dotDotDotToken),
        };
      }),
    });
  }
  return out;
}
