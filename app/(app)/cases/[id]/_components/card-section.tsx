/** A card with a level-2 heading that names it for screen readers; `aside` sits beside the heading. */
export function CardSection({ id, title, testId, aside, children }: { id: string; title: string; testId?: string; aside?: React.ReactNode; children: React.ReactNode }) {
  return (
    <section className="card min-w-0 space-y-3" aria-labelledby={`${id}-heading`} data-testid={testId}>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={`${id}-heading`} className="text-lg font-bold">
          {title}
        </h2>
        {aside}
      </div>
      {children}
    </section>
  );
}
