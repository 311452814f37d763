'use client';

import { useState } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiClientError } from '@/components/api/client';
import { Button } from '@/components/ui/Button';
import { Field } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { EmptyState } from '@/components/ui/Card';
import type { TokenRow } from '@/lib/api-tokens/schema';
import { formatDate, formatDateTime } from '@/lib/format/dates';

export function TokensPanel() {
  const { data, isLoading, mutate } = useSWR<{ tokens: TokenRow[] }>('/api/v1/tokens', (u: string) => apiFetch<{ tokens: TokenRow[] }>(u));
  const [fresh, setFresh] = useState<string>();
  const [errors, setErrors] = useState<Record<string, string[]>>();
  const [message, setMessage] = useState<string>();
  const [revoking, setRevoking] = useState<TokenRow | null>(null);
  const [busy, setBusy] = useState(false);

  async function create(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    setBusy(true);
    setErrors(undefined);
    setMessage(undefined);
    try {
      const res = await apiFetch<{ token: TokenRow & { secret: string } }>('/api/v1/tokens', {
        method: 'POST',
        body: JSON.stringify({ label: new FormData(formEl).get('label') }),
      });
      setFresh(res.token.secret);
      formEl.reset();
      await mutate();
    } catch (err) {
      if (err instanceof ApiClientError && err.fields) setErrors(err.fields);
      else setMessage(err instanceof Error ? err.message : 'The token was not created.');
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-6">
      <form onSubmit={create} className="grid gap-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300 sm:grid-cols-[1fr_auto] sm:items-end">
        <Field label="Label" name="label" required placeholder="e.g. nightly export script" errors={errors?.label} />
        <Button type="submit" disabled={busy}>Create token</Button>
      </form>
      {message ? <Notice tone="danger">{message}</Notice> : null}
      {fresh ? (
        <Notice tone="success" title="Copy your token now: it will not be shown again">
          <code className="mt-1 block break-all rounded bg-white px-2 py-1 font-mono text-xs" data-testid="fresh-token">{fresh}</code>
          <p className="mt-2">Send it as <code>Authorization: Bearer …</code>. It acts as you, in this workspace only.</p>
        </Notice>
      ) : null}
      {isLoading ? <p className="text-sm text-rind-500">Loading tokens…</p> : null}
      {data && data.tokens.length === 0 ? <EmptyState title="No tokens yet">Create one for each script that reads or writes Setwell data.</EmptyState> : null}
      {data && data.tokens.length > 0 ? (
        <ul className="divide-y divide-pith-200 rounded-card bg-pith-50 ring-1 ring-pith-300">
          {data.tokens.map((t) => (
            <li key={t.tokenId} className="flex flex-wrap items-center justify-between gap-3 px-4 py-3 text-sm">
              <div>
                <p className="font-medium">{t.label}</p>
                <p className="text-xs text-rind-500">
                  <code>{t.displayPrefix}…</code> · created {formatDate(t.createdAt)} · {t.lastUsedAt ? `last used ${formatDateTime(t.lastUsedAt)}` : 'never used'}
                </p>
              </div>
              <Button tone="ghost" type="button" onClick={() => setRevoking(t)}>Revoke</Button>
            </li>
          ))}
        </ul>
      ) : null}
      <ConfirmDialog
        open={revoking !== null}
        busy={busy}
        title="Revoke this token?"
        body={`Scripts using “${revoking?.label}” will get 401 from now on.`}
        confirmLabel="Revoke"
        onCancel={() => setRevoking(null)}
        onConfirm={async () => {
          if (!revoking) return;
          setBusy(true);
          try {
            await apiFetch(`/api/v1/tokens/${revoking.tokenId}`, { method: 'DELETE' });
            await mutate();
          } catch (err) {
            setMessage(err instanceof Error ? err.message : 'The token was not revoked.');
          } finally {
            setBusy(false);
            setRevoking(null);
          }
        }}
      />
    </div>
  );
}
