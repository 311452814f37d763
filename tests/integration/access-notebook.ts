/** Authorisation-table rows for the notebook feature (merged into access-table.ts). */
import type { Role } from '@/lib/permissions';
import { saveEntry } from '@/lib/notebook/mutations';
import type { TiptapDoc } from '@/lib/notebook/shape';
import type { ActionCase, RouteCase } from './access-table';
import { actorOf, type WorkspaceFixture } from './harness';
import { createFixtureTrial } from './fixtures';

const READ_TRIALS: Role[] = ['admin', 'developer', 'head_of_product'];
const WRITE_TRIALS: Role[] = ['admin', 'developer'];

const matrixDoc = (text: string): TiptapDoc => ({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

/** A conflict kept on a fresh trial of workspace A: two saves from version 0 by different people. */
async function keptConflictId(a: WorkspaceFixture): Promise<string> {
  const { trialId } = await createFixtureTrial(a);
  await saveEntry(actorOf(a, 'developer'), { trialId, variantId: null, baseVersion: 0, doc: matrixDoc('first') });
  const second = await saveEntry(actorOf(a, 'admin'), { trialId, variantId: null, baseVersion: 0, doc: matrixDoc('parallel') });
  if (second.status !== 'conflict') throw new Error('expected a kept conflict');
  return second.conflictId;
}

export const NOTEBOOK_ROUTE_CASES: RouteCase[] = [
  {
    route: 'GET /api/v1/trials/[trialId]/notebook',
    allowed: READ_TRIALS,
    otherWorkspace: 404,
    prepare: async (a) => ({ params: { trialId: (await createFixtureTrial(a)).trialId } }),
  },
  {
    route: 'PUT /api/v1/trials/[trialId]/notebook',
    allowed: WRITE_TRIALS,
    otherWorkspace: 404,
    // A fresh trial per call, so version 0 is always the current one for allowed callers.
    prepare: async (a) => ({ params: { trialId: (await createFixtureTrial(a)).trialId }, body: { variantId: null, baseVersion: 0, doc: matrixDoc('matrix') } }),
  },
];

export const NOTEBOOK_ACTION_CASES: ActionCase[] = [
  {
    action: 'lib/notebook/actions.ts#saveNotebookAction',
    allowed: WRITE_TRIALS,
    otherWorkspace: 404,
    argsAsync: async (a) => [{ trialId: (await createFixtureTrial(a)).trialId, variantId: null, baseVersion: 0, doc: matrixDoc('matrix') }],
  },
  {
    action: 'lib/notebook/actions.ts#resolveNotebookConflictAction',
    allowed: WRITE_TRIALS,
    otherWorkspace: 404,
    argsAsync: async (a) => [{ conflictId: await keptConflictId(a), keep: 'theirs' }],
  },
];
