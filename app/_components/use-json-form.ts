// Client hook for a form validated with a shared zod schema and sent to our JSON API: per-field messages,
// the overall message from an ApiError, and the busy flag, so each form keeps only what it sends and what follows.
'use client';

import { useState, type FormEvent } from 'react';
import type { z } from 'zod';
import { ApiError } from '@/lib/fetcher';
import { parseSubmit, type FieldErrors } from './form-fields';

export interface JsonFormOptions {
  /** Leave the form busy after `send` succeeds (it navigates away, so the button must not come back). */
  staysBusyOnSuccess?: boolean;
  /** Message shown when `send` throws something other than an ApiError; by default nothing is shown. */
  fallbackMessage?: string;
}

/**
 * State and submit handler for one API-backed form. `send` gets the parsed data and the form element; an ApiError it
 * throws fills `fields` and `message`.
 *
 * @example
 * const { fields, message, busy, onSubmit } = useJsonForm(createManuscriptSchema, async (data) => {
 *   await sendJson('/api/manuscripts', { method: 'POST', body: data });
 * });
 */
export function useJsonForm<S extends z.ZodType>(
  schema: S,
  send: (data: z.output<S>, form: HTMLFormElement) => Promise<void>,
  { staysBusyOnSuccess = false, fallbackMessage }: JsonFormOptions = {},
) {
  const [fields, setFields] = useState<FieldErrors>({});
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    const form = event.currentTarget;
    setMessage(null);
    const data = parseSubmit(event, schema, setFields);
    if (data === null) return;
    setBusy(true);
    let sent = false;
    try {
      await send(data, form);
      sent = true;
    } catch (error) {
      if (error instanceof ApiError) {
        setFields(error.fields);
        setMessage(error.message);
      } else if (fallbackMessage) {
        setMessage(fallbackMessage);
      }
    } finally {
      if (!sent || !staysBusyOnSuccess) setBusy(false);
    }
  }

  return { fields, message, setMessage, busy, setBusy, onSubmit };
}
