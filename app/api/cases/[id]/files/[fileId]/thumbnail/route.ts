import { route } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { getFile } from '@/db/files';
import { notFound } from '@/lib/errors';
import { loadVisibleCase } from '@/lib/hunt/case-detail';
import { presignGet } from '@/lib/storage/s3';
import { fileIdSchema } from '@/lib/validation/files';

/** A photo's thumbnail (made without any metadata): whoever may see the case. */
export const GET = route<{ id: string; fileId: string }>(async (_req, ctx) => {
  const { id, fileId } = fileIdSchema.parse(await ctx.params);
  const me = await requireUser();
  await loadVisibleCase(me, id);
  const f = await getFile(id, fileId);
  if (!f || f.status !== 'ready' || !f.thumbKey) throw notFound('No thumbnail for this file.');
  const url = await presignGet(f.thumbKey, { contentType: 'image/jpeg', disposition: 'inline; filename="thumbnail.jpg"' });
  return new Response(null, { status: 302, headers: { location: url, 'cache-control': 'private, no-store' } });
});
