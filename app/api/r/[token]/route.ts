import { route, json } from '@/lib/api/handler';
import { tokenParamsSchema } from '@/lib/notices/request';
import { recipientView } from '@/lib/notices/recipient';

/** Public: the notice behind a response link. A wrong or expired link is a plain 404. */
export const GET = route<{ token: string }>(async (_req, ctx) => {
  const { token } = tokenParamsSchema.parse(await ctx.params);
  return json(await recipientView(token));
});
