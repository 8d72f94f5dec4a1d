'use client';

/** The save button of a hunt form, kept in reach at the bottom of the sheet while the form scrolls. */
export function SaveBar({ label, pending }: { label: string; pending: boolean }) {
  return (
    <div className="sticky bottom-0 z-10 border-t border-ink/10 bg-white pt-2 pb-[max(0.5rem,env(safe-area-inset-bottom))]">
      <button type="submit" className="btn-primary min-h-14 w-full text-lg" disabled={pending}>
        {pending ? 'Saving…' : label}
      </button>
    </div>
  );
}

/** Said instead of a form when the caller may not add to this hunt (the server refuses it too). */
export function NoHuntRights() {
  return <p className="card text-ink-soft">You can follow this hunt but not add bearings or sweeps to it.</p>;
}
