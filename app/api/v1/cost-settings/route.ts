import { apiRoute, json } from '@/lib/api/route';
import { costSettings } from '@/lib/pricing/queries';
import { saveCostSettings } from '@/lib/pricing/mutations';
import { costSettingsSchema } from '@/lib/pricing/schema';

export const dynamic = 'force-dynamic';

export const GET = apiRoute('prices.read', async ({ actor }) => json({ settings: await costSettings(actor.workspaceId) }));

export const PUT = apiRoute('costs.settings', async ({ actor, body }) => {
  await saveCostSettings(actor, await body(costSettingsSchema));
  return json({ settings: await costSettings(actor.workspaceId) });
});
