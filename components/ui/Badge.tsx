/** A small rounded status word. Each feature maps its own statuses to one of these tones. */
export type BadgeTone = 'good' | 'bad' | 'waiting' | 'quiet' | 'planning' | 'cooking' | 'tasting' | 'archived';

const TONES: Record<BadgeTone, string> = {
  good: 'bg-leaf-50 text-leaf-700 ring-leaf-100',
  bad: 'bg-ember-50 text-ember-700 ring-ember-100',
  waiting: 'bg-amberline-50 text-amberline-700 ring-amberline-100',
  quiet: 'bg-pith-100 text-rind-600 ring-pith-300',
  planning: 'bg-pith-200 text-rind-700 ring-pith-300',
  cooking: 'bg-quince-100 text-quince-700 ring-quince-200',
  tasting: 'bg-damson-100 text-damson-800 ring-damson-200',
  archived: 'bg-rind-300/30 text-rind-600 ring-rind-300',
};

export function Badge({ tone, children }: { tone: BadgeTone; children: React.ReactNode }) {
  return <span className={`inline-flex rounded-full px-2.5 py-0.5 text-xs font-semibold ring-1 ring-inset ${TONES[tone]}`}>{children}</span>;
}
