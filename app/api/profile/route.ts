import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getProfile, updateProfile } from '@/db/users';
import { profileSchema } from '@/lib/validation/profile';
import { loopCircumferenceM, type LoopShape } from '@/lib/df';

/** The loop's circumference in metres from its shape and size ("other": the size is the circumference). */
function circumference(shape: string | null, sizeM: number | null): number | null {
  if (!shape || sizeM === null) return null;
  const loop: LoopShape | null =
    shape === 'circle' ? { shape: 'circle', diameterM: sizeM } : shape === 'square' ? { shape: 'square', sideM: sizeM } : shape === 'octagon' ? { shape: 'regular-polygon', sides: 8, sideM: sizeM } : null;
  return loop ? loopCircumferenceM(loop) : sizeM;
}

export const GET = route(async () => {
  const me = await requireUser();
  return json(await getProfile(me.id));
});

export const PATCH = route(async (req) => {
  const me = await requireUser();
  const p = profileSchema.parse(await readJson(req));
  await inTransaction((trx) => updateProfile(trx, me.id, { ...p, loopCircumferenceM: circumference(p.loopShape, p.loopSizeM) }));
  return json(await getProfile(me.id));
});
