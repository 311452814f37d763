import Link from 'next/link';
import QRCode from 'qrcode';
import { requirePage, orNotFound, pageId } from '@/lib/page-guard';
import { can } from '@/lib/permissions';
import { getTasting } from '@/lib/tastings/queries';
import { listMembers } from '@/lib/members/queries';
import { env } from '@/lib/env';
import { isLoopbackUrl, joinLink } from '@/lib/tastings/join-link';
import { TastingControl } from '@/components/tastings/TastingControl';
import { PageHeader } from '@/components/ui/Card';
import { formatDateTime } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Tasting' };

export default async function TastingPage({ params }: { params: Promise<{ tastingId: string }> }) {
  const actor = await requirePage('tastings.read');
  const session = await orNotFound(getTasting(actor, pageId((await params).tastingId)));
  const joinUrl = session.joinCode ? joinLink(env().APP_URL, session.joinCode) : null;
  const qrDataUrl = joinUrl ? await QRCode.toDataURL(joinUrl, { margin: 1, width: 360, color: { dark: '#2f1729', light: '#ffffff' } }) : null;
  const members = (await listMembers(actor)).members.filter((m) => m.active).map((m) => ({ userId: m.userId, name: m.name, role: m.role }));
  return (
    <>
      <p className="text-sm text-rind-500"><Link href={`/trials/${session.trialId}`} className="underline-offset-2 hover:underline">Back to the trial</Link></p>
      <PageHeader title={session.title} lead={[session.place, session.startsAt ? formatDateTime(session.startsAt) : null].filter(Boolean).join(' · ') || undefined} />
      <TastingControl initial={session} qrDataUrl={qrDataUrl} joinUrl={joinUrl} members={members} canRun={can(actor.role, 'tastings.run')} joinUrlLocalOnly={isLoopbackUrl(env().APP_URL)} />
    </>
  );
}
