import { OUTCOMES, SOUND_KINDS } from '@/lib/validation/cases';
import type { CaseDetail } from '@/lib/hunt/views';
import { formatWhen, frequencyWords, levelWords, scheduleWords, signed } from '@/lib/hunt/words';
import { CardSection } from './card-section';

function Row({ term, children, testId }: { term: string; children: React.ReactNode; testId?: string }) {
  return (
    <div className="grid gap-1 py-2 sm:grid-cols-[10rem_1fr]" data-testid={testId}>
      <dt className="text-sm font-semibold text-ink-soft">{term}</dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </div>
  );
}

/** The report in words; the reporter and their position only when the API included them. */
export function CaseDetails({ c }: { c: CaseDetail }) {
  const r = c.report;
  const khz = r.frequenciesKhz ?? [];
  const sound = r.sound ? (SOUND_KINDS[r.sound as keyof typeof SOUND_KINDS] ?? r.sound) : undefined;
  return (
    <CardSection id="details" title="The report" testId="case-details">
      <dl className="divide-y divide-ink/10">
        <Row term="Filed">{formatWhen(c.createdAt)}</Row>
        {sound && (
          <Row term="Sounds like">
            {sound}
            {r.soundNote && <span className="block text-ink-soft">“{r.soundNote}”</span>}
          </Row>
        )}
        {khz.length > 0 && (
          <Row term="Frequencies">
            <ul>
              {khz.map((f) => (
                <li key={f}>{frequencyWords(f)}</li>
              ))}
            </ul>
          </Row>
        )}
        <Row term="Level" testId="case-level">
          {typeof r.levelDbm === 'number' ? levelWords(r.levelDbm, khz[0]) : 'Not measured'}
        </Row>
        {r.schedule && <Row term="When heard">{scheduleWords(r.schedule)}</Row>}
        {c.description && (
          <Row term="Description">
            <p className="whitespace-pre-line">{c.description}</p>
          </Row>
        )}
        {c.reporter && (
          <Row term="Reporter" testId="case-reporter">
            {c.reporter.name}
            {c.reporter.callSign && ` (${c.reporter.callSign})`} · <a href={`mailto:${c.reporter.email}`}>{c.reporter.email}</a>
          </Row>
        )}
        {c.reportedPosition && (
          <Row term="Reporter’s position" testId="case-reported-position">
            {c.reportedPosition.lat.toFixed(5)}, {c.reportedPosition.lon.toFixed(5)}
          </Row>
        )}
        <Row term="Name in letters">
          {c.consentShareName ? 'The reporter agreed that the neighbour may be told their name.' : 'Keep the reporter’s name out of any letter.'}
        </Row>
        {c.status === 'resolved' && (
          <Row term="Outcome" testId="case-outcome">
            {c.outcome ? (OUTCOMES[c.outcome as keyof typeof OUTCOMES] ?? c.outcome) : 'Not given'}
            {c.resolvedAt && <span className="text-ink-soft"> · {formatWhen(c.resolvedAt)}</span>}
            {(c.levelBeforeDbm !== null || c.levelAfterDbm !== null) && (
              <span className="block">
                Level before {c.levelBeforeDbm !== null ? levelWords(c.levelBeforeDbm, khz[0]) : 'not measured'}, after{' '}
                {c.levelAfterDbm !== null ? levelWords(c.levelAfterDbm, khz[0]) : 'not measured'}
                {c.levelBeforeDbm !== null && c.levelAfterDbm !== null && ` (${signed(c.levelAfterDbm - c.levelBeforeDbm)} dB)`}
              </span>
            )}
          </Row>
        )}
      </dl>
    </CardSection>
  );
}
