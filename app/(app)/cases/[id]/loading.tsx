export default function Loading() {
  return (
    <div className="space-y-3" aria-busy="true" aria-live="polite">
      <p className="sr-only">Loading the case…</p>
      <div className="card h-20 animate-pulse bg-paper-deep" />
      <div className="grid gap-3 lg:grid-cols-2">
        <div className="card h-64 animate-pulse bg-paper-deep" />
        <div className="card h-64 animate-pulse bg-paper-deep" />
      </div>
    </div>
  );
}
