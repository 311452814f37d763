'use client';

import { useState, useTransition } from 'react';
import Link from 'next/link';
import { Button } from '@/components/ui/Button';
import { switchWorkspaceAction } from '@/lib/workspaces/actions';
import type { RecordHome } from '@/lib/workspaces/record-home';

/** A link led to a record of another of the user's workspaces: offer the switch, or say why not. A section: it renders inside the staff frame's main. */
export function RecordElsewhere({ home }: { home: RecordHome }) {
  const [pending, start] = useTransition();
  const [error, setError] = useState<string>();
  return (
    <section className="mx-auto max-w-lg px-6 py-24 text-center">
      <h1 className="text-2xl font-semibold">
        This {home.kind} is in {home.workspaceName}
      </h1>
      {home.canOpen ? (
        <>
          <p className="mt-2 text-rind-600">
            Switch to {home.workspaceName} to open it. You are {home.roleLabel.toLowerCase()} there.
          </p>
          <Button
            type="button"
            disabled={pending}
            className="mt-6"
            onClick={() =>
              start(async () => {
                const res = await switchWorkspaceAction(home.workspaceId);
                if (!res.ok) setError(res.error);
                // A full load: the whole frame (navigation, role) changes with the workspace.
                else window.location.assign(home.returnPath);
              })
            }
          >
            {pending ? 'Switching…' : `Switch to ${home.workspaceName}`}
          </Button>
          {error ? (
            <p role="alert" className="mt-2 text-sm text-ember-700">
              {error}
            </p>
          ) : null}
        </>
      ) : (
        <p className="mt-2 text-rind-600">
          Your role there ({home.roleLabel}) does not open {home.opens}. If you need it, ask an administrator of {home.workspaceName} to
          change your role.
        </p>
      )}
      <p className="mt-6">
        <Link href="/home" className="text-damson-700 underline underline-offset-2">
          Back to your overview
        </Link>
      </p>
    </section>
  );
}
