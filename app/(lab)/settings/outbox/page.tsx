import { requirePage } from '@/lib/page-guard';
import { readOutbox } from '@/lib/outbox';
import { PageHeader, EmptyState } from '@/components/ui/Card';
import { Notice } from '@/components/ui/Notice';
import { formatDateTime } from '@/lib/format/dates';

export const dynamic = 'force-dynamic';
export const metadata = { title: 'Mail outbox' };

/** Development only: what the local SMTP fake received. With a real SMTP relay there is nothing to show. */
export default async function OutboxPage() {
  await requirePage('outbox.read');
  const { available, messages } = await readOutbox();
  return (
    <>
      <PageHeader title="Mail outbox" lead="Every e-mail Setwell sent through the local mail fake, newest first." />
      {!available ? (
        <Notice tone="info">No local mail fake is configured, so mail goes to the real SMTP relay and is not kept here.</Notice>
      ) : messages.length === 0 ? (
        <EmptyState title="No mail sent yet">Invite a member or ask for a password reset, and the message shows up here.</EmptyState>
      ) : (
        <ul className="space-y-3">
          {messages.map((m) => (
            <li key={m.id} className="rounded-card bg-pith-50 p-4 ring-1 ring-pith-300">
              <p className="font-medium">{m.subject}</p>
              <p className="text-xs text-rind-500">To {m.to.join(', ')} · {formatDateTime(m.date)}</p>
              <pre className="mt-3 whitespace-pre-wrap break-words font-sans text-sm text-rind-700">{m.text}</pre>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
