import { NextResponse, type NextRequest } from 'next/server';
import { badRequest, toErrorBody } from '@/lib/errors';

export type RouteContext<P = Record<string, string>> = { params: Promise<P> };

/**
 * Wraps a route handler so every error goes through the one mapping in lib/errors.ts.
 * Order inside a handler: params -> who is asking and may they -> body -> write -> status.
 */
export function route<P = Record<string, string>>(
  fn: (req: NextRequest, ctx: RouteContext<P>) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: RouteContext<P>): Promise<Response> => {
    try {
      return await fn(req, ctx);
    } catch (err) {
      const { status, body } = toErrorBody(err, `${req.method} ${req.nextUrl.pathname}`);
      const headers: Record<string, string> = {};
      if (status === 429 && typeof body.retryAfterS === 'number') headers['Retry-After'] = String(body.retryAfterS);
      return NextResponse.json(body, { status, headers });
    }
  };
}

/** Reads a JSON body; a body that is not JSON is a 400 with a plain message. */
export async function readJson(req: Request): Promise<unknown> {
  try {
    return await req.json();
  } catch {
    throw badRequest('The request body must be JSON.');
  }
}

export const json = (data: unknown, status = 200) => NextResponse.json(data, { status });
