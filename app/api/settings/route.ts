import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getClubSettings, listSettingsEvents, updateClubSettings } from '@/db/settings';
import { clubSettingsPatchSchema } from '@/lib/validation/settings';

/** The club settings and their timeline: admins. */
export const GET = route(async () => {
  await requireUser('admin');
  const [settings, timeline] = await Promise.all([getClubSettings(), listSettingsEvents()]);
  return json({ settings, timeline });
});

/** Changes some settings; each change goes to the settings timeline with who, when, before and after. */
export const PATCH = route(async (req) => {
  const me = await requireUser('admin');
  const patch = clubSettingsPatchSchema.parse(await readJson(req));
  const changes = await inTransaction((trx) => updateClubSettings(trx, me.id, patch));
  return json({ settings: await getClubSettings(), changes });
});
