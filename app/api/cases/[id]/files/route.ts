import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { listFiles } from '@/db/files';
import { caseIdSchema, loadVisibleCase } from '@/lib/hunt/case-detail';
import { createUpload } from '@/lib/evidence/files';
import { toFileView } from '@/lib/evidence/views';
import { uploadRequestSchema } from '@/lib/validation/files';

/** The case's completed files, newest first: whoever may see the case. */
export const GET = route<{ id: string }>(async (_req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  const items = (await listFiles(id)).map((f) => toFileView(me, access, f));
  return json({ items, total: items.length });
});

/** Ask to upload a file: {name, size, contentType} -> a presigned PUT for exactly that size and type. */
export const POST = route<{ id: string }>(async (req, ctx) => {
  const { id } = caseIdSchema.parse(await ctx.params);
  const me = await requireUser();
  await loadVisibleCase(me, id);
  const input = uploadRequestSchema.parse(await readJson(req));
  return json(await inTransaction((trx) => createUpload(trx, me, id, input)), 201);
});
