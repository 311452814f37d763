import { requirePage } from '@/lib/page-guard';
import { PageHeader } from '@/components/ui/Card';
import { WorkList, type WorkItem } from '@/components/home/WorkList';
import { ROLE_LABELS, can, isStaff } from '@/lib/permissions';
import { batchWorklist, listProducts, reviewQueue } from '@/lib/production/queries';
import { type BatchWorkItem } from '@/lib/production/schema';
import { trialsAtTheStove } from '@/lib/trials/queries';
import { listMySeats, listTastings } from '@/lib/tastings/queries';
import { listMembers } from '@/lib/members/queries';
import { TASTING_STATE_LABELS } from '@/lib/tastings/vocabulary';
import { formatDate, todayIso, formatDateTime } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';

const TODAY_DETAIL: Record<BatchWorkItem['status'], string> = {
  passed: 'Passed its checks.', held: 'On hold: a check failed or was not measured.', discarded: 'Discarded.', released: 'Released after re-test.', rejected: 'Rejected.',
};
export const metadata = { title: 'Overview' };


/** The home page is a worklist: each part shows only to those whose permissions let them do the work it links to. */
export default async function HomePage() {
  const actor = await requirePage('account.self');
  const today = todayIso();
  const [stove, tastings, reviews, batches, kitchen, seats, members] = await Promise.all([
    can(actor.role, 'trials.write') ? trialsAtTheStove(actor) : null,
    can(actor.role, 'tastings.run') ? listTastings(actor) : null,
    can(actor.role, 'promotion.decide') ? reviewQueue(actor) : null,
    can(actor.role, 'batches.record') ? batchWorklist(actor, today) : null,
    can(actor.role, 'batches.record') ? listProducts(actor) : null,
    listMySeats(actor),
    can(actor.role, 'members.manage') ? listMembers(actor) : null,
  ]);
  const waitingSeats = seats.filter((s) => s.waiting);
  const sections: React.ReactNode[] = [];

  if (stove) {
    sections.push(
      <WorkList key="stove" title="At the stove" more={{ href: '/trials?status=cooking', label: 'All trials being cooked' }}
        empty="None of your trials is at the stove. Move a planned trial to “Cooking” when its variants are ready to cook."
        items={stove.map((t) => ({
          key: t.id, href: `/trials/${t.id}`, label: `${t.code}: ${t.title}`,
          detail: t.uncooked.length ? `Not cooked yet: variant${t.uncooked.length > 1 ? 's' : ''} ${t.uncooked.join(', ')}` : 'Every variant has a cook: ready to taste.',
        }))} />,
    );
  }
  if (tastings) {
    const live = tastings.filter((t) => t.state !== 'closed');
    sections.push(
      <WorkList key="tastings" title="Tastings being set up or taking answers" more={{ href: '/tastings', label: 'All tastings' }}
        empty="No tasting is being set up or taking answers. Start one from a trial once its variants are cooked."
        items={live.map((t) => ({
          key: t.id, href: `/tastings/${t.id}`, label: `${t.title} (${t.trial.code})`,
          detail: t.state === 'open' ? `${TASTING_STATE_LABELS.open}: ${t.submitted} of ${t.seats} tasters finished` : `${TASTING_STATE_LABELS.draft}${t.startsAt ? `, planned for ${formatDate(t.startsAt)}` : ''}`,
        }))} />,
    );
  }
  if (reviews) {
    const waiting = reviews.filter((r) => !r.ownRequest);
    sections.push(
      <WorkList key="reviews" title="Promotions waiting for your decision" more={{ href: '/production/reviews', label: 'All reviews' }}
        empty="No promotion request is waiting for you."
        items={waiting.map((r) => ({ key: r.id, href: `/production/reviews/${r.id}`, label: `${r.code}: ${r.trial.code} variant ${r.variantLabel}`, detail: `To ${r.productLabel}` }))} />,
    );
  }
  if (batches && kitchen) {
    const held: WorkItem[] = batches.held.map((b) => ({ key: b.id, href: `/production/batches/${b.id}`, label: `${b.lotCode}: ${b.productName}`, detail: `On hold since ${formatDate(b.batchDate)}: decide what happens to it.` }));
    const todays: WorkItem[] = batches.today.map((b) => ({ key: b.id, href: `/production/batches/${b.id}`, label: `${b.lotCode}: ${b.productName}`, detail: TODAY_DETAIL[b.status] }));
    const sheets: WorkItem[] = kitchen.filter((p) => p.current).map((p) => ({
      key: p.id, href: `/production/versions/${p.current!.id}/batches/new`, label: `Record a batch of ${p.name}`, detail: `Version ${p.current!.version}`,
    }));
    sections.push(
      <WorkList key="held" title="Batches on hold" empty="No batch is on hold." items={held} />,
      <WorkList key="today" title="Today’s batches" empty="No batch recorded today yet." items={todays} actions={sheets} more={{ href: '/production', label: 'Products and batch sheets' }} />,
    );
  }
  if (members) {
    sections.push(
      <WorkList key="invitations" title="Invitations not yet accepted" more={{ href: '/settings/members', label: 'Members' }}
        empty="Every invitation has been accepted."
        items={members.invitations.map((i) => ({ key: i.invitationId, href: '/settings/members', label: i.email, detail: `${ROLE_LABELS[i.role]}, invited by ${i.invitedBy}; the link works until ${formatDate(i.expiresAt)}` }))} />,
    );
  }
  // Everyone can be seated at a tasting; staff see the part only when a seat waits for them.
  if (waitingSeats.length || !isStaff(actor.role)) {
    sections.push(
      <WorkList key="seats" title="Tastings waiting for your answers" more={{ href: '/tastings/mine', label: 'My tastings' }}
        empty="No tasting is waiting for you. When an organiser seats you, it appears here and you get an e-mail with your link."
        items={waitingSeats.map((s) => ({ key: s.tastingId, href: '/tastings/mine', label: s.title, detail: [s.place, s.startsAt ? formatDateTime(s.startsAt) : null].filter(Boolean).join(' · ') || undefined }))} />,
    );
  }

  return (
    <>
      <PageHeader title={`Good to see you, ${actor.name.split(' ')[0]}`} />
      <p className="mb-6 text-sm text-rind-600">
        You are working in <strong>{actor.workspaceName}</strong> as {ROLE_LABELS[actor.role]}.
      </p>
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-2">{sections}</div>
    </>
  );
}
