/** One timeline event in plain words: "Cleo Marchetti added a bearing 212.0° true (±4°)". */
import { OUTCOMES } from '@/lib/validation/cases';
import type { EventView } from '@/lib/hunt/views';

const str = (v: unknown) => (typeof v === 'string' && v.trim() ? v : undefined);
const num = (v: unknown) => (typeof v === 'number' && Number.isFinite(v) ? v : undefined);

const EVIDENCE: Record<string, string> = { fix: 'the fix is small enough', premises: 'the hunter confirmed the premises' };

function bearingWords(d: Record<string, unknown>): string {
  const az = num(d.azimuthTrueDeg);
  const sigma = num(d.sigmaDeg);
  if (az === undefined) return 'a bearing';
  return `a bearing ${az.toFixed(1)}° true${sigma !== undefined ? ` (±${+sigma.toFixed(1)}°)` : ''}`;
}

/** The details a status change carries (evidence, letter date, outcome, reason), as a clause. */
function statusDetails(d: Record<string, unknown>): string {
  const bits: string[] = [];
  const evidence = str(d.evidence);
  if (evidence) bits.push(EVIDENCE[evidence] ?? evidence);
  if (str(d.deliveredOn)) bits.push(`letter delivered by hand on ${d.deliveredOn}`);
  const outcome = str(d.outcome);
  if (outcome) bits.push(OUTCOMES[outcome as keyof typeof OUTCOMES] ?? outcome);
  if (str(d.reason)) bits.push(`reason: ${d.reason}`);
  return bits.length ? ` — ${bits.join('; ')}` : '';
}

export function eventWords(e: EventView): string {
  const who = e.actor?.name ?? 'Quietfix';
  const d = e.data ?? {};
  switch (e.kind) {
    case 'reported':
      return `${who} filed the report`;
    case 'assigned':
      return `${who} assigned the case to ${str(d.assigneeName) ?? 'a hunter'}`;
    case 'unassigned':
      return `${who} took the hunter off the case`;
    case 'edited':
      return `${who} edited ${Array.isArray(d.fields) && d.fields.length ? `the ${d.fields.join(' and ')}` : 'the case'}`;
    case 'status-changed':
      return `${who} moved the case from ${str(d.from) ?? '?'} to ${str(d.to) ?? '?'}${statusDetails(d)}`;
    case 'comment':
      return d.premisesConfirmed ? `${who} commented and confirmed the premises on foot` : `${who} commented`;
    case 'bearing-added':
      return `${who} added ${bearingWords(d)}`;
    case 'bearing-edited':
      return `${who} edited ${bearingWords(d)}`;
    case 'bearing-excluded':
      return `${who} left ${bearingWords(d)} out of the fix`;
    case 'bearing-included':
      return `${who} put ${bearingWords(d)} back into the fix`;
    case 'sweep-added':
      return `${who} added a rotation sweep giving ${bearingWords(d)}`;
    case 'merged-in':
      return `${who} merged ${str(d.fromReference) ?? 'another case'} into this case`;
    case 'merged-into':
      return `${who} merged this case into ${str(d.intoReference) ?? 'another case'}`;
    case 'notice-drafted':
      return `${who} drafted a notice`;
    case 'notice-approved':
      return `${who} approved the notice`;
    case 'notice-queued':
      return `${who} sent the notice to the outbox`;
    case 'notice-retried':
      return `${who} asked the outbox to try the notice again`;
    case 'notice-sent':
      return d.via === 'hand'
        ? `${who} recorded the letter as delivered by hand${str(d.deliveredOn) ? ` on ${d.deliveredOn}` : ''}`
        : `The notice was accepted by the mail server${d.to === 'notified' ? ' — the case is now notified' : ''}`;
    case 'recipient-answered':
      return `The neighbour answered: ${str(d.label) ?? str(d.answer) ?? 'see below'}`;
    case 'follow-up-prepared':
      return 'No answer yet: a follow-up notice is drafted, waiting for approval';
    case 'duplicate-flagged':
      return `Possible duplicate of ${str(d.reference) ?? 'an earlier case'} noticed`;
    default:
      return `${who}: ${e.kind.replace(/-/g, ' ')}`;
  }
}

/** The free text an event carries (a comment, or a status change's note). */
export const eventText = (e: EventView) => str(e.data?.text) ?? str(e.data?.note);
