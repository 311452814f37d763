import { apiRoute, json } from '@/lib/api/route';
import { listMyWorkspaces } from '@/lib/workspaces/queries';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('account.self', async ({ actor }) => {
  const workspaces = await listMyWorkspaces(actor.userId);
  return json({
    user: { id: actor.userId, email: actor.email, name: actor.name, massUnits: actor.massUnits, temperatureUnit: actor.temperatureUnit },
    workspace: { id: actor.workspaceId, name: actor.workspaceName, role: actor.role },
    workspaces,
    via: actor.via,
  });
});
