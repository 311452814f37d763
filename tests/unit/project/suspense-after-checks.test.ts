/**
 * A slow part of a page loads behind `<Suspense fallback={<Skeleton …/>}>` around an async server
 * component (issue 18, part 6), never through a loading.tsx (area-boundaries.test.tsx says why).
 * Streaming begins when the part outside the Suspense boundaries is rendered, so the page's own
 * checks (requirePage, then the record's 404) must come before the first boundary, and a suspended
 * component must decide no 404/403/redirect: one decided after streaming began goes out as HTTP 200.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import ts from 'typescript';
import { describe, expect, it } from 'vitest';

const ROOT = process.cwd();
const APP = path.join(ROOT, 'app');

/** Pages known to stream a slow part; a new one is found by the scan below and checked the same way. */
const STREAMING_PAGES = ['(lab)/tastings/[tastingId]/results/page.tsx', '(lab)/trials/[trialId]/page.tsx'];
/** Calls that decide a status or leave the page: only before the first boundary. */
const STATUS_CALLS = ['requirePage', 'orNotFound', 'notFound', 'forbidden', 'unauthorized', 'redirect', 'permanentRedirect', 'pageId'];

function filesUnder(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const full = path.join(dir, name);
    return statSync(full).isDirectory() ? filesUnder(full) : /\.tsx$/.test(name) ? [full] : [];
  });
}

interface PageReport {
  /** Source positions of the default export's status calls and its first Suspense element. */
  checks: Array<{ call: string; at: number }>;
  firstSuspense: number;
  fallbacks: string[];
  /** Each component rendered inside a boundary, with the status calls its own body makes (null: not declared in the file). */
  suspended: Array<{ name: string; statusCalls: string[] | null }>;
}

function calledName(node: ts.CallExpression): string | null {
  return ts.isIdentifier(node.expression) ? node.expression.text : null;
}

function statusCallsIn(node: ts.Node): Array<{ call: string; at: number }> {
  const found: Array<{ call: string; at: number }> = [];
  const visit = (n: ts.Node) => {
    if (ts.isCallExpression(n)) {
      const name = calledName(n);
      if (name && STATUS_CALLS.includes(name)) found.push({ call: name, at: n.getStart() });
    }
    ts.forEachChild(n, visit);
  };
  visit(node);
  return found;
}

const tagName = (n: ts.JsxElement | ts.JsxSelfClosingElement) => (ts.isJsxElement(n) ? n.openingElement.tagName : n.tagName).getText();

function inspectPage(source: string): PageReport {
  const file = ts.createSourceFile('page.tsx', source, ts.ScriptTarget.Latest, true, ts.ScriptKind.TSX);
  const functions = new Map<string, ts.FunctionDeclaration>();
  let page: ts.FunctionDeclaration | undefined;
  for (const statement of file.statements) {
    if (!ts.isFunctionDeclaration(statement)) continue;
    const modifiers = ts.getModifiers(statement) ?? [];
    if (modifiers.some((m) => m.kind === ts.SyntaxKind.DefaultKeyword)) page = statement;
    else if (statement.name) functions.set(statement.name.text, statement);
  }
  const report: PageReport = { checks: [], firstSuspense: -1, fallbacks: [], suspended: [] };
  if (!page?.body) return report;
  report.checks = statusCallsIn(page.body);
  const visit = (n: ts.Node) => {
    if ((ts.isJsxElement(n) || ts.isJsxSelfClosingElement(n)) && tagName(n) === 'Suspense') {
      if (report.firstSuspense < 0) report.firstSuspense = n.getStart();
      const attributes = ts.isJsxElement(n) ? n.openingElement.attributes : n.attributes;
      for (const attribute of attributes.properties) {
        if (ts.isJsxAttribute(attribute) && attribute.name.getText() === 'fallback') report.fallbacks.push(attribute.initializer?.getText() ?? '');
      }
      if (ts.isJsxElement(n)) {
        const inside = (c: ts.Node) => {
          if ((ts.isJsxElement(c) || ts.isJsxSelfClosingElement(c)) && /^[A-Z]/.test(tagName(c))) {
            const declared = functions.get(tagName(c));
            report.suspended.push({ name: tagName(c), statusCalls: declared?.body ? statusCallsIn(declared.body).map((x) => x.call) : null });
          }
          ts.forEachChild(c, inside);
        };
        n.children.forEach(inside);
      }
    }
    ts.forEachChild(n, visit);
  };
  visit(page.body);
  return report;
}

const pagesWithSuspense = filesUnder(APP)
  .filter((file) => /(^|\/)(page|layout)\.tsx$/.test(file) && /<Suspense\b/.test(readFileSync(file, 'utf8')))
  .map((file) => path.relative(APP, file));

function problemsOf(report: PageReport): string[] {
  const problems: string[] = [];
  if (report.firstSuspense < 0) problems.push('no <Suspense> in the default export');
  if (!report.checks.some((c) => c.call === 'requirePage')) problems.push('no requirePage() in the page');
  for (const c of report.checks) if (c.at > report.firstSuspense) problems.push(`${c.call}() after the first <Suspense>`);
  if (!report.fallbacks.length || !report.fallbacks.every((f) => /<Skeleton\b/.test(f))) problems.push(`a fallback without the shared Skeleton: ${report.fallbacks.join(' | ')}`);
  if (!report.suspended.length) problems.push('nothing suspended');
  for (const s of report.suspended) {
    if (s.statusCalls === null) problems.push(`${s.name} is not declared in the page file, so its checks cannot be read`);
    else if (s.statusCalls.length) problems.push(`${s.name} calls ${s.statusCalls.join(', ')} inside the boundary`);
  }
  return problems;
}

describe('Suspense only after the page’s checks', () => {
  it('finds the pages that stream a slow part', () => {
    expect(pagesWithSuspense).toEqual(expect.arrayContaining(STREAMING_PAGES));
  });

  it.each(pagesWithSuspense)('%s checks permission and record first, and suspends only components that decide no status', (page) => {
    expect(problemsOf(inspectPage(readFileSync(path.join(APP, page), 'utf8')))).toEqual([]);
  });

  it('the check fails a page that suspends before its checks, or suspends a part that decides a 404', () => {
    const good = `
      export default async function Page() {
        const actor = await requirePage('trials.read');
        const trial = await orNotFound(load(actor));
        return <Suspense fallback={<Skeleton what="x" />}><Part trial={trial} /></Suspense>;
      }
      async function Part({ trial }) { const rows = await read(trial); return <List rows={rows} />; }`;
    expect(problemsOf(inspectPage(good))).toEqual([]);

    const checksLate = `
      export default async function Page() {
        const actor = await requirePage('trials.read');
        return <Suspense fallback={<Skeleton what="x" />}><Part actor={actor} id={orNotFound(load())} /></Suspense>;
      }
      async function Part() { return null; }`;
    expect(problemsOf(inspectPage(checksLate))).toEqual(['orNotFound() after the first <Suspense>']);

    const partDecides = `
      export default async function Page() {
        await requirePage('trials.read');
        return <Suspense fallback={<p>Loading</p>}><Part /><Imported /></Suspense>;
      }
      async function Part() { const row = await find(); if (!row) notFound(); return null; }`;
    expect(problemsOf(inspectPage(partDecides))).toEqual([
      'a fallback without the shared Skeleton: {<p>Loading</p>}',
      'Part calls notFound inside the boundary',
      'Imported is not declared in the page file, so its checks cannot be read',
    ]);
  });
});
