'use server';

import { cookies } from 'next/headers';
import { z } from 'zod';
import { runAction } from '@/lib/actions';
import { WORKSPACE_COOKIE } from '@/lib/auth';
import { notFound } from '@/lib/permissions';
import { listMyWorkspaces } from './queries';

/** Remembers the chosen workspace in a cookie; only a workspace the user belongs to is accepted. */
export async function switchWorkspaceAction(workspaceId: unknown) {
  return runAction('account.self', z.object({ workspaceId: z.uuid('Unknown workspace.') }), { workspaceId }, async (actor, d) => {
    const mine = await listMyWorkspaces(actor.userId);
    if (!mine.some((w) => w.workspaceId === d.workspaceId)) throw notFound('workspace');
    (await cookies()).set(WORKSPACE_COOKIE, d.workspaceId, {
      httpOnly: true,
      sameSite: 'lax',
      secure: process.env.APP_URL?.startsWith('https://') ?? false,
      path: '/',
      maxAge: 60 * 60 * 24 * 365,
    });
    return { workspaceId: d.workspaceId };
  });
}
