import type { FixView } from '@/lib/hunt/views';

/** The hunt's warnings in words: the server's (loop size, near field, one-way lines) and the fix's own. */
export function HuntWarnings({ fix }: { fix?: FixView }) {
  const f = fix?.current?.fix;
  const all = [...new Set([...(fix?.warnings ?? []), ...(f && f.ok ? f.warnings : [])])];
  if (all.length === 0) return null;
  return (
    <section aria-label="Warnings" className="rounded-lg border-l-4 border-flare-500 bg-flare-100 p-3 text-flare-700">
      <ul className="list-disc space-y-1 pl-5 text-base font-medium text-ink">
        {all.map((w) => (
          <li key={w}>{w}</li>
        ))}
      </ul>
    </section>
  );
}
