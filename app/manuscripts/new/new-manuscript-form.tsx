// The new-manuscript form: validated with the shared schema, sent to POST /api/manuscripts, then opens the manuscript.
// The same zod schema validates here and in the route handler.
'use client';

import { useRouter } from 'next/navigation';
import { useSWRConfig } from 'swr';
import { manuscriptsKey } from '@/app/_hooks/use-manuscripts';
import type { ManuscriptJson } from '@/lib/api-types';
import { sendJson } from '@/lib/fetcher';
import { MAX_ABSTRACT, MAX_TITLE } from '@/lib/validations/common';
import { createManuscriptSchema } from '@/lib/validations/manuscript';
import { Button, ButtonLink } from '../../_components/button';
import { TextAreaField, TextField } from '../../_components/field';
import { FormAlert } from '../../_components/form-alert';
import { useToast } from '../../_components/toaster';
import { useJsonForm } from '../../_components/use-json-form';

export function NewManuscriptForm() {
  const router = useRouter();
  const toast = useToast();
  const { mutate } = useSWRConfig();
  const { fields, message, busy, onSubmit } = useJsonForm(
    createManuscriptSchema,
    async (data) => {
      const { manuscript } = await sendJson<{ manuscript: ManuscriptJson }>('/api/manuscripts', { method: 'POST', body: data });
      await mutate(manuscriptsKey('mine'));
      toast('Manuscript created');
      router.push(`/m/${manuscript.slug}`);
    },
    { staysBusyOnSuccess: true },
  );

  return (
    <form onSubmit={onSubmit} noValidate className="mt-8 space-y-5 rounded-xl bg-white p-5 shadow-sm ring-1 ring-slate-200 sm:p-6">
      {message && <FormAlert>{message}</FormAlert>}
      <TextField
        label="Title"
        name="title"
        required
        maxLength={MAX_TITLE}
        autoFocus
        placeholder="e.g. Level crossings of a flux-threaded annular well"
        hint={`Up to ${MAX_TITLE} characters. The manuscript's address is made from it.`}
        errors={fields.title}
      />
      <TextAreaField
        label="Abstract"
        name="abstract"
        maxLength={MAX_ABSTRACT}
        rows={6}
        hint={`Optional, up to ${MAX_ABSTRACT} characters. You can change it later.`}
        errors={fields.abstract}
      />
      <div className="flex flex-wrap justify-end gap-3">
        <ButtonLink href="/dashboard" variant="quiet">
          Cancel
        </ButtonLink>
        <Button type="submit" busy={busy}>
          Create manuscript
        </Button>
      </div>
    </form>
  );
}
