import path from 'node:path';
import { z } from 'zod';

const bool = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

const envSchema = z.object({
  DATABASE_URL: z.string().url(),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HOST: z.string().default('127.0.0.1'),
  PUBLIC_URL: z.string().url().optional(),
  EXTRA_ORIGINS: z.string().default(''),
  SESSION_SECRET: z.string().min(32, 'SESSION_SECRET must be at least 32 characters'),
  // The audit chain's HMAC key, kept outside the database: hex, at least 32 bytes.
  AUDIT_KEY: z.string().regex(/^([0-9a-fA-F]{2}){32,}$/, 'AUDIT_KEY must be hex, at least 32 bytes (64 hex digits)'),
  AUDIT_ANCHOR_DIR: z.string().default('.data'),
  MAIL_OUTBOX_DIR: z.string().default('mail-outbox'),
  MAIL_FROM: z.string().default('Breakover <no-reply@breakover.invalid>'),
  SMTP_URL: z.string().url().optional(),
  UPLOAD_MAX_BYTES: z.coerce.number().int().positive().default(10 * 1024 * 1024),
  COOKIE_SECURE: bool.optional(),
  SIGNIN_RATE_LIMIT: z.coerce.number().int().positive().default(30),
  SIGNIN_RATE_WINDOW_MINUTES: z.coerce.number().int().positive().default(5),
  LOCKOUT_THRESHOLD: z.coerce.number().int().positive().default(5),
  LOCKOUT_MINUTES: z.coerce.number().int().positive().default(15),
  INVITE_VALID_HOURS: z.coerce.number().int().positive().default(72),
  RESET_VALID_MINUTES: z.coerce.number().int().positive().default(60),
  STATIC_DIR: z.string().default('dist'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  // Readable lines unless told otherwise; a production supervisor collecting logs sets json.
  LOG_FORMAT: z.enum(['json', 'pretty']).default('pretty'),
});

export type Config = ReturnType<typeof loadConfig>;

/** Parses the environment once; fails fast with the variable named. */
export function loadConfig(env: Record<string, string | undefined> = process.env) {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const publicUrl = (e.PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/+$/, '');
  const origins = new Set([new URL(publicUrl).origin, ...e.EXTRA_ORIGINS.split(',').map((s) => s.trim()).filter(Boolean)]);
  return {
    databaseUrl: e.DATABASE_URL,
    port: e.PORT,
    host: e.HOST,
    publicUrl,
    allowedOrigins: origins,
    sessionSecret: e.SESSION_SECRET,
    audit: { key: e.AUDIT_KEY, anchorDir: path.resolve(e.AUDIT_ANCHOR_DIR) },
    mail: { outboxDir: path.resolve(e.MAIL_OUTBOX_DIR), from: e.MAIL_FROM, smtpUrl: e.SMTP_URL },
    uploadMaxBytes: e.UPLOAD_MAX_BYTES,
    cookieSecure: e.COOKIE_SECURE ?? publicUrl.startsWith('https:'),
    signIn: {
      rateLimit: e.SIGNIN_RATE_LIMIT,
      rateWindowMs: e.SIGNIN_RATE_WINDOW_MINUTES * 60_000,
      lockoutThreshold: e.LOCKOUT_THRESHOLD,
      lockoutMs: e.LOCKOUT_MINUTES * 60_000,
    },
    tokens: { inviteMs: e.INVITE_VALID_HOURS * 3_600_000, resetMs: e.RESET_VALID_MINUTES * 60_000 },
    staticDir: path.resolve(e.STATIC_DIR),
    log: { level: e.LOG_LEVEL, format: e.LOG_FORMAT },
  };
}
