import { route, json } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getFile, getSignature } from '@/db/files';
import { notFound } from '@/lib/errors';
import { loadVisibleCase } from '@/lib/hunt/case-detail';
import { deleteFile } from '@/lib/evidence/files';
import { toFileView } from '@/lib/evidence/views';
import { deleteObjects } from '@/lib/storage/s3';
import { fileIdSchema } from '@/lib/validation/files';

type P = { id: string; fileId: string };

/** One file's metadata, its analysis and (recordings) the signature's spectrum and spectrogram. */
export const GET = route<P>(async (_req, ctx) => {
  const { id, fileId } = fileIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  const f = await getFile(id, fileId);
  if (!f || f.status !== 'ready') throw notFound('No such file.');
  return json({ file: toFileView(me, access, f), signature: f.kind === 'audio' ? await getSignature(f.id) : null });
});

/** Delete: whoever attached it, or the committee. */
export const DELETE = route<P>(async (_req, ctx) => {
  const { id, fileId } = fileIdSchema.parse(await ctx.params);
  const me = await requireUser();
  await loadVisibleCase(me, id);
  const keys = await inTransaction((trx) => deleteFile(trx, me, id, fileId));
  try {
    await deleteObjects(keys);
  } catch (err) {
    // The row is gone; objects left behind hold nothing anyone can reach. Logged for the operator.
    console.error(`[quietfix] deleting objects of file ${fileId} failed:`, (err as Error).message);
  }
  return json({ deleted: fileId });
});
