import type { FixView } from '@/lib/hunt/views';
import { formatTime, metres } from '@/lib/hunt/words';

/** How the fix shrank as lines were added: time, lines, semi-major. */
export function ConvergenceTrail({ trail }: { trail: FixView['trail'] }) {
  if (trail.length === 0) return null;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm" data-testid="convergence-trail">
        <caption className="mb-1 text-left font-bold">How the fix converged</caption>
        <thead>
          <tr className="border-b border-ink/20">
            <th scope="col" className="py-1 pr-3">
              Time
            </th>
            <th scope="col" className="py-1 pr-3">
              Lines
            </th>
            <th scope="col" className="py-1">
              Semi-major
            </th>
          </tr>
        </thead>
        <tbody>
          {trail.map((t) => (
            <tr key={t.id} className="border-b border-ink/10">
              <td className="py-1 pr-3">
                <time dateTime={t.createdAt}>{formatTime(t.createdAt)}</time>
              </td>
              <td className="py-1 pr-3">{t.lineCount}</td>
              <td className="py-1">{t.ok && t.semiMajorM !== null ? metres(t.semiMajorM) : 'no fix'}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
