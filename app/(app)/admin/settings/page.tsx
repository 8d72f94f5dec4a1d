import type { Metadata } from 'next';
import { requirePageUser } from '@/lib/auth/session';
import { getClubSettings, listSettingsEvents } from '@/db/settings';
import { SettingsForm } from './settings-form';

export const metadata: Metadata = { title: 'Club settings' };

const LABELS: Record<string, string> = {
  clubName: 'club name',
  contactEmail: 'contact',
  locateThresholdM: 'locate threshold',
  reminderDays: 'reminder days',
  maxPositionAccuracyM: 'position accuracy limit',
  noiseEnvironment: 'noise environment',
  uploadMaxMb: 'upload size limit',
};

export default async function ClubSettingsPage() {
  await requirePageUser('admin');
  const [settings, timeline] = await Promise.all([getClubSettings(), listSettingsEvents()]);
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-extrabold">Club settings</h1>
      <SettingsForm settings={settings} />
      <section className="card" aria-labelledby="settings-timeline">
        <h2 id="settings-timeline" className="font-bold">Changes</h2>
        {timeline.length === 0 ? (
          <p className="text-ink-soft">No change yet.</p>
        ) : (
          <ul className="space-y-1 text-sm" data-testid="settings-timeline">
            {timeline.map((e) => (
              <li key={e.id}>
                <span className="text-ink-faint">{new Date(e.createdAt).toISOString().slice(0, 16).replace('T', ' ')}</span> {e.actorName ?? 'someone'}:{' '}
                {Object.entries(e.changes)
                  .map(([k, c]) => `${LABELS[k] ?? k} ${String(c.from)} → ${String(c.to)}`)
                  .join('; ')}
              </li>
            ))}
          </ul>
        )}
      </section>
    </div>
  );
}
