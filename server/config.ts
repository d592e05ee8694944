import { z } from 'zod';

/** The local payment fake's signing secret: anyone can read it here, so production refuses it. */
export const DEV_WEBHOOK_SECRET = 'whsec_spinyard_local_fake';

/** Every setting the server reads, validated once at start-up (README lists them). */
const ConfigSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  PUBLIC_URL: z.string().url().optional(),
  DB_HOST: z.string().default('127.0.0.1'),
  DB_PORT: z.coerce.number().int().min(1).max(65535).default(3307),
  DB_NAME: z.string().regex(/^[A-Za-z0-9_]+$/, 'letters, digits and _ only').default('spinyard'),
  DB_USER: z.string().default('spinyard'),
  DB_PASSWORD: z.string().default('spinyard-local'),
  REDIS_URL: z.string().regex(/^rediss?:\/\//, 'must start with redis://').default('redis://127.0.0.1:6390'),
  SESSION_SECRET: z.string().min(16, 'use at least 16 characters').default('spinyard-dev-session-secret-change-me'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(1025),
  MAIL_FROM: z.string().default('Spinyard <no-reply@spinyard.local>'),
  WEB_DIR: z.string().optional(),
  // Payments through the official SDK; defaults point at the local fake (server/fakes/payments), see docs/billing.md.
  STRIPE_SECRET_KEY: z.string().regex(/^sk_(test|live)_\S+$/, 'must start with sk_test_ or sk_live_').default('sk_test_spinyard_local_fake'),
  STRIPE_WEBHOOK_SECRET: z.string().min(8).default(DEV_WEBHOOK_SECRET),
  STRIPE_API_HOST: z.string().default('127.0.0.1'),
  /** Unset = the local fake's port (PAYMENTS_PORT). */
  STRIPE_API_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).default('http'),
  PAYMENTS_PORT: z.coerce.number().int().min(1).max(65535).default(12111),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export type Config = z.infer<typeof ConfigSchema> & { publicUrl: string };

export class ConfigError extends Error {}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = ConfigSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message} (got ${JSON.stringify(env[String(i.path[0])])})`);
    throw new ConfigError(`invalid configuration — ${lines.join('; ')}`);
  }
  const c = parsed.data;
  if (c.NODE_ENV === 'production' && c.SESSION_SECRET.startsWith('spinyard-dev')) {
    throw new ConfigError('SESSION_SECRET: set a secret of your own in production');
  }
  // With the published development secret anyone could sign payment events that credit money.
  if (c.NODE_ENV === 'production' && c.STRIPE_WEBHOOK_SECRET === DEV_WEBHOOK_SECRET) {
    throw new ConfigError("STRIPE_WEBHOOK_SECRET: set your webhook endpoint's signing secret in production (the development secret is public)");
  }
  return { ...c, publicUrl: c.PUBLIC_URL ?? `http://${c.HOST}:${c.PORT}` };
}
