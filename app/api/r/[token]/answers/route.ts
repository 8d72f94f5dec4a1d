import { route, json, readJson } from '@/lib/api/handler';
import { clientOf } from '@/lib/auth/throttle';
import { tokenParamsSchema } from '@/lib/notices/request';
import { recipientView, recordAnswer } from '@/lib/notices/recipient';
import { answerSchema } from '@/lib/validation/notices';

/** Public: the recipient's answer. Limited per link and per client (429 with a plain message). */
export const POST = route<{ token: string }>(async (req, ctx) => {
  const { token } = tokenParamsSchema.parse(await ctx.params);
  await recipientView(token); // 404 before reading the body: a wrong link learns nothing about the form
  const answer = answerSchema.parse(await readJson(req));
  await recordAnswer(token, clientOf(req.headers), answer);
  return json({ ok: true, message: 'Thank you. Your answer has reached the club.' }, 201);
});
