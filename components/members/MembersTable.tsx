'use client';

import { useState } from 'react';
import useSWR from 'swr';
import { apiFetch, ApiClientError } from '@/components/api/client';
import { Button } from '@/components/ui/Button';
import { Field, SelectField } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { ROLE_LABELS, ROLES, type Role } from '@/lib/permissions';
import type { MemberRow, PendingInvitation } from '@/lib/members/schema';
import { formatDate } from '@/lib/format/dates';
import { TableBox } from '@/components/ui/TableBox';

type MembersPayload = { members: MemberRow[]; invitations: PendingInvitation[] };
type Pending =
  | { kind: 'deactivate' | 'reactivate'; member: MemberRow }
  | { kind: 'role'; member: MemberRow; role: Role }
  | { kind: 'revoke'; invitation: PendingInvitation }
  | null;

const roleOptions = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

export function MembersTable({ currentUserId }: { currentUserId: string }) {
  const { data, error, isLoading, mutate } = useSWR<MembersPayload>('/api/v1/members', (u: string) => apiFetch<MembersPayload>(u));
  const [notice, setNotice] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const [inviteErrors, setInviteErrors] = useState<Record<string, string[]>>();
  const [inviting, setInviting] = useState(false);
  const [pending, setPending] = useState<Pending>(null);
  const [busy, setBusy] = useState(false);

  async function run(fn: () => Promise<unknown>, success: string) {
    setBusy(true);
    setNotice(undefined);
    try {
      await fn();
      setNotice({ tone: 'success', text: success });
      await mutate();
    } catch (e) {
      setNotice({ tone: 'danger', text: e instanceof Error ? e.message : 'That did not work.' });
    } finally {
      setBusy(false);
      setPending(null);
    }
  }

  async function invite(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const form = new FormData(formEl);
    setInviting(true);
    setInviteErrors(undefined);
    setNotice(undefined);
    try {
      await apiFetch('/api/v1/members', { method: 'POST', body: JSON.stringify({ email: form.get('email'), role: form.get('role') }) });
      setNotice({ tone: 'success', text: `Invitation sent to ${String(form.get('email'))}.` });
      formEl.reset();
      await mutate();
    } catch (err) {
      if (err instanceof ApiClientError && err.fields) setInviteErrors(err.fields);
      else setNotice({ tone: 'danger', text: err instanceof Error ? err.message : 'The invitation was not sent.' });
    } finally {
      setInviting(false);
    }
  }

  const changeRole = (m: MemberRow, role: Role) =>
    run(() => apiFetch(`/api/v1/members/${m.membershipId}`, { method: 'PATCH', body: JSON.stringify({ role }) }), `${m.name} is now ${ROLE_LABELS[role]}.`);

  return (
    <div className="space-y-6">
      <form onSubmit={invite} className="grid gap-3 rounded-card bg-pith-50 p-5 ring-1 ring-pith-300 sm:grid-cols-[1fr_14rem_auto] sm:items-end" aria-label="Invite a member">
        <Field label="E-mail to invite" name="email" type="email" required errors={inviteErrors?.email} placeholder="name@example.org" />
        <SelectField label="Role" name="role" options={roleOptions} defaultValue="developer" errors={inviteErrors?.role} />
        <Button type="submit" disabled={inviting}>
          {inviting ? 'Sending…' : 'Send invitation'}
        </Button>
      </form>

      {notice ? <Notice tone={notice.tone}>{notice.text}</Notice> : null}
      {error ? <Notice tone="danger">{(error as Error).message}</Notice> : null}

      <TableBox label="Members and invitations">
        <table className="min-w-full divide-y divide-pith-300 bg-pith-50 text-sm" data-testid="members-table">
          <caption className="sr-only">Members of this workspace</caption>
          <thead className="bg-pith-200 text-left text-xs uppercase tracking-wider text-rind-600">
            <tr>
              <th scope="col" className="px-4 py-3">Name</th>
              <th scope="col" className="px-4 py-3">E-mail</th>
              <th scope="col" className="px-4 py-3">Role</th>
              <th scope="col" className="px-4 py-3">Status</th>
              <th scope="col" className="px-4 py-3"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody className="divide-y divide-pith-200">
            {isLoading ? (
              <tr>
                <td colSpan={5} className="px-4 py-6 text-center text-rind-500" aria-busy="true">Loading members…</td>
              </tr>
            ) : null}
            {data?.members.map((m) => (
              <tr key={m.membershipId} className={m.active ? '' : 'text-rind-400'}>
                <td className="px-4 py-3 font-medium">{m.name}{m.userId === currentUserId ? ' (you)' : ''}</td>
                <td className="px-4 py-3">{m.email}</td>
                <td className="px-4 py-3">
                  <label className="sr-only" htmlFor={`role-${m.membershipId}`}>Role of {m.name}</label>
                  <select
                    id={`role-${m.membershipId}`}
                    value={m.role}
                    disabled={busy || !m.active}
                    onChange={(e) => setPending({ kind: 'role', member: m, role: e.target.value as Role })}
                    className="rounded-md border-0 bg-white py-1 pl-2 pr-7 text-sm ring-1 ring-inset ring-rind-300"
                  >
                    {roleOptions.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
                  </select>
                </td>
                <td className="px-4 py-3">{m.active ? 'Active' : 'Deactivated'}</td>
                <td className="px-4 py-3 text-right">
                  <Button tone={m.active ? 'ghost' : 'secondary'} type="button" disabled={busy} onClick={() => setPending({ kind: m.active ? 'deactivate' : 'reactivate', member: m })}>
                    {m.active ? 'Deactivate' : 'Reactivate'}
                  </Button>
                </td>
              </tr>
            ))}
            {data?.invitations.map((i) => (
              <tr key={i.invitationId} className="bg-quince-50/60">
                <td className="px-4 py-3 italic text-rind-500">Invited</td>
                <td className="px-4 py-3">{i.email}</td>
                <td className="px-4 py-3">{ROLE_LABELS[i.role]}</td>
                <td className="px-4 py-3 text-xs">Waiting · expires {formatDate(i.expiresAt)}</td>
                <td className="px-4 py-3 text-right">
                  <Button tone="ghost" type="button" disabled={busy} onClick={() => setPending({ kind: 'revoke', invitation: i })}>Revoke</Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </TableBox>

      <ConfirmDialog
        open={pending !== null}
        busy={busy}
        tone={pending?.kind === 'reactivate' || (pending?.kind === 'role' && pending.member.userId !== currentUserId) ? 'primary' : 'danger'}
        title={pending ? confirmTitle(pending, currentUserId) : ''}
        body={pending ? confirmBody(pending, currentUserId) : null}
        confirmLabel={pending?.kind === 'revoke' ? 'Revoke' : pending?.kind === 'deactivate' ? 'Deactivate' : pending?.kind === 'role' ? 'Change role' : 'Reactivate'}
        onCancel={() => setPending(null)}
        onConfirm={() => {
          if (!pending) return;
          if (pending.kind === 'role') {
            void changeRole(pending.member, pending.role);
          } else if (pending.kind === 'revoke') {
            void run(() => apiFetch(`/api/v1/invitations/${pending.invitation.invitationId}`, { method: 'DELETE' }), 'Invitation revoked.');
          } else {
            const active = pending.kind === 'reactivate';
            void run(
              () => apiFetch(`/api/v1/members/${pending.member.membershipId}`, { method: 'PATCH', body: JSON.stringify({ active }) }),
              `${pending.member.name} was ${active ? 'reactivated' : 'deactivated'}.`,
            );
          }
        }}
      />
    </div>
  );
}

function confirmTitle(pending: NonNullable<Pending>, currentUserId: string): string {
  switch (pending.kind) {
    case 'revoke': return 'Revoke this invitation?';
    case 'deactivate': return 'Deactivate this member?';
    case 'reactivate': return 'Reactivate this member?';
    case 'role': return pending.member.userId === currentUserId ? 'Change your own role?' : `Make ${pending.member.name} ${ROLE_LABELS[pending.role]}?`;
  }
}

function confirmBody(pending: NonNullable<Pending>, currentUserId: string): string {
  switch (pending.kind) {
    case 'revoke': return `The link sent to ${pending.invitation.email} will stop working.`;
    case 'deactivate': return `${pending.member.name} will no longer be able to open this workspace. Their work stays, and you can reactivate them later.`;
    case 'reactivate': return `${pending.member.name} gets their access back with the role ${ROLE_LABELS[pending.member.role]}.`;
    case 'role':
      return pending.member.userId === currentUserId && pending.member.role === 'admin'
        ? `You become ${ROLE_LABELS[pending.role]} at once and lose the administration of this workspace, this page included. Only another administrator can give it back.`
        : `${pending.member.name} changes from ${ROLE_LABELS[pending.member.role]} to ${ROLE_LABELS[pending.role]} at their next click. The change goes in the audit trail.`;
  }
}
