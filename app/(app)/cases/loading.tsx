export default function Loading() {
  return (
    <div className="space-y-2" aria-busy="true" aria-live="polite">
      <p className="sr-only">Loading cases…</p>
      {[0, 1, 2].map((i) => (
        <div key={i} className="card h-16 animate-pulse bg-paper-deep" />
      ))}
    </div>
  );
}
