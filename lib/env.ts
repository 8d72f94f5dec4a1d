import { z } from 'zod';
import { parseTrustedProxy } from '@/lib/auth/client-address';

/**
 * Every setting Quietfix reads from the environment, parsed once.
 * Defaults match what `npm start` sets up on a fresh machine; README.md lists them.
 */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  APP_URL: z.url().default('http://localhost:3000'),
  /** Other origins whose pages may send state-changing requests (comma-separated), e.g. a second host name. */
  TRUSTED_ORIGINS: z
    .string()
    .default('')
    .transform((s) => s.split(',').map((o) => o.trim()).filter(Boolean))
    .pipe(z.array(z.url('TRUSTED_ORIGINS must be a comma-separated list of origins such as https://club.example.test.'))),
  DB_HOST: z.string().min(1).default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(54329),
  DB_USER: z.string().min(1).default('quietfix'),
  DB_PASSWORD: z.string().default('quietfix-local'),
  DB_NAME: z.string().min(1).default('quietfix'),
  DB_POOL_MAX: z.coerce.number().int().min(1).max(50).default(10),
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(1025),
  SMTP_SECURE: z.enum(['true', 'false']).default('false').transform((v) => v === 'true'),
  SMTP_USER: z.string().optional(),
  SMTP_PASS: z.string().optional(),
  MAIL_FROM: z.string().min(3).default('Quietfix <no-reply@quietfix.example.test>'),
  MAIL_CATCHER_URL: z.union([z.url(), z.literal('')]).default('http://127.0.0.1:8025'),
  // The map's raster tiles, read at run time and handed to the page: an XYZ template with {z}/{x}/{y}
  // (and optionally {s}) and the attribution its licence asks for. Empty: no tiles, the places layer only.
  // Its origin joins the Content-Security-Policy's img-src and connect-src (proxy.ts).
  TILE_URL: z.union([z.literal(''), z.string().regex(/^https?:\/\/\S*\{z\}\S*\{x\}\S*\{y\}/, 'TILE_URL must be an http(s) XYZ template with {z}, {x} and {y}')]).default(''),
  TILE_ATTRIBUTION: z.string().max(500).default(''),
  // How many tiles "Prepare for the field" may fetch ahead from TILE_URL. 0 (default): none — only
  // tiles already viewed stay cached. Set it only for a server whose policy allows bulk fetching
  // (e.g. the club's own); public servers such as OpenStreetMap's forbid it.
  TILE_PREFETCH_MAX: z.coerce.number().int().min(0).max(5000).default(0),
  // Notices and the outbox worker (lib/notices; the worker process reads the same settings).
  NOTICE_TOKEN_SECRET: z.string().min(16).optional(),
  NOTICE_TOKEN_DAYS: z.coerce.number().int().min(1).max(3650).default(90),
  OUTBOX_BACKOFF_BASE_MS: z.coerce.number().int().min(1).default(5000),
  OUTBOX_BACKOFF_CAP_MS: z.coerce.number().int().min(1).default(15 * 60_000),
  OUTBOX_LEASE_MS: z.coerce.number().int().min(100).default(60_000),
  OUTBOX_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(100).default(8),
  OUTBOX_BATCH_SIZE: z.coerce.number().int().min(1).max(500).default(10),
  OUTBOX_POLL_MS: z.coerce.number().int().min(50).default(2000),
  // Sign-in and reset limits key on the socket address; set this only behind a reverse proxy:
  // 'any' (every peer is the proxy) or its addresses, comma-separated. Then the right-most
  // X-Forwarded-For entry (the hop the proxy added) is the client. lib/auth/client-address.ts.
  TRUSTED_PROXY: z
    .string()
    .optional()
    .transform((v, ctx) => {
      try {
        return parseTrustedProxy(v);
      } catch (err) {
        ctx.addIssue({ code: 'custom', message: (err as Error).message });
        return z.NEVER;
      }
    }),
});

export type Env = z.infer<typeof schema>;

function load(): Env {
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`).join('\n');
    throw new Error(`Quietfix configuration is invalid:\n${lines}`);
  }
  return parsed.data;
}

export const env: Env = load();

/** The origins a state-changing request may come from: APP_URL's and TRUSTED_ORIGINS'. */
export const allowedOrigins: ReadonlySet<string> = new Set([env.APP_URL, ...env.TRUSTED_ORIGINS].map((u) => new URL(u).origin));

/** True when APP_URL is https: cookies are Secure and HSTS is sent. */
export const appIsHttps = new URL(env.APP_URL).protocol === 'https:';
