'use client';

import { useState } from 'react';
import useSWR from 'swr';
import Link from 'next/link';
import { apiFetch } from '@/components/api/client';
import { Button, buttonClass } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { EmptyState } from '@/components/ui/Card';
import { TASTING_METHOD_LABELS, TASTING_STATE_LABELS } from '@/lib/tastings/vocabulary';
import type { TastingView } from '@/lib/tastings/schema';
import { DiscardTastingButton } from './DiscardTastingButton';
import { TableBox } from '@/components/ui/TableBox';

const STATUS_LABEL = { joined: 'Joined', answering: 'Answering', submitted: 'Submitted', partial: 'Partial' } as const;

/**
 * The organiser's live view. Progress is polled from the API every few seconds, so it works
 * the same with any number of app servers behind a load balancer.
 */
export function TastingControl({ initial, qrDataUrl, joinUrl, members, canRun, joinUrlLocalOnly = false }: {
  initial: TastingView; qrDataUrl: string | null; joinUrl: string | null; joinUrlLocalOnly?: boolean;
  members: Array<{ userId: string; name: string; role: string }>; canRun: boolean;
}) {
  const { data, mutate } = useSWR<{ session: TastingView }>(`/api/v1/tastings/${initial.id}`, (u: string) => apiFetch(u), {
    fallbackData: { session: initial },
    refreshInterval: initial.state === 'open' ? 3000 : 0,
  });
  const s = data?.session ?? initial;
  const [confirmClose, setConfirmClose] = useState(false);
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const [invitees, setInvitees] = useState<string[]>([]);
  const unfinished = s.seats.filter((x) => x.status !== 'submitted').length;

  async function call(path: string, body?: unknown, success?: string) {
    setBusy(true);
    setMessage(undefined);
    try {
      await apiFetch(path, { method: 'POST', body: JSON.stringify(body ?? {}) });
      if (success) setMessage({ tone: 'success', text: success });
      await mutate();
      if (path.endsWith('/open')) window.location.reload();
    } catch (err) {
      setMessage({ tone: 'danger', text: err instanceof Error ? err.message : 'That did not work.' });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3">
        <span className="rounded-full bg-damson-100 px-3 py-1 text-sm font-semibold text-damson-800" data-testid="tasting-state">{TASTING_STATE_LABELS[s.state]}</span>
        <span className="text-sm text-rind-600">{TASTING_METHOD_LABELS[s.method]} · {s.samples.length} samples{s.attributes.length ? ` · ${s.attributes.map((a) => a.name).join(', ')}` : ''}</span>
        {canRun && s.state === 'draft' ? <Button type="button" disabled={busy} onClick={() => call(`/api/v1/tastings/${s.id}/open`)}>Open for tasters</Button> : null}
        {canRun && s.state === 'draft' ? <Link href={`/tastings/${s.id}/edit`} className={buttonClass('secondary')}>Change the set-up</Link> : null}
        {canRun && s.state === 'draft' ? <DiscardTastingButton tastingId={s.id} trialId={s.trialId} /> : null}
        {canRun && s.state === 'open' ? <Button type="button" tone="danger" disabled={busy} onClick={() => setConfirmClose(true)}>Close the tasting</Button> : null}
        {canRun ? <Link href={`/tastings/${s.id}/sheet`} className={buttonClass('ghost')}>Kitchen serving sheet</Link> : null}
        {s.seats.length ? <Link href={`/tastings/${s.id}/results`} className={buttonClass('ghost')}>Results</Link> : null}
      </div>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}

      {s.state === 'open' && s.joinCode ? (
        <section className="grid gap-4 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300 sm:grid-cols-[auto_1fr] sm:items-center" aria-label="Join">
          {/* eslint-disable-next-line @next/next/no-img-element -- generated on our server */}
          {qrDataUrl ? <img src={qrDataUrl} alt={`QR code for ${joinUrl}`} width={180} height={180} className="rounded bg-white p-2" /> : null}
          <div>
            <p className="text-sm text-rind-600">Guests open <strong>{joinUrl?.replace(/\?.*$/, '')}</strong> on their phone and type</p>
            <p className="font-mono text-5xl font-bold tracking-[0.3em] text-damson-900" data-testid="join-code">{s.joinCode}</p>
            <p className="mt-1 text-sm text-rind-600">or scan the code. Each guest gets a seat of their own for this tasting only.</p>
            {joinUrlLocalOnly ? (
              <div className="mt-3" data-testid="join-link-local">
                <Notice tone="warning" title="Phones cannot open this address">
                  The app’s public address (APP_URL) points at this computer only. Restart the app with the address phones on the kitchen’s network reach, e.g. <code>APP_URL=http://192.168.1.20:3000</code> (see the README).
                </Notice>
              </div>
            ) : null}
          </div>
        </section>
      ) : null}

      {canRun && s.state === 'open' ? (
        <section className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300" aria-label="Invite staff tasters">
          <h2 className="text-lg font-semibold">Seat staff tasters</h2>
          <p className="text-sm text-rind-600">Each gets an e-mail with a link of their own.</p>
          <div className="mt-3 grid gap-2 sm:grid-cols-3">
            {members.map((m) => (
              <label key={m.userId} className="flex min-h-10 items-center gap-2 text-sm">
                <input type="checkbox" checked={invitees.includes(m.userId)} onChange={() => setInvitees(invitees.includes(m.userId) ? invitees.filter((x) => x !== m.userId) : [...invitees, m.userId])} />
                {m.name}
              </label>
            ))}
          </div>
          <Button className="mt-3" tone="secondary" type="button" disabled={busy || !invitees.length} onClick={() => call(`/api/v1/tastings/${s.id}/invitations`, { userIds: invitees }, 'Invitations sent.').then(() => setInvitees([]))}>
            Send invitations
          </Button>
        </section>
      ) : null}

      <section aria-labelledby="seats-title">
        <h2 id="seats-title" className="mb-2 text-lg font-semibold">Seats {s.state === 'open' ? <span className="text-sm font-normal text-rind-500">(updates every few seconds)</span> : null}</h2>
        {s.seats.length === 0 ? (
          <EmptyState title="Nobody has joined yet">{s.state === 'draft' ? 'Open the tasting to show the join code.' : 'Seats appear here as tasters join.'}</EmptyState>
        ) : (
          <TableBox label="Tasters and their progress">
            <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm" data-testid="seat-progress">
              <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
                <tr><th scope="col" className="px-3 py-2">Seat</th><th scope="col" className="px-3 py-2">Taster</th><th scope="col" className="px-3 py-2">Answered</th><th scope="col" className="px-3 py-2">Status</th></tr>
              </thead>
              <tbody className="divide-y divide-pith-200">
                {s.seats.map((x) => (
                  <tr key={x.seatIndex}>
                    <td className="px-3 py-2 tabular-nums">{x.seatIndex + 1}</td>
                    <td className="px-3 py-2">{x.displayName} <span className="text-xs text-rind-500">({x.kind})</span></td>
                    <td className="px-3 py-2 tabular-nums">{x.answered} of {x.expected}</td>
                    <td className="px-3 py-2">{STATUS_LABEL[x.status]}{!x.consented && x.status !== 'submitted' ? ' · notice not yet accepted' : ''}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </TableBox>
        )}
      </section>

      <ConfirmDialog
        open={confirmClose}
        busy={busy}
        title="Close the tasting?"
        body={unfinished ? `${unfinished} seat${unfinished === 1 ? ' has' : 's have'} not submitted. Their answers so far are kept and marked partial; no more answers are accepted.` : 'Every seat has submitted. Closing locks the answers.'}
        confirmLabel="Close"
        onCancel={() => setConfirmClose(false)}
        onConfirm={() => {
          setConfirmClose(false);
          void call(`/api/v1/tastings/${s.id}/close`, {}, 'The tasting is closed; the answers are locked.');
        }}
      />
    </div>
  );
}
