// Every environment variable Fluxfolio reads, declared once with zod, with defaults that fit a local install.
// Empty strings count as unset; `readEnv()` throws one error naming each invalid variable.
import path from 'node:path';
import { z } from 'zod';

/** The local dev database served by scripts/pg.sh, as its app role (kept equal to db/index.ts; the password comes from `pg.sh url`). */
export const DEFAULT_DATABASE_URL = 'postgres://fluxfolio_app@127.0.0.1:54329/fluxfolio';
export const DEFAULT_SMTP_URL = 'smtp://127.0.0.1:2525?ignoreTLS=true';
export const DEFAULT_MAIL_FROM = 'Fluxfolio <no-reply@fluxfolio.test>';

const emptyToUndefined = (value: unknown) => (value === '' ? undefined : value);
const optional = <T extends z.ZodType>(schema: T) => z.preprocess(emptyToUndefined, schema.optional());
const withDefault = <T extends z.ZodType>(schema: T, fallback: z.input<T>) =>
  z.preprocess(emptyToUndefined, schema.prefault(fallback as never)); // prefault: the default is parsed too

const postgresUrl = z
  .string()
  .regex(/^postgres(ql)?:\/\/\S+$/, 'must be a postgres:// or postgresql:// URL');
const smtpUrl = z.string().regex(/^smtps?:\/\/\S+$/, 'must be an smtp:// or smtps:// URL');
const flag = z.enum(['0', '1']).transform((v) => v === '1');

export const envSchema = z.object({
  NODE_ENV: withDefault(z.enum(['development', 'production', 'test']), 'development'),
  /** PostgreSQL connection string; wins over the local default. */
  DATABASE_URL: withDefault(postgresUrl, DEFAULT_DATABASE_URL),
  /** The public URL next-auth builds its links from. */
  NEXTAUTH_URL: withDefault(z.url(), 'http://127.0.0.1:3000'),
  /** Secret for next-auth's JWTs; required by `next start` (scripts/app.sh generates one into .data/secret when unset). */
  NEXTAUTH_SECRET: optional(z.string().min(16, 'must be at least 16 characters')),
  /** Public base URL for links in e-mails (falls back to NEXTAUTH_URL); the test runner sets it to the served app. */
  APP_URL: optional(z.url()),
  /** Outgoing mail server as a URL string (next-auth's object form breaks on empty credentials). */
  SMTP_URL: withDefault(smtpUrl, DEFAULT_SMTP_URL),
  MAIL_FROM: withDefault(z.string().min(3), DEFAULT_MAIL_FROM),
  /** Where the local fake SMTP server stores received messages (JSON + .eml). */
  MAIL_DIR: withDefault(z.string().min(1), '.data/mail'),
  /** Port `next start` listens on. */
  PORT: withDefault(z.coerce.number().int().min(1).max(65535), 3000),
  /** 1: turn the dev mailbox page on (site admins only; scripts/test.sh sets it, `npm run app` only when asked). */
  FLUXFOLIO_DEV_MAILBOX: withDefault(flag, '0'),
  /** Chromium for the browser tests (Debian's package). */
  CHROMIUM_PATH: withDefault(z.string().min(1), '/usr/bin/chromium'),
  /** Name of the database `npm test` drops, recreates and migrates. */
  TEST_DATABASE_NAME: withDefault(z.string().regex(/^[a-z_][a-z0-9_]{0,62}$/), 'fluxfolio_test'),
});

export type Env = z.infer<typeof envSchema>;

/**
 * Parse and validate environment variables.
 *
 * @param source - the variables to read (default `process.env`)
 * @returns the typed settings with defaults applied
 * @throws Error listing every invalid variable, e.g. `SMTP_URL: must be an smtp:// or smtps:// URL`
 * @example
 * readEnv({ PORT: '3100' }).PORT; // returns 3100
 */
export function readEnv(source: Record<string, string | undefined> = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (parsed.success) return parsed.data;
  const lines = parsed.error.issues.map((issue) => `  ${issue.path.join('.')}: ${issue.message}`);
  throw new Error(`Invalid environment variables:\n${lines.join('\n')}`);
}

/** The current process's settings (parsed on every call: cheap, and tests may change process.env). */
export function getEnv(): Env {
  return readEnv(process.env);
}

/**
 * What keeps the server from starting in production: today only a missing NEXTAUTH_SECRET (without it next-auth
 * would sign sessions with a key derived from public settings). Called from instrumentation.ts at server start.
 *
 * @param env - the settings (default: the current process's)
 * @returns one line per problem, empty when the server may start
 * @example
 * serverStartProblems(readEnv({ NODE_ENV: 'production' })); // ['NEXTAUTH_SECRET is not set: ...']
 */
export function serverStartProblems(env: Env = getEnv()): string[] {
  if (env.NODE_ENV !== 'production' || env.NEXTAUTH_SECRET) return [];
  return [
    'NEXTAUTH_SECRET is not set: the server refuses to start without it. Set it to a long random string ' +
      '(e.g. `openssl rand -base64 32`); `npm run app` generates one into .data/secret.',
  ];
}

/** MAIL_DIR as an absolute path (relative values are taken from the working directory, the project root). */
export function mailDir(env: Env = getEnv()): string {
  return path.resolve(env.MAIL_DIR);
}
