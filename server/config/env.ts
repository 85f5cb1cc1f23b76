import path from 'node:path';
import { z } from 'zod';

/**
 * Every setting Seepwise reads from the environment, parsed once. The README's
 * "Configuration" table documents the same list.
 */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4310),
  HOST: z.string().default('127.0.0.1'),
  /** Set: use that PostgreSQL and start nothing. Unset: a private cluster is started. */
  DATABASE_URL: z.string().url().optional(),
  SEEPWISE_PG_PORT: z.coerce.number().int().min(1).max(65535).default(54329),
  SEEPWISE_DATA_DIR: z.string().default(path.resolve('.data')),
  SESSION_SECRET: z.string().min(16).default('dev-only-session-secret-change-me'),
  /** Public base URL used in e-mailed links. Defaults to http://localhost:PORT. */
  PUBLIC_URL: z.string().url().optional(),
  /** SMTP server for outgoing mail. Unset in development: a local sink is started. */
  SMTP_URL: z.string().optional(),
  MAIL_FROM: z.string().default('Seepwise <no-reply@seepwise.invalid>'),
  /** S3-compatible object storage for photos. Unset in development: a local fake is started. */
  S3_ENDPOINT: z.string().url().optional(),
  S3_BUCKET: z.string().default('seepwise-photos'),
  S3_REGION: z.string().default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().default('S3RVER'),
  S3_SECRET_ACCESS_KEY: z.string().default('S3RVER'),
  /** Load the invented demo scenario on first start (development only by default). */
  SEED_DEMO: z
    .enum(['true', 'false'])
    .optional()
    .transform((v) => (v === undefined ? undefined : v === 'true')),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  TRUST_PROXY: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
});

export type Env = z.infer<typeof envSchema>;

export function parseEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  return parsed.data;
}
