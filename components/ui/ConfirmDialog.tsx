'use client';

import { useEffect, useRef } from 'react';
import { Button } from './Button';

/** A modal confirmation for destructive actions; Escape or Cancel closes it without acting. */
export function ConfirmDialog({
  open,
  title,
  body,
  confirmLabel,
  tone = 'danger',
  busy = false,
  onConfirm,
  onCancel,
}: {
  open: boolean;
  title: string;
  body: React.ReactNode;
  confirmLabel: string;
  tone?: 'danger' | 'primary';
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal();
    if (!open && d.open) d.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onCancel={(e) => {
        e.preventDefault();
        onCancel();
      }}
      className="m-auto w-[min(28rem,calc(100vw-2rem))] rounded-card bg-pith-50 p-6 text-rind-800 shadow-card backdrop:bg-damson-900/40"
      aria-labelledby="confirm-title"
    >
      <h2 id="confirm-title" className="text-xl font-semibold">
        {title}
      </h2>
      <div className="mt-2 text-sm text-rind-600">{body}</div>
      <div className="mt-6 flex justify-end gap-3">
        <Button tone="secondary" type="button" onClick={onCancel} disabled={busy}>
          Cancel
        </Button>
        <Button tone={tone} type="button" onClick={onConfirm} disabled={busy}>
          {busy ? 'Working…' : confirmLabel}
        </Button>
      </div>
    </dialog>
  );
}
