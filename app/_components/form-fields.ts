// Helpers for client forms validated with the shared zod schemas: read a form into a plain object and
// turn a failed parse into per-field messages (the same shape the API answers with).
import type { z } from 'zod';

export type FieldErrors = Record<string, string[]>;

/** The form's entries as strings (files are ignored; none of our forms upload). */
export function formValues(form: HTMLFormElement): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of new FormData(form).entries()) if (typeof value === 'string') values[key] = value;
  return values;
}

/** Parse with a schema; on failure return the per-field messages instead of throwing. */
export function parseWith<S extends z.ZodType>(
  schema: S,
  input: unknown,
): { ok: true; data: z.output<S> } | { ok: false; fields: FieldErrors } {
  const result = schema.safeParse(input);
  if (result.success) return { ok: true, data: result.data };
  const fields: FieldErrors = {};
  for (const issue of result.error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    (fields[key] ??= []).push(issue.message);
  }
  return { ok: false, fields };
}
