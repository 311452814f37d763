import Link from 'next/link';
import type { TrialOverview } from '@/lib/trials/schema';
import { StatusBadge } from './StatusBadge';
import { formatDate } from '@/lib/format/dates';

export function TrialHeader({ trial, children }: { trial: TrialOverview; children?: React.ReactNode }) {
  return (
    <header className="mb-6">
      <p className="no-print text-sm text-rind-500">
        <Link href="/trials" className="underline-offset-2 hover:underline">Trials</Link> /
      </p>
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-3xl font-semibold tracking-tight">
          <span className="mr-2 font-mono text-xl text-rind-500">{trial.code}</span>
          {trial.title}
        </h1>
        <StatusBadge status={trial.status} />
      </div>
      <p className="mt-2 max-w-3xl text-rind-700">{trial.question}</p>
      <p className="mt-1 text-sm text-rind-500">
        Owner {trial.owner.name} · base <Link href={`/formulas/${trial.baseFormula.id}`} className="underline">{trial.baseFormula.name}</Link>, revision {trial.baseFormula.revision} · started{' '}
        {formatDate(trial.createdAt)}
      </p>
      {children ? <div className="mt-4">{children}</div> : null}
    </header>
  );
}
