/**
 * The notebook end to end against real PostgreSQL: saving with versions, keeping a parallel
 * save as a conflict instead of overwriting, resolving it, refusing unsafe documents, and
 * workspace isolation.
 */
import { beforeAll, describe, expect, it } from 'vitest';
// The harness first: it mocks next/headers and next/cache before the actions load them.
import { actorOf, asCaller, callRoute, createWorkspace, type WorkspaceFixture } from './harness';
import { getEm } from '@/lib/db';
import { NotebookConflict, NotebookEntry, Variant } from '@/entities';
import { GET, PUT } from '@/app/api/v1/trials/[trialId]/notebook/route';
import { resolveNotebookConflictAction, saveNotebookAction } from '@/lib/notebook/actions';
import { saveEntry } from '@/lib/notebook/mutations';
import type { TiptapDoc, TiptapNode } from '@/lib/notebook/shape';
import { createFixtureTrial, strawberryJamInput } from './fixtures';

let a: WorkspaceFixture;
let b: WorkspaceFixture;

beforeAll(async () => {
  a = await createWorkspace('Notebook A');
  b = await createWorkspace('Notebook B');
});

const para = (text: string): TiptapNode => ({ type: 'paragraph', content: [{ type: 'text', text }] });
const doc = (...content: TiptapNode[]): TiptapDoc & { content: TiptapNode[] } => ({ type: 'doc', content });
const UPLOAD_SRC = '/api/v1/uploads/5d1c2b3a-4e5f-4a6b-9c7d-8e9f0a1b2c3d';

function put(trialId: string, person: WorkspaceFixture['people'][keyof WorkspaceFixture['people']], body: unknown) {
  return callRoute(PUT, { method: 'PUT', path: `/api/v1/trials/${trialId}/notebook`, caller: { kind: 'session', person }, params: { trialId }, body });
}
function get(trialId: string, person: WorkspaceFixture['people'][keyof WorkspaceFixture['people']], variantId?: string) {
  const query = variantId ? `?variantId=${variantId}` : '';
  return callRoute(GET, { method: 'GET', path: `/api/v1/trials/${trialId}/notebook${query}`, caller: { kind: 'session', person }, params: { trialId } });
}

async function rows(trialId: string) {
  const em = await getEm();
  const entries = await em.find(NotebookEntry, { trial: trialId });
  const conflicts = entries.length ? await em.find(NotebookConflict, { entry: { $in: entries.map((e) => e.id) } }, { orderBy: { createdAt: 'asc' } }) : [];
  return { entries, conflicts };
}

async function addVariant(fx: WorkspaceFixture, trialId: string, label: string): Promise<string> {
  const em = await getEm();
  const input = await strawberryJamInput(fx);
  const v = em.create(Variant, {
    workspace: fx.workspaceId,
    trial: trialId,
    label,
    isBase: label === 'A',
    description: `Variant ${label}`,
    factorLevels: [],
    settings: input.settings,
    lines: [],
    summary: { complianceOverall: 'pass', dangerCount: 0, warningCount: 0, finishedMassG: 0 },
    position: label.charCodeAt(0) - 65,
    createdBy: fx.people.developer.userId,
  } as never) as unknown as { id: string };
  await em.flush();
  return v.id;
}

describe('saving and keeping parallel edits', () => {
  it('saves at version 1, keeps a stale save beside the entry (409), and "Keep both" merges it', async () => {
    const { trialId } = await createFixtureTrial(a);
    const first = doc(para('Cooked to 104 °C; set in 2 minutes.'));
    const parallel = doc(para('Foam skimmed twice; colour darker than A.'));

    const empty = await get(trialId, a.people.head_of_product);
    expect(empty.status).toBe(200);
    expect(empty.body.entry).toMatchObject({ entryId: null, version: 0, conflicts: [] });

    const saved = await put(trialId, a.people.developer, { variantId: null, baseVersion: 0, doc: first });
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    expect(saved.body).toMatchObject({ status: 'saved', version: 1 });

    // Another person saves from version 0 too: kept, not written over.
    // Source: RFC 9110 §15.5.10 (409 Conflict — the request conflicts with the current state of the resource).
    const stale = await put(trialId, a.people.admin, { variantId: null, baseVersion: 0, doc: parallel });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('conflict');
    expect(stale.body.error.conflict.version).toBe(1);
    expect(stale.body.error.conflict.current.doc).toEqual(first);
    expect(stale.body.error.conflict.current.updatedByName).toMatch(/^developer /);
    const conflictId = stale.body.error.conflict.conflictId as string;

    const afterConflict = await rows(trialId);
    expect(afterConflict.entries).toHaveLength(1);
    expect(afterConflict.entries[0].version).toBe(1);
    expect(afterConflict.entries[0].doc).toEqual(first);
    expect(afterConflict.conflicts).toHaveLength(1);
    expect(afterConflict.conflicts[0]).toMatchObject({ id: conflictId, doc: parallel, baseVersion: 0, resolvedAt: null });
    expect((afterConflict.conflicts[0].savedBy as unknown as { id: string }).id).toBe(a.people.admin.userId);

    const listed = await get(trialId, a.people.developer);
    expect(listed.body.entry.version).toBe(1);
    expect(listed.body.entry.conflicts).toHaveLength(1);
    expect(listed.body.entry.conflicts[0]).toMatchObject({ conflictId, doc: parallel, baseVersion: 0 });
    expect(listed.body.entry.conflicts[0].savedByName).toMatch(/^admin /);

    const resolved = await asCaller({ kind: 'session', person: a.people.developer }, () => resolveNotebookConflictAction({ conflictId, keep: 'both' }));
    expect(resolved.ok, JSON.stringify(resolved)).toBe(true);
    if (!resolved.ok) return;
    expect(resolved.data.version).toBe(2);
    expect(resolved.data.entry.conflicts).toEqual([]);

    const merged = await rows(trialId);
    const content = (merged.entries[0].doc as { content: Array<{ type: string; content?: Array<{ text: string }> }> }).content;
    expect(merged.entries[0].version).toBe(2);
    expect(content[0]).toEqual(first.content[0]);
    expect(content[1].type).toBe('heading');
    expect(content[1].content?.[0].text).toMatch(/^Kept from a parallel edit by admin .+ at \d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} UTC$/);
    expect(content[2]).toEqual(parallel.content[0]);
    // Resolved, not deleted: the kept version stays on record.
    expect(merged.conflicts).toHaveLength(1);
    expect(merged.conflicts[0].resolvedAt).toBeInstanceOf(Date);

    const again = await asCaller({ kind: 'session', person: a.people.developer }, () => resolveNotebookConflictAction({ conflictId, keep: 'mine' }));
    expect(again).toMatchObject({ ok: false, status: 409 });
  });

  it("'mine' makes the kept version current; 'theirs' leaves the entry as it was", async () => {
    const { trialId } = await createFixtureTrial(a);
    const dev = actorOf(a, 'developer');
    const admin = actorOf(a, 'admin');
    const theirs = doc(para('pH 3.2 at filling.'));
    const mine = doc(para('pH 3.3 at filling, second reading.'));
    await saveEntry(dev, { trialId, variantId: null, baseVersion: 0, doc: theirs });

    const k1 = await saveEntry(admin, { trialId, variantId: null, baseVersion: 0, doc: mine });
    expect(k1.status).toBe('conflict');
    if (k1.status !== 'conflict') return;
    const kept = await asCaller({ kind: 'session', person: a.people.admin }, () => resolveNotebookConflictAction({ conflictId: k1.conflictId, keep: 'theirs' }));
    expect(kept).toMatchObject({ ok: true, data: { version: 1, keep: 'theirs' } });
    expect((await rows(trialId)).entries[0].doc).toEqual(theirs);

    const k2 = await saveEntry(admin, { trialId, variantId: null, baseVersion: 0, doc: mine });
    if (k2.status !== 'conflict') throw new Error('expected a conflict');
    const mineKept = await asCaller({ kind: 'session', person: a.people.admin }, () => resolveNotebookConflictAction({ conflictId: k2.conflictId, keep: 'mine' }));
    expect(mineKept).toMatchObject({ ok: true, data: { version: 2, keep: 'mine' } });
    const after = await rows(trialId);
    expect(after.entries[0].doc).toEqual(mine);
    expect(after.conflicts.every((c) => c.resolvedAt instanceof Date)).toBe(true);
  });

  it('two first saves racing each other create one entry: one is saved, the other kept as a conflict', async () => {
    const { trialId } = await createFixtureTrial(a);
    const results = await Promise.all([
      saveEntry(actorOf(a, 'developer'), { trialId, variantId: null, baseVersion: 0, doc: doc(para('Race one')) }),
      saveEntry(actorOf(a, 'admin'), { trialId, variantId: null, baseVersion: 0, doc: doc(para('Race two')) }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual(['conflict', 'saved']);
    const { entries, conflicts } = await rows(trialId);
    expect(entries).toHaveLength(1);
    expect(conflicts).toHaveLength(1);
  });

  it("keeps a variant's entry apart from the trial's own", async () => {
    const { trialId } = await createFixtureTrial(a);
    const variantId = await addVariant(a, trialId, 'B');
    expect((await put(trialId, a.people.developer, { variantId: null, baseVersion: 0, doc: doc(para('Trial plan')) })).status).toBe(200);
    const v = await put(trialId, a.people.developer, { variantId, baseVersion: 0, doc: doc(para('Variant B: 10 % less sugar')) });
    expect(v.status, JSON.stringify(v.body)).toBe(200);
    expect(v.body.version).toBe(1);
    const read = await get(trialId, a.people.developer, variantId);
    expect(read.body.entry.doc).toEqual(doc(para('Variant B: 10 % less sugar')));
    expect((await get(trialId, a.people.developer)).body.entry.doc).toEqual(doc(para('Trial plan')));

    const otherTrial = await createFixtureTrial(a);
    expect((await put(otherTrial.trialId, a.people.developer, { variantId, baseVersion: 0, doc: doc(para('x')) })).status).toBe(404);
  });
});

describe('refusing unsafe documents', () => {
  // Source: OWASP Cross Site Scripting Prevention Cheat Sheet — javascript: and data: URLs in href/src execute script.
  it.each([
    ['a javascript: link', doc({ type: 'paragraph', content: [{ type: 'text', text: 'click', marks: [{ type: 'link', attrs: { href: 'javascript:alert(1)' } }] }] }), 'doc.content.0.content.0.marks.0.attrs.href'],
    ['an image from another host', doc(para('photo'), { type: 'image', attrs: { src: 'https://images.example.net/jar.png', alt: 'jar' } }), 'doc.content.1.attrs.src'],
    ['a data: image', doc({ type: 'image', attrs: { src: 'data:image/svg+xml,<svg onload=alert(1)>', alt: 'x' } }), 'doc.content.0.attrs.src'],
  ])('refuses %s with 422 naming the path, and writes nothing', async (_what, badDoc, path) => {
    const { trialId } = await createFixtureTrial(a);
    // Source: RFC 9110 §15.5.21 (422 Unprocessable Content).
    const res = await put(trialId, a.people.developer, { variantId: null, baseVersion: 0, doc: badDoc });
    expect(res.status).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain(path);
    const viaAction = await asCaller({ kind: 'session', person: a.people.developer }, () => saveNotebookAction({ trialId, variantId: null, baseVersion: 0, doc: badDoc }));
    expect(viaAction).toMatchObject({ ok: false, status: 422 });
    expect((await rows(trialId)).entries).toHaveLength(0);
  });

  it('accepts an image from the app’s own uploads', async () => {
    const { trialId } = await createFixtureTrial(a);
    const res = await put(trialId, a.people.developer, { variantId: null, baseVersion: 0, doc: doc({ type: 'image', attrs: { src: UPLOAD_SRC, alt: 'jar-b.jpg' } }) });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  });
});

describe('workspace isolation', () => {
  it("answers 404 to another workspace for the entry, saves and a kept conflict", async () => {
    const { trialId } = await createFixtureTrial(a);
    await saveEntry(actorOf(a, 'developer'), { trialId, variantId: null, baseVersion: 0, doc: doc(para('Private note')) });
    const kept = await saveEntry(actorOf(a, 'admin'), { trialId, variantId: null, baseVersion: 0, doc: doc(para('Private parallel note')) });
    if (kept.status !== 'conflict') throw new Error('expected a conflict');

    const outsider = b.people.admin;
    const read = await get(trialId, outsider);
    expect(read.status).toBe(404);
    expect(JSON.stringify(read.body)).not.toContain('Private');
    expect((await put(trialId, outsider, { variantId: null, baseVersion: 1, doc: doc(para('overwrite')) })).status).toBe(404);
    // 404 comes before validation, so an invalid body reveals nothing either.
    expect((await put(trialId, outsider, { variantId: null, baseVersion: 1, doc: { type: 'nope' } })).status).toBe(404);
    const viaAction = await asCaller({ kind: 'session', person: outsider }, () => saveNotebookAction({ trialId, variantId: null, baseVersion: 1, doc: doc(para('overwrite')) }));
    expect(viaAction).toMatchObject({ ok: false, status: 404 });
    const resolve = await asCaller({ kind: 'session', person: outsider }, () => resolveNotebookConflictAction({ conflictId: kept.conflictId, keep: 'mine' }));
    expect(resolve).toMatchObject({ ok: false, status: 404 });

    const after = await rows(trialId);
    expect(after.entries[0].doc).toEqual(doc(para('Private note')));
    expect(after.conflicts[0].resolvedAt).toBeNull();
  });
});

describe('bounded documents', () => {
  const table = (attrs: Record<string, unknown>) =>
    doc({ type: 'table', content: [{ type: 'tableRow', content: [{ type: 'tableCell', attrs: { colspan: 1, rowspan: 1, colwidth: null, ...attrs }, content: [para('Brix')] }] }] });

  it.each([
    ['a colspan of a billion', { variantId: null, baseVersion: 0, doc: table({ colspan: 1_000_000_000 }) }, 'doc.content.0.content.0.content.0.attrs.colspan'],
    ['a rowspan past the table limit', { variantId: null, baseVersion: 0, doc: table({ rowspan: 201 }) }, 'doc.content.0.content.0.content.0.attrs.rowspan'],
    ['a list starting past the limit', { variantId: null, baseVersion: 0, doc: doc({ type: 'orderedList', attrs: { start: 2 ** 31, type: null }, content: [{ type: 'listItem', content: [para('x')] }] }) }, 'doc.content.0.attrs.start'],
    // Source: PostgreSQL documentation, Numeric Types — integer ranges up to +2147483647.
    ['a base version of 2^31', { variantId: null, baseVersion: 2 ** 31, doc: doc(para('x')) }, 'baseVersion'],
    ['a base version past 2^53', { variantId: null, baseVersion: 2 ** 53 + 2, doc: doc(para('x')) }, 'baseVersion'],
  ])('refuses %s with 422 through the API and the action, and stores nothing', async (_what, body, path) => {
    const { trialId } = await createFixtureTrial(a);
    const res = await put(trialId, a.people.developer, body);
    expect(res.status, JSON.stringify(res.body)).toBe(422);
    expect(Object.keys(res.body.error.fields)).toContain(path);
    const viaAction = await asCaller({ kind: 'session', person: a.people.developer }, () => saveNotebookAction({ trialId, ...body }));
    expect(viaAction).toMatchObject({ ok: false, status: 422 });
    expect((await rows(trialId)).entries).toHaveLength(0);
  });

  it.each(['__proto__', 'constructor', 'valueOf', 'hasOwnProperty'])('refuses "%s" as an attribute, a node or a mark with 422, never 500, and stores nothing', async (name) => {
    const { trialId } = await createFixtureTrial(a);
    const bodies = [
      `{"variantId":null,"baseVersion":0,"doc":{"type":"doc","content":[{"type":"heading","attrs":{"level":2,"${name}":{"level":9}},"content":[{"type":"text","text":"x"}]}]}}`,
      `{"variantId":null,"baseVersion":0,"doc":{"type":"doc","content":[{"type":"${name}"}]}}`,
      `{"variantId":null,"baseVersion":0,"doc":{"type":"doc","content":[{"type":"paragraph","content":[{"type":"text","text":"x","marks":[{"type":"link","attrs":{"href":"/x","${name}":1}},{"type":"${name}"}]}]}]}}`,
      `{"variantId":null,"baseVersion":0,"${name}":{"baseVersion":1},"doc":{"type":"doc"}}`,
    ];
    for (const text of bodies) {
      const res = await callRoute(PUT, { method: 'PUT', path: `/api/v1/trials/${trialId}/notebook`, caller: { kind: 'session', person: a.people.developer }, params: { trialId }, raw: { text, contentType: 'application/json' } });
      expect(res.status, `${text} → ${JSON.stringify(res.body)}`).toBe(422);
      const viaAction = await asCaller({ kind: 'session', person: a.people.developer }, () => saveNotebookAction({ trialId, ...JSON.parse(text) }));
      expect(viaAction, text).toMatchObject({ ok: false, status: 422 });
    }
    expect((await rows(trialId)).entries).toHaveLength(0);
  });

  it('stores links without the rel, target and class sent with them', async () => {
    const { trialId } = await createFixtureTrial(a);
    const linked = doc({ type: 'paragraph', content: [{ type: 'text', text: 'method', marks: [{ type: 'link', attrs: { href: 'https://example.org/m', target: '_self', rel: 'opener', class: 'x', title: 'Method' } }] }] });
    const res = await put(trialId, a.people.developer, { variantId: null, baseVersion: 0, doc: linked });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const stored = (await rows(trialId)).entries[0].doc as unknown as TiptapDoc;
    expect(stored.content![0].content![0].marks).toEqual([{ type: 'link', attrs: { href: 'https://example.org/m', title: 'Method' } }]);
  });

  it('still loads a row stored before the limits, and the next save from it must fit them', async () => {
    const { trialId } = await createFixtureTrial(a);
    expect((await put(trialId, a.people.developer, { variantId: null, baseVersion: 0, doc: doc(para('first')) })).status).toBe(200);
    const em = await getEm();
    // As an old row would be: written before the check bounded colspan.
    await em.getConnection().execute(`update notebook_entries set doc = ?::jsonb where trial_id = ?`, [JSON.stringify(table({ colspan: 1_000_000_000 })), trialId]);
    const loaded = await get(trialId, a.people.developer);
    expect(loaded.status).toBe(200);
    expect(loaded.body.entry.version).toBe(1);
    expect(loaded.body.entry.doc.content[0].content[0].content[0].attrs.colspan).toBe(1_000_000_000);
    expect((await put(trialId, a.people.developer, { variantId: null, baseVersion: 1, doc: table({ colspan: 2 }) })).status).toBe(200);
  });
});
