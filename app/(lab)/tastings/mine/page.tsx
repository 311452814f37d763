import { requirePage } from '@/lib/page-guard';
import { listMySeats } from '@/lib/tastings/queries';
import { TASTING_STATE_LABELS } from '@/lib/tastings/vocabulary';
import { PageHeader, EmptyState } from '@/components/ui/Card';
import { OpenSeatButton } from '@/components/tastings/OpenSeatButton';
import { formatDateTime } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'My tastings' };


export default async function MyTastingsPage() {
  const actor = await requirePage('tastings.own');
  const seats = await listMySeats(actor);
  return (
    <>
      <PageHeader title="My tastings" lead="Blind tastings you are seated at, the ones waiting for your answers first. You only ever see three-digit sample codes." />
      {seats.length === 0 ? (
        <EmptyState title="You are not seated at any tasting">
          When an organiser seats you at a tasting, it appears here and you get an e-mail with a link of your own: open it on your phone when
          the samples arrive. At a public tasting, open <strong>/join</strong> and type the code on the organiser’s screen.
        </EmptyState>
      ) : (
        <ul className="space-y-3" data-testid="my-seats">
          {seats.map((s) => (
            <li key={s.tastingId} className="flex flex-wrap items-center justify-between gap-3 rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
              <div className="min-w-0">
                <p className="font-medium">{s.title}</p>
                <p className="text-sm text-rind-600">
                  {s.waiting ? 'Waiting for your answers' : s.submitted ? 'Your answers are in. Thank you.' : TASTING_STATE_LABELS[s.state]}
                  {s.place ? ` · ${s.place}` : ''}{s.startsAt ? ` · ${formatDateTime(s.startsAt)}` : ''}
                </p>
              </div>
              {s.waiting ? (
                <div className="text-right">
                  <OpenSeatButton tastingId={s.tastingId} />
                  <p className="mt-1 max-w-xs text-xs text-rind-500">Lost the e-mail? This opens your seat with a fresh link; the old one stops working.</p>
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
