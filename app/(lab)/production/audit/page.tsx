import { requirePage } from '@/lib/page-guard';
import { listAuditEvents } from '@/lib/production/queries';
import { PageHeader, Card } from '@/components/ui/Card';
import { AuditTrail } from '@/components/production/AuditTrail';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Audit trail' };

export default async function AuditPage() {
  const actor = await requirePage('audit.read');
  const events = await listAuditEvents(actor);
  return (
    <>
      <PageHeader title="Audit trail" lead="Every promotion step, batch record, price change and change of membership, newest first. The trail is written with each change and no one can edit it." />
      <Card><AuditTrail events={events} showRequest /></Card>
    </>
  );
}
