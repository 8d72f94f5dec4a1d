import type { EventView } from '@/lib/hunt/views';
import { eventText, eventWords } from './event-words';
import { formatWhen } from '@/lib/hunt/words';
import { CardSection } from './card-section';

/** The append-only case history, oldest first; new entries are announced politely. */
export function CaseTimeline({ events, error, children }: { events?: EventView[]; error?: Error; children?: React.ReactNode }) {
  return (
    <CardSection id="timeline" title="Timeline">
      {error && <p className="font-semibold text-alarm-600">The timeline could not be loaded: {error.message}</p>}
      {!events && !error && <p className="text-ink-soft">Loading the timeline…</p>}
      <ol className="space-y-3" data-testid="timeline" aria-live="polite" aria-relevant="additions">
        {events?.map((e) => {
          const text = eventText(e);
          return (
            <li key={e.id} className="border-l-2 border-hush-300 pl-3" data-testid="timeline-event" data-kind={e.kind}>
              <p>{eventWords(e)}</p>
              {text && <p className="mt-1 rounded-lg bg-paper-deep p-2 whitespace-pre-line">{text}</p>}
              <p className="text-xs text-ink-faint">
                <time dateTime={e.createdAt}>{formatWhen(e.createdAt)}</time>
                {e.visibility === 'committee' && ' · committee only'}
              </p>
            </li>
          );
        })}
      </ol>
      {events?.length === 0 && <p className="text-ink-soft">Nothing has happened yet.</p>}
      {children}
    </CardSection>
  );
}
