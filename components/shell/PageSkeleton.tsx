/**
 * What an area shows while its page is fetched on the server (each area's loading.tsx).
 * Grey blocks in the page's shape; the one line a screen reader hears is "Loading…".
 */
export function PageSkeleton({ shape = 'list' }: { shape?: 'list' | 'detail' }) {
  const rows = shape === 'list' ? 6 : 3;
  return (
    <div role="status" aria-live="polite" className="animate-pulse motion-reduce:animate-none" data-skeleton="">
      <span className="sr-only">Loading…</span>
      <div aria-hidden="true">
        <div className="h-8 w-2/3 max-w-sm rounded bg-rind-100" />
        <div className="mt-3 h-4 w-1/2 max-w-xs rounded bg-rind-100" />
        {shape === 'detail' ? <div className="mt-8 h-40 rounded-lg bg-rind-100" /> : null}
        <div className="mt-8 space-y-3">
          {Array.from({ length: rows }, (_, i) => (
            <div key={i} className="h-12 rounded-lg bg-rind-100" />
          ))}
        </div>
      </div>
    </div>
  );
}
