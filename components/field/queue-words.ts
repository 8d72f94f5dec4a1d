import type { QueuedItem } from '@/lib/field/queue';
import { levelLabel } from './level-words';

const time = (iso: string) => new Date(iso).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' });

/** One line saying what a queued item is, e.g. "Bearing 123° magnetic · typed 05:12". */
export function queuedItemLabel(item: QueuedItem): string {
  const b = item.body;
  if (item.kind === 'bearing') return `Bearing ${b.azimuthDeg}° ${b.reference} · typed ${time(item.createdAt)}`;
  if (item.kind === 'sweep') return `Sweep of ${Array.isArray(b.samples) ? b.samples.length : 0} readings · typed ${time(item.createdAt)}`;
  const level = b.level as { unit: 'S' | 'dBm'; value: number };
  return `Level ${levelLabel(level)}${b.frequencyKhz ? ` at ${b.frequencyKhz} kHz` : ''} · taken ${time(String(b.takenAt ?? item.createdAt))}`;
}

/** "2 waiting to send" */
export function waitingText(n: number): string {
  return n === 0 ? 'Nothing waiting to send' : `${n} waiting to send`;
}
