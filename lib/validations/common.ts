// Field schemas shared by several concepts (e-mail, person name, ids), with the project's maximum lengths.
// Every form, route handler, action and script validates these fields through the same definitions.
import { z } from 'zod';

export const MAX_EMAIL = 254;
export const MAX_NAME = 120;
export const MAX_TITLE = 200;
export const MAX_ABSTRACT = 5000;
export const MIN_PASSWORD = 10;
/** bcrypt only reads the first 72 bytes of a password; longer ones would silently lose their tail. */
export const MAX_PASSWORD_BYTES = 72;

/** An e-mail address, trimmed and lower-cased so that one person has one address. */
export const emailSchema = z
  .string({ error: 'Enter an e-mail address' })
  .trim()
  .min(1, 'Enter an e-mail address')
  .max(MAX_EMAIL, `At most ${MAX_EMAIL} characters`)
  .pipe(z.email({ error: 'Enter a valid e-mail address' }))
  .transform((value) => value.toLowerCase());

/** A person's display name. */
export const personNameSchema = z
  .string({ error: 'Enter your name' })
  .trim()
  .min(1, 'Enter your name')
  .max(MAX_NAME, `At most ${MAX_NAME} characters`);

/** A new password (sign-up): at least 10 characters, at most 72 bytes in UTF-8. */
export const newPasswordSchema = z
  .string({ error: 'Choose a password' })
  .min(MIN_PASSWORD, `At least ${MIN_PASSWORD} characters`)
  .refine((value) => new TextEncoder().encode(value).length <= MAX_PASSWORD_BYTES, {
    error: `At most ${MAX_PASSWORD_BYTES} bytes`,
  });

/** A manuscript id in a URL (UUID). */
export const manuscriptIdSchema = z.uuid({ error: 'Not a valid manuscript id' });

/** A user id in a URL (next-auth user ids are text; ours are UUIDs, but accept any short token). */
export const userIdSchema = z
  .string()
  .min(1, 'Not a valid user id')
  .max(64, 'Not a valid user id')
  .regex(/^[A-Za-z0-9_-]+$/, 'Not a valid user id');

/** Longest slug made from a title (characters); callers may append a "-2", "-3"… suffix to keep it unique. */
export const MAX_SLUG_BASE = 60;

/**
 * A URL-safe slug from a title: lower-case ASCII letters, digits and single hyphens, at most {@link MAX_SLUG_BASE}
 * characters; `fallback` when nothing is left (a title of symbols only).
 *
 * @example
 * slugFromTitle('Flux  tubes, part II', 'manuscript'); // 'flux-tubes-part-ii'
 * slugFromTitle('Émile’s ring', 'manuscript'); // 'emile-s-ring' (accents stripped, other symbols become hyphens)
 */
export function slugFromTitle(title: string, fallback: string): string {
  const slug = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, MAX_SLUG_BASE)
    .replace(/-+$/g, '');
  return slug || fallback;
}
