import { route } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { getFile } from '@/db/files';
import { AppError, notFound } from '@/lib/errors';
import { fileAccess } from '@/lib/hunt/access';
import { loadVisibleCase } from '@/lib/hunt/case-detail';
import { disposition } from '@/lib/evidence/types';
import { presignGet } from '@/lib/storage/s3';
import { fileIdSchema } from '@/lib/validation/files';

/**
 * The bytes: a redirect to a two-minute presigned GET that answers with the sniffed type and a
 * Content-Disposition (inline only for photos and recordings). Photos: the committee gets the
 * file as uploaded, everyone else the copy without location and camera data.
 */
export const GET = route<{ id: string; fileId: string }>(async (_req, ctx) => {
  const { id, fileId } = fileIdSchema.parse(await ctx.params);
  const me = await requireUser();
  const { access } = await loadVisibleCase(me, id);
  const f = await getFile(id, fileId);
  if (!f || f.status !== 'ready' || !f.contentType) throw notFound('No such file.');
  let key = f.objectKey;
  if (f.kind === 'photo' && !fileAccess(me, access, f).originalPhoto) {
    if (!f.publicKey) throw new AppError(409, 'The photo is still being prepared (its location data is being removed): try again in a moment.');
    key = f.publicKey;
  }
  const url = await presignGet(key, { contentType: f.contentType, disposition: disposition(f.kind, f.name) });
  return new Response(null, { status: 302, headers: { location: url, 'cache-control': 'private, no-store' } });
});
