/**
 * Issue 14: a link to a record of another of the user's workspaces offers the switch on the
 * not-found and forbidden pages; anyone who is not a member of the record's workspace gets the
 * plain pages, with no trace of the other workspace.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { asCaller, createWorkspace, type WorkspaceFixture } from './harness';
import { createFixtureTrial } from './fixtures';
import { getEm } from '@/lib/db';
import { Membership } from '@/entities';
import { WORKSPACE_COOKIE } from '@/lib/auth';
import { findRecordHome, recordInPath } from '@/lib/workspaces/record-home';
import { REQUEST_PATH_HEADER } from '@/lib/workspaces/record-path';
import NotFound from '@/app/not-found';
import Forbidden from '@/app/forbidden';

let active: WorkspaceFixture;
let home: WorkspaceFixture;
let trialId: string;
let formulaId: string;

async function join(fx: WorkspaceFixture, userId: string, role: 'developer' | 'taster') {
  const em = await getEm();
  em.create(Membership, { workspace: fx.workspaceId, user: userId, role } as never);
  await em.flush();
}

/** Renders a page as the person would get it, with their active workspace and the path proxy.ts passes on. */
async function render(page: () => Promise<React.ReactElement>, person: { sessionCookie: string }, activeWorkspaceId: string, path: string) {
  return asCaller({ kind: 'session', person: { ...active.people.developer, ...person } }, async () => renderToStaticMarkup(await page()), {
    cookie: `${person.sessionCookie}; ${WORKSPACE_COOKIE}=${activeWorkspaceId}`,
    [REQUEST_PATH_HEADER]: path,
  });
}

beforeAll(async () => {
  active = await createWorkspace('Active kitchen');
  home = await createWorkspace('Record home');
  ({ trialId, formulaId } = await createFixtureTrial(home));
  // The active workspace's developer is a developer in the record's home too; its taster only a taster there.
  await join(home, active.people.developer.userId, 'developer');
  await join(home, active.people.taster.userId, 'taster');
});

describe('record home', () => {
  it('reads only our own record paths with a UUID', () => {
    expect(recordInPath(`/trials/${trialId}/compare`)?.route.kind).toBe('trial');
    expect(recordInPath(`/production/versions/${trialId}/sheet`)?.route.kind).toBe('production version');
    expect(recordInPath('/trials/not-a-uuid')).toBeNull();
    expect(recordInPath(`//evil.example/trials/${trialId}`)).toBeNull();
    expect(recordInPath(`/trials/${trialId}?x=1`)).toBeNull();
    expect(recordInPath('/home')).toBeNull();
  });

  it('a member of both workspaces is offered the switch on the not-found page, back to the same page', async () => {
    const path = `/trials/${trialId}/compare`;
    const found = await findRecordHome({ userId: active.people.developer.userId, workspaceId: active.workspaceId }, path);
    expect(found).toMatchObject({ kind: 'trial', workspaceId: home.workspaceId, workspaceName: home.name, canOpen: true, returnPath: path });
    const html = await render(NotFound, active.people.developer, active.workspaceId, path);
    expect(html).toContain(`This trial is in ${home.name}`);
    expect(html).toContain(`Switch to ${home.name} to open it.`);
    expect(html).toContain(`>Switch to ${home.name}</button>`);
    expect(html).not.toContain('Nothing here');
  });

  it('a formula link works the same way', async () => {
    const html = await render(NotFound, active.people.developer, active.workspaceId, `/formulas/${formulaId}`);
    expect(html).toContain(`This formula is in ${home.name}`);
  });

  it('the forbidden page offers the switch too when the active role cannot open that kind of record', async () => {
    // The developer acting in a workspace where they are the taster: trials are not open to that role.
    const tasterThere = await createWorkspace('Tasting only');
    await join(tasterThere, active.people.developer.userId, 'taster');
    const html = await render(Forbidden, active.people.developer, tasterThere.workspaceId, `/trials/${trialId}`);
    expect(html).toContain(`Switch to ${home.name} to open it.`);
  });

  it('no switch is offered where the role held there cannot open the record: it says so', async () => {
    const html = await render(NotFound, active.people.taster, active.workspaceId, `/trials/${trialId}`);
    expect(html).toContain(`This trial is in ${home.name}`);
    expect(html).toContain('Your role there (Taster) does not open trials.');
    expect(html).not.toContain('</button>');
  });

  it('a non-member gets the plain 404 and 403 with no trace of the other workspace', async () => {
    const path = `/trials/${trialId}`;
    const outsider = active.people.head_of_product;
    expect(await findRecordHome({ userId: outsider.userId, workspaceId: active.workspaceId }, path)).toBeNull();
    const plain = await render(NotFound, outsider, active.workspaceId, '/trials/00000000-0000-4000-8000-000000000000');
    const html = await render(NotFound, outsider, active.workspaceId, path);
    expect(html).toBe(plain);
    expect(html).toContain('Nothing here');
    expect(html).not.toContain(home.name);
    expect(html).not.toContain('Record home');
    const forbidden = await render(Forbidden, outsider, active.workspaceId, path);
    expect(forbidden).toContain('not open to your role');
    expect(forbidden).not.toContain('Record home');
  });

  it('a member who was deactivated in the record\'s workspace gets the plain 404', async () => {
    const leaver = active.people.production;
    await join(home, leaver.userId, 'developer');
    const path = `/trials/${trialId}`;
    expect(await findRecordHome({ userId: leaver.userId, workspaceId: active.workspaceId }, path)).not.toBeNull();
    const em = await getEm();
    await em.nativeUpdate(Membership, { workspace: home.workspaceId, user: leaver.userId }, { active: false });
    const html = await render(NotFound, leaver, active.workspaceId, path);
    expect(html).toContain('Nothing here');
    expect(html).not.toContain('Record home');
  });

  it('a record of the active workspace itself gets the plain 404 (it is missing for another reason)', async () => {
    const html = await render(NotFound, home.people.developer, home.workspaceId, `/trials/${trialId}/variants/00000000-0000-4000-8000-000000000000`);
    expect(html).toContain('Nothing here');
  });
});
