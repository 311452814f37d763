/**
 * View types (the plain types that cross to components, pages and the API) live in the feature's
 * `schema.ts`, never in `queries.ts` or `mutations.ts` (issue 18, part 1): a component that needs a
 * type must not have to import a server module's file. A type used only inside a queries or
 * mutations file stays unexported there.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = process.cwd();
const LIB = path.join(ROOT, 'lib');
const features = readdirSync(LIB).filter((name) => statSync(path.join(LIB, name)).isDirectory());
const featureFiles = features.flatMap((feature) => ['queries.ts', 'mutations.ts'].map((file) => `lib/${feature}/${file}`)).filter((file) => existsSync(path.join(ROOT, file)));

const isExported = (node: ts.Node) => ts.canHaveModifiers(node) && (ts.getModifiers(node) ?? []).some((m) => m.kind === ts.SyntaxKind.ExportKeyword);

/** The names of the types a module exports: declared with `export`, or re-exported as types. */
function exportedTypes(source: string): string[] {
  const file = ts.createSourceFile('module.ts', source, ts.ScriptTarget.Latest, false, ts.ScriptKind.TS);
  const names: string[] = [];
  for (const node of file.statements) {
    if ((ts.isInterfaceDeclaration(node) || ts.isTypeAliasDeclaration(node) || ts.isEnumDeclaration(node)) && isExported(node)) names.push(node.name.text);
    if (ts.isExportDeclaration(node)) {
      if (node.isTypeOnly) names.push(node.exportClause ? node.exportClause.getText(file) : '*');
      else if (node.exportClause && ts.isNamedExports(node.exportClause)) names.push(...node.exportClause.elements.filter((e) => e.isTypeOnly).map((e) => e.name.text));
    }
  }
  return names;
}

describe('view types live in schema.ts', () => {
  it('finds the feature reads and writes', () => {
    expect(featureFiles.length).toBeGreaterThan(20);
  });

  it('the check sees every way a module exports a type', () => {
    expect(exportedTypes('export interface A { x: number }\nexport type B = string;\nexport enum C { D }')).toEqual(['A', 'B', 'C']);
    expect(exportedTypes("export type { E } from './schema';\nexport { f, type G } from './other';\nexport type * from './all';")).toEqual(['{ E }', 'G', '*']);
    expect(exportedTypes('interface Internal { x: number }\ntype Row = string;\nexport function read(): Row { return "" }')).toEqual([]);
  });

  it.each(featureFiles)('%s exports no type or interface', (file) => {
    expect(exportedTypes(readFileSync(path.join(ROOT, file), 'utf8'))).toEqual([]);
  });
});
