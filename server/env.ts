import path from 'node:path';
import { z } from 'zod';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
  PORT: z.coerce.number().int().min(1).max(65535).default(8080),
  HOST: z.string().default('127.0.0.1'),
  DATABASE_URL: z.string().startsWith('postgres', { message: 'DATABASE_URL must be a postgres:// URL' }),
  SESSION_PASSWORD: z
    .string()
    .min(32, { message: 'SESSION_PASSWORD must be at least 32 characters' })
    .default('frameside-local-development-session-secret-do-not-use-in-production'),
  /** Set when the app is served over HTTPS (behind a proxy): session cookies become Secure. */
  SECURE_COOKIES: z
    .enum(['true', 'false'])
    .default('false')
    .transform((v) => v === 'true'),
  TRUST_PROXY: z.string().default('loopback'),
  WEB_DIR: z.string().default('dist'),
  UPLOADS_DIR: z.string().default('uploads'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FROM: z.string().default('Frameside <no-reply@frameside.test>'),
  PUBLIC_URL: z.string().url().default('http://127.0.0.1:8080'),
  /**
   * Run the local fake SMTP server in-process (mail kept as .eml in MAIL_DIR, listed at /dev/mail).
   * Default: on outside production; `npm start` turns it on for the local demo. Never set it on a real host.
   */
  MAIL_FAKE: z.enum(['true', 'false']).optional(),
  MAIL_DIR: z.string().default('.mail'),
  /** Scheduled jobs (the weekly due digest) through pg-boss on the same database. */
  JOBS: z
    .enum(['true', 'false'])
    .default('true')
    .transform((v) => v === 'true'),
  /** `npm run dev` only: the Metro origin allowed to call the API with cookies. */
  DEV_ORIGIN: z.string().url().optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

export type Env = z.infer<typeof envSchema>;

/** Parses the environment once at start; a bad value stops the server with a clear message. */
export function readEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Frameside cannot start, the environment is not valid:\n${lines.join('\n')}`);
  }
  // Photos go out only through the access-checked route; a storage folder inside the served web
  // folder would make every stored photo public.
  const web = path.resolve(parsed.data.WEB_DIR);
  const uploads = path.resolve(parsed.data.UPLOADS_DIR);
  if (uploads === web || uploads.startsWith(web + path.sep)) {
    throw new Error('Frameside cannot start: UPLOADS_DIR must not be inside WEB_DIR (the web folder is public, photos are not).');
  }
  if (parsed.data.NODE_ENV === 'production' && parsed.data.SESSION_PASSWORD.startsWith('frameside-local-development')) {
    throw new Error('Frameside cannot start: set SESSION_PASSWORD (32+ random characters) in production.');
  }
  return parsed.data;
}
