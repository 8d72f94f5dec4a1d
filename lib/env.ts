import { z } from 'zod';

/**
 * Every setting Quietfix reads from the environment, parsed once.
 * Defaults match what `npm start` sets up on a fresh machine; README.md lists them.
 */
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  APP_URL: z.url().default('http://localhost:3000'),
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
  TILE_URL: z.union([z.literal(''), z.string().regex(/^https?:\/\/\S*\{z\}\S*\{x\}\S*\{y\}/, 'TILE_URL must be an http(s) XYZ template with {z}, {x} and {y}')]).default(''),
  TILE_ATTRIBUTION: z.string().max(500).default(''),
  // Notices and the outbox worker (lib/notices; the worker process reads the same settings).
  NOTICE_TOKEN_SECRET: z.string().min(16).optional(),
  NOTICE_TOKEN_DAYS: z.coerce.number().int().min(1).max(3650).default(90),
  OUTBOX_BACKOFF_BASE_MS: z.coerce.number().int().min(1).default(5000),
  OUTBOX_BACKOFF_CAP_MS: z.coerce.number().int().min(1).default(15 * 60_000),
  OUTBOX_LEASE_MS: z.coerce.number().int().min(100).default(60_000),
  OUTBOX_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(100).default(8),
  OUTBOX_BATCH_SIZE: z.coerce.number().int().min(1).max(500).default(10),
  OUTBOX_POLL_MS: z.coerce.number().int().min(50).default(2000),
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
