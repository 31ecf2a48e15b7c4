// Helpers for client forms validated with the shared zod schemas: read a form into a plain object and
// turn a failed parse into per-field messages (the same shape the API answers with).
import type { z } from 'zod';
import { ApiError } from '@/lib/fetcher';
import type { FieldMessages } from '@/lib/domain-error';
import { fieldMessages } from '@/lib/validation-fields';

export type FieldErrors = FieldMessages;

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
  return { ok: false, fields: fieldMessages(result.error.issues) };
}

/**
 * Handle a form's submit event: stop the browser's own submit, read and parse the form, and store the per-field
 * messages through `setFields` (cleared when the form is valid). Returns the parsed data, or null when invalid.
 *
 * @example
 * const data = parseSubmit(event, magicLinkSchema, setLinkErrors);
 * if (!data) return;
 */
export function parseSubmit<S extends z.ZodType>(
  event: { preventDefault(): void; currentTarget: HTMLFormElement },
  schema: S,
  setFields: (fields: FieldErrors) => void,
): z.output<S> | null {
  event.preventDefault();
  const parsed = parseWith(schema, formValues(event.currentTarget));
  setFields(parsed.ok ? {} : parsed.fields);
  return parsed.ok ? parsed.data : null;
}

/** A failed request as per-field messages, with the overall message under `_` (for forms that show it inline). */
export function errorFields(error: unknown): FieldErrors {
  return error instanceof ApiError ? { ...error.fields, _: [error.message] } : { _: [String(error)] };
}
