/**
 * What a phone remembers between visits (localStorage): the last position per case, so it
 * survives the phone sleeping or the page reloading, and the hunter's usual north reference.
 * Browser only; every read is validated and a missing or broken entry reads as nothing.
 */
import { z } from 'zod';

const positionSchema = z.object({
  lat: z.number().min(-90).max(90),
  lon: z.number().min(-180).max(180),
  source: z.enum(['device', 'map']),
  /** Reported horizontal accuracy of a device position, metres. */
  accuracyM: z.number().min(0).optional(),
  /** When the position was taken, ISO time. */
  at: z.string(),
});
export type RememberedPosition = z.infer<typeof positionSchema>;

const positionKey = (caseId: string) => `quietfix:position:${caseId}`;
const REFERENCE_KEY = 'quietfix:reference';

function read(key: string): unknown {
  try {
    const raw = window.localStorage.getItem(key);
    return raw === null ? undefined : JSON.parse(raw);
  } catch {
    return undefined;
  }
}

function write(key: string, value: unknown) {
  try {
    window.localStorage.setItem(key, JSON.stringify(value));
  } catch {
    // Storage full or disabled (private mode): the position simply is not remembered.
  }
}

export function loadPosition(caseId: string): RememberedPosition | undefined {
  const parsed = positionSchema.safeParse(read(positionKey(caseId)));
  return parsed.success ? parsed.data : undefined;
}

export function savePosition(caseId: string, p: RememberedPosition) {
  write(positionKey(caseId), p);
}

/** The north reference the hunter used last; magnetic (a hand compass) when unknown. */
export function loadReference(): 'true' | 'magnetic' {
  return read(REFERENCE_KEY) === 'true' ? 'true' : 'magnetic';
}

export function saveReference(reference: 'true' | 'magnetic') {
  write(REFERENCE_KEY, reference);
}
