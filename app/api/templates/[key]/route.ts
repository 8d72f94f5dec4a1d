import { route, json, readJson } from '@/lib/api/handler';
import { requireUser } from '@/lib/auth/session';
import { inTransaction } from '@/db';
import { getTemplate, lockTemplate, writeTemplate } from '@/db/templates';
import { badRequest, conflict, notFound } from '@/lib/errors';
import { templateProblem } from '@/lib/notices/render';
import { templateKeySchema, templatePutSchema } from '@/lib/validation/notices';

export const GET = route<{ key: string }>(async (_req, ctx) => {
  const { key } = templateKeySchema.parse(await ctx.params);
  await requireUser('admin');
  const t = await getTemplate(key);
  if (!t) throw notFound('No such template.');
  return json(t);
});

/** Saves a template's subject and text (admin). Notices already approved keep the text they were approved with. */
export const PUT = route<{ key: string }>(async (req, ctx) => {
  const { key } = templateKeySchema.parse(await ctx.params);
  const me = await requireUser('admin');
  const input = templatePutSchema.parse(await readJson(req));
  for (const [field, source] of [['subject', input.subject], ['body', input.body]] as const) {
    const problem = templateProblem(source);
    if (problem) throw badRequest('Some fields need attention.', { issues: [{ path: field, message: problem, code: 'custom' }] });
  }
  await inTransaction(async (trx) => {
    const current = await lockTemplate(trx, key);
    if (!current) throw notFound('No such template.');
    if (current.version !== input.version) throw conflict('Someone saved this template after you opened it. Reload to see their text, then make your change again.', { currentVersion: current.version });
    await writeTemplate(trx, key, { subject: input.subject, body: input.body, updatedBy: me.id });
  });
  return json(await getTemplate(key));
});
