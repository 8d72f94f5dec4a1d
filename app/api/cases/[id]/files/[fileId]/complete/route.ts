import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { loadVisibleCase } from '@/lib/hunt/case-detail';
import { completeUpload } from '@/lib/evidence/files';
import { toFileView } from '@/lib/evidence/views';
import { fileIdSchema } from '@/lib/validation/files';

/** The bytes are in storage: the server checks size and content; a refusal deletes everything (415/413/422). */
export const POST = route<{ id: string; fileId: string }>(async (_req, ctx) => {
  const { id, fileId } = fileIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  const r = await inTransaction((trx) => completeUpload(trx, me, id, fileId));
  if ('refused' in r) throw r.refused;
  return json({ file: toFileView(me, access, r) });
});
