import { requirePage } from '@/lib/page-guard';
import { PageHeader, EmptyState } from '@/components/ui/Card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'My tastings' };

export default async function MyTastingsPage() {
  await requirePage('tastings.own');
  return (
    <>
      <PageHeader title="My tastings" lead="Blind tastings you are seated at. You will only ever see three-digit sample codes." />
      <EmptyState title="No tastings yet">
        When an organiser invites you to a panel, it appears here with a link that opens on your phone.
      </EmptyState>
    </>
  );
}
