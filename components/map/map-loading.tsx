/** Placeholder while a map's code loads: same footprint, plain text for screen readers. */
export function MapLoading({ label }: { label: string }) {
  return (
    <div className="flex h-full min-h-56 w-full items-center justify-center rounded-lg border border-ink/20 bg-paper-deep text-ink-soft" aria-busy="true">
      {label}
    </div>
  );
}
