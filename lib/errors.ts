import { ZodError } from 'zod';

/** An error whose message is safe to show to the person who caused it. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const unauthorized = (message = 'Please sign in.') => new AppError(401, message);
export const forbidden = (message = 'Your role does not allow this.') => new AppError(403, message);
export const notFound = (message = 'Not found.') => new AppError(404, message);
export const conflict = (message: string, extra?: Record<string, unknown>) => new AppError(409, message, extra);
export const tooManyRequests = (message: string, retryAfterS?: number) =>
  new AppError(429, message, retryAfterS ? { retryAfterS } : {});
export const payloadTooLarge = (message: string) => new AppError(413, message);
export const unsupportedMediaType = (message: string) => new AppError(415, message);
export const badRequest = (message: string, extra?: Record<string, unknown>) => new AppError(400, message, extra);

const DB_DOWN_CODES = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', '57P01', '57P02', '57P03', '08000', '08001', '08003', '08006']);

/** True when the error means PostgreSQL could not be reached (not a bad query). */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (!err || typeof err !== 'object') return false;
  const e = err as { code?: string; name?: string; message?: string; errors?: unknown[] };
  if (e.code && DB_DOWN_CODES.has(e.code)) return true;
  if (e.name === 'KnexTimeoutError') return true;
  if (typeof e.message === 'string' && /Connection terminated|connect ECONNREFUSED|Timeout acquiring a connection/i.test(e.message)) return true;
  // Node wraps several failed connection attempts (IPv4/IPv6) in an AggregateError.
  return Array.isArray(e.errors) && e.errors.some(isDatabaseUnavailable);
}

export type ErrorBody = { error: string; issues?: unknown; [k: string]: unknown };

/** The one mapping from any thrown value to an HTTP status and a JSON body a person can read. */
export function toErrorBody(err: unknown, context = 'request'): { status: number; body: ErrorBody } {
  if (err instanceof ZodError) {
    return {
      status: 400,
      body: {
        error: 'Some fields need attention.',
        issues: err.issues.map((i) => ({ path: i.path.join('.'), message: i.message, code: i.code })),
      },
    };
  }
  if (err instanceof AppError) return { status: err.status, body: { error: err.message, ...err.extra } };
  if (isDatabaseUnavailable(err)) {
    console.error(`[quietfix] ${context}: database unavailable:`, (err as Error).message);
    return { status: 503, body: { error: 'database unavailable' } };
  }
  console.error(`[quietfix] ${context}: unexpected error`, err);
  return { status: 500, body: { error: 'Something went wrong on our side. It has been logged; please try again.' } };
}
