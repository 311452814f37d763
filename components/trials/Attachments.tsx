'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { Button } from '@/components/ui/Button';
import { Notice } from '@/components/ui/Notice';
import { EmptyState } from '@/components/ui/Card';
import { ConfirmDialog } from '@/components/ui/ConfirmDialog';
import { UPLOAD_SUBJECTS, UPLOAD_SUBJECT_LABELS, type UploadView } from '@/lib/uploads/schema';
import { readErrorBody } from '@/lib/api/error-body';

/** Photos and files of a trial or variant: upload (checked by content on the server), view, remove. */
export function Attachments({ trialId, variantId, uploads, canEdit }: { trialId: string; variantId?: string; uploads: UploadView[]; canEdit: boolean }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'success' | 'danger'; text: string }>();
  const [removing, setRemoving] = useState<UploadView | null>(null);

  async function upload(e: React.FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const formEl = e.currentTarget;
    const form = new FormData(formEl);
    if (!(form.get('file') instanceof File) || (form.get('file') as File).size === 0) return setMessage({ tone: 'danger', text: 'Choose a photo or a file first.' });
    if (variantId) form.set('variantId', variantId);
    setBusy(true);
    setMessage(undefined);
    const res = await fetch(`/api/v1/trials/${trialId}/uploads`, { method: 'POST', body: form, credentials: 'same-origin' });
    const body = await res.json().catch(() => ({}));
    setBusy(false);
    if (!res.ok) return setMessage({ tone: 'danger', text: readErrorBody(body).message ?? `Upload failed (${res.status}).` });
    formEl.reset();
    setMessage({ tone: 'success', text: `Added ${body.upload.originalName}.` });
    router.refresh();
  }

  const photos = uploads.filter((u) => u.kind === 'photo');
  const files = uploads.filter((u) => u.kind === 'file');
  return (
    <section aria-labelledby={`att-${variantId ?? 'trial'}`} className="rounded-card bg-pith-50 p-5 ring-1 ring-pith-300">
      <h2 id={`att-${variantId ?? 'trial'}`} className="text-lg font-semibold">Photos and files</h2>
      {uploads.length === 0 ? (
        <div className="mt-3"><EmptyState title="No photos yet">Photograph the jar, the set test and a spread; attach CSV or PDF files such as lab reports.</EmptyState></div>
      ) : (
        <>
          <ul className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-3" data-testid="photo-grid">
            {photos.map((p) => (
              <li key={p.id} className="overflow-hidden rounded-lg bg-white ring-1 ring-pith-300">
                <a href={p.url} target="_blank" rel="noreferrer">
                  {/* eslint-disable-next-line @next/next/no-img-element -- served by our own authorised route */}
                  <img src={p.thumbnailUrl ?? p.url} alt={`${p.subject ? UPLOAD_SUBJECT_LABELS[p.subject] : 'Photo'}: ${p.originalName}`} className="aspect-square w-full object-cover" loading="lazy" />
                </a>
                <div className="flex items-center justify-between gap-2 px-2 py-1 text-xs">
                  <span className="truncate">{p.subject ? UPLOAD_SUBJECT_LABELS[p.subject] : p.originalName}</span>
                  {canEdit ? <button type="button" className="text-ember-700 underline" onClick={() => setRemoving(p)}>Remove</button> : null}
                </div>
              </li>
            ))}
          </ul>
          {files.length ? (
            <ul className="mt-3 divide-y divide-pith-200 text-sm">
              {files.map((f) => (
                <li key={f.id} className="flex items-center justify-between gap-2 py-2">
                  <a href={f.url} className="text-damson-700 underline">{f.originalName}</a>
                  <span className="text-xs text-rind-500">{(f.sizeBytes / 1024).toFixed(0)} KB</span>
                  {canEdit ? <button type="button" className="text-xs text-ember-700 underline" onClick={() => setRemoving(f)}>Remove</button> : null}
                </li>
              ))}
            </ul>
          ) : null}
        </>
      )}
      {canEdit ? (
        <form onSubmit={upload} className="mt-4 flex flex-wrap items-end gap-3">
          <label className="text-sm">
            <span className="mb-1 block font-medium text-rind-700">Photo or file (JPEG, PNG, WebP, PDF, CSV)</span>
            <input name="file" type="file" accept="image/jpeg,image/png,image/webp,application/pdf,.csv" className="text-sm" />
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-rind-700">Shows</span>
            <select name="subject" className="rounded-lg bg-white px-3 py-2 ring-1 ring-rind-300">
              <option value="">—</option>
              {UPLOAD_SUBJECTS.map((s) => <option key={s} value={s}>{UPLOAD_SUBJECT_LABELS[s]}</option>)}
            </select>
          </label>
          <Button type="submit" tone="secondary" disabled={busy}>{busy ? 'Uploading…' : 'Upload'}</Button>
        </form>
      ) : null}
      {message ? <div className="mt-3"><Notice tone={message.tone}>{message.text}</Notice></div> : null}
      <ConfirmDialog
        open={removing !== null}
        busy={busy}
        title="Remove this attachment?"
        body={`“${removing?.originalName}” will be deleted from storage. This cannot be undone.`}
        confirmLabel="Remove"
        onCancel={() => setRemoving(null)}
        onConfirm={async () => {
          if (!removing) return;
          setBusy(true);
          const res = await fetch(`/api/v1/uploads/${removing.id}`, { method: 'DELETE', credentials: 'same-origin' });
          setBusy(false);
          setRemoving(null);
          if (!res.ok) setMessage({ tone: 'danger', text: 'It was not removed.' });
          else router.refresh();
        }}
      />
    </section>
  );
}
