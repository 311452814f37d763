'use client';

/** A save that arrived after someone else's: both versions side by side, and the writer's choice. */
import type { ReactNode } from 'react';
import { clockTime } from '@/lib/notebook/autosave';
import type { TiptapDoc } from '@/lib/notebook/shape';
import type { NotebookConflictView } from '@/lib/notebook/schema';
import { Button } from '@/components/ui/Button';
import { NotebookView } from './NotebookView';

export type EntrySnapshot = { doc: TiptapDoc; updatedAt: string | null; updatedByName: string | null };

export function ConflictPanel({
  mine,
  theirs,
  busy,
  error,
  remaining,
  onKeep,
}: {
  mine: NotebookConflictView;
  theirs: EntrySnapshot;
  busy: boolean;
  error: string | null;
  remaining: number;
  onKeep: (keep: 'mine' | 'theirs' | 'both') => void;
}) {
  const theirsBy = theirs.updatedByName ?? 'Someone';
  return (
    <div role="region" aria-label="Parallel edit" className="border-b border-amberline-100 bg-amberline-50 px-4 py-4">
      <p role="alert" className="font-semibold text-amberline-700">
        Someone else saved this entry while you were writing. Nothing is lost: your version is kept beside theirs.
      </p>
      {remaining > 1 ? <p className="mt-1 text-sm text-amberline-700">{remaining} parallel versions are kept; you choose for each in turn.</p> : null}
      <div className="mt-3 grid gap-3 md:grid-cols-2">
        <VersionCard label={mine.savedByName === 'you' ? `Your version (${clockTime(mine.createdAt)})` : `Kept version by ${mine.savedByName} (${clockTime(mine.createdAt)})`} testId="conflict-mine">
          <NotebookView doc={mine.doc} />
        </VersionCard>
        <VersionCard label={`Their version by ${theirsBy}${theirs.updatedAt ? ` (${clockTime(theirs.updatedAt)})` : ''}`} testId="conflict-theirs">
          <NotebookView doc={theirs.doc} />
        </VersionCard>
      </div>
      {error ? <p role="alert" className="mt-2 text-sm text-ember-700">{error}</p> : null}
      <div className="mt-3 flex flex-wrap gap-2">
        <Button type="button" tone="secondary" onClick={() => onKeep('mine')} disabled={busy} className="disabled:opacity-60">Keep mine</Button>
        <Button type="button" tone="secondary" onClick={() => onKeep('theirs')} disabled={busy} className="disabled:opacity-60">Keep theirs</Button>
        <Button type="button" onClick={() => onKeep('both')} disabled={busy} className="disabled:opacity-60">Keep both</Button>
      </div>
    </div>
  );
}

function VersionCard({ label, testId, children }: { label: string; testId: string; children: ReactNode }) {
  return (
    <article aria-label={label} data-testid={testId} className="min-w-0 rounded-lg bg-pith-50 p-3 ring-1 ring-pith-300">
      <h3 className="mb-2 text-sm font-semibold text-rind-600">{label}</h3>
      <div className="max-h-96 overflow-y-auto">{children}</div>
    </article>
  );
}
