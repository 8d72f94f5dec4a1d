import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { fixRequestSchema } from '@/lib/validation/df';
import { estimateFix } from '@/lib/df';

/**
 * Any signed-in user: the Fix for a set of lines, exactly as lib/df computes it.
 * A refusal (too few lines, near-parallel...) is a 200 with ok:false; malformed input is a 400.
 */
export const POST = route(async (req) => {
  await requireUser();
  const { lines, confidence } = fixRequestSchema.parse(await readJson(req));
  return json(estimateFix(lines, confidence === undefined ? undefined : { confidence }));
});
