import 'server-only';
import { getEm } from '@/lib/db';
import { Membership } from '@/entities';
import type { WorkspaceChoice } from './schema';

/** The workspaces a user can switch between: their active memberships only. */
export async function listMyWorkspaces(userId: string): Promise<WorkspaceChoice[]> {
  const em = await getEm();
  const rows = await em.find(Membership, { user: userId, active: true }, { populate: ['workspace'], orderBy: { createdAt: 'asc', id: 'asc' } });
  return rows.map((r) => ({ workspaceId: r.workspace.id, name: r.workspace.name, role: r.role }));
}
