/** While the field screen loads: its layout in grey, so nothing jumps on a phone. */
export default function Loading() {
  return (
    <div className="space-y-3" aria-busy="true" aria-live="polite">
      <p className="sr-only">Loading the field screen…</p>
      <div className="h-12 animate-pulse rounded-lg bg-paper-deep" />
      <div className="h-[45dvh] min-h-56 animate-pulse rounded-lg bg-paper-deep" />
      <div className="card h-28 animate-pulse bg-paper-deep" />
    </div>
  );
}
