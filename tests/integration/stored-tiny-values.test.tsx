/**
 * Values saved before today's bounds (a jar fill of 1e-320 g): the formula pages, the API and the batch
 * sheet must name the value as needing correction and refuse to scale, never print Infinity jars or
 * crash; the stored row is left as it is. The bound is the save's own (lib/formulas/schema.ts: a jar
 * fill of at least 1 g, as a pack format's net fill); common practice, no published source.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { actorOf, asCaller, callRoute, createWorkspace, type WorkspaceFixture } from './harness';
import { createFixtureFormula } from './fixtures';
import { createApprovedVersion } from './production-fixtures';
import { discoverRoutes, type RouteHandler } from './routes';
import { getEm } from '@/lib/db';
import { getFormula } from '@/lib/formulas/queries';
import { getBatchSheet } from '@/lib/production/queries';
import { batchSheetQuerySchema } from '@/lib/production/schema';
import type { Role } from '@/lib/permissions';
import { computeEditor, initialSettingsDraft } from '@/components/formulas/editor-state';
import FormulaPage from '@/app/(lab)/formulas/[formulaId]/page';
import BatchSheetPage from '@/app/(lab)/production/versions/[versionId]/sheet/page';

const TINY = '1e-320';
let ws: WorkspaceFixture;
let formulaId: string;
let versionId: string;
let routes: Map<string, RouteHandler>;

async function storedFill(table: 'formula_revisions' | 'production_formulas', id: string): Promise<unknown> {
  const conn = (await getEm()).getConnection();
  const key = table === 'formula_revisions' ? 'formula_id' : 'id';
  const rows = (await conn.execute(`select settings->'jarNetFillG' as fill from ${table} where ${key} = ?`, [id])) as Array<{ fill: unknown }>;
  return rows[0]?.fill;
}

async function render(role: Role, page: () => Promise<React.ReactElement>): Promise<string> {
  return asCaller({ kind: 'session', person: ws.people[role] }, async () => renderToStaticMarkup(await page()), { cookie: ws.people[role].sessionCookie });
}

beforeAll(async () => {
  ws = await createWorkspace('Old rows kitchen');
  routes = await discoverRoutes();
  formulaId = await createFixtureFormula(ws);
  ({ versionId } = await createApprovedVersion(ws));
  // As an older release saved them: straight into the rows, the immutability triggers lifted for
  // these statements only, in one transaction.
  const em = (await getEm()).fork();
  await em.transactional(async (tx) => {
    const run = (statement: string, params: unknown[] = []) => tx.getConnection().execute(statement, params, 'run', tx.getTransactionContext());
    await run('alter table formula_revisions disable trigger formula_revisions_no_change');
    await run(`update formula_revisions set settings = jsonb_set(settings, '{jarNetFillG}', '${TINY}'::jsonb) where formula_id = ?`, [formulaId]);
    await run('alter table formula_revisions enable trigger formula_revisions_no_change');
    await run('alter table production_formulas disable trigger production_formulas_no_change');
    await run(`update production_formulas set settings = jsonb_set(settings, '{jarNetFillG}', '${TINY}'::jsonb) where id = ?`, [versionId]);
    await run('alter table production_formulas enable trigger production_formulas_no_change');
  });
});

describe('a formula saved with a jar fill of 1e-320 g', () => {
  it('reads back as needing correction, with no results computed from it', async () => {
    const formula = await getFormula(actorOf(ws, 'developer'), formulaId);
    expect(formula!.current.settings.jarNetFillG).toBe(1e-320);
    expect(formula!.computation).toBeNull();
    expect(formula!.computationError).toBe('Needs correcting before it can be used: Jar fill must be at least 1 g.');
  });

  it('the API answers the formula with the message, not Infinity jars', async () => {
    const res = await callRoute(routes.get('GET /api/v1/formulas/[formulaId]')!, {
      method: 'GET', path: `/api/v1/formulas/${formulaId}`, caller: { kind: 'session', person: ws.people.developer }, params: { formulaId },
    });
    expect(res.status).toBe(200);
    expect(JSON.stringify(res.body)).not.toMatch(/Infinity|e-3\d\d jars|null jars/);
    expect(JSON.stringify(res.body)).toContain('Jar fill must be at least 1 g.');
  });

  it('the formula page for a reviewer shows the fill as needing correction, with no results', async () => {
    const html = await render('head_of_product', () => FormulaPage({ params: Promise.resolve({ formulaId }) }));
    expect(html).toContain('Jar fill must be at least 1 g.');
    expect(html).not.toMatch(/Infinity|NaN/);
  });

  it('the editor a developer gets marks the jar fill field (results and scaling wait for it)', async () => {
    // The editor page itself needs the app router to render; its state is what it draws from.
    const formula = (await getFormula(actorOf(ws, 'developer'), formulaId))!;
    const draft = initialSettingsDraft({ settings: formula.current.settings, system: 'metric', temperatureUnit: 'C' });
    const computed = computeEditor(draft, [], new Map());
    expect(computed.settingsErrors['settings.jarNetFillG']).toEqual(['Jar fill must be at least 1 g.']);
  });

  it('the row is left as it was', async () => {
    expect(await storedFill('formula_revisions', formulaId)).toBe(1e-320);
  });
});

describe('a production version frozen with a jar fill of 1e-320 g', () => {
  it('the batch sheet is refused with a 4xx naming the value, not scaled', async () => {
    await expect(getBatchSheet(actorOf(ws, 'production'), versionId, batchSheetQuerySchema.parse({ target: 'jar_count', amount: '12' }))).rejects.toThrow(/needs correcting.*Jar fill must be at least 1 g\./);
    const res = await callRoute(routes.get('GET /api/v1/production-versions/[versionId]/batch-sheet')!, {
      method: 'GET', path: `/api/v1/production-versions/${versionId}/batch-sheet?target=jar_count&amount=12`, caller: { kind: 'session', person: ws.people.production }, params: { versionId },
    });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/needs correcting, so the sheet is not scaled: Jar fill must be at least 1 g\./);
  });

  it('the batch sheet page says so and shows no sheet', async () => {
    const html = await render('production', () => BatchSheetPage({ params: Promise.resolve({ versionId }), searchParams: Promise.resolve({ target: 'jar_count', amount: '12' }) }));
    expect(html).toContain('needs correcting, so the sheet is not scaled: Jar fill must be at least 1 g.');
    expect(html).not.toMatch(/Infinity|NaN/);
    expect(await storedFill('production_formulas', versionId)).toBe(1e-320);
  });
});
