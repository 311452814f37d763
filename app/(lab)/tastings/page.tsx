import { requirePage } from '@/lib/page-guard';
import { PageHeader, EmptyState } from '@/components/ui/Card';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'My tastings' };

export default async function MyTastingsPage() {
  await requirePage('tastings.own');
  return (
    <>
      <PageHeader title="My tastings" lead="Blind tastings you are seated at. You will only ever see three-digit sample codes." />
      <EmptyState title="Your invitations come by e-mail">
        When an organiser seats you at a tasting, you get an e-mail with a link of your own: open it on your phone when the
        samples arrive. At a public tasting, open <strong>/join</strong> and type the code on the organiser’s screen.
      </EmptyState>
    </>
  );
}
