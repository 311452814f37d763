/** Bar widths in turn, so the placeholder reads as lines of text rather than a block. */
const WIDTHS = ['w-full', 'w-11/12', 'w-4/5', 'w-2/3'];

/**
 * The placeholder of a slow part of a page while it loads: the `<Suspense>` fallback around an
 * async server component, inside a page and after its permission checks (a loading.tsx would
 * stream the whole page and turn its 404/403 into HTTP 200). Screen readers hear
 * "Loading <what>…"; the bars are decoration.
 */
export function Skeleton({ what, lines = 3 }: { what: string; lines?: number }) {
  return (
    <div role="status" aria-busy="true" className="space-y-2 rounded-card bg-pith-50 p-4 ring-1 ring-pith-300" data-testid="skeleton">
      <span className="sr-only">Loading {what}…</span>
      {Array.from({ length: Math.max(1, lines) }, (_, i) => (
        <div key={i} aria-hidden="true" className={`h-4 animate-pulse rounded bg-pith-200 motion-reduce:animate-none ${WIDTHS[i % WIDTHS.length]}`} />
      ))}
    </div>
  );
}
