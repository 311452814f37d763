import type { ReactNode } from 'react';

type Tone = 'info' | 'success' | 'warning' | 'danger';

const TONES: Record<Tone, string> = {
  info: 'bg-damson-50 text-damson-900 ring-damson-200',
  success: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  warning: 'bg-amberline-50 text-amberline-700 ring-amberline-100',
  danger: 'bg-ember-50 text-ember-700 ring-ember-100',
};

export function Notice({ tone = 'info', title, children }: { tone?: Tone; title?: string; children?: ReactNode }) {
  return (
    <div role={tone === 'danger' ? 'alert' : 'status'} className={`break-words rounded-lg px-4 py-3 text-sm ring-1 ring-inset ${TONES[tone]}`}>
      {title ? <p className="font-semibold">{title}</p> : null}
      {children ? <div className={title ? 'mt-1' : ''}>{children}</div> : null}
    </div>
  );
}
