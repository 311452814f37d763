'use client';

import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { SelectField } from '@/components/ui/Field';
import { Notice } from '@/components/ui/Notice';
import { useFormAction } from '@/components/ui/useFormAction';
import { setFormulaPackFormatAction, setVersionPackFormatAction } from '@/lib/pricing/actions';

/** Picks the pack format a formula or a production version is costed in; saves on change. */
export function PackFormatPicker({ subject, subjectId, current, formats }: { subject: 'formula' | 'version'; subjectId: string; current: string | null; formats: { id: string; name: string }[] }) {
  const router = useRouter();
  const form = useFormAction(subject === 'formula' ? setFormulaPackFormatAction : setVersionPackFormatAction, { fieldPrefix: 'choice' });
  const [value, setValue] = useState(current ?? '');
  async function change(e: React.ChangeEvent<HTMLSelectElement>) {
    setValue(e.target.value);
    if ((await form.run(subjectId, { packFormatId: e.target.value || null }))?.ok) router.refresh();
  }
  return (
    <div className="max-w-sm space-y-2">
      {form.error && !form.fields.packFormatId ? <Notice tone="danger">{form.error}</Notice> : null}
      <SelectField id={`pack-format-${subjectId}`} label="Pack format" name="packFormatId" value={value} onChange={change} disabled={form.pending} errors={form.fields.packFormatId}
        options={[{ value: '', label: 'None chosen' }, ...formats.map((f) => ({ value: f.id, label: f.name }))]} />
    </div>
  );
}
