import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getProfile, updateProfile } from '@/db/users';
import { profilePatchSchema } from '@/lib/validation/profile';
import { notFound } from '@/lib/errors';
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

/** Changes only the fields named; the loop's circumference follows from the merged shape and size. */
export const PATCH = route(async (req) => {
  const me = await requireUser();
  const patch = profilePatchSchema.parse(await readJson(req));
  await inTransaction(async (trx) => {
    const current = await getProfile(me.id, trx);
    if (!current) throw notFound('No such profile.');
    const loopNamed = patch.loopShape !== undefined || patch.loopSizeM !== undefined;
    const loopCircumferenceM = loopNamed
      ? circumference(
          patch.loopShape === undefined ? current.loopShape : patch.loopShape,
          patch.loopSizeM === undefined ? current.loopSizeM : patch.loopSizeM,
        )
      : undefined;
    await updateProfile(trx, me.id, { ...patch, loopCircumferenceM });
  });
  return json(await getProfile(me.id));
});
