export default function LabLoading() {
  return (
    <div aria-busy="true" aria-live="polite" className="animate-pulse space-y-4">
      <span className="sr-only">Loading…</span>
      <div className="h-8 w-64 rounded bg-pith-300" />
      <div className="h-4 w-96 max-w-full rounded bg-pith-200" />
      <div className="h-48 rounded-card bg-pith-200" />
    </div>
  );
}
