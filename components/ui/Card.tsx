import type { ReactNode } from 'react';

export function Card({ title, actions, children, className = '' }: { title?: string; actions?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-card bg-pith-50 p-5 shadow-card ring-1 ring-pith-300 ${className}`}>
      {title || actions ? (
        <header className="mb-4 flex flex-wrap items-center justify-between gap-3">
          {title ? <h2 className="text-lg font-semibold">{title}</h2> : <span />}
          {actions}
        </header>
      ) : null}
      {children}
    </section>
  );
}

/** Record codes (T-006, PR-004) never break at their hyphen: on a phone "T-" / "006" reads as two things. */
export function keepCodesWhole(text: string): ReactNode {
  const parts = text.split(/\b([A-Z]{1,4}-\d+)\b/);
  return parts.length === 1 ? text : parts.map((part, i) => (i % 2 ? <span key={i} className="whitespace-nowrap">{part}</span> : part));
}

export function PageHeader({ title, lead, actions }: { title: string; lead?: string; actions?: ReactNode }) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div>
        <h1 className="text-3xl font-semibold tracking-tight">{keepCodesWhole(title)}</h1>
        {lead ? <p className="mt-1 max-w-2xl text-rind-600">{lead}</p> : null}
      </div>
      {actions}
    </div>
  );
}

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-card border-2 border-dashed border-pith-300 px-6 py-10 text-center">
      <p className="font-display text-lg text-damson-900">{title}</p>
      {children ? <div className="mx-auto mt-2 max-w-md text-sm text-rind-600">{children}</div> : null}
      {action ? <div className="mt-4">{action}</div> : null}
    </div>
  );
}
