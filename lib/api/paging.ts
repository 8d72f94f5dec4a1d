import { z } from 'zod';

export const MAX_PAGE_SIZE = 100;

export const pagingSchema = z.object({
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(1).default(25).transform((n) => Math.min(n, MAX_PAGE_SIZE)),
});
export type Paging = z.infer<typeof pagingSchema>;

export type Page<T> = { items: T[]; total: number; page: number; pageSize: number };

/** Reads ?page=&pageSize= (pageSize capped at MAX_PAGE_SIZE). */
export function parsePaging(params: URLSearchParams): Paging {
  return pagingSchema.parse({ page: params.get('page') ?? undefined, pageSize: params.get('pageSize') ?? undefined });
}
