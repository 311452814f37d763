'use client';

import { useTransition, useState } from 'react';
import { useRouter } from 'next/navigation';
import { switchWorkspaceAction } from '@/lib/workspaces/actions';
import { ROLE_LABELS } from '@/lib/permissions';
import type { WorkspaceChoice } from '@/lib/workspaces/schema';

export function WorkspaceSwitcher({ current, workspaces }: { current: string; workspaces: WorkspaceChoice[] }) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [error, setError] = useState<string>();
  if (workspaces.length < 2) {
    return <p className="px-3 text-sm font-semibold text-damson-900">{workspaces[0]?.name}</p>;
  }
  return (
    <div className="px-1">
      <label htmlFor="workspace-switcher" className="mb-1 block px-2 text-xs font-semibold uppercase tracking-wider text-rind-400">
        Workspace
      </label>
      <select
        id="workspace-switcher"
        value={current}
        disabled={pending}
        className="block w-full rounded-lg border-0 bg-white px-3 py-2 text-sm ring-1 ring-inset ring-rind-300"
        onChange={(e) => {
          const id = e.target.value;
          start(async () => {
            const res = await switchWorkspaceAction(id);
            if (!res.ok) setError(res.error);
            else {
              router.push('/home');
              router.refresh();
            }
          });
        }}
      >
        {workspaces.map((w) => (
          <option key={w.workspaceId} value={w.workspaceId}>
            {w.name} — {ROLE_LABELS[w.role]}
          </option>
        ))}
      </select>
      {error ? <p className="mt-1 text-xs text-ember-700">{error}</p> : null}
    </div>
  );
}
