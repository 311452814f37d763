'use client';

import { useState, useTransition } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { Notice } from '@/components/ui/Notice';
import { archiveIngredientAction } from '@/lib/ingredients/actions';

/** Archive or restore one ingredient, after a confirmation that says what archiving means for formulas. */
export function ArchiveIngredientButton({ ingredientId, name, archived }: { ingredientId: string; name: string; archived: boolean }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const [error, setError] = useState<string>();
  const [pending, startTransition] = useTransition();

  function confirm() {
    setError(undefined);
    startTransition(async () => {
      const result = await archiveIngredientAction(ingredientId, !archived);
      setOpen(false);
      if (!result.ok) {
        setError(result.error);
        return;
      }
      router.refresh();
    });
  }

  return (
    <div className="space-y-2">
      <Button tone={archived ? 'secondary' : 'ghost'} type="button" disabled={pending} onClick={() => setOpen(true)} aria-label={`${archived ? 'Restore' : 'Archive'} ${name}`}>
        {archived ? 'Restore' : 'Archive'}
      </Button>
      {error ? <Notice tone="danger">{error}</Notice> : null}
      <ConfirmDialog
        open={open}
        busy={pending}
        tone={archived ? 'primary' : 'danger'}
        title={archived ? `Restore ${name}?` : `Archive ${name}?`}
        body={
          archived
            ? 'It returns to the library and can be added to new formula lines again.'
            : 'Archived ingredients stay in old revisions but cannot be added to new lines. You can restore it later.'
        }
        confirmLabel={archived ? 'Restore' : 'Archive'}
        onCancel={() => setOpen(false)}
        onConfirm={confirm}
      />
    </div>
  );
}
