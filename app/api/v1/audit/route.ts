import { apiRoute, json } from '@/lib/api/route';
import { listAuditEvents } from '@/lib/production/queries';

export const dynamic = 'force-dynamic';

/** The workspace's audit trail, newest first (read-only: there is no write operation). */
export const GET = apiRoute('audit.read', async ({ actor }) => json({ events: await listAuditEvents(actor) }));
