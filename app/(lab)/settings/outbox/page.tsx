import { notFound } from 'next/navigation';
import { requirePage } from '@/lib/page-guard';
import { outboxAvailable, readWorkspaceOutbox } from '@/lib/outbox';
import { PageHeader, EmptyState } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { formatDateTime } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Mail outbox' };

/** Demo and development only: this workspace's mail as the local fake received it, links hidden. Absent with a real relay. */
export default async function OutboxPage() {
  const actor = await requirePage('outbox.read');
  if (!outboxAvailable()) notFound();
  const { reachable, messages } = await readWorkspaceOutbox(actor);
  return (
    <>
      <PageHeader
        title="Mail outbox"
        lead={`E-mail sent by ${actor.workspaceName}, newest first, as the local mail fake received it. Links are hidden: each one is for its recipient alone. Password-reset mail is never shown here.`}
      />
      {!reachable ? (
        <Notice tone="info">The local mail fake is not answering, so there is nothing to show right now.</Notice>
      ) : messages.length === 0 ? (
        <EmptyState title="No mail sent yet">Invite a member or seat a staff taster, and the message shows up here.</EmptyState>
      ) : (
        <ul className="space-y-3">
          {messages.map((m) => (
            <li key={m.id} className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
              <p className="font-medium break-words">{m.subject}</p>
              <p className="text-xs text-rind-500 break-words">To {m.to.join(', ')} · {formatDateTime(m.date)}</p>
              <pre className="mt-3 whitespace-pre-wrap break-words font-sans text-sm text-rind-700">{m.text}</pre>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
